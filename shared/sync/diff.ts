// Translates one local change (the document before and after an editor batch) into id-addressed
// operations. Diffing the two documents rather than reading the immer patches keeps the meaning
// of array edits: an immer splice is "replace every later index", a diff is "remove part R2".
// Unchanged parts are the same objects in both documents (immer structural sharing), so this
// costs one identity check per part plus the work on what actually changed.
import { COLLECTIONS, type Collection, type FieldPath, type Json, type JsonObject, type SheetOp, type Target } from './ops';

function isObject(v: unknown): v is JsonObject {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Structural equality of JSON values (key order ignored). */
export function jsonEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== typeof b || a === null || b === null || typeof a !== 'object') return false;
  if (Array.isArray(a)) return Array.isArray(b) && a.length === b.length && a.every((x, i) => jsonEqual(x, b[i]));
  if (Array.isArray(b)) return false;
  const ak = Object.keys(a as object).filter((k) => (a as JsonObject)[k] !== undefined);
  const bk = Object.keys(b as object).filter((k) => (b as JsonObject)[k] !== undefined);
  return ak.length === bk.length && ak.every((k) => jsonEqual((a as JsonObject)[k], (b as JsonObject)[k]));
}

/** set/unset operations turning object `a` into `b` under `target`; nested objects are diffed by key. */
function diffFields(target: Target, a: JsonObject, b: JsonObject, path: string[], skip: ReadonlySet<string>, out: SheetOp[]): void {
  for (const key of Object.keys(b)) {
    if (skip.has(key) || b[key] === undefined) continue;
    const av = a[key];
    const bv = b[key];
    if (av === bv) continue;
    if (isObject(av) && isObject(bv)) diffFields(target, av, bv, [...path, key], NO_SKIP, out);
    else if (!jsonEqual(av, bv)) out.push({ op: 'set', target, path: [...path, key] as FieldPath, value: bv as Json });
  }
  for (const key of Object.keys(a)) {
    if (skip.has(key) || a[key] === undefined) continue;
    if (b[key] === undefined) out.push({ op: 'unset', target, path: [...path, key] });
  }
}

const NO_SKIP: ReadonlySet<string> = new Set();
const ELEMENT_SKIP: ReadonlySet<string> = new Set(['id']);
const SHEET_SKIP: ReadonlySet<string> = new Set(COLLECTIONS);

function elements(list: unknown): JsonObject[] {
  return Array.isArray(list) ? list.filter((e): e is JsonObject => isObject(e) && typeof e.id === 'string') : [];
}

/** Indexes (into `seq`) of one longest strictly increasing subsequence. */
function longestIncreasing(seq: number[]): Set<number> {
  const tails: number[] = [];
  const prev = new Array<number>(seq.length).fill(-1);
  for (let i = 0; i < seq.length; i++) {
    let lo = 0;
    let hi = tails.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (seq[tails[mid]] < seq[i]) lo = mid + 1;
      else hi = mid;
    }
    if (lo > 0) prev[i] = tails[lo - 1];
    tails[lo] = i;
  }
  const keep = new Set<number>();
  for (let i = tails.length ? tails[tails.length - 1] : -1; i >= 0; i = prev[i]) keep.add(i);
  return keep;
}

interface CollectionDiff {
  placements: SheetOp[];
  updates: SheetOp[];
  removes: SheetOp[];
}

function diffCollection(coll: Collection, before: unknown, after: unknown): CollectionDiff {
  const a = elements(before);
  const b = elements(after);
  const byIdA = new Map(a.map((e, i) => [e.id as string, { e, i }]));
  const idsB = new Set(b.map((e) => e.id as string));
  const removes: SheetOp[] = a.filter((e) => !idsB.has(e.id as string)).map((e) => ({ op: 'remove', coll, id: e.id as string }));

  // Elements present in both, in their new order, with their old positions: those on a longest
  // increasing run stay put, the others are moved.
  const common = b.filter((e) => byIdA.has(e.id as string));
  const stable = longestIncreasing(common.map((e) => byIdA.get(e.id as string)!.i));
  const movedIds = new Set(common.filter((_, k) => !stable.has(k)).map((e) => e.id as string));

  const placements: SheetOp[] = [];
  const updates: SheetOp[] = [];
  b.forEach((e, k) => {
    const id = e.id as string;
    const after = k === 0 ? null : (b[k - 1].id as string);
    const old = byIdA.get(id);
    if (!old) {
      placements.push({ op: 'insert', coll, value: e, after });
      return;
    }
    if (movedIds.has(id)) placements.push({ op: 'move', coll, id, after });
    if (old.e !== e) diffFields({ coll, id }, old.e, e, [], ELEMENT_SKIP, updates);
  });
  return { placements, updates, removes };
}

/**
 * The operations that turn `before` into `after`, ordered so each one is valid when applied in
 * turn: new parts first (new wires may reference them), then part edits, wire changes, and part
 * removals last (a part removal takes its wires with it, so wires re-pointed away from it must be
 * changed before). Returns [] when the documents are equal.
 */
export function diffSheets(before: JsonObject, after: JsonObject): SheetOp[] {
  if (before === after) return [];
  const parts = diffCollection('parts', before.parts, after.parts);
  const wires = diffCollection('wires', before.wires, after.wires);
  const sheet: SheetOp[] = [];
  diffFields('sheet', before, after, [], SHEET_SKIP, sheet);
  return [...parts.placements, ...parts.updates, ...wires.removes, ...wires.placements, ...wires.updates, ...parts.removes, ...sheet];
}
