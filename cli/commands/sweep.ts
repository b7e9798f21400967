// `solve sweep FILE --vary PART.PARAM=FROM:TO:POINTS[:log] [--vary …]`: one or two nested sweeps.
import { runSweep, type SweepAxis } from '../../shared/analysis';
import { UsageError } from '../args';
import { commonSheetFlags, type CliCommand } from './types';
import { csvFlag, emitText, jsonColumn, list, parseNumber, runSheetCommand, targetFrom, toCsv } from './analysis-common';

function parseAxis(text: string) {
  const eq = text.indexOf('=');
  if (eq < 0) throw new UsageError(`--vary expects TARGET=FROM:TO:POINTS[:log] (got "${text}")`);
  const target = targetFrom(text.slice(0, eq), '--vary');
  const parts = text.slice(eq + 1).split(':');
  if (parts.length < 3 || parts.length > 4 || (parts[3] !== undefined && parts[3] !== 'log' && parts[3] !== 'lin'))
    throw new UsageError(`--vary expects TARGET=FROM:TO:POINTS[:log] (got "${text}")`);
  const points = Number(parts[2]);
  if (parts[0] === 'min' && parts[1] === 'max') return { target, steps: { overRange: true as const, points, scale: parts[3] === 'log' ? ('log' as const) : ('linear' as const) } };
  return { target, steps: { from: parseNumber(parts[0], '--vary from'), to: parseNumber(parts[1], '--vary to'), points, scale: parts[3] === 'log' ? ('log' as const) : ('linear' as const) } };
}

export const sweepCommand: CliCommand = {
  name: 'sweep',
  summary: 'sweep one param or condition (or two, nested): every net voltage, pin current and power per point',
  usage: 'npm run solve -- sweep FILE.json --vary TARGET=FROM:TO:POINTS[:log] [--vary TARGET=…] [--column KEY]... [--csv]',
  flags: [
    { name: 'vary', value: true, repeat: true, valueName: 'TARGET=FROM:TO:POINTS[:log]', description: 'what to sweep, e.g. RV1.position=0:1:101, temperature=-20:60:17, or V1.voltage=min:max:21 (the declared supply range); a second --vary is the inner loop' },
    { name: 'column', value: true, repeat: true, valueName: 'KEY', description: 'print only these columns, e.g. V(tap) I(R1.a) P(R1) (default: all)' },
    csvFlag,
    ...commonSheetFlags,
  ],
  run(argv, io) {
    return runSheetCommand(this, argv, io, ({ args, prepared, base, pretty, csv }) => {
      const axes = list(args.flags, 'vary').map(parseAxis);
      if (axes.length < 1 || axes.length > 2) throw new UsageError('give one or two --vary axes');
      const t = runSweep(prepared, { axes: axes as [SweepAxis] | [SweepAxis, SweepAxis], base });
      const wanted = list(args.flags, 'column');
      for (const w of wanted) if (!(w in t.columns)) throw new UsageError(`no column "${w}"; columns are ${Object.keys(t.columns).join(' ')}`);
      const keys = wanted.length ? wanted : Object.keys(t.columns);
      for (const e of t.errors) io.log(`point ${e.point} (${e.at.join(', ')}): ${e.message}`);
      if (csv) {
        const errAt = new Map(t.errors.map((e) => [e.point, e.message]));
        const rows: Array<Array<string | number | null>> = [[...t.axes.map((a) => a.key), ...keys, 'error']];
        for (let pt = 0; pt < t.points; pt++) rows.push([...t.axisColumns.map((c) => c[pt]), ...keys.map((k) => t.columns[k][pt]), errAt.get(pt) ?? '']);
        emitText(io, toCsv(rows));
        return;
      }
      io.out(
        {
          ok: true,
          analysis: 'sweep',
          axes: t.axes,
          points: t.points,
          axisColumns: t.axisColumns.map(jsonColumn),
          columns: Object.fromEntries(keys.map((k) => [k, jsonColumn(t.columns[k])])),
          units: Object.fromEntries(keys.map((k) => [k, t.units[k]])),
          errors: t.errors,
        },
        pretty,
      );
    });
  },
};
