// Net extraction: connected groups of pins (wires are transitive), ground, and net labels.
import { partSpecs } from '../parts/specs';
import { pinKey, splitPinRef, type Sheet } from './schema';

export const GROUND_NET = '0';

export interface Net {
  /** "0" for ground, the label name for labelled nets, otherwise "N1", "N2", … */
  name: string;
  /** index in NetList.nets */
  index: number;
  /** pins on the net, "R1.a", in part order then pin order */
  pins: string[];
  isGround: boolean;
  /** every distinct net-label name found on this net (the first names it unless it is ground) */
  labels: string[];
}

export interface NetNotice {
  code: 'net_label_conflict' | 'ground_label';
  net: string;
  message: string;
}

export interface NetList {
  nets: Net[];
  /** "R1.a" → net name */
  pinToNet: Record<string, string>;
  /** "R1.a" → index in nets */
  pinToIndex: Map<string, number>;
  /**
   * By position in sheet.parts: each pin's "R1.a" key and net index, in the part type's pin order
   * (empty for a part of unknown type). Saves callers a string build and lookup per pin.
   */
  partPins: Array<{ keys: string[]; nets: number[] }>;
  /** the ground net's index, or -1 when the sheet has no ground */
  groundIndex: number;
  byName: Map<string, Net>;
  notices: NetNotice[];
}

class UnionFind {
  parent: number[] = [];
  add(): number {
    this.parent.push(this.parent.length);
    return this.parent.length - 1;
  }
  find(i: number): number {
    let r = i;
    while (this.parent[r] !== r) r = this.parent[r];
    while (this.parent[i] !== r) {
      const n = this.parent[i];
      this.parent[i] = r;
      i = n;
    }
    return r;
  }
  union(a: number, b: number): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra === rb) return;
    // keep the smaller index as root so results are independent of wire order
    if (ra < rb) this.parent[rb] = ra;
    else this.parent[ra] = rb;
  }
}

/**
 * Group the sheet's pins into nets. Expects a valid sheet (parseSheet); wire ends that name an
 * unknown part or pin are ignored. Deterministic: the same sheet always gives the same names.
 */
