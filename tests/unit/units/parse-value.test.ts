import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseValue } from '../../../shared/units/parse-value';

const value = (text: string, unit?: Parameters<typeof parseValue>[1]) => {
  const r = parseValue(text, unit);
  if (!r.ok) throw new Error(`expected ${text} to parse: ${r.message}`);
  return r;
};
const message = (text: string, options?: Parameters<typeof parseValue>[1]) => {
  const r = parseValue(text, options);
  if (r.ok) throw new Error(`expected ${text} to be refused, got ${r.value}`);
  return r.message;
};

describe('RKM code (IEC 60062:2016 examples, references.md)', () => {
  it.each([
    ['R47', 0.47],
    ['4R7', 4.7],
    ['470R', 470],
    ['4K7', 4700],
    ['47K3', 47300],
    ['1M0', 1e6],
    ['2M2', 2.2e6],
  ])('%s = %d Ω', (text, ohms) => {
    expect(value(text, { unit: 'Ω' }).value).toBe(ohms);
  });

  it('reads L as milliohms and G, T as giga, tera (IEC 60062)', () => {
    expect(value('1L5').value).toBe(0.0015);
    expect(value('10L').value).toBe(0.01);
    expect(value('L47').value).toBe(0.00047);
    // A leading letter reads like R47: K47 is 0.47 kΩ.
    expect(value('K47').value).toBe(470);
    expect(value('4G7').value).toBe(4.7e9);
    expect(value('1T0').value).toBe(1e12);
  });

  it('reads the lower-case kilo and the R marker alone as ohms (common practice)', () => {
    expect(value('4k7').value).toBe(4700);
    expect(value('2R2').value).toBe(2.2);
    expect(value('2R2').unit).toBe('Ω');
    expect(value('100R').value).toBe(100);
    expect(value('10k').value).toBe(10000);
  });

  it.each([
    ['4K7B', 0.001],
    ['4K7C', 0.0025],
    ['4K7D', 0.005],
    ['4K7F', 0.01],
    ['4K7G', 0.02],
    ['4K7J', 0.05],
    ['4K7K', 0.1],
    ['4K7M', 0.2],
  ])('%s carries its tolerance letter (IEC 60062; F and K read, the rest from memory)', (text, t) => {
    const r = value(text);
    expect(r.value).toBe(4700);
    expect(r.tolerance).toBe(t);
  });

  it('reads K after the value as ±10 % and M as ±20 %, not as multipliers (IEC 60062)', () => {
    expect(value('10KK')).toMatchObject({ value: 10000, tolerance: 0.1 });
    expect(value('2M2M')).toMatchObject({ value: 2.2e6, tolerance: 0.2 });
    expect(value('470RJ')).toMatchObject({ value: 470, tolerance: 0.05 });
  });

  it('reads unit letters as the decimal point (3V3, common practice)', () => {
    expect(value('3V3', { unit: 'V' })).toMatchObject({ value: 3.3, unit: 'V' });
    expect(value('1A5').value).toBe(1.5);
  });
});

