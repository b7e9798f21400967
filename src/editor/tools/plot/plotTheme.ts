// Plot colours from the theme tokens, so a plot follows light and dark like everything else.

export interface PlotTheme {
  dark: boolean;
  ink: string;
  muted: string;
  grid: string;
  paper: string;
  panel: string;
  danger: string;
  ok: string;
  /** series colours, in order */
  series: string[];
}

const LIGHT_SERIES = ['#12606e', '#a15c00', '#6b3fa0', '#2e6b3a', '#b3261e', '#1f5fbf', '#7a5c00', '#8c3b6e'];
const DARK_SERIES = ['#5cc2cf', '#f4b942', '#c3a0f0', '#7fd08f', '#ff8a80', '#8ab4ff', '#e0c060', '#f09ad0'];

function cssVar(name: string, fallback: string): string {
  if (typeof document === 'undefined') return fallback;
  const v = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  return v || fallback;
}

export function currentPlotTheme(): PlotTheme {
  const dark = typeof document !== 'undefined' && document.documentElement.dataset.theme === 'dark';
  return {
    dark,
    ink: cssVar('--tl-ink', dark ? '#e6ecea' : '#14262b'),
    muted: cssVar('--tl-ink-muted', dark ? '#9fb0b0' : '#4f6166'),
    grid: cssVar('--tl-rule', dark ? '#2b3a3d' : '#d5d1c6'),
    paper: cssVar('--tl-paper', dark ? '#0f1719' : '#f7f5f0'),
    panel: cssVar('--tl-panel', dark ? '#162124' : '#ffffff'),
    danger: cssVar('--tl-danger', dark ? '#ff8a80' : '#b3261e'),
    ok: cssVar('--tl-ok', dark ? '#7fd08f' : '#2e6b3a'),
    series: dark ? DARK_SERIES : LIGHT_SERIES,
  };
}

/** The print/report theme: always dark ink on white, whatever the screen theme. */
export function printPlotTheme(): PlotTheme {
  return { dark: false, ink: '#14262b', muted: '#4f6166', grid: '#d5d1c6', paper: '#ffffff', panel: '#ffffff', danger: '#b3261e', ok: '#2e6b3a', series: LIGHT_SERIES };
}
