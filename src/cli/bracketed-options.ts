import { Option, type Command } from 'commander';
import type { TreeReadOptions } from './read-trees.js';
import type { TreeBreaks } from '../formats/bracketed/split-trees.js';

/** The reading options every command that reads bracketed trees shares. */
export function addBracketedReadOptions(command: Command): Command {
  return command
    .option('--lemmas', 'split word-lemma leaves into form and lemma (at the last hyphen)')
    .option('--drop-meta', 'drop CODE/META brackets nested inside sentences')
    .addOption(
      new Option('--tree-breaks <rule>', 'where a new tree may begin: first-column (a "(" in column 1) or brackets (balance only)')
        .choices(['first-column', 'brackets'])
        .default('first-column'),
    )
    .option('--literal-tags <tags>', 'comma-separated tags under which "*" and "0" are words, not empty elements');
}

/** `--from` for commands that read only constituency trees: bracketed or the XML graph encoding. */
export function addTreeFormatOption(command: Command): Command {
  return command.addOption(new Option('--from <format>', 'input format (default: by extension, .xml is the XML graph encoding)').choices(['bracketed', 'xml']));
}

/** Reading options from the parsed command line; `--from` passes on when it names a tree format. */
export function bracketedReadOptions(options: Record<string, unknown>): TreeReadOptions {
  const read: TreeReadOptions = {
    splitLemmas: options.lemmas === true,
    keepMeta: options.dropMeta !== true,
    treeBreaks: options.treeBreaks as TreeBreaks,
  };
  if (options.from === 'bracketed' || options.from === 'xml') read.from = options.from;
  if (typeof options.literalTags === 'string') {
    read.literalTags = options.literalTags.split(',').map((tag) => tag.trim()).filter(Boolean);
  }
  return read;
}

/** Options that only bracketed or XML input uses, by their names in the parsed options. */
export const treeReadingOptions = ['lemmas', 'dropMeta', 'treeBreaks', 'literalTags'];
/** Options that only a conversion of constituency trees uses. */
export const conversionOptionNames = ['heads', 'labels', 'traces', 'coordination', 'punctuation', 'posMap', 'lossless'];

/**
 * A message refusing options the user gave that this run would ignore (the
 * reason says why), or undefined. Defaults are not counted: only options
 * written on the command line.
 */
export function refuseIgnored(command: Command, names: string[], why: string): string | undefined {
  const given = names.filter((name) => command.getOptionValueSource(name) === 'cli');
  if (given.length === 0) return undefined;
  const flags = given.map((name) => command.options.find((option) => option.attributeName() === name)?.long ?? name);
  return `${flags.join(', ')} ${given.length === 1 ? 'does' : 'do'} nothing here: ${why}`;
}