describe('engineering notation', () => {
  it.each([
    ['4.7 kΩ', 4700],
    ['4.7k', 4700],
    ['4.7K', 4700],
    ['4.7 k', 4700],
    ['4.7 k Ω', 4700],
    ['470m', 0.47],
    ['1e3', 1000],
    ['1E-3', 0.001],
    ['2.5e+3', 2500],
    ['4700', 4700],
    ['.5', 0.5],
    ['10 kohm', 10000],
    ['100 ohms', 100],
    ['4.7 kΩ', 4700], // ohm sign U+2126
    ['1.5 MΩ', 1.5e6],
    ['33R', 33],
  ])('%s = %d (in a resistance field)', (text, expected) => {
    expect(value(text, { unit: 'Ω' }).value).toBe(expected);
  });

  it('reads voltages, currents, powers, illuminance and temperature with their units', () => {
    expect(value('3.3V', { unit: 'V' })).toMatchObject({ value: 3.3, unit: 'V' });
    expect(value('10 µA', { unit: 'A' }).value).toBe(1e-5);
    expect(value('10 μA', { unit: 'A' }).value).toBe(1e-5); // Greek mu U+03BC
    expect(value('10uA', { unit: 'A' }).value).toBe(1e-5);
    expect(value('20 mA', { unit: 'A' }).value).toBe(0.02);
    expect(value('0.25 W', { unit: 'W' }).value).toBe(0.25);
    expect(value('250 mW', { unit: 'W' }).value).toBe(0.25);
    expect(value('100 lx', { unit: 'lx' }).value).toBe(100);
    expect(value('1.2 klux', { unit: 'lx' }).value).toBe(1200);
    expect(value('25 °C', { unit: '°C' }).value).toBe(25);
    expect(value('25℃', { unit: '°C' }).value).toBe(25);
    expect(value('25C', { unit: '°C' }).value).toBe(25);
  });

  it('accepts signs, Unicode minus and stray whitespace', () => {
    expect(value('-5 V', { unit: 'V' }).value).toBe(-5);
    expect(value('−12 V', { unit: 'V' }).value).toBe(-12); // U+2212
    expect(value('-40 °C', { unit: '°C' }).value).toBe(-40);
    expect(value('-2 mA', { unit: 'A' }).value).toBe(-0.002);
    expect(value('+5', { unit: 'V' }).value).toBe(5);
    expect(value('  4.7\u00a0k  ', { unit: 'Ω' }).value).toBe(4700);
    expect(Object.is(value('-0', { unit: 'V' }).value, -0)).toBe(false);
  });

  it('reads a written tolerance after the value', () => {
    expect(value('4.7 kΩ ±1 %')).toMatchObject({ value: 4700, tolerance: 0.01 });
    expect(value('4.7k +/-5%')).toMatchObject({ value: 4700, tolerance: 0.05 });
    expect(value('10k 0.1%')).toMatchObject({ value: 10000, tolerance: 0.001 });
  });
});

describe('refusals a user can act on', () => {
  it.each([
    ['4k7k', /two multiplier letters; write 4k7 or 4\.7k/],
    ['4.7kk', /two multiplier letters/],
    ['4R7k', /two multiplier letters; write 4R7 or 4\.7/],
    ['4k7j', /tolerance letters are upper case; write 4k7J/],
    ['4.7k7', /mixes a decimal point with an RKM letter/],
    ['4k7.5', /mixes a decimal point with an RKM letter/],
    ['1.2.3', /more than one decimal point/],
    ['4,7k', /decimal point, not a comma/],
    ['1 000', /space inside the number/],
    ['abc', /start with a number/],
    ['4x7', /'x' is not an RKM letter/],
    ['4.7q', /'q' is not a unit or multiplier/],
    ['1e3k', /both an exponent and a multiplier/],
    ['1e', /exponent after 'e' needs digits/],
    ['1e400', /too large/],
    ['1e-400', /too small/],
    ['', /Enter a value/],
    ['   ', /Enter a value/],
    ['-', /needs a number after the sign/],
    ['Infinity', /start with a number/],
    ['NaN', /start with a number/],
    ['2R2V', /R marks Ω but the unit says V/],
    ['4K7JQ', /'Q' after the tolerance letter J is not a unit/],
    ['4K7Z', /neither a tolerance letter/],
    ['4K7J ±5 %', /tolerance twice/],
    ['±5 %', /tolerance but no value/],
    ['4.7k ±150 %', /below 100 %/],
  ])('%s', (text, pattern) => {
    expect(message(text)).toMatch(pattern);
  });

  it('names the quantity when the unit does not fit the field', () => {
    expect(message('3.3V', { unit: 'Ω' })).toBe("'3.3V' is a voltage (V); this field takes a resistance (Ω)");
    expect(message('10 µA', { unit: 'V' })).toMatch(/is a current \(A\); this field takes a voltage \(V\)/);
    expect(message('3V3', { unit: 'Ω' })).toMatch(/voltage/);
  });

  it('refuses negative resistances, powers and illuminance, but not when asked to allow them', () => {
    expect(message('-4k7', { unit: 'Ω' })).toMatch(/resistance cannot be negative here; remove the minus sign/);
    expect(message('-1 W', { unit: 'W' })).toMatch(/power cannot be negative/);
    expect(value('-4k7').value).toBe(-4700); // no unit known: a sign is allowed
    expect(value('-4k7', { unit: 'Ω', allowNegative: true }).value).toBe(-4700);
  });

  it('never throws and always explains a refusal, whatever is typed', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 12 }), (text) => {
        const r = parseValue(text, { unit: 'Ω' });
        if (r.ok) expect(Number.isFinite(r.value)).toBe(true);
        else expect(r.message.length).toBeGreaterThan(10);
      }),
      { numRuns: 2000 },
    );
  });
});
