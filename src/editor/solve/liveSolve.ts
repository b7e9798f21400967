// Re-solves the sheet after every electrical change (not after pure layout moves), latest-wins,
// and publishes a SolveView into a small store of its own.
import { createStore, type StoreApi } from 'zustand/vanilla';
import type { Sheet } from '../../../shared/sheet';
import type { Editor } from '../store/actions';
import { applyCorners } from './corners';
import { LatestWinsSolver, type SolverHandle } from './latestWins';
import { buildSolveView, emptySolveView, type SolveView } from './solveView';

export interface LiveSolveState extends SolveView {
  /** a solve is running */
  busy: boolean;
}

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

/** Start solving `editor`'s sheet in `makeHandle`'s worker; stops on dispose(). */
export function startLiveSolve(editor: Editor, makeHandle: () => SolverHandle): LiveSolve {
  const store = createStore<LiveSolveState>(() => ({ ...emptySolveView, busy: false }));
  const sent = new Map<number, Sheet>();
  const solver = new LatestWinsSolver(makeHandle, {
    onBusy: (busy) => store.setState({ busy }),
    onResult: ({ seq, result, ms }) => {
      const sheet = sent.get(seq);
      for (const k of [...sent.keys()]) if (k <= seq) sent.delete(k);
      if (sheet) store.setState({ ...buildSolveView(sheet, result, ms) });
    },
  });
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
    sent.set(solver.request(input), input);
  };
  const unsubscribe = editor.store.subscribe((s, prev) => {
    if (s.doc !== prev.doc || s.session.corners !== prev.session.corners) maybeSolve();
  });
  maybeSolve();
  return {
    store,
    dispose() {
      unsubscribe();
      solver.dispose();
    },
  };
}
