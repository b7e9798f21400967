// The document-change path a co-editing layer will use: every local batch reaches listeners,
// remote batches apply without entering the local undo stack.
import { describe, expect, it } from 'vitest';
import type { Patch } from 'immer';
import { createEditor } from '../../../src/editor/store/actions';
import type { PatchBatch } from '../../../src/editor/store/editorStore';
import { emptySheet, partOf } from './helpers';

describe('patch batches', () => {
  it('sends each local change, undo and redo to listeners, and stops after unsubscribe', () => {
    const ed = createEditor(emptySheet());
    const seen: PatchBatch[] = [];
    const off = ed.subscribePatches((b) => seen.push(b));
    ed.actions.place('resistor', { x: 0, y: 0 });
    ed.actions.undo();
    ed.actions.redo();
    expect(seen.map((b) => b.origin)).toEqual(['local', 'undo', 'redo']);
    expect(seen[0].patches.length).toBeGreaterThan(0);
    off();
    ed.actions.place('resistor', { x: 0, y: 0 });
    expect(seen).toHaveLength(3);
  });

  it('replays a session of local batches on a second editor to the same document', () => {
    const a = createEditor(emptySheet());
    const b = createEditor(emptySheet());
    a.subscribePatches((batch) => {
      if (batch.origin !== 'remote') b.applyRemote(batch.patches);
    });
    a.actions.place('dc_voltage_source', { x: 0, y: 100 });
    a.actions.place('resistor', { x: 100, y: 0 });
    a.actions.connect('V1.pos', 'R1.a');
    a.actions.beginDrag(1);
    a.actions.moveParts({ R1: { x: 120, y: 0 } });
    a.actions.moveParts({ R1: { x: 140, y: 20 } });
    a.actions.endDrag();
    a.actions.rename('R1', 'Rs');
    a.actions.undo();
    a.actions.select({ parts: ['V1'] });
    a.actions.deleteSelection();
    expect(b.getDoc()).toEqual(a.getDoc());
  });

  it('keeps remote changes out of the local undo stack', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    const remote: Patch[] = [{ op: 'replace', path: ['title'], value: 'Renamed by a colleague' }];
    ed.applyRemote(remote);
    expect(ed.getDoc().title).toBe('Renamed by a colleague');
    // the only local step is still the placement; undoing it leaves the remote title alone
    expect(ed.store.getState().history.undoLabel).toBe('Place resistor');
    ed.actions.undo();
    expect(ed.getDoc().parts).toEqual([]);
    expect(ed.getDoc().title).toBe('Renamed by a colleague');
    expect(ed.actions.undo()).toBe(false);
  });

  it('undoes a local edit correctly after a remote edit to another part', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    ed.actions.place('resistor', { x: 200, y: 0 });
    ed.actions.setParam('R1', 'resistance', 4700);
    ed.applyRemote([{ op: 'replace', path: ['parts', 1, 'params', 'resistance'], value: 22_000 }]);
    ed.actions.undo();
    expect((partOf(ed, 'R1').params as { resistance: number }).resistance).toBe(10_000);
    expect((partOf(ed, 'R2').params as { resistance: number }).resistance).toBe(22_000);
  });

  it('drops a remote-deleted part from the local selection', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    expect(ed.getSession().selection.parts).toEqual(['R1']);
    ed.applyRemote([{ op: 'replace', path: ['parts'], value: [] }]);
    expect(ed.getSession().selection.parts).toEqual([]);
  });
});

describe('undo after remote structural edits', () => {
  it('keeps local undo across a remote append, drops it when a remote edit moves indices', () => {
    const ed = createEditor(emptySheet());
    ed.actions.place('resistor', { x: 0, y: 0 });
    ed.actions.place('resistor', { x: 200, y: 0 });
    ed.actions.setParam('R2', 'resistance', 4700);
    const other = { id: 'R9', type: 'resistor', params: { resistance: 1000, tolerance: 0.01, powerRating: 0.25, tempco: 0 }, position: { x: 0, y: 200 } };
    ed.applyRemote([{ op: 'add', path: ['parts', 2], value: other }]);
    expect(ed.store.getState().history.canUndo).toBe(true);
    ed.actions.undo();
    expect((partOf(ed, 'R2').params as { resistance: number }).resistance).toBe(10_000);
    // a colleague deletes R1: R2 moves to index 0, so index-addressed steps would hit the wrong part
    ed.actions.setParam('R2', 'resistance', 2200);
    ed.applyRemote([{ op: 'remove', path: ['parts', 0] }]);
    expect(ed.store.getState().history.canUndo).toBe(false);
    expect(ed.actions.undo()).toBe(false);
    expect((partOf(ed, 'R2').params as { resistance: number }).resistance).toBe(2200);
  });
});
