import { createWriteStream, existsSync, readdirSync, realpathSync, statSync, unlinkSync, type WriteStream } from 'node:fs';
import { chmod, open, realpath, rename, stat, unlink } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import type { Readable, Writable } from 'node:stream';
import { openAhead } from '../formats/bracketed/read-bracketed.js';
import { formatOf, sniffFormat, type Input, type InputFormat } from './input-format.js';

/** The streams a CLI run talks through; tests pass their own. */
export interface CliIO {
  stdin: Readable;
  stdout: Writable;
  stderr: Writable & { isTTY?: boolean; columns?: number };
  /** Directory relative paths are resolved against; default the process's. */
  cwd?: string;
}

export type { Input } from './input-format.js';

/** Resolves input names to inputs; unreadable ones are returned as messages instead. */
export async function openInputs(names: string[], io: CliIO): Promise<{ inputs: Input[]; failures: string[] }> {
  const inputs: Input[] = [];
  const failures: string[] = [];
  for (const name of names) {
    if (name === '-') {
      inputs.push({ name, open: () => io.stdin });
      continue;
    }
    const path = io.cwd ? resolve(io.cwd, name) : name;
    try {
      const info = await stat(path);
      if (info.isDirectory()) {
        failures.push(`cannot read "${name}": it is a folder; name the files in it (${join(name, '*.psd')}, say)`);
        continue;
      }
      inputs.push({ name, open: () => openAhead(path), size: info.size, sniffed: info.isFile() ? await sniffFile(path) : undefined, realPath: await realpath(path) });
    } catch (error) {
      failures.push(`cannot read "${name}": ${describeError(error)}`);
    }
  }
  return { inputs, failures };
}

/** The first bytes of a file, as a guess at its format. */
async function sniffFile(path: string): Promise<InputFormat | undefined> {
  const handle = await open(path, 'r');
  try {
    const buffer = Buffer.alloc(16 * 1024);
    const { bytesRead } = await handle.read(buffer, 0, buffer.length, 0);
    return sniffFormat(buffer.subarray(0, bytesRead).toString('utf8'));
  } finally {
    await handle.close();
  }
}

/** What the three formats look like from their first characters, in words for messages. */
const described: Record<InputFormat, string> = {
  bracketed: 'bracketed trees',
  conllu: 'CoNLL-U dependency trees',
  xml: 'XML graphs',
};

/**
 * Checks before anything is written: every input readable, each one of a
 * format the command reads (by `--from`, extension or content), and no output
 * file that is also an input. Returns the messages for the user, empty when all is well.
 */
export function checkInputs(
  inputs: Input[],
  failures: string[],
  command: string,
  accepts: readonly InputFormat[],
  from: InputFormat | undefined,
  outputs: Array<string | undefined>,
  io: CliIO,
): string[] {
  const problems = [...failures];
  for (const input of inputs) {
    const format = formatOf(input, from);
    const seen = input.sniffed;
    if (!from && seen && seen !== format) {
      problems.push(`"${input.name}" looks like ${described[seen]}, not ${described[format]} as its name says: read it with --from ${seen}${accepts.includes(seen) ? '' : ` (${command} does not read ${described[seen]}; ${readerOf(seen)})`}`);
    } else if (!accepts.includes(format) && (from || seen || formatOf(input, undefined, 'conllu') === format)) {
      // (A name and content that tell nothing, as standard input's, leave the format to the command.)
      problems.push(`"${input.name}" holds ${described[format]}; ${command} reads ${accepts.map((f) => described[f]).join(' or ')} (${readerOf(format)})`);
    }
  }
  for (const output of outputs) {
    if (output === undefined || output === '-') continue;
    const target = io.cwd ? resolve(io.cwd, output) : resolve(output);
    const real = realTarget(target);
    const clash = inputs.find((input) => input.realPath !== undefined && (input.realPath === real || input.realPath === target));
    if (clash) problems.push(`the output "${output}" is the input "${clash.name}": writing it would destroy what is being read; name another file`);
    if (!existsSync(dirname(real))) problems.push(`cannot write "${output}": the folder "${dirname(output)}" does not exist`);
  }
  return problems;
}

