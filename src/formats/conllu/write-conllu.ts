import type { DependencySentence } from '../../model/dependency.js';

/** Writes a sentence in CoNLL-U: comments, one line per word, token or empty node, then a blank line. */
export function writeSentence(sentence: DependencySentence): string {
  const parts: string[] = [];
  for (const comment of sentence.comments) parts.push(`#${comment.text}\n`);
  for (const line of sentence.lines) parts.push(lineOf(line), '\n');
  parts.push('\n');
  return parts.join('');
}

type Line = DependencySentence['lines'][number];

function lineOf(line: Line): string {
  return `${line.id}\t${line.form}\t${line.lemma}\t${line.upos}\t${line.xpos}\t${line.feats}\t${line.head}\t${line.deprel}\t${line.deps}\t${line.misc}`;
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
    // One test of the whole line settles nearly every line; only a line that fails it is taken apart.
    if (WRITABLE_LINE.test(lineOf(line))) continue;
    for (const column of ['id', 'form', 'lemma', 'upos', 'xpos', 'feats', 'head', 'deprel', 'deps', 'misc'] as const) {
      const value = line[column];
      if (value === '') return `word ${line.id} has an empty ${column.toUpperCase()}`;
      if (/[\t\n\r]/.test(value)) return `the ${column.toUpperCase()} ${JSON.stringify(value)} of word ${line.id} holds a tab or a line break`;
      if (!SPACED_COLUMNS.has(column) && value.includes(' ')) return `the ${column.toUpperCase()} ${JSON.stringify(value)} of word ${line.id} holds a space`;
    }
  }
  return undefined;
}

/**
 * Writes a sentence and checks in the same stroke that it reads back as
 * itself: the text, or why it cannot be written (see unwritableSentenceReason).
 */
export function writeCheckedSentence(sentence: DependencySentence): { text: string } | { problem: string } {
  const text = writeSentence(sentence);
  if (WRITABLE_SENTENCE.test(text)) return { text };
  const problem = unwritableSentenceReason(sentence);
  return problem === undefined ? { text } : { problem };
}

/** Ten columns, none empty, none holding a tab or line break; spaces only in FORM, LEMMA and MISC. */
const WRITABLE_LINE = /^[^\t\n\r ]+\t[^\t\n\r]+\t[^\t\n\r]+(\t[^\t\n\r ]+){6}\t[^\t\n\r]+$/;

/** A whole sentence as writeSentence writes it: comments without carriage returns, then writable lines, then a blank line. */
const WRITABLE_SENTENCE = /^(#[^\n\r]*\n)*([^\t\n\r ]+\t[^\t\n\r]+\t[^\t\n\r]+(\t[^\t\n\r ]+){6}\t[^\t\n\r]+\n)*\n$/;
