// The command line's contact with the terminal, injected so commands can be tested without a process.
// Results go to stdout (or --out); progress, warnings and errors go to stderr.

export interface CliIo {
  writeStdout(text: string): void;
  writeStderr(text: string): void;
  /** True when stderr is a terminal (progress bars are drawn only then). */
  readonly stderrIsTerminal: boolean;
  /** Working directory used to resolve relative paths. */
  readonly cwd: string;
}

export function processIo(): CliIo {
  return {
    writeStdout: (text) => process.stdout.write(text),
    writeStderr: (text) => process.stderr.write(text),
    stderrIsTerminal: Boolean(process.stderr.isTTY),
    cwd: process.cwd(),
  };
}
