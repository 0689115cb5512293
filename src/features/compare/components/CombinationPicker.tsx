import type { StudyDocument } from '#shared/schemas/study';
import { planColour } from '#src/components/plots/style';
import { lineKeyOf } from '#src/components/study/lines';
import { MAX_COMBINATIONS, MIN_COMBINATIONS } from '../selection';
import { CombinationMark } from './CombinationMark';

/**
 * Plans down the side, scenarios and their boost rows across: tick two to four cells. A chosen
 * cell shows the colour, marker and dash its line gets on the map.
 */
export function CombinationPicker({ document, selected, onToggle }: { document: StudyDocument; selected: readonly string[]; onToggle: (key: string) => void }) {
  const columns = document.scenarios.flatMap((scenario, scenarioIndex) =>
    scenario.boostSchedule.map((row, rowIndex) => ({ scenarioIndex, rowIndex, scenario: scenario.name, row: row.label })),
  );
  const full = selected.length >= MAX_COMBINATIONS;
  return (
    // min-w-0: a fieldset is otherwise as wide as its widest content, and the table scrolls inside it.
    <fieldset className="min-w-0 space-y-2">
      <legend className="text-sm text-ink-soft">
        Tick {MIN_COMBINATIONS} to {MAX_COMBINATIONS} plan × scenario × boost row combinations.{' '}
        <span className="font-semibold text-ink" aria-live="polite">
          {selected.length} of {MAX_COMBINATIONS} chosen
          {full ? ': untick one to choose another' : selected.length < MIN_COMBINATIONS ? `: choose at least ${MIN_COMBINATIONS}` : ''}.
        </span>
      </legend>
      <div className="overflow-x-auto">
        <table className="border-collapse text-sm">
          <thead className="align-bottom text-xs text-ink-soft">
            <tr>
              <th scope="col" className="px-2 py-1.5 text-left font-semibold uppercase tracking-wider">
                Plan
              </th>
              {columns.map((c) => (
                <th key={`${c.scenarioIndex}|${c.rowIndex}`} scope="col" className="max-w-[9rem] px-2 py-1.5 text-left font-normal">
                  <span className="block font-semibold text-ink">{c.scenario}</span>
                  <span className="block">{c.row}</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-line">
            {document.plans.map((plan, planIndex) => (
              <tr key={plan.id}>
                <th scope="row" className="whitespace-nowrap px-2 py-1.5 text-left font-semibold text-ink">
                  <span className="flex items-center gap-1.5">
                    <span aria-hidden="true" className="inline-block size-2.5 rounded-full" style={{ background: planColour(planIndex) }} />
                    {plan.name}
                  </span>
                </th>
                {columns.map((c) => {
                  const key = lineKeyOf(plan.id, c.scenarioIndex, c.rowIndex);
                  const index = selected.indexOf(key);
                  const checked = index >= 0;
                  return (
                    <td key={key} className={`px-2 py-1.5 ${checked ? 'bg-teal-light/50' : ''}`}>
                      <label className={`flex items-center gap-2 ${!checked && full ? 'cursor-not-allowed opacity-50' : 'cursor-pointer'}`}>
                        <input
                          type="checkbox"
                          className="size-4 accent-teal"
                          checked={checked}
                          disabled={!checked && full}
                          onChange={() => onToggle(key)}
                          aria-label={`${plan.name} · ${c.scenario} · ${c.row}`}
                        />
                        {checked ? <CombinationMark index={index} /> : <span className="h-3 w-7" aria-hidden="true" />}
                      </label>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </fieldset>
  );
}
