import { basename } from 'node:path';
import { z } from 'zod';
import { convertTree as convertPrepared, type Conversion } from '../convert/convert-tree.js';
import { reportWordlessTree } from '../convert/report-wordless-tree.js';
import { diagnoseItem, itemName, type Report } from '../diagnostics/diagnostic.js';
import { readBracketedText } from '../formats/bracketed/read-bracketed.js';
import type { BracketedReadOptions } from '../formats/bracketed/read-options.js';
import { writeCheckedSentence, writeSentence } from '../formats/conllu/write-conllu.js';
import { carryBrackets } from '../lossless/carry-brackets.js';
import { carryComment } from '../lossless/carry-wordless-trees.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence } from '../model/dependency.js';
import { checkOptions, conversionOptionsSchema, resolveConversionOptions, type ConversionOptions, type ResolvedConversion } from './options.js';

/** How the trees of a stream are named in the output, besides the conversion options. */
export const namingSchema = z.strictObject({
  /** `# sent_id` of a tree without identifier: this prefix and its number; default the file's base name and `-`. */
  idPrefix: z.string().optional(),
  /** The number of the first tree of each input (for pieces of a split corpus); default 1. */
  firstNumber: z.number().int().min(0).default(1),
  /** The name of the source in each word's MISC (`From=NAME#n`) for trees read from no file; default none. */
  source: z.string().optional(),
});

export type NamingOptions = z.input<typeof namingSchema>;

/** What happened to the trees of a stream: read = converted + carried + skipped. */
export interface ConversionTally {
  read: number;
  converted: number;
  /** Trees without words carried in comments of a neighbouring sentence (lossless mode). */
  carried: number;
  /** Trees without words, or that CoNLL-U cannot hold (each reported). */
  skipped: number;
}

export function emptyConversionTally(): ConversionTally {
  return { read: 0, converted: 0, carried: 0, skipped: 0 };
}

/**
 * Converts one tree to a dependency sentence with the given options (tables
 * by name, path or loaded; defaults as the command line's). `id` becomes `#
 * sent_id` (default the tree's identifier); `origin` names the tree in each
 * word's MISC (`From=…`), and is left out when not given. Undefined for a tree
 * without words.
 */
export function convertTree(tree: Tree, options: ConversionOptions | ResolvedConversion, naming: { id?: string; origin?: string } = {}): Conversion | undefined {
  const { settings, lossless } = 'settings' in options ? options : resolveConversionOptions(options);
  const conversion = convertPrepared(tree, settings, naming.id ?? tree.id ?? 'sentence', naming.origin ?? '');
  if (!conversion) return undefined;
  if (naming.origin === undefined) for (const line of conversion.sentence.lines) if (line.type === 'word') line.misc = '_';
  if (lossless) {
    carryBrackets(tree, conversion, settings);
    // Without an origin the MISC column started as `_`: the carried values stand alone.
    for (const line of conversion.sentence.lines) if (line.type === 'word') line.misc = line.misc.replace(/^_\|/, '');
  }
  return conversion;
}

/**
 * Converts a stream of trees, yielding each sentence as it is ready. Trees
 * without words are reported (`nothing-to-convert`) and skipped, or, in
 * lossless mode, carried in a comment of the next sentence (or of the last
 * one); a sentence CoNLL-U cannot hold is reported (`unwritable-tree`);
 * secondary edges of a graph are reported as left out. `tally` counts what
 * became of every tree.
 */
export async function* convertTrees(
  trees: AsyncIterable<Tree> | Iterable<Tree>,
  options: ConversionOptions & NamingOptions,
  report: Report = () => undefined,
  tally: ConversionTally = emptyConversionTally(),
): AsyncGenerator<DependencySentence> {
  const converter = new TreeConverter(options, report, tally);
  for await (const tree of trees) yield* converter.convert(tree);
  yield* converter.finish();
}

/**
 * The conversion of a stream of trees, one tree at a time and without
 * waiting: what {@link convertTrees} does, for callers that hold trees in
 * batches and want no promise per tree. `convert` gives the sentences a tree
 * completes (none, one, or in lossless mode the one held back before it);
 * `finish` gives what is left when the stream ends.
 */
export class TreeConverter {
  private readonly naming: z.output<typeof namingSchema>;
  private readonly resolved: ResolvedConversion;
  private file: string | undefined;
  private number: number;
  /** Lossless mode holds back one sentence, so that trees without words at the very end can ride on it. */
  private held: DependencySentence | undefined;
  private wordless: Tree[] = [];
  /** The text of each sentence as written when it was checked, so that it is not written twice. */
  private readonly written = new WeakMap<DependencySentence, string>();

