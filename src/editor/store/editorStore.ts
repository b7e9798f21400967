// The editor store: one document (the sheet), its session state, and the only path by which the
// document changes. Every local change goes through `applyLocal`, which records immer patches for
// undo and hands them to listeners (the co-editing layer sends them on); `applyRemote` applies
// someone else's patches without touching the local undo stack.
import { applyPatches, enablePatches, produceWithPatches, type Draft, type Patch } from 'immer';
import { createStore, type StoreApi } from 'zustand/vanilla';
import { immer } from 'zustand/middleware/immer';
import type { Sheet } from '../../../shared/sheet';
import { initialSession, type DocumentState, type PresenceState, type SessionState } from '../model/scopes';
import { UndoHistory, type UndoEntry } from './history';
import { ensureWireIds } from './normalize';

enablePatches();

export type PatchOrigin = 'local' | 'undo' | 'redo' | 'remote';

/** One document change, as the co-editing layer sees it. */
export interface PatchBatch {
  origin: PatchOrigin;
  label: string;
  patches: Patch[];
  inversePatches: Patch[];
}

export type DocRecipe = (draft: Draft<DocumentState>) => void;

/**
 * Turns an undo/redo step into patches for the document as it is now (others' edits may have
 * moved or removed what the step touched since it was recorded); null: apply the recorded ones.
 */
export type HistoryResolver = (step: UndoEntry, direction: 'undo' | 'redo', doc: DocumentState) => Patch[] | null;

export interface HistoryState {
  canUndo: boolean;
  canRedo: boolean;
  undoLabel?: string;
  redoLabel?: string;
}

export interface EditorState {
  doc: DocumentState;
  /** bumps on every document change (cheap dependency for effects) */
  docRevision: number;
  session: SessionState;
  presence: PresenceState;
  history: HistoryState;
}

export interface EditorStore {
  /** the zustand store, for React (`useStore(editor.store, selector)`) and tests */
  readonly store: StoreApi<EditorState>;
  getDoc(): DocumentState;
  getSession(): SessionState;
  /**
   * Change the document. Returns the batch (also sent to every patch listener), or null when the
   * recipe changed nothing or the sheet is read-only. Inside a gesture the change joins the open
   * undo step.
   */
  applyLocal(recipe: DocRecipe, label?: string): PatchBatch | null;
  /** Apply patches made elsewhere (another editor). They never enter the local undo stack. */
  applyRemote(patches: Patch[], label?: string): void;
  /** Listen to every document change; returns an unsubscribe function. */
  subscribePatches(listener: (batch: PatchBatch) => void): () => void;
  undo(): boolean;
  redo(): boolean;
  /** Installed by the co-editing layer (src/collab) while a sheet is edited live; null removes it. */
  setHistoryResolver(resolver: HistoryResolver | null): void;
  /** Fold the following changes into one undo step (a drag, a slider pull) until `endGesture`. */
  beginGesture(label: string): void;
  endGesture(): void;
  /** Replace the document (opening a sheet): clears undo and the session's selection. */
  loadDocument(sheet: Sheet, options?: { readOnly?: boolean }): void;
  updateSession(recipe: (draft: Draft<SessionState>) => void): void;
}

/** Apply patches, or null when they no longer fit the document (then the step is dropped). */
function safeApply(doc: DocumentState, patches: Patch[]): DocumentState | null {
  try {
    return applyPatches(doc, patches);
  } catch {
    return null;
  }
}

/** True when `patches` insert, remove or replace whole parts/wires other than appending at the end. */
export function shiftsIndices(doc: DocumentState, patches: readonly Patch[]): boolean {
  const length: Record<string, number> = { parts: doc.parts.length, wires: doc.wires.length };
  for (const p of patches) {
    if (p.path.length === 0) return true;
    const [coll, index] = p.path;
    if (coll !== 'parts' && coll !== 'wires') continue;
    if (p.path.length === 1) return true;
    if (p.path.length > 2) continue; // a field of one record
    if (p.op === 'add' && index === length[coll]) {
      length[coll] += 1;
      continue;
    }
    return true;
  }
  return false;
}

