import { describe, expect, it } from 'vitest';
import { computeAt } from './fixtures';

describe('lean mixtures under boost', () => {
  it('lambda 1.05 at 160 kPa of boost on petrol is at a limit', () => {
    const f = computeAt(1.05, 160_000).findings.find((x) => x.code === 'lean-under-boost-limit');
    expect(f?.severity).toBe('limit'); // above the 1.0 limit under boost (common practice, no source)
    expect(f?.message).toMatch(/1\.05/);
  });

  it('lambda 0.95 under boost is a warning, and no boost raises nothing', () => {
    expect(computeAt(0.95, 160_000).findings.find((x) => x.code === 'lean-under-boost')?.severity).toBe('warning'); // above the 0.9 default (common practice, no source)
    expect(computeAt(1.05, 0).findings.some((x) => x.code.startsWith('lean-under-boost'))).toBe(false); // 0 Pa gauge is not under boost
  });
});
