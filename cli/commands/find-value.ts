// `solve find-value 4k7 --series E24 --parts 2`: preferred values and pairs/triples near a target
// (the value finder lives in shared/design).
import { findValue } from '../../shared/design';
import { isESeriesName } from '../../shared/units/eseries';
import { parseArgs, UsageError } from '../args';
import { EXIT_INVALID, EXIT_SOLVED } from '../io';
import { outputFlags, printedHelp, type CliCommand } from './types';
import { csvFlag, emitText, parseNumber, toCsv } from './analysis-common';

export const findValueCommand: CliCommand = {
  name: 'find-value',
  summary: 'nearest preferred values, series/parallel pairs and triples for a target resistance',
  usage: 'npm run solve -- find-value OHMS [--series E24] [--parts 1|2|3] [--limit N] [--min-part OHMS] [--max-part OHMS] [--csv]',
  flags: [
    { name: 'series', value: true, valueName: 'E6…E192', description: 'series to draw parts from (default E24)' },
    { name: 'parts', value: true, valueName: '1|2|3', description: 'up to how many parts in a combination (default 2)' },
    { name: 'limit', value: true, valueName: 'N', description: 'length of the ranking (default 10)' },
    { name: 'min-part', value: true, valueName: 'OHMS', description: 'smallest part value allowed' },
    { name: 'max-part', value: true, valueName: 'OHMS', description: 'largest part value allowed' },
    csvFlag,
    ...outputFlags,
  ],
  run(argv, io) {
    const args = parseArgs(argv, this.flags);
    if (printedHelp(this, args, io)) return EXIT_SOLVED;
    if (args.positionals.length !== 1) throw new UsageError('give one target resistance, e.g. 4k7 or 4700');
    const target = parseNumber(args.positionals[0], 'target', 'Ω');
    const series = typeof args.flags.series === 'string' ? args.flags.series.toUpperCase() : 'E24';
    if (!isESeriesName(series)) throw new UsageError(`--series is one of E6, E12, E24, E48, E96, E192 (got "${series}")`);
    const parts = typeof args.flags.parts === 'string' ? Number(args.flags.parts) : 2;
    if (parts !== 1 && parts !== 2 && parts !== 3) throw new UsageError('--parts is 1, 2 or 3');
    const opt = (k: string) => (typeof args.flags[k] === 'string' ? parseNumber(args.flags[k] as string, `--${k}`, 'Ω') : undefined);
    try {
      const r = findValue(target, {
        series,
        maxParts: parts,
        ...(opt('limit') !== undefined ? { limit: opt('limit') } : {}),
        ...(opt('min-part') !== undefined ? { minPart: opt('min-part') } : {}),
        ...(opt('max-part') !== undefined ? { maxPart: opt('max-part') } : {}),
      });
      if (args.flags.csv === true) {
        emitText(io, toCsv([['rank', 'topology', 'expression', 'value (ohm)', 'error', 'parts (ohm)'], ...r.ranked.map((m, i) => [i + 1, m.topology, m.expression, m.value, m.error, m.parts.join(' ')])]));
        return EXIT_SOLVED;
      }
      io.out({ ok: true, analysis: 'find-value', ...r }, args.flags.pretty === true);
      return EXIT_SOLVED;
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      io.out({ ok: false, error: { code: 'invalid_analysis', message, parts: [], nets: [] } }, false);
      io.log(`find-value: ${message}`);
      return EXIT_INVALID;
    }
  },
};
