// A progress line on stderr for long runs, drawn only when stderr is a terminal (quiet when piped).
import type { PipelineProgress } from '../../core/pipeline';
import type { CliIo } from './io';
import { formatDurationClock } from './format';

export interface ProgressLine {
  update(progress: PipelineProgress): void;
  done(): void;
}

export function progressLine(io: CliIo, clockMilliseconds: () => number = () => Date.now()): ProgressLine {
  const startedMilliseconds = clockMilliseconds();
  let lastDrawMilliseconds = 0;
  let drawn = false;
  return {
    update(progress) {
      if (!io.stderrIsTerminal) return;
      const now = clockMilliseconds();
      if (now - lastDrawMilliseconds < 100 && progress.fraction < 1) return;
      lastDrawMilliseconds = now;
      const width = 30;
      const filled = Math.round(Math.min(1, Math.max(0, progress.fraction)) * width);
      const elapsedSeconds = (now - startedMilliseconds) / 1000;
      const leftSeconds = progress.fraction > 0.01 ? (elapsedSeconds * (1 - progress.fraction)) / progress.fraction : undefined;
      const left = leftSeconds === undefined ? '' : `, ${formatDurationClock(leftSeconds).slice(0, 8)} left`;
      io.writeStderr(`\r[${'#'.repeat(filled)}${' '.repeat(width - filled)}] ${(progress.fraction * 100).toFixed(0).padStart(3)}%  ${progress.eventsFound} events found, ${progress.eventsLocated} located${left}   `);
      drawn = true;
    },
    done() {
      if (drawn) io.writeStderr('\n');
    },
  };
}
