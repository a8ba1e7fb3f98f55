// Test helpers for the command line: run `main` in-process with captured streams, or the bundled program as a child.
import { spawnSync } from 'node:child_process';
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

export function runCliBinary(argv: string[]): CliRun {
  const result = spawnSync(process.execPath, ['dist/cli/whence.mjs', ...argv], { encoding: 'utf8' });
  return { exitCode: result.status ?? -1, stdout: result.stdout, stderr: result.stderr };
}
