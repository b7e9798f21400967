// The hard-circuit fixtures (tests/fixtures/hard-circuits/*.json): each file is a complete sheet
// (the CLI solves it as it is) plus an `expect` block, which the sheet format keeps and the solver
// ignores.
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const FIXTURE_DIR = join(dirname(fileURLToPath(import.meta.url)), '../../../fixtures/hard-circuits');

/** A value the solution must have: `key` is V(NET), I(PART.PIN) or P(PART), as in the analyses. */
export interface ExpectedValue {
  key: string;
  value: number;
  /** relative tolerance (default 1e-9) */
  relative?: number;
  /** absolute tolerance in the key's unit (default 0) */
  absolute?: number;
  /** where the value comes from: closed form, handbook, shared/references.md, … */
  source: string;
}

export interface ExpectSolves {
  outcome: 'solves';
  /** Kirchhoff's current law at every net: |Σ i| ≤ relative·max|i| + absolute */
  kcl: { relative: number; absolute: number };
  /** device laws at the reported pin voltages (default: the KCL tolerances) */
  laws?: { relative: number; absolute: number };
  /** the solve must report at most this many Newton iterations */
  maxIterations: number;
  /** the strategy the solve must report, when it matters (e.g. "direct" for a linear sheet) */
  strategy?: string;
  values?: ExpectedValue[];
  /** derived values by part: { "Q1": { "region": "saturation" } } */
  derived?: Record<string, Record<string, string | number>>;
  /** warning codes that must be reported (and, with partId, on that part: "CODE@PART") */
  warnings?: string[];
  /** parts whose own law is not checked (the fixture's `why` says why), KCL still is */
  skipLaws?: string[];
  /** warning codes that must not be reported */
  noWarnings?: string[];
}

export interface ExpectError {
  outcome: 'error';
  code: string;
  /** parts the error must name (all of them, any order) */
  parts?: string[];
  nets?: string[];
  /** fragments the message must contain */
  messageIncludes?: string[];
  /** bound on the iterations spent before giving up, when the solve got that far */
  maxIterations?: number;
}

export type Expectation = (ExpectSolves | ExpectError) & {
  /** what makes the case hard, in a sentence */
  why: string;
  /** for a fixture left by a fixed bug: what the engine did wrong before */
  regression?: string;
};

export interface HardCircuit {
  file: string;
  sheet: Record<string, unknown>;
  expect: Expectation;
}

export function loadHardCircuits(): HardCircuit[] {
  return readdirSync(FIXTURE_DIR)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((file) => {
      const sheet = JSON.parse(readFileSync(join(FIXTURE_DIR, file), 'utf8')) as Record<string, unknown>;
      return { file, sheet, expect: sheet.expect as Expectation };
    });
}
