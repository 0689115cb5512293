import type { TurbineModel, TurbineReading } from '../matching/exhaust-model';
import { criticalPressureRatio } from '../physics/gas';
import { TURBINE_GAS } from '../physics/turbine';
import { orificeFlowFunction } from '../physics/wastegate';
import type { TurbineMap } from './types';

/**
 * A turbine map as a steady model uses it: one capacity curve, flow parameter and efficiency
 * against expansion ratio.
 *
 * The speed lines are collapsed by their MEAN: at every expansion ratio that appears in the file,
 * the flow parameter (and the efficiency) of each speed line that reaches that ratio is read on
 * the line (straight between its points) and the readings are averaged; the curve joins these
 * nodes with straight lines. A quasi-steady model does not know the turbine's speed, and the
 * lines of a radial turbine lie close together, so the mean is the middle of the band the
 * engine's points can fall in. The flow parameter is kept from falling as ER rises (a running
 * maximum), so each flow has exactly one expansion ratio.
 *
 * Divided housings: when the file gives the flow of ONE scroll, the turbine's capacity is twice
 * it (two scrolls in parallel at the same p3, physics note §5). Maps measured with both scrolls
 * fed are used as they are.
 *
 * Outside the map nothing is extrapolated silently; the reading says where it is and the engine
 * raises "off the turbine map":
 *  - above the highest expansion ratio, flow parameter and efficiency are held at the last node
 *    (the turbine is choked there; its flow parameter has flattened);
 *  - below the lowest, the efficiency is held at the first node, and the flow is that of the
 *    nozzle that passes the map's first point (the compressible orifice relation of §5 scaled
 *    through it), so that flow falls to zero at ER 1. Holding the flow parameter there instead
 *    would have the turbine pass flow with no pressure drop at all.
 */
export function turbineModelFromMap(map: TurbineMap): TurbineModel {
  const nodes = capacityNodes(map);
  const divisor = map.housing === 'divided' && map.scrollFeed === 'per-scroll' ? 2 : 1;
  const n = nodes.expansionRatio.length;
  const er = Float64Array.from(nodes.expansionRatio);
  const fp = Float64Array.from(nodes.flowParameter, (x) => x * divisor);
  const eta = nodes.efficiency;
  const hasEfficiency = eta !== null;
  const erMin = er[0];
  const erMax = er[n - 1];
  const gamma = TURBINE_GAS.gamma;
  const phiAtFirst = orificeFlowFunction(1 / erMin, gamma).value;
  // For the inverse: the reduced flow FP·ER at each node (increasing), and the nozzle below the map.
  const q = Float64Array.from(er, (x, i) => x * fp[i]);
  const nozzleScale = phiAtFirst > 0 ? fp[0] / phiAtFirst : 0;
  const b = (gamma - 1) / gamma;
  const subsonicConstant = Math.sqrt((2 * gamma) / (gamma - 1));
  const chokedPhi = orificeFlowFunction(0, gamma).value;
  const chokedRatio = 1 / criticalPressureRatio(gamma);
  const etaFirst = hasEfficiency ? eta[0] : null;
  const etaLast = hasEfficiency ? eta[n - 1] : null;

  const rule =
    'Speed lines collapsed to one capacity curve: at each expansion ratio of the file, the mean flow parameter and efficiency of the lines that reach it, joined by straight lines' +
    (divisor === 2 ? '; the file gives the flow of one scroll, so the capacity is twice it' : '') +
    '. Below the lowest expansion ratio the flow is that of the nozzle through the first point (zero at ER 1) and the efficiency is held; above the highest both are held.';

  return {
    name: map.name,
    housing: map.housing,
    scrollFeed: map.scrollFeed,
    areaRatio: map.areaRatio,
    expansionRatioRange: [erMin, erMax],
    mapFlowParameterDivisor: divisor,
    capacityRule: rule,
    expansionRatioForFlow(reducedFlow: number): number {
      if (!(reducedFlow > 0)) return 1;
      if (reducedFlow >= q[n - 1]) return fp[n - 1] > 0 ? reducedFlow / fp[n - 1] : Infinity;
      if (reducedFlow <= q[0]) {
        if (!(nozzleScale > 0)) return erMin;
        // ER·Φ(1/ER) = K. Subsonic: Φ = C·√(r^(2/γ) − r^((γ+1)/γ)), so ER·Φ = C·√(u² − u) with
        // u = ER^((γ−1)/γ): a quadratic in u. Choked: Φ is constant and ER = K/Φ*.
        const k = reducedFlow / nozzleScale;
        const w = k / subsonicConstant;
        const u = (1 + Math.sqrt(1 + 4 * w * w)) / 2;
        const subsonic = Math.pow(u, 1 / b);
        return Math.min(erMin, subsonic <= chokedRatio ? subsonic : k / chokedPhi);
      }
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (q[mid] <= reducedFlow) lo = mid;
        else hi = mid;
      }
      // On the segment FP = FP_lo + s·(ER − ER_lo), so FP·ER = s·ER² + β·ER: the positive root.
      const slope = (fp[hi] - fp[lo]) / (er[hi] - er[lo]);
      const beta = fp[lo] - slope * er[lo];
      const root = (2 * reducedFlow) / (beta + Math.sqrt(beta * beta + 4 * slope * reducedFlow));
      return Math.min(er[hi], Math.max(er[lo], root));
    },
    read(expansionRatio: number): TurbineReading {
      if (!(expansionRatio > 1)) return { flowParameter: 0, efficiency: etaFirst, location: 'below-map' };
      if (expansionRatio < erMin) {
        // Φ(1/ER) of the nozzle, written with u = ER^((γ−1)/γ): one power instead of two.
        const u = Math.pow(expansionRatio, b);
        const phi = expansionRatio >= chokedRatio ? chokedPhi : (subsonicConstant * Math.sqrt(Math.max(0, u * u - u))) / expansionRatio;
        return { flowParameter: nozzleScale > 0 ? nozzleScale * phi : fp[0], efficiency: etaFirst, location: 'below-map' };
      }
      if (expansionRatio > erMax) return { flowParameter: fp[n - 1], efficiency: etaLast, location: 'above-map' };
      // Binary search for the node interval [lo, lo + 1] holding the ratio.
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (er[mid] <= expansionRatio) lo = mid;
        else hi = mid;
      }
      if (lo === hi) return { flowParameter: fp[lo], efficiency: hasEfficiency ? eta[lo] : null, location: 'inside' };
      const t = (expansionRatio - er[lo]) / (er[hi] - er[lo]);
      return {
        flowParameter: fp[lo] + t * (fp[hi] - fp[lo]),
        efficiency: hasEfficiency ? eta[lo] + t * (eta[hi] - eta[lo]) : null,
        location: 'inside',
      };
    },
  };
}

