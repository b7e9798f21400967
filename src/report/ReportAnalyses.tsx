// The report's analysis sections: the last sweep and tolerance runs made in this browser tab
// (they are session results, so a report opened elsewhere says how to add them).
import { useMemo } from 'react';
import type { ToolSessionState } from '../editor/tools/results/toolSession';
import { buildSweepPlot } from '../editor/tools/sweep/plotModel';
import { SweepPlot } from '../editor/tools/sweep/SweepPlot';
import { compareWithCurve } from '../editor/tools/sweep/deviation';
import { measuredPairs } from '../editor/tools/sweep/plotModel';
import { MonteCarloSummary, WorstCaseSummary } from '../editor/tools/tolerance/ToleranceResults';
import { printPlotTheme } from '../editor/tools/plot/plotTheme';
import { fmtQ } from '../editor/tools/format';

const theme = printPlotTheme();

function StaleNote({ stale }: { stale: boolean }) {
  return stale ? <p className="mb-1 text-[12px] text-caution">Run on an earlier version of this sheet; run it again in the editor to update this section.</p> : null;
}

export function SweepSection({ session, sheetKey }: { session: ToolSessionState | null; sheetKey: string }) {
  const data = session?.sweep.result ?? null;
  const outputs = useMemo(() => (data && session?.sweepForm ? session.sweepForm.outputs.filter((o) => data.curves[o]) : []), [data, session]);
  const model = useMemo(
    () => (data ? buildSweepPlot(data, outputs, session?.bench ?? null, (f) => (data.family ? `${data.family.key} = ${fmtQ(data.family.values[f], data.family.unit)}` : '')) : null),
    [data, outputs, session],
  );
  if (!data || !model || !outputs.length)
    return (
      <section data-testid="report-sweep">
        <h2>Sweep</h2>
        <p className="text-sm text-ink-muted">No sweep was run for this sheet in this browser tab. Run one in the editor’s Sweep tab and open the report again to include it.</p>
      </section>
    );
  const bench = session?.bench;
  return (
    <section data-testid="report-sweep">
      <h2>Sweep: {outputs.join(', ')} against {data.x.key}{data.family ? ` (one curve per ${data.family.key})` : ''}</h2>
      <StaleNote stale={session?.sweep.resultKey !== sheetKey} />
      <SweepPlot model={model} data={data} theme={theme} height={240} />
      <ul className="mt-1 flex flex-wrap gap-x-4 text-[11px]">
        {model.series.map((s) => (
          <li key={s.label} className="inline-flex items-center gap-1">
            <span className={`tl-swatch tl-swatch-${s.color % 8} ${s.kind === 'measured' ? 'is-dot' : ''}`} /> {s.label}
          </li>
        ))}
      </ul>
      {bench &&
        Object.entries(bench.mapping.yColumns)
          .filter(([, o]) => data.curves[o])
          .map(([col, o]) => {
            const p = measuredPairs(bench.table, bench.mapping, Number(col));
            const s = compareWithCurve(data.x.values, data.curves[o][0], p.x, p.y, data.x.scale === 'log');
            const u = data.units[o] ?? '';
            return (
              <p key={col} className="mt-1 text-[12px]">
                Bench readings “{bench.table.columns[Number(col)]}” ({bench.table.fileName}) against {o}: max deviation <span className="num">{fmtQ(s.maxAbs, u)}</span>, RMS{' '}
                <span className="num">{fmtQ(s.rms, u)}</span> over {s.compared} readings.
              </p>
            );
          })}
    </section>
  );
}

export function ToleranceSection({ session, sheetKey }: { session: ToolSessionState | null; sheetKey: string }) {
  const wc = session?.worstCase.result ?? null;
  const mc = session?.monteCarlo.result ?? null;
  if (!wc && !mc)
    return (
      <section data-testid="report-tolerance">
        <h2>Tolerance</h2>
        <p className="text-sm text-ink-muted">No tolerance run was made for this sheet in this browser tab. Run one in the editor’s Tolerance tab to include the worst-case window and the Monte Carlo spread.</p>
      </section>
    );
  const keys = mc?.outputs.map((o) => o.key) ?? wc!.outputs.map((o) => o.key);
  const stale = (session?.monteCarlo.resultKey ?? session?.worstCase.resultKey) !== sheetKey;
  return (
    <section className="can-split" data-testid="report-tolerance">
      <h2>Tolerance</h2>
      <StaleNote stale={stale} />
      {mc && (
        <p className="mb-2 text-[12px] text-ink-muted">
          Monte Carlo: {mc.samples} samples, seed {mc.seed}, {mc.variables.map((v) => v.key).join(', ')} varied ({mc.variables[0]?.distribution ?? 'normal'}
          {mc.variables[0]?.distribution === 'normal' ? ', tolerance = 3σ' : ''}).
        </p>
      )}
      <div className="grid grid-cols-2 gap-6 max-md:grid-cols-1 print:grid-cols-2">
        {keys.map((k) => {
          const w = wc?.outputs.find((o) => o.key === k);
          const m = mc?.outputs.find((o) => o.key === k);
          return (
            <div key={k} style={{ breakInside: 'avoid' }}>
              <h3 className="num mb-1 text-sm font-semibold">{k}</h3>
              {w && <WorstCaseSummary wc={w} />}
              {m && <div className="mt-2"><MonteCarloSummary mc={m} wc={w} theme={theme} height={150} /></div>}
            </div>
          );
        })}
      </div>
    </section>
  );
}
