// The analysis commands, registered in commands/index.ts with one line.
import { budgetCommand } from './budget';
import { designDividerCommand } from './design-divider';
import { findValueCommand } from './find-value';
import { monteCarloCommand } from './monte-carlo';
import { sweepCommand } from './sweep';
import { theveninCommand } from './thevenin';
import type { CliCommand } from './types';
import { worstCaseCommand } from './worst-case';

export const analysisCommands: Record<string, CliCommand> = Object.fromEntries(
  [sweepCommand, worstCaseCommand, monteCarloCommand, theveninCommand, budgetCommand, findValueCommand, designDividerCommand].map((c) => [c.name, c]),
);
