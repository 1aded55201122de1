import { z } from 'zod';
import { treeHeads } from '../analysis/heads.js';
import { diagnoseItem, itemName, type Report } from '../diagnostics/diagnostic.js';
import { decodeBrackets, decodeCarriedTrees, isBrokenCarry } from '../lossless/decode-brackets.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence } from '../model/dependency.js';
import { countDiscontinuousPhrases } from '../model/terminal-order.js';
import { buildBrackets as build, type BracketSettings } from '../reverse/build-brackets.js';
import type { Lift } from '../reverse/lift-nonprojective-arcs.js';
import { loadCategoryTable, type CategoryTable } from '../tables/load-category-table.js';
import { checkOptions } from './options.js';

const categoryTable = z.custom<CategoryTable>((value) => typeof value === 'object' && value !== null && Array.isArray((value as CategoryTable).rules), 'a category table (loadCategoryTable)');

/** How dependency trees become bracketings. */
export const bracketOptionsSchema = z.strictObject({
  /** Which phrase a word projects: a shipped category table (`ud`), a path, or a loaded table. */
  categories: z.union([z.string().min(1), categoryTable]).default('ud'),
  /** `flat`: one phrase per head; `layered`: one phrase level per dependent, nearest first. */
  shape: z.enum(['flat', 'layered']).default('flat'),
  /** The column that gives the part-of-speech brackets. */
  pos: z.enum(['upos', 'xpos']).default('upos'),
  /** Discontinuous phrases for non-projective subtrees (for the XML graph encoding), instead of lifted arcs with *ICH* traces. */
  discontinuous: z.boolean().default(false),
  /** Rebuild the bracketing carried by lossless conversion exactly, where a sentence carries one. */
  lossless: z.boolean().default(false),
});

export type BracketOptions = z.input<typeof bracketOptionsSchema>;

/** What happened to the sentences of a stream, and what the bracketings hold. */
export interface BracketTally {
  read: number;
  /** Sentences that became a tree (the trees carried beside them not counted). */
  built: number;
  /** Sentences that are not trees, or whose carried bracketing is broken (each reported). */
  skipped: number;
  lifted: number;
  liftedSentences: number;
  discontinuousPhrases: number;
  /** Trees without words given back from the comments that carried them. */
  restored: number;
}

export function emptyBracketTally(): BracketTally {
  return { read: 0, built: 0, skipped: 0, lifted: 0, liftedSentences: 0, discontinuousPhrases: 0, restored: 0 };
}

/** A tree rebuilt from a sentence, with the arcs lifted to make it projective; or a tree carried beside one. */
export interface RebuiltTree {
  tree: Tree;
  /** The sentence it was built from; absent for a carried tree without words. */
  sentence?: DependencySentence;
  lifts: Lift[];
}

/** The settings of a bracketing, the category table loaded. */
export function resolveBracketOptions(options: BracketOptions): BracketSettings & { lossless: boolean } {
  const checked = checkOptions(bracketOptionsSchema, options);
  const categories = typeof checked.categories === 'string' ? loadCategoryTable(checked.categories) : checked.categories;
  return { categories, shape: checked.shape, pos: checked.pos, discontinuous: checked.discontinuous, lossless: checked.lossless };
}

/**
 * Rebuilds bracketed trees from a stream of dependency sentences (see
 * buildBrackets: non-projective arcs lifted and marked with *ICH* traces, or
 * discontinuous phrases). In lossless mode a sentence that carries its
 * bracketing gives it back exactly, with the trees without words carried
 * beside it. A sentence that is not a tree, or whose carried bracketing is
 * broken, is reported and skipped.
 */
export async function* toBrackets(
  sentences: AsyncIterable<DependencySentence> | Iterable<DependencySentence>,
  options: BracketOptions = {},
  report: Report = () => undefined,
  tally: BracketTally = emptyBracketTally(),
): AsyncGenerator<RebuiltTree> {
  const settings = resolveBracketOptions(options);
  for await (const sentence of sentences) yield* rebuildSentence(sentence, settings, report, tally);
}

/**
 * The trees of one sentence, as {@link toBrackets} gives them: its tree (or
 * none, reported, when it is not a tree), and in lossless mode the trees
 * without words it carries before and after it.
 */
export function* rebuildSentence(
  sentence: DependencySentence,
  settings: ReturnType<typeof resolveBracketOptions>,
  report: Report,
  tally: BracketTally,
): Generator<RebuiltTree> {
  tally.read++;
  const decoded = settings.lossless ? decodeBrackets(sentence) : undefined;
  if (isBrokenCarry(decoded)) {
    tally.skipped++;
    report(diagnoseItem('carried-brackets-broken', `sentence ${itemName(sentence, tally.read)}: ${decoded.problem}; skipped`, sentence));
    return;
  }
  const result = decoded ? { tree: decoded, lifts: [] } : build(sentence, settings);
  if (!result) {
    tally.skipped++;
    const checked = treeHeads(sentence);
    const why = 'problem' in checked ? checked.problem : 'the heads do not form a tree';
    report(diagnoseItem('not-a-tree', `sentence ${itemName(sentence, tally.read)}: ${why}; skipped`, sentence));
    return;
  }
  tally.built++;
  if (settings.discontinuous) tally.discontinuousPhrases += countDiscontinuousPhrases(result.tree);
  if (result.lifts.length > 0) {
    tally.lifted += result.lifts.length;
    tally.liftedSentences++;
  }
  const before = decoded ? decodeCarriedTrees(sentence, 'before') : [];
  const after = decoded ? decodeCarriedTrees(sentence, 'after') : [];
  tally.restored += before.length + after.length;
  for (const tree of before) yield { tree, lifts: [] };
  yield { tree: result.tree, sentence, lifts: result.lifts };
  for (const tree of after) yield { tree, lifts: [] };
}
