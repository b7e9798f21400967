// Undo/redo over immer patches: one step per action, one step per gesture (drag, slider pull).
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../../src/editor/store/actions';
import { emptySheet, partOf } from './helpers';

describe('undo and redo', () => {
  it('undoes and redoes a placement', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 100, y: 100 });
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['R1']);
    expect(ed.actions.undo()).toBe(true);
    expect(ed.getDoc().parts).toEqual([]);
    expect(ed.actions.redo()).toBe(true);
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['R1']);
    expect(ed.actions.redo()).toBe(false);
  });

  it('drops selection of parts an undo removed', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    expect(ed.getSession().selection.parts).toEqual(['R1']);
    ed.actions.undo();
    expect(ed.getSession().selection.parts).toEqual([]);
  });

  it('records a drag of many moves as one undo step', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 100, y: 100 });
    ed.actions.place('resistor', { x: 300, y: 100 });
    ed.actions.beginDrag(2);
    for (let i = 1; i <= 25; i++) ed.actions.moveParts({ R1: { x: 100 + 20 * i, y: 100 }, R2: { x: 300 + 20 * i, y: 100 } });
    ed.actions.endDrag();
    expect(partOf(ed, 'R1').position).toEqual({ x: 600, y: 100 });
    expect(ed.store.getState().history.undoLabel).toBe('Move 2 parts');
    ed.actions.undo();
    expect(partOf(ed, 'R1').position).toEqual({ x: 100, y: 100 });
    expect(partOf(ed, 'R2').position).toEqual({ x: 300, y: 100 });
    // the next undo takes away the second placement, not part of the drag
    ed.actions.undo();
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['R1']);
    ed.actions.redo();
    ed.actions.redo();
    expect(partOf(ed, 'R2').position).toEqual({ x: 800, y: 100 });
  });

  it('makes no undo step for a drag that did not move anything (a click)', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 100, y: 100 });
    ed.actions.beginDrag(1);
    ed.actions.moveParts({ R1: { x: 100, y: 100 } });
    ed.actions.endDrag();
    expect(ed.store.getState().history.undoLabel).toBe('Place resistor');
  });

  it('records a slider pull of a potentiometer as one undo step', () => {
    const ed = createEditor(emptySheet());
    const id = ed.actions.place('potentiometer', { x: 0, y: 0 })!;
    ed.actions.beginContinuous('Turn RV1');
    for (const v of [0.55, 0.6, 0.7, 0.9]) ed.actions.setParam(id, 'position', v);
    ed.actions.endContinuous();
    expect((partOf(ed, id).params as { position: number }).position).toBe(0.9);
    ed.actions.undo();
    expect((partOf(ed, id).params as { position: number }).position).toBe(0.5);
  });

  it('clears the redo stack after a new change', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    ed.actions.undo();
    ed.actions.place('diode', { x: 0, y: 0 });
    expect(ed.actions.redo()).toBe(false);
    expect(ed.getDoc().parts.map((p) => p.id)).toEqual(['D1']);
  });

  it('refuses every change to a read-only sheet', () => {
    const ed = createEditor(emptySheet());
    ed.loadDocument(emptySheet(), { readOnly: true });
    expect(ed.actions.place('resistor', { x: 0, y: 0 })).toBeNull();
    expect(ed.getDoc().parts).toEqual([]);
  });
});
