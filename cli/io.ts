// Input/output helpers for the CLI (Node-only, kept out of shared/).
import { readFileSync } from 'node:fs';
import path from 'node:path';

export interface CliIO {
  /** the one JSON document a command prints on stdout */
  out(value: unknown, pretty: boolean): void;
  /** human messages, on stderr */
  log(message: string): void;
  /** resolve a path the user typed (npm run changes the working directory to the package root) */
  resolve(p: string): string;
  readText(p: string): string;
}

export const nodeIO: CliIO = {
  out(value, pretty) {
    process.stdout.write(JSON.stringify(value, null, pretty ? 2 : 0) + '\n');
  },
  log(message) {
    process.stderr.write(message + '\n');
  },
  resolve(p) {
    return path.resolve(process.env.INIT_CWD ?? process.cwd(), p);
  },
  readText(p) {
    return readFileSync(p, 'utf8');
  },
};

export const EXIT_SOLVED = 0;
export const EXIT_UNSOLVABLE = 1;
export const EXIT_INVALID = 2;
