// Sheet format v1 (shared/contracts/sheet-format.md): schema, defaults, and messages that name the
// part and the field.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { partCatalog, PART_TYPES } from '../../../shared/parts';
import { nextPartId, parseSheet, parseSheetJson, SheetSchema } from '../../../shared/sheet';

const base = { format: 'tapline.sheet', version: 1 };

function issuesOf(input: unknown) {
  const r = parseSheet(input);
  if (r.ok) throw new Error('expected an invalid sheet');
  expect(r.error.code).toBe('invalid_sheet');
  return r.error;
}

describe('parseSheet', () => {
  it('fills in the documented defaults', () => {
    const r = parseSheet({
      ...base,
      parts: [
        { id: 'R1', type: 'resistor', params: { resistance: 1000 } },
        { id: 'RV1', type: 'potentiometer', params: { resistance: 10000 } },
        { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5 } },
        { id: 'D1', type: 'diode' },
        { id: 'DZ1', type: 'zener', params: { zenerVoltage: 5.1 } },
        { id: 'D2', type: 'led' },
        { id: 'Q1', type: 'npn' },
        { id: 'TH1', type: 'ntc' },
        { id: 'LDR1', type: 'ldr' },
        { id: 'S1', type: 'switch' },
      ],
    });
    if (!r.ok) throw new Error(r.error.message);
    const p = Object.fromEntries(r.sheet.parts.map((x) => [x.id, x.params as Record<string, unknown>]));
    expect(r.sheet.conditions).toEqual({ temperatureC: 25, illuminanceLux: 100 });
    expect(r.sheet.wires).toEqual([]);
    expect(p.R1).toMatchObject({ tolerance: 0.01, powerRating: 0.25, tempco: 0 });
    expect(p.RV1).toMatchObject({ position: 0.5, taper: 'linear', tolerance: 0.2, powerRating: 0.5 });
    expect(p.V1).toMatchObject({ internalResistance: 0 });
    expect(p.V1.min).toBeUndefined();
    expect(p.D1).toMatchObject({ saturationCurrent: 1e-14, emissionCoefficient: 1, seriesResistance: 0 });
    expect(p.D1.breakdownVoltage).toBeUndefined();
    expect(p.DZ1).toMatchObject({ testCurrent: 0.005, zenerResistance: 10 });
    expect(p.D2).toMatchObject({ forwardVoltage: 2.0, testCurrent: 0.02, emissionCoefficient: 2, maxCurrent: 0.03 });
    expect(p.Q1).toMatchObject({ beta: 100, reverseBeta: 1, saturationCurrent: 1e-14 });
    expect(p.TH1).toMatchObject({ nominalResistance: 10000, nominalTemperatureC: 25, beta: 3950 });
    expect(p.LDR1).toMatchObject({ resistanceAt10Lux: 10000, gamma: 0.7, darkResistance: 1e6 });
    expect(p.S1).toMatchObject({ closed: true, onResistance: 0.01, offResistance: 1e9 });
  });

  it('keeps unknown fields (forward compatibility) and layout', () => {
    const r = parseSheet({ ...base, future: { x: 1 }, parts: [{ id: 'R1', type: 'resistor', params: { resistance: 1, newParam: 3 }, position: { x: 1, y: 2 }, rotation: 90, color: 'red' }] });
    if (!r.ok) throw new Error(r.error.message);
    expect((r.sheet as Record<string, unknown>).future).toEqual({ x: 1 });
    expect(r.sheet.parts[0]).toMatchObject({ position: { x: 1, y: 2 }, rotation: 90, color: 'red', params: { newParam: 3 } });
  });

  it('names the part and field: negative resistance', () => {
    const e = issuesOf({ ...base, parts: [{ id: 'R2', type: 'resistor', params: { resistance: -5 } }] });
    expect(e.message).toContain('Part "R2" (resistor): field "resistance" must be a positive number (got -5)');
    expect(e.issues).toEqual([{ path: 'parts[0].params.resistance', partId: 'R2', field: 'resistance', message: expect.stringContaining('(got -5)') }]);
  });

  it('a missing required param, a string where a number belongs, an enum, a boolean', () => {
    const e = issuesOf({
      ...base,
      parts: [
        { id: 'R1', type: 'resistor', params: {} },
        { id: 'R2', type: 'resistor', params: { resistance: '4k7' } },
        { id: 'RV1', type: 'potentiometer', params: { resistance: 1000, taper: 'audio' } },
        { id: 'S1', type: 'switch', params: { closed: 'yes' } },
        { id: 'RL1', type: 'load', params: { value: 3 } },
        { id: 'L1', type: 'net_label', params: { name: '' } },
      ],
    });
    const m = e.issues.map((i) => i.message);
    expect(m[0]).toBe('Part "R1" (resistor): field "resistance" is required (a number in Ω).');
    expect(m[1]).toMatch(/^Part "R2" \(resistor\): field "resistance" must be a number in Ω \(got "4k7"\); sheet files hold plain numbers/);
    expect(m[2]).toBe('Part "RV1" (potentiometer): field "taper" must be one of "linear", "log" (got "audio").');
    expect(m[3]).toBe('Part "S1" (switch): field "closed" must be true or false (got "yes").');
    expect(m[4]).toBe('Part "RL1" (load): field "mode" is required: one of "resistance", "current", "power".');
    expect(m[5]).toMatch(/^Part "L1" \(net_label\): field "name" must be a non-empty string/);
    expect(e.message).toMatch(/\(and 5 more problems\)$/);
  });

  it('cross-field checks: load value by mode, supply min above max', () => {
    const e = issuesOf({
      ...base,
      parts: [
        { id: 'RL1', type: 'load', params: { mode: 'resistance', value: 0 } },
        { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5, min: 6, max: 4 } },
      ],
    });
    expect(e.issues.map((i) => [i.partId, i.field])).toEqual([
      ['RL1', 'value'],
      ['V1', 'min'],
    ]);
  });

  it('duplicate ids, unknown types, bad ids', () => {
    const e = issuesOf({
      ...base,
      parts: [
        { id: 'R1', type: 'resistor', params: { resistance: 1 } },
        { id: 'R1', type: 'resistor', params: { resistance: 2 } },
        { id: 'C1', type: 'capacitor' },
        { id: 'a.b', type: 'ground' },
      ],
    });
    const m = e.issues.map((i) => i.message);
    expect(m[0]).toMatch(/Part "R1": the id is used by more than one part \(parts #1 and #2\)/);
    expect(m[1]).toMatch(/Part "C1": field "type" must be one of resistor, potentiometer, .* \(got "capacitor"\)/);
    expect(m[2]).toMatch(/Part #4 \(ground\): field "id" must be a non-empty string without spaces or "\."/);
  });

  it('wires that refer to unknown parts or pins', () => {
    const e = issuesOf({
      ...base,
      parts: [{ id: 'R1', type: 'resistor', params: { resistance: 1 } }],
      wires: [
        { from: 'R1.a', to: 'R9.a' },
        { from: 'R1.c', to: 'R1.b' },
        { from: 'R1', to: 'R1.b' },
      ],
    });
    expect(e.issues.map((i) => i.message)).toEqual([
      'Wire #1 (R1.a → R9.a): field "to" refers to part "R9", which is not on the sheet.',
      'Wire #2 (R1.c → R1.b): field "from" refers to pin "c" of part "R1", but a resistor has pins "a", "b".',
      'Wire #3 (R1 → R1.b): field "from" must be a pin written PARTID.PIN, e.g. "R1.a" (got "R1").',
    ]);
  });

  it('format, version and conditions', () => {
    const e = issuesOf({ format: 'kicad', version: 2, conditions: { temperatureC: -300 } });
    expect(e.issues.map((i) => i.field)).toEqual(['format', 'version', 'conditions.temperatureC']);
    expect(issuesOf('nope').message).toMatch(/must be a JSON object/);
    expect(parseSheetJson('{ bad json').ok).toBe(false);
  });

  it('every example sheet is valid, marked as demo data, and matches the exported zod schema', () => {
    const dir = path.resolve(import.meta.dirname, '../../../examples');
    const files = readdirSync(dir).filter((f) => f.endsWith('.json'));
    expect(files.length).toBeGreaterThanOrEqual(5);
    for (const f of files) {
      const data = JSON.parse(readFileSync(path.join(dir, f), 'utf8'));
      const r = parseSheet(data);
      if (!r.ok) throw new Error(`${f}: ${r.error.message}`);
      expect(r.sheet.description).toMatch(/^Demo data/);
      expect(SheetSchema.safeParse(data).success).toBe(true);
    }
  });
});

describe('part catalogue', () => {
  it('covers every type with pins, designator, labelled params and a model', () => {
    expect(Object.keys(partCatalog).sort()).toEqual([...PART_TYPES].sort());
    for (const t of PART_TYPES) {
      const d = partCatalog[t];
      expect(d.type).toBe(t);
      expect(d.pins.length).toBeGreaterThan(0);
      expect(d.designator).toMatch(/^[A-Z]+$/);
      expect(typeof d.model.create).toBe('function');
      for (const p of d.params) {
        expect(p.label.length).toBeGreaterThan(0);
        expect(typeof p.unit).toBe('string');
        if (p.default !== undefined) expect(d.defaults[p.name]).toBe(p.default);
        if (p.tolerance?.kind === 'fraction') expect(d.params.some((q) => q.name === (p.tolerance as { param: string }).param)).toBe(true);
      }
    }
    expect(partCatalog.resistor.pins.map((p) => p.name)).toEqual(['a', 'b']);
    expect(partCatalog.potentiometer.pins.map((p) => p.name)).toEqual(['a', 'w', 'b']);
    expect(partCatalog.npn.pins.map((p) => p.name)).toEqual(['c', 'b', 'e']);
    expect(partCatalog.resistor.params.find((p) => p.name === 'resistance')).toMatchObject({ unit: 'Ω', required: true, sweepable: true, tolerance: { kind: 'fraction', param: 'tolerance' } });
    expect(partCatalog.dc_voltage_source.params.find((p) => p.name === 'voltage')?.tolerance).toEqual({ kind: 'range', minParam: 'min', maxParam: 'max' });
  });

  it('nextPartId uses the designator prefix', () => {
    const r = parseSheet({ ...base, parts: [{ id: 'R1', type: 'resistor', params: { resistance: 1 } }, { id: 'R7', type: 'resistor', params: { resistance: 1 } }] });
    if (!r.ok) throw new Error();
    expect(nextPartId(r.sheet, 'resistor')).toBe('R8');
    expect(nextPartId(r.sheet, 'npn')).toBe('Q1');
    expect(nextPartId(r.sheet, 'potentiometer')).toBe('RV1');
  });
});
