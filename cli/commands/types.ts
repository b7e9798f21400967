import { formatFlags, type FlagSpec, type ParsedArgs } from '../args';
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

/** Flags of the commands that print a ranking or table and read no sheet. */
export const outputFlags: readonly FlagSpec[] = [
  { name: 'pretty', description: 'indent the JSON output' },
  { name: 'help', description: 'show this help' },
];

/** Prints the command's usage when `--help` was given; returns whether it did. */
export function printedHelp(cmd: CliCommand, args: ParsedArgs, io: CliIO): boolean {
  if (!args.flags.help) return false;
  io.log(`${cmd.usage}\n\n${cmd.summary}\n\n${formatFlags(cmd.flags)}`);
  return true;
}
