// The actions the UI dispatches (and the headless tests drive): each one is a document command
// run through applyLocal (one undo step) plus the session bookkeeping around it.
import type { PartType, Position, Rotation, Sheet } from '../../../shared/sheet';
import type { Corner, Selection, ActiveTool, SymbolStyle } from '../model/scopes';
import type { ESeriesName } from '../../../shared/units';
import {
  addPart,
  connectPins,
  copyFragment,
  deleteItems,
  designatorProblem,
  joinTouchingPins,
  moveParts,
  pasteFragment,
  renamePart,
  rotateParts,
  setParam,
  type ConnectResult,
  type Fragment,
} from './commands';
import { createEditorStore, type EditorStore } from './editorStore';
import { GRID } from '../symbols/geometry';

export interface EditorActions {
  /** Place a part centred at `center` (canvas units) and select it; returns its id. */
  place(type: PartType, center: Position, rotation?: Rotation): string | null;
  /** Start a drag of parts: the moves until endDrag are one undo step. */
  beginDrag(count: number): void;
  /** Move parts to new centres (canvas units). */
  moveParts(centers: Record<string, Position>): void;
  endDrag(): void;
  rotateSelection(direction?: 1 | -1): void;
  deleteSelection(): void;
  connect(from: string, to: string): ConnectResult;
  /** Set one param in SI units; `undefined` removes an optional param. */
  setParam(partId: string, name: string, value: unknown, label?: string): void;
  /** Set several params in one undo step (a value typed with its tolerance, "4K7J"). */
  setParams(partId: string, values: Record<string, unknown>, label?: string): void;
  /** Start a continuous change (slider): the setParam calls until endContinuous are one undo step. */
  beginContinuous(label: string): void;
  endContinuous(): void;
  /** Rename a part; returns what is wrong with the name, or null when done. */
  rename(partId: string, next: string): string | null;
  setConditions(patch: Partial<Sheet['conditions']>): void;
  setTitle(title: string): void;
  copySelection(): Fragment | null;
  cutSelection(): void;
  /** Paste the clipboard (or a fragment given), offset from the source; selects the pasted parts. */
  paste(fragment?: Fragment): string[];
  duplicateSelection(): string[];
  select(selection: Partial<Selection>, mode?: 'replace' | 'add' | 'toggle'): void;
  selectAll(): void;
  clearSelection(): void;
  setTool(tool: ActiveTool): void;
  setCorner(partId: string, corner: Corner | null): void;
  setSymbolStyle(style: SymbolStyle): void;
  setSnapSeries(series: ESeriesName): void;
  undo(): boolean;
  redo(): boolean;
}

export type Editor = EditorStore & { actions: EditorActions };

function plural(n: number, one: string): string {
  return n === 1 ? `1 ${one}` : `${n} ${one}s`;
}

