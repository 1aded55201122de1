import { tableErrorLines } from './print-problems.js';
import { Option, type Command } from 'commander';
import type { ConversionSettings } from '../convert/convert-tree.js';
import { loadHeadTable, loadLabelTable, TableError } from '../tables/load-table.js';
import { loadPosMap } from '../tables/load-pos-map.js';
import { shippedTables } from '../tables/table-source.js';

/** The options of every command that converts bracketed trees to dependencies. */
export function addConversionOptions(command: Command, headsRequired = true): Command {
  const heads = new Option('--heads <table>', `head table: a shipped one (${shippedTables('heads').join(', ')}) or a path`);
  return command
    .addOption(headsRequired ? heads.makeOptionMandatory() : heads)
    .option('--labels <table>', `label table: a shipped one (${shippedTables('labels').join(', ')}) or a path; without one, function tags give the labels`)
    .addOption(new Option('--traces <mode>', 'keep: traces stay empty elements and phrases attach where they stand; resolve: antecedents of *T* *ICH* *EXP* *RNR* move to their traces and attach there').choices(['keep', 'resolve']).default('keep'))
    .addOption(new Option('--coordination <style>', 'which conjunct heads a coordination: first (as in UD), last, conjunction, or table (the head table decides)').choices(['first', 'last', 'conjunction', 'table']).default('first'))
    .addOption(new Option('--punctuation <policy>', 'where punctuation attaches: phrase (to the head of its phrase) or root').choices(['phrase', 'root']).default('phrase'))
    .option('--pos-map <map>', `POS map giving UPOS from the tags: a shipped one (${shippedTables('pos').join(', ')}) or a path`)
    .option('--lossless', 'carry each tree\'s bracketing in MISC (key Brackets) and a "# brackets" comment, so that to-brackets --lossless gives it back exactly');
}

/** The settings from the parsed options, or the table problems as printable lines. */
export function conversionSettings(options: Record<string, unknown>): ConversionSettings | { problems: string[] } {
  try {
    return {
      heads: loadHeadTable(options.heads as string),
      labels: typeof options.labels === 'string' ? loadLabelTable(options.labels) : undefined,
      traces: options.traces as ConversionSettings['traces'],
      coordination: options.coordination as ConversionSettings['coordination'],
      punctuation: options.punctuation as ConversionSettings['punctuation'],
      upos: typeof options.posMap === 'string' ? loadPosMap(options.posMap) : undefined,
      lossless: options.lossless === true,
    };
  } catch (error) {
    if (!(error instanceof TableError)) throw error;
    return { problems: tableErrorLines(error) };
  }
}
