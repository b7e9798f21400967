// What the sweep panel offers to vary: every numeric, sweepable param of every part that has a
// value, plus the sheet's temperature and illuminance; each with a sensible starting range.
import { partSpecs } from '../../../../shared/parts/specs';
import type { ParamInfo } from '../../../../shared/parts/types';
import type { ParamTarget } from '../../../../shared/analysis/targets';
import type { Sheet } from '../../../../shared/sheet';

export interface SweepChoice {
  target: ParamTarget;
  /** "RV1.position", "conditions.temperatureC" */
  key: string;
  /** "RV1 wiper position", "Temperature" */
  label: string;
  unit: string;
  nominal: number;
  from: number;
  to: number;
  scale: 'linear' | 'log';
}

function clampToRule(info: ParamInfo | undefined, v: number): number {
  const r = info?.rule;
  if (!r) return v;
  if (r.kind === 'range') return Math.min(r.max, Math.max(r.min, v));
  if ((r.kind === 'positive' || r.kind === 'above') && v <= (r.kind === 'above' ? r.min : 0)) return NaN;
  if (r.kind === 'nonNegative' && v < 0) return 0;
  return v;
}

/** Starting range for a param: a supply's declared range, a wiper end to end, a decade each way for a resistance. */
function defaultRange(info: ParamInfo, nominal: number, params: Record<string, unknown>): Pick<SweepChoice, 'from' | 'to' | 'scale'> {
  if (info.tolerance?.kind === 'range') {
    const lo = params[info.tolerance.minParam];
    const hi = params[info.tolerance.maxParam];
    if (typeof lo === 'number' && typeof hi === 'number' && lo < hi) return { from: lo, to: hi, scale: 'linear' };
  }
  if (info.rule?.kind === 'range') return { from: info.rule.min, to: info.rule.max, scale: 'linear' };
  if (info.unit === 'Ω' && nominal > 0) return { from: nominal / 10, to: nominal * 10, scale: 'log' };
  if (nominal === 0) return { from: 0, to: 1, scale: 'linear' };
  const a = clampToRule(info, nominal * 0.5);
  const b = clampToRule(info, nominal * 1.5);
  return { from: Number.isFinite(a) ? Math.min(a, b) : nominal / 2, to: Math.max(a, b), scale: 'linear' };
}

/** Every sweepable quantity of the sheet, parts in sheet order, then the conditions. */
export function sweepChoices(sheet: Sheet): SweepChoice[] {
  const out: SweepChoice[] = [];
  for (const part of sheet.parts) {
    const params = part.params as Record<string, unknown>;
    for (const info of partSpecs[part.type].params) {
      if (info.kind !== 'number' || !info.sweepable || info.toleranceOf) continue;
      const nominal = params[info.name];
      if (typeof nominal !== 'number') continue;
      out.push({
        target: { kind: 'param', part: part.id, param: info.name },
        key: `${part.id}.${info.name}`,
        label: `${part.id} · ${info.label.toLowerCase()}`,
        unit: info.unit,
        nominal,
        ...defaultRange(info, nominal, params),
      });
    }
  }
  const c = sheet.conditions;
  out.push({
    target: { kind: 'condition', condition: 'temperatureC' },
    key: 'conditions.temperatureC',
    label: 'Temperature (sheet)',
    unit: '°C',
    nominal: c.temperatureC,
    from: -40,
    to: 85,
    scale: 'linear',
  });
  out.push({
    target: { kind: 'condition', condition: 'illuminanceLux' },
    key: 'conditions.illuminanceLux',
    label: 'Illuminance (sheet)',
    unit: 'lx',
    nominal: c.illuminanceLux,
    from: 0.1,
    to: 10_000,
    scale: 'log',
  });
  return out;
}
