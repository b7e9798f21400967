// Session-only "what if this part sits at the end of its tolerance": the corner overrides are
// applied to a copy of the sheet handed to the solver, never written to the document.
import { partSpecs } from '../../../shared/parts/specs';
import type { Part, Sheet } from '../../../shared/sheet';
import type { Corner } from '../model/scopes';

/** The params a corner changes for a part type, and how. Empty when the part has no tolerance. */
export function cornerParams(type: Part['type']): Array<{ name: string; label: string; how: string }> {
  return partSpecs[type].params.flatMap((p) =>
    p.tolerance
      ? [{ name: p.name, label: p.label, how: p.tolerance.kind === 'fraction' ? `± ${p.tolerance.param}` : `${p.tolerance.minParam}…${p.tolerance.maxParam}` }]
      : [],
  );
}

/** Whether switching the part to a corner would change anything. */
export function hasCorners(part: Part): boolean {
  return cornerValues(part, 'min') !== null;
}

/** The part's params at a corner, or null when nothing can vary (no tolerance, no supply range). */
export function cornerValues(part: Part, corner: Corner): Record<string, number> | null {
  const params = part.params as Record<string, unknown>;
  const out: Record<string, number> = {};
  for (const info of partSpecs[part.type].params) {
    const tol = info.tolerance;
    const nominal = params[info.name];
    if (!tol || typeof nominal !== 'number') continue;
    if (tol.kind === 'fraction') {
      const t = params[tol.param];
      if (typeof t !== 'number' || t <= 0) continue;
      out[info.name] = nominal * (corner === 'min' ? 1 - t : 1 + t);
    } else {
      const v = params[corner === 'min' ? tol.minParam : tol.maxParam];
      if (typeof v === 'number') out[info.name] = v;
    }
  }
  return Object.keys(out).length ? out : null;
}

/** A copy of the sheet with each overridden part at its corner (unchanged sheet when none apply). */
export function applyCorners(sheet: Sheet, corners: Readonly<Record<string, Corner>>): Sheet {
  const ids = Object.keys(corners);
  if (!ids.length) return sheet;
  return {
    ...sheet,
    parts: sheet.parts.map((p) => {
      const corner = corners[p.id];
      const values = corner && cornerValues(p, corner);
      return values ? ({ ...p, params: { ...p.params, ...values } } as Part) : p;
    }),
  };
}
