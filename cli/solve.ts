// `npm run solve -- FILE.json`: a thin shell over shared/ (see cli/commands for the commands).
import { main } from './main';
import { nodeIO } from './io';

main(process.argv.slice(2), nodeIO).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`solve: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  },
);
