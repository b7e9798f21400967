// Property fields read engineering and RKM notation (IEC 60062 RKM code) and show units.
import { describe, expect, it } from 'vitest';
import { partSpecs } from '../../../shared/parts/specs';
import { formatAmps, formatParamValue, formatVolts, parseParamText } from '../../../src/editor/format/values';

const info = (type: keyof typeof partSpecs, name: string) => partSpecs[type].params.find((p) => p.name === name)!;

describe('param fields', () => {
  it('read RKM and engineering forms of 4.7 kΩ alike (IEC 60062: the letter stands for the decimal point)', () => {
    const r = info('resistor', 'resistance');
    for (const text of ['4k7', '4K7', '4.7k', '4.7 kΩ', '4700']) expect(parseParamText(r, text)).toMatchObject({ ok: true, value: 4700 });
    expect(parseParamText(r, 'R47')).toMatchObject({ ok: true, value: 0.47 });
    // IEC 60062 tolerance letter J = ±5 %
    expect(parseParamText(r, '4K7J')).toEqual({ ok: true, value: 4700, tolerance: 0.05 });
  });

  it('explain bad input: a wrong unit, a negative resistance, nonsense', () => {
    const r = info('resistor', 'resistance');
    const wrongUnit = parseParamText(r, '3.3V');
    expect(wrongUnit.ok).toBe(false);
    expect(!wrongUnit.ok && wrongUnit.message).toMatch(/resistance|Ω/);
    expect(parseParamText(r, '-10k').ok).toBe(false);
    expect(parseParamText(r, 'abc').ok).toBe(false);
    expect(parseParamText(r, '0')).toMatchObject({ ok: false });
  });

  it('show and read tolerances in percent', () => {
    const t = info('resistor', 'tolerance');
    expect(formatParamValue(t, 0.01)).toBe('1');
    expect(parseParamText(t, '5')).toEqual({ ok: true, value: 0.05 });
    expect(parseParamText(t, '±0.1 %')).toEqual({ ok: true, value: 0.001 });
  });

  it('accept the unit typed after params the shared parser has no unit for', () => {
    expect(parseParamText(info('ntc', 'beta'), '3950 K')).toEqual({ ok: true, value: 3950 });
    expect(parseParamText(info('resistor', 'tempco'), '-100 ppm/K')).toEqual({ ok: true, value: -100 });
  });

  it('print readings with four significant figures', () => {
    expect(formatVolts(3.243243243)).toBe('3.243 V');
    expect(formatAmps(0.000324324)).toBe('324.3 µA');
    expect(formatVolts(-1e-15)).toBe('0 V');
  });
});

import { readingsCsv } from '../../../src/editor/panels/readingsRows';
describe('readings export', () => {
  it('writes SI values with the unit in the header, parsable by an independent CSV reader (papaparse)', async () => {
    const csv = readingsCsv('nets', [{ net: 'tap', voltage: 3.2432432432, pins: 'R1.b R2.a' }]);
    expect(csv.split('\n')[0]).toBe('net,voltage_V,pins');
    const Papa = (await import('papaparse')).default;
    const back = Papa.parse<Record<string, string>>(csv, { header: true });
    expect(Number(back.data[0].voltage_V)).toBeCloseTo(3.2432432432, 10);
  });
});
