/**
 * The compute contract (`POST /api/compute`): single points with their own manifold temperature,
 * no study around them. Same solver as the study; the answer carries exactly the contract's fields.
 */
import { chargeGasOf, resolveAmbient } from '../matching/ambient';
import { STANDARD_REFERENCE } from '../matching/compressor/model';
import { DEFAULT_COMPRESSOR_EFFICIENCY, solvePoint } from '../matching/compressor/solve-point';
import { pointWorking } from '../matching/explain-point';
import { resolveRequirements } from '../matching/input/requirements';
import type { LineContext } from '../matching/line-context';
import type { OperatingPoint } from '../matching/result';
import type { WorkingStep } from '../matching/working';
import { efficiencyFromBsfc, fuelProperties, type FuelChoice } from '../physics';
import type { ComputeRequest, ComputeResponse, ComputeResultPoint } from '../schemas/compute';

const SEVERITY_ORDER = { limit: 0, warning: 1, info: 2 } as const;

/** Refused compute request: a point that passed the schema yet has no physical state. */
export class ComputeError extends Error {}

/** The line context of a compute request (fixed manifold temperature per point). */
function computeContext(req: ComputeRequest): LineContext {
  const f = req.fuel;
  const choice: FuelChoice | null = f
    ? f.kind === 'ethanol-blend'
      ? { kind: 'ethanol-blend', ethanolPercent: f.ethanolPercent ?? 0 }
      : { kind: f.kind }
    : null;
  const properties = choice ? fuelProperties(choice) : null;
  let power: LineContext['power'] = null;
  if (f && properties && (f.brakeThermalEfficiency !== undefined || f.bsfc !== undefined)) {
    power =
      f.bsfc !== undefined
        ? {
            basis: 'bsfc',
            brakeThermalEfficiency: efficiencyFromBsfc(f.bsfc, properties.lowerHeatingValue),
            bsfc: f.bsfc,
            drivetrainLoss: f.drivetrainLoss ?? null,
          }
        : { basis: 'brake-thermal-efficiency', brakeThermalEfficiency: f.brakeThermalEfficiency!, bsfc: null, drivetrainLoss: f.drivetrainLoss ?? null };
  }
  const reference = req.mapReference ?? STANDARD_REFERENCE;
  const ambient = resolveAmbient(req.ambient);
  return {
    engine: { displacement: req.engine.displacement, cylinders: req.engine.cylinders, strokes: req.engine.strokes, limits: {}, trappingEfficiency: 1 },
    tables: { volumetricEfficiency: null, boost: null, lambda: null },
    fuel: choice && properties ? { choice, properties } : null,
    injectors: null,
    pumpFlowAvailable: null,
    power,
    losses: { inlet: req.losses?.inlet ?? { pressureLoss: 0 }, chargeCooler: req.losses?.chargeCooler ?? { pressureLoss: 0 }, inletTemperatureRise: 0 },
    // Each point states its own manifold temperature; this placeholder is never read.
    intercooler: { kind: 'effectiveness', effectiveness: 0 },
    ambient,
    air: chargeGasOf(ambient),
    plan: {
      name: 'compute request',
      turbochargers: req.turbochargers ?? 1,
      compressorEfficiency: DEFAULT_COMPRESSOR_EFFICIENCY,
      mapReference: { temperature: reference.temperature, pressure: reference.pressure },
    },
    reference: { temperature: reference.temperature, pressure: reference.pressure },
    referenceFrom: req.mapReference ? 'plan' : 'standard',
    hasMap: false,
    requirements: resolveRequirements(req.requirements),
  };
}

/** Solves every point of a (parsed) compute request, with the engine's full result per point. */
export function solveComputeRequest(req: ComputeRequest): { context: LineContext; points: OperatingPoint[] } {
  const context = computeContext(req);
  const lambda = req.fuel?.lambda ?? null;
  const points = req.points.map((p, i) =>
    solvePoint(
      context,
      null,
      {
        rpm: p.rpm,
        volumetricEfficiency: p.volumetricEfficiency,
        boost: p.boost,
        lambda,
        manifoldTemperature: p.manifoldTemperature,
        ...(p.compressorEfficiency !== undefined ? { compressorEfficiency: p.compressorEfficiency } : {}),
      },
      { firstOfLine: i === 0 },
    ),
  );
  return { context, points };
}

/** The Working of one point of a compute request. */
export function computePointWorking(context: LineContext, point: OperatingPoint): WorkingStep[] {
  return pointWorking(context, point, { fixedManifoldTemperature: true });
}

/** Answers a parsed compute request with exactly the contract's result fields. */
export function runComputeRequest(req: ComputeRequest): ComputeResponse {
  const { points } = solveComputeRequest(req);
  return {
    points: points.map((point, i): ComputeResultPoint => {
      if (!point.solved) throw new ComputeError(`points.${i}: ${point.findings[0]?.message ?? 'cannot be solved'}`);
      const v = point.values;
      const out: ComputeResultPoint = {
        rpm: v.rpm,
        manifoldPressure: v.manifoldPressure,
        airDensity: v.airDensity,
        massFlow: v.massFlow,
        correctedMassFlow: v.correctedMassFlow,
        compressorInletPressure: v.compressorInletPressure,
        compressorOutletPressure: v.compressorOutletPressure,
        pressureRatio: v.pressureRatio,
        // No map in a compute request: every point is reachable and keeps its results.
        compressorOutletTemperature: v.compressorOutletTemperature ?? Number.NaN,
        compressorPower: v.compressorPower ?? Number.NaN,
        findings: [],
      };
      if (v.fuelMassFlow !== null) out.fuelMassFlow = v.fuelMassFlow;
      if (v.brakePower !== null) out.brakePower = v.brakePower;
      if (v.wheelPower !== null) out.wheelPower = v.wheelPower;
      out.findings = [...point.findings]
        .sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity])
        .map((f) => ({ code: f.code, severity: f.severity, message: f.message }));
      return out;
    }),
  };
}