/** Which commands read a format, for messages that point the way. */
function readerOf(format: InputFormat): string {
  if (format === 'conllu') return 'CoNLL-U is read by validate, stats, to-brackets and roundtrip';
  return `${described[format]} are read by validate, rewrite, to-deps, stats, roundtrip and heads`;
}

/** Where writing to a path really writes: through a symbolic link to the file it names. */
function realTarget(target: string): string {
  try {
    return realpathSync(target);
  } catch {
    return target;
  }
}

/** Resolves when a stream has drained, failed or closed; its listeners are removed, so that waiting often leaks none. */
function drained(stream: Writable): Promise<void> {
  return new Promise((resolve) => {
    const done = () => {
      stream.off('drain', done);
      stream.off('error', done);
      stream.off('close', done);
      resolve();
    };
    stream.on('drain', done);
    stream.on('error', done);
    stream.on('close', done);
  });
}

/** A file could not be written; its message is the one-line reason for the user. */
export class OutputError extends Error {}

/** A short reason for a file-system error. */
export function describeError(error: unknown): string {
  const code = (error as NodeJS.ErrnoException)?.code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'it is a directory';
  return error instanceof Error ? error.message : String(error);
}

/** Temporary files being written right now, removed if the process is stopped by a signal. */
const temporaries = new Set<string>();
let signalsHandled = false;

/** On SIGINT or SIGTERM, temporary files are removed before the process ends as the signal would end it. */
function removeTemporariesOnSignals(): void {
  if (signalsHandled) return;
  signalsHandled = true;
  for (const [signal, code] of [['SIGINT', 130], ['SIGTERM', 143]] as const) {
    process.once(signal, () => {
      for (const path of temporaries) {
        try {
          unlinkSync(path);
        } catch {
          // Already gone.
        }
      }
      process.exit(code);
    });
  }
}

/** The temporary file name beside a target; its pid tells a live run's file from a stale one. */
function temporaryName(target: string): string {
  return join(dirname(target), `.${basename(target)}.tmp-${process.pid}-${Date.now()}`);
}

/** Temporary files beside a target left by runs that no longer exist (killed before they could clean up). */
function staleTemporaries(target: string): string[] {
  const prefix = `.${basename(target)}.tmp-`;
  let names: string[];
  try {
    names = readdirSync(dirname(target));
  } catch {
    return [];
  }
  return names
    .filter((name) => name.startsWith(prefix))
    .filter((name) => {
      const pid = Number(name.slice(prefix.length).split('-')[0]);
      if (!Number.isInteger(pid) || pid === process.pid) return false;
      try {
        process.kill(pid, 0);
        return false;
      } catch {
        return true;
      }
    })
    .map((name) => join(dirname(target), name));
}

/**
 * Where a command's output goes: standard output, or a file written
 * atomically (a temporary file beside it, renamed into place only when the
 * command finished writing, so a failed run never leaves half a file). A
 * symbolic link is written through (the file it names is replaced, the link
 * stays); a FIFO or a device is written to directly, as it cannot be replaced;
 * a replaced file keeps its permissions. Temporary files are removed on
 * SIGINT and SIGTERM. When standard output is closed early (`| head`), the rest
 * of the output is dropped and the command runs to its end, so that its exit
 * code still says what it found.
 */
export class Output {
  private file: WriteStream | undefined;
  private failure: unknown;
  /** The reader went away (EPIPE): nothing more is written, and that is no failure. */
  private closed = false;
  /**
   * Text written but not yet handed to the stream: many small writes cost more
   * than one large one (each is a call into the stream and, for a file, a
   * system call), so text leaves in pieces of {@link Output.PIECE} bytes. Each
   * text is encoded straight into the piece being filled: no buffer per text,
   * and no copy to join them. A piece handed to the stream is not touched again.
   */
  private piece: Buffer | undefined;
  private used = 0;
  static readonly PIECE = 256 * 1024;

