// Messages for the set-up scripts: what went wrong and what to do, never a stack trace.
export function note(msg) {
  process.stderr.write(`tapline: ${msg}\n`);
}

export function fail(what, todo) {
  process.stderr.write(`\ntapline: ${what}\n  What to do: ${todo}\n\n`);
  process.exit(1);
}
