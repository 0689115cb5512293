import { DEFAULT_PULSE_FACTOR } from '#shared/matching/exhaust/context';
import type { StudyDocument } from '#shared/schemas/study';
import { formatNumber } from '#src/lib/quantities';

/** The divided-housing plans with the pulse-energy factor each uses (absent: the steady model as it is). */
export function pulseFactors(doc: StudyDocument): { name: string; factor: number; stated: boolean }[] {
  return doc.plans.flatMap((plan) =>
    plan.exhaust?.housing === 'divided'
      ? [{ name: plan.name, factor: plan.exhaust.pulseFactor ?? DEFAULT_PULSE_FACTOR, stated: plan.exhaust.pulseFactor !== undefined }]
      : [],
  );
}

/**
 * What goes beside the turbine maps: that a divided housing's pulse-energy factor is the user's
 * assumption, and a line on exhaust heat deferring to the makers' limits (the app's general
 * caution covers the other hazards).
 */
export function ExhaustNotes({ document }: { document: StudyDocument }) {
  const divided = pulseFactors(document);
  return (
    <div className="space-y-2">
      {divided.length > 0 && (
        <p className="text-sm text-ink" data-testid="pulse-factor-note">
          <strong className="font-semibold">Pulse-energy factor.</strong> A divided housing keeps the cylinders’ exhaust pulses apart, which a steady model
          cannot see. The factor on turbine energy stands in for that gain (
          {divided.map((d) => `${d.name}: ${formatNumber(d.factor, 3)}${d.stated ? '' : ', the default'}`).join('; ')}). It is the user’s assumption and the
          model cannot check it: confirm the boost it predicts on the dyno before relying on it.
        </p>
      )}
      <aside
        aria-label="Exhaust heat caution"
        data-testid="exhaust-caution"
        className="rounded-md border-l-4 border-copper bg-copper-light/40 px-4 py-2 text-sm text-ink-soft"
      >
        <strong className="font-semibold text-ink">Exhaust heat. </strong>
        The turbine inlet temperatures here are the plans’ stated assumptions, not predictions. Keep exhaust gas temperature within the limits the turbocharger
        maker publishes for the turbine housing and wheel and the valve maker for the wastegates, and measure it on the engine.
      </aside>
    </div>
  );
}
