// The property form model: field texts, inline messages, and what a commit writes.
import { describe, expect, it } from 'vitest';
import { commitField, formSchema, formValues } from '../../../src/editor/panels/paramFormModel';

describe('property form model', () => {
  it('shows a resistor\'s params as field texts', () => {
    const v = formValues('resistor', { resistance: 4700, tolerance: 0.05, powerRating: 0.25, tempco: 0 });
    expect(v).toMatchObject({ resistance: '4.7k', tolerance: '5', powerRating: '250m' });
  });

  it('explains a bad value inline and accepts a good one', () => {
    const schema = formSchema('resistor');
    const base = formValues('resistor', { resistance: 4700, tolerance: 0.05, powerRating: 0.25, tempco: 0 });
    const bad = schema.safeParse({ ...base, resistance: '4k7k' });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(['resistance']);
    expect(bad.error?.issues[0].message.length).toBeGreaterThan(5);
    expect(schema.safeParse({ ...base, resistance: '2M2' }).success).toBe(true);
  });

  it('writes the tolerance along with a value typed with its RKM tolerance letter (IEC 60062: F = ±1 %)', () => {
    expect(commitField('resistor', 'resistance', '10K0F')).toEqual({ ok: true, values: { resistance: 10_000, tolerance: 0.01 } });
  });

  it('removes an optional param left empty, and refuses an empty required one', () => {
    expect(commitField('dc_voltage_source', 'max', '  ')).toEqual({ ok: true, values: { max: undefined } });
    expect(commitField('dc_voltage_source', 'voltage', '').ok).toBe(false);
  });

  it('reads a net label name and a switch state', () => {
    expect(commitField('net_label', 'name', ' adc_in ')).toEqual({ ok: true, values: { name: 'adc_in' } });
    expect(commitField('switch', 'closed', false)).toEqual({ ok: true, values: { closed: false } });
  });
});
