// Positions for parts a sheet file leaves without one (positions are optional in the format).
// A ladder layout that reads like a hand-drawn DC schematic: one row per net, the highest voltage
// at the top and ground at the bottom, each part standing upright in a column of its own between
// the rows of the nets it joins. Voltages come from a first solve when one is available; without
// it, nets are ranked by distance from the first supply's + pin. Only a first look: the user
// moves parts from there.
import { extractNets, type Part, type Rotation, type Sheet } from '../../../shared/sheet';
import { partSpecs } from '../../../shared/parts/specs';
import { GRID, snapToGrid } from '../symbols/geometry';

const COL = 8 * GRID;
const ROW = 5 * GRID;
const LEFT = 6 * GRID;
const TOP = 5 * GRID;

/** Two-terminal parts drawn with pins left/right (unrotated): upright means rotating them. */
const SIDEWAYS = new Set<Part['type']>(['resistor', 'ntc', 'ldr', 'switch', 'diode', 'zener', 'led']);
const UPRIGHT = new Set<Part['type']>(['dc_voltage_source', 'dc_current_source', 'load']);
const FIRST_PIN: Partial<Record<Part['type'], [string, string]>> = {
  resistor: ['a', 'b'],
  ntc: ['a', 'b'],
  ldr: ['a', 'b'],
  switch: ['a', 'b'],
  diode: ['anode', 'cathode'],
  zener: ['cathode', 'anode'],
  led: ['anode', 'cathode'],
  dc_voltage_source: ['pos', 'neg'],
  dc_current_source: ['pos', 'neg'],
  load: ['pos', 'neg'],
};

/**
 * The sheet with every missing position (and the rotation of those parts) filled in.
 * `netVoltages` (net name → V) orders the rows; unchanged object when nothing is missing.
 */
export function layoutMissingPositions(sheet: Sheet, netVoltages?: Record<string, number>): Sheet {
  if (sheet.parts.every((p) => p.position)) return sheet;
  const nets = extractNets(sheet);
  const netOf = (id: string, pin: string) => nets.pinToNet[`${id}.${pin}`];
  const rank = netRanks(sheet, nets, netVoltages);
  const rowY = (net: string | undefined) => TOP + (rank.get(net ?? '') ?? 0) * ROW;
  const groundY = TOP + Math.max(1, ...rank.values()) * ROW;

  let column = 0;
  const groundCols: number[] = [];
  const out = sheet.parts.map((p): Part => {
    if (p.position) return p;
    if (p.type === 'ground') return p; // placed below, once the columns are known
    const x = LEFT + column++ * COL;
    const pins = FIRST_PIN[p.type];
    let rotation: Rotation = 0;
    let y: number;
    if (pins) {
      const [hi, lo] = pins;
      const yHi = rowY(netOf(p.id, hi));
      const yLo = rowY(netOf(p.id, lo));
      const flipped = yHi > yLo; // the "first" pin's net sits lower: stand the part on its head
      rotation = (SIDEWAYS.has(p.type) ? (flipped ? 270 : 90) : UPRIGHT.has(p.type) && flipped ? 180 : 0) as Rotation;
      y = (yHi + yLo) / 2;
    } else if (p.type === 'potentiometer') {
      rotation = 90;
      y = rowY(netOf(p.id, 'w'));
    } else if (p.type === 'npn' || p.type === 'pnp') {
      y = rowY(netOf(p.id, 'b'));
    } else {
      y = rowY(netOf(p.id, 'n'));
    }
    if (partSpecs[p.type].pins.some((pin) => netOf(p.id, pin.name) === '0')) groundCols.push(x);
    return { ...p, position: { x: snapToGrid(x), y: snapToGrid(y) }, rotation };
  });
  let g = 0;
  return {
    ...sheet,
    parts: out.map((p) => {
      if (p.position || p.type !== 'ground') return p;
      const x = groundCols[g] ?? LEFT + (column + g) * COL;
      g++;
      return { ...p, position: { x: snapToGrid(x), y: snapToGrid(groundY + 3 * GRID) }, rotation: 0 };
    }),
  };
}

/** Row index per net name: highest voltage first, ground last. */
function netRanks(sheet: Sheet, nets: ReturnType<typeof extractNets>, volts?: Record<string, number>): Map<string, number> {
  const names = nets.nets.filter((n) => !n.isGround).map((n) => n.name);
  let order: string[];
  if (volts && names.every((n) => typeof volts[n] === 'number')) order = [...names].sort((a, b) => volts[b] - volts[a]);
  else {
    // breadth-first from the first supply's + pin across parts
    const supply = sheet.parts.find((p) => p.type === 'dc_voltage_source' || p.type === 'dc_current_source');
    const start = supply ? nets.pinToNet[`${supply.id}.pos`] : names[0];
    const netsOfPart = new Map<string, string[]>();
    for (const [pin, net] of Object.entries(nets.pinToNet)) {
      const id = pin.slice(0, pin.indexOf('.'));
      (netsOfPart.get(id) ?? netsOfPart.set(id, []).get(id)!).push(net);
    }
    const dist = new Map<string, number>(start ? [[start, 0]] : []);
    const queue = start ? [start] : [];
    while (queue.length) {
      const net = queue.shift()!;
      for (const pins of netsOfPart.values())
        if (pins.includes(net))
          for (const n of pins)
            if (n !== '0' && !dist.has(n)) {
              dist.set(n, dist.get(net)! + 1);
              queue.push(n);
            }
    }
    order = [...names].sort((a, b) => (dist.get(a) ?? 99) - (dist.get(b) ?? 99));
  }
  const rank = new Map(order.map((n, i) => [n, i] as const));
  rank.set('0', order.length);
  return rank;
}
