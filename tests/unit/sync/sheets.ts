// Small sheets and random edits for the sync tests (invented demo circuits).
import fc from 'fast-check';
import type { JsonObject } from '../../../shared/sync';

/** A 9 V battery, a 10 kΩ / 10 kΩ divider and a ground, wires with ids (demo data). */
export function divider(): JsonObject {
  return {
    format: 'tapline.sheet',
    version: 1,
    title: 'Half-supply tap (demo)',
    conditions: { temperatureC: 25, illuminanceLux: 100 },
    parts: [
      { id: 'V1', type: 'dc_voltage_source', params: { voltage: 9 }, position: { x: 0, y: 0 } },
      { id: 'R1', type: 'resistor', params: { resistance: 10000 }, position: { x: 100, y: 0 } },
      { id: 'R2', type: 'resistor', params: { resistance: 10000 }, position: { x: 100, y: 100 } },
      { id: 'GND', type: 'ground', position: { x: 0, y: 200 } },
    ],
    wires: [
      { id: 'w1', from: 'V1.pos', to: 'R1.a' },
      { id: 'w2', from: 'R1.b', to: 'R2.a' },
      { id: 'w3', from: 'R2.b', to: 'GND.g' },
      { id: 'w4', from: 'V1.neg', to: 'GND.g' },
    ],
  };
}

export type Edit =
  | { kind: 'move'; pick: number; x: number; y: number }
  | { kind: 'value'; pick: number; value: number }
  | { kind: 'add'; at: number; value: number }
  | { kind: 'delete'; pick: number }
  | { kind: 'wire'; a: number; b: number }
  | { kind: 'unwire'; pick: number }
  | { kind: 'reorder'; from: number; to: number }
  | { kind: 'title'; text: string }
  | { kind: 'unsetTolerance'; pick: number };

export const editArb: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ kind: fc.constant('move' as const), pick: fc.nat(), x: fc.integer({ min: -500, max: 500 }), y: fc.integer({ min: -500, max: 500 }) }),
  fc.record({ kind: fc.constant('value' as const), pick: fc.nat(), value: fc.integer({ min: 1, max: 1e6 }) }),
  fc.record({ kind: fc.constant('add' as const), at: fc.nat(), value: fc.integer({ min: 1, max: 1e6 }) }),
  fc.record({ kind: fc.constant('delete' as const), pick: fc.nat() }),
  fc.record({ kind: fc.constant('wire' as const), a: fc.nat(), b: fc.nat() }),
  fc.record({ kind: fc.constant('unwire' as const), pick: fc.nat() }),
  fc.record({ kind: fc.constant('reorder' as const), from: fc.nat(), to: fc.nat() }),
  fc.record({ kind: fc.constant('title' as const), text: fc.string({ maxLength: 8 }) }),
  fc.record({ kind: fc.constant('unsetTolerance' as const), pick: fc.nat() }),
);

type Part = { id: string; type: string; params?: Record<string, unknown>; position?: { x: number; y: number } };
type Wire = { id: string; from: string; to: string };

let counter = 0;
/** A fresh id no other client will pick (tests of concurrent adds pass their own prefix). */
export function freshId(prefix: string): string {
  counter += 1;
  return `${prefix}${counter}`;
}

/**
 * Apply one edit to a mutable sheet the way an editor command would (a delete takes the part's
 * wires with it; new parts are resistors). Returns false when the edit does not fit the sheet.
 */
export function applyEdit(d: JsonObject, e: Edit, idPrefix = 'RN'): boolean {
  const parts = d.parts as unknown as Part[];
  const wires = d.wires as unknown as Wire[];
  const resistors = parts.filter((p) => p.type === 'resistor');
  switch (e.kind) {
    case 'move': {
      if (!parts.length) return false;
      parts[e.pick % parts.length].position = { x: e.x, y: e.y };
      return true;
    }
    case 'value': {
      if (!resistors.length) return false;
      const r = resistors[e.pick % resistors.length];
      r.params = { ...r.params, resistance: e.value };
      return true;
    }
    case 'add': {
      const part: Part = { id: freshId(idPrefix), type: 'resistor', params: { resistance: e.value, tolerance: 0.05 }, position: { x: 0, y: 0 } };
      parts.splice(e.at % (parts.length + 1), 0, part);
      return true;
    }
    case 'delete': {
      if (!parts.length) return false;
      const [gone] = parts.splice(e.pick % parts.length, 1);
      for (let i = wires.length - 1; i >= 0; i--) if (wires[i].from.startsWith(`${gone.id}.`) || wires[i].to.startsWith(`${gone.id}.`)) wires.splice(i, 1);
      return true;
    }
    case 'wire': {
      if (resistors.length < 2) return false;
      const a = resistors[e.a % resistors.length];
      const b = resistors[e.b % resistors.length];
      if (a === b) return false;
      wires.push({ id: freshId(`w-${idPrefix}`), from: `${a.id}.b`, to: `${b.id}.a` });
      return true;
    }
    case 'unwire': {
      if (!wires.length) return false;
      wires.splice(e.pick % wires.length, 1);
      return true;
    }
    case 'reorder': {
      if (parts.length < 2) return false;
      const [p] = parts.splice(e.from % parts.length, 1);
      parts.splice(e.to % (parts.length + 1), 0, p);
      return true;
    }
    case 'title':
      d.title = e.text;
      return true;
    case 'unsetTolerance': {
      const withTol = resistors.filter((r) => r.params && 'tolerance' in r.params);
      if (!withTol.length) return false;
      delete withTol[e.pick % withTol.length].params!.tolerance;
      return true;
    }
  }
}
