import { SingleBar } from 'cli-progress';
import type { CliIO } from './io.js';

/** Reports bytes read so far; a no-op unless a bar is showing. */
export interface Progress {
  advance(bytesOfCurrentInput: number): void;
  nextInput(): void;
  stop(): void;
}

/**
 * Inputs smaller than this finish before a bar would be worth drawing: 8 MiB,
 * or the number of bytes in TREEBRIDGE_PROGRESS_BYTES (0 draws a bar for any run).
 */
function worthABar(): number {
  const set = Number(process.env.TREEBRIDGE_PROGRESS_BYTES);
  return process.env.TREEBRIDGE_PROGRESS_BYTES !== undefined && Number.isFinite(set) && set >= 0 ? set : 8 * 1024 * 1024;
}

const silent: Progress = { advance() {}, nextInput() {}, stop() {} };

/**
 * The one status line of a run on standard error: at most one progress bar,
 * and messages printed above it rather than onto it. A bar holds a timer that
 * keeps the process alive, so every bar started is stopped when its reading
 * ends, and again, whatever happened, when the command returns
 * ({@link stopStatusLine}).
 */
class StatusLine {
  private bar: SingleBar | undefined;

  constructor(private readonly io: CliIO) {}

  /** A bar on standard error, only when it is a terminal, the run is long and no other bar is showing. */
  start(totalBytes: number, label: string): Progress {
    if (!this.io.stderr.isTTY || totalBytes < worthABar() || this.bar) return silent;
    const bar = new SingleBar({
      stream: this.io.stderr as NodeJS.WritableStream,
      format: `${label} [{bar}] {percentage}% of {totalMB} MB, {eta_formatted} left`,
      barsize: 30,
      hideCursor: true,
      clearOnComplete: true,
      // The estimate averages the last 200 updates, so that it does not jump with every slice read.
      etaBuffer: 200,
      etaAsynchronousUpdate: true,
    });
    this.bar = bar;
    const megabytes = (bytes: number) => (bytes / 1048576).toFixed(1);
    bar.start(totalBytes, 0, { totalMB: megabytes(totalBytes) });
    let done = 0;
    let current = 0;
    return {
      advance(bytes) {
        current = bytes;
        bar.update(done + current);
      },
      nextInput() {
        done += current;
        current = 0;
      },
      stop: () => this.stop(bar),
    };
  }

  /** Writes a line of text (with its line feed) above the bar, which is drawn again after it. */
  write(text: string): void {
    const bar = this.bar;
    if (!bar) {
      this.io.stderr.write(text);
      return;
    }
    this.io.stderr.write('\r\x1b[2K' + text);
    // The bar draws only what changed; forget what it drew so that it draws itself again.
    (bar as unknown as { lastDrawnString: string | null }).lastDrawnString = null;
    bar.render();
  }

  stop(bar = this.bar): void {
    if (!bar || bar !== this.bar) return;
    bar.stop();
    this.bar = undefined;
  }
}

const lines = new WeakMap<CliIO, StatusLine>();

/** The status line of the run that talks through these streams. */
export function statusLine(io: CliIO): StatusLine {
  let line = lines.get(io);
  if (!line) lines.set(io, (line = new StatusLine(io)));
  return line;
}

/** A progress bar for reading `totalBytes`, on the run's status line (see StatusLine). */
export function startProgress(io: CliIO, totalBytes: number, label: string): Progress {
  return statusLine(io).start(totalBytes, label);
}

/** Stops any bar still showing: called when a command returns, however it returns. */
export function stopStatusLine(io: CliIO): void {
  lines.get(io)?.stop();
}