  constructor(
    options: ConversionOptions & NamingOptions,
    private readonly report: Report = () => undefined,
    readonly tally: ConversionTally = emptyConversionTally(),
  ) {
    const { idPrefix, firstNumber, source, ...rest } = options;
    this.naming = checkOptions(namingSchema, { idPrefix, firstNumber, source });
    this.resolved = resolveConversionOptions(checkOptions(conversionOptionsSchema, rest));
    this.number = this.naming.firstNumber - 1;
  }

  convert(tree: Tree): DependencySentence[] {
    const { tally, naming, resolved, report } = this;
    tally.read++;
    if (tree.file !== this.file || tally.read === 1) {
      this.file = tree.file;
      this.number = naming.firstNumber - 1;
    }
    // A reader's count of the trees of its input names a tree, so that a tree keeps its name whatever
    // trees before it could not be read, and a piece of a split input numbers as the whole does.
    const number = (this.number = tree.number === undefined ? this.number + 1 : naming.firstNumber - 1 + tree.number);
    const name = this.file === undefined ? naming.source : basename(this.file);
    const id = tree.id ?? `${naming.idPrefix ?? (name === undefined ? '' : `${name}-`)}${number}`;
    if (tree.secondaryEdges && tree.secondaryEdges.length > 0) reportSecondaryEdges(tree, report);
    const conversion = convertTree(tree, resolved, { id, origin: name === undefined ? undefined : `${name}#${number}` });
    if (!conversion) {
      if (resolved.lossless) this.wordless.push(tree);
      else {
        tally.skipped++;
        reportWordlessTree(tree, report);
      }
      return [];
    }
    const checked = writeCheckedSentence(conversion.sentence);
    if ('problem' in checked) {
      tally.skipped++;
      report(diagnoseItem('unwritable-tree', `tree ${itemName(tree)} cannot be written as CoNLL-U: ${checked.problem}`, tree));
      return [];
    }
    // A sentence held back in lossless mode gains comments before it leaves: its text is written then.
    if (!resolved.lossless) this.written.set(conversion.sentence, checked.text);
    tally.converted++;
    if (!resolved.lossless) return [conversion.sentence];
    const ready = this.held ? [this.held] : [];
    this.held = conversion.sentence;
    this.held.comments.push(...this.wordless.map((t) => carryComment(t, 'before')));
    tally.carried += this.wordless.length;
    this.wordless = [];
    return ready;
  }

  /** As {@link convert}, the sentences written as CoNLL-U. */
  convertToText(tree: Tree): string {
    const sentences = this.convert(tree);
    if (sentences.length === 0) return '';
    if (sentences.length === 1) return this.written.get(sentences[0]!) ?? writeSentence(sentences[0]!);
    return sentences.map((sentence) => this.written.get(sentence) ?? writeSentence(sentence)).join('');
  }

  finish(): DependencySentence[] {
    const { held, wordless, tally } = this;
    this.held = undefined;
    this.wordless = [];
    if (held) {
      held.comments.push(...wordless.map((t) => carryComment(t, 'after')));
      tally.carried += wordless.length;
      return [held];
    }
    for (const tree of wordless) {
      tally.skipped++;
      reportWordlessTree(tree, this.report);
    }
    return [];
  }
}

/** A dependency tree has no place for secondary edges: each sentence that has some says how many are left out. */
function reportSecondaryEdges(tree: Tree, report: Report): void {
  const edges = tree.secondaryEdges!;
  const labels = [...new Set(edges.map((edge) => edge.label))].join(', ');
  const at = edges[0]!.position ? { ...tree, position: edges[0]!.position } : tree;
  report(diagnoseItem('secondary-edges-dropped', `sentence ${itemName(tree)}: ${edges.length} secondary edge${edges.length === 1 ? '' : 's'} (${labels}) left out of the dependency tree`, at));
}

/**
 * Converts bracketed trees given as text to CoNLL-U text: the simplest way in.
 * Problems of the text or the conversion go to `report`; trees that cannot be
 * read or converted are left out.
 */
export async function convertText(text: string, options: ConversionOptions & NamingOptions & { read?: BracketedReadOptions }, report: Report = () => undefined): Promise<string> {
  const { read, ...conversion } = options;
  // Text read from no file names no file: the trees are named by `source`, when given.
  const trees = readBracketedText(text, read ?? {}, report).map((tree) => (read?.file === undefined ? { ...tree, file: undefined } : tree));
  let out = '';
  for await (const sentence of convertTrees(trees, conversion, report)) out += writeSentence(sentence);
  return out;
}
