import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { parseSheet } from '../../../shared/sheet/parse';
import type { Sheet } from '../../../shared/sheet/schema';
import { partsList } from '../../../shared/design/parts-list';
import { partsListCsv } from '../../../shared/design/parts-list-csv';

const sheetOf = (parts: unknown[]): Sheet => {
  const r = parseSheet({ format: 'tapline.sheet', version: 1, title: 'Demo (invented): cell monitor', parts, wires: [] });
  if (!r.ok) throw new Error(r.error.message);
  return r.sheet;
};

// Demo data (invented): a cell-voltage tap, an indicator LED and a thermistor front end.
const demo = sheetOf([
  { id: 'V1', type: 'dc_voltage_source', params: { voltage: 4.2 } },
  { id: 'R10', type: 'resistor', params: { resistance: 100e3 } },
  { id: 'R1', type: 'resistor', params: { resistance: 100e3 } },
  { id: 'R2', type: 'resistor', params: { resistance: 47e3 } },
  { id: 'R3', type: 'resistor', params: { resistance: 100e3 } },
  { id: 'R4', type: 'resistor', params: { resistance: 100e3, tolerance: 0.05 } },
  { id: 'R5', type: 'resistor', params: { resistance: 100e3, powerRating: 0.125 } },
  { id: 'RV1', type: 'potentiometer', params: { resistance: 10e3, position: 0.2 } },
  { id: 'RV2', type: 'potentiometer', params: { resistance: 10e3, position: 0.9 } },
  { id: 'D1', type: 'led', params: {} },
  { id: 'TH1', type: 'ntc', params: {} },
  { id: 'S1', type: 'switch', params: { closed: false } },
  { id: 'RL1', type: 'load', params: { mode: 'resistance', value: 1e6 } },
  { id: 'GND1', type: 'ground', params: {} },
]);

describe('partsList', () => {
  const rows = partsList(demo);

  it('groups identical parts, in natural designator order, and leaves out sources, loads and ground', () => {
    expect(rows.map((r) => r.designators.join(' '))).toEqual(['R1 R3 R10', 'R2', 'R4', 'R5', 'RV1 RV2', 'D1', 'TH1', 'S1']);
    expect(rows.map((r) => r.quantity)).toEqual([3, 1, 1, 1, 2, 1, 1, 1]);
  });

  it('shows values in RKM and engineering form with tolerance and rating (sheet defaults: ±1 %, 0.25 W)', () => {
    expect(rows[0]).toEqual({
      designators: ['R1', 'R3', 'R10'],
      type: 'resistor',
      typeLabel: 'Resistor',
      value: '100 kΩ',
      valueRkm: '100K',
      tolerance: 0.01,
      powerRating: 0.25,
      quantity: 3,
    });
    expect(rows[1]).toMatchObject({ value: '47 kΩ', valueRkm: '47K' });
    expect(rows[2]).toMatchObject({ tolerance: 0.05 });
    expect(rows[3]).toMatchObject({ powerRating: 0.125 });
    expect(rows[4]).toMatchObject({ value: '10 kΩ linear', valueRkm: '10K', quantity: 2 });
    expect(rows[5]).toMatchObject({ typeLabel: 'LED', value: '2 V at 20 mA, max 30 mA', tolerance: null, powerRating: null });
    expect(rows[6].value).toBe('10 kΩ at 25 °C, B 3950 K');
  });

  it('is empty for a sheet without parts to buy', () => {
    expect(partsList(sheetOf([{ id: 'GND1', type: 'ground', params: {} }]))).toEqual([]);
  });
});

describe('partsListCsv (RFC 4180)', () => {
  it('writes a heading, CRLF line ends and quotes the fields that need it', () => {
    const csv = partsListCsv(partsList(sheetOf([
      { id: 'R2', type: 'resistor', params: { resistance: 4700 } },
      { id: 'R1', type: 'resistor', params: { resistance: 4700 } },
      { id: 'D"7', type: 'zener', params: { zenerVoltage: 5.1 } },
    ])));
    expect(csv).toBe(
      'Designators,Quantity,Type,Value,RKM,Tolerance,Power rating\r\n' +
        '"R1, R2",2,Resistor,4.7 kΩ,4K7,±1 %,250 mW\r\n' +
        '"D""7",1,Zener diode,5.1 V at 5 mA,,,500 mW',
    );
  });

  it('reads back field for field with an RFC 4180 parser, and defuses formula-like ids', () => {
    const csv = partsListCsv(partsList(demo));
    const parsed = Papa.parse<string[]>(csv, { newline: '\r\n' });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBe(1 + partsList(demo).length);
    expect(parsed.data[1]).toEqual(['R1, R3, R10', '3', 'Resistor', '100 kΩ', '100K', '±1 %', '250 mW']);
    const risky = partsListCsv(partsList(sheetOf([{ id: '=HYPERLINK', type: 'resistor', params: { resistance: 1 } }])));
    expect(Papa.parse<string[]>(risky, { newline: '\r\n' }).data[1][0]).toBe("'=HYPERLINK");
  });
});
