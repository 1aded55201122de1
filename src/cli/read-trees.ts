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
    for (const input of inputs) {
      onInput?.(input);
      const text = decodeStream(input.bytes(), (bytes) => progress.advance(bytes));
      for await (const batch of readBracketedBatches(text, { ...options, file: input.name }, report)) yield* batch;
      progress.nextInput();
    }
  } finally {
    progress.stop();
  }
}
