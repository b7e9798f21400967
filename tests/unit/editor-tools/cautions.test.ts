// Cautions where the work can hurt someone: supplies above 60 V DC (the ELV touch limit many codes
// use; from memory, local codes decide), parts at or above 50 % of their derated rating (common
// practice), LEDs with nothing to limit their current.
import { describe, expect, it } from 'vitest';
import { solveOperatingPoint } from '../../../shared/engine';
import { powerBudget } from '../../../shared/analysis';
import { toolCautions } from '../../../src/editor/tools/cautions/toolCautions';
import { parsed } from './helpers';

function cautionsOf(input: unknown) {
  const sheet = parsed(input);
  const r = solveOperatingPoint(sheet);
  const ok = r.ok ? r : null;
  return toolCautions(sheet, ok as never, ok ? powerBudget(sheet, ok) : null);
}

const base = { format: 'tapline.sheet', version: 1 };

describe('toolCautions', () => {
  it('flags a 100 V supply as above extra-low voltage', () => {
    const c = cautionsOf({
      ...base,
      parts: [
        { id: 'V1', type: 'dc_voltage_source', params: { voltage: 100 } },
        { id: 'R1', type: 'resistor', params: { resistance: 1e6 } },
        { id: 'G', type: 'ground', params: {} },
      ],
      wires: [{ from: 'V1.pos', to: 'R1.a' }, { from: 'R1.b', to: 'G.g' }, { from: 'V1.neg', to: 'G.g' }],
    });
    expect(c.find((x) => x.code === 'supply_above_elv')).toMatchObject({ severity: 'danger', partId: 'V1' });
  });

  it('cautions at 50–100 % of rating and warns above it: 5 V across 100 Ω is 250 mW (P = V²/R)', () => {
    const at = (ohms: number, rating: number) =>
      cautionsOf({
        ...base,
        parts: [
          { id: 'V1', type: 'dc_voltage_source', params: { voltage: 5 } },
          { id: 'R1', type: 'resistor', params: { resistance: ohms, powerRating: rating } },
          { id: 'G', type: 'ground', params: {} },
        ],
        wires: [{ from: 'V1.pos', to: 'R1.a' }, { from: 'R1.b', to: 'G.g' }, { from: 'V1.neg', to: 'G.g' }],
      }).filter((x) => x.partId === 'R1');
    expect(at(100, 0.4)[0]).toMatchObject({ code: 'near_rating', severity: 'caution' });
    expect(at(100, 0.4)[0].message).toMatch(/250 mW, 62\.5 % of its 400 mW rating/);
    expect(at(100, 0.125)[0]).toMatchObject({ code: 'over_rating', severity: 'danger' });
    expect(at(100, 1)).toEqual([]);
  });

  it('flags an LED straight across a supply', () => {
    const c = cautionsOf({
      ...base,
      parts: [
        { id: 'V1', type: 'dc_voltage_source', params: { voltage: 3 } },
        { id: 'D1', type: 'led', params: {} },
        { id: 'G', type: 'ground', params: {} },
      ],
      wires: [{ from: 'V1.pos', to: 'D1.anode' }, { from: 'D1.cathode', to: 'G.g' }, { from: 'V1.neg', to: 'G.g' }],
    });
    expect(c.find((x) => x.code === 'led_no_current_limit')).toMatchObject({ severity: 'danger', partId: 'D1' });
  });
});
