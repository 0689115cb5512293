import { REQUIREMENT_DEFAULTS, resolveRequirements, type Requirements } from '#shared/matching/input/requirements';
import { pathKey } from '#src/features/studies/lib/draft';
import { localizeIssue } from '#src/features/studies/lib/localize-issue';
import { useEditor } from './context';
import { ReadValue, UnitNumberInput } from './fields';
import { FieldRow, Section, SubHeading } from './Section';
import { formatStudyValue, inputText, quantityUnit, type StudyQuantity, useUnitSystem } from '#src/lib/quantities';

interface RequirementSpec {
  key: keyof Requirements;
  label: string;
  quantity: StudyQuantity;
  hint?: string;
}

const MARGINS: RequirementSpec[] = [
  { key: 'minSurgeMargin', label: 'Smallest surge margin', quantity: 'fraction' },
  { key: 'minChokeMargin', label: 'Smallest choke margin', quantity: 'fraction' },
  { key: 'minSpeedMargin', label: 'Smallest speed margin', quantity: 'fraction' },
  {
    key: 'maxCompressorOutletTemperature',
    label: 'Highest outlet temperature accepted',
    quantity: 'temperature',
    hint: 'Above it: a warning. A limit stated under Engine stays a hard limit.',
  },
];

const LEAN: RequirementSpec[] = [
  { key: 'lambdaWarningUnderBoost', label: 'Lambda warning', quantity: 'ratio', hint: 'Leaner than this under boost: a warning.' },
  { key: 'lambdaLimitUnderBoost', label: 'Lambda limit', quantity: 'ratio', hint: 'Leaner than this under boost: the plan does not fit.' },
];

const UNDER_BOOST: RequirementSpec = {
  key: 'underBoostFrom',
  label: 'Under boost from',
  quantity: 'pressureGauge',
  hint: 'The lambda checks apply from this boost up.',
};

/** A default as people read it in the user's units: "5 %", "200 °C", "0.9". */
function defaultText(spec: RequirementSpec, system: 'si' | 'us'): string {
  const unit = quantityUnit(spec.quantity, system);
  const shown = inputText(unit.fromSI(REQUIREMENT_DEFAULTS[spec.key]), 4);
  return unit.label ? `${shown} ${unit.label}` : shown;
}

/**
 * One required margin or limit. Empty means the common-practice default, shown in grey in the
 * box; clearing a field removes its key (and the whole block once none is left), so a study that
 * sets nothing saves nothing.
 */
function RequirementField({ spec }: { spec: RequirementSpec }) {
  const editor = useEditor();
  const unitSystem = useUnitSystem();
  const path = ['requirements', spec.key] as const;
  const value = editor.draft.requirements?.[spec.key];
  const fallback = defaultText(spec, unitSystem);
  if (editor.readOnly) {
    return (
      <ReadValue label={spec.label}>
        {value !== undefined ? (
          formatStudyValue(value, spec.quantity, unitSystem)
        ) : (
          <>
            {fallback} <span className="text-sm text-ink-faint">(default, common practice)</span>
          </>
        )}
      </ReadValue>
    );
  }
  const issue = editor.issues[pathKey(path)];
  const unit = quantityUnit(spec.quantity, unitSystem);
  function change(si: number | undefined) {
    if (si !== undefined) {
      editor.update(path, si);
      return;
    }
    const { [spec.key]: _cleared, ...rest } = editor.draft.requirements ?? {};
    editor.update(['requirements'], Object.keys(rest).length > 0 ? rest : undefined);
  }
  return (
    <UnitNumberInput
      label={spec.label}
      value={value}
      onChange={change}
      quantity={spec.quantity}
      optional
      placeholder={inputText(unit.fromSI(REQUIREMENT_DEFAULTS[spec.key]), 4)}
      error={issue ? localizeIssue(issue, spec.quantity, unitSystem) : null}
      hint={
        <>
          {value === undefined ? <>Default {fallback}, common practice.</> : <>Common practice: {fallback}.</>}
          {spec.hint ? ` ${spec.hint}` : ''}
        </>
      }
      testId={`requirement-${spec.key}`}
    />
  );
}

/**
 * The study's required margins and limits: what a plan must keep to fit. Each verdict applies
 * them; thinner margins raise warnings, leaner mixtures under boost a warning or a limit.
 */
export function RequirementsSection() {
  const editor = useEditor();
  const resolved = resolveRequirements(editor.draft.requirements);
  // A warning leaner than the limit would never be raised: the limit is met first.
  const warningPastLimit = resolved.lambdaWarningUnderBoost > resolved.lambdaLimitUnderBoost;
  return (
    <Section title="Required margins" prefixes={['requirements']} testId="section-requirements">
      <p className="text-xs text-ink-soft">
        What a plan must keep to fit, applied to every point of every plan. An empty field takes the common-practice default shown in grey: a starting point,
        not a published rule. Set your team’s own, and keep to the turbocharger and engine makers’ limits.
      </p>
      <SubHeading>Compressor</SubHeading>
      <FieldRow>
        {MARGINS.slice(0, 2).map((spec) => (
          <RequirementField key={spec.key} spec={spec} />
        ))}
      </FieldRow>
      <RequirementField spec={MARGINS[2]} />
      <RequirementField spec={MARGINS[3]} />
      <SubHeading>Mixture under boost</SubHeading>
      <FieldRow>
        {LEAN.map((spec) => (
          <RequirementField key={spec.key} spec={spec} />
        ))}
      </FieldRow>
      {warningPastLimit && (
        <p role="alert" className="text-sm font-medium text-copper-ink" data-testid="lambda-order">
          ! The lambda warning ({resolved.lambdaWarningUnderBoost}) is leaner than the limit ({resolved.lambdaLimitUnderBoost}): a point past the limit does not
          fit before the warning could be raised. Set the warning at or below the limit.
        </p>
      )}
      <RequirementField spec={UNDER_BOOST} />
      {!editor.readOnly && (
        <p className="text-xs text-ink-soft">
          Lean mixtures under boost burn pistons and valves: keep to the fuel system maker’s and your calibrator’s targets.
        </p>
      )}
    </Section>
  );
}
