// The sweep plot: simulated curves, measured points on top, a cursor read-out beneath, and
// drag-to-zoom (double-click to zoom out).
import { useCallback, useMemo, useState } from 'react';
import type uPlot from 'uplot';
import { formatEng } from '../../../../shared/units';
import { UPlotChart } from '../plot/UPlotChart';
import type { PlotTheme } from '../plot/plotTheme';
import { fmtQ } from '../format';
import { interpolate } from './deviation';
import type { SweepData } from './sweepData';
import type { SweepPlotModel } from './plotModel';

const tick = (_u: uPlot, splits: number[]) => splits.map((v) => formatEng(v, '', { digits: 3 }));

export function sweepPlotOptions(model: SweepPlotModel, data: SweepData, height = 260) {
  return (width: number, theme: PlotTheme): uPlot.Options => {
    const axis = (label: string, extra: Partial<uPlot.Axis> = {}): uPlot.Axis => ({
      label,
      stroke: theme.muted,
      grid: { stroke: theme.grid, width: 1 },
      ticks: { stroke: theme.grid, width: 1 },
      values: tick,
      labelFont: '12px "IBM Plex Sans", system-ui, sans-serif',
      font: '11px "JetBrains Mono", ui-monospace, monospace',
      ...extra,
    });
    const [u0, u1] = model.units;
    // name the outputs on their axis when there are few of them
    const yLabel = (unit: string | undefined) => {
      const names = [...new Set(model.series.filter((s) => s.unit === unit && s.kind === 'simulated').map((s) => s.output))];
      const u = unit ? ` (${unit})` : '';
      return names.length && names.length <= 2 ? `${names.join(', ')}${u}` : u.trim();
    };
    return {
      width,
      height,
      scales: { x: { time: false, distr: data.x.scale === 'log' ? 3 : 1 }, y: { auto: true }, ...(u1 !== undefined ? { y2: { auto: true } } : {}) },
      axes: [
        axis(`${data.x.key}${data.x.unit ? ` (${data.x.unit})` : ''}`),
        axis(yLabel(u0), { scale: 'y', size: 60 }),
        ...(u1 !== undefined ? [axis(yLabel(u1), { scale: 'y2', side: 1, grid: { show: false }, size: 60 })] : []),
      ],
      series: [
        { label: data.x.key },
        ...model.series.map((s): uPlot.Series => ({
          label: s.label,
          scale: s.unit === u0 ? 'y' : 'y2',
          stroke: theme.series[s.color % theme.series.length],
          width: s.kind === 'measured' ? 0 : 2,
          spanGaps: true,
          ...(s.kind === 'measured'
            ? { paths: () => null, points: { show: true, size: 7, width: 1.5, fill: theme.panel, stroke: theme.series[s.color % theme.series.length] } }
            : { points: { show: false } }),
        })),
      ],
      legend: { show: false },
      cursor: { drag: { x: true, y: false }, points: { size: 6 } },
    };
  };
}

export function SweepPlot({ model, data, chartRef, theme, height }: { model: SweepPlotModel; data: SweepData; chartRef?: (u: uPlot | null) => void; theme?: PlotTheme; height?: number }) {
  const [idx, setIdx] = useState<number | null>(null);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const makeOptions = useCallback(sweepPlotOptions(model, data, height), [model, data, height]);
  const x = idx === null ? null : (model.data[0][idx] as number);
  const readings = useMemo(() => {
    if (x === null) return [];
    const nf = data.family ? data.family.values.length : 1;
    return model.series.map((s, k) => {
      if (s.kind === 'measured') {
        const v = model.data[k + 1][idx!];
        return { label: s.label, value: v === null || v === undefined ? null : (v as number), unit: s.unit, color: s.color };
      }
      const f = data.family ? (k % nf) : 0;
      const ys = data.curves[s.output][f];
      return { label: s.label, value: interpolate(data.x.values, ys, x, data.x.scale === 'log'), unit: s.unit, color: s.color };
    });
  }, [x, idx, model, data]);
  return (
    <UPlotChart makeOptions={makeOptions} data={model.data} onCursor={setIdx} chartRef={chartRef} theme={theme} testId="sweep-plot">
      <div className="num mt-1 min-h-[2.5rem] text-[11px] text-ink-muted" data-testid="sweep-readout" aria-live="polite">
        {x === null ? (
          <span>Move over the plot to read values; drag to zoom, double-click to zoom out.</span>
        ) : (
          <>
            <span className="mr-3 text-ink">
              {data.x.key} = {fmtQ(x, data.x.unit)}
            </span>
            {readings.map((r) => (
              <span key={r.label} className="mr-3 inline-flex items-center gap-1">
                <SeriesSwatch index={r.color} measured={r.label.endsWith('(measured)')} />
                {r.label}: <span className="text-ink">{r.value === null ? '—' : fmtQ(r.value, r.unit)}</span>
              </span>
            ))}
          </>
        )}
      </div>
    </UPlotChart>
  );
}

/** The colour key of a series, as drawn in the plot. */
export function SeriesSwatch({ index, measured }: { index: number; measured?: boolean }) {
  return <span className={`tl-swatch tl-swatch-${index % 8} ${measured ? 'is-dot' : ''}`} aria-hidden />;
}
