import type { PlanVerdict } from '#shared/matching/verdict';
import { planColour, scenarioDash } from '#src/components/plots/style';

/** A chosen line of Side by side: its place in the comparison and where it comes from. */
export interface ChosenLine {
  key: string;
  /** 0–3: picks the line's colour, marker and dash on the map (each chosen line its own). */
  index: number;
  planName: string;
  scenarioName: string;
  rowLabel: string;
  /** The verdict of the line's plan over all its scenarios and boost rows, when judged. */
  verdict?: PlanVerdict;
}

// The marker shapes of style.ts's planMarkers, drawn small for tables and legends.
const SHAPES = ['circle', 'square', 'diamond', 'triangle'] as const;

/** The colour, marker and dash a chosen line has on the map, as a small legend glyph. */
export function CombinationMark({ index }: { index: number }) {
  const colour = planColour(index);
  const shape = SHAPES[index % SHAPES.length];
  const dash = scenarioDash(index);
  const dashArray = dash === 'dash' ? '4 3' : dash === 'dot' ? '1.5 2.5' : dash === 'dashdot' ? '5 2 1.5 2' : undefined;
  return (
    <svg aria-hidden="true" viewBox="0 0 28 12" className="mt-0.5 h-3 w-7 shrink-0">
      <line x1="1" y1="6" x2="27" y2="6" stroke={colour} strokeWidth="2" strokeDasharray={dashArray} />
      {shape === 'circle' && <circle cx="14" cy="6" r="3.5" fill={colour} />}
      {shape === 'square' && <rect x="10.5" y="2.5" width="7" height="7" fill={colour} />}
      {shape === 'diamond' && <path d="M14 1.5 L18.5 6 L14 10.5 L9.5 6 Z" fill={colour} />}
      {shape === 'triangle' && <path d="M14 1.5 L18.5 10 L9.5 10 Z" fill={colour} />}
    </svg>
  );
}
