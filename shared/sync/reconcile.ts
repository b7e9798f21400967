// Moves the editor's document to a target document with index-addressed immer patches, which is
// what the editor store applies (`applyRemote`). Only what differs is touched: elements keep
// their place and identity unless they changed, so the canvas re-renders just those.
import type { Patch } from 'immer';
import { jsonEqual } from './diff';
import { COLLECTIONS, type Json, type JsonObject } from './ops';

function isObject(v: unknown): v is JsonObject {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

type Path = (string | number)[];

function fieldPatches(a: JsonObject, b: JsonObject, base: Path, skip: ReadonlySet<string>, out: Patch[]): void {
  for (const key of Object.keys(b)) {
    if (skip.has(key) || b[key] === undefined) continue;
    const av = a[key];
    const bv = b[key];
    if (av === bv) continue;
    if (isObject(av) && isObject(bv)) fieldPatches(av, bv, [...base, key], NONE, out);
    else if (!jsonEqual(av, bv)) out.push({ op: av === undefined ? 'add' : 'replace', path: [...base, key], value: bv });
  }
  for (const key of Object.keys(a)) {
    if (skip.has(key) || a[key] === undefined) continue;
    if (b[key] === undefined) out.push({ op: 'remove', path: [...base, key] });
  }
}

const NONE: ReadonlySet<string> = new Set();
const COLLECTION_KEYS: ReadonlySet<string> = new Set(COLLECTIONS);

function idOf(e: Json | undefined): string | undefined {
  return isObject(e) && typeof e.id === 'string' ? e.id : undefined;
}

function listPatches(coll: string, current: Json[], target: Json[], out: Patch[]): void {
  const sim = [...current];
  const wanted = new Set(target.map(idOf));
  for (let i = sim.length - 1; i >= 0; i--) {
    if (!wanted.has(idOf(sim[i]))) {
      out.push({ op: 'remove', path: [coll, i] });
      sim.splice(i, 1);
    }
  }
  target.forEach((t, k) => {
    const id = idOf(t);
    if (k < sim.length && idOf(sim[k]) === id && id !== undefined) {
      const s = sim[k];
      if (s !== t && isObject(s) && isObject(t)) fieldPatches(s, t, [coll, k], NONE, out);
      return;
    }
    const j = id === undefined ? -1 : sim.findIndex((e, x) => x > k && idOf(e) === id);
    if (j >= 0) {
      out.push({ op: 'remove', path: [coll, j] });
      sim.splice(j, 1);
    }
    out.push({ op: 'add', path: [coll, k], value: t });
    sim.splice(k, 0, t);
  });
  for (let i = sim.length - 1; i >= target.length; i--) out.push({ op: 'remove', path: [coll, i] });
}

/**
 * Immer patches that turn `current` into a document equal to `target` (parts and wires matched
 * by id, in the target's order). Returns [] when they are already equal.
 */
export function patchesToReach(current: JsonObject, target: JsonObject): Patch[] {
  if (current === target) return [];
  const out: Patch[] = [];
  for (const coll of COLLECTIONS) {
    const a = current[coll];
    const b = target[coll];
    if (Array.isArray(a) && Array.isArray(b)) listPatches(coll, a, b, out);
    else if (!jsonEqual(a, b)) out.push(b === undefined ? { op: 'remove', path: [coll] } : { op: a === undefined ? 'add' : 'replace', path: [coll], value: b });
  }
  fieldPatches(current, target, [], COLLECTION_KEYS, out);
  return out;
}
