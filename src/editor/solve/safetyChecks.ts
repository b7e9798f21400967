// Cautions the editor adds on top of the engine's own findings (the engine already flags power
// over rating and LED over-current): supplies above the extra-low-voltage limit, and LEDs with
// nothing in their path to limit the current.
import { extractNets, type Sheet } from '../../../shared/sheet';
import type { SolveSuccess, SolveWarning } from './resultTypes';

/**
 * 60 V DC: the limit commonly applied to touchable SELV DC circuits in equipment-safety practice
 * (common practice; from memory — standards and local codes set the binding figure, and some
 * allow up to 120 V ripple-free DC for ELV).
 */
export const ELV_DC_LIMIT_V = 60;

const ELV_ADVICE =
  'Above 60 V DC a shock can be dangerous: treat the circuit as hazardous (insulation, enclosure, protection) and follow local electrical codes and licensed practice.';

function fmtV(v: number): string {
  return `${Number(Math.abs(v).toPrecision(3))} V`;
}

/** Supplies (or their stated range) above 60 V, and nets that reach it. */
export function elvCautions(sheet: Sheet, result: SolveSuccess | null): SolveWarning[] {
  const out: SolveWarning[] = [];
  for (const p of sheet.parts) {
    if (p.type !== 'dc_voltage_source') continue;
    const { voltage, max, min } = p.params as { voltage: number; max?: number; min?: number };
    const worst = Math.max(Math.abs(voltage), Math.abs(max ?? 0), Math.abs(min ?? 0));
    if (worst > ELV_DC_LIMIT_V)
      out.push({
        code: 'supply_above_elv',
        severity: 'danger',
        partId: p.id,
        message: `${p.id} supplies ${fmtV(worst)}${worst !== Math.abs(voltage) ? ' at the end of its range' : ''}. ${ELV_ADVICE}`,
      });
  }
  if (result && !out.length) {
    for (const [net, v] of Object.entries(result.nets))
      if (Math.abs(v) > ELV_DC_LIMIT_V) {
        out.push({ code: 'net_above_elv', severity: 'danger', net, message: `Net ${net} is at ${fmtV(v)}. ${ELV_ADVICE}` });
        break;
      }
  }
  return out;
}

/**
 * LEDs whose every path to a supply runs only through voltage sources (without internal
 * resistance) and other diodes: nothing sets their current but the supply's voltage. A net is
 * "stiff" when every other part on it is such a source, a diode or an LED.
 */
export function ledLimitCautions(sheet: Sheet): SolveWarning[] {
  if (!sheet.parts.some((p) => p.type === 'dc_voltage_source')) return [];
  const nets = extractNets(sheet);
  const byId = new Map(sheet.parts.map((p) => [p.id, p] as const));
  const others = (index: number | undefined, self: string) =>
    index === undefined
      ? []
      : [...new Set(nets.nets[index].pins.map((ref) => ref.slice(0, ref.indexOf('.'))))]
          .filter((id) => id !== self)
          .map((id) => byId.get(id)!)
          .filter((p) => p.type !== 'ground' && p.type !== 'net_label');
  const stiffSource = (p: Sheet['parts'][number]) =>
    p.type === 'dc_voltage_source' && !(((p.params as { internalResistance?: number }).internalResistance ?? 0) > 0);
  const stiff = (list: Sheet['parts']) => list.length > 0 && list.every((p) => stiffSource(p) || p.type === 'led' || p.type === 'diode');
  const out: SolveWarning[] = [];
  for (const led of sheet.parts) {
    if (led.type !== 'led') continue;
    const a = others(nets.pinToIndex.get(`${led.id}.anode`), led.id);
    const k = others(nets.pinToIndex.get(`${led.id}.cathode`), led.id);
    if (stiff(a) && stiff(k) && [...a, ...k].some(stiffSource))
      out.push({
        code: 'led_no_current_limit',
        severity: 'danger',
        partId: led.id,
        message: `${led.id} sits across a voltage source with nothing to limit its current: it can burn out (and get hot) at once. Add a series resistor of about (supply − forward voltage) / wanted current.`,
      });
  }
  return out;
}

/** Every editor-side caution for a solved (or failed: result null) sheet. */
export function safetyCautions(sheet: Sheet, result: SolveSuccess | null): SolveWarning[] {
  return [...elvCautions(sheet, result), ...ledLimitCautions(sheet)];
}
