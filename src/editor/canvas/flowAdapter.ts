// The one place document records become React Flow nodes and edges. Nothing here is stored:
// React Flow objects are rebuilt from the sheet and cached, so an unchanged part keeps its node
// object and an unchanged sheet keeps its node array (and React Flow skips them).
//
// A node carries only where the part is (id, type, centre, rotation), not its params: a slider
// step or a typed value changes the part but not its node, so React Flow has nothing to adopt,
// and the node's view reads the part itself from the editor store (PartNode.tsx).
import { Position as HandleSide, type Edge, type Node } from '@xyflow/react';
import type { Part, PartType, Position, Rotation, Sheet, Wire } from '../../../shared/sheet';
import { rotatedPin, rotatedSize, SYMBOL_GEOMETRY, type Side } from '../symbols/geometry';

/** What a node knows of its part: enough to place it and its pins, nothing that a value edit changes. */
export interface PartNodeData extends Record<string, unknown> {
  partId: string;
  type: PartType;
  /** the part's centre, canvas units */
  position: Position;
  rotation: Rotation;
}
export type PartFlowNode = Node<PartNodeData, 'part'>;

export interface WireEdgeData extends Record<string, unknown> {
  wire: Wire;
}
export type WireFlowEdge = Edge<WireEdgeData, 'wire'>;

export const SIDE_TO_HANDLE: Record<Side, HandleSide> = {
  left: HandleSide.Left,
  right: HandleSide.Right,
  top: HandleSide.Top,
  bottom: HandleSide.Bottom,
};

/** Handles are 10×10 boxes centred on the pin, in node-local coordinates. */
const HANDLE = 10;

/** The node's top-left corner for a part centre. */
export function nodeCorner(part: Part): { x: number; y: number } {
  const { width, height } = rotatedSize(part.type, part.rotation ?? 0);
  const c = part.position ?? { x: 0, y: 0 };
  return { x: c.x - width / 2, y: c.y - height / 2 };
}

/** The part centre for a node's top-left corner (inverse of nodeCorner). */
export function partCenter(part: Part, corner: { x: number; y: number }): { x: number; y: number } {
  const { width, height } = rotatedSize(part.type, part.rotation ?? 0);
  return { x: corner.x + width / 2, y: corner.y + height / 2 };
}

function buildNode(part: Part, selected: boolean, readOnly: boolean): PartFlowNode {
  const rotation = part.rotation ?? 0;
  const { width, height } = rotatedSize(part.type, rotation);
  const handles = Object.keys(SYMBOL_GEOMETRY[part.type].pins).map((pin) => {
    const p = rotatedPin(part.type, pin, rotation)!;
    return {
      id: pin,
      type: 'source' as const,
      position: SIDE_TO_HANDLE[p.side],
      x: p.x + width / 2 - HANDLE / 2,
      y: p.y + height / 2 - HANDLE / 2,
      width: HANDLE,
      height: HANDLE,
    };
  });
  return {
    id: part.id,
    type: 'part',
    position: nodeCorner(part),
    width,
    height,
    measured: { width, height },
    handles,
    selected,
    draggable: !readOnly,
    connectable: !readOnly,
    data: { partId: part.id, type: part.type, position: part.position ?? { x: 0, y: 0 }, rotation },
  };
}

function samePlacement(node: PartFlowNode, part: Part): boolean {
  const d = node.data;
  const c = part.position ?? { x: 0, y: 0 };
  return d.type === part.type && d.rotation === (part.rotation ?? 0) && d.position.x === c.x && d.position.y === c.y;
}

/** `next`, or `prev` when it holds the very same items (so React Flow sees an unchanged prop). */
function keepArray<T>(prev: readonly T[] | null, next: T[]): T[] {
  return prev && prev.length === next.length && next.every((x, i) => x === prev[i]) ? (prev as T[]) : next;
}

/** Build (or reuse) nodes for the sheet's parts. */
export function createNodeMapper() {
  const cache = new Map<string, { selected: boolean; readOnly: boolean; node: PartFlowNode }>();
  let last: PartFlowNode[] | null = null;
  return (parts: readonly Part[], selected: ReadonlySet<string>, readOnly: boolean): PartFlowNode[] => {
    const nodes = parts.map((part) => {
      const isSel = selected.has(part.id);
      const hit = cache.get(part.id);
      if (hit && hit.selected === isSel && hit.readOnly === readOnly && samePlacement(hit.node, part)) return hit.node;
      const node = buildNode(part, isSel, readOnly);
      cache.set(part.id, { selected: isSel, readOnly, node });
      return node;
    });
    if (cache.size > parts.length * 2) {
      // forget deleted parts now and then
      const ids = new Set(parts.map((p) => p.id));
      for (const id of cache.keys()) if (!ids.has(id)) cache.delete(id);
    }
    return (last = keepArray(last, nodes));
  };
}

/** Build (or reuse) edges for the sheet's wires. */
export function createEdgeMapper() {
  const cache = new WeakMap<Wire, { selected: boolean; edge: WireFlowEdge }>();
  let last: WireFlowEdge[] | null = null;
  return (wires: readonly Wire[], selected: ReadonlySet<string>): WireFlowEdge[] => {
    const edges = wires.map((wire) => {
      const id = wire.id ?? `${wire.from}~${wire.to}`;
      const isSel = selected.has(id);
      const hit = cache.get(wire);
      if (hit && hit.selected === isSel) return hit.edge;
      const [source, sourceHandle] = wire.from.split('.');
      const [target, targetHandle] = wire.to.split('.');
      const edge: WireFlowEdge = { id, type: 'wire', source, sourceHandle, target, targetHandle, selected: isSel, data: { wire } };
      cache.set(wire, { selected: isSel, edge });
      return edge;
    });
    return (last = keepArray(last, edges));
  };
}

/** How many wire ends sit on each pin ("R1.a" → 2): junction dots and open-pin rings use it. */
export function wireCounts(sheet: Pick<Sheet, 'wires'>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const w of sheet.wires) {
    out[w.from] = (out[w.from] ?? 0) + 1;
    out[w.to] = (out[w.to] ?? 0) + 1;
  }
  return out;
}
