
/** An input file as the user named it, and its bytes. */
export interface Input {
  /** The name as given (`-` for standard input). */
  name: string;
  /** Opens the input; a file starts being read at once, so it can be opened ahead of its turn. */
  open: () => AsyncIterable<Buffer | string>;
  /** Size in bytes when known (files), for the progress bar. */
  size?: number;
  /** What the first bytes of a file look like (see {@link sniffFormat}); undefined for standard input or an empty file. */
  sniffed?: InputFormat;
  /** The file's real path, for telling an output that would overwrite it. */
  realPath?: string;
}

/** The input formats treebridge reads: bracketed trees, CoNLL-U, and the XML graph encoding. */
export type InputFormat = 'bracketed' | 'conllu' | 'xml';

export const inputFormats: readonly InputFormat[] = ['bracketed', 'conllu', 'xml'];

/** The formats that hold constituency trees. */
export type TreeFormat = Exclude<InputFormat, 'conllu'>;

/** Extensions that name a format. */
const CONLLU_NAME = /\.conllu?$/i;
const XML_NAME = /\.xml$/i;
const BRACKETED_NAME = /\.(psd|ptb|mrg|tree|trees|penn|brackets?)$/i;

/**
 * The format of an input: `--from` when given, else by extension (`.conllu`,
 * `.conll`; `.xml`; `.psd`, `.ptb`, `.mrg` …), else by what its first
 * characters look like, else bracketed.
 */
export function formatOf(input: Input, from: InputFormat | undefined, fallback: InputFormat = 'bracketed'): InputFormat {
  if (from) return from;
  if (CONLLU_NAME.test(input.name)) return 'conllu';
  if (XML_NAME.test(input.name)) return 'xml';
  if (BRACKETED_NAME.test(input.name)) return 'bracketed';
  return input.sniffed ?? fallback;
}

/**
 * A guess at a format from the first characters of a file: `<` opens XML, a
 * bracket opens a bracketing, and comment lines or ten tab-separated columns
 * are CoNLL-U. Undefined when nothing tells (an empty file, plain text).
 */
export function sniffFormat(text: string): InputFormat | undefined {
  const start = text.replace(/^\uFEFF/, '').trimStart();
  if (start === '') return undefined;
  if (start.startsWith('<')) return 'xml';
  if (start.startsWith('(')) return 'bracketed';
  for (const line of start.split('\n').slice(0, 50)) {
    if (line.startsWith('#') || line.trim() === '') continue;
    return line.split('\t').length >= 9 ? 'conllu' : undefined;
  }
  return start.startsWith('#') ? 'conllu' : undefined;
}

/** The one format of all inputs, or a message when they mix formats. */
export function commonFormat(inputs: Input[], from: InputFormat | undefined): InputFormat | { mixed: string } {
  const formats = new Set(inputs.map((input) => formatOf(input, from)));
  if (formats.has('conllu') && formats.size > 1) return { mixed: 'inputs mix constituency trees and CoNLL-U files; give one format at a time, or --from' };
  // Bracketed and XML graph files both hold constituency trees, and may be read together.
  if (formats.size > 1) return 'bracketed';
  return formats.values().next().value ?? from ?? 'bracketed';
}
