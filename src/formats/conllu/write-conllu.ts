import type { DependencySentence } from '../../model/dependency.js';

/** Writes a sentence in CoNLL-U: comments, one line per word, token or empty node, then a blank line. */
export function writeSentence(sentence: DependencySentence): string {
  let text = '';
  for (const comment of sentence.comments) text += `#${comment.text}\n`;
  for (const line of sentence.lines) {
    text += `${line.id}\t${line.form}\t${line.lemma}\t${line.upos}\t${line.xpos}\t${line.feats}\t${line.head}\t${line.deprel}\t${line.deps}\t${line.misc}\n`;
  }
  return text + '\n';
}

/** Columns where the format allows spaces: FORM, LEMMA and MISC (UD v2 format specification). */
const SPACED_COLUMNS = new Set(['form', 'lemma', 'misc']);

/**
 * Why a sentence cannot be written as CoNLL-U that reads back as the same
 * sentence, or undefined when it can: a tab or line break in any column or
 * comment, a space in a column that allows none, an empty column. Trees read
 * from the XML graph encoding can carry any of these in their attributes.
 */
export function unwritableSentenceReason(sentence: DependencySentence): string | undefined {
  for (const comment of sentence.comments) {
    if (/[\n\r]/.test(comment.text)) return `the comment ${JSON.stringify(comment.text.slice(0, 40))} holds a line break`;
  }
  for (const line of sentence.lines) {
    for (const column of ['id', 'form', 'lemma', 'upos', 'xpos', 'feats', 'head', 'deprel', 'deps', 'misc'] as const) {
      const value = line[column];
      if (value === '') return `word ${line.id} has an empty ${column.toUpperCase()}`;
      if (/[\t\n\r]/.test(value)) return `the ${column.toUpperCase()} ${JSON.stringify(value)} of word ${line.id} holds a tab or a line break`;
      if (!SPACED_COLUMNS.has(column) && value.includes(' ')) return `the ${column.toUpperCase()} ${JSON.stringify(value)} of word ${line.id} holds a space`;
    }
  }
  return undefined;
}
