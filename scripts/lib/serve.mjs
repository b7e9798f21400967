// Runs a long-lived child (the server) and tears everything down on Ctrl-C / SIGTERM.
import { spawn } from 'node:child_process';

export function runUntilStopped(children, onStop) {
  let stopping = false;
  const stop = (code) => {
    if (stopping) return;
    stopping = true;
    for (const c of children) if (c.exitCode === null) c.kill('SIGTERM');
    const left = children.filter((c) => c.exitCode === null);
    let pending = left.length;
    const finish = () => { onStop(); process.exit(code); };
    if (pending === 0) return finish();
    const timer = setTimeout(() => { for (const c of left) c.kill('SIGKILL'); finish(); }, 5000);
    for (const c of left) c.once('exit', () => { if (--pending === 0) { clearTimeout(timer); finish(); } });
  };
  process.on('SIGINT', () => stop(0));
  process.on('SIGTERM', () => stop(0));
  for (const c of children) c.once('exit', (code) => stop(code ?? 1));
}

export function spawnChild(cmd, args, opts) {
  return spawn(cmd, args, { stdio: 'inherit', ...opts });
}
