import { Button } from '#src/components/Button';
import { PlanSwatch } from '#src/components/study/PlanSwatch';
import type { MapSummary } from '#src/features/maps/api';
import { newPlanId, type PlanDraft } from '#src/features/studies/lib/draft';
import { useEditor } from './context';
import { ExhaustFields } from './ExhaustFields';
import { ChoiceField, CountField, GroupIssue, NumberField, TextInputField } from './fields';
import { FieldRow, Section } from './Section';

/** A new plan: one turbocharger on the last plan's map, judged at 70 % where the map gives no efficiency. */
function newPlan(plans: readonly PlanDraft[]): PlanDraft {
  return {
    id: newPlanId(plans),
    name: `Plan ${plans.length + 1}`,
    turbochargers: 1,
    compressorEfficiency: 0.7,
    compressorMapId: plans[plans.length - 1]?.compressorMapId ?? null,
  };
}

export function PlansSection({
  maps,
  mapsError,
  turbineMaps,
  turbineMapsError,
}: {
  maps: MapSummary[] | undefined;
  mapsError: string | null;
  turbineMaps: MapSummary[] | undefined;
  turbineMapsError: string | null;
}) {
  const editor = useEditor();
  const plans = editor.draft.plans ?? [];
  const known = new Set((maps ?? []).map((m) => m.id));
  const mapOptions = (current: string | null | undefined) => [
    { value: '', label: 'No map: judge with the default efficiency' },
    ...(maps ?? []).map((m) => ({ value: m.id, label: m.builtin ? `${m.name} (built-in demo)` : m.name })),
    // A map the list does not show (still loading, or gone) stays selectable under its id.
    ...(current && !known.has(current) ? [{ value: current, label: maps ? `${current} (not in the library)` : 'Loading the map library…' }] : []),
  ];

  return (
    <Section title="Plans" prefixes={['plans']} testId="section-plans">
      <p className="text-xs text-ink-soft">The hardware being judged. Each plan is drawn in its own colour and marker shape.</p>
      {mapsError && <p className="text-sm text-copper-ink">The map library could not be loaded: {mapsError}</p>}
      <GroupIssue path={['plans']} />
      {plans.map((plan, pi) => (
        <fieldset key={plan.id ?? pi} className="space-y-3 rounded-md border border-ink/15 p-3" data-testid={`plan-${pi}`}>
          <legend className="flex items-center gap-2 px-1 text-sm font-semibold text-ink">
            <PlanSwatch index={pi} />
            Plan {pi + 1}
          </legend>
          <TextInputField path={['plans', pi, 'name']} label="Name" maxLength={100} />
          <ChoiceField
            path={['plans', pi, 'compressorMapId']}
            label="Compressor map"
            value={plan.compressorMapId ?? ''}
            options={mapOptions(plan.compressorMapId)}
            onChoose={(id) => editor.update(['plans', pi, 'compressorMapId'], id === '' ? null : id)}
          />
          <FieldRow>
            <CountField path={['plans', pi, 'turbochargers']} label="Turbochargers" />
            <NumberField
              path={['plans', pi, 'compressorEfficiency']}
              label="Default efficiency"
              quantity="fraction"
              hint="Used without a map, and below the map’s lowest speed line."
            />
          </FieldRow>
          <NumberField
            path={['plans', pi, 'offMapEfficiency']}
            label="Off-map efficiency (assumption)"
            quantity="fraction"
            optional
            testId={`plan-${pi}-off-map-efficiency`}
            hint={
              <>
                Empty: points past choke, above the map or outside its speed lines are not reachable and give no results. Set, they are computed on this
                efficiency, and the findings name the assumption. It never covers surge or overspeed: those stay limits. Use it only with the turbocharger
                maker’s word that the wheel runs there.
              </>
            }
          />
          <NumberField
            path={['plans', pi, 'maxShaftSpeed']}
            label="Max wheel speed"
            quantity="speed"
            optional
            hint="Empty: the map's rated speed; the lower of the two applies."
          />
          <ExhaustFields planIndex={pi} turbineMaps={turbineMaps} turbineMapsError={turbineMapsError} />
          {!editor.readOnly && (
            <div className="flex flex-wrap gap-2">
              <Button
                variant="quiet"
                disabled={plans.length >= 10}
                onClick={() =>
                  editor.update(
                    ['plans'],
                    [...plans.slice(0, pi + 1), { ...structuredClone(plan), id: newPlanId(plans), name: `${plan.name ?? ''} (copy)` }, ...plans.slice(pi + 1)],
                  )
                }
              >
                Duplicate plan
              </Button>
              <Button
                variant="quiet"
                disabled={plans.length <= 1}
                onClick={() =>
                  editor.update(
                    ['plans'],
                    plans.filter((_p, k) => k !== pi),
                  )
                }
              >
                Remove plan
              </Button>
            </div>
          )}
        </fieldset>
      ))}
      {!editor.readOnly && (
        <Button disabled={plans.length >= 10} onClick={() => editor.update(['plans'], [...plans, newPlan(plans)])}>
          + Add plan
        </Button>
      )}
    </Section>
  );
}
