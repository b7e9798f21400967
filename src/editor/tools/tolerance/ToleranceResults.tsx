// What the tolerance runs found for one output: the worst-case window and what drives it, the
// Monte Carlo histogram, spread and percentiles, and the yield against the spec window.
import type { MonteCarloResult } from '../../../../shared/analysis/monte-carlo';
import type { WorstCaseOutput } from '../../../../shared/analysis/worst-case';
import type { PlotTheme } from '../plot/plotTheme';
import { fmtPct, fmtQ } from '../format';
import { HistogramPlot } from './HistogramPlot';

type McOutput = MonteCarloResult['outputs'][number];

export function WorstCaseSummary({ wc }: { wc: WorstCaseOutput }) {
  const u = wc.unit;
  const drivers = wc.contributions.filter((c) => c.share > 0.005).slice(0, 5);
  return (
    <div className="text-xs" data-testid="worst-case-summary">
      <p>
        Worst case <span className="num font-semibold">{fmtQ(wc.min.value, u)}</span> … <span className="num font-semibold">{fmtQ(wc.max.value, u)}</span>{' '}
        <span className="text-ink-muted">
          (nominal <span className="num">{fmtQ(wc.nominal, u)}</span>, {fmtPct((wc.min.value - wc.nominal) / Math.abs(wc.nominal), 3)} / +
          {fmtPct((wc.max.value - wc.nominal) / Math.abs(wc.nominal), 3)})
        </span>
      </p>
      {drivers.length > 0 && (
        <table className="tl-table num mt-1">
          <thead>
            <tr>
              <th>drives the spread</th>
              <th className="r">share</th>
              <th className="r">at max</th>
              <th className="r">at min</th>
            </tr>
          </thead>
          <tbody>
            {drivers.map((c) => (
              <tr key={c.key}>
                <td>{c.key}</td>
                <td className="r">{fmtPct(c.share, 3)}</td>
                <td className="r" title={`moves the output by +${fmtQ(c.towardMax, u, 3)}`}>{wc.max.sides[c.key] ?? '—'}</td>
                <td className="r" title={`moves the output by ${fmtQ(c.towardMin, u, 3)}`}>{wc.min.sides[c.key] ?? '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}

export function MonteCarloSummary({ mc, wc, theme, height }: { mc: McOutput; wc?: WorstCaseOutput; theme?: PlotTheme; height?: number }) {
  const s = mc.stats;
  const u = mc.unit;
  const p = (k: string) => s.percentiles[k];
  return (
    <div className="text-xs" data-testid="monte-carlo-summary">
      <HistogramPlot
        histogram={s.histogram}
        unit={u}
        label={mc.key}
        marks={{ spec: s.yield?.window, worstCase: wc ? { min: wc.min.value, max: wc.max.value } : undefined }}
        theme={theme}
        height={height}
        testId="mc-histogram"
      />
      <p className="mt-1 text-[11px] text-ink-muted">
        <span className="tl-swatch tl-swatch-3" /> spec window · <span className="text-danger">- - -</span> worst-case window
      </p>
      <dl className="num mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
        <dt className="text-ink-muted">mean ± σ</dt>
        <dd>
          {fmtQ(s.mean, u, 5)} ± {fmtQ(s.std, u, 3)} <span className="text-ink-muted">({s.count} samples)</span>
        </dd>
        <dt className="text-ink-muted">0.135 … 99.865 %</dt>
        <dd>
          {fmtQ(p('0.135'), u)} … {fmtQ(p('99.865'), u)} <span className="text-ink-muted">(±3σ-equivalent)</span>
        </dd>
        <dt className="text-ink-muted">1 / 50 / 99 %</dt>
        <dd>
          {fmtQ(p('1'), u)} / {fmtQ(p('50'), u)} / {fmtQ(p('99'), u)}
        </dd>
        <dt className="text-ink-muted">min … max seen</dt>
        <dd>
          {fmtQ(s.min, u)} … {fmtQ(s.max, u)}
        </dd>
        {s.yield && (
          <>
            <dt className="text-ink-muted">yield</dt>
            <dd data-testid="mc-yield">
              <span className="font-semibold">{fmtPct(s.yield.fraction)}</span> in {s.yield.window.min !== undefined ? fmtQ(s.yield.window.min, u) : '−∞'} …{' '}
              {s.yield.window.max !== undefined ? fmtQ(s.yield.window.max, u) : '+∞'}{' '}
              <span className="text-ink-muted">
                ({s.yield.pass}/{s.yield.total}; 95 % interval {fmtPct(s.yield.interval95[0], 3)} … {fmtPct(s.yield.interval95[1], 3)})
              </span>
            </dd>
          </>
        )}
      </dl>
    </div>
  );
}
