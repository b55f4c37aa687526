/**
 * cellbasis command line: dispatches to one command, turns user mistakes into one clear line
 * on stderr and an exit code (0 ok, 1 validation or audit failure, 2 usage, 3 internal).
 */
import { writeSync } from 'node:fs';
import { isAbsolute, relative } from 'node:path';
import { helpText, parseCommandArgs, type Command, type Io } from './command.ts';
import { UserError, EXIT_INTERNAL, EXIT_OK, EXIT_USAGE } from '../core/errors.ts';
import { reactionCommand } from './commands/reaction.ts';
import { speciesCommand } from './commands/species.ts';
import { equilibriumCommand } from './commands/equilibrium.ts';
import { steamLimitCommand } from './commands/steam-limit.ts';
import { newCommand } from './commands/new.ts';
import { checkCommand } from './commands/check.ts';
import { schemaCommand } from './commands/schema.ts';
import { calcCommand } from './commands/calc.ts';
import { hazardsCommand } from './commands/hazards.ts';
import { buildCommand } from './commands/build.ts';
import { serveCommand } from './commands/serve.ts';
import { auditCommand } from './commands/audit.ts';
import { compareCommand } from './commands/compare.ts';
import { keygenCommand } from './commands/keygen.ts';
import { issueCommand } from './commands/issue.ts';
import { toolVersion } from '../core/version.ts';
import { fileProblem } from '../core/file-errors.ts';
import { visibleText } from '../core/visible-text.ts';

export const COMMANDS: Command[] = [reactionCommand, speciesCommand, equilibriumCommand, steamLimitCommand, newCommand, checkCommand, schemaCommand, calcCommand, hazardsCommand, issueCommand, auditCommand, compareCommand, keygenCommand, buildCommand, serveCommand];

function overview(): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length)) + 2;
  return [
    `cellbasis ${toolVersion()}: design-basis calculation packages for fuel-cell and electrolyser plants`,
    '',
    'usage: cellbasis COMMAND [options]   (cellbasis COMMAND --help for its options)',
    '',
    'commands:',
    ...COMMANDS.map((c) => `  ${c.name.padEnd(width)}${c.summary}`),
    '',
    'exit codes: 0 success, 1 validation or audit failure, 2 usage error, 3 internal error',
    '',
  ].join('\n');
}

/** A path as messages show it: relative to the working folder when inside it. */
function shownPath(path: string, cwd: string): string {
  const rel = relative(cwd, path);
  return isAbsolute(path) && rel && !rel.startsWith('..') && !isAbsolute(rel) ? rel : path;
}

let pipesWatched = false;

/**
 * A reader that stops early (`cellbasis schema | head -1`) closes the pipe, and the next write
 * fails with EPIPE as an event no caller can catch: end quietly then, as other command-line
 * tools do, rather than with Node's report of an unhandled error.
 */
function endQuietlyOnClosedPipes(): void {
  if (pipesWatched) return;
  pipesWatched = true;
  for (const stream of [process.stdout, process.stderr]) {
    stream.on('error', (error: NodeJS.ErrnoException) => {
      if (error.code === 'EPIPE') process.exit(process.exitCode ?? EXIT_OK);
      // Standard output on a full disk (or /dev/full): said on stderr, if stderr still takes it.
      const problem = fileProblem(error);
      if (stream === process.stdout && problem) {
        try {
          writeSync(2, `cellbasis: standard output: ${problem.message}\n`);
        } catch {
          // stderr is gone too: the exit code says it
        }
      }
      process.exit(problem ? problem.exitCode : EXIT_INTERNAL);
    });
  }
}

const processIo = (): Io => {
  endQuietlyOnClosedPipes();
  return {
    out: (t) => process.stdout.write(t),
    err: (t) => process.stderr.write(t),
    isTTY: process.stderr.isTTY === true,
    cwd: process.cwd(),
  };
};

/**
 * Standard error as the user reads it: every character a reader cannot see or that reorders the
 * display (lib/core/visible-text.ts) written as an escape, in every message of every command, so
 * that a message repeating a name, an id or an argument shows what it holds. Line ends stay, and
 * so does the carriage return with which a progress bar starts to redraw its line.
 */
function visibleErrors(io: Io): Io {
  return { ...io, err: (text) => io.err(text.startsWith('\r') ? `\r${visibleLines(text.slice(1))}` : visibleLines(text)) };
}

function visibleLines(text: string): string {
  return text.split('\n').map(visibleText).join('\n');
}

/** Runs one command; every error becomes a message on stderr and an exit code, never a stack trace (unless CELLBASIS_DEBUG is set). */
export async function main(argv: string[], given: Io = processIo()): Promise<number> {
  const io = visibleErrors(given);
  try {
    return await dispatch(argv, io);
  } catch (error) {
    // A folder that is read-only, a full disk, a path through a file: the user's to put right, in one line.
    const problem = error instanceof UserError ? error : fileProblem(error, (path) => shownPath(path, io.cwd));
    if (problem) {
      io.err(`cellbasis: ${problem.message}\n`);
      return problem.exitCode;
    }
    const message = error instanceof Error ? error.message : String(error);
    io.err(`cellbasis: internal error: ${message}\n`);
    if (process.env.CELLBASIS_DEBUG && error instanceof Error && error.stack) io.err(`${error.stack}\n`);
    return EXIT_INTERNAL;
  }
}

async function dispatch(argv: string[], io: Io): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    io.out(overview());
    return name === undefined ? EXIT_USAGE : EXIT_OK;
  }
  if (name === '--version') {
    io.out(`${toolVersion()}\n`);
    return EXIT_OK;
  }
  const command = COMMANDS.find((c) => c.name === name);
  if (!command) {
    io.err(`cellbasis: unknown command ${JSON.stringify(name)}; commands: ${COMMANDS.map((c) => c.name).join(', ')}\n`);
    return EXIT_USAGE;
  }
  const args = parseCommandArgs(command, rest);
  if (args === 'help') {
    io.out(helpText(command));
    return EXIT_OK;
  }
  return await command.run(args, io);
}
