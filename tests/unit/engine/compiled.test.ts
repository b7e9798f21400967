// The compiled form used by sweeps and Monte Carlo: param overrides, conditions, warm starts,
// determinism.
import { describe, expect, it } from 'vitest';
import { compileCircuit, solveOperatingPoint, type ParamOverrides } from '../../../shared/engine';
import { part, sheet, wire } from '../../support/reference/sheets';
import { expectRel } from './helpers';

const biasSheet = sheet(
  [
    part('V1', 'dc_voltage_source', { voltage: 9 }),
    part('R1', 'resistor', { resistance: 47000 }),
    part('R2', 'resistor', { resistance: 10000 }),
    part('RC', 'resistor', { resistance: 2200 }),
    part('RE', 'resistor', { resistance: 470 }),
    part('Q1', 'npn', { beta: 150 }),
    part('TH1', 'ntc', {}),
    part('S1', 'switch', { closed: true }),
    part('G', 'ground'),
  ],
  [
    wire('V1.pos', 'R1.a'), wire('R1.b', 'Q1.b'), wire('Q1.b', 'R2.a'), wire('R2.b', 'G.g'), wire('V1.pos', 'RC.a'), wire('RC.b', 'Q1.c'),
    wire('Q1.e', 'RE.a'), wire('RE.b', 'G.g'), wire('V1.neg', 'G.g'), wire('V1.pos', 'S1.a'), wire('S1.b', 'TH1.a'), wire('TH1.b', 'G.g'),
  ],
);

