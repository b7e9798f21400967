// Wiring, deleting, designators, rotation and paste, driven through the same actions the UI uses.
import { describe, expect, it } from 'vitest';
import { extractNets, parseSheet, PART_TYPES } from '../../../shared/sheet';
import { partSpecs } from '../../../shared/parts/specs';
import { createEditor } from '../../../src/editor/store/actions';
import { emptySheet, partOf, pinAt } from './helpers';

function divider() {
  const ed = createEditor(emptySheet());
  ed.actions.place('dc_voltage_source', { x: 0, y: 100 });
  ed.actions.place('resistor', { x: 100, y: 0 });
  ed.actions.place('resistor', { x: 200, y: 100 }, 90);
  ed.actions.place('ground', { x: 0, y: 200 });
  expect(ed.actions.connect('V1.pos', 'R1.a').ok).toBe(true);
  expect(ed.actions.connect('R1.b', 'R2.a').ok).toBe(true);
  expect(ed.actions.connect('R2.b', 'GND1.g').ok).toBe(true);
  expect(ed.actions.connect('V1.neg', 'GND1.g').ok).toBe(true);
  return ed;
}

describe('placing parts', () => {
  it('gives each type its catalogue prefix and the next free number', () => {
    const ed = divider();
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['V1', 'R1', 'R2', 'GND1']);
    ed.actions.place('potentiometer', { x: 0, y: 0 });
    ed.actions.place('net_label', { x: 0, y: 0 });
    ed.actions.place('net_label', { x: 0, y: 0 });
    expect(ed.getDoc().parts.slice(4).map((p) => p.id)).toEqual(['RV1', 'LBL1', 'LBL2']);
    // two labels placed without a name must not join nets by accident
    const names = ed.getDoc().parts.filter((p) => p.type === 'net_label').map((p) => (p.params as { name: string }).name);
    expect(new Set(names).size).toBe(2);
  });

  it('starts every part type with params the sheet schema accepts', () => {
    const ed = createEditor(emptySheet());
    PART_TYPES.forEach((t, i) => ed.actions.place(t, { x: i * 100, y: 0 }));
    const r = parseSheet(JSON.parse(JSON.stringify(ed.getDoc())));
    expect(r.ok ? 'valid' : r.error.message).toBe('valid');
  });

  it('snaps a placed part to the grid', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 107, y: 53 });
    expect(partOf(ed, 'R1').position).toEqual({ x: 100, y: 60 });
  });
});

describe('wiring', () => {
  it('joins the pins it connects into one net', () => {
    const nets = extractNets(divider().getDoc());
    expect(nets.pinToNet['R1.b']).toBe(nets.pinToNet['R2.a']);
    expect(nets.pinToNet['R2.b']).toBe('0');
    expect(nets.pinToNet['V1.pos']).not.toBe(nets.pinToNet['R2.a']);
  });

  it('refuses a wire from a pin to itself, a duplicate and an unknown pin', () => {
    const ed = divider();
    expect(ed.actions.connect('R1.a', 'R1.a').ok).toBe(false);
    const dup = ed.actions.connect('R1.a', 'V1.pos');
    expect(dup.ok ? '' : dup.message).toMatch(/already wired/);
    expect(ed.actions.connect('R1.x', 'R2.a').ok).toBe(false);
    expect(ed.getDoc().wires).toHaveLength(4);
  });

  it('deletes the wires on a deleted part, and undo brings both back', () => {
    const ed = divider();
    ed.actions.select({ parts: ['R1'] });
    ed.actions.deleteSelection();
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['V1', 'R2', 'GND1']);
    expect(ed.getDoc().wires.map((w) => `${w.from}-${w.to}`)).toEqual(['R2.b-GND1.g', 'V1.neg-GND1.g']);
    ed.actions.undo();
    expect(ed.getDoc().wires).toHaveLength(4);
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['V1', 'R1', 'R2', 'GND1']);
  });

  it('deletes a selected wire on its own', () => {
    const ed = divider();
    const w = ed.getDoc().wires[1].id!;
    ed.actions.select({ wires: [w] });
    ed.actions.deleteSelection();
    expect(ed.getDoc().wires.map((x) => x.id)).not.toContain(w);
    expect(ed.getDoc().parts).toHaveLength(4);
  });
});

describe('designators', () => {
  it('renames a part and every wire end on it', () => {
    const ed = divider();
    expect(ed.actions.rename('R1', 'Rtop')).toBeNull();
    expect(ed.getDoc().wires.map((w) => w.to)).toContain('Rtop.a');
    expect(ed.getDoc().wires.map((w) => w.from)).toContain('Rtop.b');
    ed.actions.undo();
    expect(ed.getDoc().wires.map((w) => w.to)).toContain('R1.a');
  });

  it('refuses a taken, empty or malformed designator with a reason', () => {
    const ed = divider();
    expect(ed.actions.rename('R1', 'R2')).toMatch(/already used/);
    expect(ed.actions.rename('R1', '  ')).toMatch(/Enter a designator/);
    expect(ed.actions.rename('R1', 'R 1')).toMatch(/no spaces/);
    expect(ed.actions.rename('R1', 'R1.x')).toMatch(/"\."/);
    expect(partOf(ed, 'R1').id).toBe('R1');
  });

  it('moves the part\'s tolerance corner along with a rename', () => {
    const ed = divider();
    ed.actions.setCorner('R1', 'max');
    ed.actions.rename('R1', 'R9');
    expect(ed.getSession().corners).toEqual({ R9: 'max' });
  });
});

