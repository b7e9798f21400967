// Cautions the design tools and the report show where the work can hurt someone: supplies above
// extra-low voltage, parts running near or over their (derated) rating, LEDs with nothing to limit
// their current. The supply and LED checks are the editor's own (solve/safetyChecks.ts), so the
// canvas, the tools and the report can never disagree.
import type { BudgetResult } from '../../../../shared/analysis/budgets';
import type { Sheet } from '../../../../shared/sheet';
import { elvCautions, ledLimitCautions } from '../../solve/safetyChecks';
import type { SolveSuccess } from '../../solve/resultTypes';
import { fmtPct, fmtQ } from '../format';

export interface ToolCaution {
  code: string;
  severity: 'danger' | 'caution';
  partId?: string;
  message: string;
}

/** The standing note for the report and the tool views. */
export const SAFETY_NOTE =
  'Tapline is a design aid, not a safety approval. Work on mains-connected equipment, on batteries that can deliver large currents, on parts that run hot and on LED drive currents must follow local electrical codes, the parts’ datasheets and licensed practice; have such designs checked by a qualified person.';

/** Rating checks from a budget: caution from 50 % of the derated rating (common practice), danger above it. */
export function stressCautions(budget: BudgetResult): ToolCaution[] {
  const out: ToolCaution[] = [];
  for (const s of budget.stress) {
    if (s.status === 'ok') continue;
    const u = s.quantity === 'power' ? 'W' : 'A';
    const derated = s.deratedRating < s.rating ? ` (derated to ${fmtQ(s.deratedRating, u, 3)} at ${s.ambientC} °C)` : '';
    const what = s.quantity === 'power' ? `dissipates ${fmtQ(s.value, u, 3)}` : `carries ${fmtQ(s.value, u, 3)}`;
    const advice =
      s.quantity === 'power'
        ? 'A resistor this hot can burn skin and char the board: use a higher rating (common practice keeps resistors at or below 50 % of rating) and keep it clear of other parts.'
        : 'Above its maximum current an LED or diode overheats and fails: increase the series resistance.';
    out.push({
      code: s.status === 'over' ? 'over_rating' : 'near_rating',
      severity: s.status === 'over' ? 'danger' : 'caution',
      partId: s.part,
      message: `${s.part} ${what}, ${fmtPct(s.utilisation, 3)} of its ${fmtQ(s.rating, u, 3)} rating${derated}. ${advice}`,
    });
  }
  return out;
}

/** Every caution for a sheet, its solve (null when it did not solve) and its budget. */
export function toolCautions(sheet: Sheet, result: SolveSuccess | null, budget: BudgetResult | null): ToolCaution[] {
  const fromEditor = [...elvCautions(sheet, result), ...ledLimitCautions(sheet)].map(
    (w): ToolCaution => ({ code: w.code, severity: 'danger', partId: w.partId, message: w.message }),
  );
  return [...fromEditor, ...(budget ? stressCautions(budget) : [])].sort((a, b) => Number(a.severity !== 'danger') - Number(b.severity !== 'danger'));
}
