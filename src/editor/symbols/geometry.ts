// Where each part type's pins sit, in canvas units, relative to the part's centre, before
// rotation. Every pin lies on the 20-unit grid and every box side is a multiple of 40, so a part
// whose centre is on the grid has its corner and all its pins on the grid in any rotation.
import type { PartType, Rotation } from '../../../shared/sheet';

/** The snapping grid, in canvas units (1 unit = 1 CSS px at zoom 1). */
export const GRID = 20;

export type Side = 'left' | 'right' | 'top' | 'bottom';

export interface PinGeometry {
  /** offset from the part centre, canvas units, unrotated */
  x: number;
  y: number;
  /** the direction a wire leaves the pin */
  side: Side;
}

export interface SymbolGeometry {
  /** unrotated box, canvas units */
  width: number;
  height: number;
  pins: Readonly<Record<string, PinGeometry>>;
}

const twoTerminal: SymbolGeometry = {
  width: 80,
  height: 40,
  pins: { a: { x: -40, y: 0, side: 'left' }, b: { x: 40, y: 0, side: 'right' } },
};
const diodeLike: SymbolGeometry = {
  width: 80,
  height: 40,
  pins: { anode: { x: -40, y: 0, side: 'left' }, cathode: { x: 40, y: 0, side: 'right' } },
};
const source: SymbolGeometry = {
  width: 40,
  height: 80,
  pins: { pos: { x: 0, y: -40, side: 'top' }, neg: { x: 0, y: 40, side: 'bottom' } },
};
const bjt: SymbolGeometry = {
  width: 80,
  height: 80,
  pins: {
    b: { x: -40, y: 0, side: 'left' },
    c: { x: 20, y: -40, side: 'top' },
    e: { x: 20, y: 40, side: 'bottom' },
  },
};

export const SYMBOL_GEOMETRY: Readonly<Record<PartType, SymbolGeometry>> = {
  resistor: twoTerminal,
  potentiometer: {
    width: 80,
    height: 80,
    pins: {
      a: { x: -40, y: 0, side: 'left' },
      w: { x: 0, y: -40, side: 'top' },
      b: { x: 40, y: 0, side: 'right' },
    },
  },
  dc_voltage_source: source,
  dc_current_source: source,
  diode: diodeLike,
  zener: diodeLike,
  led: diodeLike,
  npn: bjt,
  pnp: bjt,
  ntc: twoTerminal,
  ldr: twoTerminal,
  load: source,
  switch: twoTerminal,
  ground: { width: 40, height: 40, pins: { g: { x: 0, y: -20, side: 'top' } } },
  net_label: { width: 80, height: 40, pins: { n: { x: -40, y: 0, side: 'left' } } },
};

const SIDES_CW: readonly Side[] = ['top', 'right', 'bottom', 'left'];

/** Rotate an offset clockwise on screen (y grows downwards) by `rotation` degrees. */
export function rotateOffset(x: number, y: number, rotation: Rotation): { x: number; y: number } {
  // `0 - v` rather than `-v`: no negative zeros leaking into the document
  switch (rotation) {
    case 90:
      return { x: 0 - y, y: x };
    case 180:
      return { x: 0 - x, y: 0 - y };
    case 270:
      return { x: y, y: 0 - x };
    default:
      return { x, y };
  }
}

export function rotateSide(side: Side, rotation: Rotation): Side {
  return SIDES_CW[(SIDES_CW.indexOf(side) + rotation / 90) % 4];
}

/** The box a part occupies once rotated (canvas units). */
export function rotatedSize(type: PartType, rotation: Rotation): { width: number; height: number } {
  const g = SYMBOL_GEOMETRY[type];
  return rotation === 90 || rotation === 270 ? { width: g.height, height: g.width } : { width: g.width, height: g.height };
}

/** Pin offset from the centre and wire direction after rotation. */
export function rotatedPin(type: PartType, pin: string, rotation: Rotation): PinGeometry | undefined {
  const p = SYMBOL_GEOMETRY[type].pins[pin];
  if (!p) return undefined;
  return { ...rotateOffset(p.x, p.y, rotation), side: rotateSide(p.side, rotation) };
}

/** Absolute canvas position of a pin of a part placed with its centre at `center`. */
export function pinPosition(
  type: PartType,
  pin: string,
  center: { x: number; y: number },
  rotation: Rotation,
): { x: number; y: number; side: Side } | undefined {
  const p = rotatedPin(type, pin, rotation);
  return p && { x: center.x + p.x, y: center.y + p.y, side: p.side };
}

/** Nearest grid point (canvas units). */
export function snapToGrid(v: number): number {
  return Math.round(v / GRID) * GRID;
}

/** Advance of one character of the label face (mono, 11 px: 0.6 em), canvas units. */
const LABEL_CHAR = 6.6;

/**
 * Where a net label's flag ends, canvas units right of the part's centre in its unrotated frame:
 * the flag grows with the name so the whole name shows (at least the 80-unit box of the symbol).
 */
export function netLabelFlagEnd(name: string): number {
  return Math.max(36, -16 + name.length * LABEL_CHAR + 7);
}
