// Worst case against the exact closed-form extremes of a two-resistor divider (shared/references.md,
// "Divider tolerance and loading": V_max = V·R₂(1+t₂)/(R₁(1−t₁)+R₂(1+t₂)), V_min likewise; the
// worked 12 V, 27 kΩ/10 kΩ ±5 % figures there are computed with high-precision arithmetic).
import { describe, expect, it } from 'vitest';
import { runWorstCase } from '../../../shared/analysis';
import { divider } from './fixtures';

const tap = { kind: 'net', net: 'tap' } as const;
const vMax = (v: number, r1: number, r2: number, t1: number, t2: number) => (v * r2 * (1 + t2)) / (r1 * (1 - t1) + r2 * (1 + t2));
const vMin = (v: number, r1: number, r2: number, t1: number, t2: number) => (v * r2 * (1 - t2)) / (r1 * (1 + t1) + r2 * (1 - t2));

describe('worst case of a divider', () => {
  it('matches the worked extremes in shared/references.md (all corners)', () => {
    const r = runWorstCase(divider(), { outputs: [tap] });
    expect(r.method).toBe('all-corners');
    const o = r.outputs[0];
    expect(o.nominal).toBeCloseTo(3.24324324324, 10);
    expect(o.max.value).toBeCloseTo(3.48547717842, 10);
    expect(o.min.value).toBeCloseTo(3.01188903567, 10);
    // the maximum needs R1 at its low end and R2 at its high end
    expect(o.max.sides).toEqual({ 'R1.resistance': 'low', 'R2.resistance': 'high' });
    expect(o.min.sides).toEqual({ 'R1.resistance': 'high', 'R2.resistance': 'low' });
    // first-order: δV/V = S·(δR₂/R₂ − δR₁/R₁), S = R₁/(R₁+R₂); each ±5 % part moves V by S·5 %·V
    const each = (27 / 37) * 0.05 * (12 * 10 / 37);
    for (const c of o.contributions) {
      expect(c.towardMax).toBeCloseTo(each, 7);
      expect(c.share).toBeCloseTo(0.5, 6);
    }
    expect(o.contributions.find((c) => c.key === 'R1.resistance')!.sensitivity).toBeLessThan(0);
    expect(o.max.linearEstimate).toBeCloseTo(o.nominal + 2 * each, 9);
  });

  it('finds the same extremes by sensitivity corners and vertex search', () => {
    const r = runWorstCase(divider({ r1Tol: 0.01, r2Tol: 0.1 }), { outputs: [tap], maxExhaustiveVariables: 0 });
    expect(r.method).toBe('sensitivity-corner+vertex-search');
    expect(r.outputs[0].max.value).toBeCloseTo(vMax(12, 27000, 10000, 0.01, 0.1), 10);
    expect(r.outputs[0].min.value).toBeCloseTo(vMin(12, 27000, 10000, 0.01, 0.1), 10);
    // R2's ±10 % dominates R1's ±1 %
    expect(r.outputs[0].max.drivers[0].key).toBe('R2.resistance');
  });

  it('includes the supply range (the divider output is proportional to the supply)', () => {
    const r = runWorstCase(divider({ vMin: 10.8, vMax: 13.2 }), { outputs: [tap, { kind: 'current', part: 'V1', pin: 'pos' }] });
    expect(r.variables.map((v) => v.key)).toEqual(['V1.voltage', 'R1.resistance', 'R2.resistance']);
    expect(r.outputs[0].max.value).toBeCloseTo(vMax(13.2, 27000, 10000, 0.05, 0.05), 10);
    expect(r.outputs[0].min.value).toBeCloseTo(vMin(10.8, 27000, 10000, 0.05, 0.05), 10);
    // current INTO V1.pos is −V/(R1+R2): most negative at 13.2 V with both resistors low
    expect(r.outputs[1].min.value).toBeCloseTo(-13.2 / (0.95 * 37000), 12);
  });

  it('says what is wrong with an output that does not exist', () => {
    expect(() => runWorstCase(divider(), { outputs: [{ kind: 'net', net: 'tapp' }] })).toThrow(/no net "tapp".*Nets on this sheet: .*tap/);
    expect(() => runWorstCase(divider(), { outputs: [{ kind: 'current', part: 'R1', pin: 'c' }] })).toThrow(/has no pin "c"; its pins are a, b/);
  });
});

describe('worst case over a temperature range', () => {
  it('an NTC divider is bounded by the β equation at the range ends (Steinhart & Hart 1968 β form; references.md)', () => {
    // 3.3 V over 10 kΩ (tempco 0 here) onto a 10 kΩ, B = 3950 K NTC; no part tolerances, −20 … 60 °C
    const sheet = {
      format: 'tapline.sheet',
      version: 1,
      conditions: { temperatureC: 25 },
      parts: [
        { id: 'V1', type: 'dc_voltage_source', params: { voltage: 3.3 } },
        { id: 'R1', type: 'resistor', params: { resistance: 10000, tolerance: 0 } },
        { id: 'TH1', type: 'ntc', params: { nominalResistance: 10000, beta: 3950, tolerance: 0 } },
        { id: 'S', type: 'net_label', params: { name: 'sense' } },
        { id: 'GND1', type: 'ground' },
      ],
      wires: [
        { from: 'V1.pos', to: 'R1.a' },
        { from: 'R1.b', to: 'TH1.a' },
        { from: 'S.n', to: 'TH1.a' },
        { from: 'TH1.b', to: 'GND1.g' },
        { from: 'V1.neg', to: 'GND1.g' },
      ],
    };
    const r = runWorstCase(sheet, { outputs: [{ kind: 'net', net: 'sense' }], extra: [{ target: { kind: 'condition', condition: 'temperatureC' }, low: -20, high: 60 }] });
    expect(r.variables.map((v) => v.key)).toEqual(['conditions.temperatureC']);
    const rNtc = (tC: number) => 10000 * Math.exp(3950 * (1 / (tC + 273.15) - 1 / 298.15));
    const v = (tC: number) => (3.3 * rNtc(tC)) / (10000 + rNtc(tC));
    expect(r.outputs[0].nominal).toBeCloseTo(1.65, 10);
    expect(r.outputs[0].max.value).toBeCloseTo(v(-20), 9); // cold: NTC high, tap high
    expect(r.outputs[0].min.value).toBeCloseTo(v(60), 9);
    expect(r.outputs[0].max.sides['conditions.temperatureC']).toBe('low');
  });
});
