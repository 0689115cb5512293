import { describe } from 'vitest';
import { studyInputSchema } from '#shared/matching/input/study';
import { itNeverThrows } from '#tests/unit/schema-robustness';
import { baseStudy } from '../fixtures';

describe('schemas never throw on malformed input', () => {
  itNeverThrows('study input', studyInputSchema, baseStudy());
});
