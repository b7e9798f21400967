// `solve budget FILE [--load RL1]`: supply current and power, part stress against derated ratings,
// divider efficiency.
import { powerBudget, solveOrThrow } from '../../shared/analysis';
import { commonSheetFlags, type CliCommand } from './types';
import { csvFlag, emitText, runSheetCommand, toCsv } from './analysis-common';

export const budgetCommand: CliCommand = {
  name: 'budget',
  summary: 'supply current and power, each part against its (derated) rating, and the efficiency into a load',
  usage: 'npm run solve -- budget FILE.json [--load PART] [--source PART] [--temperature C] [--csv]',
  flags: [
    { name: 'load', value: true, valueName: 'PART', description: 'the part the divider feeds, for the efficiency P(load)/P(source)' },
    { name: 'source', value: true, valueName: 'PART', description: 'the supply feeding it (default: all supplies)' },
    csvFlag,
    ...commonSheetFlags,
  ],
  run(argv, io) {
    return runSheetCommand(this, argv, io, ({ args, prepared, base, pretty, csv }) => {
      const r = solveOrThrow(prepared, base, false);
      const b = powerBudget(prepared.sheet, r, {
        ...(typeof args.flags.load === 'string' ? { load: args.flags.load } : {}),
        ...(typeof args.flags.source === 'string' ? { source: args.flags.source } : {}),
      });
      for (const s of b.stress) if (s.status !== 'ok') io.log(`${s.status === 'over' ? 'warning' : 'caution'}: ${s.part} at ${(s.utilisation * 100).toFixed(0)} % of its ${s.quantity} rating at ${s.ambientC} °C — hot parts can burn; check the datasheet and local practice.`);
      if (csv) {
        const rows: Array<Array<string | number | null>> = [['part', 'type', 'quantity', 'value', 'rating', 'derated rating', 'ambient (C)', 'utilisation', 'status']];
        for (const s of b.stress) rows.push([s.part, s.type, s.quantity, s.value, s.rating, s.deratedRating, s.ambientC, s.utilisation, s.status]);
        for (const s of b.supplies) rows.push([s.part, s.type, 'supply current (A) / power (W)', s.current, null, null, null, s.power, '']);
        for (const br of b.branches) rows.push([br.part, br.type, 'branch current (A) / power (W)', br.current, null, null, null, br.power, '']);
        emitText(io, toCsv(rows));
        return;
      }
      io.out({ ok: true, analysis: 'budget', ...b }, pretty);
    });
  },
};
