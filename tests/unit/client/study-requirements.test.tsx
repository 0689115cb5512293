import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { planVerdicts } from '#shared/matching/verdict';
import { studyDocumentSchema } from '#shared/schemas/study';
import { runStudyDocument } from '#shared/study/run';
import { PlansSection } from '#src/features/studies/components/editor/PlansSection';
import { RequirementsSection } from '#src/features/studies/components/editor/RequirementsSection';
import { demoDocument, demoMaps } from './demo-study';
import type { UnitSystem } from '#src/lib/quantities';
import { EditorHost } from './study-editor-host';

afterEach(cleanup);

const demo = demoDocument();

/** The required margins (and the plans) of the demo study, editing a live draft as the study page does. */
function Host({
  unitSystem = 'si',
  readOnly = false,
  start = demo,
  onDraft,
}: {
  unitSystem?: UnitSystem;
  readOnly?: boolean;
  start?: Record<string, unknown>;
  onDraft: (draft: Record<string, unknown>) => void;
}) {
  return (
    <EditorHost start={start} unitSystem={unitSystem} readOnly={readOnly} onDraft={onDraft}>
      <RequirementsSection />
      <PlansSection maps={[]} mapsError={null} turbineMaps={[]} turbineMapsError={null} />
    </EditorHost>
  );
}

const box = (key: string) => screen.getByTestId(`requirement-${key}`) as HTMLInputElement;

