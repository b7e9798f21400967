// The dot grid behind the schematic, as a CSS background that follows pan and zoom. React Flow's
// own Background is an SVG filling the pane, and the browser repaints an SVG root whole whenever
// layout touches it: each new reading then repainted the entire canvas. A CSS background is
// repainted only where something over it changed (measured with paint flashing in Chromium).
import { useStore } from '@xyflow/react';
import { GRID } from '../symbols/geometry';

/** Dot radius at zoom 1, px (the size React Flow's Background was given before: 1.3). */
const DOT = 0.65;

export function GridDots() {
  const [x, y, zoom] = useStore((s) => s.transform);
  const gap = GRID * zoom;
  const r = Math.max(0.5, DOT * zoom);
  // one dot in the middle of each tile, the tiles shifted so the dots sit on the grid points
  const offset = (v: number) => `${(((v - gap / 2) % gap) + gap) % gap}px`;
  return (
    <div
      aria-hidden="true"
      // React Flow's class: below the drawing, and hidden where a style sheet hides the grid (print)
      className="react-flow__background pointer-events-none absolute inset-0"
      style={{
        backgroundImage: `radial-gradient(circle at center, var(--tl-rule) ${r}px, transparent ${r + 0.6}px)`,
        backgroundSize: `${gap}px ${gap}px`,
        backgroundPosition: `${offset(x)} ${offset(y)}`,
      }}
      data-testid="canvas-grid"
    />
  );
}