describe('compileCircuit', () => {
  it('solve() equals solveOperatingPoint, and is deterministic', () => {
    const c = compileCircuit(biasSheet);
    const a = c.solve();
    const b = solveOperatingPoint(biasSheet);
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
    expect(JSON.stringify(c.solve())).toBe(JSON.stringify(a));
    expect(c.unknowns).toBeGreaterThan(0);
    expect(c.error).toBeNull();
  });

  it('param overrides apply to one solve only, and are validated', () => {
    const c = compileCircuit(biasSheet);
    const base = c.solve();
    const over = c.solve({ paramOverrides: { R2: { resistance: 12000 }, S1: { closed: false } } });
    expect(base.ok && over.ok).toBe(true);
    if (!base.ok || !over.ok) return;
    expect(over.pins['Q1.b']).toBeGreaterThan(base.pins['Q1.b']);
    expect(Math.abs(over.parts.TH1.pinCurrents.a)).toBeLessThan(1e-7);
    // same as editing the sheet
    const edited = JSON.parse(JSON.stringify(biasSheet));
    edited.parts.find((p: { id: string }) => p.id === 'R2').params.resistance = 12000;
    edited.parts.find((p: { id: string }) => p.id === 'S1').params.closed = false;
    const direct = solveOperatingPoint(edited);
    if (!direct.ok) throw new Error('direct');
    for (const k of Object.keys(direct.nets)) expectRel(over.nets[k], direct.nets[k], 1e-9, 1e-12);
    expect(JSON.stringify(c.solve())).toBe(JSON.stringify(base));
    const bad = c.solve({ paramOverrides: { R2: { resistance: -1 } } });
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.error.code).toBe('invalid_parameter');
      expect(bad.error.message).toContain('Part "R2" (resistor): field "resistance" must be a positive number (got -1)');
    }
    const unknown = c.solve({ paramOverrides: { R9: { resistance: 1 } } });
    expect(!unknown.ok && unknown.error.code).toBe('invalid_parameter');
  });

  it('conditions override the sheet temperature', () => {
    const c = compileCircuit(biasSheet);
    const hot = c.solve({ conditions: { temperatureC: 85 } });
    const cold = c.solve({ conditions: { temperatureC: -20 } });
    if (!hot.ok || !cold.ok) throw new Error('solve');
    expect(hot.conditions.temperatureC).toBe(85);
    // NTC resistance falls with temperature; V_BE falls, so the collector current rises
    expect(Number(hot.parts.TH1.derived?.resistance)).toBeLessThan(Number(cold.parts.TH1.derived?.resistance));
    expect(hot.parts.Q1.pinCurrents.c).toBeGreaterThan(cold.parts.Q1.pinCurrents.c);
  });

  it('a warm start from the previous solution converges in fewer iterations', () => {
    const c = compileCircuit(biasSheet);
    const cold = c.solve();
    if (!cold.ok) throw new Error('solve');
    const warm = c.solve({ paramOverrides: { R2: { resistance: 10100 } }, initialGuess: 'previous' });
    const warm2 = c.solve({ paramOverrides: { R2: { resistance: 10100 } }, initialGuess: cold });
    const byNets = c.solve({ paramOverrides: { R2: { resistance: 10100 } }, initialGuess: cold.nets });
    const coldOver = compileCircuit(biasSheet).solve({ paramOverrides: { R2: { resistance: 10100 } } });
    if (!warm.ok || !warm2.ok || !byNets.ok || !coldOver.ok) throw new Error('solve');
    expect(warm.iterations).toBeLessThan(coldOver.iterations);
    expect(warm2.iterations).toBeLessThan(coldOver.iterations);
    expect(byNets.iterations).toBeLessThan(coldOver.iterations);
    expectRel(warm.nets.N2, coldOver.nets.N2, 1e-9);
  });

  it('a structural failure is reported by every solve', () => {
    const c = compileCircuit(sheet([part('R1', 'resistor', { resistance: 1 })], []));
    expect(c.error?.error.code).toBe('no_ground');
    expect(c.solve().ok).toBe(false);
  });

  it('solveRaw and the accessors give the same numbers as solve()', () => {
    const c = compileCircuit(biasSheet);
    expect(c.netNames).toEqual(['N1', '0', 'N2', 'N3', 'N4', 'N5']);
    const full = c.solve({ paramOverrides: { RE: { resistance: 560 } } });
    const raw = c.solveRaw({ paramOverrides: { RE: { resistance: 560 } } });
    if (!full.ok || !raw.ok) throw new Error('solve');
    expect(raw.iterations).toBe(full.iterations);
    for (const n of c.netNames) expect(c.netVoltage(n)).toBe(full.nets[n]);
    expect(c.pinVoltage('Q1', 'c')).toBe(full.pins['Q1.c']);
    expect(c.pinCurrent('Q1', 'b')).toBe(full.parts.Q1.pinCurrents.b);
    expect(c.partPower('RC')).toBeCloseTo(full.parts.RC.power, 15);
    expect(() => c.netVoltage('nope')).toThrow();
    const failed = compileCircuit(sheet([part('R1', 'resistor', { resistance: 1 })], []));
    expect(failed.solveRaw().ok).toBe(false);
    expect(() => failed.netVoltage('0')).toThrow();
  });

  it('overrides that change the structure (a 0 Ω end position, a new series resistance) still solve', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 5 }), part('RV1', 'potentiometer', { resistance: 10000, position: 0.5 }), part('R1', 'resistor', { resistance: 1000 }), part('D1', 'diode'), part('G', 'ground')],
      [wire('V1.pos', 'RV1.a'), wire('RV1.b', 'G.g'), wire('RV1.w', 'R1.a'), wire('R1.b', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const c = compileCircuit(s);
    const overrides: ParamOverrides[] = [{ RV1: { position: 0 } }, { RV1: { position: 1 } }, { D1: { seriesResistance: 50 } }, { RV1: { position: 0.25 }, D1: { seriesResistance: 0 } }];
    for (const ov of overrides) {
      const a = c.solve({ paramOverrides: ov, initialGuess: 'previous' });
      const edited = JSON.parse(JSON.stringify(s));
      for (const [id, o] of Object.entries(ov)) Object.assign(edited.parts.find((p: { id: string }) => p.id === id).params, o);
      const b = solveOperatingPoint(edited);
      if (!a.ok || !b.ok) throw new Error('solve');
      for (const k of Object.keys(b.nets)) expectRel(a.nets[k], b.nets[k], 1e-9, 1e-12);
    }
    const r = c.solve({ paramOverrides: { RV1: { position: 0 } } });
    if (!r.ok) throw new Error('solve');
    expect(r.pins['RV1.w']).toBe(5);
  });
});

