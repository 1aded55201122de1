import type { TreeBreaks } from './split-trees.js';

/** How the bracketed reader interprets a file. Every field is optional. */
export interface BracketedReadOptions {
  /** The file name put in diagnostics and on trees; default `-`. */
  file?: string;
  /** Split `form-lemma` leaves at their last hyphen; default false. */
  splitLemmas?: boolean;
  /** Keep `CODE`/`META` brackets nested inside sentences; default true. Top-level ones always stay. */
  keepMeta?: boolean;
  /** Labels of brackets that hold notes and markup rather than the sentence; default `CODE`, `META`. */
  metaLabels?: string[];
  /** Top-level labels that wrap a sentence rather than belong to it; default `''`, `ROOT`, `TOP`. */
  wrapperLabels?: string[];
  /** Label of the identifier node beside a sentence; default `ID`. */
  idLabel?: string;
  /**
   * Tags under which `*`, `*x*` and `0` are ordinary words rather than empty
   * elements (a real asterisk tagged `SYM`, the number `0` tagged `CD`); tags
   * starting `NUM` are always included. Default `SYM CD LS NFP`, punctuation tags and the 17 Universal POS tags.
   */
  literalTags?: string[];
  /** Where a new tree may begin; see {@link TreeBreaks}. */
  treeBreaks?: TreeBreaks;
  /** Largest tree accepted, in characters. */
  maxTreeLength?: number;
  /** Deepest nesting accepted. */
  maxDepth?: number;
}

/** The options with every default filled in. */
export type ResolvedReadOptions = Required<Omit<BracketedReadOptions, 'maxTreeLength' | 'maxDepth'>> &
  Pick<BracketedReadOptions, 'maxTreeLength' | 'maxDepth'>;

export const defaultLiteralTags = [
  // Penn Treebank tags of symbols, numbers and punctuation.
  'SYM', 'CD', 'LS', 'NFP', '.', ',', ':', '``', "''", '-LRB-', '-RRB-', 'HYPH', '$', '#',
  // The 17 Universal POS tags, so that bracketings built from UD trees (to-brackets) read back.
  'ADJ', 'ADP', 'ADV', 'AUX', 'CCONJ', 'DET', 'INTJ', 'NOUN', 'NUM', 'PART', 'PRON', 'PROPN', 'PUNCT', 'SCONJ', 'SYM', 'VERB', 'X',
];

export function resolveReadOptions(options: BracketedReadOptions = {}): ResolvedReadOptions {
  return {
    file: options.file ?? '-',
    splitLemmas: options.splitLemmas ?? false,
    keepMeta: options.keepMeta ?? true,
    metaLabels: options.metaLabels ?? ['CODE', 'META'],
    wrapperLabels: options.wrapperLabels ?? ['', 'ROOT', 'TOP'],
    idLabel: options.idLabel ?? 'ID',
    literalTags: options.literalTags ?? defaultLiteralTags,
    treeBreaks: options.treeBreaks ?? 'first-column',
    maxTreeLength: options.maxTreeLength,
    maxDepth: options.maxDepth,
  };
}
