import { SingleBar } from 'cli-progress';
import type { CliIO } from './io.js';

/** Reports bytes read so far; a no-op unless a bar is showing. */
export interface Progress {
  advance(bytesOfCurrentInput: number): void;
  nextInput(): void;
  stop(): void;
}

/** Inputs smaller than this finish before a bar would be worth drawing. */
const WORTH_A_BAR = 8 * 1024 * 1024;

/** A progress bar on standard error, only when it is a terminal and the run is long. */
export function startProgress(io: CliIO, totalBytes: number, label: string): Progress {
  if (!io.stderr.isTTY || totalBytes < WORTH_A_BAR) return { advance() {}, nextInput() {}, stop() {} };
  const bar = new SingleBar({
    stream: io.stderr as NodeJS.WritableStream,
    format: `${label} [{bar}] {percentage}% of {totalMB} MB, {eta_formatted} left`,
    barsize: 30,
    hideCursor: true,
    clearOnComplete: true,
  });
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
    stop() {
      bar.stop();
    },
  };
}
