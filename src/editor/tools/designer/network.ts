// A resistor combination as a small tree (series and parallel groups of single parts), laid out
// on the grid and added to a draft sheet: series groups stack downwards, parallel groups stand
// side by side. Every part is a vertical resistor (pin a on top).
import type { Draft } from 'immer';
import type { Topology } from '../../../../shared/design';
import type { Sheet } from '../../../../shared/sheet';
import { addPart, connectPins, setParam } from '../../store/commands';
import { GRID } from '../../symbols/geometry';

export type Network = { kind: 'part'; ohms: number } | { kind: 'series' | 'parallel'; children: Network[] };

const part = (ohms: number): Network => ({ kind: 'part', ohms });

/** The tree of a value-finder topology (parts in the order the topology's formula names them). */
export function networkOf(topology: Topology, parts: readonly number[]): Network {
  const [a, b, c] = parts.map(part);
  switch (topology) {
    case 'single':
      return a;
    case 'series':
      return { kind: 'series', children: [a, b] };
    case 'parallel':
      return { kind: 'parallel', children: [a, b] };
    case 'series3':
      return { kind: 'series', children: [a, b, c] };
    case 'parallel3':
      return { kind: 'parallel', children: [a, b, c] };
    case 'series-parallel':
      return { kind: 'series', children: [a, { kind: 'parallel', children: [b, c] }] };
    case 'parallel-series':
      return { kind: 'parallel', children: [a, { kind: 'series', children: [b, c] }] };
  }
}

/** Grid space a network takes: width and height in canvas units. */
export function networkSize(n: Network): { width: number; height: number } {
  if (n.kind === 'part') return { width: 4 * GRID, height: 4 * GRID };
  const sizes = n.children.map(networkSize);
  if (n.kind === 'series') return { width: Math.max(...sizes.map((s) => s.width)), height: sizes.reduce((a, s) => a + s.height, 0) + 2 * GRID * (sizes.length - 1) };
  return { width: sizes.reduce((a, s) => a + s.width, 0), height: Math.max(...sizes.map((s) => s.height)) };
}

export interface PartOptions {
  /** fraction, e.g. 0.01 */
  tolerance: number;
  /** W */
  powerRating: number;
}

export interface PlacedNetwork {
  /** pin refs at the network's two ends */
  top: string;
  bottom: string;
  ids: string[];
}

/** Add `n` with its top-left corner at `origin` (on the grid); wires its inner joints. */
export function addNetwork(d: Draft<Sheet>, n: Network, origin: { x: number; y: number }, o: PartOptions): PlacedNetwork {
  if (n.kind === 'part') {
    const id = addPart(d, 'resistor', { x: origin.x + 2 * GRID, y: origin.y + 2 * GRID }, 90);
    setParam(d, id, 'resistance', n.ohms);
    setParam(d, id, 'tolerance', o.tolerance);
    setParam(d, id, 'powerRating', o.powerRating);
    return { top: `${id}.a`, bottom: `${id}.b`, ids: [id] };
  }
  const placed: PlacedNetwork[] = [];
  let x = origin.x;
  let y = origin.y;
  for (const child of n.children) {
    const size = networkSize(child);
    placed.push(addNetwork(d, child, { x, y }, o));
    if (n.kind === 'series') y += size.height + 2 * GRID;
    else x += size.width;
  }
  for (let i = 1; i < placed.length; i++) {
    if (n.kind === 'series') connectPins(d, placed[i - 1].bottom, placed[i].top);
    else {
      connectPins(d, placed[i - 1].top, placed[i].top);
      connectPins(d, placed[i - 1].bottom, placed[i].bottom);
    }
  }
  return { top: placed[0].top, bottom: n.kind === 'series' ? placed[placed.length - 1].bottom : placed[0].bottom, ids: placed.flatMap((p) => p.ids) };
}

/** A free grid spot to the right of everything on the sheet (canvas units). */
export function freeSpot(sheet: Pick<Sheet, 'parts'>): { x: number; y: number } {
  const pos = sheet.parts.map((p) => p.position).filter((p): p is { x: number; y: number } => !!p);
  if (!pos.length) return { x: 0, y: 0 };
  const snap = (v: number) => Math.round(v / GRID) * GRID;
  return { x: snap(Math.max(...pos.map((p) => p.x)) + 8 * GRID), y: snap(Math.min(...pos.map((p) => p.y))) };
}
