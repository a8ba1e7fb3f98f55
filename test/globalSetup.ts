// Builds the `whence` program once before the tests, so command-line tests run the real bundled binary.
import { execFileSync } from 'node:child_process';

export default function setup(): void {
  execFileSync(process.execPath, ['scripts/build.mjs', 'cli'], { stdio: 'inherit' });
}
