/**
 * The safety caution every study and report carries (product brief, "Safety"). Kept in one
 * place so its wording stays the same everywhere.
 */
export const cautionText =
  'Results are estimates from a quasi-steady model. Confirm them against the manufacturer’s published limits, ' +
  'dyno and data-logged testing, and qualified professionals, and follow local law and the rules of the competition.';

export const hazardText =
  'Turbochargers can overspeed and burst, surge damages bearings, lean mixtures and high exhaust temperatures ' +
  'destroy engines, and ethanol and methanol are toxic and burn with a near-invisible flame.';

export function Caution({ className = '' }: { className?: string }) {
  return (
    <aside aria-label="Safety caution" className={`rounded-md border-l-4 border-copper bg-copper-light/40 px-4 py-3 text-sm text-ink-soft ${className}`}>
      <p>
        <strong className="font-semibold text-ink">Caution. </strong>
        {cautionText}
      </p>
      <p className="mt-1">{hazardText}</p>
    </aside>
  );
}
