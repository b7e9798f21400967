// Small document fix-ups made when a sheet is opened (not undo steps).
import type { Sheet } from '../../../shared/sheet';

/** A new wire id: short, random, unique enough within one sheet and across co-editors. */
export function newWireId(): string {
  const c = globalThis.crypto;
  if (c?.randomUUID) return `w-${c.randomUUID().slice(0, 8)}`;
  return `w-${Math.random().toString(36).slice(2, 10)}`;
}

/**
 * Give every wire a stable `id` (an optional field of the format) so selection, canvas edges and
 * co-editing can name it. Returns the same object when nothing was missing.
 */
export function ensureWireIds(sheet: Sheet): Sheet {
  if (sheet.wires.every((w) => typeof w.id === 'string' && w.id)) return sheet;
  const used = new Set<string>();
  const wires = sheet.wires.map((w) => {
    let id = w.id && !used.has(w.id) ? w.id : newWireId();
    while (used.has(id)) id = newWireId();
    used.add(id);
    return id === w.id ? w : { ...w, id };
  });
  return { ...sheet, wires };
}
