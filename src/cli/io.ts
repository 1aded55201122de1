import { once } from 'node:events';
import { createWriteStream, type WriteStream } from 'node:fs';
import { rename, stat, unlink } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import type { Readable, Writable } from 'node:stream';
import { openAhead } from '../formats/bracketed/read-bracketed.js';

/** The streams a CLI run talks through; tests pass their own. */
export interface CliIO {
  stdin: Readable;
  stdout: Writable;
  stderr: Writable & { isTTY?: boolean; columns?: number };
  /** Directory relative paths are resolved against; default the process's. */
  cwd?: string;
}

/** An input file as the user named it, and its bytes. */
export interface Input {
  /** The name as given (`-` for standard input). */
  name: string;
  /** Opens the input; a file starts being read at once, so it can be opened ahead of its turn. */
  open: () => AsyncIterable<Buffer | string>;
  /** Size in bytes when known (files), for the progress bar. */
  size?: number;
}

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
        failures.push(`cannot read "${name}": it is a directory`);
        continue;
      }
      inputs.push({ name, open: () => openAhead(path), size: info.size });
    } catch (error) {
      failures.push(`cannot read "${name}": ${describeError(error)}`);
    }
  }
  return { inputs, failures };
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

/**
 * Where a command's output goes: standard output, or a file written
 * atomically (a temporary file beside it, renamed into place only when the
 * command finished writing, so a failed run never leaves half a file).
 */
export class Output {
  private file: WriteStream | undefined;
  private failure: unknown;

  private constructor(
    private readonly stream: Writable,
    private readonly name?: string,
    private readonly target?: string,
    private readonly temporary?: string,
  ) {
    if (temporary) {
      this.file = stream as WriteStream;
      this.file.on('error', (error) => (this.failure = error));
    }
  }

  static to(path: string | undefined, io: CliIO): Output {
    if (path === undefined || path === '-') return new Output(io.stdout);
    const target = io.cwd ? resolve(io.cwd, path) : path;
    const temporary = join(dirname(target), `.${basename(target)}.tmp-${process.pid}-${Date.now()}`);
    return new Output(createWriteStream(temporary), path, target, temporary);
  }

  /** Writes text, waiting when the stream asks for it. */
  async write(text: string): Promise<void> {
    this.check();
    if (!this.stream.write(text)) {
      // Wait for the stream to drain; an error instead is kept by the listener above and thrown below.
      await once(this.stream, 'drain').catch(() => undefined);
    }
    this.check();
  }

  /** Finishes the output: a file is moved into place. */
  async commit(): Promise<void> {
    if (!this.file || !this.target || !this.temporary) return;
    await new Promise<void>((resolve) => this.file!.end(() => resolve()));
    this.check();
    try {
      await rename(this.temporary, this.target);
    } catch (error) {
      this.failure = error;
      this.check();
    }
  }

  private check(): void {
    if (this.failure) throw new OutputError(`cannot write "${this.name}": ${describeError(this.failure)}`);
  }

  /** Abandons the output: a temporary file is removed, the target left as it was. */
  async abandon(): Promise<void> {
    if (!this.file || !this.temporary) return;
    await new Promise<void>((resolve) => this.file!.end(() => resolve()));
    await unlink(this.temporary).catch(() => undefined);
  }
}