/** Make a fresh editor store; the page makes one per open sheet, tests make one per test. */
export function createEditorStore(initial: Sheet): EditorStore {
  const history = new UndoHistory();
  const listeners = new Set<(b: PatchBatch) => void>();
  let resolveStep: HistoryResolver | null = null;
  const store = createStore<EditorState>()(
    immer(() => ({
      doc: ensureWireIds(initial),
      docRevision: 0,
      session: initialSession(),
      presence: { peers: {} },
      history: { canUndo: false, canRedo: false },
    })),
  );

  const historyState = (): HistoryState => {
    const d = history.depth;
    return { canUndo: d.past > 0, canRedo: d.future > 0, undoLabel: history.undoLabel, redoLabel: history.redoLabel };
  };

  const sameHistory = (a: HistoryState, b: HistoryState) =>
    a.canUndo === b.canUndo && a.canRedo === b.canRedo && a.undoLabel === b.undoLabel && a.redoLabel === b.redoLabel;

  /**
   * Set the new document and drop session references to parts/wires that no longer exist. Slices
   * that did not change keep their objects (a slider step must not re-render everything that
   * reads the selection or the undo state).
   */
  const commitDoc = (next: DocumentState) => {
    store.setState((s) => {
      s.doc = next as Draft<DocumentState>;
      s.docRevision += 1;
      const h = historyState();
      if (!sameHistory(s.history, h)) s.history = h;
      const { selection, corners } = s.session;
      if (selection.parts.length || Object.keys(corners).length) {
        const partIds = new Set(next.parts.map((p) => p.id));
        if (selection.parts.some((id) => !partIds.has(id))) selection.parts = selection.parts.filter((id) => partIds.has(id));
        for (const id of Object.keys(corners)) if (!partIds.has(id)) delete corners[id];
      }
      if (selection.wires.length) {
        const wireIds = new Set(next.wires.map((w) => w.id));
        if (selection.wires.some((id) => !wireIds.has(id))) selection.wires = selection.wires.filter((id) => wireIds.has(id));
      }
    });
  };

  const emit = (batch: PatchBatch) => {
    for (const l of [...listeners]) l(batch);
  };

  const api: EditorStore = {
    store,
    getDoc: () => store.getState().doc,
    getSession: () => store.getState().session,

    applyLocal(recipe, label = 'Edit') {
      if (store.getState().session.readOnly) return null;
      const [next, patches, inversePatches] = produceWithPatches(store.getState().doc, recipe);
      if (!patches.length) return null;
      history.record(label, patches, inversePatches);
      commitDoc(next);
      const batch: PatchBatch = { origin: 'local', label, patches, inversePatches };
      emit(batch);
      return batch;
    },

    applyRemote(patches, label = 'Remote edit') {
      if (!patches.length) return;
      // Without a history resolver, undo steps are raw patches that address parts and wires by
      // array index. A remote change that moves those indices (anything but appending) would make
      // them hit the wrong record, so the local history is dropped instead; field edits and
      // appends keep it. With a resolver (the co-editing binding) steps are re-derived by id.
      if (!resolveStep && shiftsIndices(store.getState().doc, patches)) history.clear();
      // The inverse is not needed for undo (remote steps are not ours to undo) but listeners may log it.
      const [next, , inversePatches] = produceWithPatches(store.getState().doc, (d) => applyPatches(d, patches));
      commitDoc(next);
      emit({ origin: 'remote', label, patches, inversePatches });
    },

    subscribePatches(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },

    undo() {
      if (store.getState().session.readOnly) return false;
      const entry = history.takeUndo();
      if (!entry) {
        store.setState((s) => void (s.history = historyState()));
        return false;
      }
      const doc = store.getState().doc;
      const patches = resolveStep?.(entry, 'undo', doc) ?? entry.inversePatches;
      const next = safeApply(doc, patches);
      if (!next) {
        // the step no longer fits the document: drop the history rather than corrupt the sheet
        history.clear();
        store.setState((s) => void (s.history = historyState()));
        return false;
      }
      commitDoc(next);
      emit({ origin: 'undo', label: entry.label, patches, inversePatches: entry.patches });
      return true;
    },

    redo() {
      if (store.getState().session.readOnly) return false;
      const entry = history.takeRedo();
      if (!entry) return false;
      const doc = store.getState().doc;
      const patches = resolveStep?.(entry, 'redo', doc) ?? entry.patches;
      const next = safeApply(doc, patches);
      if (!next) {
        // the step no longer fits the document: drop the history rather than corrupt the sheet
        history.clear();
        store.setState((s) => void (s.history = historyState()));
        return false;
      }
      commitDoc(next);
      emit({ origin: 'redo', label: entry.label, patches, inversePatches: entry.inversePatches });
      return true;
    },

    setHistoryResolver(resolver) {
      resolveStep = resolver;
    },

    beginGesture(label) {
      history.begin(label);
    },

    endGesture() {
      history.end();
      const h = historyState();
      if (!sameHistory(store.getState().history, h)) store.setState((s) => void (s.history = h));
    },

    loadDocument(sheet, options = {}) {
      history.clear();
      store.setState((s) => {
        s.doc = ensureWireIds(sheet) as Draft<DocumentState>;
        s.docRevision += 1;
        s.history = historyState();
        s.session = { ...initialSession(), symbolStyle: s.session.symbolStyle, snapSeries: s.session.snapSeries, readOnly: !!options.readOnly } as Draft<SessionState>;
      });
    },

    updateSession(recipe) {
      store.setState((s) => recipe(s.session));
    },
  };
  return api;
}
