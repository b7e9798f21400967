// Sheets for the design-tool tests (invented demo circuits).
import { parseSheet, type Sheet } from '../../../shared/sheet';

export function parsed(input: unknown): Sheet {
  const r = parseSheet(input);
  if (!r.ok) throw new Error(r.error.message);
  return r.sheet;
}

/** A 12 V supply and ground, nothing else: the designer's divider goes between them. */
export function supplyOnly(): Sheet {
  return parsed({
    format: 'tapline.sheet',
    version: 1,
    title: 'Bare supply',
    parts: [
      { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12, min: 10.5, max: 14.4 }, position: { x: 0, y: 0 } },
      { id: 'GND1', type: 'ground', params: {}, position: { x: 0, y: 120 } },
    ],
    wires: [{ from: 'V1.neg', to: 'GND1.g' }],
  });
}

/** 12 V over 27 kΩ / 10 kΩ, the tap labelled "tap" (references.md worked divider). */
export function divider(tolerance = 0.05): Sheet {
  return parsed({
    format: 'tapline.sheet',
    version: 1,
    title: 'Worked divider',
    parts: [
      { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12 } },
      { id: 'R1', type: 'resistor', params: { resistance: 27000, tolerance } },
      { id: 'R2', type: 'resistor', params: { resistance: 10000, tolerance } },
      { id: 'L1', type: 'net_label', params: { name: 'tap' } },
      { id: 'GND1', type: 'ground', params: {} },
    ],
    wires: [
      { from: 'V1.pos', to: 'R1.a' },
      { from: 'R1.b', to: 'R2.a' },
      { from: 'R2.a', to: 'L1.n' },
      { from: 'R2.b', to: 'GND1.g' },
      { from: 'V1.neg', to: 'GND1.g' },
    ],
  });
}
