// The CLI's command table. `solve FILE.json` runs the default command (op); `solve NAME ...` runs
// another. Sweeps, worst case, Monte Carlo and the value finder register here as they arrive.
import { opCommand } from './op';
import { analysisCommands } from './analysis-commands';
import type { CliCommand } from './types';

export const commands: Record<string, CliCommand> = {
  [opCommand.name]: opCommand,
  ...analysisCommands,
};

export const DEFAULT_COMMAND = opCommand.name;

export type { CliCommand };
