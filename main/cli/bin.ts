// Entry point of the bundled `whence` program (dist/cli/whence.mjs): runs the command line on this process.
import { main } from './whence';
import { processIo } from './io';

main(process.argv.slice(2), processIo()).then(
  (exitCode) => {
    process.exitCode = exitCode;
  },
  (error: unknown) => {
    process.stderr.write(`whence: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = 1;
  },
);
