import type { StudyDocument } from '#shared/schemas/study';
import { AIR_CP, AIR_GAMMA, AIR_GAS_CONSTANT, TURBINE_GAS } from '#shared/physics';
import type { MapGroup } from '../study-view';
import { formatNumber, formatStudyValue, useUnitSystem } from '#src/lib/quantities';

/**
 * What the numbers rest on, in plain words: the model, the atmosphere, where each plan's
 * compressor efficiency comes from and the reference its corrected flow is measured against, and
 * for plans with an exhaust side the turbine's power balance and what it takes as given.
 */
export function Assumptions({ document, groups }: { document: StudyDocument; groups: readonly MapGroup[] }) {
  const system = useUnitSystem();
  const ic = document.intercooler;
  const power = document.power;
  const withExhaust = document.plans.some((p) => p.exhaust);
  const divided = document.plans.some((p) => p.exhaust?.housing === 'divided');
  return (
    <div className="space-y-3 text-sm text-ink">
      <ul className="list-disc space-y-1.5 pl-5">
        <li>
          <strong>Quasi-steady model.</strong> Each engine speed is worked out on its own, as if the engine were held there at the boost target
          {withExhaust ? ' (for a plan with an exhaust side, at the boost its turbine can hold where that is less)' : ''}. Spool-up, transients and pulsation
          are not modelled.
        </li>
        <li>
          <strong>Atmosphere.</strong> Where a scenario gives an altitude, pressure follows the International Standard Atmosphere (ISO 2533 / ICAO Doc 7488,
          troposphere), with the altitude taken as geopotential height. Air is an ideal gas with R = {formatNumber(AIR_GAS_CONSTANT, 8)} J/(kg·K), γ ={' '}
          {AIR_GAMMA} and c<sub>p</sub> = {formatNumber(AIR_CP, 5)} J/(kg·K).
        </li>
        <li>
          <strong>Pressures.</strong> Boost is gauge (above the outside air); every other pressure is absolute. Static pressures stand in for total pressures:
          the air is slow in the pipes.
        </li>
        <li>
          <strong>Engine air flow.</strong> Volumetric efficiency is referred to the density in the intake manifold (Heywood, 1988, §2.10).
        </li>
        <li>
          <strong>Manifold temperature.</strong>{' '}
          {ic.kind === 'fixed'
            ? `Stated as ${formatStudyValue(ic.manifoldTemperature, 'temperature', system)} at every point.`
            : `From the intercooler's effectiveness (${formatStudyValue(ic.effectiveness, 'fraction', system)}); because the compressor outlet temperature depends on where the point lands on the map, the two are solved together by repeated passes.`}
        </li>
        <li>
          <strong>Compressor efficiency.</strong> Read from each plan’s map where the point lands on it; below the map’s lowest speed line (or for a plan with
          no map) the plan’s default efficiency is used, and the findings say so. A point left of surge, past choke, over the speed limit or off the map is not
          reachable with that compressor: it keeps its place on the map, but its efficiency, temperatures, power, fuel and exhaust side are not given and count
          in no peak.
          {document.plans.some((p) => p.offMapEfficiency !== undefined) &&
            ' Where a plan states an off-map efficiency, its points past choke, above the map or outside the speed lines are computed on that assumption instead, named in the findings; surge and overspeed stay limits.'}
        </li>
        <li>
          <strong>Power.</strong>{' '}
          {power.basis === 'bsfc'
            ? `From the fuel that burns (set by the air when rich, by the fuel itself when lean), with a brake specific fuel consumption of ${formatStudyValue(power.bsfc, 'bsfc', system)}`
            : `From the fuel that burns (set by the air when rich, by the fuel itself when lean), with a brake thermal efficiency of ${formatStudyValue(power.brakeThermalEfficiency, 'fraction', system)}`}
          ; wheel power is crank power less a drivetrain loss of {formatStudyValue(power.drivetrainLoss, 'fraction', system)}.
        </li>
        <li>
          <strong>Injectors.</strong> Flow scales with the square root of the pressure difference across them. Duty above 80 % is a warning and above 85 % a
          limit (common practice, no published source).
        </li>
        <li>
          <strong>Verdict.</strong> A plan does not fit where any point of any scenario crosses a limit (a point the compressor cannot deliver, overspeed,
          saturated injectors, a lean mixture under boost, a stated limit); it fits with warnings where a margin is thinner than the study requires or another
          warning stands. The required margins are the study’s own, or common-practice defaults where it sets none: a starting point, not a published rule.
        </li>
        {withExhaust && (
          <li>
            <strong>Exhaust side.</strong> For the plans that have one, the turbine must drive the compressor: turbine power times the mechanical efficiency
            equals compressor power. The exhaust is the air and the fuel burnt with it, an ideal gas with γ = {formatNumber(TURBINE_GAS.gamma, 4)} and c
            <sub>p</sub> = {formatNumber(TURBINE_GAS.cp, 4)} J/(kg·K); its temperature at the turbine is the plan’s stated table, not a prediction; the pressure
            after the turbine is the outside air’s plus the stated loss. Turbine efficiency is read from the turbine map where it gives one, else the plan’s
            stated value, and the findings say so. What the turbine does not need passes the wastegates, whose valves are sized by compressible flow through an
            orifice with the stated discharge coefficient.
          </li>
        )}
        {divided && (
          <li>
            <strong>Pulse energy.</strong> A steady model cannot see the exhaust pulses a divided housing keeps apart. The plan’s pulse-energy factor multiplies
            the turbine’s energy to stand for them (1.0 when not set: no gain). It is an assumption the model cannot check.
          </li>
        )}
      </ul>
      <div>
        <p className="font-semibold">Reference of corrected flow, by map</p>
        <ul className="list-disc space-y-1 pl-5">
          {groups.map((g) => (
            <li key={g.key}>
              {g.map
                ? `${g.title} (${g.planNames.join(', ')}): ${formatStudyValue(g.map.reference.temperature, 'temperature', system)} and ${formatStudyValue(g.map.reference.pressure, 'pressure', system)} absolute.`
                : `${g.planNames.join(', ')}: no map, so corrected flow refers to ISA sea level (15 °C, 101.325 kPa) unless the plan states its own reference.`}
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
