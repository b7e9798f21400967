// Document commands: pure recipes over a draft sheet. The store runs them through applyLocal,
// so each one is an undoable, syncable patch batch. Positions are part centres, canvas units.
import { original, type Draft } from 'immer';
import { nextPartId, splitPinRef, type Part, type PartType, type Position, type Rotation, type Sheet, type Wire } from '../../../shared/sheet';
import { partSpecs } from '../../../shared/parts/specs';
import { GRID, pinPosition, rotateOffset, snapToGrid, SYMBOL_GEOMETRY } from '../symbols/geometry';
import { placementParams } from '../model/placementDefaults';
import { newWireId } from './normalize';

type D = Draft<Sheet>;

/** Parts and the wires among them, as copied to the clipboard. */
export interface Fragment {
  parts: Part[];
  wires: Wire[];
}

/** Place a new part of `type` centred at `center` (snapped to the grid); returns its id. */
export function addPart(d: D, type: PartType, center: Position, rotation: Rotation = 0): string {
  const id = nextPartId(d as Sheet, type);
  const part = {
    id,
    type,
    params: placementParams(type, d.parts as Part[]),
    position: { x: snapToGrid(center.x), y: snapToGrid(center.y) },
    rotation,
  } as Part;
  d.parts.push(part as Draft<Part>);
  return id;
}

function findPart(d: D, id: string): Draft<Part> | undefined {
  return d.parts.find((p) => p.id === id);
}

/** Move parts to new centres (already snapped by the canvas). */
export function moveParts(d: D, centers: Record<string, Position>): void {
  // Look the parts up in the base array: touching every draft part would make immer proxy all of
  // them on each frame of a drag.
  const base = (original(d.parts) ?? d.parts) as readonly Part[];
  base.forEach((p, i) => {
    const c = centers[p.id];
    if (!c || (p.position?.x === c.x && p.position?.y === c.y)) return;
    d.parts[i].position = { x: c.x, y: c.y };
  });
}

/**
 * Rotate parts by +90° (clockwise) or −90°. One part turns in place; several turn as a group about
 * their common centre (snapped to the grid), so their wiring keeps its shape.
 */
export function rotateParts(d: D, ids: readonly string[], direction: 1 | -1 = 1): void {
  const parts = ids.map((id) => findPart(d, id)).filter((p): p is Draft<Part> => !!p);
  if (!parts.length) return;
  const step = (direction === 1 ? 90 : 270) as Rotation;
  const pivot =
    parts.length === 1
      ? null
      : {
          x: snapToGrid(parts.reduce((s, p) => s + (p.position?.x ?? 0), 0) / parts.length),
          y: snapToGrid(parts.reduce((s, p) => s + (p.position?.y ?? 0), 0) / parts.length),
        };
  for (const p of parts) {
    p.rotation = (((p.rotation ?? 0) + step) % 360) as Rotation;
    if (pivot) {
      const pos = p.position ?? { x: 0, y: 0 };
      const off = rotateOffset(pos.x - pivot.x, pos.y - pivot.y, step);
      p.position = { x: pivot.x + off.x, y: pivot.y + off.y };
    }
  }
}

/** Delete parts (with every wire on their pins) and wires. */
export function deleteItems(d: D, partIds: readonly string[], wireIds: readonly string[]): void {
  const parts = new Set(partIds);
  const wires = new Set(wireIds);
  const touches = (ref: string) => parts.has(splitPinRef(ref)?.[0] ?? '');
  for (let i = d.wires.length - 1; i >= 0; i--) {
    const w = d.wires[i];
    if ((w.id && wires.has(w.id)) || touches(w.from) || touches(w.to)) d.wires.splice(i, 1);
  }
  for (let i = d.parts.length - 1; i >= 0; i--) if (parts.has(d.parts[i].id)) d.parts.splice(i, 1);
}

export type ConnectResult = { ok: true; wireId: string } | { ok: false; message: string };

/** Why two pins cannot be wired, or null when they can. */
export function connectProblem(sheet: Sheet, from: string, to: string): string | null {
  if (from === to) return 'A wire needs two different pins.';
  for (const ref of [from, to]) {
    const split = splitPinRef(ref);
    const part = split && sheet.parts.find((p) => p.id === split[0]);
    if (!split || !part) return `Pin ${ref} is not on the sheet.`;
    if (!partSpecs[part.type].pins.some((p) => p.name === split[1])) return `${part.id} has no pin "${split[1]}".`;
  }
  if (sheet.wires.some((w) => (w.from === from && w.to === to) || (w.from === to && w.to === from)))
    return `${from} and ${to} are already wired.`;
  return null;
}

