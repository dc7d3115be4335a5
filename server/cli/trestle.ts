/** Entry of `npm run trestle -- <command> …`; see run.ts for commands and exit codes. */
import { runCli } from './run.js';

const io = { out: (l: string) => process.stdout.write(`${l}\n`), err: (l: string) => process.stderr.write(`${l}\n`) };

runCli(process.argv.slice(2), io).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    io.err(`trestle: ${(e as Error)?.message ?? String(e)}`);
    process.exitCode = 3;
  },
);
