// `solve worst-case FILE --output V(tap)`: extremes over tolerances and supply ranges.
import { runWorstCase } from '../../shared/analysis';
import { UsageError } from '../args';
import { commonSheetFlags, type CliCommand } from './types';
import { csvFlag, emitText, outputsFrom, parseNumber, runSheetCommand, toCsv } from './analysis-common';
import { toleranceFlags, toleranceOptionsFrom } from './tolerance-flags';

export const worstCaseCommand: CliCommand = {
  name: 'worst-case',
  summary: 'worst-case extremes of chosen outputs over part tolerances and supply ranges, with the parts that drive them',
  usage: 'npm run solve -- worst-case FILE.json --output KEY [--output KEY]... [--exclude PART] [--tolerance PART=FRACTION] [--range TARGET=LOW:HIGH] [--csv]',
  flags: [
    ...toleranceFlags,
    { name: 'all-corners-up-to', value: true, valueName: 'N', description: 'try every corner when at most N params vary (default 10); above it, sensitivity corners plus a vertex search' },
    csvFlag,
    ...commonSheetFlags,
  ],
  run(argv, io) {
    return runSheetCommand(this, argv, io, ({ args, prepared, base, pretty, csv }) => {
      const outputs = outputsFrom(args.flags);
      if (!outputs.length) throw new UsageError('which output? e.g. --output "V(tap)"');
      const limit = args.flags['all-corners-up-to'];
      const r = runWorstCase(prepared, {
        ...toleranceOptionsFrom(args.flags),
        outputs,
        base,
        ...(typeof limit === 'string' ? { maxExhaustiveVariables: parseNumber(limit, '--all-corners-up-to') } : {}),
      });
      for (const f of r.failedCorners.slice(0, 5)) io.log(`caution: the circuit does not solve at a corner (${JSON.stringify(f.corner)}): ${f.message}`);
      if (csv) {
        const rows: Array<Array<string | number | null>> = [['output', 'unit', 'nominal', 'min', 'max', 'min (first order)', 'max (first order)', 'variable', 'sensitivity', 'toward max', 'toward min', 'share', 'side at min', 'side at max']];
        for (const o of r.outputs)
          for (const c of o.contributions)
            rows.push([o.key, o.unit, o.nominal, o.min.value, o.max.value, o.min.linearEstimate, o.max.linearEstimate, c.key, c.sensitivity, c.towardMax, c.towardMin, c.share, o.min.sides[c.key], o.max.sides[c.key]]);
        emitText(io, toCsv(rows));
        return;
      }
      io.out({ ok: true, analysis: 'worst-case', ...r }, pretty);
    });
  },
};
