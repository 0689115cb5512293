import { describe, expect, it } from 'vitest';
import { SOURCES } from '#shared/matching/working';
import { DEFAULT_LESSON, lessonSource, runLesson } from '#src/features/learn/lesson';

describe('the Learn lesson names its sources for a page without a study', () => {
  it('never says "Study" or "Plan" in a step’s source, and keeps the published sources by name', () => {
    const { steps } = runLesson(DEFAULT_LESSON, null);
    expect(steps.length).toBeGreaterThan(3);
    for (const step of steps) expect(step.source, step.id).not.toMatch(/\b(Study|Plan)\b/);
    expect(steps.some((s) => s.source === 'Set in this lesson (the controls above, or the lesson’s engine)')).toBe(true);
    expect(steps.some((s) => s.source === SOURCES.isa)).toBe(true);
  });

  it('rewords only the sources that speak of a study or a plan', () => {
    expect(lessonSource(SOURCES.given)).not.toContain('Study');
    expect(lessonSource(SOURCES.heywoodAirflow)).toBe(SOURCES.heywoodAirflow);
  });
});
