import type { TurbineAtSpeed, TurbineModel, TurbineReading } from '../matching/exhaust/model';
import { criticalPressureRatio } from '../physics/gas';
import { TURBINE_GAS } from '../physics/turbine';
import { orificeFlowFunction } from '../physics/wastegate';
import type { TurbineMap } from './types';

/**
 * A turbine map as a steady model uses it: flow parameter and efficiency against expansion ratio,
 * read at the shaft speed the compressor side finds, or, where no speed is known, as the mean of
 * the lines.
 *
 * **At a shaft speed** N (`atSpeed`): the map is read between the two speed lines around N, each
 * line read at the expansion ratio (straight between its points), the two readings joined by a
 * straight line in speed. Outside the lines' speeds the nearest line is held (below the lowest
 * line, above the top one), and the reading says so. Where a line does not reach an expansion
 * ratio, its flow parameter follows the shape of the mean capacity curve from its end (scaled
 * through its end point) and its efficiency is held at its end. Lines without a speed are left out.
 *
 * **The mean of the lines** (`read`, where no shaft speed is known): at every expansion ratio that
 * appears in the file, the flow parameter (and the efficiency) of each speed line that reaches
 * that ratio is read on the line and the readings are averaged; the curve joins these nodes with
 * straight lines. Either way the flow parameter is kept from falling as ER rises (a running
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
 *    nozzle that passes the curve's first point (the compressible orifice relation of §5 scaled
 *    through it), so that flow falls to zero at ER 1. Holding the flow parameter there instead
 *    would have the turbine pass flow with no pressure drop at all.
 */
export function turbineModelFromMap(map: TurbineMap): TurbineModel {
  const nodes = capacityNodes(map);
  const divisor = map.housing === 'divided' && map.scrollFeed === 'per-scroll' ? 2 : 1;
  const er = Float64Array.from(nodes.expansionRatio);
  const fp = Float64Array.from(nodes.flowParameter, (x) => x * divisor);
  const eta = nodes.efficiency === null ? null : Float64Array.from(nodes.efficiency);
  const shape = curveShape(er);
  const mean = new CurveReader(shape, fp, fp, eta, eta, 0);
  const lines = speedLineRows(map, nodes, divisor);
  const speeds = lines.map((l) => l.speed);

  const rule =
    (lines.length > 0
      ? `Read at the turbocharger's shaft speed between the two speed lines around it (straight in speed), the nearest line held below the lowest and above the top line (${speeds.map((x) => Math.round(x)).join(', ')} rpm); where a line does not reach an expansion ratio, its flow parameter follows the mean curve's shape from its end and its efficiency is held. Where no shaft speed is known: the mean flow parameter and efficiency of the lines that reach each expansion ratio of the file`
      : 'Speed lines collapsed to one capacity curve (the map gives no line speeds): at each expansion ratio of the file, the mean flow parameter and efficiency of the lines that reach it, joined by straight lines') +
    (divisor === 2 ? '; the file gives the flow of one scroll, so the capacity is twice it' : '') +
    '. Below the lowest expansion ratio the flow is that of the nozzle through the first point (zero at ER 1) and the efficiency is held; above the highest both are held.';

  return {
    name: map.name,
    housing: map.housing,
    scrollFeed: map.scrollFeed,
    areaRatio: map.areaRatio,
    efficiencyKind: map.efficiencyKind ?? null,
    expansionRatioRange: [shape.erMin, shape.erMax],
    mapFlowParameterDivisor: divisor,
    capacityRule: rule,
    speedLines: speeds,
    expansionRatioForFlow: (reducedFlow: number) => mean.expansionRatioForFlow(reducedFlow),
    read: (expansionRatio: number) => mean.read(expansionRatio),
    atSpeed: lines.length === 0 ? undefined : (shaftSpeed: number) => readerAtSpeed(shape, lines, shaftSpeed),
  };
}

/** What every curve on the map's nodes shares: the node ratios and the nozzle below the first. */
interface CurveShape {
  er: Float64Array;
  n: number;
  erMin: number;
  erMax: number;
  /** Φ(1/ER_min) of the nozzle through the first node. */
  phiAtFirst: number;
  gamma: number;
  exponent: number;
  subsonicConstant: number;
  chokedPhi: number;
  chokedRatio: number;
}

function curveShape(er: Float64Array): CurveShape {
  // The nozzle's shape is the map's, not the point's gas: a fixed γ keeps the curve a property of the map.
  const gamma = TURBINE_GAS.gamma;
  return {
    er,
    n: er.length,
    erMin: er[0],
    erMax: er[er.length - 1],
    phiAtFirst: orificeFlowFunction(1 / er[0], gamma).value,
    gamma,
    exponent: (gamma - 1) / gamma,
    subsonicConstant: Math.sqrt((2 * gamma) / (gamma - 1)),
    chokedPhi: orificeFlowFunction(0, gamma).value,
    chokedRatio: 1 / criticalPressureRatio(gamma),
  };
}

