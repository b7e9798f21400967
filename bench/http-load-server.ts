// The server process of bench/http-load.bench.ts: server/main.ts unchanged, plus an answer over the
// IPC channel with its memory figures (before and after a full GC; run with --expose-gc).
import '../server/main';

process.on('message', (message) => {
  if (message !== 'memory') return;
  const before = process.memoryUsage();
  (globalThis as { gc?: () => void }).gc?.();
  const afterGc = process.memoryUsage();
  process.send?.({ before, afterGc });
});
