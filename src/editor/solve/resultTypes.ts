// The operating-point result as the sheet-format contract fixes it (shared/contracts/sheet-format.md,
// "Results"): the editor's view of it. shared/engine's SolveResult is assignable to this type; the
// editor adds its own failure (a crashed worker) and its own safety checks (safetyChecks.ts).

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
  /** operating quantities the engine reports (resistance at temperature, transistor region, …) */
  derived?: Record<string, number | string>;
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
  /** findings made before the failure (e.g. unconnected pins) that help explain it */
  warnings?: SolveWarning[];
}

export type SolveResult = SolveSuccess | SolveFailure;
