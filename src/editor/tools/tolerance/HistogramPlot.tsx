// Monte Carlo histogram of one output, with the spec window (solid) and the worst-case window
// (dashed) drawn as vertical lines.
import { useCallback, useMemo } from 'react';
import uPlot from 'uplot';
import { formatEng } from '../../../../shared/units';
import type { Histogram, SpecWindow } from '../../../../shared/analysis/statistics';
import { UPlotChart } from '../plot/UPlotChart';
import type { PlotTheme } from '../plot/plotTheme';

export interface HistogramMarks {
  spec?: SpecWindow;
  worstCase?: { min: number; max: number };
}

export function histogramData(h: Histogram): uPlot.AlignedData {
  const centres = h.counts.map((_, i) => (h.edges[i] + h.edges[i + 1]) / 2);
  return [centres, h.counts];
}

export function histogramOptions(h: Histogram, unit: string, marks: HistogramMarks, height: number, label = '') {
  return (width: number, theme: PlotTheme): uPlot.Options => {
    const xs = [h.edges[0], h.edges[h.edges.length - 1], marks.spec?.min, marks.spec?.max, marks.worstCase?.min, marks.worstCase?.max].filter(
      (v): v is number => typeof v === 'number' && Number.isFinite(v),
    );
    const lo = Math.min(...xs);
    const hi = Math.max(...xs);
    const pad = (hi - lo) * 0.04 || Math.abs(lo) * 0.01 || 1;
    const line = (u: uPlot, v: number | undefined, color: string, dash: number[]) => {
      if (v === undefined || !Number.isFinite(v)) return;
      const x = u.valToPos(v, 'x', true);
      const ctx = u.ctx;
      ctx.save();
      ctx.strokeStyle = color;
      ctx.lineWidth = 2 * devicePixelRatio;
      ctx.setLineDash(dash.map((d) => d * devicePixelRatio));
      ctx.beginPath();
      ctx.moveTo(x, u.bbox.top);
      ctx.lineTo(x, u.bbox.top + u.bbox.height);
      ctx.stroke();
      ctx.restore();
    };
    const axis = (label: string, extra: Partial<uPlot.Axis> = {}): uPlot.Axis => ({
      label,
      stroke: theme.muted,
      grid: { stroke: theme.grid, width: 1 },
      ticks: { stroke: theme.grid, width: 1 },
      labelFont: '12px "IBM Plex Sans", system-ui, sans-serif',
      font: '11px "JetBrains Mono", ui-monospace, monospace',
      ...extra,
    });
    return {
      width,
      height,
      scales: { x: { time: false, range: [lo - pad, hi + pad] }, y: { range: (_u, _min, max) => [0, Math.max(1, max * 1.08)] } },
      axes: [axis(`${label}${unit ? ` (${unit})` : ''}`.trim(), { values: (_u, s) => s.map((v) => formatEng(v, '', { digits: 4 })) }), axis('samples', { size: 50 })],
      series: [
        {},
        {
          label: 'samples',
          stroke: theme.series[0],
          fill: `${theme.series[0]}55`,
          width: 1,
          paths: uPlot.paths.bars!({ size: [1, Infinity], gap: 1 }),
          points: { show: false },
        },
      ],
      legend: { show: false },
      cursor: { drag: { x: false, y: false } },
      hooks: {
        draw: [
          (u) => {
            line(u, marks.spec?.min, theme.ok, []);
            line(u, marks.spec?.max, theme.ok, []);
            line(u, marks.worstCase?.min, theme.danger, [5, 4]);
            line(u, marks.worstCase?.max, theme.danger, [5, 4]);
          },
        ],
      },
    };
  };
}

export function HistogramPlot({ histogram, unit, label, marks, theme, height = 180, chartRef, testId }: { histogram: Histogram; unit: string; label?: string; marks: HistogramMarks; theme?: PlotTheme; height?: number; chartRef?: (u: uPlot | null) => void; testId?: string }) {
  const data = useMemo(() => histogramData(histogram), [histogram]);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const makeOptions = useCallback(histogramOptions(histogram, unit, marks, height, label), [histogram, unit, label, marks.spec?.min, marks.spec?.max, marks.worstCase?.min, marks.worstCase?.max, height]);
  return <UPlotChart makeOptions={makeOptions} data={data} theme={theme} chartRef={chartRef} testId={testId} />;
}
