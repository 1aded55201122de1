import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { readBracketedText } from '../../src/formats/bracketed/read-bracketed.js';
import type { BracketedReadOptions } from '../../src/formats/bracketed/read-options.js';
import type { Tree } from '../../src/model/constituency.js';

/** Reads a string, collecting problems; the file is called `t.psd`. */
export function read(text: string, options: BracketedReadOptions = {}): { trees: Tree[]; problems: Diagnostic[] } {
  const problems: Diagnostic[] = [];
  const trees = readBracketedText(text, { file: 't.psd', ...options }, (d) => problems.push(d));
  return { trees, problems };
}

/** `code@line:col` for each problem, in file order, for compact assertions. */
export function where(problems: Diagnostic[]): string[] {
  return [...problems].sort((a, b) => a.offset - b.offset).map((p) => `${p.code}@${p.line}:${p.column}`);
}

import { BracketedValidator } from '../../src/validate/validate-bracketed.js';

/** Reads and validates a string: the problems `treebridge validate` would print, and the trees read. */
export function validate(text: string, options: BracketedReadOptions = {}) {
  const problems: Diagnostic[] = [];
  const validator = new BracketedValidator((d) => problems.push(d));
  validator.startFile();
  const trees = readBracketedText(text, { file: 't.psd', ...options }, validator.report);
  for (const tree of trees) validator.check(tree);
  return { trees, problems, summary: validator.summary };
}

import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { ConlluValidator } from '../../src/validate/validate-conllu.js';
import { loadFeatureInventory } from '../../src/tables/load-feature-inventory.js';

/** Reads and validates CoNLL-U text: the problems `treebridge validate` would print, and the sentences read. */
export function validateConllu(text: string, relations?: string[]) {
  const problems: Diagnostic[] = [];
  const validator = new ConlluValidator((d) => problems.push(d), relations, loadFeatureInventory('ud'));
  validator.startFile();
  const sentences = readConlluText(text, { file: 't.conllu' }, validator.report);
  for (const sentence of sentences) validator.check(sentence);
  return { sentences, problems, summary: validator.summary };
}