describe('rotation', () => {
  it('turns a resistor\'s pins with it, back home after four turns', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 100, y: 100 });
    expect(pinAt(ed, 'R1.a')).toEqual({ x: 60, y: 100 });
    ed.actions.rotateSelection();
    expect(partOf(ed, 'R1').rotation).toBe(90);
    // clockwise on screen: the left pin goes to the top
    expect(pinAt(ed, 'R1.a')).toEqual({ x: 100, y: 60 });
    expect(pinAt(ed, 'R1.b')).toEqual({ x: 100, y: 140 });
    ed.actions.rotateSelection();
    expect(pinAt(ed, 'R1.a')).toEqual({ x: 140, y: 100 });
    ed.actions.rotateSelection();
    ed.actions.rotateSelection();
    expect(partOf(ed, 'R1').rotation).toBe(0);
    expect(pinAt(ed, 'R1.a')).toEqual({ x: 60, y: 100 });
  });

  it('turns a group about its centre, so touching pins stay together', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 100, y: 100 });
    ed.actions.place('resistor', { x: 180, y: 100 });
    ed.actions.place('npn', { x: 300, y: 100 });
    expect(pinAt(ed, 'R1.b')).toEqual(pinAt(ed, 'R2.a'));
    ed.actions.selectAll();
    for (const dir of [1, 1, -1, 1] as const) {
      ed.actions.rotateSelection(dir);
      expect(pinAt(ed, 'R1.b')).toEqual(pinAt(ed, 'R2.a'));
    }
    // three pins of the transistor keep their shape: c and e are 80 apart in any rotation
    const c = pinAt(ed, 'Q1.c');
    const e = pinAt(ed, 'Q1.e');
    expect(Math.hypot(c.x - e.x, c.y - e.y)).toBe(80);
  });

  it('keeps every pin on the 20-unit grid in every rotation', () => {
    const ed = createEditor(emptySheet());
    PART_TYPES.forEach((t, i) => ed.actions.place(t, { x: 40 * i, y: 60 }));
    ed.actions.selectAll();
    for (let turn = 0; turn < 4; turn++) {
      for (const p of ed.getDoc().parts)
        for (const ref of pinRefs(p.type).map((n) => `${p.id}.${n}`)) {
          const at = pinAt(ed, ref);
          expect([Math.abs(at.x % 20), Math.abs(at.y % 20)]).toEqual([0, 0]);
        }
      ed.actions.rotateSelection();
    }
  });
});

function pinRefs(type: keyof typeof partSpecs): string[] {
  return partSpecs[type].pins.map((p) => p.name);
}

describe('copy and paste', () => {
  it('pastes with fresh designators, the inner wires only, offset from the original', () => {
    const ed = divider();
    ed.actions.select({ parts: ['R1', 'R2'] });
    ed.actions.copySelection();
    const ids = ed.actions.paste();
    expect(ids).toEqual(['R3', 'R4']);
    expect(ed.getSession().selection.parts).toEqual(['R3', 'R4']);
    const pasted = ed.getDoc().wires.filter((w) => w.from.startsWith('R3') || w.to.startsWith('R3'));
    expect(pasted.map((w) => `${w.from}-${w.to}`)).toEqual(['R3.b-R4.a']);
    expect(partOf(ed, 'R3').position).toEqual({ x: 140, y: 40 });
    ed.actions.paste();
    expect(partOf(ed, 'R5').position).toEqual({ x: 180, y: 80 });
    ed.actions.undo();
    expect(ed.getDoc().parts.map((p) => p.id)).not.toContain('R5');
  });

  it('cut removes the parts and their wires; paste brings them back under new names', () => {
    const ed = divider();
    ed.actions.select({ parts: ['R2'] });
    ed.actions.cutSelection();
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['V1', 'R1', 'GND1']);
    expect(ed.actions.paste()).toEqual(['R2']);
  });
});

describe('touching pins', () => {
  it('joins pins a drag lands on the same point, in the same undo step as the drag', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 100, y: 100 });
    ed.actions.place('resistor', { x: 300, y: 100 });
    expect(ed.getDoc().wires).toHaveLength(0);
    ed.actions.beginDrag(1);
    ed.actions.moveParts({ R2: { x: 240, y: 100 } });
    ed.actions.moveParts({ R2: { x: 180, y: 100 } });
    ed.actions.endDrag();
    expect(ed.getDoc().wires.map((w) => `${w.from}-${w.to}`)).toEqual(['R1.b-R2.a']);
    ed.actions.undo();
    expect(ed.getDoc().wires).toHaveLength(0);
    expect(partOf(ed, 'R2').position).toEqual({ x: 300, y: 100 });
  });

  it('joins a part placed with a pin on another part\'s pin', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 100, y: 100 });
    ed.actions.place('ground', { x: 140, y: 120 });
    expect(ed.getDoc().wires.map((w) => `${w.from}-${w.to}`)).toEqual(['R1.b-GND1.g']);
  });
});
