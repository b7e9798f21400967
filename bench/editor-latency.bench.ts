// Editor input-to-reading latency: how long from a potentiometer slider's input event until the
// new operating point shows in the canvas's net-voltage tags, on the largest example sheet, in
// Debian's Chromium. Target: under one 60 Hz frame (16.7 ms). Builds the client into
// .local/bench-dist, serves it, and drives the slider from inside the page (native value setter +
// an input event, as a drag produces), timing each step with performance.now() and a
// MutationObserver on the tags.
import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';
import { chromium } from 'playwright-core';
import { startStaticServer } from '../tests/support/static-server';
import { CHROMIUM_ARGS } from '../tests/support/browser';
import { printTable } from './analysis-timing';

const root = path.resolve(import.meta.dirname, '..');
const SAMPLES = 60;
const WARMUP = 5;
const FRAME_MS = 1000 / 60;

/** The example sheet with the most parts that has a potentiometer. */
function largestPotExample(): { name: string; pot: string; parts: number } {
  const dir = path.join(root, 'examples');
  const found = fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .map((f) => ({ name: f.replace(/\.json$/, ''), sheet: JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8')) as { parts: Array<{ id: string; type: string }> } }))
    .filter((e) => e.sheet.parts.some((p) => p.type === 'potentiometer'))
    .sort((a, b) => b.sheet.parts.length - a.sheet.parts.length)[0];
  if (!found) throw new Error('No example sheet has a potentiometer to drag.');
  return { name: found.name, pot: found.sheet.parts.find((p) => p.type === 'potentiometer')!.id, parts: found.sheet.parts.length };
}

const pct = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];

export async function run(): Promise<void> {
  const ex = largestPotExample();
  const outDir = path.join(root, '.local/bench-dist');
  await build({ root, logLevel: 'error', build: { outDir, emptyOutDir: true, sourcemap: false } });
  const server = await startStaticServer(outDir);
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: CHROMIUM_ARGS });
  try {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    // tsx compiles the measuring function below with esbuild's __name helper; give the page one
    await page.addInitScript({ content: 'window.__name = (f) => f;' });
    await page.goto(`${server.url}/sheets/example-${ex.name}`);
    await page.getByTestId(`pot-slider-${ex.pot}`).waitFor();
    await page.locator('[data-testid^=net-tag-]').first().waitFor();
    const times = await page.evaluate(
      async ({ pot, n }) => {
        const slider = document.querySelector<HTMLInputElement>(`[data-testid=pot-slider-${pot}]`)!;
        const canvas = document.querySelector('[data-testid=schematic-canvas]')!;
        const setValue = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
        const tags = () => [...canvas.querySelectorAll('[data-testid^=net-tag-]')].map((e) => e.textContent).join('|');
        const frame = () => new Promise((r) => requestAnimationFrame(() => r(null)));
        const out: number[] = [];
        for (let i = 0; i < n; i++) {
          await frame();
          const before = tags();
          // walk the wiper back and forth so every step moves the readings
          const v = 0.15 + 0.7 * ((i * 0.37) % 1);
          const seen = new Promise<number>((resolve, reject) => {
            const timer = setTimeout(() => reject(new Error(`no new reading 2 s after input ${i}`)), 2000);
            const mo = new MutationObserver(() => {
              if (tags() === before) return;
              clearTimeout(timer);
              mo.disconnect();
              resolve(performance.now());
            });
            mo.observe(canvas, { subtree: true, childList: true, characterData: true });
          });
          const t0 = performance.now();
          setValue.call(slider, String(v));
          slider.dispatchEvent(new Event('input', { bubbles: true }));
          out.push((await seen) - t0);
        }
        return out;
      },
      { pot: ex.pot, n: SAMPLES + WARMUP },
    );
    const s = times.slice(WARMUP).sort((a, b) => a - b);
    printTable([
      {
        sheet: `${ex.name} (${ex.parts} parts, drag ${ex.pot})`,
        samples: s.length,
        'p50 ms': s[Math.floor(s.length / 2)].toFixed(2),
        'p95 ms': pct(s, 95).toFixed(2),
        'max ms': s[s.length - 1].toFixed(2),
        'target ms': FRAME_MS.toFixed(1),
        'p95 within target': pct(s, 95) < FRAME_MS ? 'yes' : 'no',
      },
    ]);
  } finally {
    await browser.close();
    await server.close();
  }
}
