// The design tools as a user drives them, in Debian's Chromium against the built client: a sweep
// of the battery tap's supply with its CSV export checked against the loaded-divider formula and
// bench readings overlaid; a Monte Carlo run with a spec window (and a long one cancelled, which
// keeps the last good result); the parts-list CSV download; the printable report.
import fs from 'node:fs';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Download } from 'playwright-core';
import { openScreen, type Screen } from '../support/browser';

let screen: Screen;
let server: Screen['server'];
let page: Screen['page'];
let problems: Screen['problems'];

beforeAll(async () => {
  screen = await openScreen({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
  ({ server, page, problems } = screen);
  await page.goto(`${server.baseUrl}/sheets/example-battery-divider`);
  await page.getByTestId('panel-tab-analyse').click();
});
afterAll(async () => {
  await screen?.close();
});

async function downloaded(click: () => Promise<void>): Promise<{ name: string; text: string }> {
  const [d] = (await Promise.all([page.waitForEvent('download'), click()])) as [Download, void];
  const file = await d.path();
  return { name: d.suggestedFilename(), text: fs.readFileSync(file!, 'utf8') };
}

/**
 * The example's tap, closed form: 27 kΩ over (10 kΩ ∥ 1 MΩ), fed through the battery's 0.05 Ω
 * (voltage-divider and parallel-resistance rules; common practice).
 */
function tapVolts(v: number): number {
  const bottom = (10_000 * 1e6) / (10_000 + 1e6);
  return (v * bottom) / (27_000 + bottom + 0.05);
}

describe('design tools in the editor', () => {
  it('sweeps the supply between its min and max, reads the cursor, exports CSV, overlays bench readings', async () => {
    await page.getByTestId('tool-view-sweep').click();
    await page.getByTestId('sweep-target').selectOption('V1.voltage');
    await expect.poll(() => page.getByTestId('sweep-from').inputValue()).toBe('10.5');
    await expect.poll(() => page.getByTestId('sweep-to').inputValue()).toBe('14.4');
    await page.getByTestId('sweep-run').click();
    const plot = page.locator('[data-testid=sweep-plot] canvas').first();
    await plot.waitFor();
    const box = (await plot.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await expect.poll(() => page.getByTestId('sweep-readout').textContent()).toMatch(/V1\.voltage = [\d.]+ V.*V\(adc_in\): [\d.]+ V/);

    const csv = await downloaded(() => page.getByTestId('sweep-csv').click());
    expect(csv.name).toMatch(/sweep\.csv$/);
    const rows = Papa.parse<string[]>(csv.text.trim()).data;
    expect(rows[0]).toEqual(['V1.voltage [V]', 'V(adc_in) [V]']);
    expect(rows).toHaveLength(102);
    for (const r of [rows[1], rows[51], rows[101]]) expect(Number(r[1])).toBeCloseTo(tapVolts(Number(r[0])), 9);

    // bench readings 20 mV above the model: max and RMS deviation 20 mV
    const bench = ['V1.voltage,V(adc_in)', ...[11, 12, 13, 14].map((v) => `${v},${(tapVolts(v) + 0.02).toFixed(6)}`)].join('\n');
    await page.getByTestId('bench-file').setInputFiles({ name: 'bench.csv', mimeType: 'text/csv', buffer: Buffer.from(bench) });
    await expect.poll(() => page.getByTestId('deviation-summary').textContent()).toMatch(/max deviation\s*20 mV.*RMS\s*20 mV.* 4 readings/s);
    expect(await page.locator('[data-testid=deviation-table] tbody tr').count()).toBe(4);
  });

  it('runs worst case and Monte Carlo with a spec window; a cancelled long run keeps the last result', async () => {
    await page.getByTestId('tool-view-tolerance').click();
    await page.getByTestId('spec-min-V(adc_in)').fill('3.0');
    await page.getByTestId('spec-max-V(adc_in)').fill('3.5');
    await page.getByTestId('mc-samples').fill('2000');
    await page.getByTestId('tolerance-run').click();
    await page.getByTestId('mc-yield').waitFor({ timeout: 60_000 });
    const wc = (await page.getByTestId('worst-case-summary').textContent())!;
    // the corners, closed form: lowest supply with R1 high and R2 low; highest supply with R1 low and R2 high
    const corner = (v: number, r1: number, r2: number) => {
      const b = (r2 * 1e6) / (r2 + 1e6);
      return (v * b) / (r1 + b + 0.05);
    };
    const [lo, hi] = /Worst case ([\d.]+) V … ([\d.]+) V/.exec(wc)!.slice(1).map(Number);
    expect(lo).toBeCloseTo(corner(10.5, 27_270, 9_900), 3);
    expect(hi).toBeCloseTo(corner(14.4, 26_730, 10_100), 3);
    expect(wc).toContain('V1.voltage');
    const yieldText = (await page.getByTestId('mc-yield').textContent())!;
    const pass = Number(/\((\d+)\/2000/.exec(yieldText)![1]);
    expect(pass).toBeGreaterThan(0);
    expect(pass).toBeLessThan(2000);

    // long enough (a few seconds on two cores) to cancel part-way
    await page.getByTestId('mc-samples').fill('2000000');
    await page.getByTestId('tolerance-run').click();
    await page.getByTestId('mc-running').waitFor();
    await page.getByTestId('mc-cancel').click();
    await expect.poll(() => page.getByTestId('mc-note').textContent()).toMatch(/cancelled\. Showing the previous result/);
    expect(await page.getByTestId('mc-yield').textContent()).toBe(yieldText);
  });

  it('exports the parts list as CSV', async () => {
    await page.getByTestId('export-menu').click();
    const csv = await downloaded(() => page.getByTestId('export-parts-csv').click());
    expect(csv.name).toMatch(/-parts\.csv$/);
    const rows = Papa.parse<string[]>(csv.text.trim()).data;
    expect(rows[0]).toEqual(['Designators', 'Quantity', 'Type', 'Value', 'RKM', 'Tolerance', 'Power rating']);
    const byId = Object.fromEntries(rows.slice(1).map((r) => [r[0], r]));
    expect(byId.R1.slice(1, 5)).toEqual(['1', 'Resistor', '27 kΩ', '27K']);
    expect(byId.R2.slice(1, 5)).toEqual(['1', 'Resistor', '10 kΩ', '10K']);
    // sources, loads, grounds and labels are the world around the circuit, not parts to buy
    expect(rows).toHaveLength(3);
  });

  it('exports the schematic as PNG and SVG pictures and the sheet as its file', async () => {
    await page.getByTestId('export-menu').click();
    const [png] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-png').click()]);
    const bytes = fs.readFileSync((await png.path())!);
    expect(png.suggestedFilename()).toMatch(/\.png$/);
    expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG'); // PNG signature (ISO/IEC 15948)
    await page.getByTestId('export-menu').click();
    const svg = await downloaded(() => page.getByTestId('export-svg').click());
    expect(svg.text).toMatch(/^<svg[\s\S]*R1[\s\S]*<\/svg>$/);
    await page.getByTestId('export-menu').click();
    const json = await downloaded(() => page.getByTestId('export-json').click());
    const sheet = JSON.parse(json.text);
    expect(sheet).toMatchObject({ format: 'tapline.sheet', version: 1, title: '12 V battery monitor tap' });
  });

  it('opens the printable report with the runs, the parts list and the safety note', async () => {
    await page.getByTestId('export-menu').click();
    await page.getByTestId('open-report').click();
    await page.waitForURL(/\/sheets\/[^/]+\/report$/);
    await page.getByTestId('design-report').waitFor();
    await page.locator('[data-testid=report-sweep] canvas').first().waitFor();
    await page.locator('[data-testid=report-tolerance] [data-testid=mc-histogram] canvas').first().waitFor();
    expect(await page.getByTestId('report-safety').textContent()).toMatch(/local electrical codes.*licensed practice/);
    expect(await page.getByTestId('report-parts-list').textContent()).toContain('27K');
    expect(await page.getByTestId('report-operating-point').textContent()).toContain('adc_in');
    expect(problems.errors).toEqual([]);
  });
});
