/** One line of a CoNLL-U file as the reader met it. */
export interface SourceLine {
  /** The line without its line feed. */
  text: string;
  /** File offset of its first character. */
  offset: number;
  /** 1-based line number. */
  line: number;
}

/** The ten columns, in order. */
export const COLUMNS = ['ID', 'FORM', 'LEMMA', 'UPOS', 'XPOS', 'FEATS', 'HEAD', 'DEPREL', 'DEPS', 'MISC'] as const;

/** 1-based column of the start of field `index` (0-based) of a tab-separated line. */
export function fieldColumn(fields: string[], index: number): number {
  let column = 1;
  for (let k = 0; k < index && k < fields.length; k++) column += fields[k]!.length + 1;
  return column;
}
