// The schematic as a picture (SVG or PNG) with html-to-image: the canvas viewport is rendered
// with a transform that fits every part, on the theme's paper colour, without the pan/zoom
// controls, selection boxes or the sliders' browser chrome.
import { toPng, toSvg } from 'html-to-image';
import { getViewportForBounds, type Node } from '@xyflow/react';
import { schematicBounds } from '../../canvas/fitSchematic';

export interface PictureOptions {
  /** output size, CSS px (PNG is drawn at pixelRatio times this) */
  width?: number;
  height?: number;
  pixelRatio?: number;
  background?: string;
}

function viewportOf(root: ParentNode): HTMLElement {
  const el = root.querySelector<HTMLElement>('.react-flow__viewport');
  if (!el) throw new Error('The schematic canvas is not on screen; open the sheet in the editor and try again.');
  return el;
}

// parts of the canvas that are interaction aids, not part of the drawing
const SKIP = ['react-flow__handle', 'react-flow__nodesselection', 'react-flow__selection', 'tl-slider'];
const keep = (n: HTMLElement) => !(n.classList && SKIP.some((c) => n.classList.contains(c)));

function frame(nodes: Node[], o: PictureOptions) {
  if (!nodes.length) throw new Error('The sheet is empty: place some parts before exporting a picture.');
  const bounds = schematicBounds(nodes); // labels and readings included
  const pad = 40;
  const width = o.width ?? Math.min(2400, Math.max(480, Math.ceil(bounds.width + 2 * pad)));
  const height = o.height ?? Math.min(1800, Math.max(320, Math.ceil(bounds.height + 2 * pad)));
  const vp = getViewportForBounds(bounds, width, height, 0.2, 2, 0.08);
  return {
    width,
    height,
    style: { width: `${width}px`, height: `${height}px`, transform: `translate(${vp.x}px, ${vp.y}px) scale(${vp.zoom})` },
  };
}

function background(o: PictureOptions): string {
  return o.background ?? (getComputedStyle(document.documentElement).getPropertyValue('--tl-paper').trim() || '#ffffff');
}

/** PNG data URL of the schematic in `root` (the canvas element or the document). */
export async function schematicPng(root: ParentNode, nodes: Node[], o: PictureOptions = {}): Promise<string> {
  const f = frame(nodes, o);
  return toPng(viewportOf(root), { backgroundColor: background(o), width: f.width, height: f.height, style: f.style, pixelRatio: o.pixelRatio ?? 2, filter: keep });
}

/** SVG data URL of the schematic (vector lines and text inside an SVG foreignObject). */
export async function schematicSvg(root: ParentNode, nodes: Node[], o: PictureOptions = {}): Promise<string> {
  const f = frame(nodes, o);
  return toSvg(viewportOf(root), { backgroundColor: background(o), width: f.width, height: f.height, style: f.style, filter: keep });
}
