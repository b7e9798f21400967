// Demo sheets for the analysis tests (invented values, not test files themselves).
import type { SheetInput } from '../../../shared/sheet/schema';

/** 12 V over 27 kΩ / 10 kΩ, both ±5 %: the worked divider of shared/references.md. */
export function divider(opts: { r1Tol?: number; r2Tol?: number; vMin?: number; vMax?: number; load?: number } = {}): SheetInput {
  const parts: SheetInput['parts'] = [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12, ...(opts.vMin !== undefined ? { min: opts.vMin } : {}), ...(opts.vMax !== undefined ? { max: opts.vMax } : {}) } },
    { id: 'R1', type: 'resistor', params: { resistance: 27000, tolerance: opts.r1Tol ?? 0.05 } },
    { id: 'R2', type: 'resistor', params: { resistance: 10000, tolerance: opts.r2Tol ?? 0.05 } },
    { id: 'GND1', type: 'ground' },
    { id: 'TAP', type: 'net_label', params: { name: 'tap' } },
  ];
  const wires = [
    { from: 'V1.pos', to: 'R1.a' },
    { from: 'R1.b', to: 'R2.a' },
    { from: 'R2.b', to: 'GND1.g' },
    { from: 'V1.neg', to: 'GND1.g' },
    { from: 'TAP.n', to: 'R1.b' },
  ];
  if (opts.load !== undefined) {
    parts.push({ id: 'RL1', type: 'load', params: { mode: 'resistance', value: opts.load } });
    wires.push({ from: 'RL1.pos', to: 'R1.b' }, { from: 'RL1.neg', to: 'GND1.g' });
  }
  return { format: 'tapline.sheet', version: 1, parts, wires };
}

/** A Wheatstone-style bridge with a sense net "s" (linear, several paths to the net). */
export function bridge(): SheetInput {
  return {
    format: 'tapline.sheet',
    version: 1,
    parts: [
      { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5, internalResistance: 2 } },
      { id: 'R1', type: 'resistor', params: { resistance: 4700 } },
      { id: 'R2', type: 'resistor', params: { resistance: 3300 } },
      { id: 'R3', type: 'resistor', params: { resistance: 2200 } },
      { id: 'R4', type: 'resistor', params: { resistance: 6800 } },
      { id: 'R5', type: 'resistor', params: { resistance: 1000 } },
      { id: 'I1', type: 'dc_current_source', params: { current: 0.0002 } },
      { id: 'GND1', type: 'ground' },
      { id: 'S', type: 'net_label', params: { name: 's' } },
    ],
    wires: [
      { from: 'V1.pos', to: 'R1.a' },
      { from: 'V1.pos', to: 'R3.a' },
      { from: 'R1.b', to: 'R2.a' },
      { from: 'R3.b', to: 'R4.a' },
      { from: 'R2.b', to: 'GND1.g' },
      { from: 'R4.b', to: 'GND1.g' },
      { from: 'R1.b', to: 'R5.a' },
      { from: 'R5.b', to: 'R3.b' },
      { from: 'S.n', to: 'R5.b' },
      { from: 'I1.pos', to: 'R5.b' },
      { from: 'I1.neg', to: 'GND1.g' },
      { from: 'V1.neg', to: 'GND1.g' },
    ],
  };
}

/** A k×k grid of resistors (values varied so the matrix is not uniform), 5 V into one corner, ground at the other. */
export function resistorMesh(k: number): SheetInput {
  const parts: SheetInput['parts'] = [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5 } },
    { id: 'GND1', type: 'ground' },
    { id: 'MID', type: 'net_label', params: { name: 'mid' } },
  ];
  const wires: SheetInput['wires'] = [{ from: 'V1.neg', to: 'GND1.g' }];
  const first = new Map<number, string>();
  const attach = (node: number, pin: string) => {
    const f = first.get(node);
    if (f) wires.push({ from: f, to: pin });
    else first.set(node, pin);
  };
  let n = 0;
  for (let r = 0; r < k; r++)
    for (let c = 0; c < k; c++) {
      const here = r * k + c;
      for (const [dr, dc] of [[0, 1], [1, 0]]) {
        if (r + dr >= k || c + dc >= k) continue;
        const id = `R${++n}`;
        parts.push({ id, type: 'resistor', params: { resistance: 1000 + 37 * ((n * 7) % 11) } });
        attach(here, `${id}.a`);
        attach((r + dr) * k + c + dc, `${id}.b`);
      }
    }
  attach(0, 'V1.pos');
  attach(k * k - 1, 'GND1.g');
  attach(Math.floor(k / 2) * k + Math.floor(k / 2), 'MID.n');
  return { format: 'tapline.sheet', version: 1, parts, wires };
}
