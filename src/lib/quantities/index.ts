// Quantities as the screens show and take them: the unit system (a context every page reads),
// the display unit of each kind, the one table of unit labels, number formatting, the units of a
// study's own quantities, and the one parser of typed numbers. SI inside; converted only here.
export * from './unit-system';
export * from './display-units';
export * from './unit-label';
export * from './format';
export * from './study-quantity';
export * from './typed-number';
