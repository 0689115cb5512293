import { planColour } from '../plots/style';
import type { StudyLine } from './lines';
import { formatNumber, formatStudyValue, useUnitSystem } from '#src/lib/quantities';

/**
 * The exhaust side of each line in one table: where full boost arrives, the highest drive pressure
 * ratio, the valve each gate needs against the one fitted, and the turbine inlet pressure at peak
 * power. Only lines whose plan has the exhaust side computed are listed.
 */
export function ExhaustSummary({ lines }: { lines: readonly StudyLine[] }) {
  const unitSystem = useUnitSystem();
  const rows = lines.filter((l) => l.line.exhaust);
  if (rows.length === 0) return null;
  const at = (rpm: number | null | undefined) => (rpm === null || rpm === undefined ? '' : ` at ${formatNumber(rpm, 21)} rpm`);
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[40rem] border-collapse text-left text-sm" data-testid="exhaust-summary">
        <caption className="mb-1 text-left text-xs text-ink-soft">
          Each line’s exhaust side at a glance. Full boost arrives at the first speed whose target the turbine holds.
        </caption>
        <thead className="border-b-2 border-ink/20 align-bottom text-xs uppercase tracking-wider text-ink-soft">
          <tr>
            <th scope="col" className="px-2 py-1.5 font-semibold">
              Line
            </th>
            <th scope="col" className="px-2 py-1.5 text-right font-semibold">
              Full boost from
            </th>
            <th scope="col" className="px-2 py-1.5 text-right font-semibold">
              Peak drive pressure ratio
            </th>
            <th scope="col" className="px-2 py-1.5 text-right font-semibold">
              Valve needed / fitted (each gate)
            </th>
            <th scope="col" className="px-2 py-1.5 text-right font-semibold">
              Turbine inlet pressure at peak power
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-line">
          {rows.map((l) => {
            const e = l.line.exhaust!;
            const needed = e.wastegateDiameterNeeded;
            const tooSmall = needed !== null && needed.value > e.wastegateDiameterFitted;
            return (
              <tr key={l.key} data-line={l.key}>
                <th scope="row" className="px-2 py-1.5 font-normal text-ink">
                  <span className="flex items-center gap-1.5">
                    <span aria-hidden="true" className="inline-block size-2.5 shrink-0 rounded-full" style={{ background: planColour(l.planIndex) }} />
                    {l.label}
                  </span>
                </th>
                <td className="numeric px-2 py-1.5 text-right">
                  {e.boostThresholdRpm !== null ? `${formatNumber(e.boostThresholdRpm, 21)} rpm` : <span className="text-copper-ink">not reached</span>}
                </td>
                <td className="numeric px-2 py-1.5 text-right">
                  {e.peakDrivePressureRatio ? `${formatNumber(e.peakDrivePressureRatio.value, 3)}${at(e.peakDrivePressureRatio.rpm)}` : '—'}
                </td>
                <td className={`numeric px-2 py-1.5 text-right ${tooSmall ? 'font-semibold text-copper-ink' : ''}`}>
                  {needed ? formatStudyValue(needed.value, 'diameter', unitSystem, 3) : 'gates shut'} /{' '}
                  {formatStudyValue(e.wastegateDiameterFitted, 'diameter', unitSystem, 3)}
                  {tooSmall && <span className="block text-xs">too small: boost creeps above target</span>}
                </td>
                <td className="numeric px-2 py-1.5 text-right">
                  {e.turbineInletPressureAtPeakPower
                    ? `${formatStudyValue(e.turbineInletPressureAtPeakPower.value, 'pressure', unitSystem)} abs.${at(e.turbineInletPressureAtPeakPower.rpm)}`
                    : '—'}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
