// The short text beside a part on the canvas: its main value(s) and, after a solve, what it carries.
import { partSpecs } from '../../../shared/parts/specs';
import type { Part } from '../../../shared/sheet';
import { formatAmps, formatParamWithUnit, formatWatts } from '../format/values';
import type { PartResult } from '../solve/resultTypes';

const MAIN_PARAMS: Partial<Record<Part['type'], string[]>> = {
  resistor: ['resistance'],
  potentiometer: ['resistance'],
  dc_voltage_source: ['voltage'],
  dc_current_source: ['current'],
  zener: ['zenerVoltage'],
  led: ['forwardVoltage'],
  npn: ['beta'],
  pnp: ['beta'],
  ntc: ['nominalResistance'],
  ldr: ['resistanceAt10Lux'],
};

function paramText(part: Part, name: string): string {
  const info = partSpecs[part.type].params.find((p) => p.name === name);
  const value = (part.params as Record<string, unknown>)[name];
  if (!info || value === undefined) return '';
  if (name === 'beta' && (part.type === 'npn' || part.type === 'pnp')) return `β ${value}`;
  return formatParamWithUnit(info, value);
}

/** The value text under the designator, e.g. "10 kΩ", "12 V", "β 100", "10 kΩ · R". */
export function valueText(part: Part): string {
  const p = part.params as Record<string, unknown>;
  if (part.type === 'load') {
    const unit = p.mode === 'current' ? 'A' : p.mode === 'power' ? 'W' : 'Ω';
    const info = partSpecs.load.params.find((x) => x.name === 'value')!;
    return `${formatParamWithUnit({ ...info, unit }, p.value)}`;
  }
  if (part.type === 'switch') return p.closed === false ? 'open' : 'closed';
  if (part.type === 'ntc') return `${paramText(part, 'nominalResistance')} · β${p.beta}`;
  if (part.type === 'ldr') return `${paramText(part, 'resistanceAt10Lux')} @10 lx`;
  return (MAIN_PARAMS[part.type] ?? []).map((n) => paramText(part, n)).filter(Boolean).join(' · ');
}

/** The current the part carries, as a reading: through a two-terminal part, into the collector of a transistor. */
export function currentText(part: Part, r: PartResult | undefined): string | null {
  if (!r) return null;
  const pins = r.pinCurrents;
  switch (part.type) {
    case 'ground':
    case 'net_label':
      return null;
    case 'npn':
    case 'pnp':
      return `Ic ${formatAmps(Math.abs(pins.c ?? 0))}`;
    case 'potentiometer':
      return `Iw ${formatAmps(Math.abs(pins.w ?? 0))}`;
    default: {
      const first = Object.values(pins)[0] ?? 0;
      return formatAmps(Math.abs(first));
    }
  }
}

/** Dissipation, or delivered power for sources ("−"), as a reading. */
export function powerText(part: Part, r: PartResult | undefined): string | null {
  if (!r || part.type === 'ground' || part.type === 'net_label') return null;
  if (r.power < 0) return `delivers ${formatWatts(-r.power)}`;
  return formatWatts(r.power);
}