/** Wire two pins, written "R1.a". */
export function connectPins(d: D, from: string, to: string): ConnectResult {
  const problem = connectProblem(d as Sheet, from, to);
  if (problem) return { ok: false, message: problem };
  const wireId = newWireId();
  d.wires.push({ id: wireId, from, to });
  return { ok: true, wireId };
}

/** Set (or, with undefined, remove) one param of a part. */
export function setParam(d: D, partId: string, name: string, value: unknown): void {
  const p = findPart(d, partId);
  if (!p) return;
  const params = p.params as Record<string, unknown>;
  if (value === undefined) delete params[name];
  else if (params[name] !== value) params[name] = value;
}

/** Copy a selection: the parts and only the wires with both ends inside it. */
export function copyFragment(sheet: Sheet, partIds: readonly string[]): Fragment {
  const ids = new Set(partIds);
  const parts = sheet.parts.filter((p) => ids.has(p.id));
  const inside = (ref: string) => ids.has(splitPinRef(ref)?.[0] ?? '');
  const wires = sheet.wires.filter((w) => inside(w.from) && inside(w.to));
  return structuredClone({ parts, wires });
}

/** Paste a fragment with fresh designators, shifted by `offset`; returns the new part ids. */
export function pasteFragment(d: D, fragment: Fragment, offset: Position = { x: 2 * GRID, y: 2 * GRID }): string[] {
  const rename = new Map<string, string>();
  const added: string[] = [];
  for (const src of fragment.parts) {
    const id = nextPartId(d as Sheet, src.type);
    rename.set(src.id, id);
    const pos = src.position ?? { x: 0, y: 0 };
    d.parts.push({
      ...structuredClone(src),
      id,
      position: { x: snapToGrid(pos.x + offset.x), y: snapToGrid(pos.y + offset.y) },
    } as Draft<Part>);
    added.push(id);
  }
  const mapRef = (ref: string) => {
    const s = splitPinRef(ref);
    const id = s && rename.get(s[0]);
    return id ? `${id}.${s[1]}` : null;
  };
  for (const w of fragment.wires) {
    const from = mapRef(w.from);
    const to = mapRef(w.to);
    if (from && to) d.wires.push({ ...structuredClone(w), id: newWireId(), from, to });
  }
  return added;
}

/** Why `next` cannot be the designator of part `current`, or null when it can. */
export function designatorProblem(sheet: Sheet, current: string, next: string): string | null {
  const id = next.trim();
  if (!id) return 'Enter a designator, e.g. R1.';
  if (/\s/.test(id)) return 'A designator has no spaces (write R1, not "R 1").';
  if (id.includes('.')) return 'A designator cannot contain "." (pins are written R1.a).';
  if (id.length > 24) return 'Keep the designator to 24 characters or fewer.';
  if (id !== current && sheet.parts.some((p) => p.id === id)) return `${id} is already used by another part.`;
  return null;
}

/** Rename a part and every wire end on it. Check designatorProblem first. */
export function renamePart(d: D, current: string, next: string): void {
  const p = findPart(d, current);
  const id = next.trim();
  if (!p || id === current) return;
  p.id = id;
  const mapRef = (ref: string) => (ref.startsWith(`${current}.`) ? `${id}${ref.slice(current.length)}` : ref);
  for (const w of d.wires) {
    w.from = mapRef(w.from);
    w.to = mapRef(w.to);
  }
}

/**
 * Wire together pins that sit on the same grid point when one of them belongs to `partIds`
 * (the parts just placed or moved), so pins that look joined are joined. Returns the wire count added.
 */
export function joinTouchingPins(d: D, partIds: readonly string[]): number {
  const moved = new Set(partIds);
  const at = new Map<string, string[]>();
  for (const p of d.parts) {
    for (const pin of Object.keys(SYMBOL_GEOMETRY[p.type].pins)) {
      const pos = pinPosition(p.type, pin, p.position ?? { x: 0, y: 0 }, p.rotation ?? 0)!;
      const key = `${pos.x},${pos.y}`;
      const list = at.get(key) ?? [];
      list.push(`${p.id}.${pin}`);
      at.set(key, list);
    }
  }
  let added = 0;
  for (const refs of at.values()) {
    if (refs.length < 2 || !refs.some((r) => moved.has(r.slice(0, r.indexOf('.'))))) continue;
    // chain them: a-b, b-c, … (skipping pairs already joined by a wire)
    for (let i = 1; i < refs.length; i++) if (connectPins(d, refs[i - 1], refs[i]).ok) added++;
  }
  return added;
}
