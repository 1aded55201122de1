import { Option, type Command } from 'commander';
import type { BracketedReadOptions } from '../formats/bracketed/read-options.js';
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

/** Reading options from the parsed command line. */
export function bracketedReadOptions(options: Record<string, unknown>): BracketedReadOptions {
  const read: BracketedReadOptions = {
    splitLemmas: options.lemmas === true,
    keepMeta: options.dropMeta !== true,
    treeBreaks: options.treeBreaks as TreeBreaks,
  };
  if (typeof options.literalTags === 'string') {
    read.literalTags = options.literalTags.split(',').map((tag) => tag.trim()).filter(Boolean);
  }
  return read;
}