/** The collapsed curve as plain numbers (flow parameter as the file gives it, SI), for plots and tests. */
export interface CapacityNodes {
  expansionRatio: number[];
  /** Mean flow parameter of the lines at each node, kg·K^0.5/(s·Pa), non-decreasing. */
  flowParameter: number[];
  /** Mean efficiency at each node (gaps filled along the curve), fraction; null when the file has none. */
  efficiency: number[] | null;
}

/** The mean-of-lines capacity curve of a turbine map (see turbineModelFromMap). */
export function capacityNodes(map: TurbineMap): CapacityNodes {
  const all = map.curves.flatMap((c) => c.points.map((p) => p.expansionRatio)).sort((a, b) => a - b);
  const ratios: number[] = [];
  for (const x of all) if (ratios.length === 0 || x - ratios[ratios.length - 1] > 1e-9 * x) ratios.push(x);
  const flow: number[] = [];
  const efficiency: (number | null)[] = [];
  for (const x of ratios) {
    const fpOnLines: number[] = [];
    const etaOnLines: number[] = [];
    for (const curve of map.curves) {
      const pts = curve.points;
      if (pts.length === 0 || x < pts[0].expansionRatio - 1e-12 || x > pts[pts.length - 1].expansionRatio + 1e-12) continue;
      let i = 0;
      while (i < pts.length - 2 && pts[i + 1].expansionRatio < x) i++;
      const a = pts[i];
      const b = pts[Math.min(i + 1, pts.length - 1)];
      const span = b.expansionRatio - a.expansionRatio;
      const t = span > 0 ? Math.min(1, Math.max(0, (x - a.expansionRatio) / span)) : 0;
      fpOnLines.push(a.flowParameter + t * (b.flowParameter - a.flowParameter));
      const etaA = t === 1 ? b.efficiency : a.efficiency;
      const etaB = t === 0 ? a.efficiency : b.efficiency;
      if (etaA !== null && etaB !== null) etaOnLines.push(etaA + t * (etaB - etaA));
    }
    flow.push(fpOnLines.length > 0 ? meanInAscendingOrder(fpOnLines) : 0);
    efficiency.push(etaOnLines.length > 0 ? meanInAscendingOrder(etaOnLines) : null);
  }
  for (let i = 1; i < flow.length; i++) if (flow[i] < flow[i - 1]) flow[i] = flow[i - 1];
  return { expansionRatio: ratios, flowParameter: flow, efficiency: fillGaps(ratios, efficiency) };
}

/** The mean, summed smallest first: the same to the last bit in whatever order the file lists its lines. */
function meanInAscendingOrder(values: number[]): number {
  values.sort((a, b) => a - b);
  let sum = 0;
  for (const x of values) sum += x;
  return sum / values.length;
}

/** Fills nulls by straight lines between the known values, held at the ends; null when none is known. */
function fillGaps(x: number[], y: (number | null)[]): number[] | null {
  const known = y.map((v, i) => (v === null ? -1 : i)).filter((i) => i >= 0);
  if (known.length === 0) return null;
  return y.map((v, i) => {
    if (v !== null) return v;
    let left = -1;
    let right = -1;
    for (const k of known) {
      if (k < i) left = k;
      else if (right === -1) right = k;
    }
    if (left === -1) return y[right]!;
    if (right === -1) return y[left]!;
    const t = (x[i] - x[left]) / (x[right] - x[left]);
    return y[left]! + t * (y[right]! - y[left]!);
  });
}
