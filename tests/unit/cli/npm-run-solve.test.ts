import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../../..');

// The sheet contract: `npm run solve -- FILE.json` prints the result JSON on stdout and nothing
// else (npm's own "> script" banner is silenced by the project's .npmrc).
describe('npm run solve (as a user types it)', () => {
  it('prints only JSON on stdout and exits 0 for a solvable sheet', () => {
    const r = spawnSync('npm', ['run', 'solve', '--', 'examples/battery-divider.json'], { cwd: root, encoding: 'utf8', timeout: 60_000 });
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.ok).toBe(true);
    expect(out.analysis).toBe('operating-point');
  });

  it('exits 2 with a JSON error naming the problem for a file that is not a sheet', () => {
    const r = spawnSync('npm', ['run', 'solve', '--', 'package.json'], { cwd: root, encoding: 'utf8', timeout: 60_000 });
    expect(r.status).toBe(2);
    const out = JSON.parse(r.stdout);
    expect(out.ok).toBe(false);
  });
});
