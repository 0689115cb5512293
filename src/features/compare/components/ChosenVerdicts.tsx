import { reasonText } from '#shared/matching/verdict';
import { VerdictStamp } from '#src/components/study/PlanVerdicts';
import { CombinationMark, type ChosenLine } from './CombinationMark';

/** The plan verdict of each chosen line, what fits first, each with its first reason and where. */
export function ChosenVerdicts({ chosen }: { chosen: readonly ChosenLine[] }) {
  return (
    <ul className="space-y-1.5" data-testid="compare-verdicts">
      {chosen.map((c) => (
        <li key={c.key} className="flex flex-wrap items-start gap-x-3 gap-y-1 text-sm" data-verdict={c.verdict?.status ?? 'not-judged'}>
          <span className="flex min-w-[16rem] items-start gap-1.5">
            <CombinationMark index={c.index} />
            <span>
              <span className="font-semibold text-ink">{c.planName}</span>
              <span className="text-ink-soft">
                {' '}
                · {c.scenarioName} · {c.rowLabel}
              </span>
            </span>
          </span>
          <VerdictStamp status={c.verdict?.status ?? 'not-judged'} />
          <span className="min-w-0 flex-1 text-ink">{verdictWords(c)}</span>
        </li>
      ))}
    </ul>
  );
}

/** A plan's verdict after its stamp: its first reason and where, or what the headline says when it names none. */
function verdictWords(c: ChosenLine): string {
  const v = c.verdict;
  if (!v) return 'no verdict: the plan has no operating line';
  const first = v.reasons[0];
  if (first && v.status !== 'not-judged') return `${reasonText(first)} (plan over all scenarios)`;
  const colon = v.headline.indexOf(': ');
  return colon >= 0 ? v.headline.slice(colon + 2) : v.headline;
}
