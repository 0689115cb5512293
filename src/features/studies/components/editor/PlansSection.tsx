import { Button } from '../../../../components/Button';
import { planColour, planMarker } from '../../../../components/plots/style';
import type { MapListItem } from '../../api/get-team-maps';
import { getIn, newPlanId } from '../../lib/draft';
import { useEditor } from './context';
import { ExhaustFields } from './ExhaustFields';
import { ChoiceField, CountField, GroupIssue, NumberField, TextInputField } from './fields';
import { FieldRow, Section } from './Section';

type Plan = { id: string; name: string; turbochargers: number; compressorEfficiency: number; maxShaftSpeed?: number; compressorMapId: string | null; turbineMapId?: string | null };

const MARKER_PATHS: Record<string, string> = {
  circle: 'M6 1a5 5 0 1 0 0.001 0z',
  square: 'M1.5 1.5h9v9h-9z',
  diamond: 'M6 0.5 11.5 6 6 11.5 0.5 6z',
  'triangle-up': 'M6 1 11 10.5H1z',
  'triangle-down': 'M6 11 11 1.5H1z',
  cross: 'M4 0.5h4v3.5h3.5v4H8v3.5H4V8H0.5V4H4z',
  x: 'M2 0.5 6 4.5 10 0.5 11.5 2 7.5 6l4 4-1.5 1.5-4-4-4 4L0.5 10l4-4-4-4z',
  star: 'M6 0.5l1.6 3.6 3.9.4-2.9 2.6.8 3.9L6 9l-3.4 2 .8-3.9L.5 4.5l3.9-.4z',
};

/** The colour and marker a plan is drawn with, so the form and the plots read together. */
export function PlanSwatch({ index }: { index: number }) {
  return (
    <svg aria-hidden="true" width="14" height="14" viewBox="0 0 12 12" className="shrink-0">
      <path d={MARKER_PATHS[planMarker(index)] ?? MARKER_PATHS.circle} fill={planColour(index)} stroke="#2b2b2b" strokeWidth="0.6" />
    </svg>
  );
}

export function PlansSection({
  maps,
  mapsError,
  turbineMaps,
  turbineMapsError,
}: {
  maps: MapListItem[] | undefined;
  mapsError: string | null;
  turbineMaps: MapListItem[] | undefined;
  turbineMapsError: string | null;
}) {
  const editor = useEditor();
  const plans = (getIn(editor.draft, ['plans']) as Plan[] | undefined) ?? [];
  const known = new Set((maps ?? []).map((m) => m.id));
  const mapOptions = (current: string | null) => [
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
            <NumberField path={['plans', pi, 'compressorEfficiency']} label="Default efficiency" quantity="fraction" hint="Used where the map gives none." />
          </FieldRow>
          <NumberField path={['plans', pi, 'maxShaftSpeed']} label="Max wheel speed" quantity="speed" optional hint="Empty: the map's rated speed; the lower of the two applies." />
          <ExhaustFields planIndex={pi} turbineMaps={turbineMaps} turbineMapsError={turbineMapsError} />
          {!editor.readOnly && (
            <div className="flex flex-wrap gap-2">
              <Button
                variant="quiet"
                disabled={plans.length >= 10}
                onClick={() => editor.update(['plans'], [...plans.slice(0, pi + 1), { ...structuredClone(plan), id: newPlanId(plans), name: `${plan.name} (copy)` }, ...plans.slice(pi + 1)])}
              >
                Duplicate plan
              </Button>
              <Button variant="quiet" disabled={plans.length <= 1} onClick={() => editor.update(['plans'], plans.filter((_p, k) => k !== pi))}>
                Remove plan
              </Button>
            </div>
          )}
        </fieldset>
      ))}
      {!editor.readOnly && (
        <Button
          disabled={plans.length >= 10}
          onClick={() =>
            editor.update(['plans'], [
              ...plans,
              { id: newPlanId(plans), name: `Plan ${plans.length + 1}`, turbochargers: 1, compressorEfficiency: 0.7, compressorMapId: plans[plans.length - 1]?.compressorMapId ?? null },
            ])
          }
        >
          + Add plan
        </Button>
      )}
    </Section>
  );
}
