// The `whence` command line: dispatches to one command per job and turns deliberate errors into one-line messages.
// Exit codes: 0 success, 1 the input could not be used (bad file, out-of-range value), 2 a usage mistake.
import { isWhenceError } from '../../core/errors';
import { WHENCE_VERSION } from '../../core/version';
import { infoHelp, runInfo } from './commands/info';
import { locateHelp, runLocate } from './commands/locate';
import { runSolve, solveHelp } from './commands/solve';
import { runSpeed, speedHelp } from './commands/speed';
import { runSync, syncHelp } from './commands/sync';
import { mergeHelp, runMerge } from './commands/merge';
import type { CliIo } from './io';
import { terminalDataSafe, terminalSafe } from './format';
import { printableText } from '../../core/text';
import { maxOf } from '../../core/units';

/** Longest error message printed, in characters (a message quoting a whole binary file is cut). */
const MAX_MESSAGE_CHARS = 2000;

interface Command {
  summary: string;
  help: string;
  run(argv: string[], io: CliIo): Promise<number>;
}

const commands: Record<string, Command> = {
  info: { summary: 'what a recording holds: format, channels, rate, duration, start time', help: infoHelp, run: runInfo },
  locate: { summary: 'find each sound in a recording and fix where it came from (survey log)', help: locateHelp, run: runLocate },
  merge: { summary: 'join the survey logs of spans of one deployment into one', help: mergeHelp, run: runMerge },
  solve: { summary: 'position fixes from a table of measured time differences', help: solveHelp, run: runSolve },
  speed: { summary: 'speed of sound in air, seawater or fresh water', help: speedHelp, run: runSpeed },
  sync: { summary: 'fit the clocks of separate recorders from calibration sounds', help: syncHelp, run: runSync },
};

export function overallHelp(): string {
  const width = maxOf(Object.keys(commands).map((name) => name.length));
  const lines = Object.entries(commands).map(([name, command]) => `  ${name.padEnd(width + 2)}${command.summary}`);
  return `whence ${WHENCE_VERSION}: where a sound came from, from a synchronized microphone array

Usage: whence COMMAND [options]

Commands:
${lines.join('\n')}

'whence help COMMAND' shows a command's options. Results go to standard output,
messages and progress to standard error. Numbers are plain decimals (12.5, -5, 1e3);
a negative value may follow its option after a space or '=' (--temperature -5).
`;
}

export async function main(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === 'help' || name === '--help' || name === '-h') {
    const topic = name === 'help' ? rest[0] : undefined;
    const command = topic !== undefined ? commands[topic] : undefined;
    if (topic !== undefined && command === undefined) {
      io.writeStderr(`whence: no command '${topic}'. Commands: ${Object.keys(commands).join(', ')}.\n`);
      return 2;
    }
    io.writeStdout(command?.help ?? overallHelp());
    return name === undefined ? 2 : 0;
  }
  if (name === '--version' || name === '-V') {
    io.writeStdout(`${WHENCE_VERSION}\n`);
    return 0;
  }
  const command = commands[name];
  if (command === undefined) {
    io.writeStderr(`whence: no command '${name}'. Commands: ${Object.keys(commands).join(', ')}. Run 'whence help' for more.\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.writeStdout(command.help);
    return 0;
  }
  // Messages quote file names, labels, tags and cells from files: nothing reaches the terminal as a control sequence.
  const guardedIo: CliIo = { ...io, writeStdout: (text) => io.writeStdout(terminalDataSafe(text)), writeStderr: (text) => io.writeStderr(terminalSafe(text)) };
  try {
    return await command.run(rest, guardedIo);
  } catch (error) {
    if (isWhenceError(error)) {
      guardedIo.writeStderr(`whence ${name}: ${printableText(error.message, MAX_MESSAGE_CHARS)}\n`);
      return error.code === 'usage' ? 2 : 1;
    }
    const detail = error instanceof Error ? error.message : String(error);
    guardedIo.writeStderr(`whence ${name}: unexpected internal error: ${printableText(detail, MAX_MESSAGE_CHARS)}. Please report it with the command you ran (set WHENCE_DEBUG=1 for details).\n`);
    if (process.env.WHENCE_DEBUG === '1' && error instanceof Error && error.stack !== undefined) io.writeStderr(`${error.stack}\n`);
    return 1;
  }
}
