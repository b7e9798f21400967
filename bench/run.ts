// `npm run bench`: runs every bench/*.bench.ts (each exports `run()`) and prints its figures.
// Filter with `npm run bench -- engine` (substring of the file name).
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

const dir = import.meta.dirname;
const filter = process.argv.slice(2);
const files = fs.readdirSync(dir).filter((f) => f.endsWith('.bench.ts')).sort()
  .filter((f) => filter.length === 0 || filter.some((s) => f.includes(s)));

for (const f of files) {
  console.log(`\n=== ${f} ===`);
  const mod = (await import(pathToFileURL(path.join(dir, f)).href)) as { run?: () => Promise<void> };
  if (typeof mod.run !== 'function') { console.log('(no run() exported)'); continue; }
  try {
    await mod.run();
  } catch (err) {
    console.log(`FAILED: ${(err as Error).message}`);
    process.exitCode = 1;
  }
}
