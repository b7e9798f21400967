// A plot as a PNG file: the chart's canvas on a solid background, with a title line and a
// legend drawn underneath (uPlot's legend is HTML, so it is redrawn here).
import type uPlot from 'uplot';

export interface PngLegendItem {
  label: string;
  color: string;
  /** drawn as a dot (measured points) instead of a line */
  dot?: boolean;
}

/** Compose the PNG. Sizes in device pixels of the chart's canvas. */
export async function plotPng(u: uPlot, title: string, legend: readonly PngLegendItem[], colors: { background: string; ink: string }): Promise<Blob> {
  const src = u.ctx.canvas;
  const ratio = src.width / Math.max(1, u.width);
  const pad = Math.round(12 * ratio);
  const line = Math.round(18 * ratio);
  const legendRows = Math.ceil(legend.length / 2);
  const out = document.createElement('canvas');
  out.width = src.width + 2 * pad;
  out.height = src.height + 2 * pad + line + legendRows * line;
  const ctx = out.getContext('2d');
  if (!ctx) throw new Error('This browser cannot draw the picture (no 2D canvas).');
  ctx.fillStyle = colors.background;
  ctx.fillRect(0, 0, out.width, out.height);
  ctx.fillStyle = colors.ink;
  ctx.font = `600 ${Math.round(13 * ratio)}px "IBM Plex Sans", system-ui, sans-serif`;
  ctx.textBaseline = 'middle';
  ctx.fillText(title, pad, pad + line / 2);
  ctx.drawImage(src, pad, pad + line);
  ctx.font = `${Math.round(12 * ratio)}px "IBM Plex Sans", system-ui, sans-serif`;
  const colW = src.width / 2;
  legend.forEach((item, i) => {
    const x = pad + (i % 2) * colW;
    const y = pad + line + src.height + Math.floor(i / 2) * line + line / 2;
    ctx.strokeStyle = item.color;
    ctx.fillStyle = item.color;
    if (item.dot) {
      ctx.beginPath();
      ctx.arc(x + 9 * ratio, y, 3.5 * ratio, 0, 2 * Math.PI);
      ctx.fill();
    } else {
      ctx.lineWidth = 2 * ratio;
      ctx.beginPath();
      ctx.moveTo(x, y);
      ctx.lineTo(x + 18 * ratio, y);
      ctx.stroke();
    }
    ctx.fillStyle = colors.ink;
    ctx.fillText(item.label, x + 24 * ratio, y);
  });
  return new Promise((resolve, reject) => out.toBlob((b) => (b ? resolve(b) : reject(new Error('Could not encode the PNG.'))), 'image/png'));
}
