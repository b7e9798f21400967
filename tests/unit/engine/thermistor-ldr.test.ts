// NTC thermistor values against the β equation and the Steinhart & Hart equation (Steinhart &
// Hart, "Calibration curves for thermistors", Deep-Sea Research 15(4), 497–503, 1968), and the
// LDR against the datasheet convention R(E) = R₁₀·(E/10 lx)^(−γ) (references.md).
import { describe, expect, it } from 'vitest';
import { betaResistance, steinhartHartResistance, steinhartHartTemperature } from '../../support/reference/thermistor';
import { part, sheet, wire } from '../../support/reference/sheets';
import { expectRel, solveOk } from './helpers';

/** The NTC's resistance as the solver sees it: V/I across it in a divider. */
function measuredResistance(params: Record<string, unknown>, temperatureC: number): number {
  const s = sheet(
    [part('V1', 'dc_voltage_source', { voltage: 1 }), part('R1', 'resistor', { resistance: 10000 }), part('TH1', 'ntc', params), part('G', 'ground')],
    [wire('V1.pos', 'R1.a'), wire('R1.b', 'TH1.a'), wire('TH1.b', 'G.g'), wire('V1.neg', 'G.g')],
    { conditions: { temperatureC } },
  );
  const r = solveOk(s);
  return (r.pins['TH1.a'] - r.pins['TH1.b']) / r.parts.TH1.pinCurrents.a;
}

describe('NTC thermistor', () => {
  it('β equation over −40 … 125 °C (to 1e-9 relative)', () => {
    for (const tC of [-40, -10, 0, 25, 37, 60, 85, 125]) {
      const expected = betaResistance(10000, 298.15, 3950, tC + 273.15);
      expectRel(measuredResistance({ nominalResistance: 10000, beta: 3950 }, tC), expected, 1e-9);
    }
    // another nominal point: 4.7 kΩ at 50 °C, B = 3435 K
    expectRel(measuredResistance({ nominalResistance: 4700, nominalTemperatureC: 50, beta: 3435 }, 0), betaResistance(4700, 323.15, 3435, 273.15), 1e-9);
  });

  it('Steinhart–Hart coefficients are used instead of β when present (to 1e-9 relative)', () => {
    const sh = { a: 1.129148e-3, b: 2.34125e-4, c: 8.76741e-8 };
    for (const tC of [-20, 0, 25, 50, 100]) {
      const expected = steinhartHartResistance(sh.a, sh.b, sh.c, tC + 273.15);
      expectRel(measuredResistance({ beta: 1, steinhartHart: sh }, tC), expected, 1e-9);
    }
  });

  it('references.md: the commonly published 10 kΩ set gives 25.00 °C at 10 kΩ; the other set 24.68 °C', () => {
    expect(steinhartHartTemperature(1.129148e-3, 2.34125e-4, 8.76741e-8, 10000) - 273.15).toBeCloseTo(25.0, 2);
    expectRel(measuredResistance({ steinhartHart: { a: 1.129148e-3, b: 2.34125e-4, c: 8.76741e-8 } }, 25), 10000, 2e-3);
  });

  it('a part-level temperatureC overrides the sheet conditions', () => {
    expectRel(measuredResistance({ temperatureC: 0 }, 80), betaResistance(10000, 298.15, 3950, 273.15), 1e-9);
  });
});

describe('LDR', () => {
  function ldr(params: Record<string, unknown>, lux: number) {
    const s = sheet(
      [part('V1', 'dc_voltage_source', { voltage: 1 }), part('R1', 'resistor', { resistance: 10000 }), part('LDR1', 'ldr', params), part('G', 'ground')],
      [wire('V1.pos', 'R1.a'), wire('R1.b', 'LDR1.a'), wire('LDR1.b', 'G.g'), wire('V1.neg', 'G.g')],
      { conditions: { illuminanceLux: lux } },
    );
    const r = solveOk(s);
    return (r.pins['LDR1.a'] - r.pins['LDR1.b']) / r.parts.LDR1.pinCurrents.a;
  }
  it('R = R₁₀·(E/10)^(−γ), γ = log₁₀(R₁₀/R₁₀₀), capped by the dark resistance', () => {
    const p = { resistanceAt10Lux: 20000, gamma: 0.8, darkResistance: 2e6 };
    for (const lux of [1, 10, 100, 1000]) expectRel(ldr(p, lux), Math.min(2e6, 20000 * Math.pow(lux / 10, -0.8)), 1e-9);
    expectRel(Math.log10(ldr(p, 10) / ldr(p, 100)), 0.8, 1e-9);
    expectRel(ldr(p, 0), 2e6, 1e-9);
    expectRel(ldr(p, 0.001), 2e6, 1e-9);
  });
});
