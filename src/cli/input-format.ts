import type { Input } from './io.js';

/** The input formats treebridge reads. */
export type InputFormat = 'bracketed' | 'conllu';

export const inputFormats: readonly InputFormat[] = ['bracketed', 'conllu'];

/** The format of an input: `--from` when given, else by extension (`.conllu`, `.conll`), else bracketed. */
export function formatOf(input: Input, from: InputFormat | undefined): InputFormat {
  if (from) return from;
  return /\.conllu?$/i.test(input.name) ? 'conllu' : 'bracketed';
}

/** The one format of all inputs, or a message when they mix formats. */
export function commonFormat(inputs: Input[], from: InputFormat | undefined): InputFormat | { mixed: string } {
  const formats = new Set(inputs.map((input) => formatOf(input, from)));
  if (formats.size > 1) return { mixed: 'inputs mix bracketed and CoNLL-U files; give one format at a time, or --from' };
  return formats.values().next().value ?? from ?? 'bracketed';
}
