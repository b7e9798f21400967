// Seeds and run counts for the fuzz tests. Fixed by default so a failure reproduces; fast-check
// prints the seed and the shrunk counterexample when a property fails. For a longer hunt:
//   TAPLINE_FUZZ_SEED=123 TAPLINE_FUZZ_SCALE=20 npx vitest run --project unit tests/unit/hardening
export interface FuzzRun {
  seed: number;
  numRuns: number;
}

export function fuzzRun(name: string, defaultSeed: number, defaultRuns: number): FuzzRun {
  const envSeed = Number(process.env.TAPLINE_FUZZ_SEED);
  const envScale = Number(process.env.TAPLINE_FUZZ_SCALE);
  const seed = Number.isFinite(envSeed) ? envSeed : defaultSeed;
  const numRuns = Math.max(1, Math.round(defaultRuns * (Number.isFinite(envScale) && envScale > 0 ? envScale : 1)));
  console.log(`[fuzz] ${name}: seed ${seed}, ${numRuns} runs`);
  return { seed, numRuns };
}
