// Operating-point warnings: power ratings (and the 50 % derating caution), LED, Zener and diode
// currents, transistor saturation and cut-off.
import { describe, expect, it } from 'vitest';
import { part, sheet, wire } from '../../support/reference/sheets';
import { solveOk } from './helpers';

const codes = (r: ReturnType<typeof solveOk>, id: string) => r.parts[id].warnings.map((w) => `${w.severity}:${w.code}`);

function resistorAcross(v: number, r: number, rating?: number) {
  return sheet(
    [part('V1', 'dc_voltage_source', { voltage: v }), part('R1', 'resistor', { resistance: r, ...(rating ? { powerRating: rating } : {}) }), part('G', 'ground')],
    [wire('V1.pos', 'R1.a'), wire('R1.b', 'G.g'), wire('V1.neg', 'G.g')],
  );
}

describe('resistor and potentiometer power', () => {
  it('danger above the rating, caution above 50 %, nothing below', () => {
    expect(codes(solveOk(resistorAcross(10, 100)), 'R1')).toEqual(['danger:power_over_rating']); // 1 W in a 0.25 W part
    expect(codes(solveOk(resistorAcross(6, 100, 0.5)), 'R1')).toEqual(['caution:power_above_derating']); // 0.36 W of 0.5 W
  });
  it('the 50 % band', () => {
    expect(codes(solveOk(resistorAcross(4, 100)), 'R1')).toEqual(['caution:power_above_derating']); // 0.16 W of 0.25 W
    expect(codes(solveOk(resistorAcross(3, 100)), 'R1')).toEqual([]); // 0.09 W
    const r = solveOk(resistorAcross(10, 100));
    expect(r.warnings[0]).toMatchObject({ partId: 'R1', code: 'power_over_rating' });
    expect(r.warnings[0].message).toMatch(/1 W, above its 250 mW rating/);
  });
  it('a potentiometer section carrying the current is checked against its share of the track', () => {
    // 10 V across the a–w section only (w tied to ground, b open): 1 kΩ pot at 0.1 → 100 Ω section, 1 W
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 10 }), part('RV1', 'potentiometer', { resistance: 1000, position: 0.1, powerRating: 2 }), part('G', 'ground')],
      [wire('V1.pos', 'RV1.a'), wire('RV1.w', 'G.g'), wire('RV1.b', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const r = solveOk(s);
    // total 1.11 W is within 2 W, but the 100 Ω section may only take 10 % of 2 W
    expect(codes(r, 'RV1')).toContain('danger:power_over_rating');
    expect(r.parts.RV1.warnings.find((w) => w.code === 'power_over_rating')!.message).toMatch(/a–w section/);
  });
});

