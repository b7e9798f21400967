// The operating-point result as the sheet-format contract fixes it (shared/contracts/sheet-format.md,
// "Results"): the editor's view of it, derived from shared/engine's types so the two cannot drift.
// It is looser in three ways: the editor's own safety checks (safetyChecks.ts) add severities
// 'info' and 'error'; a failure may be the editor's own (a crashed worker), with any error code;
// and fields the screens do not read (strategy, conditions) are left out, so results from older
// workers or saved reports still fit. shared/engine's SolveResult is assignable to this type.
import type { PartResult as EnginePartResult, SolveSuccess as EngineSuccess, SolveWarning as EngineWarning } from '../../../shared/engine/result';

export type WarningSeverity = EngineWarning['severity'] | 'info' | 'error';

/** A structured finding about the circuit: what, where, how bad. */
export interface SolveWarning extends Omit<EngineWarning, 'severity'> {
  severity: WarningSeverity | string;
}

export interface PartResult extends Omit<EnginePartResult, 'warnings'> {
  warnings: SolveWarning[];
}

export interface SolveSuccess extends Pick<EngineSuccess, 'ok' | 'analysis' | 'nets' | 'pins' | 'iterations'> {
  parts: Record<string, PartResult>;
  warnings: SolveWarning[];
}

export interface SolveFailure {
  ok: false;
  error: { code: string; message: string; parts?: string[]; nets?: string[] };
  /** findings made before the failure (e.g. unconnected pins) that help explain it */
  warnings?: SolveWarning[];
}

export type SolveResult = SolveSuccess | SolveFailure;