/** Index lo of the node interval [lo, lo + 1] holding x (values rising). */
function intervalOf(values: Float64Array, x: number): number {
  let lo = 0;
  let hi = values.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (values[mid] <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * Reading and inverse of one curve on the map's nodes: a straight blend, in speed, of two rows of
 * node values (the same row twice for the mean curve). Each row's flow parameter never falls as
 * ER rises, so neither does the blend, and each flow has one ratio. Nothing is allocated per
 * blend: the exhaust side builds one for every trial shaft speed.
 */
class CurveReader {
  private readonly etaA: Float64Array | null;
  private readonly etaB: Float64Array | null;
  constructor(
    protected readonly shape: CurveShape,
    private readonly fpA: Float64Array,
    private readonly fpB: Float64Array,
    etaA: Float64Array | null,
    etaB: Float64Array | null,
    private readonly w: number,
  ) {
    // A row without efficiency gives way to the other.
    this.etaA = etaA ?? etaB;
    this.etaB = etaB ?? etaA;
  }

  /** Flow parameter at node j. */
  private fp(j: number): number {
    const a = this.fpA[j];
    return this.w === 0 ? a : a + this.w * (this.fpB[j] - a);
  }

  /** Efficiency at node j; null when neither row gives one. */
  private eta(j: number): number | null {
    const a = this.etaA;
    if (a === null) return null;
    return this.w === 0 ? a[j] : a[j] + this.w * (this.etaB![j] - a[j]);
  }

  private nozzleScale(): number {
    return this.shape.phiAtFirst > 0 ? this.fp(0) / this.shape.phiAtFirst : 0;
  }

  expansionRatioForFlow(reducedFlow: number): number {
    const { er, n, erMin, exponent: b, subsonicConstant, chokedPhi, chokedRatio } = this.shape;
    if (!(reducedFlow > 0)) return 1;
    const fpLast = this.fp(n - 1);
    if (reducedFlow >= er[n - 1] * fpLast) return fpLast > 0 ? reducedFlow / fpLast : Infinity;
    if (reducedFlow <= er[0] * this.fp(0)) {
      const nozzleScale = this.nozzleScale();
      if (!(nozzleScale > 0)) return erMin;
      // ER·Φ(1/ER) = K. Subsonic: Φ = C·√(r^(2/γ) − r^((γ+1)/γ)), so ER·Φ = C·√(u² − u) with
      // u = ER^((γ−1)/γ): a quadratic in u. Choked: Φ is constant and ER = K/Φ*.
      const k = reducedFlow / nozzleScale;
      const w = k / subsonicConstant;
      const u = (1 + Math.sqrt(1 + 4 * w * w)) / 2;
      const subsonic = Math.pow(u, 1 / b);
      return Math.min(erMin, subsonic <= chokedRatio ? subsonic : k / chokedPhi);
    }
    // The node interval whose reduced flow FP·ER holds the flow (it rises node to node).
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (er[mid] * this.fp(mid) <= reducedFlow) lo = mid;
      else hi = mid;
    }
    hi = lo + 1;
    const fpLo = this.fp(lo);
    // On the segment FP = FP_lo + s·(ER − ER_lo), so FP·ER = s·ER² + β·ER: the positive root.
    const slope = (this.fp(hi) - fpLo) / (er[hi] - er[lo]);
    const beta = fpLo - slope * er[lo];
    const root = (2 * reducedFlow) / (beta + Math.sqrt(beta * beta + 4 * slope * reducedFlow));
    return Math.min(er[hi], Math.max(er[lo], root));
  }

  read(expansionRatio: number): TurbineReading {
    const { er, n, erMin, erMax, exponent: b, subsonicConstant, chokedPhi, chokedRatio } = this.shape;
    if (!(expansionRatio > 1)) return { flowParameter: 0, efficiency: this.eta(0), location: 'below-map' };
    if (expansionRatio < erMin) {
      // Φ(1/ER) of the nozzle, written with u = ER^((γ−1)/γ): one power instead of two.
      const u = Math.pow(expansionRatio, b);
      const phi = expansionRatio >= chokedRatio ? chokedPhi : (subsonicConstant * Math.sqrt(Math.max(0, u * u - u))) / expansionRatio;
      const nozzleScale = this.nozzleScale();
      return { flowParameter: nozzleScale > 0 ? nozzleScale * phi : this.fp(0), efficiency: this.eta(0), location: 'below-map' };
    }
    if (expansionRatio > erMax) return { flowParameter: this.fp(n - 1), efficiency: this.eta(n - 1), location: 'above-map' };
    if (n === 1) return { flowParameter: this.fp(0), efficiency: this.eta(0), location: 'inside' };
    const lo = intervalOf(er, expansionRatio);
    const hi = lo + 1;
    const t = (expansionRatio - er[lo]) / (er[hi] - er[lo]);
    const fpLo = this.fp(lo);
    const etaLo = this.eta(lo);
    return {
      flowParameter: fpLo + t * (this.fp(hi) - fpLo),
      efficiency: etaLo === null ? null : etaLo + t * (this.eta(hi)! - etaLo),
      location: 'inside',
    };
  }
}

/** The map at one shaft speed: the curve between the two lines around it, and how the speed was used. */
class SpeedReader extends CurveReader implements TurbineAtSpeed {
  constructor(
    shape: CurveShape,
    private readonly lower: SpeedLineRow,
    private readonly upper: SpeedLineRow,
    weight: number,
    readonly speedBasis: TurbineAtSpeed['speedBasis'],
    readonly shaftSpeed: number,
  ) {
    super(shape, lower.fp, upper.fp, lower.eta, upper.eta, weight);
  }

  get lowerSpeed(): number {
    return this.lower.speed;
  }

  get upperSpeed(): number {
    return this.upper.speed;
  }

  linesAt(expansionRatio: number): { lowerEfficiency: number | null; upperEfficiency: number | null } {
    return { lowerEfficiency: this.onLine(this.lower, expansionRatio), upperEfficiency: this.onLine(this.upper, expansionRatio) };
  }

  /** One line's efficiency at a ratio, held at the map's ends. */
  private onLine(row: SpeedLineRow, x: number): number | null {
    const { er, n, erMin, erMax } = this.shape;
    if (!row.eta) return null;
    if (!(x > erMin)) return row.eta[0];
    if (x >= erMax) return row.eta[n - 1];
    const lo = intervalOf(er, x);
    const t = (x - er[lo]) / (er[lo + 1] - er[lo]);
    return row.eta[lo] + t * (row.eta[lo + 1] - row.eta[lo]);
  }
}

/** One speed line read at every node of the map (see turbineModelFromMap): flow parameter with the divisor applied. */
interface SpeedLineRow {
  speed: number;
  fp: Float64Array;
  eta: Float64Array | null;
}

/** The lines that carry a speed, slowest first, each read at every node ratio. */
function speedLineRows(map: TurbineMap, nodes: CapacityNodes, divisor: number): SpeedLineRow[] {
  const rows: SpeedLineRow[] = [];
  const ratios = nodes.expansionRatio;
  const meanFp = nodes.flowParameter;
  const nodeIndex = (x: number) => ratios.findIndex((r) => Math.abs(r - x) <= 1e-9 * x);
  for (const curve of map.curves) {
    const pts = curve.points;
    const speed = pts.find((p) => p.speed !== null)?.speed ?? null;
    if (speed === null || !(speed > 0) || pts.length === 0) continue;
    const ers = pts.map((p) => p.expansionRatio);
    const etas = fillGaps(
      ers,
      pts.map((p) => p.efficiency),
    );
    const first = 0;
    const last = pts.length - 1;
    const meanAt = (i: number) => meanFp[Math.max(0, nodeIndex(ers[i]))];
    const fp = new Float64Array(ratios.length);
    const eta = etas === null ? null : new Float64Array(ratios.length);
    ratios.forEach((x, j) => {
      if (x < ers[first] - 1e-12) {
        const ref = meanAt(first);
        fp[j] = ref > 0 ? (pts[first].flowParameter * meanFp[j]) / ref : pts[first].flowParameter;
        if (eta) eta[j] = etas![first];
      } else if (x > ers[last] + 1e-12) {
        const ref = meanAt(last);
        fp[j] = ref > 0 ? (pts[last].flowParameter * meanFp[j]) / ref : pts[last].flowParameter;
        if (eta) eta[j] = etas![last];
      } else {
        let i = 0;
        while (i < pts.length - 2 && ers[i + 1] < x) i++;
        const k = Math.min(i + 1, last);
        const span = ers[k] - ers[i];
        const t = span > 0 ? Math.min(1, Math.max(0, (x - ers[i]) / span)) : 0;
        fp[j] = pts[i].flowParameter + t * (pts[k].flowParameter - pts[i].flowParameter);
        if (eta) eta[j] = etas![i] + t * (etas![k] - etas![i]);
      }
      fp[j] *= divisor;
      // Kept from falling as ER rises, like the mean curve: then any blend of two rows is too.
      if (j > 0 && fp[j] < fp[j - 1]) fp[j] = fp[j - 1];
    });
    rows.push({ speed, fp, eta });
  }
  return rows.sort((a, b) => a.speed - b.speed);
}

/** The map at one shaft speed (rpm): the two lines around it joined by a straight line in speed. */
function readerAtSpeed(shape: CurveShape, lines: SpeedLineRow[], shaftSpeed: number): TurbineAtSpeed {
  const m = lines.length;
  if (!(shaftSpeed >= lines[0].speed)) return new SpeedReader(shape, lines[0], lines[0], 0, 'held-at-lowest-line', shaftSpeed);
  if (shaftSpeed > lines[m - 1].speed) return new SpeedReader(shape, lines[m - 1], lines[m - 1], 0, 'held-at-top-line', shaftSpeed);
  let upper = 0;
  while (upper < m - 1 && lines[upper].speed < shaftSpeed) upper++;
  const lower = upper > 0 && lines[upper].speed > shaftSpeed ? upper - 1 : upper;
  const weight = upper === lower ? 0 : (shaftSpeed - lines[lower].speed) / (lines[upper].speed - lines[lower].speed);
  return new SpeedReader(shape, lines[lower], lines[upper], weight, 'speed-lines', shaftSpeed);
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
