// Test helpers for the command line: run `main` in-process with captured streams, or the bundled program as a child.
import { execFileSync, spawnSync } from 'node:child_process';
import { main } from '../../main/cli/whence';
import type { CliIo } from '../../main/cli/io';

export interface CliRun { exitCode: number; stdout: string; stderr: string }

export async function runCliInProcess(argv: string[], cwd = process.cwd()): Promise<CliRun> {
  let stdout = '';
  let stderr = '';
  const io: CliIo = { writeStdout: (text) => { stdout += text; }, writeStderr: (text) => { stderr += text; }, stderrIsTerminal: false, cwd };
  const exitCode = await main(argv, io);
  return { exitCode, stdout, stderr };
}

let built = false;

/** Builds dist/cli/whence.mjs from the current sources (once per test file) so tests run the real bundled program. */
export function buildCliOnce(): void {
  if (built) return;
  execFileSync(process.execPath, ['scripts/build.mjs', 'cli'], { stdio: 'pipe' });
  built = true;
}

export function runCliBinary(argv: string[], options: { cwd?: string; input?: string } = {}): CliRun {
  buildCliOnce();
  const result = spawnSync(process.execPath, [`${process.cwd()}/dist/cli/whence.mjs`, ...argv], { encoding: 'utf8', cwd: options.cwd ?? process.cwd(), input: options.input ?? '' });
  return { exitCode: result.status ?? -1, stdout: result.stdout, stderr: result.stderr };
}
