// `solve FILE.json` / `solve op FILE.json`: the DC operating point.
import { compileCircuit } from '../../shared/engine/compile';
import { failure } from '../../shared/engine/result';
import { parseArgs, UsageError } from '../args';
import { EXIT_INVALID, EXIT_SOLVED, EXIT_UNSOLVABLE } from '../io';
import { readSheet, solveOptionsFromFlags } from '../sheet-input';
import { commonSheetFlags, printedHelp, type CliCommand } from './types';

export const opCommand: CliCommand = {
  name: 'op',
  summary: 'DC operating point: every net and pin voltage, pin currents, power, warnings',
  usage: 'npm run solve -- [op] FILE.json [--pretty] [--set PART.PARAM=VALUE]... [--temperature C] [--illuminance LUX]',
  flags: commonSheetFlags,
  run(argv, io) {
    const args = parseArgs(argv, this.flags);
    if (printedHelp(this, args, io)) return EXIT_SOLVED;
    if (args.positionals.length !== 1) throw new UsageError(args.positionals.length ? 'give exactly one sheet file' : 'which sheet file? e.g. npm run solve -- examples/divider.json');
    const pretty = args.flags.pretty === true;
    const file = args.positionals[0];
    const parsed = readSheet(io, file);
    if (!parsed.ok) {
      const e = parsed.error;
      io.out(failure({ code: 'invalid_sheet', message: e.message, parts: [...new Set(e.issues.map((i) => i.partId).filter((x): x is string => !!x))], nets: [], issues: e.issues }), pretty);
      for (const i of e.issues) io.log(`${file}: ${i.message}`);
      return EXIT_INVALID;
    }
    const solveOpts = solveOptionsFromFlags(args.flags);
    const circuit = compileCircuit(parsed.sheet);
    const result = circuit.solve(solveOpts);
    io.out(result, pretty);
    if (result.ok) {
      for (const w of result.warnings) io.log(`${w.severity}: ${w.message}`);
      return EXIT_SOLVED;
    }
    io.log(`${file}: ${result.error.message}`);
    // a bad --set value is a bad input, like a bad file
    return result.error.code === 'invalid_sheet' || result.error.code === 'invalid_parameter' ? EXIT_INVALID : EXIT_UNSOLVABLE;
  },
};
