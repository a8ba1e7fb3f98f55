import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCliBinary, runCliInProcess } from '../../helpers/cli';
import { WHENCE_VERSION } from '../../../core/version';

describe('whence command line', () => {
  // Expected values: the behaviour this project specifies (help text, messages); exit status 2 for usage errors is common practice.
  it('main() lists every command in its help and exits 0 for `help`', async () => {
    const run = await runCliInProcess(['help']);
    expect(run.exitCode).toBe(0);
    expect(run.stdout).toMatch(/info\s+what a recording holds/);
    expect(run.stdout).toMatch(/speed\s+speed of sound/);
  });

  it('main() refuses an unknown command with exit 2 and names the commands', async () => {
    const run = await runCliInProcess(['triangulate']);
    expect(run.exitCode).toBe(2);
    expect(run.stderr).toContain("no command 'triangulate'");
    expect(run.stderr).toContain('info, locate, merge, solve, speed, sync');
    expect(run.stdout).toBe('');
  });

  it('--version prints the version of package.json', async () => {
    const packageVersion = (JSON.parse(readFileSync('package.json', 'utf8')) as { version: string }).version;
    expect(WHENCE_VERSION).toBe(packageVersion);
    const run = await runCliInProcess(['--version']);
    expect(run.stdout.trim()).toBe(packageVersion);
  });

  it('the bundled program runs and shows a command help', () => {
    const run = runCliBinary(['help', 'speed']);
    expect(run.stderr).toBe('');
    expect(run.exitCode).toBe(0);
    expect(run.stdout).toContain('--temperature C');
  });

  it('an unknown option is a one-line usage message with exit 2, no stack trace', async () => {
    const run = await runCliInProcess(['speed', '--tempreature', '12']);
    expect(run.exitCode).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toContain("'--tempreature'");
    expect(run.stderr).not.toMatch(/\n\s+at /);
  });
});
