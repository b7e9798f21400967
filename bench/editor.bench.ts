// Speed targets of the editor's document path (issue 5), measured headless: one drag frame
// (patch + commit + node mapping) must leave room in a 16 ms frame for React to render; the
// "did the circuit change?" check runs on every edit; undoing a long drag must feel instant.
import { createEditor } from '../src/editor/store/actions';
import { createNodeMapper } from '../src/editor/canvas/flowAdapter';
import { electricalKey } from '../src/editor/solve/liveSolve';
import type { Sheet } from '../shared/sheet';
import { fmtMs, medianMs, printTable } from './analysis-timing';

/** A ladder of `n` resistors between two rails (demo data for timing only). */
function ladder(n: number): Sheet {
  const ed = createEditor({ format: 'tapline.sheet', version: 1, conditions: { temperatureC: 25, illuminanceLux: 100 }, parts: [], wires: [] });
  ed.actions.place('dc_voltage_source', { x: 0, y: 100 });
  ed.actions.place('ground', { x: 0, y: 300 });
  ed.actions.connect('V1.neg', 'GND1.g');
  for (let i = 0; i < n; i++) {
    const id = ed.actions.place('resistor', { x: 100 + 100 * i, y: 100 }, 90)!;
    ed.actions.connect(`${id}.a`, 'V1.pos');
    ed.actions.connect(`${id}.b`, 'GND1.g');
  }
  return ed.getDoc();
}

const verdict = (ms: number, target: number) => (ms <= target ? 'met' : `MISSED (×${(ms / target).toFixed(1)})`);

export async function run(): Promise<void> {
  const rows: Array<Record<string, string>> = [];
  for (const n of [20, 200]) {
    const sheet = ladder(n);
    const ed = createEditor(sheet);
    const map = createNodeMapper();
    const none = new Set<string>();
    map(ed.getDoc().parts, none, false);
    let x = 0;
    ed.actions.beginDrag(1);
    const frame = medianMs(
      () => {
        x += 20;
        ed.actions.moveParts({ R1: { x, y: 100 } });
        map(ed.getDoc().parts, none, false);
      },
      { warmup: 20, reps: 200 },
    );
    ed.actions.endDrag();
    rows.push({ task: `drag frame, ${n + 2} parts`, median: fmtMs(frame), target: '< 4 ms', verdict: verdict(frame, 4) });

    const key = medianMs(() => void electricalKey(ed.getDoc()), { warmup: 20, reps: 200 });
    rows.push({ task: `electrical-change check, ${n + 2} parts`, median: fmtMs(key), target: '< 1 ms', verdict: verdict(key, 1) });

    const undo = medianMs(
      () => {
        ed.actions.beginDrag(1);
        for (let i = 0; i < 100; i++) ed.actions.moveParts({ R2: { x: 200 + 20 * i, y: 100 } });
        ed.actions.endDrag();
        ed.actions.undo();
      },
      { warmup: 3, reps: 15 },
    );
    rows.push({ task: `100-frame drag + its undo, ${n + 2} parts`, median: fmtMs(undo), target: '< 50 ms', verdict: verdict(undo, 50) });
  }
  printTable(rows);
}
