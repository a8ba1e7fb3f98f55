// Peak memory of a locate run: V8's young generation (where new objects live) kept at the size it has. Megabytes.
import { setFlagsFromString } from 'node:v8';

/**
 * Stops V8 growing the young generation (doubling it when many objects survive its collections, as a locate run's do).
 * Process-wide: call it once the worker threads run (LocatePool.online). Measured on the 10-minute bench file: the main
 * thread's young generation went from 8 to 16 MB once it located events after its scan (peak RSS 117-121 MB); held
 * from the workers' start, 101-111 MB at the same CPU time. Set before the workers' isolates were made, it kept their
 * peak as high as before (119 MB), so the order matters.
 */
export function holdYoungGenerationSize(): void {
  setFlagsFromString('--semi-space-growth-factor=1');
}
