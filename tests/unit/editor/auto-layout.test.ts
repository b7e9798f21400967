// Parts without positions get a ladder layout: rows by net voltage, parts upright between them.
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint } from '../../../shared/engine';
import { parseSheet } from '../../../shared/sheet';
import { layoutMissingPositions } from '../../../src/editor/sources/autoLayout';
import { createEditor } from '../../../src/editor/store/actions';
import { pinAt } from './helpers';

const divider = () => {
  const r = parseSheet({
    format: 'tapline.sheet',
    version: 1,
    parts: [
      { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12 } },
      { id: 'R1', type: 'resistor', params: { resistance: 27000 } },
      { id: 'R2', type: 'resistor', params: { resistance: 10000 } },
      { id: 'GND1', type: 'ground' },
    ],
    wires: [
      { from: 'V1.pos', to: 'R1.a' },
      { from: 'R1.b', to: 'R2.a' },
      { from: 'R2.b', to: 'GND1.g' },
      { from: 'V1.neg', to: 'GND1.g' },
    ],
  });
  if (!r.ok) throw new Error(r.error.message);
  return r.sheet;
};

describe('auto layout', () => {
  it('places the supply rail above the tap and the tap above ground, every pin on the grid', () => {
    const sheet = divider();
    const solved = solveOperatingPoint(sheet);
    const laid = layoutMissingPositions(sheet, solved.ok ? solved.nets : undefined);
    expect(laid.parts.every((p) => p.position)).toBe(true);
    const ed = createEditor(laid);
    const y = (ref: string) => pinAt(ed, ref).y;
    expect(y('R1.a')).toBeLessThan(y('R1.b'));
    expect(y('R1.b')).toBeLessThan(y('R2.b'));
    expect(y('V1.pos')).toBeLessThan(y('V1.neg'));
    for (const p of ed.getDoc().parts) expect([p.position!.x % 20, p.position!.y % 20]).toEqual([0, 0]);
  });

  it('works without voltages and leaves placed parts alone', () => {
    const sheet = divider();
    sheet.parts[1] = { ...sheet.parts[1], position: { x: 500, y: 500 } };
    const laid = layoutMissingPositions(sheet);
    expect(laid.parts[1].position).toEqual({ x: 500, y: 500 });
    expect(laid.parts.every((p) => p.position)).toBe(true);
  });
});
