// A React home for one uPlot chart: makes it on mount, keeps it as wide as its box, remakes it
// when the options or the theme change, and hands the cursor position to a read-out.
import { useEffect, useRef, useState, type ReactNode } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { currentPlotTheme, type PlotTheme } from './plotTheme';

export interface UPlotChartProps {
  /** builds the options for a width (px) and theme; must not depend on anything else that changes per render */
  makeOptions: (width: number, theme: PlotTheme) => uPlot.Options;
  data: uPlot.AlignedData;
  /** called with the data index under the cursor (null when it leaves) */
  onCursor?: (index: number | null) => void;
  /** receives the chart (for PNG export), null on unmount */
  chartRef?: (u: uPlot | null) => void;
  /** theme override (the report prints in its own theme) */
  theme?: PlotTheme;
  className?: string;
  children?: ReactNode;
  testId?: string;
}

/** Re-render when the page's data-theme attribute changes. */
function useThemeVersion(): number {
  const [v, setV] = useState(0);
  useEffect(() => {
    const mo = new MutationObserver(() => setV((x) => x + 1));
    mo.observe(document.documentElement, { attributes: true, attributeFilter: ['data-theme'] });
    return () => mo.disconnect();
  }, []);
  return v;
}

export function UPlotChart({ makeOptions, data, onCursor, chartRef, theme, className, children, testId }: UPlotChartProps) {
  const box = useRef<HTMLDivElement>(null);
  const chart = useRef<uPlot | null>(null);
  const [width, setWidth] = useState(0);
  const themeVersion = useThemeVersion();
  const cursorCb = useRef(onCursor);
  const dataRef = useRef(data);
  useEffect(() => {
    cursorCb.current = onCursor;
  }, [onCursor]);

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const ro = new ResizeObserver(([entry]) => setWidth(Math.floor(entry.contentRect.width)));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  useEffect(() => {
    const el = box.current;
    if (!el || width < 40) return;
    const opts = makeOptions(width, theme ?? currentPlotTheme());
    const withCursor: uPlot.Options = {
      ...opts,
      hooks: {
        ...opts.hooks,
        setCursor: [...(opts.hooks?.setCursor ?? []), (u) => cursorCb.current?.(u.cursor.idx ?? null)],
      },
    };
    const u = new uPlot(withCursor, dataRef.current, el);
    chart.current = u;
    chartRef?.(u);
    return () => {
      chartRef?.(null);
      u.destroy();
      chart.current = null;
    };
    // themeVersion: remake with the new colours
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [makeOptions, width, themeVersion, theme]);

  useEffect(() => {
    dataRef.current = data;
    chart.current?.setData(data);
  }, [data]);

  return (
    <div className={className} data-testid={testId}>
      <div ref={box} className="tl-uplot w-full" />
      {children}
    </div>
  );
}