export function extractNets(sheet: Pick<Sheet, 'parts' | 'wires'>): NetList {
  const uf = new UnionFind();
  // pin key → union-find slot; once the nets are known its values become net indices (pinToIndex)
  const pinIndex = new Map<string, number>();
  const pinOrder: string[] = [];
  const partSlots: Array<{ keys: string[]; slots: number[] }> = [];
  for (const part of sheet.parts) {
    const spec = partSpecs[part.type];
    const own = { keys: [] as string[], slots: [] as number[] };
    partSlots.push(own);
    if (!spec) continue;
    for (const pin of spec.pins) {
      const key = pinKey(part.id, pin.name);
      let slot = pinIndex.get(key);
      if (slot === undefined) {
        slot = uf.add();
        pinIndex.set(key, slot);
        pinOrder.push(key);
      }
      own.keys.push(key);
      own.slots.push(slot);
    }
  }
  for (const w of sheet.wires) {
    const a = pinIndex.get(w.from);
    const b = pinIndex.get(w.to);
    if (a === undefined || b === undefined) continue;
    uf.union(a, b);
  }

  // ground pins and labels join nets
  const groundPins: number[] = [];
  const labelPins = new Map<string, number[]>();
  for (const part of sheet.parts) {
    if (part.type === 'ground') {
      const i = pinIndex.get(pinKey(part.id, 'g'));
      if (i !== undefined) groundPins.push(i);
    } else if (part.type === 'net_label') {
      const i = pinIndex.get(pinKey(part.id, 'n'));
      const name = String((part.params as { name?: unknown }).name ?? '').trim();
      if (i === undefined || !name) continue;
      if (name === GROUND_NET) groundPins.push(i);
      else {
        const list = labelPins.get(name) ?? [];
        list.push(i);
        labelPins.set(name, list);
      }
    }
  }
  for (let k = 1; k < groundPins.length; k++) uf.union(groundPins[0], groundPins[k]);
  for (const list of labelPins.values()) for (let k = 1; k < list.length; k++) uf.union(list[0], list[k]);

  const groundRoot = groundPins.length ? uf.find(groundPins[0]) : -1;
  const labelsByRoot = new Map<number, string[]>();
  for (const part of sheet.parts) {
    if (part.type !== 'net_label') continue;
    const i = pinIndex.get(pinKey(part.id, 'n'));
    const name = String((part.params as { name?: unknown }).name ?? '').trim();
    if (i === undefined || !name || name === GROUND_NET) continue;
    const r = uf.find(i);
    const list = labelsByRoot.get(r) ?? [];
    if (!list.includes(name)) list.push(name);
    labelsByRoot.set(r, list);
  }

  // nets in order of first appearance (part order, then pin order)
  const rootToNet = new Map<number, Net>();
  const nets: Net[] = [];
  const netOfSlot = new Int32Array(pinOrder.length);
  for (const key of pinOrder) {
    const slot = pinIndex.get(key)!;
    const r = uf.find(slot);
    let net = rootToNet.get(r);
    if (!net) {
      net = { name: '', index: nets.length, pins: [], isGround: r === groundRoot, labels: labelsByRoot.get(r) ?? [] };
      rootToNet.set(r, net);
      nets.push(net);
    }
    net.pins.push(key);
    netOfSlot[slot] = net.index;
  }

  const notices: NetNotice[] = [];
  const taken = new Set<string>([GROUND_NET]);
  for (const net of nets) {
    if (net.isGround) {
      net.name = GROUND_NET;
      if (net.labels.length)
        notices.push({
          code: 'ground_label',
          net: GROUND_NET,
          message: `Net label${net.labels.length > 1 ? 's' : ''} ${net.labels.map((l) => `"${l}"`).join(', ')} ${net.labels.length > 1 ? 'are' : 'is'} on the ground net, which is always named "0".`,
        });
    } else if (net.labels.length) {
      net.name = net.labels[0];
      taken.add(net.name);
      if (net.labels.length > 1)
        notices.push({
          code: 'net_label_conflict',
          net: net.name,
          message: `Net labels ${net.labels.map((l) => `"${l}"`).join(', ')} are all on one net (joined by wires); it is named "${net.name}".`,
        });
    }
  }
  let counter = 0;
  for (const net of nets) {
    if (net.name) continue;
    let name: string;
    do name = `N${++counter}`;
    while (taken.has(name));
    taken.add(name);
    net.name = name;
  }

  const pinToIndex = pinIndex;
  for (const key of pinOrder) pinToIndex.set(key, netOfSlot[pinIndex.get(key)!]);
  const partPins = partSlots.map(({ keys, slots }) => ({ keys, nets: slots.map((s) => netOfSlot[s]) }));
  const byName = new Map(nets.map((n) => [n.name, n] as const));
  // built on first use: a plain object with tens of thousands of keys is slow to build
  let pinToNet: Record<string, string> | null = null;
  return {
    nets,
    get pinToNet() {
      if (!pinToNet) {
        pinToNet = {};
        for (const net of nets) for (const p of net.pins) pinToNet[p] = net.name;
      }
      return pinToNet;
    },
    pinToIndex,
    partPins,
    groundIndex: groundRoot === -1 ? -1 : rootToNet.get(groundRoot)!.index,
    byName,
    notices,
  };
}

/** Pins with no wire at all (and that are not a ground or label pin). */
export function unwiredPins(sheet: Pick<Sheet, 'parts' | 'wires'>): string[] {
  const wired = new Set<string>();
  for (const w of sheet.wires) {
    wired.add(w.from);
    wired.add(w.to);
  }
  const out: string[] = [];
  for (const part of sheet.parts) {
    if (part.type === 'ground' || part.type === 'net_label') continue;
    for (const pin of partSpecs[part.type].pins) {
      const k = pinKey(part.id, pin.name);
      if (!wired.has(k)) out.push(k);
    }
  }
  return out;
}

export { splitPinRef };
