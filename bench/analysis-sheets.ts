// Demo sheets for bench/analysis.bench.ts (invented; demo data, not a real product).

/**
 * "Four-zone temperature indicator", demo data: one supply with a range, and four identical
 * channels of NTC divider → NPN switch → LED with its resistor. 30 parts, non-linear
 * (4 transistors, 4 LEDs), every resistor and NTC toleranced.
 */
export function fourZoneIndicator(): Record<string, unknown> {
  const parts: Array<Record<string, unknown>> = [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5, min: 4.75, max: 5.25 } },
    { id: 'GND1', type: 'ground' },
  ];
  const wires: Array<{ from: string; to: string }> = [{ from: 'V1.neg', to: 'GND1.g' }];
  for (let k = 1; k <= 4; k++) {
    const tC = 20 + 5 * k; // each zone at its own temperature
    parts.push(
      { id: `RT${k}`, type: 'resistor', params: { resistance: 12000, tolerance: 0.01 } },
      { id: `TH${k}`, type: 'ntc', params: { nominalResistance: 10000, beta: 3950, tolerance: 0.03, temperatureC: tC } },
      { id: `RB${k}`, type: 'resistor', params: { resistance: 47000, tolerance: 0.05 } },
      { id: `Q${k}`, type: 'npn', params: { beta: 150 } },
      { id: `RE${k}`, type: 'resistor', params: { resistance: 220, tolerance: 0.05 } },
      { id: `RL${k}`, type: 'resistor', params: { resistance: 150, tolerance: 0.05 } },
      { id: `D${k}`, type: 'led', params: { forwardVoltage: 2.0 } },
    );
    wires.push(
      { from: 'V1.pos', to: `RT${k}.a` },
      { from: `RT${k}.b`, to: `TH${k}.a` },
      { from: `TH${k}.b`, to: 'GND1.g' },
      { from: `RT${k}.b`, to: `RB${k}.a` },
      { from: `RB${k}.b`, to: `Q${k}.b` },
      { from: `Q${k}.e`, to: `RE${k}.a` },
      { from: `RE${k}.b`, to: 'GND1.g' },
      { from: 'V1.pos', to: `RL${k}.a` },
      { from: `RL${k}.b`, to: `D${k}.anode` },
      { from: `D${k}.cathode`, to: `Q${k}.c` },
    );
  }
  return { format: 'tapline.sheet', version: 1, title: 'Four-zone temperature indicator (demo data)', parts, wires };
}

/** A k×k grid of 1 kΩ resistors, 1 V across opposite corners (demo data). */
export function resistorGrid(k: number): Record<string, unknown> {
  const parts: Array<Record<string, unknown>> = [
    { id: 'V1', type: 'dc_voltage_source', params: { voltage: 1 } },
    { id: 'GND1', type: 'ground' },
  ];
  const wires: Array<{ from: string; to: string }> = [{ from: 'V1.neg', to: 'GND1.g' }];
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
      if (c + 1 < k) {
        const id = `R${++n}`;
        parts.push({ id, type: 'resistor', params: { resistance: 1000 } });
        attach(here, `${id}.a`);
        attach(here + 1, `${id}.b`);
      }
      if (r + 1 < k) {
        const id = `R${++n}`;
        parts.push({ id, type: 'resistor', params: { resistance: 1000 } });
        attach(here, `${id}.a`);
        attach(here + k, `${id}.b`);
      }
    }
  attach(0, 'V1.pos');
  attach(k * k - 1, 'GND1.g');
  return { format: 'tapline.sheet', version: 1, title: `${k}×${k} resistor grid (demo data)`, parts, wires };
}
