import { partSpecs, type PartType } from '../parts/specs';
import type { Sheet } from './schema';

/** The next free id for a new part of `type`, e.g. "R3" when R1 and R2 exist. */
export function nextPartId(sheet: Pick<Sheet, 'parts'>, type: PartType): string {
  const prefix = partSpecs[type].designator;
  const used = new Set(sheet.parts.map((p) => p.id));
  let n = 1;
  for (const id of used) {
    if (!id.startsWith(prefix)) continue;
    const rest = id.slice(prefix.length);
    if (/^\d+$/.test(rest)) n = Math.max(n, Number(rest) + 1);
  }
  while (used.has(`${prefix}${n}`)) n++;
  return `${prefix}${n}`;
}
