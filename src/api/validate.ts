import type { Diagnostic } from '../diagnostics/diagnostic.js';
import { readBracketedText } from '../formats/bracketed/read-bracketed.js';
import type { BracketedReadOptions } from '../formats/bracketed/read-options.js';
import { readConlluText } from '../formats/conllu/read-conllu.js';
import { readXmlGraphText } from '../formats/xml-graph/read-xml-graph.js';
import { loadFeatureInventory, type FeatureInventory } from '../tables/load-feature-inventory.js';
import { BracketedValidator, type ValidationSummary } from '../validate/validate-bracketed.js';
import { ConlluValidator, type ConlluSummary } from '../validate/validate-conllu.js';

/** What a validation finds: the totals, and every problem as data, in the order of the text. */
export interface Validation<S> {
  summary: S;
  diagnostics: Diagnostic[];
}

/**
 * Checks CoNLL-U text as `treebridge validate` does (UD v2 format, the tree,
 * `# text`, relations, UPOS, features, DEPS). `relations` declares the
 * relation set (default the 37 universal ones); `features` adds a treebank's
 * own features to the universal inventory (a feature name and its values).
 */
export function validateConllu(text: string, options: { file?: string; relations?: string[]; features?: FeatureInventory } = {}): Validation<ConlluSummary> {
  const diagnostics: Diagnostic[] = [];
  const inventory = loadFeatureInventory('ud');
  for (const [name, values] of options.features ?? []) inventory.set(name, values);
  const validator = new ConlluValidator((d) => diagnostics.push(d), options.relations, inventory);
  validator.startFile();
  for (const sentence of readConlluText(text, { file: options.file ?? '-' }, validator.report)) validator.check(sentence);
  return { summary: validator.summary, diagnostics: diagnostics.sort((a, b) => a.offset - b.offset) };
}

/**
 * Checks bracketed text (or, with `format: 'xml'`, the XML graph encoding) as
 * `treebridge validate` does: what stops a tree from being read (errors) and
 * what looks inconsistent in a tree that was read (warnings).
 */
export function validateBracketed(text: string, options: BracketedReadOptions & { format?: 'bracketed' | 'xml' } = {}): Validation<ValidationSummary> {
  const diagnostics: Diagnostic[] = [];
  const validator = new BracketedValidator((d) => diagnostics.push(d));
  validator.startFile();
  const { format, ...read } = options;
  const trees = format === 'xml' ? readXmlGraphText(text, { file: read.file ?? '-' }, validator.report) : readBracketedText(text, read, validator.report);
  for (const tree of trees) validator.check(tree);
  return { summary: validator.summary, diagnostics: diagnostics.sort((a, b) => a.offset - b.offset) };
}
