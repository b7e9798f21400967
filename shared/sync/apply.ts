// The one pure apply function: the server runs it to decide whether a batch is accepted, every
// client runs it to replay the server's order, and the undo resolver runs its lenient form.
import { produce, type Draft } from 'immer';
import { describeElement, type Collection, type ElementRef, type FieldPath, type Json, type JsonObject, type SheetOp } from './ops';
import { normalizeForSync } from './normalize';

/** Why one operation cannot be applied to the document as it is now. */
export interface ApplyFailure {
  /** `conflict`: the document moved on (the part is gone, the id is taken); `invalid_request`: the operation is malformed. */
  code: 'conflict' | 'invalid_request';
  message: string;
  /** position of the failing operation in the batch */
  opIndex: number;
}

export type ApplyResult<D> = { ok: true; doc: D } | { ok: false; error: ApplyFailure };

const FORBIDDEN_KEYS = new Set(['__proto__', 'prototype', 'constructor']);

class OpError extends Error {
  constructor(readonly code: ApplyFailure['code'], message: string) {
    super(message);
  }
}

type Doc = JsonObject;
type Element = JsonObject;

function isObject(v: unknown): v is JsonObject {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/**
 * Values are copied in: the operation stays a record of what was sent (it is logged, re-applied
 * on rebase, and may be frozen), and later operations of the batch may change the copy.
 */
function copy<T extends Json>(value: T): T {
  return typeof value === 'object' && value !== null ? (structuredClone(value) as T) : value;
}

function listOf(doc: Doc, coll: Collection): Element[] {
  const list = doc[coll];
  if (list === undefined) {
    doc[coll] = [];
    return doc[coll] as Element[];
  }
  if (!Array.isArray(list)) throw new OpError('conflict', `The sheet's "${coll}" is not a list.`);
  return list as Element[];
}

function indexOfId(list: Element[], id: string): number {
  for (let i = 0; i < list.length; i++) if (isObject(list[i]) && list[i].id === id) return i;
  return -1;
}

function find(doc: Doc, ref: ElementRef): Element {
  const list = listOf(doc, ref.coll);
  const i = indexOfId(list, ref.id);
  if (i < 0) throw new OpError('conflict', `The ${describeElement(ref)} is no longer on the sheet (someone removed it).`);
  return list[i];
}

/** Index an element goes to when placed after `after` (null: first; gone: last). */
function slotAfter(list: Element[], after: string | null): number {
  if (after === null) return 0;
  const i = indexOfId(list, after);
  return i < 0 ? list.length : i + 1;
}

function partOfPin(ref: Json | undefined): string | null {
  if (typeof ref !== 'string') return null;
  const dot = ref.indexOf('.');
  return dot > 0 ? ref.slice(0, dot) : null;
}

function requirePinPart(doc: Doc, ref: Json | undefined, wireId: string): void {
  const pid = partOfPin(ref);
  // A malformed pin reference is left to the sheet schema, which names the field.
  if (pid !== null && indexOfId(listOf(doc, 'parts'), pid) < 0)
    throw new OpError('conflict', `Wire ${wireId} joins part ${pid}, which is no longer on the sheet (someone removed it).`);
}

function checkPath(path: FieldPath): void {
  if (!path.length) throw new OpError('invalid_request', 'A set or unset needs a field path.');
  for (const k of path)
    if (typeof k !== 'string' || !k || FORBIDDEN_KEYS.has(k)) throw new OpError('invalid_request', `"${String(k)}" is not an allowed field name.`);
}

function targetObject(doc: Doc, op: Extract<SheetOp, { op: 'set' | 'unset' }>): Element {
  checkPath(op.path);
  if (op.target === 'sheet') {
    if (op.path[0] === 'parts' || op.path[0] === 'wires')
      throw new OpError('invalid_request', `The sheet's "${op.path[0]}" change through insert, remove and move operations.`);
    return doc;
  }
  if (op.path[0] === 'id') throw new OpError('invalid_request', `An id is changed by removing the ${describeElement(op.target)} and inserting it again.`);
  return find(doc, op.target);
}

function applyOne(doc: Doc, op: Exclude<SheetOp, { op: 'replaceSheet' }>): void {
  switch (op.op) {
    case 'insert': {
      const id = op.value.id;
      if (typeof id !== 'string' || !id) throw new OpError('invalid_request', `A new ${op.coll === 'parts' ? 'part' : 'wire'} needs a string "id".`);
      const list = listOf(doc, op.coll);
      if (indexOfId(list, id) >= 0)
        throw new OpError('conflict', `There is already a ${describeElement({ coll: op.coll, id })} on the sheet (someone else added one with that id).`);
      if (op.coll === 'wires') {
        requirePinPart(doc, op.value.from, id);
        requirePinPart(doc, op.value.to, id);
      }
      list.splice(slotAfter(list, op.after), 0, copy(op.value));
      return;
    }
    case 'remove': {
      const list = listOf(doc, op.coll);
      const i = indexOfId(list, op.id);
      if (i < 0) return;
      list.splice(i, 1);
      if (op.coll === 'parts') {
        const wires = listOf(doc, 'wires');
        for (let w = wires.length - 1; w >= 0; w--)
          if (partOfPin(wires[w]?.from) === op.id || partOfPin(wires[w]?.to) === op.id) wires.splice(w, 1);
      }
      return;
    }
    case 'move': {
      const list = listOf(doc, op.coll);
      const i = indexOfId(list, op.id);
      if (i < 0) throw new OpError('conflict', `The ${describeElement(op)} is no longer on the sheet (someone removed it).`);
      if (op.after === op.id) return;
      const [el] = list.splice(i, 1);
      list.splice(slotAfter(list, op.after), 0, el);
      return;
    }
    case 'set': {
      let obj = targetObject(doc, op);
      if (op.target !== 'sheet' && op.target.coll === 'wires' && op.path.length === 1 && (op.path[0] === 'from' || op.path[0] === 'to'))
        requirePinPart(doc, op.value, op.target.id);
      for (const key of op.path.slice(0, -1)) {
        const next = obj[key];
        if (next === undefined) obj[key] = {};
        else if (!isObject(next)) throw new OpError('conflict', `Field "${op.path.join('.')}" cannot be set: "${key}" is not an object.`);
        obj = obj[key] as Element;
      }
      obj[op.path[op.path.length - 1]] = copy(op.value);
      return;
    }
    case 'unset': {
      let obj: Json | undefined = targetObject(doc, op);
      for (const key of op.path.slice(0, -1)) {
        obj = isObject(obj) ? obj[key] : undefined;
        if (!isObject(obj)) return;
      }
      if (isObject(obj)) delete obj[op.path[op.path.length - 1]];
      return;
    }
  }
}

function failAt(err: unknown, opIndex: number): never {
  if (err instanceof OpError) throw Object.assign(err, { opIndex });
  throw err;
}

function run<D extends object>(doc: D, ops: readonly SheetOp[], lenient: boolean, skipped: number[]): D {
  let current = doc;
  let i = 0;
  while (i < ops.length) {
    const op = ops[i];
    if (op.op === 'replaceSheet') {
      if (isObject(op.sheet)) current = normalizeForSync(op.sheet) as unknown as D;
      else if (lenient) skipped.push(i);
      else failAt(new OpError('invalid_request', 'replaceSheet needs a sheet object.'), i);
      i++;
      continue;
    }
    // Consecutive element and field operations share one immer draft.
    let end = i;
    while (end < ops.length && ops[end].op !== 'replaceSheet') end++;
    const from = i;
    current = produce(current, (draft: Draft<D>) => {
      for (let k = from; k < end; k++) {
        try {
          applyOne(draft as unknown as Doc, ops[k] as Exclude<SheetOp, { op: 'replaceSheet' }>);
        } catch (err) {
          if (lenient && err instanceof OpError) skipped.push(k);
          else failAt(err, k);
        }
      }
    }) as D;
    i = end;
  }
  return current;
}

/**
 * Apply a batch all or nothing. Unchanged parts and wires keep their identity (immer structural
 * sharing), so applying to a large sheet costs only what the batch touches plus the id lookups.
 */
export function applyOps<D extends object>(doc: D, ops: readonly SheetOp[]): ApplyResult<D> {
  try {
    return { ok: true, doc: run(doc, ops, false, []) };
  } catch (err) {
    if (err instanceof OpError) return { ok: false, error: { code: err.code, message: err.message, opIndex: (err as OpError & { opIndex?: number }).opIndex ?? 0 } };
    throw err;
  }
}

/** Apply what still applies and skip the rest (undo of a step others have since changed). */
export function applyOpsLenient<D extends object>(doc: D, ops: readonly SheetOp[]): { doc: D; skipped: number[] } {
  const skipped: number[] = [];
  return { doc: run(doc, ops, true, skipped), skipped };
}
