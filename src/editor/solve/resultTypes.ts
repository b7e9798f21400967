// The operating-point result as the sheet-format contract fixes it (shared/contracts/sheet-format.md,
// "Results"). Kept here as the editor's view of it, so the canvas does not depend on engine internals.

export type WarningSeverity = 'info' | 'caution' | 'warning' | 'danger' | 'error';

/** A structured finding about the circuit: what, where, how bad. */
export interface SolveWarning {
  code: string;
  severity: WarningSeverity | string;
  partId?: string;
  net?: string;
  message: string;
}

export interface PartResult {
  /** current INTO the part at each pin, A */
  pinCurrents: Record<string, number>;
  /** power absorbed, W (negative when the part delivers power) */
  power: number;
  warnings: SolveWarning[];
}

export interface SolveSuccess {
  ok: true;
  analysis: 'operating-point';
  /** net name → V against the reference net "0" */
  nets: Record<string, number>;
  /** "R1.a" → V */
  pins: Record<string, number>;
  parts: Record<string, PartResult>;
  warnings: SolveWarning[];
  iterations: number;
}

export interface SolveFailure {
  ok: false;
  error: { code: string; message: string; parts?: string[]; nets?: string[] };
}

export type SolveResult = SolveSuccess | SolveFailure;
