// The design tools' session state for the open sheet: the panels' settings and their last good
// results. Session scope (never saved with the sheet); kept in sessionStorage so the printable
// report, opened in the same tab or a new one, shows the runs the user made.
import { create } from 'zustand';
import type { MonteCarloResult } from '../../../../shared/analysis/monte-carlo';
import type { WorstCaseResult } from '../../../../shared/analysis/worst-case';
import type { TheveninResult } from '../../../../shared/analysis/thevenin';
import type { Sheet } from '../../../../shared/sheet';
import { idleRun, type RunState } from '../runner/runState';
import type { SweepData } from '../sweep/sweepData';
import type { BenchMapping, BenchTable } from '../sweep/benchData';

export interface SweepForm {
  targetKey: string;
  from: string;
  to: string;
  points: number;
  scale: 'linear' | 'log';
  /** optional second parameter: one curve per value */
  familyKey: string;
  familyFrom: string;
  familyTo: string;
  familyPoints: number;
  outputs: string[];
}

export interface ToleranceForm {
  outputs: string[];
  samples: number;
  seed: number;
  distribution: 'normal' | 'uniform';
  /** output key → spec window as typed ("3.1", "3.4 V") */
  windows: Record<string, { min: string; max: string }>;
  supplyRange: boolean;
}

export interface ToolSessionState {
  /** the sheet these belong to (route id) */
  sheetKey: string | null;
  /** a copy of the sheet as last seen by the tools (the report uses it when opened directly) */
  sheet: Sheet | null;
  sweepForm: SweepForm | null;
  sweep: RunState<SweepData>;
  bench: { table: BenchTable; mapping: BenchMapping } | null;
  toleranceForm: ToleranceForm | null;
  worstCase: RunState<WorstCaseResult>;
  monteCarlo: RunState<MonteCarloResult>;
  budgetNet: string;
  thevenin: RunState<TheveninResult>;
}

const fresh = (sheetKey: string | null): ToolSessionState => ({
  sheetKey,
  sheet: null,
  sweepForm: null,
  sweep: idleRun(),
  bench: null,
  toleranceForm: null,
  worstCase: idleRun(),
  monteCarlo: idleRun(),
  budgetNet: '',
  thevenin: idleRun(),
});

const STORAGE_PREFIX = 'tapline.tools.';

function load(sheetKey: string): ToolSessionState | null {
  try {
    const raw = sessionStorage.getItem(STORAGE_PREFIX + sheetKey);
    if (!raw) return null;
    const s = JSON.parse(raw, (_k, v) => (v === '__NaN__' ? NaN : v)) as ToolSessionState;
    // a run that was going when the page went away is not going any more
    for (const k of ['sweep', 'worstCase', 'monteCarlo', 'thevenin'] as const) {
      const r = s[k] as RunState<unknown>;
      if (r.status === 'running') (s as unknown as Record<string, RunState<unknown>>)[k] = { ...r, status: r.result ? 'done' : 'idle', progress: null };
    }
    return { ...fresh(sheetKey), ...s, sheetKey };
  } catch {
    return null;
  }
}

function save(s: ToolSessionState): void {
  if (!s.sheetKey) return;
  try {
    // NaN marks failed points and must survive JSON
    sessionStorage.setItem(STORAGE_PREFIX + s.sheetKey, JSON.stringify(s, (_k, v) => (typeof v === 'number' && Number.isNaN(v) ? '__NaN__' : v)));
  } catch {
    // storage full or disabled: the report then shows only what it can compute itself
  }
}

export const useToolSession = create<ToolSessionState>(() => fresh(null));

let saveTimer: ReturnType<typeof setTimeout> | null = null;
useToolSession.subscribe((s) => {
  if (saveTimer) clearTimeout(saveTimer);
  saveTimer = setTimeout(() => save(s), 250);
});

/** Switch the tools to `sheetKey` (restoring what this tab kept for it). */
export function openToolSession(sheetKey: string): void {
  const cur = useToolSession.getState();
  if (cur.sheetKey === sheetKey) return;
  useToolSession.setState(load(sheetKey) ?? fresh(sheetKey), true);
}

/** Write now (before navigating to the report). */
export function flushToolSession(): void {
  if (saveTimer) clearTimeout(saveTimer);
  save(useToolSession.getState());
}

/** Read what a tab kept for `sheetKey` without making it current (the report page). */
export function peekToolSession(sheetKey: string): ToolSessionState | null {
  const cur = useToolSession.getState();
  if (cur.sheetKey === sheetKey) return cur;
  return load(sheetKey);
}

/** A setter for one run slot, in the shape startRun wants. */
export function runSetter<K extends 'sweep' | 'worstCase' | 'monteCarlo' | 'thevenin'>(key: K) {
  return (update: (prev: ToolSessionState[K]) => ToolSessionState[K]) =>
    useToolSession.setState((s) => ({ [key]: update(s[key]) }) as Partial<ToolSessionState>);
}
