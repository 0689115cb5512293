import { LOSS_REFERENCE_DENSITY } from '#shared/physics/losses';
import { pathKey, type DocPath, type StudyDraft } from '#src/features/studies/lib/draft';
import { localizeIssue } from '#src/features/studies/lib/localize-issue';
import { useEditor } from './context';
import { NumberField, UnitNumberInput } from './fields';
import { FieldRow } from './Section';
import { inputText, quantityUnit, useUnitSystem } from '#src/lib/quantities';

/**
 * A pressure loss as the study states it: the loss, and the engine flow (and gas density) it was
 * measured at, so that it follows the flow as flow²/density. Without the flow the loss is the same
 * at every flow (the older form); clearing the flow clears its density too.
 */
export function LossFields({
  path,
  loss,
  label,
  hint,
  flow,
  testId,
}: {
  /** Where the loss is in the document. */
  path: DocPath;
  /** The loss at `path`. */
  loss: NonNullable<StudyDraft['losses']>['inlet'];
  label: string;
  hint: string;
  flow: 'air' | 'exhaust';
  testId?: string;
}) {
  const editor = useEditor();
  const unitSystem = useUnitSystem();
  const flowPath = [...path, 'referenceMassFlow'];
  const issue = editor.issues[pathKey(flowPath)];
  const density = quantityUnit('density', unitSystem);
  const follows = loss?.referenceMassFlow !== undefined;
  return (
    <div className="space-y-2" data-testid={testId}>
      <FieldRow>
        <NumberField path={[...path, 'pressureLoss']} label={label} quantity="pressure" hint={hint} />
        <UnitNumberInput
          label={`At engine ${flow} flow`}
          value={loss?.referenceMassFlow}
          onChange={(si) => {
            const { referenceMassFlow: _flow, referenceDensity: _density, ...rest } = loss ?? { pressureLoss: 0 };
            editor.update(
              path,
              si === undefined
                ? rest
                : { ...rest, referenceMassFlow: si, ...(loss?.referenceDensity !== undefined ? { referenceDensity: loss.referenceDensity } : {}) },
            );
          }}
          quantity="massFlow"
          optional
          error={issue ? localizeIssue(issue, 'massFlow', unitSystem) : null}
          hint={
            follows
              ? 'The engine flow the loss was measured at: it follows the flow, flow² over density.'
              : 'Empty: the same loss at every flow. Give the engine flow it was measured at to have it follow the flow.'
          }
          readOnly={editor.readOnly}
        />
      </FieldRow>
      {follows && (
        <NumberField
          path={[...path, 'referenceDensity']}
          label={`Density of the ${flow === 'air' ? 'air' : 'exhaust gas'} then`}
          quantity="density"
          optional
          placeholder={inputText(density.fromSI(LOSS_REFERENCE_DENSITY))}
          hint={`Empty: ${inputText(density.fromSI(LOSS_REFERENCE_DENSITY))} ${density.label}, standard sea-level air (a flow bench).`}
        />
      )}
    </div>
  );
}
