import { planColour, planMarker } from '../plots/style';

const MARKER_PATHS: Record<string, string> = {
  circle: 'M6 1a5 5 0 1 0 0.001 0z',
  square: 'M1.5 1.5h9v9h-9z',
  diamond: 'M6 0.5 11.5 6 6 11.5 0.5 6z',
  'triangle-up': 'M6 1 11 10.5H1z',
  'triangle-down': 'M6 11 11 1.5H1z',
  cross: 'M4 0.5h4v3.5h3.5v4H8v3.5H4V8H0.5V4H4z',
  x: 'M2 0.5 6 4.5 10 0.5 11.5 2 7.5 6l4 4-1.5 1.5-4-4-4 4L0.5 10l4-4-4-4z',
  star: 'M6 0.5l1.6 3.6 3.9.4-2.9 2.6.8 3.9L6 9l-3.4 2 .8-3.9L.5 4.5l3.9-.4z',
};

/** The colour and marker a plan is drawn with, so forms, lists and plots read together. */
export function PlanSwatch({ index }: { index: number }) {
  return (
    <svg aria-hidden="true" width="14" height="14" viewBox="0 0 12 12" className="shrink-0">
      <path d={MARKER_PATHS[planMarker(index)] ?? MARKER_PATHS.circle} fill={planColour(index)} stroke="#2b2b2b" strokeWidth="0.6" />
    </svg>
  );
}
