// Small sheets for the server tests (invented demo circuits).

/** A 12 V supply into a 10 kΩ / 4.7 kΩ divider: the usual first sheet. */
export function dividerSheet(title = 'Divider (test)') {
  return {
    format: 'tapline.sheet',
    version: 1,
    title,
    conditions: { temperatureC: 25, illuminanceLux: 100 },
    parts: [
      { id: 'V1', type: 'dc_voltage_source', params: { voltage: 12 }, position: { x: 0, y: 0 } },
      { id: 'R1', type: 'resistor', params: { resistance: 10000 }, position: { x: 120, y: 0 } },
      { id: 'R2', type: 'resistor', params: { resistance: 4700 }, position: { x: 120, y: 120 } },
      { id: 'GND', type: 'ground', position: { x: 0, y: 200 } },
    ],
    wires: [
      { from: 'V1.pos', to: 'R1.a' },
      { from: 'R1.b', to: 'R2.a' },
      { from: 'R2.b', to: 'GND.g' },
      { from: 'V1.neg', to: 'GND.g' },
    ],
  };
}

/** The same divider with R2 changed, so a test can tell two versions apart. */
export function dividerWithR2(resistance: number) {
  const s = dividerSheet();
  s.parts[2] = { ...s.parts[2], params: { resistance } };
  return s;
}
