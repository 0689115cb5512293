// psychrolib ships no types; the tests use only these calls.
declare module 'psychrolib' {
  const psychrolib: {
    SI: number;
    IP: number;
    SetUnitSystem(system: number): void;
    GetStandardAtmPressure(altitude: number): number;
    GetStandardAtmTemperature(altitude: number): number;
  };
  export default psychrolib;
}
