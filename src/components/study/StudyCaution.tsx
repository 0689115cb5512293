import { Caution } from '../Caution';

/**
 * The safety caution of every study, report and shared view (product brief, "Safety"). One
 * wording for the whole app lives in `Caution`; this marks where a study shows it.
 */
export function StudyCaution({ className = '' }: { className?: string }) {
  return (
    <div className={className} data-testid="study-caution">
      <Caution />
    </div>
  );
}
