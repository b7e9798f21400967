// Editor-side cautions: supplies above the ELV limit and LEDs without current limiting.
import { describe, expect, it } from 'vitest';
import { parseSheet, type SheetInput } from '../../../shared/sheet';
import { ELV_DC_LIMIT_V, elvCautions, ledLimitCautions } from '../../../src/editor/solve/safetyChecks';

function sheet(parts: SheetInput['parts'], wires: Array<[string, string]>) {
  const r = parseSheet({ format: 'tapline.sheet', version: 1, parts, wires: wires.map(([from, to]) => ({ from, to })) });
  if (!r.ok) throw new Error(r.error.message);
  return r.sheet;
}

describe('ELV caution', () => {
  it('marks a supply above 60 V DC (common practice for ELV/SELV DC limits) and not one at 60 V', () => {
    expect(ELV_DC_LIMIT_V).toBe(60);
    const at = sheet([{ id: 'V1', type: 'dc_voltage_source', params: { voltage: 60 } }], []);
    expect(elvCautions(at, null)).toEqual([]);
    const above = sheet([{ id: 'V1', type: 'dc_voltage_source', params: { voltage: 48, max: 72 } }], []);
    const c = elvCautions(above, null);
    expect(c).toHaveLength(1);
    expect(c[0]).toMatchObject({ code: 'supply_above_elv', partId: 'V1', severity: 'danger' });
    expect(c[0].message).toMatch(/local electrical codes/);
  });
});

describe('LED current limiting', () => {
  const led = { id: 'D1', type: 'led' as const };
  const v = { id: 'V1', type: 'dc_voltage_source' as const, params: { voltage: 5 } };
  const g = { id: 'GND1', type: 'ground' as const };

  it('flags an LED straight across a supply', () => {
    const s = sheet([v, led, g], [['V1.pos', 'D1.anode'], ['D1.cathode', 'GND1.g'], ['V1.neg', 'GND1.g']]);
    expect(ledLimitCautions(s).map((w) => w.partId)).toEqual(['D1']);
  });

  it('flags a chain of LEDs across a supply', () => {
    const s = sheet(
      [v, led, { id: 'D2', type: 'led' }, g],
      [['V1.pos', 'D1.anode'], ['D1.cathode', 'D2.anode'], ['D2.cathode', 'GND1.g'], ['V1.neg', 'GND1.g']],
    );
    expect(ledLimitCautions(s).map((w) => w.partId)).toEqual(['D1', 'D2']);
  });

  it('accepts an LED with a series resistor on either side', () => {
    const r = { id: 'R1', type: 'resistor' as const, params: { resistance: 150 } };
    const s = sheet([v, r, led, g], [['V1.pos', 'R1.a'], ['R1.b', 'D1.anode'], ['D1.cathode', 'GND1.g'], ['V1.neg', 'GND1.g']]);
    expect(ledLimitCautions(s)).toEqual([]);
    const low = sheet([v, r, led, g], [['V1.pos', 'D1.anode'], ['D1.cathode', 'R1.a'], ['R1.b', 'GND1.g'], ['V1.neg', 'GND1.g']]);
    expect(ledLimitCautions(low)).toEqual([]);
  });

  it('does not flag an LED fed from a current source or one left unconnected', () => {
    const i = { id: 'I1', type: 'dc_current_source' as const, params: { current: 0.01 } };
    expect(ledLimitCautions(sheet([i, led, g], [['I1.pos', 'D1.anode'], ['D1.cathode', 'GND1.g'], ['I1.neg', 'GND1.g']]))).toEqual([]);
    expect(ledLimitCautions(sheet([v, led, g], [['V1.pos', 'D1.anode'], ['V1.neg', 'GND1.g']]))).toEqual([]);
  });
});
