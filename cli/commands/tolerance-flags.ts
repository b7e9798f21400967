// Flags that choose what a tolerance run varies (worst-case and monte-carlo share them).
import type { ToleranceOptions } from '../../shared/analysis';
import { UsageError, type FlagSpec, type ParsedArgs } from '../args';
import { list, parseNumber, parseRange, targetFrom } from './analysis-common';

export const toleranceFlags: readonly FlagSpec[] = [
  { name: 'output', value: true, repeat: true, valueName: 'KEY', description: 'what to measure (repeatable): V(NET) or NET, I(PART.PIN), P(PART)' },
  { name: 'only', value: true, repeat: true, valueName: 'PART', description: 'vary only these parts (repeatable)' },
  { name: 'exclude', value: true, repeat: true, valueName: 'PART', description: 'hold these parts at nominal (repeatable)' },
  { name: 'tolerance', value: true, repeat: true, valueName: 'PART=FRACTION', description: "use this tolerance for a part, e.g. R1=0.01 or R1=1% (repeatable)" },
  { name: 'range', value: true, repeat: true, valueName: 'TARGET=LOW:HIGH', description: 'also vary a param or condition over a range, e.g. temperature=-20:60 or RL1.value=0:0.002 (repeatable)' },
  { name: 'no-supply-range', description: "hold supplies at their voltage (ignore their min/max)" },
];

export function toleranceOptionsFrom(flags: ParsedArgs['flags']): ToleranceOptions {
  const o: ToleranceOptions = {};
  const only = list(flags, 'only');
  if (only.length) o.parts = only;
  const exclude = list(flags, 'exclude');
  if (exclude.length) o.exclude = exclude;
  if (flags['no-supply-range'] === true) o.supplyRange = false;
  const tol: Record<string, number> = {};
  for (const t of list(flags, 'tolerance')) {
    const m = /^([^=\s]+)=(.+)$/.exec(t);
    if (!m) throw new UsageError(`--tolerance expects PART=FRACTION (got "${t}")`);
    const v = m[2].trim().endsWith('%') ? parseNumber(m[2].trim().slice(0, -1), '--tolerance') / 100 : parseNumber(m[2], '--tolerance');
    tol[m[1]] = v;
  }
  if (Object.keys(tol).length) o.toleranceOverride = tol;
  const extra = list(flags, 'range').map((r) => {
    const eq = r.indexOf('=');
    if (eq < 0) throw new UsageError(`--range expects TARGET=LOW:HIGH (got "${r}")`);
    const [low, high] = parseRange(r.slice(eq + 1), '--range');
    return { target: targetFrom(r.slice(0, eq), '--range'), low, high };
  });
  if (extra.length) o.extra = extra;
  return o;
}
