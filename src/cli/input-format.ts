import type { Input } from './io.js';

/** The input formats treebridge reads: bracketed trees, CoNLL-U, and the XML graph encoding. */
export type InputFormat = 'bracketed' | 'conllu' | 'xml';

export const inputFormats: readonly InputFormat[] = ['bracketed', 'conllu', 'xml'];

/** The formats that hold constituency trees. */
export type TreeFormat = Exclude<InputFormat, 'conllu'>;

/** The format of an input: `--from` when given, else by extension (`.conllu`, `.conll`; `.xml`), else bracketed. */
export function formatOf(input: Input, from: InputFormat | undefined): InputFormat {
  if (from) return from;
  if (/\.conllu?$/i.test(input.name)) return 'conllu';
  return /\.xml$/i.test(input.name) ? 'xml' : 'bracketed';
}

/** The one format of all inputs, or a message when they mix formats. */
export function commonFormat(inputs: Input[], from: InputFormat | undefined): InputFormat | { mixed: string } {
  const formats = new Set(inputs.map((input) => formatOf(input, from)));
  if (formats.has('conllu') && formats.size > 1) return { mixed: 'inputs mix constituency trees and CoNLL-U files; give one format at a time, or --from' };
  // Bracketed and XML graph files both hold constituency trees, and may be read together.
  if (formats.size > 1) return 'bracketed';
  return formats.values().next().value ?? from ?? 'bracketed';
}
