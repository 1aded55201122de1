import { Command, CommanderError } from 'commander';
import { registerRewrite } from './commands/rewrite.js';
import { registerStats } from './commands/stats.js';
import { registerToDeps } from './commands/to-deps.js';
import { registerHeads } from './commands/heads.js';
import { registerToBrackets } from './commands/to-brackets.js';
import { registerRoundtrip } from './commands/roundtrip.js';
import { registerValidate } from './commands/validate.js';
import { ExitCode, type CommandResult } from './exit-codes.js';
import { describeError, OutputError, type CliIO } from './io.js';
import { version } from '../version.js';
import { stopStatusLine } from './progress.js';

/**
 * Runs treebridge with the given arguments (without `node` and the script) and
 * streams, and resolves to the exit code: 0 ok, 1 findings, 2 usage or I/O
 * error. Never calls process.exit, so tests can call it directly.
 */
export async function runCli(argv: string[], io: CliIO): Promise<number> {
  let result: CommandResult = { code: ExitCode.Ok };
  const done = (outcome: CommandResult) => (result = outcome);
  const program = new Command('treebridge')
    .description('read, check and convert syntactically annotated corpora')
    .version(version, '-V, --version')
    .exitOverride()
    .configureOutput({
      writeOut: (text) => io.stdout.write(text),
      writeErr: (text) => io.stderr.write(text),
    });
  registerValidate(program, io, done);
  registerRewrite(program, io, done);
  registerStats(program, io, done);
  registerToDeps(program, io, done);
  registerHeads(program, io, done);
  registerToBrackets(program, io, done);
  registerRoundtrip(program, io, done);
  for (const command of program.commands) {
    command.exitOverride().configureOutput({
      writeOut: (text) => io.stdout.write(text),
      writeErr: (text) => io.stderr.write(text),
    });
  }
  try {
    if (argv.length === 0) {
      program.outputHelp();
      return ExitCode.UsageOrIO;
    }
    await program.parseAsync(argv, { from: 'user' });
  } catch (error) {
    stopStatusLine(io);
    if (error instanceof CommanderError) {
      const informational = ['commander.helpDisplayed', 'commander.version', 'commander.help'];
      return informational.includes(error.code) ? ExitCode.Ok : ExitCode.UsageOrIO;
    }
    if (error instanceof OutputError || isSystemError(error)) {
      io.stderr.write(`treebridge: ${error instanceof OutputError ? error.message : describeError(error)}\n`);
      return ExitCode.UsageOrIO;
    }
    // Anything else is a fault of treebridge's, not of the input or the system: said so, with its own code.
    const detail = error instanceof Error ? (process.env.TREEBRIDGE_DEBUG ? error.stack ?? error.message : error.message) : String(error);
    io.stderr.write(`treebridge: internal error: ${detail}\n  this is a bug in treebridge: please report it with the command and the input that caused it\n`);
    return ExitCode.Internal;
  }
  // A bar left drawing would keep its timer, and the process, alive.
  stopStatusLine(io);
  for (const message of result.messages ?? []) io.stderr.write(`treebridge: ${message}\n`);
  return result.code;
}

/** An error from the operating system (a file that cannot be opened, a full disk …), as Node reports them. */
function isSystemError(error: unknown): boolean {
  return error instanceof Error && typeof (error as NodeJS.ErrnoException).code === 'string' && typeof (error as NodeJS.ErrnoException).syscall === 'string';
}
