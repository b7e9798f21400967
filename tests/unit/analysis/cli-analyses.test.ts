// The analysis commands of `npm run solve` through cli/main with an in-memory io: JSON or CSV on
// stdout, exit 0 done / 1 unsolvable / 2 bad sheet or arguments, results equal to the library's.
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { main } from '../../../cli/main';
import type { CliIO } from '../../../cli/io';
import { divider } from './fixtures';

function fakeIO(files: Record<string, string>) {
  const out: unknown[] = [];
  const text: string[] = [];
  const err: string[] = [];
  const io: CliIO & { text(s: string): void } = {
    out: (v) => out.push(JSON.parse(JSON.stringify(v))),
    text: (s) => text.push(s),
    log: (m) => err.push(m),
    resolve: (p) => p,
    readText: (p) => {
      if (!(p in files)) throw Object.assign(new Error('nope'), { code: 'ENOENT' });
      return files[p];
    },
  };
  return { io, out, text, err };
}

const files = { 'd.json': JSON.stringify(divider()), 'dv.json': JSON.stringify(divider({ vMin: 10.8, vMax: 13.2 })) };

describe('analysis commands', () => {
  it('sweep: CSV with the axis and the chosen column; V·R2/(R1+R2) at each point', async () => {
    const f = fakeIO(files);
    expect(await main(['sweep', 'd.json', '--vary', 'R2.resistance=1k:10k:4', '--column', 'V(tap)', '--csv'], f.io)).toBe(0);
    const rows = Papa.parse<string[]>(f.text.join('').trim()).data;
    expect(rows[0]).toEqual(['R2.resistance', 'V(tap)', 'error']);
    for (const [r2, v] of rows.slice(1).map((r) => r.map(Number))) expect(v).toBeCloseTo((12 * r2) / (27000 + r2), 12);
  });

  it('worst-case: JSON extremes equal the closed form (shared/references.md)', async () => {
    const f = fakeIO(files);
    expect(await main(['worst-case', 'd.json', '--output', 'tap'], f.io)).toBe(0);
    const r = f.out[0] as { ok: boolean; outputs: Array<{ max: { value: number }; min: { value: number } }> };
    expect(r.ok).toBe(true);
    expect(r.outputs[0].max.value).toBeCloseTo(3.48547717842, 10);
    expect(r.outputs[0].min.value).toBeCloseTo(3.01188903567, 10);
  });

  it('monte-carlo: the same --seed gives the same statistics, another seed does not', async () => {
    const run = async (seed: string) => {
      const f = fakeIO(files);
      expect(await main(['monte-carlo', 'dv.json', '--output', 'V(tap)', '--samples', '300', '--seed', seed, '--spec', 'V(tap)=3:3.5'], f.io)).toBe(0);
      return (f.out[0] as { outputs: Array<{ stats: { mean: number; yield: { pass: number } } }> }).outputs[0].stats;
    };
    const a = await run('42');
    expect(await run('42')).toEqual(a);
    expect((await run('43')).mean).not.toBe(a.mean);
    expect(a.yield.pass).toBeGreaterThan(0);
  });

  it('thevenin and budget', async () => {
    const f = fakeIO(files);
    expect(await main(['thevenin', 'd.json', '--net', 'tap'], f.io)).toBe(0);
    expect((f.out[0] as { results: Array<{ resistance: number }> }).results[0].resistance).toBeCloseTo(270000 / 37, 6);
    expect(await main(['budget', 'd.json'], f.io)).toBe(0);
    expect((f.out[1] as { totalSupplyCurrent: number }).totalSupplyCurrent).toBeCloseTo(12 / 37000, 15);
  });

  it('find-value and design-divider run without a sheet', async () => {
    const f = fakeIO({});
    expect(await main(['find-value', '4k7', '--series', 'E24', '--parts', '1'], f.io)).toBe(0);
    expect((f.out[0] as { ranked: Array<{ value: number }> }).ranked[0].value).toBe(4700);
    expect(await main(['design-divider', '--supply', '12', '--target', '3.3', '--max-current', '100u', '--limit', '3'], f.io)).toBe(0);
    expect((f.out[1] as { candidates: unknown[] }).candidates.length).toBeGreaterThan(0);
  });

  it('exit 2 with a message for bad arguments or outputs', async () => {
    const f = fakeIO(files);
    expect(await main(['sweep', 'd.json', '--vary', 'R2.resistance=1k:10k'], f.io)).toBe(2);
    expect(f.err.join('\n')).toMatch(/TARGET=FROM:TO:POINTS/);
    expect(await main(['worst-case', 'd.json', '--output', 'nowhere'], f.io)).toBe(2);
    expect(JSON.stringify(f.out.at(-1))).toMatch(/no net \\"nowhere\\"/);
    expect(await main(['monte-carlo', 'missing.json', '--output', 'tap'], f.io)).toBe(2);
  });
});
