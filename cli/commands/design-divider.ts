// `solve design-divider --supply 11:13 --target 3.3 --max-current 100u`: ranked E-series dividers
// (the designer lives in shared/design).
import { designDivider, type DividerBudget, type DividerLoad, type DividerSpec } from '../../shared/design';
import { isESeriesName } from '../../shared/units/eseries';
import { parseArgs, UsageError } from '../args';
import { EXIT_INVALID, EXIT_SOLVED } from '../io';
import { outputFlags, printedHelp, type CliCommand } from './types';
import { csvFlag, emitText, parseNumber, toCsv } from './analysis-common';

export const designDividerCommand: CliCommand = {
  name: 'design-divider',
  summary: 'design a voltage divider from preferred values: ranked candidates with worst-case window and dissipation',
  usage: 'npm run solve -- design-divider --supply V|MIN:MAX --target V (--max-current A | --total OHMS) [--tolerance F] [--series E24] [--load-ohms R | --load-amps A] [--csv]',
  flags: [
    { name: 'supply', value: true, valueName: 'V|MIN:MAX', description: 'supply voltage, or its range (nominal = midpoint)' },
    { name: 'target', value: true, valueName: 'V', description: 'wanted tap voltage at the nominal supply, with the load' },
    { name: 'max-current', value: true, valueName: 'A', description: "budget: the divider's own current at the highest supply, e.g. 100u" },
    { name: 'total', value: true, valueName: 'OHMS', description: 'budget: R1+R2 near this value instead' },
    { name: 'tolerance', value: true, valueName: 'F', description: 'resistor tolerance as a fraction or percent (default 0.01)' },
    { name: 'series', value: true, valueName: 'E6…E192', description: 'series the parts come from (default E24)' },
    { name: 'load-ohms', value: true, valueName: 'OHMS', description: 'the tap feeds this resistance' },
    { name: 'load-amps', value: true, valueName: 'A', description: 'the tap feeds this current' },
    { name: 'parts-per-leg', value: true, valueName: '1|2', description: '2 allows a series or parallel pair per leg' },
    { name: 'limit', value: true, valueName: 'N', description: 'how many candidates (default 10)' },
    csvFlag,
    ...outputFlags,
  ],
  run(argv, io) {
    const args = parseArgs(argv, this.flags);
    if (printedHelp(this, args, io)) return EXIT_SOLVED;
    const f = args.flags;
    const str = (k: string) => (typeof f[k] === 'string' ? (f[k] as string) : undefined);
    if (!str('supply') || !str('target')) throw new UsageError('give --supply and --target, e.g. --supply 12 --target 3.3 --max-current 100u');
    const sup = str('supply')!;
    const supply = sup.includes(':') ? { min: parseNumber(sup.split(':')[0], '--supply', 'V'), max: parseNumber(sup.split(':')[1], '--supply', 'V') } : parseNumber(sup, '--supply', 'V');
    let budget: DividerBudget;
    if (str('max-current')) budget = { maxQuiescentCurrent: parseNumber(str('max-current')!, '--max-current', 'A') };
    else if (str('total')) budget = { totalResistance: parseNumber(str('total')!, '--total', 'Ω') };
    else throw new UsageError('give a budget: --max-current A or --total OHMS');
    const tolText = str('tolerance') ?? '0.01';
    const tolerance = tolText.endsWith('%') ? parseNumber(tolText.slice(0, -1), '--tolerance') / 100 : parseNumber(tolText, '--tolerance');
    const series = (str('series') ?? 'E24').toUpperCase();
    if (!isESeriesName(series)) throw new UsageError(`--series is one of E6, E12, E24, E48, E96, E192 (got "${series}")`);
    let load: DividerLoad = { kind: 'none' };
    if (str('load-ohms')) load = { kind: 'resistance', ohms: parseNumber(str('load-ohms')!, '--load-ohms', 'Ω') };
    if (str('load-amps')) load = { kind: 'current', amps: parseNumber(str('load-amps')!, '--load-amps', 'A') };
    const ppl = str('parts-per-leg') ? Number(str('parts-per-leg')) : 1;
    if (ppl !== 1 && ppl !== 2) throw new UsageError('--parts-per-leg is 1 or 2');
    const spec: DividerSpec = { supply, target: parseNumber(str('target')!, '--target', 'V'), budget, tolerance, series, load, partsPerLeg: ppl, ...(str('limit') ? { limit: Number(str('limit')) } : {}) };
    const d = designDivider(spec);
    if (!d.ok) {
      io.out({ ok: false, error: { code: 'invalid_analysis', message: d.message, parts: [], nets: [] } }, f.pretty === true);
      io.log(`design-divider: ${d.message}`);
      return EXIT_INVALID;
    }
    for (const w of d.warnings) io.log(`caution: ${w}`);
    if (f.csv === true) {
      emitText(io, toCsv([['rank', 'R1 (top)', 'R2 (bottom)', 'output (V)', 'error', 'window min (V)', 'window max (V)', 'quiescent current (A)'], ...d.candidates.map((c, i) => [i + 1, c.top.expression, c.bottom.expression, c.output, c.error, c.window.min, c.window.max, c.quiescentCurrent])]));
      return EXIT_SOLVED;
    }
    io.out({ analysis: 'design-divider', ...d }, f.pretty === true);
    return EXIT_SOLVED;
  },
};
