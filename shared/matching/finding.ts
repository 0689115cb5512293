/**
 * A finding: what a point's numbers mean for the build, with a severity. "limit" is reserved for
 * hard limits (surge, overspeed, injector saturation, the builder's own limits).
 */
import type { WorkingKind } from './working';

export type Severity = 'info' | 'warning' | 'limit';

export type FindingCode =
  | 'unsolvable'
  | 'input-out-of-range'
  | 'injector-duty-high'
  | 'injector-duty-limit'
  | 'injector-saturated'
  | 'injector-no-flow'
  | 'fuel-pump-short'
  | 'fuel-pump-near-limit'
  | 'compressor-outlet-temperature-high'
  | 'compressor-outlet-temperature-limit'
  | 'efficiency-off-map'
  | 'map-left-of-surge'
  | 'map-beyond-choke'
  | 'map-above-top-speed'
  | 'map-below-map'
  | 'map-off-map'
  | 'overspeed'
  | 'throttled'
  | 'not-converged'
  | 'rpm-limit'
  | 'manifold-pressure-limit'
  | 'boost-target-not-held'
  | 'wastegate-too-small'
  | 'drive-pressure-ratio-high'
  | 'turbine-off-map'
  | 'turbine-efficiency-assumed'
  | 'turbine-map-missing'
  | 'turbine-housing-mismatch'
  | 'exhaust-not-converged'
  | 'throttle-sets-boost'
  | 'surge-margin-thin'
  | 'choke-margin-thin'
  | 'speed-margin-thin'
  | 'lean-under-boost'
  | 'lean-under-boost-limit'
  | 'off-map-assumption'
  | 'turbine-speed-outside-lines'
  | 'mechanical-efficiency-in-map'
  | 'map-estimate';

export interface Finding {
  code: FindingCode;
  severity: Severity;
  /** Plain words, SI values; `value`, `threshold` and `kind` let a screen re-word it in the user's units. */
  message: string;
  /** Engine speed of the point, rpm. */
  rpm: number;
  value?: number;
  threshold?: number;
  kind?: WorkingKind;
}

/** A finding, with the quantity it is about when there is one. */
export function finding(
  code: FindingCode,
  severity: Severity,
  message: string,
  rpm: number,
  quantity?: { value: number; threshold?: number; kind: WorkingKind },
): Finding {
  return quantity ? { code, severity, message, rpm, ...quantity } : { code, severity, message, rpm };
}

/** The finding of a point that cannot be solved. */
export function unsolvableFinding(rpm: number, reason: string): Finding {
  return finding('unsolvable', 'limit', reason, rpm);
}

const severityRank: Record<Severity, number> = { info: 0, warning: 1, limit: 2 };

/** The most severe of some findings, or null when there are none. */
export function worstSeverity(findings: readonly Finding[]): Severity | null {
  let worst: Severity | null = null;
  for (const f of findings) if (worst === null || severityRank[f.severity] > severityRank[worst]) worst = f.severity;
  return worst;
}
