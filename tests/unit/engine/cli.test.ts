// The command line (shared/contracts/sheet-format.md, "Command line"): stdout is one JSON
// document; exit 0 solved, 1 cannot be solved, 2 not a valid sheet.
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../../cli/main';
import type { CliIO } from '../../../cli/io';

const root = path.resolve(import.meta.dirname, '../../..');

function fakeIO(files: Record<string, string>) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIO = {
    out: (v, pretty) => out.push(JSON.stringify(v, null, pretty ? 2 : 0)),
    log: (m) => err.push(m),
    resolve: (p) => p,
    readText: (p) => {
      if (!(p in files)) throw Object.assign(new Error('nope'), { code: 'ENOENT' });
      return files[p];
    },
  };
  return { io, out, err };
}

const good = JSON.stringify({
  format: 'tapline.sheet',
  version: 1,
  parts: [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12 } },
    { id: 'R1', type: 'resistor', params: { resistance: 27000 } },
    { id: 'R2', type: 'resistor', params: { resistance: 10000 } },
    { id: 'G', type: 'ground' },
  ],
  wires: [{ from: 'V1.pos', to: 'R1.a' }, { from: 'R1.b', to: 'R2.a' }, { from: 'R2.b', to: 'G.g' }, { from: 'V1.neg', to: 'G.g' }],
});

describe('solve CLI', () => {
  it('exit 0 and the result JSON for a solvable sheet', async () => {
    const f = fakeIO({ 'a.json': good });
    expect(await main(['a.json'], f.io)).toBe(0);
    expect(f.out).toHaveLength(1);
    const r = JSON.parse(f.out[0]);
    expect(r).toMatchObject({ ok: true, analysis: 'operating-point', iterations: 1 });
    expect(r.nets.N2).toBeCloseTo(3.243243243243, 10);
    expect(r.pins['R1.b']).toBeCloseTo(3.243243243243, 10);
    expect(await main(['op', 'a.json', '--pretty'], f.io)).toBe(0);
  });

  it('exit 1 with the error JSON when the circuit cannot be solved', async () => {
    const s = JSON.parse(good);
    s.parts.pop();
    s.wires = s.wires.filter((w: { to: string }) => w.to !== 'G.g');
    const f = fakeIO({ 'b.json': JSON.stringify(s) });
    expect(await main(['b.json'], f.io)).toBe(1);
    expect(JSON.parse(f.out[0])).toMatchObject({ ok: false, error: { code: 'no_ground' } });
  });

  it('exit 2 for an invalid sheet, bad JSON, a missing file, or bad arguments', async () => {
    const s = JSON.parse(good);
    s.parts[1].params.resistance = -5;
    const f = fakeIO({ 'c.json': JSON.stringify(s), 'd.json': '{' });
    expect(await main(['c.json'], f.io)).toBe(2);
    const r = JSON.parse(f.out[0]);
    expect(r.error.code).toBe('invalid_sheet');
    expect(r.error.message).toContain('Part "R1" (resistor): field "resistance" must be a positive number (got -5)');
    expect(r.error.parts).toEqual(['R1']);
    expect(await main(['d.json'], f.io)).toBe(2);
    expect(await main(['missing.json'], f.io)).toBe(2);
    expect(await main(['a.json', '--frobnicate'], f.io)).toBe(2);
    expect(await main(['a.json', '--set', 'R1.resistance=-1'], fakeIO({ 'a.json': good }).io)).toBe(2);
    expect(await main([], f.io)).toBe(2);
  });

  it('--set and --temperature apply to the run', async () => {
    const f = fakeIO({ 'a.json': good });
    expect(await main(['a.json', '--set', 'R2.resistance=27000'], f.io)).toBe(0);
    expect(JSON.parse(f.out[0]).nets.N2).toBeCloseTo(6, 12);
  });

  it('the real command prints only JSON on stdout and exits 0 / 2', () => {
    const tsx = path.join(root, 'node_modules/.bin/tsx');
    const ok = spawnSync(tsx, ['--conditions=tapline', 'cli/solve.ts', 'examples/battery-divider.json'], { cwd: root, encoding: 'utf8', env: { ...process.env, INIT_CWD: root } });
    expect(ok.status).toBe(0);
    expect(JSON.parse(ok.stdout).ok).toBe(true);
    const bad = spawnSync(tsx, ['--conditions=tapline', 'cli/solve.ts', 'package.json'], { cwd: root, encoding: 'utf8', env: { ...process.env, INIT_CWD: root } });
    expect(bad.status).toBe(2);
    expect(JSON.parse(bad.stdout).error.code).toBe('invalid_sheet');
  }, 30_000);
});
