/**
 * A family of compressor maps from one parent map by the similarity laws of turbomachines.
 *
 * Geometrically similar wheels at the same flow coefficient φ = ṁ/(ρ·N·D³), the same head
 * coefficient ψ = Δh/(N·D)² and the same blade Mach number work alike (Dixon & Hall, Fluid Mechanics
 * and Thermodynamics of Turbomachinery, 7th ed., 2014, ch. 1, "Dimensional analysis and
 * performance laws"). Holding the tip speed U = π·D·N/60 (so ψ and the Mach number) between sizes:
 *
 *   N₂ = N₁·(D₁/D₂)            corrected speed inversely with diameter
 *   ṁ₂ = ṁ₁·(D₂/D₁)²           corrected flow with diameter squared (φ fixed, ρ·N·D³ ∝ D²)
 *   PR₂ = PR₁, η₂ = η₁          pressure ratio and efficiency kept
 *
 * Optionally the size effect on efficiency: a larger wheel loses a smaller share to friction and
 * clearances. Moody's step-up formula, (1 − η₂)/(1 − η₁) = (D₁/D₂)^(1/5), as given in Dixon & Hall,
 * 7th ed., ch. 1 (from memory of the section; Moody's exponent 1/5 for hydraulic turbines, used here
 * for compressors as an estimate).
 *
 * Trim (inducer area over exducer area) changed on the same exducer: the flow a wheel passes
 * follows its inducer area at the same tip speed, so corrected flow scales with the trim ratio
 * while speed lines, pressure ratio and efficiency are kept. This holds only for small changes
 * (common practice, no source): within ±10 % of the parent's trim; beyond it the inducer's
 * incidence and throat change the map's shape, and the rule refuses.
 */
import type { CompressorCurve, CompressorMap } from '../types';

/** The diameter ratios the rule accepts: beyond them Reynolds number and tip clearance no longer scale (common practice, no source). */
export const DIAMETER_RATIO_RANGE = [0.5, 2] as const;
/** The trim ratios (new trim over the parent's) the rule accepts (common practice, no source). */
export const TRIM_RATIO_RANGE = [0.9, 1.1] as const;
/** Moody's exponent of the size effect on efficiency (Dixon & Hall, 7th ed., ch. 1; from memory). */
const MOODY_EXPONENT = 0.2;

export type FamilyRule = { kind: 'diameter'; diameterRatio: number; sizeEffect: boolean } | { kind: 'trim'; parentTrim: number; trim: number };

/** A new map (marked as an estimate of its parent, `map.estimate`), or why the rule does not hold. */
export type FamilyResult = { ok: true; map: CompressorMap } | { ok: false; message: string };

const fixed = (x: number, digits = 3) => x.toFixed(digits).replace(/0+$/, '').replace(/\.$/, '');

/** Efficiency of a wheel D₂/D₁ times the parent's by Moody's formula: 1 − (1 − η₁)·(D₁/D₂)^(1/5). */
export function moodyEfficiency(efficiency: number, diameterRatio: number): number {
  return 1 - (1 - efficiency) * diameterRatio ** -MOODY_EXPONENT;
}

function scaleCurves(curves: readonly CompressorCurve[], flowFactor: number, speedFactor: number, efficiency: (eta: number) => number): CompressorCurve[] {
  return curves.map((c) => ({
    ...c,
    label:
      c.kind === 'speed' && c.points[0]?.speed != null
        ? String(Math.round(c.points[0].speed * speedFactor))
        : c.kind === 'island'
          ? islandLabel(c, efficiency)
          : c.label,
    points: c.points.map((p) => ({
      correctedMassFlow: p.correctedMassFlow * flowFactor,
      pressureRatio: p.pressureRatio,
      efficiency: p.efficiency === null ? null : efficiency(p.efficiency),
      speed: p.speed === null ? null : Math.round(p.speed * speedFactor),
    })),
  }));
}

/** An island's label follows its efficiency where the label is that efficiency (percent or fraction); a name stays. */
function islandLabel(c: CompressorCurve, efficiency: (eta: number) => number): string {
  const eta = c.points[0]?.efficiency;
  const label = Number(c.label);
  if (eta == null || !Number.isFinite(label) || c.label.trim() === '') return c.label;
  const scaled = efficiency(eta);
  return Math.abs(label - eta * 100) < 0.51 ? fixed(scaled * 100, 1) : fixed(scaled, 3);
}

const outside = (x: number, [low, high]: readonly [number, number]) => !(x >= low && x <= high);

/** A new compressor map from a parent by one rule, or why the rule does not hold there. */
export function familyMember(parent: { id: string; map: CompressorMap }, rule: FamilyRule, name: string): FamilyResult {
  const { id: parentId, map: source } = parent;
  let flowFactor: number;
  let speedFactor: number;
  let efficiency: (eta: number) => number = (eta) => eta;
  let words: string;
  if (rule.kind === 'diameter') {
    const r = rule.diameterRatio;
    if (!Number.isFinite(r) || outside(r, DIAMETER_RATIO_RANGE)) {
      return {
        ok: false,
        message: `diameterRatio must be between ${DIAMETER_RATIO_RANGE[0]} and ${DIAMETER_RATIO_RANGE[1]} (got ${r}): further from the parent, friction and tip clearance no longer scale with the wheel and the estimate would not be honest.`,
      };
    }
    flowFactor = r * r;
    speedFactor = 1 / r;
    if (rule.sizeEffect) efficiency = (eta) => moodyEfficiency(eta, r);
    words = `diameter × ${fixed(r)} by the similarity laws at equal tip speed (flow × ${fixed(flowFactor)}, speed ÷ ${fixed(r)}, pressure ratio kept, efficiency ${rule.sizeEffect ? "with Moody's size effect" : 'kept'})`;
  } else {
    const { parentTrim, trim } = rule;
    for (const [field, value] of [
      ['parentTrim', parentTrim],
      ['trim', trim],
    ] as const) {
      if (!Number.isFinite(value) || value <= 0 || value > 100)
        return { ok: false, message: `${field} is the inducer/exducer area ratio in percent, above 0 and at most 100 (got ${value}).` };
    }
    const ratio = trim / parentTrim;
    if (outside(ratio, TRIM_RATIO_RANGE)) {
      return {
        ok: false,
        message: `A trim of ${fixed(trim, 1)} from ${fixed(parentTrim, 1)} is a change of ${fixed((ratio - 1) * 100, 1)} %; the rule holds only within ±10 % of the parent's trim (${fixed(parentTrim * TRIM_RATIO_RANGE[0], 1)} to ${fixed(parentTrim * TRIM_RATIO_RANGE[1], 1)}). Beyond it the inducer reshapes the map: trace the real one.`,
      };
    }
    flowFactor = ratio;
    speedFactor = 1;
    words = `trim ${fixed(parentTrim, 1)} → ${fixed(trim, 1)} (flow × ${fixed(ratio)} with the inducer area; speed lines, pressure ratio and efficiency kept)`;
  }
  const map: CompressorMap = {
    ...source,
    name,
    notes: [`Estimate: made from “${source.name}” by ${words}. Not a measured map.`, ...source.notes],
    maxSpeed: source.maxSpeed === null ? null : Math.round(source.maxSpeed * speedFactor),
    curves: scaleCurves(source.curves, flowFactor, speedFactor, efficiency),
    estimate: { parentId, parentName: source.name, rule: words },
  };
  return { ok: true, map };
}
