// The shared document (as the server keeps it: what was saved, defaults left out) and the
// editor's document (every default filled in, every part placed) differ only in what the editor
// fills in; this is that one step.
import { parseSheet, type Sheet } from '../../shared/sheet';
import type { JsonObject } from '../../shared/sync';

export type Positions = Record<string, { x: number; y: number }>;

/**
 * The editor's form of a shared document: parsed (defaults filled in), with `layout` giving a
 * position to parts the document leaves unplaced (computed once when the sheet opened).
 * Null when the document is not a valid sheet (the server never sends one).
 */
export function editorForm(doc: JsonObject, layout: Positions = {}): Sheet | null {
  const r = parseSheet(doc);
  if (!r.ok) return null;
  if (!r.sheet.parts.some((p) => !p.position && layout[p.id])) return r.sheet;
  return { ...r.sheet, parts: r.sheet.parts.map((p) => (p.position || !layout[p.id] ? p : { ...p, position: layout[p.id] })) };
}

/** Positions the editor gave to parts `shared` leaves unplaced (the auto-layout of an imported sheet). */
export function layoutOf(shared: JsonObject, editorDoc: Sheet): Positions {
  const placed = new Set(((shared.parts as JsonObject[] | undefined) ?? []).filter((p) => p.position).map((p) => p.id as string));
  const out: Positions = {};
  for (const p of editorDoc.parts) if (p.position && !placed.has(p.id)) out[p.id] = p.position;
  return out;
}
