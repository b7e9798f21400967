// Every solve builds a fresh view, but most of it is usually what was there before: the findings,
// the readings of parts a slider pull does not reach, the tags of nets it does not move. Keeping
// the previous objects where nothing changed lets each subscriber (a part on the canvas, the
// Checks badge, the inspector) skip its render when its own slice is the same.
import type { PartResult, SolveSuccess, SolveWarning } from './resultTypes';
import type { NetTag, SolveView } from './solveView';

function sameWarning(a: SolveWarning, b: SolveWarning): boolean {
  return a.code === b.code && a.severity === b.severity && a.partId === b.partId && a.net === b.net && a.message === b.message;
}

function sameWarnings(a: readonly SolveWarning[], b: readonly SolveWarning[]): boolean {
  return a.length === b.length && a.every((w, i) => sameWarning(w, b[i]));
}

function sameFlat(a: Record<string, unknown> | undefined, b: Record<string, unknown> | undefined): boolean {
  if (a === b) return true;
  if (!a || !b) return false;
  const ka = Object.keys(a);
  return ka.length === Object.keys(b).length && ka.every((k) => Object.is(a[k], b[k]));
}

function samePart(a: PartResult, b: PartResult): boolean {
  return Object.is(a.power, b.power) && sameFlat(a.pinCurrents, b.pinCurrents) && sameFlat(a.derived, b.derived) && sameWarnings(a.warnings, b.warnings);
}

/** `next` with every entry equal to `prev`'s replaced by `prev`'s; `prev` itself when all are equal. */
function shareRecord<T>(prev: Record<string, T>, next: Record<string, T>, same: (a: T, b: T) => boolean): Record<string, T> {
  const keys = Object.keys(next);
  let all = keys.length === Object.keys(prev).length;
  const out: Record<string, T> = {};
  for (const k of keys) {
    const p = prev[k];
    if (p !== undefined && same(p, next[k])) out[k] = p;
    else {
      out[k] = next[k];
      all = false;
    }
  }
  return all ? prev : out;
}

const sameTag = (a: NetTag, b: NetTag) => a.net === b.net && Object.is(a.volts, b.volts);

function shareResult(prev: SolveSuccess | null, next: SolveSuccess | null): SolveSuccess | null {
  if (!prev || !next) return next;
  const parts = shareRecord(prev.parts, next.parts, samePart);
  return parts === next.parts ? next : { ...next, parts };
}

/** The new view, reusing the previous view's objects wherever their content is unchanged. */
export function shareView(prev: SolveView, next: SolveView): SolveView {
  const byPart = shareRecord(prev.byPart, next.byPart, sameWarnings);
  return {
    ...next,
    result: shareResult(prev.result, next.result),
    warnings: sameWarnings(prev.warnings, next.warnings) ? prev.warnings : next.warnings,
    byPart,
    tags: shareRecord(prev.tags, next.tags, sameTag),
    pinNets: sameFlat(prev.pinNets, next.pinNets) ? prev.pinNets : next.pinNets,
  };
}
