// Bugs found by the fuzz suites in the compiled-circuit API (JS callers, not sheet files), each
// kept as a test.
import { describe, expect, it } from 'vitest';
import { compileCircuit } from '../../../shared/engine';
import { resultProblems } from './support/result-shape';

const sheet = {
  format: 'tapline.sheet',
  version: 1,
  parts: [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5 } },
    { id: 'R1', type: 'resistor', params: { resistance: 1000 } },
    { id: 'G', type: 'ground' },
  ],
  wires: [
    { from: 'V1.pos', to: 'R1.a' },
    { from: 'R1.b', to: 'G.g' },
    { from: 'V1.neg', to: 'G.g' },
  ],
};

describe('compiled-circuit API regressions', () => {
  // Regression (fuzz, seed 24): a condition given as an object whose toString is not a function
  // made the error message itself throw, which came back as internal_error.
  it('values that cannot be turned into text are described, not printed', () => {
    const c = compileCircuit(sheet);
    const odd: unknown[] = [{ toString: '' }, { valueOf() { throw new Error('no'); } }, Symbol('s'), 10n, Object.create(null)];
    for (const v of odd) {
      const r = c.solve({ conditions: { temperatureC: v as number } });
      expect(resultProblems(r)).toEqual([]);
      expect(!r.ok && r.error.code).toBe('invalid_parameter');
      const o = c.solve({ paramOverrides: { R1: { resistance: v as number } } });
      expect(!o.ok && o.error.code).toBe('invalid_parameter');
      expect(resultProblems(c.solve({ initialGuess: { N1: v } as unknown as Record<string, number> }))).toEqual([]);
    }
  });
});
