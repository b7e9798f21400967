// Property-based fuzzing of the solver on valid sheets with values from one end of the double range
// to the other (support/sheet-arbitraries.ts): every sheet ends in a result or a structured error
// within the iteration bound, and every result obeys Kirchhoff's current law at each net and each
// part's own law at its pin voltages (support/circuit-laws.ts, independent of the engine). Also the
// compiled-circuit API under hostile overrides, conditions and warm starts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileCircuit, solveOperatingPoint, type SolveResult } from '../../../shared/engine';
import { checkCircuitLaws } from './support/circuit-laws';
import { fuzzRun } from './support/fuzz-config';
import { resultProblems } from './support/result-shape';
import { buildSheet, circuitShape, hostileValue } from './support/sheet-arbitraries';

/**
 * To the engine's own convergence tolerances (docs/engine.md): KCL to reltol 1e-6 (abstol 1e-14 A,
 * plus the 1e-12 S gmin where a gmin solution stands), voltage constraints to reltol and vntol 1e-9 V,
 * and device laws to the same 1e-6 (a junction behind a series resistance balances its internal
 * node only to the KCL tolerance).
 */
const TOL = { kclRelative: 1e-6, kclAbsolute: 1e-12, lawRelative: 1e-6, lawAbsolute: 1e-12, kvlRelative: 1e-6, kvlAbsolute: 1e-9 };

function checkSolved(sheet: unknown, r: SolveResult): void {
  expect(resultProblems(r)).toEqual([]);
  if (!r.ok) return;
  // a junction past the range of its exact law reports the linear continuation, and says so
  const beyond = r.warnings.filter((w) => w.code === 'junction_beyond_model').map((w) => w.partId!);
  const rep = checkCircuitLaws(sheet, r, TOL, beyond);
  if (rep.violations.length) throw new Error(`solved, but:\n${rep.violations.slice(0, 6).join('\n')}`);
}

describe('fuzz: the solver on extreme valid sheets', () => {
  it('a result obeying KCL and every device law, or a structured error, within the iteration bound', () => {
    const { seed, numRuns } = fuzzRun('extreme circuits', 9201, 1200);
    const outcomes = new Map<string, number>();
    fc.assert(
      fc.property(circuitShape(10), (shape) => {
        const sheet = buildSheet(shape);
        const r = solveOperatingPoint(sheet);
        const key = r.ok ? 'solved' : r.error.code;
        outcomes.set(key, (outcomes.get(key) ?? 0) + 1);
        checkSolved(sheet, r);
      }),
      { seed, numRuns },
    );
    console.log(`[fuzz] extreme circuits: ${[...outcomes].map(([k, n]) => `${k} ${n}`).join(', ')}`);
    // the generator must reach real solves, not only diagnostics
    expect(outcomes.get('solved') ?? 0).toBeGreaterThan(numRuns / 4);
  }, 600_000);

  it('the compiled-circuit API under hostile overrides, conditions and warm starts', () => {
    const { seed, numRuns } = fuzzRun('compiled-circuit API', 9202, 600);
    fc.assert(
      fc.property(
        circuitShape(6),
        fc.array(
          fc.record({
            part: fc.constantFrom('P0', 'P1', 'RT1', 'GND', 'L1', 'NOPE', '__proto__', 'constructor'),
            param: fc.constantFrom('resistance', 'voltage', 'current', 'position', 'closed', 'temperatureC', 'beta', 'value', 'mode', 'name', '__proto__', 'toString', 'nope'),
            value: hostileValue,
          }),
          { maxLength: 3 },
        ),
        fc.record({ temperatureC: fc.option(hostileValue), illuminanceLux: fc.option(hostileValue) }),
        fc.constantFrom('previous', 'garbage', 'nan-map', 'other', undefined),
        (shape, overrides, cond, guess) => {
          const sheet = buildSheet(shape);
          const c = compileCircuit(sheet);
          const first = c.solve();
          checkSolved(sheet, first);
          const paramOverrides: Record<string, Record<string, unknown>> = {};
          for (const o of overrides) {
            const byPart = Object.prototype.hasOwnProperty.call(paramOverrides, o.part) ? paramOverrides[o.part] : {};
            Object.defineProperty(byPart, o.param, { value: o.value, enumerable: true, writable: true, configurable: true });
            Object.defineProperty(paramOverrides, o.part, { value: byPart, enumerable: true, writable: true, configurable: true });
          }
          const conditions = Object.fromEntries(Object.entries(cond).filter(([, v]) => v !== null));
          const initialGuess =
            guess === 'garbage' ? ({ n1: 'x', n2: Infinity, '0': 5 } as unknown as Record<string, number>)
            : guess === 'nan-map' ? { n1: NaN, n2: 1e308, n3: -1e308 }
            : guess === 'other' ? (solveOperatingPoint(buildSheet({ ...shape, parts: shape.parts.slice(0, 1) })) as never)
            : guess;
          const r = c.solve({ paramOverrides: paramOverrides as never, conditions: conditions as never, ...(initialGuess !== undefined ? { initialGuess } : {}) });
          expect(resultProblems(r)).toEqual([]);
          const raw = c.solveRaw({ paramOverrides: paramOverrides as never });
          expect(typeof raw.ok).toBe('boolean');
          // the same circuit solved again gives the same answer, bit for bit (docs/engine.md, "Determinism")
          const again = c.solve();
          expect(JSON.stringify(again)).toBe(JSON.stringify(first));
        },
      ),
      { seed, numRuns },
    );
  }, 600_000);

  it('cyclic and throwing inputs from JS callers', () => {
    const cyclic: Record<string, unknown> = { format: 'tapline.sheet', version: 1, parts: [], wires: [] };
    cyclic.self = cyclic;
    (cyclic.parts as unknown[]).push({ id: 'R1', type: 'resistor', params: { resistance: 100, loop: cyclic } });
    expect(resultProblems(solveOperatingPoint(cyclic))).toEqual([]);
    const throwing = new Proxy({}, { get: () => { throw new Error('boom'); }, ownKeys: () => { throw new Error('boom'); } });
    expect(resultProblems(solveOperatingPoint(throwing))).toEqual([]);
    const getter = { format: 'tapline.sheet', version: 1, get parts(): unknown { throw new Error('no parts for you'); } };
    expect(resultProblems(solveOperatingPoint(getter))).toEqual([]);
    const bigint = { format: 'tapline.sheet', version: 1, parts: [{ id: 'R1', type: 'resistor', params: { resistance: 10n } }] };
    expect(resultProblems(solveOperatingPoint(bigint))).toEqual([]);
  });
});
