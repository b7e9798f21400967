// What the solver returns (shared/contracts/sheet-format.md, "Results").
import type { SheetIssue } from '../sheet/parse';

export type WarningSeverity = 'caution' | 'warning' | 'danger';

export interface SolveWarning {
  code: string;
  severity: WarningSeverity;
  partId?: string;
  net?: string;
  message: string;
}

export interface PartResult {
  /** current INTO the part at each pin, A (they sum to zero) */
  pinCurrents: Record<string, number>;
  /** power absorbed, W (negative for a part that delivers power) */
  power: number;
  warnings: SolveWarning[];
  /** operating quantities worth showing (resistance at temperature, transistor region, …) */
  derived?: Record<string, number | string>;
}

export type SolveStrategy = 'direct' | 'newton' | 'gmin-stepping' | 'source-stepping';

export interface SolveSuccess {
  ok: true;
  analysis: 'operating-point';
  /** net name → voltage against the reference net "0" */
  nets: Record<string, number>;
  /** "PART.PIN" → voltage */
  pins: Record<string, number>;
  parts: Record<string, PartResult>;
  /** every warning of the solve (part warnings are also listed under their part) */
  warnings: SolveWarning[];
  /** Newton iterations in all (1 for a linear circuit) */
  iterations: number;
  /** how the solution was reached */
  strategy: SolveStrategy;
  conditions: { temperatureC: number; illuminanceLux: number };
}

export type SolveErrorCode =
  | 'invalid_sheet'
  | 'invalid_parameter'
  | 'no_ground'
  | 'floating_net'
  | 'voltage_source_loop'
  | 'current_source_no_path'
  | 'singular_matrix'
  | 'no_convergence'
  | 'non_finite'
  | 'internal_error';

export interface SolveErrorInfo {
  code: SolveErrorCode;
  /** what is wrong, where, and what to try */
  message: string;
  /** ids of the parts concerned */
  parts: string[];
  /** names of the nets concerned */
  nets: string[];
  /** for invalid_sheet / invalid_parameter: each problem with its part and field */
  issues?: SheetIssue[];
}

export interface SolveFailure {
  ok: false;
  analysis: 'operating-point';
  error: SolveErrorInfo;
  /** warnings found before the failure (e.g. unconnected pins), to help explain it */
  warnings: SolveWarning[];
  /** Newton iterations spent before giving up (absent when the solve never started) */
  iterations?: number;
}

export type SolveResult = SolveSuccess | SolveFailure;

export function failure(error: SolveErrorInfo, warnings: SolveWarning[] = []): SolveFailure {
  return { ok: false, analysis: 'operating-point', error, warnings };
}
