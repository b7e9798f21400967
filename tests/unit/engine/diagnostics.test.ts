// Every diagnostic has a sheet that triggers it; messages name the parts and nets concerned.
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint, type SolveFailure } from '../../../shared/engine';
import { part, sheet, wire } from '../../support/reference/sheets';
import { solveOk } from './helpers';

function fail(s: unknown, options?: Parameters<typeof solveOperatingPoint>[1]): SolveFailure['error'] {
  const r = solveOperatingPoint(s, options);
  if (r.ok) throw new Error('expected a failure');
  return r.error;
}

const V = (id: string, voltage: number, extra: Record<string, unknown> = {}) => part(id, 'dc_voltage_source', { voltage, ...extra });
const R = (id: string, resistance: number) => part(id, 'resistor', { resistance });

describe('structural diagnostics', () => {
  it('no ground', () => {
    const e = fail(sheet([V('V1', 5), R('R1', 1000)], [wire('V1.pos', 'R1.a'), wire('R1.b', 'V1.neg')]));
    expect(e.code).toBe('no_ground');
    expect(e.message).toMatch(/no ground/i);
    expect(e.message).toMatch(/Add a ground/);
  });

  it('a net with no DC path to ground (floating)', () => {
    const s = sheet(
      [V('V1', 5), R('R1', 1000), R('R2', 1000), R('R3', 1000), R('R4', 2200), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g'), wire('R3.a', 'R4.a'), wire('R3.b', 'R4.b'), wire('R2.a', 'R3.a')],
    );
    const e = fail(s);
    expect(e.code).toBe('floating_net');
    expect(e.parts.sort()).toEqual(['R2', 'R3', 'R4']);
    expect(e.nets.length).toBeGreaterThan(0);
    expect(e.message).toMatch(/no DC path to ground/);
    expect(e.message).toMatch(/R3/);
  });

  it('voltage sources in parallel with different values', () => {
    const s = sheet([V('V1', 5), V('V2', 3.3), R('R1', 100), part('G', 'ground')], [wire('V1.pos', 'V2.pos'), wire('V1.neg', 'V2.neg'), wire('V1.neg', 'G.g'), wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g')]);
    const e = fail(s);
    expect(e.code).toBe('voltage_source_loop');
    expect(e.parts.sort()).toEqual(['V1', 'V2']);
    expect(e.message).toMatch(/in parallel/);
    expect(e.message).toMatch(/5 V/);
    expect(e.message).toMatch(/3\.3 V/);
    expect(e.message).toMatch(/internal resistance/);
  });

  it('a loop of voltage sources whose voltages do not add up', () => {
    const s = sheet(
      [V('V1', 5), V('V2', 5), V('V3', 9), part('G', 'ground')],
      [wire('V1.neg', 'G.g'), wire('V1.pos', 'V2.neg'), wire('V2.pos', 'V3.pos'), wire('V3.neg', 'G.g')],
    );
    const e = fail(s);
    expect(e.code).toBe('voltage_source_loop');
    expect(e.parts.sort()).toEqual(['V1', 'V2', 'V3']);
    expect(e.message).toMatch(/form a loop/);
  });

  it('equal sources in parallel: the message says the current split is undetermined', () => {
    const s = sheet([V('V1', 5), V('V2', 5), R('R1', 100), part('G', 'ground')], [wire('V1.pos', 'V2.pos'), wire('V1.neg', 'V2.neg'), wire('V1.neg', 'G.g'), wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g')]);
    const e = fail(s);
    expect(e.code).toBe('voltage_source_loop');
    expect(e.message).toMatch(/undetermined/);
    // with an internal resistance it solves
    const ok = solveOk(sheet([V('V1', 5), V('V2', 5, { internalResistance: 0.1 }), R('R1', 100), part('G', 'ground')], [wire('V1.pos', 'V2.pos'), wire('V1.neg', 'V2.neg'), wire('V1.neg', 'G.g'), wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g')]));
    expect(ok.nets.N1).toBe(5);
  });

  it('ideal 0 Ω links in parallel; a 0 Ω section with both ends on one net is harmless', () => {
    const s = sheet(
      [V('V1', 5), part('S1', 'switch', { onResistance: 0 }), part('S2', 'switch', { onResistance: 0 }), R('R1', 100), part('G', 'ground')],
      [wire('V1.pos', 'S1.a'), wire('V1.pos', 'S2.a'), wire('S1.b', 'R1.a'), wire('S2.b', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const e = fail(s);
    expect(e.code).toBe('voltage_source_loop');
    expect(e.message).toMatch(/are ideal 0 Ω links in parallel/);
    expect(e.message).toMatch(/non-zero on-resistance/);
    // a potentiometer wired as a rheostat (a tied to w) at position 0
    const rheostat = sheet(
      [V('V1', 5), part('RV1', 'potentiometer', { resistance: 1000, position: 0 }), R('R1', 100), part('G', 'ground')],
      [wire('V1.pos', 'RV1.a'), wire('RV1.a', 'RV1.w'), wire('RV1.b', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g')],
    );
    expect(solveOk(rheostat).pins['R1.a']).toBeCloseTo((5 * 100) / 1100, 12);
  });

  it('an empty sheet says so', () => {
    const e = fail(sheet([], []));
    expect(e.code).toBe('no_ground');
    expect(e.message).toMatch(/no parts yet/);
  });

  it('a source shorted by a wire', () => {
    const e = fail(sheet([V('V1', 5), part('G', 'ground')], [wire('V1.pos', 'V1.neg'), wire('V1.neg', 'G.g')]));
    expect(e.code).toBe('voltage_source_loop');
    expect(e.message).toMatch(/short-circuited/);
  });

  it('a current source in series with nothing that can carry its current', () => {
    // I1 feeds a net where only a capacitor-like open (another current source) connects
    const s = sheet(
      [part('I1', 'dc_current_source', { current: 1e-3 }), part('I2', 'dc_current_source', { current: 2e-3 }), R('R1', 1000), part('G', 'ground')],
      [wire('I1.neg', 'G.g'), wire('I1.pos', 'I2.neg'), wire('I2.pos', 'R1.a'), wire('R1.b', 'G.g')],
    );
    const e = fail(s);
    expect(e.code).toBe('current_source_no_path');
    expect(e.parts).toContain('I1');
    expect(e.message).toMatch(/nothing there can carry it/);
  });

  it('a current source with an unconnected pin', () => {
    const s = sheet([part('I1', 'dc_current_source', { current: 1e-3 }), R('R1', 1000), part('G', 'ground')], [wire('I1.neg', 'G.g'), wire('R1.a', 'G.g'), wire('R1.b', 'I1.neg')]);
    const r = solveOperatingPoint(s);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('current_source_no_path');
    expect(r.error.parts).toEqual(['I1']);
    expect(r.warnings.map((w) => w.code)).toContain('unconnected_pin');
  });

  it('a part with an unconnected pin is a warning naming the part and pin', () => {
    const s = sheet(
      [V('V1', 5), part('RV1', 'potentiometer', { resistance: 10000 }), part('G', 'ground')],
      [wire('V1.pos', 'RV1.a'), wire('RV1.b', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const r = solveOk(s);
    const w = r.warnings.find((x) => x.code === 'unconnected_pin')!;
    expect(w).toMatchObject({ partId: 'RV1', severity: 'warning' });
    expect(w.message).toMatch(/Pin "w"/);
    expect(r.parts.RV1.warnings.map((x) => x.code)).toContain('unconnected_pin');
    expect(r.pins['RV1.w']).toBeCloseTo(2.5, 12);
  });

  it('a part with nothing connected is left out of the solve, with a warning', () => {
    const s = sheet([V('V1', 5), R('R1', 1000), R('R9', 1), part('G', 'ground')], [wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g')]);
    const r = solveOk(s);
    expect(r.warnings.find((w) => w.code === 'part_unconnected')?.partId).toBe('R9');
    expect(r.pins['R9.a']).toBeUndefined();
    expect(r.parts.R9.power).toBe(0);
  });
});

describe('impossible parameters', () => {
  it('negative resistance', () => {
    const e = fail(sheet([V('V1', 5), R('R2', -5), part('G', 'ground')], [wire('V1.pos', 'R2.a'), wire('R2.b', 'G.g'), wire('V1.neg', 'G.g')]));
    expect(e.code).toBe('invalid_sheet');
    expect(e.parts).toEqual(['R2']);
    expect(e.message).toContain('Part "R2" (resistor): field "resistance" must be a positive number (got -5)');
    expect(e.issues?.[0]).toMatchObject({ partId: 'R2', field: 'resistance' });
  });

  it('potentiometer position outside 0..1', () => {
    const e = fail(sheet([V('V1', 5), part('RV1', 'potentiometer', { resistance: 1000, position: 1.2 }), part('G', 'ground')], [wire('V1.pos', 'RV1.a'), wire('RV1.b', 'G.g'), wire('V1.neg', 'G.g')]));
    expect(e.code).toBe('invalid_sheet');
    expect(e.message).toContain('Part "RV1" (potentiometer): field "position" must be a number from 0 to 1 (got 1.2)');
  });

  it('a temperature coefficient that makes the resistance negative at the sheet temperature', () => {
    const e = fail(sheet([V('V1', 5), part('R1', 'resistor', { resistance: 100, tempco: -20000 }), part('G', 'ground')], [wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g')], { conditions: { temperatureC: 125 } }));
    expect(e.code).toBe('invalid_parameter');
    expect(e.parts).toEqual(['R1']);
    expect(e.message).toMatch(/field "tempco"/);
  });

  it('an LED whose series resistance eats its forward voltage', () => {
    const e = fail(sheet([V('V1', 5), part('D1', 'led', { seriesResistance: 200 }), part('G', 'ground')], [wire('V1.pos', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('V1.neg', 'G.g')]));
    expect(e.code).toBe('invalid_parameter');
    expect(e.message).toMatch(/seriesResistance/);
  });
});

describe('non-convergence', () => {
  it('stops within the iteration bound and names the parts still moving', () => {
    const s = sheet(
      [V('V1', 20), R('R1', 10), part('D1', 'diode'), part('Q1', 'npn'), R('R2', 1000), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('V1.neg', 'G.g'), wire('V1.pos', 'R2.a'), wire('R2.b', 'Q1.b'), wire('Q1.c', 'V1.pos'), wire('Q1.e', 'G.g')],
    );
    const e = fail(s, { maxIterations: 3, maxTotalIterations: 20 });
    expect(e.code).toBe('no_convergence');
    expect(e.message).toMatch(/did not converge within \d+ iterations/);
    expect(e.message).toMatch(/Still moving: /);
    expect(e.parts.length).toBeGreaterThan(0);
    expect(e.parts.every((p) => ['D1', 'Q1', 'R1', 'R2', 'V1'].includes(p))).toBe(true);
    expect(e.parts[0]).toMatch(/^(D1|Q1)$/);
    const n = Number(/within (\d+) iterations/.exec(e.message)![1]);
    expect(n).toBeLessThanOrEqual(20);
    // and with the default limits the same circuit solves
    expect(solveOk(s).iterations).toBeLessThan(100);
  });

  it('never throws, even for garbage', () => {
    for (const bad of [null, 42, 'x', [], {}, { format: 'tapline.sheet', version: 1, parts: 'no' }, { format: 'tapline.sheet', version: 1, parts: [{ id: 'R1', type: 'resistor', params: { resistance: Number.NaN } }] }]) {
      const r = solveOperatingPoint(bad);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.code).toBe('invalid_sheet');
    }
  });
});
