// `solve monte-carlo FILE --output V(tap) --samples 10000 --seed 1`: statistical tolerance run.
import { runMonteCarloChunk, summarizeMonteCarlo, type Distribution, type SpecWindow } from '../../shared/analysis';
import { UsageError } from '../args';
import { commonSheetFlags, type CliCommand } from './types';
import { csvFlag, emitText, list, outputsFrom, parseNumber, runSheetCommand, toCsv } from './analysis-common';
import { toleranceFlags, toleranceOptionsFrom } from './tolerance-flags';

export const monteCarloCommand: CliCommand = {
  name: 'monte-carlo',
  summary: 'Monte Carlo over part tolerances: mean, σ, percentiles, histogram and yield per output (seeded, reproducible)',
  usage: 'npm run solve -- monte-carlo FILE.json --output KEY... [--samples N] [--seed N] [--distribution normal|uniform] [--spec KEY=MIN:MAX] [--csv]',
  flags: [
    ...toleranceFlags,
    { name: 'samples', value: true, valueName: 'N', description: 'number of samples (default 1000)' },
    { name: 'seed', value: true, valueName: 'N', description: 'random seed, an integer (default 1); the same seed gives the same samples' },
    { name: 'distribution', value: true, valueName: 'normal|uniform', description: 'normal with the tolerance at 3σ (default), or uniform over the tolerance' },
    { name: 'uniform', value: true, repeat: true, valueName: 'PART', description: 'draw this part uniformly whatever --distribution says (repeatable)' },
    { name: 'spec', value: true, repeat: true, valueName: 'KEY=MIN:MAX', description: 'spec window for the yield, e.g. "V(tap)=3.1:3.4" (an empty side is open: "V(tap)=3.1:")' },
    { name: 'bins', value: true, valueName: 'N', description: 'histogram bins (default 40)' },
    { name: 'samples-out', description: 'with --csv: print every sample (one row per sample) instead of the summary' },
    csvFlag,
    ...commonSheetFlags,
  ],
  run(argv, io) {
    return runSheetCommand(this, argv, io, ({ args, prepared, base, pretty, csv }) => {
      const outputs = outputsFrom(args.flags);
      if (!outputs.length) throw new UsageError('which output? e.g. --output "V(tap)"');
      const num = (k: string, d: number) => (typeof args.flags[k] === 'string' ? parseNumber(args.flags[k] as string, `--${k}`) : d);
      const dist = args.flags.distribution ?? 'normal';
      if (dist !== 'normal' && dist !== 'uniform') throw new UsageError(`--distribution is normal or uniform (got "${String(dist)}")`);
      const windows: Record<string, SpecWindow> = {};
      for (const s of list(args.flags, 'spec')) {
        const m = /^(.+)=([^:]*):([^:]*)$/.exec(s);
        if (!m) throw new UsageError(`--spec expects KEY=MIN:MAX (got "${s}")`);
        const key = m[1].includes('(') ? m[1] : `V(${m[1]})`;
        windows[key] = { ...(m[2] ? { min: parseNumber(m[2], '--spec') } : {}), ...(m[3] ? { max: parseNumber(m[3], '--spec') } : {}) };
      }
      const opts = {
        ...toleranceOptionsFrom(args.flags),
        outputs,
        samples: num('samples', 1000),
        seed: num('seed', 1),
        distribution: dist as Distribution,
        distributionOf: Object.fromEntries(list(args.flags, 'uniform').map((p) => [p, 'uniform' as const])),
        windows,
        histogramBins: num('bins', 40),
        base,
      };
      let last = Date.now();
      const chunk = runMonteCarloChunk(prepared, opts, 0, opts.samples, {
        checkEvery: 500,
        onProgress: (done, total) => {
          if (Date.now() - last > 2000) {
            io.log(`monte-carlo: ${done}/${total} samples`);
            last = Date.now();
          }
        },
      });
      const r = summarizeMonteCarlo(prepared, opts, [chunk]);
      if (r.failed) io.log(`caution: ${r.failed} of ${r.samples} samples did not solve (counted as out of spec); first: ${r.failures[0].message}`);
      if (csv && args.flags['samples-out'] === true) {
        const rows: Array<Array<string | number | null>> = [['sample', ...r.outputs.map((o) => o.key)]];
        for (let i = 0; i < chunk.count; i++) rows.push([i, ...chunk.values.map((v) => v[i])]);
        emitText(io, toCsv(rows));
        return;
      }
      if (csv) {
        const pk = Object.keys(r.outputs[0].stats.percentiles);
        const rows: Array<Array<string | number | null>> = [['output', 'unit', 'count', 'mean', 'std', 'min', 'max', ...pk.map((p) => `p${p}`), 'yield', 'yield low 95%', 'yield high 95%']];
        for (const o of r.outputs) {
          const s = o.stats;
          rows.push([o.key, o.unit, s.count, s.mean, s.std, s.min, s.max, ...pk.map((p) => s.percentiles[p]), s.yield?.fraction ?? null, s.yield?.interval95[0] ?? null, s.yield?.interval95[1] ?? null]);
        }
        emitText(io, toCsv(rows));
        return;
      }
      io.out({ ok: true, analysis: 'monte-carlo', ...r }, pretty);
    });
  },
};
