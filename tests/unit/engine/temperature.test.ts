// Temperature dependence: none at 25 °C; the standard saturation-current scaling for junctions;
// linear tempco for resistors, LED forward voltage and Zener voltage.
import { describe, expect, it } from 'vitest';
import { BOLTZMANN, ELEMENTARY_CHARGE, thermalVoltage } from '../../../shared/engine';
import { T25, vt } from '../../support/reference/constants';
import { diodeSeriesCurrent } from '../../support/reference/lambert-w';
import { part, sheet, wire } from '../../support/reference/sheets';
import { expectRel, solveOk } from './helpers';

const diodeSheet = (tC: number, params: Record<string, unknown> = {}) =>
  sheet(
    [part('V1', 'dc_voltage_source', { voltage: 5 }), part('R1', 'resistor', { resistance: 1000 }), part('D1', 'diode', params), part('G', 'ground')],
    [wire('V1.pos', 'R1.a'), wire('R1.b', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('V1.neg', 'G.g')],
    { conditions: { temperatureC: tC } },
  );

describe('temperature', () => {
  it('thermal voltage from the exact SI constants (references.md: V_T(298.15 K) = 0.0256925791210858 V)', () => {
    expectRel(vt(T25), 0.0256925791210858, 1e-14);
    expectRel(thermalVoltage(298.15), 0.0256925791210858, 1e-14);
    expect(BOLTZMANN).toBe(1.380649e-23);
    expect(ELEMENTARY_CHARGE).toBe(1.602176634e-19);
  });

  it('a diode at 85 °C: I_S(T) = I_S·(T/T₀)^(XTI/n)·exp((T/T₀ − 1)·E_g/(n·V_T)), V_T at T', () => {
    const T = 85 + 273.15;
    const is = 1e-14 * Math.pow(T / T25, 3) * Math.exp((T / T25 - 1) * (1.11 / vt(T)));
    const r = solveOk(diodeSheet(85));
    expectRel(r.parts.D1.pinCurrents.anode, diodeSeriesCurrent(5, 1000, is, vt(T)), 1e-7);
    // forward voltage falls by roughly 2 mV/K
    const v25 = solveOk(diodeSheet(25)).pins['D1.anode'];
    const slope = (r.pins['D1.anode'] - v25) / 60;
    expect(slope).toBeLessThan(-1.5e-3);
    expect(slope).toBeGreaterThan(-2.5e-3);
  });

  it("a part's own temperatureC wins over the sheet's", () => {
    const a = solveOk(diodeSheet(25, { temperatureC: 85 }));
    const b = solveOk(diodeSheet(85));
    expect(a.pins['D1.anode']).toBe(b.pins['D1.anode']);
  });

  it('resistor tempco: R(T) = R·(1 + α·(T − 25))', () => {
    const s = sheet(
      [part('I1', 'dc_current_source', { current: 1e-3 }), part('R1', 'resistor', { resistance: 1000, tempco: 100 }), part('G', 'ground')],
      [wire('I1.pos', 'R1.a'), wire('R1.b', 'G.g'), wire('I1.neg', 'G.g')],
      { conditions: { temperatureC: 125 } },
    );
    expectRel(solveOk(s).pins['R1.a'], 1e-3 * 1000 * (1 + 100e-6 * 100), 1e-12);
  });

  it('LED forward voltage moves by its tempco at the test current', () => {
    const mk = (tC: number) =>
      sheet(
        [part('I1', 'dc_current_source', { current: 0.02 }), part('D1', 'led', { forwardVoltage: 2.0, forwardVoltageTempco: -0.002 }), part('G', 'ground')],
        [wire('I1.pos', 'D1.anode'), wire('D1.cathode', 'G.g'), wire('I1.neg', 'G.g')],
        { conditions: { temperatureC: tC } },
      );
    expectRel(solveOk(mk(25)).pins['D1.anode'], 2.0, 1e-9);
    expectRel(solveOk(mk(75)).pins['D1.anode'], 1.9, 1e-9);
  });

  it('Zener voltage at its test current, and its tempco', () => {
    const mk = (tC: number) =>
      sheet(
        [part('I1', 'dc_current_source', { current: 0.005 }), part('DZ1', 'zener', { zenerVoltage: 6.8, zenerResistance: 20, zenerTempco: 0.003 }), part('G', 'ground')],
        [wire('I1.pos', 'DZ1.cathode'), wire('DZ1.anode', 'G.g'), wire('I1.neg', 'G.g')],
        { conditions: { temperatureC: tC } },
      );
    // at exactly the test current the reverse voltage is V_Z (the e^{−V_Z/a} term is 1e-30 here)
    expectRel(solveOk(mk(25)).pins['DZ1.cathode'], 6.8, 1e-9);
    expectRel(solveOk(mk(45)).pins['DZ1.cathode'], 6.86, 1e-9);
  });

  it('Zener dynamic resistance at the test current is zenerResistance', () => {
    const v = (i: number) =>
      solveOk(
        sheet(
          [part('I1', 'dc_current_source', { current: i }), part('DZ1', 'zener', { zenerVoltage: 6.8, zenerResistance: 20 }), part('G', 'ground')],
          [wire('I1.pos', 'DZ1.cathode'), wire('DZ1.anode', 'G.g'), wire('I1.neg', 'G.g')],
        ),
      ).pins['DZ1.cathode'];
    const h = 1e-6;
    expectRel((v(0.005 + h) - v(0.005 - h)) / (2 * h), 20, 1e-5);
  });
});