/** Make an editor (store + actions) for a sheet. */
export function createEditor(sheet: Sheet): Editor {
  const editor = createEditorStore(sheet);
  let clipboard: Fragment | null = null;
  let dragged = new Set<string>();
  let pasteCount = 0;
  const selection = () => editor.getSession().selection;
  const selectOnly = (parts: string[], wires: string[] = []) =>
    editor.updateSession((s) => {
      s.selection = { parts, wires };
    });

  const actions: EditorActions = {
    place(type, center, rotation = 0) {
      let id: string | null = null;
      const b = editor.applyLocal((d) => {
        id = addPart(d, type, center, rotation);
        joinTouchingPins(d, [id]);
      }, `Place ${type.replace(/_/g, ' ')}`);
      if (b && id) selectOnly([id]);
      return b ? id : null;
    },
    beginDrag(count) {
      dragged = new Set();
      editor.beginGesture(`Move ${plural(count, 'part')}`);
    },
    moveParts(centers) {
      const b = editor.applyLocal((d) => moveParts(d, centers), `Move ${plural(Object.keys(centers).length, 'part')}`);
      if (b) for (const id of Object.keys(centers)) dragged.add(id);
    },
    endDrag() {
      // joining pins the drag brought together belongs to the same undo step as the drag
      if (dragged.size) editor.applyLocal((d) => void joinTouchingPins(d, [...dragged]), 'Join touching pins');
      dragged = new Set();
      editor.endGesture();
    },
    rotateSelection(direction = 1) {
      const ids = selection().parts;
      if (ids.length) editor.applyLocal((d) => rotateParts(d, ids, direction), `Rotate ${plural(ids.length, 'part')}`);
    },
    deleteSelection() {
      const { parts, wires } = selection();
      if (!parts.length && !wires.length) return;
      const what = [parts.length ? plural(parts.length, 'part') : '', wires.length ? plural(wires.length, 'wire') : '']
        .filter(Boolean)
        .join(' and ');
      editor.applyLocal((d) => deleteItems(d, parts, wires), `Delete ${what}`);
    },
    connect(from, to) {
      let result: ConnectResult = { ok: false, message: 'The sheet is read-only.' };
      editor.applyLocal((d) => void (result = connectPins(d, from, to)), `Wire ${from} to ${to}`);
      const r = result as ConnectResult; // assigned inside the recipe
      if (r.ok) selectOnly([], [r.wireId]);
      return r;
    },
    setParam(partId, name, value, label) {
      editor.applyLocal((d) => setParam(d, partId, name, value), label ?? `Set ${partId} ${name}`);
    },
    setParams(partId, values, label) {
      editor.applyLocal((d) => {
        for (const [name, value] of Object.entries(values)) setParam(d, partId, name, value);
      }, label ?? `Set ${partId} ${Object.keys(values).join(', ')}`);
    },
    beginContinuous(label) {
      editor.beginGesture(label);
    },
    endContinuous() {
      editor.endGesture();
    },
    rename(partId, next) {
      const problem = designatorProblem(editor.getDoc(), partId, next);
      if (problem) return problem;
      const id = next.trim();
      if (id === partId) return null;
      // Read session references first: committing the document drops those to the old id.
      const corner = editor.getSession().corners[partId];
      const wasSelected = selection().parts.includes(partId);
      editor.applyLocal((d) => renamePart(d, partId, id), `Rename ${partId} to ${id}`);
      editor.updateSession((s) => {
        if (wasSelected && !s.selection.parts.includes(id)) s.selection.parts.push(id);
        if (corner) s.corners[id] = corner;
      });
      return null;
    },
    setConditions(patch) {
      editor.applyLocal((d) => void Object.assign(d.conditions, patch), 'Change sheet conditions');
    },
    setTitle(title) {
      editor.applyLocal((d) => {
        if (title.trim()) d.title = title.trim();
        else delete d.title;
      }, 'Rename sheet');
    },
    copySelection() {
      const ids = selection().parts;
      if (!ids.length) return null;
      clipboard = copyFragment(editor.getDoc(), ids);
      pasteCount = 0;
      return clipboard;
    },
    cutSelection() {
      if (actions.copySelection()) actions.deleteSelection();
    },
    paste(fragment) {
      const src = fragment ?? clipboard;
      if (!src || !src.parts.length) return [];
      if (fragment) pasteCount = 0;
      pasteCount += 1;
      const offset = { x: 2 * GRID * pasteCount, y: 2 * GRID * pasteCount };
      let ids: string[] = [];
      editor.applyLocal((d) => {
        ids = pasteFragment(d, src, offset);
        joinTouchingPins(d, ids);
      }, `Paste ${plural(src.parts.length, 'part')}`);
      if (ids.length) selectOnly(ids);
      return ids;
    },
    duplicateSelection() {
      const ids = selection().parts;
      if (!ids.length) return [];
      return actions.paste(copyFragment(editor.getDoc(), ids));
    },
    select(sel, mode = 'replace') {
      editor.updateSession((s) => {
        const parts = sel.parts ?? [];
        const wires = sel.wires ?? [];
        if (mode === 'replace') s.selection = { parts: [...parts], wires: [...wires] };
        else
          for (const [key, ids] of [['parts', parts], ['wires', wires]] as const) {
            const cur = new Set(s.selection[key]);
            for (const id of ids) {
              if (mode === 'toggle' && cur.has(id)) cur.delete(id);
              else cur.add(id);
            }
            s.selection[key] = [...cur];
          }
      });
    },
    selectAll() {
      const d = editor.getDoc();
      selectOnly(d.parts.map((p) => p.id), d.wires.map((w) => w.id ?? '').filter(Boolean));
    },
    clearSelection() {
      if (selection().parts.length || selection().wires.length) selectOnly([]);
    },
    setTool(tool) {
      editor.updateSession((s) => void (s.tool = tool));
    },
    setCorner(partId, corner) {
      editor.updateSession((s) => {
        if (corner) s.corners[partId] = corner;
        else delete s.corners[partId];
      });
    },
    setSymbolStyle(style) {
      editor.updateSession((s) => void (s.symbolStyle = style));
    },
    setSnapSeries(series) {
      editor.updateSession((s) => void (s.snapSeries = series));
    },
    undo: () => editor.undo(),
    redo: () => editor.redo(),
  };
  return { ...editor, actions };
}
