import type { Report } from '../diagnostics/diagnostic.js';
import { decodeStream, readBracketedBatches } from '../formats/bracketed/read-bracketed.js';
import type { BracketedReadOptions } from '../formats/bracketed/read-options.js';
import type { Tree } from '../model/constituency.js';
import type { CliIO, Input } from './io.js';
import { startProgress } from './progress.js';

/**
 * Reads the trees of several inputs in turn, one at a time, drawing a progress
 * bar when the run is long. `onInput` hears each input as it starts.
 */
export async function* readTreesOf(
  inputs: Input[],
  options: BracketedReadOptions,
  report: Report,
  io: CliIO,
  onInput?: (input: Input) => void,
): AsyncGenerator<Tree> {
  const total = inputs.reduce((sum, input) => sum + (input.size ?? 0), 0);
  const progress = startProgress(io, total, 'reading');
  try {
    let next = inputs[0]?.open();
    for (let k = 0; k < inputs.length; k++) {
      const input = inputs[k]!;
      const bytes = next!;
      // The next input opens while this one is parsed, so no time is lost waiting for the disk between files.
      next = inputs[k + 1]?.open();
      onInput?.(input);
      const text = decodeStream(bytes, (read) => progress.advance(read));
      for await (const batch of readBracketedBatches(text, { ...options, file: input.name }, report)) yield* batch;
      progress.nextInput();
    }
  } finally {
    progress.stop();
  }
}
