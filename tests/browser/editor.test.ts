// The schematic editor as a user drives it, in Debian's Chromium against the built client:
// place a divider from the palette, wire it pin to pin, read the tap voltage on the canvas;
// drag a potentiometer's slider and watch a reading move; cautions select their part.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openScreen, type Screen } from '../support/browser';

let screen: Screen;
let server: Screen['server'];
let page: Screen['page'];
let problems: Screen['problems'];

beforeAll(async () => {
  screen = await openScreen({ viewport: { width: 1440, height: 900 } });
  ({ server, page, problems } = screen);
});
afterAll(async () => {
  await screen?.close();
});

async function centre(testId: string): Promise<{ x: number; y: number }> {
  const box = await page.getByTestId(testId).boundingBox();
  if (!box) throw new Error(`${testId} is not on screen`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

/** Place a part from the palette at an offset from the canvas's top-left corner (CSS px). */
async function place(type: string, dx: number, dy: number) {
  await page.getByTestId(`palette-${type}`).click();
  const canvas = await page.getByTestId('schematic-canvas').boundingBox();
  await page.mouse.click(canvas!.x + dx, canvas!.y + dy);
}

/** Drag a wire from one pin to another, as a user does. */
async function wire(from: string, to: string) {
  const a = await centre(`pin-${from}`);
  const b = await centre(`pin-${to}`);
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 5 });
  await page.mouse.move(b.x, b.y, { steps: 5 });
  await page.mouse.up();
}

async function setField(partId: string, param: string, text: string) {
  await page.getByTestId(`part-${partId}`).click();
  const field = page.locator(`#param-${partId}-${param}`);
  await field.fill(text);
  await field.press('Enter');
}