describe('required margins in the study editor', () => {
  it('shows each common-practice default in grey, saves only what is typed, and drops the block when emptied again', () => {
    let draft: Record<string, unknown> = {};
    render(<Host onDraft={(d) => (draft = d)} />);
    const section = screen.getByTestId('section-requirements');
    // Defaults of shared/matching/requirements.ts (common practice, no source), in the user's units.
    expect(box('minSurgeMargin').placeholder).toBe('5'); // 0.05 as %
    expect(box('minSpeedMargin').placeholder).toBe('3'); // 0.03 as %
    expect(box('maxCompressorOutletTemperature').placeholder).toBe('200'); // 473.15 K = 200 °C (definition of °C)
    expect(box('underBoostFrom').placeholder).toBe('10'); // 10 000 Pa = 10 kPa gauge
    expect(box('lambdaLimitUnderBoost').placeholder).toBe('1');
    expect(within(section).getAllByText(/common practice/).length).toBeGreaterThanOrEqual(7);
    expect(draft.requirements).toBeUndefined(); // the demo sets none

    fireEvent.change(box('minSurgeMargin'), { target: { value: '12' } });
    fireEvent.change(box('maxCompressorOutletTemperature'), { target: { value: '180' } });
    expect(draft.requirements).toEqual({ minSurgeMargin: 0.12, maxCompressorOutletTemperature: 453.15 }); // 12 % = 0.12; 180 °C = 453.15 K (definition of °C)
    expect(studyDocumentSchema.safeParse(draft).success).toBe(true);

    fireEvent.change(box('minSurgeMargin'), { target: { value: '' } });
    expect(draft.requirements).toEqual({ maxCompressorOutletTemperature: 453.15 });
    fireEvent.change(box('maxCompressorOutletTemperature'), { target: { value: '' } });
    expect('requirements' in draft).toBe(false); // nothing set, nothing saved
  });

  it('types temperatures and boost in US units and stores SI', () => {
    let draft: Record<string, unknown> = {};
    render(<Host unitSystem="us" onDraft={(d) => (draft = d)} />);
    expect(box('maxCompressorOutletTemperature').placeholder).toBe('392'); // 200 °C = 392 °F (definition of °F)
    expect(box('underBoostFrom').placeholder).toBe('1.45'); // 10 kPa = 1.4504 psi (NIST SP 811, psi = 6894.757 Pa), 4 significant figures
    fireEvent.change(box('underBoostFrom'), { target: { value: '2' } });
    expect((draft.requirements as { underBoostFrom: number }).underBoostFrom).toBeCloseTo(2 * 6894.757, 2); // 1 psi = 6.894 757 kPa (NIST SP 811, Appendix B.8)
  });

  it('says in words when the lambda warning is leaner than the limit, set or default', () => {
    render(<Host onDraft={() => undefined} />);
    expect(screen.queryByTestId('lambda-order')).toBeNull();
    // 1.05 against the default limit 1.0 (common practice, no source): the limit would be met first.
    fireEvent.change(box('lambdaWarningUnderBoost'), { target: { value: '1.05' } });
    expect(screen.getByTestId('lambda-order').textContent).toContain('leaner than the limit');
    // Both set the wrong way round: the schema's own rule shows beside the field, without the API's field name.
    fireEvent.change(box('lambdaLimitUnderBoost'), { target: { value: '1.02' } });
    expect(screen.getByText(/^The lambda warning must be at or below the lambda limit/)).toBeTruthy();
    expect(screen.queryByText(/lambdaWarningUnderBoost/)).toBeNull();
    fireEvent.change(box('lambdaWarningUnderBoost'), { target: { value: '0.95' } });
    expect(screen.queryByTestId('lambda-order')).toBeNull();
  });

  it('words a margin out of range in percent and in words, not as the API names it', () => {
    render(<Host onDraft={() => undefined} />);
    fireEvent.change(box('minSurgeMargin'), { target: { value: '60' } });
    // The schema allows at most 0.5 (shared/schemas/compute.ts), shown as 50 %.
    expect(screen.getByText('Smallest surge margin must be at most 50 %.')).toBeTruthy();
    expect(screen.queryByText(/minSurgeMargin/)).toBeNull();
  });

  it('changes the verdict the engine gives: a wider surge margin required turns more points into warnings', () => {
    let draft: Record<string, unknown> = {};
    render(<Host onDraft={(d) => (draft = d)} />);
    fireEvent.change(box('minSurgeMargin'), { target: { value: '30' } });
    const maps = demoMaps();
    const warnings = (doc: unknown) => planVerdicts(runStudyDocument(studyDocumentSchema.parse(doc), maps)).map((v) => v.pointsWithWarnings);
    const before = warnings(demo);
    const after = warnings(draft);
    // Same points, a stricter rule: never fewer warnings, and more for some plan (the demo's surge margins run below 30 %).
    after.forEach((n, i) => expect(n).toBeGreaterThanOrEqual(before[i]));
    expect(after.some((n, i) => n > before[i])).toBe(true);
  });

  it('shows viewers the values and the defaults as text, with no box to type in', () => {
    const start = { ...structuredClone(demo), requirements: { minChokeMargin: 0.08 } };
    render(<Host readOnly start={start} onDraft={() => undefined} />);
    const section = screen.getByTestId('section-requirements');
    expect(within(section).queryAllByRole('textbox')).toHaveLength(0);
    expect(within(section).getByText('8 %')).toBeTruthy(); // 0.08 as %
    expect(within(section).getAllByText('(default, common practice)').length).toBe(6); // the six fields left unset
  });
});

describe('the off-map efficiency of a plan', () => {
  it('is empty by default, warns what it covers, and saves as a fraction only when typed', () => {
    let draft: Record<string, unknown> = {};
    render(<Host onDraft={(d) => (draft = d)} />);
    const field = screen.getByTestId('plan-0-off-map-efficiency') as HTMLInputElement;
    expect(field.value).toBe('');
    expect(screen.getAllByText(/never covers surge or overspeed/).length).toBe((demo.plans as unknown[]).length);
    fireEvent.change(field, { target: { value: '62' } });
    const plan0 = () => (draft.plans as Record<string, unknown>[])[0];
    expect(plan0().offMapEfficiency).toBe(0.62); // 62 % = 0.62
    expect(studyDocumentSchema.safeParse(draft).success).toBe(true);
    fireEvent.change(field, { target: { value: '' } });
    expect('offMapEfficiency' in plan0()).toBe(false);
  });
});