describe('semiconductor warnings', () => {
  it('LED above its maximum current', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 5 }), part('R1', 'resistor', { resistance: 47, powerRating: 1 }), part('D1', 'led', { maxCurrent: 0.03 }), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const r = solveOk(s);
    expect(codes(r, 'D1')).toEqual(['danger:led_over_current']);
    expect(r.parts.D1.warnings[0].message).toMatch(/Increase its series resistor/);
    // with 150 Ω it is fine
    const ok = solveOk(sheet([part('V1', 'dc_voltage_source', { voltage: 5 }), part('R1', 'resistor', { resistance: 150 }), part('D1', 'led'), part('G', 'ground')], [wire('V1.pos', 'R1.a'), wire('R1.b', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('V1.neg', 'G.g')]));
    expect(ok.parts.D1.warnings).toEqual([]);
    expect(ok.parts.D1.pinCurrents.anode).toBeGreaterThan(0.015);
    expect(ok.parts.D1.pinCurrents.anode).toBeLessThan(0.021);
  });

  it('LED reverse voltage', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 12 }), part('R1', 'resistor', { resistance: 1000 }), part('D1', 'led'), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'D1.cathode'), wire('D1.anode', 'G.g'), wire('V1.neg', 'G.g')],
    );
    expect(codes(solveOk(s), 'D1')).toContain('warning:led_reverse_voltage');
  });

  it('Zener above its power rating, and the 50 % caution', () => {
    const mk = (r: number) =>
      sheet(
        [part('V1', 'dc_voltage_source', { voltage: 24 }), part('R1', 'resistor', { resistance: r, powerRating: 10 }), part('DZ1', 'zener', { zenerVoltage: 5.1, powerRating: 0.5 }), part('G', 'ground')],
        [wire('V1.pos', 'R1.a'), wire('R1.b', 'DZ1.cathode'), wire('DZ1.anode', 'G.g'), wire('V1.neg', 'G.g')],
      );
    expect(codes(solveOk(mk(100)), 'DZ1')).toEqual(['danger:power_over_rating']); // ~190 mA × 5.1 V ≈ 1 W
    expect(codes(solveOk(mk(300)), 'DZ1')).toEqual(['caution:power_above_derating']); // ~63 mA ≈ 0.32 W
    expect(codes(solveOk(mk(2000)), 'DZ1')).toEqual([]);
    const r = solveOk(mk(2000));
    expect(r.parts.DZ1.derived?.region).toBe('breakdown');
    // reverse voltage at 9.45 mA: V_Z + r_Z·I_ZT·ln(I/I_ZT) with the exponential breakdown model
    expect(r.pins['DZ1.cathode']).toBeGreaterThan(5.1);
    expect(r.pins['DZ1.cathode']).toBeLessThan(5.2);
  });

  it('a Zener starved below its knee', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 6 }), part('R1', 'resistor', { resistance: 10000 }), part('DZ1', 'zener', { zenerVoltage: 5.1 }), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'DZ1.cathode'), wire('DZ1.anode', 'G.g'), wire('V1.neg', 'G.g')],
    );
    expect(codes(solveOk(s), 'DZ1')).toEqual(['caution:zener_below_knee']);
  });

  it('a diode beyond a sensible current', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 5 }), part('R1', 'resistor', { resistance: 1, powerRating: 100 }), part('D1', 'diode', { maxCurrent: 1 }), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('V1.neg', 'G.g')],
    );
    expect(codes(solveOk(s), 'D1')).toEqual(['warning:diode_over_current']);
  });

  it('transistor saturation and cut-off are cautions, forward-active is quiet', () => {
    const mk = (vb: number, rb: number) =>
      sheet(
        [
          part('V1', 'dc_voltage_source', { voltage: 5 }),
          part('VB', 'dc_voltage_source', { voltage: vb }),
          part('RB', 'resistor', { resistance: rb }),
          part('RC', 'resistor', { resistance: 1000 }),
          part('Q1', 'npn', { beta: 100 }),
          part('G', 'ground'),
        ],
        [wire('V1.pos', 'RC.a'), wire('RC.b', 'Q1.c'), wire('VB.pos', 'RB.a'), wire('RB.b', 'Q1.b'), wire('Q1.e', 'G.g'), wire('V1.neg', 'G.g'), wire('VB.neg', 'G.g')],
      );
    const sat = solveOk(mk(5, 4700));
    expect(codes(sat, 'Q1')).toEqual(['caution:transistor_saturated']);
    expect(sat.parts.Q1.derived?.region).toBe('saturation');
    expect(sat.parts.Q1.warnings[0].message).toMatch(/V_CE = /);
    const off = solveOk(mk(0.2, 4700));
    expect(codes(off, 'Q1')).toEqual(['caution:transistor_cutoff']);
    const lin = solveOk(mk(1, 100000));
    expect(codes(lin, 'Q1')).toEqual([]);
    expect(lin.parts.Q1.derived?.region).toBe('forward-active');
  });

  it('constant-power load under-voltage', () => {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 5, internalResistance: 10 }), part('RL1', 'load', { mode: 'power', value: 2 }), part('G', 'ground')],
      [wire('V1.pos', 'RL1.pos'), wire('RL1.neg', 'G.g'), wire('V1.neg', 'G.g')],
    );
    const r = solveOk(s);
    expect(codes(r, 'RL1')).toEqual(['warning:load_undervoltage']);
  });
});
