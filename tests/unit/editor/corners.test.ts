// Tolerance corners are a session override applied to the solve input only.
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../../src/editor/store/actions';
import { applyCorners, cornerValues } from '../../../src/editor/solve/corners';
import { emptySheet, partOf } from './helpers';

describe('tolerance corners', () => {
  it('moves a resistor to R(1 − t) and R(1 + t) without touching the document', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    ed.actions.setParam('R1', 'resistance', 10_000);
    ed.actions.setParam('R1', 'tolerance', 0.05);
    ed.actions.setCorner('R1', 'max');
    const solved = applyCorners(ed.getDoc(), ed.getSession().corners);
    // 10 kΩ ± 5 % spans 9.5 kΩ … 10.5 kΩ (definition of a symmetric tolerance)
    expect((solved.parts[0].params as { resistance: number }).resistance).toBeCloseTo(10_500, 9);
    expect((partOf(ed, 'R1').params as { resistance: number }).resistance).toBe(10_000);
    expect(cornerValues(partOf(ed, 'R1'), 'min')).toEqual({ resistance: 9500 });
  });

  it('uses a supply\'s own min/max for its corners, and nothing when it has none', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('dc_voltage_source', { x: 0, y: 0 });
    expect(cornerValues(partOf(ed, 'V1'), 'max')).toBeNull();
    ed.actions.setParam('V1', 'min', 4.5);
    ed.actions.setParam('V1', 'max', 5.5);
    expect(cornerValues(partOf(ed, 'V1'), 'max')).toEqual({ voltage: 5.5 });
  });

  it('is not undoable and not part of the document', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    ed.actions.setCorner('R1', 'min');
    expect(ed.store.getState().history.undoLabel).toBe('Place resistor');
    expect(JSON.stringify(ed.getDoc())).not.toMatch(/corner/);
  });
});
