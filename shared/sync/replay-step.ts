// Re-applying one of this user's own steps (an undo or a redo) to a document others have
// changed since: what they removed stays removed, and a part this step puts back whose id
// someone has taken since comes back under a fresh id, with its wires, instead of being lost or
// wired to their part.
import { applyOpsLenient } from './apply';
import type { JsonObject, SheetOp } from './ops';

/** Rename a part throughout a list of operations (its insert, edits, and the pins of wires). */
export function renamePartInOps(ops: readonly SheetOp[], from: string, to: string): SheetOp[] {
  const pin = (ref: unknown) => (typeof ref === 'string' && ref.startsWith(`${from}.`) ? `${to}${ref.slice(from.length)}` : ref);
  return ops.map((op): SheetOp => {
    switch (op.op) {
      case 'insert':
        if (op.coll === 'parts') return op.value.id === from ? { ...op, value: { ...op.value, id: to } } : op.after === from ? { ...op, after: to } : op;
        return { ...op, value: { ...op.value, from: pin(op.value.from) as string, to: pin(op.value.to) as string } };
      case 'remove':
      case 'move':
        return op.coll === 'parts' && op.id === from ? { ...op, id: to } : op;
      case 'set':
      case 'unset':
        if (op.target !== 'sheet' && op.target.coll === 'parts' && op.target.id === from) return { ...op, target: { coll: 'parts', id: to } };
        if (op.op === 'set' && op.target !== 'sheet' && op.target.coll === 'wires' && (op.path[0] === 'from' || op.path[0] === 'to') && op.path.length === 1)
          return { ...op, value: pin(op.value) as string };
        return op;
      case 'replaceSheet':
        return op;
    }
  });
}

export interface ReplayedStep<D> {
  doc: D;
  /** old id → new id of parts that came back under another id */
  renamed: Record<string, string>;
  /** how many operations no longer applied */
  skipped: number;
}

/**
 * Apply `ops` leniently to `doc`. `freshPartId(partsNow, part)` picks an id for a part whose
 * own id is taken (the editor passes its designator rule: the next free R<n>).
 */
export function replayStep<D extends JsonObject>(doc: D, ops: readonly SheetOp[], freshPartId: (parts: JsonObject[], part: JsonObject) => string): ReplayedStep<D> {
  let current = [...ops];
  const renamed: Record<string, string> = {};
  const taken = () => [
    ...((doc.parts as JsonObject[] | undefined) ?? []),
    ...current.flatMap((op) => (op.op === 'insert' && op.coll === 'parts' ? [op.value] : [])),
  ];
  for (let round = 0; round <= ops.length; round++) {
    const r = applyOpsLenient(doc, current);
    const clash = r.skipped.map((i) => current[i]).find((op): op is Extract<SheetOp, { op: 'insert' }> => op.op === 'insert' && op.coll === 'parts');
    if (!clash || typeof clash.value.id !== 'string') return { doc: r.doc, renamed, skipped: r.skipped.length };
    const to = freshPartId(taken(), clash.value);
    renamed[clash.value.id] = to;
    current = renamePartInOps(current, clash.value.id, to);
  }
  return { doc: applyOpsLenient(doc, current).doc, renamed, skipped: 0 };
}
