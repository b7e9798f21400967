// Every client and the server must agree on the id of each wire, because operations name wires by
// id. The id field is optional in the file format, so a sheet saved without them (an import, a
// REST save from a script) gets ids here, deterministically: the same sheet gives the same ids on
// every machine, with no round trip.
import type { Json, JsonObject } from './ops';

function isObject(v: unknown): v is JsonObject {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/**
 * The sheet with an `id` on every wire (missing or duplicate ids become `w<n>`, n the 1-based wire
 * position, suffixed until unique). Returns the same object when nothing was missing, so it is
 * cheap to call on every document that arrives whole.
 */
export function normalizeForSync<T extends JsonObject>(sheet: T): T {
  const wires = sheet.wires;
  if (!Array.isArray(wires)) return sheet;
  const used = new Set<string>();
  let changed = false;
  const taken = new Set(wires.map((w) => (isObject(w) && typeof w.id === 'string' ? w.id : '')).filter(Boolean));
  const next: Json[] = wires.map((w, i) => {
    if (!isObject(w)) return w;
    const id = typeof w.id === 'string' && w.id && !used.has(w.id) ? w.id : null;
    if (id) {
      used.add(id);
      return w;
    }
    changed = true;
    let fresh = `w${i + 1}`;
    for (let k = 2; used.has(fresh) || taken.has(fresh); k++) fresh = `w${i + 1}-${k}`;
    used.add(fresh);
    return { ...w, id: fresh };
  });
  return changed ? { ...sheet, wires: next } : sheet;
}
