import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { allPreferredValues, preferredValuesBetween } from '../../../shared/units/eseries';
import { formatEng, formatRkm, formatTolerance, formatValue } from '../../../shared/units/format';
import { parseValue } from '../../../shared/units/parse-value';

const parsed = (text: string) => {
  const r = parseValue(text);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

describe('formatRkm (IEC 60062:2016 spellings, references.md)', () => {
  it.each([
    [0.47, 'R47'],
    [4.7, '4R7'],
    [470, '470R'],
    [4700, '4K7'],
    [47300, '47K3'],
    [1e6, '1M0'],
    [2.2e6, '2M2'],
  ])('%d Ω → %s', (ohms, text) => {
    expect(formatRkm(ohms)).toBe(text);
  });

  it('writes the other decades, zero-ohm links and the lower-case kilo style', () => {
    expect(formatRkm(0.0047)).toBe('4L7');
    expect(formatRkm(0.1)).toBe('R10');
    expect(formatRkm(1)).toBe('1R0');
    expect(formatRkm(10)).toBe('10R');
    expect(formatRkm(1020)).toBe('1K02');
    expect(formatRkm(100000)).toBe('100K');
    expect(formatRkm(1e12)).toBe('1T0');
    expect(formatRkm(0)).toBe('0R');
    expect(formatRkm(4700, { style: 'lower' })).toBe('4k7');
    expect(formatRkm(4.7e6, { style: 'lower' })).toBe('4M7');
    expect(formatRkm(4700, { tolerance: 0.05 })).toBe('4K7J');
    expect(formatRkm(4700, { tolerance: 0.03 })).toBe('4K7'); // ±3 % has no letter
    expect(formatRkm(4711, { digits: 2 })).toBe('4K7');
    expect(() => formatRkm(-1)).toThrow(RangeError);
  });
});

describe('formatEng', () => {
  it('uses SI prefixes, the micro sign and a space before the unit (SI Brochure writing rules)', () => {
    expect(formatEng(4700, 'Ω')).toBe('4.7 kΩ');
    expect(formatEng(4700, 'Ω', { trimZeros: false })).toBe('4.70 kΩ');
    expect(formatEng(1e-5, 'A')).toBe('10 µA');
    expect(formatEng(1e-5, 'A').includes('\u00b5')).toBe(true);
    expect(formatEng(3.3, 'V')).toBe('3.3 V');
    expect(formatEng(-12, 'V')).toBe('-12 V');
    expect(formatEng(0.25, 'W')).toBe('250 mW');
    expect(formatEng(1200, 'lx')).toBe('1.2 klx');
    expect(formatEng(0, 'V')).toBe('0 V');
    expect(formatEng(4700, '')).toBe('4.7k');
  });

  it('rounds to the requested significant figures, carrying into the next prefix', () => {
    expect(formatEng(3.24324324324, 'V', { digits: 4 })).toBe('3.243 V');
    expect(formatEng(999.7, 'V')).toBe('1 kV');
    expect(formatEng(999.4, 'V')).toBe('999 V');
    expect(formatEng(0.047, 'Ω')).toBe('47 mΩ');
  });

  it('never prefixes °C and falls back to e-notation beyond f…T', () => {
    expect(formatEng(25, '°C')).toBe('25 °C');
    expect(formatEng(-40, '°C')).toBe('-40 °C');
    expect(formatEng(1234.5, '°C')).toBe('1230 °C');
    expect(formatEng(1.5e15, 'Ω')).toBe('1.5e15 Ω');
    expect(formatEng(2e-18, 'A')).toBe('2e-18 A');
  });

  it('formats tolerances and picks a notation', () => {
    expect(formatTolerance(0.05)).toBe('±5 %');
    expect(formatTolerance(0.001)).toBe('±0.1 %');
    expect(formatTolerance(0.0025)).toBe('±0.25 %');
    expect(formatValue(4700, 'Ω', { notation: 'rkm', tolerance: 0.01 })).toBe('4K7F');
    expect(formatValue(4700, 'Ω', { tolerance: 0.01 })).toBe('4.7 kΩ ±1 %');
  });
});

describe('round trips', () => {
  // references.md: round-trip every E24 and E96 value from 0.1 Ω to 10 MΩ.
  for (const series of ['E24', 'E96'] as const) {
    const values = preferredValuesBetween(series, 0.1, 10e6);
    it(`every ${series} value from 0.1 Ω to 10 MΩ (${values.length} values) survives RKM and engineering notation`, () => {
      expect(values.length).toBe(series === 'E24' ? 8 * 24 + 1 : 8 * 96 + 1);
      for (const v of values) {
        expect(parsed(formatRkm(v))).toBe(v);
        expect(parsed(formatRkm(v, { style: 'lower' }))).toBe(v);
        expect(parsed(formatEng(v, 'Ω'))).toBe(v);
        expect(parsed(formatEng(v, ''))).toBe(v);
      }
    });
  }

  it('keeps tolerance letters through a round trip', () => {
    for (const t of [0.001, 0.0025, 0.005, 0.01, 0.02, 0.05, 0.1, 0.2]) {
      const r = parseValue(formatRkm(4700, { tolerance: t }));
      expect(r).toEqual({ ok: true, value: 4700, tolerance: t });
    }
  });

  it('round-trips E192 values over all fifteen decades in RKM form', () => {
    for (const v of allPreferredValues('E192')) expect(parsed(formatRkm(v))).toBe(v);
  });

  it('round-trips any double exactly at 17 significant figures', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e20, max: 1e20, noNaN: true, noDefaultInfinity: true }), (v) => {
        expect(parsed(formatEng(v, 'V', { digits: 17 }))).toBe(v === 0 ? 0 : v);
        if (v >= 0) expect(parsed(formatRkm(v, { digits: 17 }))).toBe(v === 0 ? 0 : v);
      }),
      { numRuns: 3000 },
    );
  });
});
