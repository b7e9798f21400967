// `solve thevenin FILE --net tap`: open-circuit voltage and source resistance at a net.
import { theveninAt } from '../../shared/analysis';
import { UsageError } from '../args';
import { commonSheetFlags, type CliCommand } from './types';
import { csvFlag, emitText, list, runSheetCommand, toCsv } from './analysis-common';

export const theveninCommand: CliCommand = {
  name: 'thevenin',
  summary: 'Thevenin equivalent at a net: open-circuit voltage and source resistance (small-signal for non-linear circuits)',
  usage: 'npm run solve -- thevenin FILE.json --net NET [--net NET]... [--csv]',
  flags: [{ name: 'net', value: true, repeat: true, valueName: 'NET', description: 'net to look into (repeatable)' }, csvFlag, ...commonSheetFlags],
  run(argv, io) {
    return runSheetCommand(this, argv, io, ({ args, prepared, base, pretty, csv }) => {
      const nets = list(args.flags, 'net');
      if (!nets.length) throw new UsageError('which net? e.g. --net tap');
      const results = nets.map((n) => theveninAt(prepared.sheet, n, base));
      if (csv) {
        emitText(io, toCsv([['net', 'open-circuit voltage (V)', 'resistance (ohm)', 'short-circuit current (A)', 'small-signal'], ...results.map((t) => [t.net, t.openCircuitVoltage, t.resistance, t.shortCircuitCurrent, String(t.smallSignal)])]));
        return;
      }
      io.out({ ok: true, analysis: 'thevenin', results }, pretty);
    });
  },
};
