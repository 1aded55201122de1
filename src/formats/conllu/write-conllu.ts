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
