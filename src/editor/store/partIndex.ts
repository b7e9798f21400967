// Part lookup by id for the many readers of one document version (every node on the canvas
// looks up its own part after each change): one map per parts array, built on first use.
import type { Part } from '../../../shared/sheet';

const maps = new WeakMap<readonly Part[], Map<string, Part>>();

/** The part with `id` in `parts`, or undefined. O(1) after the first lookup in this array. */
export function partById(parts: readonly Part[], id: string): Part | undefined {
  let map = maps.get(parts);
  if (!map) {
    map = new Map(parts.map((p) => [p.id, p] as const));
    maps.set(parts, map);
  }
  return map.get(id);
}
