import { convertTree, type ConversionSettings } from '../../src/convert/convert-tree.js';
import { headWordOf, type ConversionNode } from '../../src/convert/conversion-tree.js';
import { findHeads } from '../../src/convert/find-heads.js';
import { prepareTree } from '../../src/convert/prepare-tree.js';
import { loadHeadTable, loadLabelTable } from '../../src/tables/load-table.js';
import { read } from './read.js';

/** The head word's form of the top phrase of a one-tree string, by a head table (no coordination styling). */
export function headOf(text: string, table: string): string {
  const tree = read(text).trees[0]!;
  const prepared = prepareTree(tree, 'keep')!;
  findHeads(prepared.root, loadHeadTable(table));
  return headWordOf(prepared.root).form;
}

/** Converts a one-tree string: `form→headForm/relation` per word (`root` for the root). */
export function arcs(text: string, heads: string, extra: Partial<ConversionSettings> & { labelTable?: string } = {}): string[] {
  const tree = read(text).trees[0]!;
  const settings: ConversionSettings = {
    heads: loadHeadTable(heads),
    labels: extra.labelTable ? loadLabelTable(extra.labelTable) : undefined,
    traces: 'keep',
    coordination: 'first',
    punctuation: 'phrase',
    ...extra,
  };
  const result = convertTree(tree, settings, 't', 't')!;
  const words = result.sentence.lines.filter((l) => l.type === 'word');
  const forms = words.map((l) => l.form);
  return words.map((l) => `${l.form}→${l.head === '0' ? 'ROOT' : forms[Number(l.head) - 1]}/${l.deprel}`);
}

export type { ConversionNode };
