import type { FlagSpec } from '../args';
import type { CliIO } from '../io';

/** One CLI command. Add new analyses (sweep, worst-case, monte-carlo, find-value) as new entries in commands/index.ts. */
export interface CliCommand {
  name: string;
  summary: string;
  usage: string;
  flags: readonly FlagSpec[];
  /** returns the exit status */
  run(argv: readonly string[], io: CliIO): number | Promise<number>;
}

/** Flags every command that reads a sheet understands. */
export const commonSheetFlags: readonly FlagSpec[] = [
  { name: 'pretty', description: 'indent the JSON output' },
  { name: 'set', value: true, repeat: true, valueName: 'PART.PARAM=VALUE', description: 'override a param for this run (repeatable), e.g. --set R2.resistance=4700' },
  { name: 'temperature', value: true, valueName: 'CELSIUS', description: 'conditions.temperatureC for this run' },
  { name: 'illuminance', value: true, valueName: 'LUX', description: 'conditions.illuminanceLux for this run' },
  { name: 'help', description: 'show this help' },
];
