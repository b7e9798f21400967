// Shared set-up for the headless editor tests: an empty sheet and pin lookups.
import { parseSheet, type Sheet } from '../../../shared/sheet';
import { pinPosition } from '../../../src/editor/symbols/geometry';
import type { Editor } from '../../../src/editor/store/actions';

export function emptySheet(): Sheet {
  const r = parseSheet({ format: 'tapline.sheet', version: 1, title: 'Test', parts: [], wires: [] });
  if (!r.ok) throw new Error(r.error.message);
  return r.sheet;
}

/** Canvas position of a pin ("R1.a") in the editor's current document. */
export function pinAt(editor: Editor, ref: string): { x: number; y: number } {
  const [id, pin] = ref.split('.');
  const part = editor.getDoc().parts.find((p) => p.id === id);
  if (!part) throw new Error(`no part ${id}`);
  const p = pinPosition(part.type, pin, part.position ?? { x: 0, y: 0 }, part.rotation ?? 0);
  if (!p) throw new Error(`no pin ${ref}`);
  return { x: p.x, y: p.y };
}

export function partOf(editor: Editor, id: string) {
  const p = editor.getDoc().parts.find((q) => q.id === id);
  if (!p) throw new Error(`no part ${id}`);
  return p;
}