describe('schematic editor', () => {
  it('builds a divider from the palette, wires it and shows the tap voltage on the canvas', async () => {
    await page.goto(`${server.baseUrl}/sheets/local`);
    await page.evaluate(() => localStorage.clear());
    await page.reload();
    await page.getByTestId('sheet-editor').waitFor();

    await place('dc_voltage_source', 200, 340);
    await place('resistor', 420, 200);
    await place('resistor', 620, 340);
    await page.keyboard.press('r'); // the new part is selected: stand R2 upright
    await place('ground', 420, 560);
    for (const id of ['V1', 'R1', 'R2', 'GND1']) await page.getByTestId(`part-${id}`).waitFor();

    await wire('V1.pos', 'R1.a');
    await wire('R1.b', 'R2.a');
    await wire('R2.b', 'GND1.g');
    await wire('V1.neg', 'GND1.g');
    await expect.poll(() => page.locator('.react-flow__edge').count()).toBe(4);

    // defaults: 5 V over 10 kΩ / 10 kΩ
    const tap = page.getByTestId('part-R1').locator('[data-testid^="net-tag-"]');
    await expect.poll(() => tap.textContent()).toBe('2.5 V');

    await setField('V1', 'voltage', '12');
    await setField('R1', 'resistance', '27k');
    await setField('R2', 'resistance', '10k');
    // ideal divider 12 V · 10k / (27k + 10k) = 3.243243… V (worked value, /work/shared/references.md)
    await expect.poll(() => tap.textContent()).toBe('3.243 V');
    expect(Number(await tap.getAttribute('data-volts'))).toBeCloseTo(3.24324324324, 9);

    // the readings table lists the same net, and one undo takes back the last value only
    await page.getByTestId('panel-tab-readings').click();
    await expect.poll(() => page.getByTestId('readings-nets').textContent()).toContain('3.243 V');
    // R2 was 10k already, so the last step is R1 27k: undone, 12 V · 10k / 20k = 6 V
    await page.getByTestId('undo').click();
    await expect.poll(() => tap.textContent()).toBe('6 V');
  });

  it('moves every reading live while the potentiometer slider is dragged, as one undo step', async () => {
    await page.goto(`${server.baseUrl}/sheets/example-ldr-night-light`);
    await page.getByTestId('sheet-editor').waitFor();
    // RV1's w–b section feeds the LDR divider (its wiper is tied to a): the LDR1.a net moves with it
    const ldrTag = page.getByTestId('part-LDR1').locator('[data-testid^="net-tag-"]');
    await expect.poll(() => ldrTag.count()).toBe(1);
    const before = Number(await ldrTag.getAttribute('data-volts'));

    const slider = page.getByTestId('pot-slider-RV1');
    const box = (await slider.boundingBox())!;
    const y = box.y + box.height / 2;
    await page.mouse.move(box.x + box.width * 0.4, y);
    await page.mouse.down();
    const seen = new Set<number>();
    for (const f of [0.5, 0.6, 0.7, 0.8, 0.95]) {
      await page.mouse.move(box.x + box.width * f, y, { steps: 3 });
      await page.waitForTimeout(80);
      seen.add(Number(await ldrTag.getAttribute('data-volts')));
    }
    await page.mouse.up();
    // less track between supply and tap raises the tap; readings changed during the drag, not only after
    await expect.poll(async () => Number(await ldrTag.getAttribute('data-volts'))).toBeGreaterThan(before + 0.1);
    expect(seen.size).toBeGreaterThan(1);

    await page.getByTestId('undo').click();
    await expect.poll(async () => Number(await ldrTag.getAttribute('data-volts'))).toBeCloseTo(before, 6);
    expect(await page.getByTestId('undo').isDisabled()).toBe(true);
  });

  it('marks an LED without current limiting, lists it, and selects it from the list', async () => {
    await page.goto(`${server.baseUrl}/sheets/local`);
    await page.evaluate(() => localStorage.clear());
    await page.reload();
    await page.getByTestId('sheet-editor').waitFor();
    await place('dc_voltage_source', 200, 300);
    await place('led', 420, 200);
    await place('ground', 300, 480);
    await wire('V1.pos', 'D1.anode');
    await wire('D1.cathode', 'GND1.g');
    await wire('V1.neg', 'GND1.g');
    await page.getByTestId('part-D1').getByTestId('part-warning-D1').waitFor();
    await page.getByTestId('panel-tab-checks').click();
    await page.keyboard.press('Escape'); // clear the selection
    await page.getByTestId('finding-led_no_current_limit-D1').click();
    await page.getByTestId('panel-tab-part').click();
    await expect.poll(() => page.getByTestId('designator-input').inputValue()).toBe('D1');
  });

  it('saves an edited example as the local sheet, keeps editing in place, and drags a part as one undo step', async () => {
    await page.goto(`${server.baseUrl}/sheets/local`);
    await page.evaluate(() => localStorage.clear());
    await page.goto(`${server.baseUrl}/sheets/example-battery-divider`);
    await page.getByTestId('sheet-editor').waitFor();
    await setField('R2', 'resistance', '12k');
    await page.waitForURL((u) => u.pathname === '/sheets/local');
    await expect.poll(() => page.getByTestId('save-status').textContent()).toMatch(/^Saved/);
    // still the same editor: the edit can be undone
    expect(await page.getByTestId('undo').isDisabled()).toBe(false);

    const part = page.getByTestId('part-R1');
    const before = (await part.boundingBox())!;
    await page.mouse.move(before.x + before.width / 2, before.y + before.height / 2);
    await page.mouse.down();
    for (let i = 1; i <= 6; i++) await page.mouse.move(before.x + before.width / 2 + 20 * i, before.y + before.height / 2, { steps: 2 });
    await page.mouse.up();
    await expect.poll(async () => (await part.boundingBox())!.x).toBeGreaterThan(before.x + 60);
    await page.getByTestId('undo').click();
    await expect.poll(async () => Math.round((await part.boundingBox())!.x)).toBe(Math.round(before.x));

    await page.reload();
    await page.getByTestId('sheet-editor').waitFor();
    expect(await page.getByTestId('sheet-title').textContent()).toContain('12 V battery monitor tap');
    await page.getByTestId('part-R2').click();
    expect(await page.locator('#param-R2-resistance').inputValue()).toBe('12k');
  });

  it('selects a wire with a click and deletes it with the Delete key; undo brings it back', async () => {
    await page.goto(`${server.baseUrl}/sheets/example-zener-reference`);
    await page.getByTestId('sheet-editor').waitFor();
    const edges = page.locator('.react-flow__edge');
    await expect.poll(() => edges.count()).toBeGreaterThan(2);
    const total = await edges.count();
    // a straight run, so the middle of its box is on the wire
    let target: { x: number; y: number } | null = null;
    for (let i = 0; i < total && !target; i++) {
      const b = await edges.nth(i).boundingBox();
      if (b && (b.width < 16 || b.height < 16) && Math.max(b.width, b.height) > 30) target = { x: b.x + b.width / 2, y: b.y + b.height / 2 };
    }
    expect(target).not.toBeNull();
    await page.mouse.click(target!.x, target!.y);
    await expect.poll(() => page.getByTestId('status-bar').textContent()).toContain('1 wire selected');
    await page.keyboard.press('Delete');
    await expect.poll(() => edges.count()).toBe(total - 1);
    await page.keyboard.press('Control+z');
    await expect.poll(() => edges.count()).toBe(total);
  });

  it('opens the shortcut help with ? and closes it with Escape', async () => {
    await page.locator('body').click({ position: { x: 5, y: 300 } });
    await page.keyboard.press('Shift+?');
    await page.getByTestId('shortcut-help').waitFor();
    await page.keyboard.press('Escape');
    await expect.poll(() => page.getByTestId('shortcut-help').count()).toBe(0);
  });

  it('stays legible at 1024 × 768: short palette names, whole net-label names, an inspector that can make room', async () => {
    await page.setViewportSize({ width: 1024, height: 768 });
    try {
      await page.goto(`${server.baseUrl}/sheets/example-ntc-front-end`);
      await page.locator('[data-testid^="net-tag-"]').first().waitFor();
      const pot = page.getByTestId('palette-potentiometer');
      // the short name shows and names the button (label in name); the tooltip gives the full name
      expect(await pot.innerText()).toMatch(/^Pot/);
      expect(await pot.innerText()).not.toMatch(/Potentiometer/);
      expect(await page.getByRole('button', { name: 'Pot', exact: true }).count()).toBe(1);
      expect(await pot.getAttribute('title')).toMatch(/^Potentiometer: /);
      const label = page.locator('[data-testid^="part-"] svg text', { hasText: 'temp_sense' });
      expect(await label.count()).toBe(1); // the whole name, not "temp_se…"
      const before = (await page.getByTestId('schematic-canvas').boundingBox())!.width;
      await page.getByTestId('hide-inspector').click();
      await expect.poll(async () => (await page.getByTestId('schematic-canvas').boundingBox())!.width).toBeGreaterThan(before + 250);
      await page.getByTestId('show-inspector').click();
      await page.getByTestId('panel-tab-part').waitFor();
    } finally {
      await page.setViewportSize({ width: 1440, height: 900 });
    }
  });

  it('ran without script errors', () => {
    expect(problems.errors).toEqual([]);
  });
});
