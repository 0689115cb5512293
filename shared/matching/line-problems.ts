/** Checks of a line's own inputs: reasons they give no physical state, checked once per line. */
import { lossFollowsFlow } from '../physics/losses';
import type { LineContext } from './line-context';
import { fmt, kelvin } from './working';

const positive = (x: number | null | undefined): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;

/** Reasons the line's own inputs give no physical state (checked once per line). */
export function lineProblems(ctx: LineContext): string[] {
  const problems: string[] = [];
  const { pressure, temperature } = ctx.ambient;
  if (!positive(pressure)) problems.push(`Ambient pressure ${fmt(pressure)} Pa is not positive.`);
  if (!positive(temperature)) problems.push(`Ambient temperature ${fmt(temperature)} K is not positive.`);
  const inlet = ctx.losses.inlet;
  if (!(inlet.pressureLoss >= 0)) problems.push('Inlet loss is negative.');
  else if (!lossFollowsFlow(inlet) && !positive(pressure - inlet.pressureLoss))
    problems.push(`The inlet loss ${fmt(inlet.pressureLoss)} Pa leaves no pressure at the compressor inlet.`);
  if (!positive(temperature + ctx.losses.inletTemperatureRise)) problems.push('Compressor inlet temperature is not positive.');
  if (!(ctx.losses.chargeCooler.pressureLoss >= 0)) problems.push('Charge-cooler loss is negative.');
  for (const [what, loss] of [
    ['inlet', inlet],
    ['charge-cooler', ctx.losses.chargeCooler],
  ] as const) {
    if (loss.referenceMassFlow !== undefined && !positive(loss.referenceMassFlow)) problems.push(`The ${what} loss's reference flow is not positive.`);
    if (loss.referenceDensity !== undefined && !positive(loss.referenceDensity)) problems.push(`The ${what} loss's reference density is not positive.`);
  }
  if (!positive(ctx.air.gasConstant) || !positive(ctx.air.cp) || !(ctx.air.gamma > 1))
    problems.push(
      `Relative humidity ${fmt(ctx.ambient.relativeHumidity * 100, 3)} % is more water than air at ${fmt(pressure / 1000)} kPa and ${kelvin(temperature)} can hold.`,
    );
  if (!(positive(ctx.engine.trappingEfficiency) && ctx.engine.trappingEfficiency <= 1)) problems.push('Trapping efficiency is not between 0 and 1.');
  if (!positive(ctx.engine.displacement)) problems.push('Displacement is not positive.');
  if (!(Number.isInteger(ctx.plan.turbochargers) && ctx.plan.turbochargers >= 1)) problems.push('Turbocharger count is not a whole number of at least 1.');
  if (!(positive(ctx.plan.compressorEfficiency) && ctx.plan.compressorEfficiency <= 1)) problems.push('Plan compressor efficiency is not between 0 and 1.');
  const offMap = ctx.plan.offMapEfficiency;
  if (offMap !== undefined && !(positive(offMap) && offMap <= 1)) problems.push('The off-map efficiency assumption is not between 0 and 1.');
  if (!positive(ctx.reference.temperature) || !positive(ctx.reference.pressure)) problems.push('The map reference temperature and pressure must be positive.');
  const ic = ctx.intercooler;
  if (ic.kind === 'fixed' && !positive(ic.manifoldTemperature)) problems.push('Manifold temperature is not positive.');
  if (ic.kind === 'effectiveness' && !(ic.effectiveness >= 0 && ic.effectiveness <= 1)) problems.push('Intercooler effectiveness is not between 0 and 1.');
  if (ic.kind === 'effectiveness' && ic.coolantTemperature !== undefined && !positive(ic.coolantTemperature))
    problems.push('Coolant temperature is not positive.');
  if (
    ctx.fuel &&
    !(positive(ctx.fuel.properties.stoichiometricAfr) && positive(ctx.fuel.properties.lowerHeatingValue) && positive(ctx.fuel.properties.density))
  )
    problems.push('The fuel properties are not positive (ethanol percent outside 0–100?).');
  if (ctx.power && !(positive(ctx.power.brakeThermalEfficiency) && ctx.power.brakeThermalEfficiency <= 1))
    problems.push('Brake thermal efficiency is not between 0 and 1.');
  if (ctx.power && ctx.power.drivetrainLoss !== null && !(ctx.power.drivetrainLoss >= 0 && ctx.power.drivetrainLoss < 1))
    problems.push('Drivetrain loss is not between 0 and 1.');
  const inj = ctx.injectors;
  if (inj) {
    const sets = inj.secondary ? [inj.primary, inj.secondary] : [inj.primary];
    for (const s of sets) {
      if (!(positive(s.count) && positive(s.ratedFlow) && positive(s.ratedPressure)))
        problems.push('An injector set has a non-positive count, flow or rated pressure.');
      if (s.ratingFluidDensity !== undefined && !positive(s.ratingFluidDensity)) problems.push("An injector set's rating fluid density is not positive.");
      if (s.deadTime !== undefined && !(s.deadTime.time >= 0)) problems.push("An injector set's dead time is negative.");
    }
    if (!positive(inj.fuelPressure)) problems.push('Fuel pressure is not positive.');
  }
  return problems;
}
