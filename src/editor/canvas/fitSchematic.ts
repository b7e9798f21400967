// Zoom to fit that sees what is drawn, not just the part boxes: designators, values and readings
// sit outside each part (right of upright parts, above horizontal ones), so fitting the boxes
// alone cut the readings of the rightmost parts off. When a sheet is too big to fit at a zoom
// where values stay legible, the view starts at its top-left corner (the supply, in the usual
// left-to-right drawing) instead of cutting both sides.
import { useCallback, useEffect } from 'react';
import { getNodesBounds, useReactFlow, useStoreApi, type Node, type Rect } from '@xyflow/react';
import type { PartNodeData } from './flowAdapter';
import { labelRoom, labelSide } from './labelPlacement';

/** Zoom limits of a fit: never so far out that 10 px text drops below ~7.5 px. */
export const FIT_ZOOM = { min: 0.75, max: 1.4 };

/** Screen margin around the fitted drawing, px. */
const MARGIN = 24;

/** Room a net-tag badge takes past its pin, canvas units ("12.34 V" plus a short name). */
const TAG_ROOM = 64;

/** One part's box grown by its label block (labelPlacement.ts) and its net tags. */
function partExtent(node: Node): Rect {
  const d = node.data as Partial<PartNodeData>;
  const x = node.position.x;
  const y = node.position.y;
  const w = node.width ?? 0;
  const h = node.height ?? 0;
  let [x0, y0, x1, y1] = [x - 8, y - 16, x + w + 8, y + h + 16]; // tags beside the pins
  if (d.type === 'net_label') {
    // the flag grows with the name (not known here); its tag sits past the far end
    const reach = 80 + TAG_ROOM;
    const r = d.rotation ?? 0;
    if (r === 0) x1 = x + reach;
    else if (r === 180) x0 = x + w - reach;
    else if (r === 90) y1 = y + reach;
    else y0 = y + h - reach;
    return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
  }
  if (!d.type || d.type === 'ground') return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
  const room = labelRoom(d.type);
  const cx = x + w / 2;
  const cy = y + h / 2;
  switch (labelSide(d.type, d.rotation ?? 0)) {
    case 'right':
      [x1, y0, y1] = [Math.max(x1, x + w + 4 + room.width), Math.min(y0, cy - room.height / 2), Math.max(y1, cy + room.height / 2)];
      break;
    case 'left':
      [x0, y0, y1] = [Math.min(x0, x - 4 - room.width), Math.min(y0, cy - room.height / 2), Math.max(y1, cy + room.height / 2)];
      break;
    case 'above':
      [y0, x0, x1] = [Math.min(y0, y - 2 - room.height), Math.min(x0, cx - room.width / 2), Math.max(x1, cx + room.width / 2)];
      break;
    case 'below':
      [y1, x0, x1] = [Math.max(y1, y + h + 2 + room.height), Math.min(x0, cx - room.width / 2), Math.max(x1, cx + room.width / 2)];
      break;
  }
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

/** The bounds of the drawing, labels and tags included, canvas units. */
export function schematicBounds(nodes: Node[]): Rect {
  if (!nodes.length) return getNodesBounds(nodes);
  let [x0, y0, x1, y1] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const n of nodes) {
    const r = partExtent(n);
    x0 = Math.min(x0, r.x);
    y0 = Math.min(y0, r.y);
    x1 = Math.max(x1, r.x + r.width);
    y1 = Math.max(y1, r.y + r.height);
  }
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

/**
 * The viewport that shows `bounds` in a `width` × `height` pane: centred when it fits, else
 * anchored at its top-left corner.
 */
export function fitViewport(bounds: Rect, width: number, height: number): { x: number; y: number; zoom: number } {
  const fits = Math.min((width - 2 * MARGIN) / bounds.width, (height - 2 * MARGIN) / bounds.height);
  const zoom = Math.min(FIT_ZOOM.max, Math.max(FIT_ZOOM.min, fits));
  const place = (pane: number, start: number, size: number) =>
    size * zoom <= pane - 2 * MARGIN ? (pane - size * zoom) / 2 - start * zoom : MARGIN - start * zoom;
  return { x: place(width, bounds.x, bounds.width), y: place(height, bounds.y, bounds.height), zoom };
}

/** A stable "fit the schematic" for the canvas, the toolbar and the F key. */
export function useFitSchematic(): () => void {
  const rf = useReactFlow();
  const store = useStoreApi();
  return useCallback(() => {
    const nodes = rf.getNodes();
    const { width, height } = store.getState();
    if (!nodes.length || !width || !height) return;
    void rf.setViewport(fitViewport(schematicBounds(nodes), width, height));
  }, [rf, store]);
}

/**
 * Fit once, when the pane first has a size (React Flow measures it after the nodes are in):
 * a sheet that opens empty stays at the default view rather than jumping at the first part.
 */
export function useInitialFit(fit: () => void): void {
  const store = useStoreApi();
  useEffect(() => {
    let done = false;
    const check = () => {
      const { width, height, nodes } = store.getState();
      if (done || !width || !height) return;
      done = true;
      if (nodes.length) fit();
    };
    check();
    const off = store.subscribe(check);
    return off;
  }, [store, fit]);
}