  private constructor(
    private readonly stream: Writable,
    private readonly name?: string,
    private readonly target?: string,
    private readonly temporary?: string,
    private readonly mode?: number,
  ) {
    if (temporary || target) {
      this.file = stream as WriteStream;
      this.file.on('error', (error) => (this.failure = error));
    } else {
      stream.on('error', (error: NodeJS.ErrnoException) => {
        if (error.code === 'EPIPE') this.closed = true;
        else this.failure = error;
      });
    }
  }

  /** The output for `-o PATH` (standard output for none or `-`); `notes` hears about stale temporary files. */
  static to(path: string | undefined, io: CliIO, notes?: (message: string) => void): Output {
    if (path === undefined || path === '-') return new Output(io.stdout);
    const named = io.cwd ? resolve(io.cwd, path) : resolve(path);
    let target = named;
    let mode: number | undefined;
    try {
      target = realpathSync(named);
      const info = statSync(target);
      // A FIFO, a device or a socket is written to as it is: there is nothing to replace.
      if (!info.isFile()) return new Output(createWriteStream(target, { flags: 'w' }), path, target);
      mode = info.mode & 0o7777;
    } catch {
      // A new file.
    }
    for (const stale of staleTemporaries(target)) notes?.(`a temporary file left by an interrupted run is still there: ${stale} (remove it)`);
    removeTemporariesOnSignals();
    const temporary = temporaryName(target);
    temporaries.add(temporary);
    return new Output(createWriteStream(temporary, mode === undefined ? {} : { mode }), path, target, temporary, mode);
  }

  /** Writes text, waiting when the stream asks for it; text is gathered into large pieces first. */
  async write(text: string): Promise<void> {
    this.check();
    if (this.closed) return;
    if (text === '') return;
    // A UTF-16 unit takes at most three bytes: only a text that might not fit is measured.
    if (text.length * 3 > Output.PIECE - this.used) {
      const bytes = Buffer.byteLength(text, 'utf8');
      if (bytes > Output.PIECE - this.used) {
        await this.flush();
        if (bytes > Output.PIECE) return this.send(Buffer.from(text, 'utf8'));
      }
    }
    this.piece ??= Buffer.allocUnsafe(Output.PIECE);
    this.used += this.piece.write(text, this.used, 'utf8');
  }

  /** Hands the gathered text to the stream. */
  async flush(): Promise<void> {
    if (this.used === 0) return;
    const bytes = this.piece!.subarray(0, this.used);
    this.piece = undefined;
    this.used = 0;
    await this.send(bytes);
  }

  private async send(bytes: Buffer): Promise<void> {
    if (this.closed) return;
    // Wait for the stream to drain; an error instead is kept by the listener above and thrown below.
    if (!this.stream.write(bytes)) await drained(this.stream);
    this.check();
  }

  /** Finishes the output: a file is moved into place, keeping the permissions of the file it replaces. */
  async commit(): Promise<void> {
    await this.flush();
    if (!this.file || !this.target) return;
    await new Promise<void>((resolve) => this.file!.end(() => resolve()));
    this.check();
    if (!this.temporary) return;
    try {
      if (this.mode !== undefined) await chmod(this.temporary, this.mode);
      await rename(this.temporary, this.target);
      temporaries.delete(this.temporary);
    } catch (error) {
      this.failure = error;
      this.check();
    }
  }

  private check(): void {
    if (this.failure) throw new OutputError(`cannot write "${this.name ?? 'standard output'}": ${describeError(this.failure)}`);
  }

  /** Abandons the output: a temporary file is removed, the target left as it was. */
  async abandon(): Promise<void> {
    this.piece = undefined;
    this.used = 0;
    if (!this.file || !this.temporary) return;
    await new Promise<void>((resolve) => this.file!.end(() => resolve()));
    await unlink(this.temporary).catch(() => undefined);
    temporaries.delete(this.temporary);
  }
}
