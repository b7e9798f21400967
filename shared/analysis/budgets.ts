// Budgets at an operating point: what each supply delivers (the quiescent current of dividers and
// references is what a battery pays all the time), each part's dissipation against its rating,
// and the efficiency of a divider feeding a load.
//
// Resistor derating (IEC 60115-1 terms, from memory; common practice): the rated dissipation holds
// up to 70 °C ambient and falls linearly to zero at the upper category temperature, 155 °C. The
// same curve is applied to potentiometers (common for cermet and carbon tracks; check the part's
// datasheet). Zener ratings are used as given (no derating curve in the catalogue).
import type { SolveSuccess } from '../engine/result';
import type { Sheet } from '../sheet/schema';
import { AnalysisInputError } from './targets';

export interface DeratingCurve {
  /** full rating up to this ambient, °C (default 70) */
  fullRatingUpToC: number;
  /** zero rating at and above this ambient, °C (default 155) */
  zeroRatingAtC: number;
}

const TWO_TERMINAL = new Set(['resistor', 'ntc', 'ldr', 'load', 'diode', 'zener', 'led']);

export const RESISTOR_DERATING: DeratingCurve = { fullRatingUpToC: 70, zeroRatingAtC: 155 };

/** Fraction (0..1) of the rating allowed at ambient `tC`. */
export function deratingFactor(tC: number, c: DeratingCurve = RESISTOR_DERATING): number {
  if (tC <= c.fullRatingUpToC) return 1;
  if (tC >= c.zeroRatingAtC) return 0;
  return (c.zeroRatingAtC - tC) / (c.zeroRatingAtC - c.fullRatingUpToC);
}

export interface SupplyEntry {
  part: string;
  type: 'dc_voltage_source' | 'dc_current_source';
  /** current delivered out of the + pin, A (negative when the supply is being charged) */
  current: number;
  /** power delivered, W */
  power: number;
}

export interface StressEntry {
  part: string;
  type: string;
  /** 'power' (W against a power rating) or 'current' (A against a maximum current) */
  quantity: 'power' | 'current';
  value: number;
  rating: number;
  /** rating after derating at the ambient, same unit */
  deratedRating: number;
  ambientC: number;
  /** value / deratedRating (∞ when derated to zero) */
  utilisation: number;
  /** ok below 50 %, caution 50–100 %, over above (common practice: keep resistors at ≤ 50 %) */
  status: 'ok' | 'caution' | 'over';
}

/** Current through a two-terminal part (its share of the quiescent budget). */
export interface BranchEntry {
  part: string;
  type: string;
  /** |current| through the part, A */
  current: number;
  /** power absorbed, W */
  power: number;
}

export interface BudgetOptions {
  /** part id of the load (for the efficiency) */
  load?: string;
  /** part id of the supply feeding it (default: all supplies together) */
  source?: string;
  derating?: DeratingCurve;
}

export interface BudgetResult {
  supplies: SupplyEntry[];
  /** Σ current delivered by the voltage sources, A */
  totalSupplyCurrent: number;
  /** Σ power delivered by all sources, W */
  totalSupplyPower: number;
  stress: StressEntry[];
  /** every resistor, thermistor, LDR, load, diode, Zener and LED with its current, largest first */
  branches: BranchEntry[];
  efficiency?: { load: string; loadPower: number; sourcePower: number; efficiency: number };
}

/** Budgets of a solved operating point of `sheet`. */
export function powerBudget(sheet: Sheet, r: SolveSuccess, o: BudgetOptions = {}): BudgetResult {
  const supplies: SupplyEntry[] = [];
  const stress: StressEntry[] = [];
  const branches: BranchEntry[] = [];
  const ambientOf = (params: Record<string, unknown>) => (typeof params.temperatureC === 'number' ? params.temperatureC : r.conditions.temperatureC);
  const push = (part: string, type: string, quantity: 'power' | 'current', value: number, rating: number, ambientC: number, factor: number) => {
    const derated = rating * factor;
    const u = derated > 0 ? value / derated : value > 0 ? Infinity : 0;
    stress.push({ part, type, quantity, value, rating, deratedRating: derated, ambientC, utilisation: u, status: u > 1 ? 'over' : u >= 0.5 ? 'caution' : 'ok' });
  };
  for (const part of sheet.parts) {
    const res = r.parts[part.id];
    if (!res) continue;
    const params = part.params as Record<string, unknown>;
    const amb = ambientOf(params);
    if (TWO_TERMINAL.has(part.type)) {
      const first = Object.values(res.pinCurrents)[0] ?? 0;
      branches.push({ part: part.id, type: part.type, current: Math.abs(first), power: res.power });
    }
    switch (part.type) {
      case 'dc_voltage_source':
      case 'dc_current_source':
        supplies.push({ part: part.id, type: part.type, current: -(res.pinCurrents.pos ?? 0), power: -res.power });
        break;
      case 'resistor':
      case 'potentiometer':
        push(part.id, part.type, 'power', res.power, params.powerRating as number, amb, deratingFactor(amb, o.derating));
        break;
      case 'zener':
        push(part.id, part.type, 'power', Math.abs(res.power), params.powerRating as number, amb, 1);
        break;
      case 'led':
      case 'diode':
        push(part.id, part.type, 'current', Math.abs(res.pinCurrents.anode ?? 0), params.maxCurrent as number, amb, 1);
        break;
      default:
        break;
    }
  }
  const totalSupplyCurrent = supplies.filter((s) => s.type === 'dc_voltage_source').reduce((a, s) => a + s.current, 0);
  const totalSupplyPower = supplies.reduce((a, s) => a + s.power, 0);
  branches.sort((a, b) => b.current - a.current || a.part.localeCompare(b.part));
  const out: BudgetResult = { supplies, totalSupplyCurrent, totalSupplyPower, stress, branches };
  if (o.load) {
    const lr = r.parts[o.load];
    if (!lr) throw new AnalysisInputError(`There is no part "${o.load}" to treat as the load.`);
    const sourcePower = o.source ? supplies.find((s) => s.part === o.source)?.power : totalSupplyPower;
    if (sourcePower === undefined) throw new AnalysisInputError(`"${o.source}" is not a supply on this sheet.`);
    out.efficiency = { load: o.load, loadPower: lr.power, sourcePower, efficiency: sourcePower !== 0 ? lr.power / sourcePower : NaN };
  }
  return out;
}
