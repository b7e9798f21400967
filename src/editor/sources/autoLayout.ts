// Positions for parts a sheet file leaves without one (positions are optional in the format).
// A plain layered layout: columns by distance from the first source along shared nets, grounds
// under their neighbour. Only for a first look; the user moves parts from there.
import { extractNets, type Part, type Sheet } from '../../../shared/sheet';
import { GRID } from '../symbols/geometry';

const COL = 8 * GRID;
const ROW = 7 * GRID;

/** The sheet with every missing position filled (unchanged object when none is missing). */
export function layoutMissingPositions(sheet: Sheet): Sheet {
  if (sheet.parts.every((p) => p.position)) return sheet;
  const nets = extractNets(sheet);
  const neighbours = new Map<string, Set<string>>();
  for (const net of nets.nets) {
    if (net.isGround) continue; // the ground net joins everything; it says little about layout
    const ids = [...new Set(net.pins.map((r) => r.slice(0, r.indexOf('.'))))];
    for (const a of ids) for (const b of ids) if (a !== b) (neighbours.get(a) ?? neighbours.set(a, new Set()).get(a)!).add(b);
  }
  const start = sheet.parts.find((p) => p.type === 'dc_voltage_source' || p.type === 'dc_current_source') ?? sheet.parts[0];
  const depth = new Map<string, number>();
  const queue = start ? [start.id] : [];
  if (start) depth.set(start.id, 0);
  while (queue.length) {
    const id = queue.shift()!;
    for (const n of neighbours.get(id) ?? [])
      if (!depth.has(n)) {
        depth.set(n, depth.get(id)! + 1);
        queue.push(n);
      }
  }
  const rows = new Map<number, number>();
  const placed = new Map<string, { x: number; y: number }>();
  const groundLike = (p: Part) => p.type === 'ground';
  for (const p of sheet.parts) {
    if (p.position || groundLike(p)) continue;
    const col = depth.get(p.id) ?? Math.max(0, ...depth.values()) + 1;
    const row = rows.get(col) ?? 0;
    rows.set(col, row + 1);
    placed.set(p.id, { x: COL + col * COL, y: ROW + row * ROW });
  }
  let groundCol = 0;
  const parts = sheet.parts.map((p) => {
    if (p.position) return p;
    let pos = placed.get(p.id);
    if (!pos) pos = { x: COL + groundCol++ * COL, y: ROW + Math.max(1, ...rows.values()) * ROW };
    return { ...p, position: pos } as Part;
  });
  return { ...sheet, parts };
}
