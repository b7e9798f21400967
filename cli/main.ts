// CLI entry logic (testable: takes argv and io, returns the exit status).
import { UsageError } from './args';
import { commands, DEFAULT_COMMAND } from './commands/index';
import { EXIT_INVALID, EXIT_SOLVED, type CliIO } from './io';

export function helpText(): string {
  const lines = ['Tapline circuit solver', '', 'Usage: npm run solve -- [COMMAND] FILE.json [options]', '', 'Commands:'];
  for (const c of Object.values(commands)) lines.push(`  ${c.name.padEnd(12)} ${c.summary}${c.name === DEFAULT_COMMAND ? ' (default)' : ''}`);
  lines.push('', 'Run with COMMAND --help for its options. Exit status: 0 solved, 1 cannot be solved, 2 not a valid sheet or bad arguments.');
  return lines.join('\n');
}

export async function main(argv: readonly string[], io: CliIO): Promise<number> {
  if (argv.length === 0 || (argv.length === 1 && (argv[0] === '--help' || argv[0] === '-h' || argv[0] === 'help'))) {
    io.log(helpText());
    if (argv.length === 0) {
      io.out({ ok: false, error: { code: 'usage_error', message: 'No sheet file given. Usage: npm run solve -- FILE.json', parts: [], nets: [] } }, false);
      return EXIT_INVALID;
    }
    return EXIT_SOLVED;
  }
  const named = commands[argv[0]];
  const cmd = named ?? commands[DEFAULT_COMMAND];
  const rest = named ? argv.slice(1) : argv;
  try {
    return await cmd.run(rest, io);
  } catch (e) {
    if (e instanceof UsageError) {
      io.log(`solve ${cmd.name}: ${e.message}\n\n${cmd.usage}`);
      io.out({ ok: false, error: { code: 'usage_error', message: e.message, parts: [], nets: [] } }, false);
      return EXIT_INVALID;
    }
    io.log(`solve: unexpected error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
    io.out({ ok: false, error: { code: 'internal_error', message: e instanceof Error ? e.message : String(e), parts: [], nets: [] } }, false);
    return 1;
  }
}
