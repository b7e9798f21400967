// Re-solves the sheet after every electrical change (not after pure layout moves), latest-wins,
// and publishes a SolveView into a small store of its own. Small sheets are solved inline (in the
// edit's own task, see inlineSolver.ts), the rest in the worker.
import { createStore, type StoreApi } from 'zustand/vanilla';
import type { Sheet } from '../../../shared/sheet';
import type { Editor } from '../store/actions';
import { applyCorners } from './corners';
import type { InlineSolver } from './inlineSolver';
import { LatestWinsSolver, type SolverHandle } from './latestWins';
import { buildSolveView, createTopologyCache, emptySolveView, type SolveView } from './solveView';
import { shareView } from './viewSharing';

export interface LiveSolveState extends SolveView {
  /** a solve has been running for a while (BUSY_AFTER_MS): worth a "Solving…" */
  busy: boolean;
}

/**
 * Solves that answer sooner than this do not flag `busy`: a worker solve of an ordinary sheet
 * takes a few ms, and flagging each one would flash "Solving…" and wake every subscriber of the
 * store twice per slider step for nothing.
 */
export const BUSY_AFTER_MS = 150;

/** Only what changes the result: layout (positions, rotation, labels, wire routes and ids) is dropped. */
export function electricalKey(sheet: Sheet): string {
  return JSON.stringify({
    c: sheet.conditions,
    p: sheet.parts.map((p) => [p.id, p.type, p.params]),
    w: sheet.wires.map((w) => [w.from, w.to]),
  });
}

export interface LiveSolve {
  store: StoreApi<LiveSolveState>;
  dispose(): void;
}

export interface LiveSolveOptions {
  /**
   * Solves small sheets on this thread (createInlineSolver); a promise while the engine module
   * loads, the worker solving until then. Without it everything goes to the worker.
   */
  inline?: InlineSolver | Promise<InlineSolver>;
}

/** Start solving `editor`'s sheet (inline or in `makeHandle`'s worker); stops on dispose(). */
export function startLiveSolve(editor: Editor, makeHandle: () => SolverHandle, options: LiveSolveOptions = {}): LiveSolve {
  const store = createStore<LiveSolveState>(() => ({ ...emptySolveView, busy: false }));
  const topology = createTopologyCache();
  let disposed = false;
  let busyTimer: ReturnType<typeof setTimeout> | null = null;
  const solver = new LatestWinsSolver(makeHandle, {
    onBusy: (busy) => {
      if (busy) {
        busyTimer ??= setTimeout(() => store.setState({ busy: true }), BUSY_AFTER_MS);
        return;
      }
      if (busyTimer) clearTimeout(busyTimer);
      busyTimer = null;
      if (store.getState().busy) store.setState({ busy: false });
    },
    onResult: ({ sheet, result, ms }) => {
      const prev = store.getState();
      store.setState({ ...shareView(prev, buildSolveView(sheet, result, ms, topology(sheet))) });
    },
  });
  const inline = options.inline;
  if (inline instanceof Promise)
    inline.then(
      (s) => !disposed && solver.setInline(s),
      () => {}, // the engine chunk did not load: the worker keeps every solve, which is fine
    );
  else if (inline) solver.setInline(inline);
  let lastKey = '';
  const maybeSolve = () => {
    const { doc, session } = editor.store.getState();
    const input = applyCorners(doc, session.corners);
    const key = electricalKey(input);
    if (key === lastKey) return;
    lastKey = key;
    if (!input.parts.length) {
      // nothing to solve is not an error: clear the readings and wait for the first part
      store.setState({ ...emptySolveView, busy: false });
      return;
    }
    solver.request(input);
  };
  const unsubscribe = editor.store.subscribe((s, prev) => {
    if (s.doc !== prev.doc || s.session.corners !== prev.session.corners) maybeSolve();
  });
  maybeSolve();
  return {
    store,
    dispose() {
      disposed = true;
      if (busyTimer) clearTimeout(busyTimer);
      unsubscribe();
      solver.dispose();
    },
  };
}
