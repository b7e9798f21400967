// Sweep → plot data → CSV, on the worked divider: every row must match the closed form
// V·R2/(R1+R2) (voltage divider rule; /work/shared/references.md), and the CSV must read back
// with papaparse (RFC 4180).
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../../shared/analysis';
import { sweepDataFrom } from '../../../src/editor/tools/sweep/sweepData';
import { sweepCsv } from '../../../src/editor/tools/sweep/sweepCsv';
import { buildSweepPlot } from '../../../src/editor/tools/sweep/plotModel';
import { parseBenchCsv, guessMapping } from '../../../src/editor/tools/sweep/benchData';
import { sweepChoices } from '../../../src/editor/tools/sweep/sweepTargets';
import { divider } from './helpers';

describe('sweep export', () => {
  it('writes one row per point with the closed-form tap voltage', () => {
    const table = runSweep(divider(), { axes: [{ target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { from: 0, to: 15, points: 16 } }] });
    const data = sweepDataFrom(table, ['linear']);
    const csv = sweepCsv(data, ['V(tap)']);
    const rows = Papa.parse<string[]>(csv.trim()).data;
    expect(rows[0]).toEqual(['V1.voltage [V]', 'V(tap) [V]']);
    expect(rows).toHaveLength(17);
    for (const [v, tap] of rows.slice(1).map((r) => r.map(Number))) expect(tap).toBeCloseTo((v * 10000) / 37000, 9);
    expect(csv.includes('\r\n')).toBe(true);
  });

  it('a two-parameter sweep gives one curve per family value', () => {
    const table = runSweep(divider(), {
      axes: [
        { target: { kind: 'param', part: 'R2', param: 'resistance' }, steps: { from: 10000, to: 20000, points: 2 } },
        { target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { from: 10, to: 14, points: 5 } },
      ],
    });
    const data = sweepDataFrom(table, ['linear', 'linear']);
    expect(data.family?.values).toEqual([10000, 20000]);
    expect(data.curves['V(tap)']).toHaveLength(2);
    expect(data.curves['V(tap)'][1][4]).toBeCloseTo((14 * 20000) / 47000, 9);
    expect(sweepCsv(data, ['V(tap)']).trim().split('\r\n')).toHaveLength(11);
  });

  it('merges measured x values into the plot axis and skips readings outside the sweep', () => {
    const data = sweepDataFrom(runSweep(divider(), { axes: [{ target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { from: 10, to: 14, points: 3 } }] }), ['linear']);
    const table = parseBenchCsv('V1.voltage,V(tap)\n11,2.98\n13,3.50\n20,5\n');
    const model = buildSweepPlot(data, ['V(tap)'], { table, mapping: guessMapping(table, 'V1.voltage', ['V(tap)']) }, () => '');
    expect(model.data[0]).toEqual([10, 11, 12, 13, 14]);
    expect(model.series.map((s) => s.kind)).toEqual(['simulated', 'measured']);
    expect(model.data[2]).toEqual([null, 2.98, null, 3.5, null]);
    expect(model.outside).toBe(1);
  });
});

describe('sweep choices', () => {
  it('offers the supply over its declared range, the wiper end to end, a decade either side of a resistance, and the conditions', () => {
    const c = sweepChoices(divider());
    const byKey = Object.fromEntries(c.map((x) => [x.key, x]));
    expect(byKey['R1.resistance']).toMatchObject({ from: 2700, to: 270000, scale: 'log', unit: 'Ω' });
    expect(byKey['R1.tolerance']).toBeUndefined();
    expect(byKey['conditions.temperatureC']).toMatchObject({ from: -40, to: 85 });
    expect(byKey['V1.voltage']).toMatchObject({ from: 6, to: 18 });
  });
});
