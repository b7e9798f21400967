// The hard circuits (tests/fixtures/hard-circuits/*.json, listed in docs/engine.md "Hard cases"):
// each one must either solve to a point that obeys Kirchhoff's laws and every device law
// (support/circuit-laws.ts, which regroups the nets and re-evaluates the laws without engine code),
// within its stated iteration bound and with its expected values, or fail with its stated
// diagnostic. Expected values name their source in the fixture; iteration counts are the engine's
// own report, never wall time.
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint, type SolveResult, type SolveSuccess } from '../../../shared/engine';
import { checkCircuitLaws } from './support/circuit-laws';
import { loadHardCircuits, type ExpectedValue, type HardCircuit } from './support/fixtures';

const circuits = loadHardCircuits();

function valueOf(r: SolveSuccess, key: string): number {
  const m = /^([VIP])\((.+)\)$/.exec(key);
  if (!m) throw new Error(`bad key ${key}`);
  const own = (o: object, k: string) => Object.prototype.hasOwnProperty.call(o, k);
  if (m[1] === 'V') {
    if (!own(r.nets, m[2])) throw new Error(`no net ${m[2]} in the result`);
    return r.nets[m[2]];
  }
  if (m[1] === 'P') {
    if (!own(r.parts, m[2])) throw new Error(`no part ${m[2]} in the result`);
    return r.parts[m[2]].power;
  }
  const dot = m[2].lastIndexOf('.');
  const part = m[2].slice(0, dot);
  const pin = m[2].slice(dot + 1);
  if (!own(r.parts, part) || !own(r.parts[part].pinCurrents, pin)) throw new Error(`no pin ${m[2]} in the result`);
  return r.parts[part].pinCurrents[pin];
}

function checkValue(r: SolveSuccess, v: ExpectedValue): void {
  const actual = valueOf(r, v.key);
  const tol = Math.abs(v.value) * (v.relative ?? 1e-9) + (v.absolute ?? 0);
  if (!(Math.abs(actual - v.value) <= tol))
    expect.fail(`${v.key} = ${actual}, expected ${v.value} ± ${tol} (${v.source})`);
}

function describeResult(r: SolveResult): string {
  return r.ok ? `solved in ${r.iterations} iterations (${r.strategy})` : `${r.error.code}: ${r.error.message}`;
}

function runCase(c: HardCircuit): void {
  const e = c.expect;
  const r = solveOperatingPoint(c.sheet);
  if (e.outcome === 'error') {
    expect(r.ok, `expected ${e.code}, got ${describeResult(r)}`).toBe(false);
    if (r.ok) return;
    expect(r.error.code, r.error.message).toBe(e.code);
    expect(r.error.message.length).toBeGreaterThan(20);
    for (const p of e.parts ?? []) expect(r.error.parts, `error should name part ${p}`).toContain(p);
    for (const n of e.nets ?? []) expect(r.error.nets, `error should name net ${n}`).toContain(n);
    for (const f of e.messageIncludes ?? []) expect(r.error.message).toContain(f);
    if (e.maxIterations !== undefined && r.iterations !== undefined) expect(r.iterations).toBeLessThanOrEqual(e.maxIterations);
    return;
  }
  if (!r.ok) expect.fail(`expected a solution, got ${describeResult(r)}`);
  expect(r.iterations, 'iterations reported by the solve').toBeLessThanOrEqual(e.maxIterations);
  if (e.strategy) expect(r.strategy).toBe(e.strategy);
  const laws = e.laws ?? e.kcl;
  const report = checkCircuitLaws(c.sheet, r, {
    kclRelative: e.kcl.relative,
    kclAbsolute: e.kcl.absolute,
    lawRelative: laws.relative,
    lawAbsolute: laws.absolute,
  }, e.skipLaws ?? []);
  expect(report.violations, report.violations.slice(0, 5).join('\n')).toEqual([]);
  for (const v of e.values ?? []) checkValue(r, v);
  for (const [part, fields] of Object.entries(e.derived ?? {}))
    for (const [k, want] of Object.entries(fields)) expect(r.parts[part]?.derived?.[k], `${part}.derived.${k}`).toBe(want);
  const codes = r.warnings.map((w) => w.code);
  const onParts = r.warnings.map((w) => `${w.code}@${w.partId ?? ''}`);
  for (const w of e.warnings ?? []) expect(w.includes('@') ? onParts : codes, `warning ${w}`).toContain(w);
  for (const w of e.noWarnings ?? []) expect(codes, `warning ${w} should not appear`).not.toContain(w);
}

describe('hard circuits', () => {
  it('has at least 40 fixtures, each saying why it is hard and where expected values come from', () => {
    expect(circuits.length).toBeGreaterThanOrEqual(40);
    for (const c of circuits) {
      expect(c.expect, c.file).toBeDefined();
      expect(c.expect.why.length, c.file).toBeGreaterThan(10);
      if (c.expect.outcome === 'solves') for (const v of c.expect.values ?? []) expect(v.source.length, `${c.file} ${v.key}`).toBeGreaterThan(5);
    }
  });

  for (const c of circuits) it(c.file.replace(/\.json$/, ''), () => runCase(c));
});
