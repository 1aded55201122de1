import { headWordOf, type ConversionNode } from '../convert/conversion-tree.js';
import { findHeads } from '../convert/find-heads.js';
import { attachDependents } from '../convert/attach-dependents.js';
import { joinFixedExpressions, joinFixedExpressionsStep } from '../convert/join-fixed-expressions.js';
import { attachLateConjunctsStep } from '../convert/attach-late-conjuncts.js';
import { phrasesTopDown } from '../convert/conversion-tree.js';
import { prepareTree } from '../convert/prepare-tree.js';
import type { Tree } from '../model/constituency.js';
import { resolveConversionOptions, type ConversionOptions, type ResolvedConversion } from './options.js';

/** Why one phrase has the head it has. */
export interface HeadExplanation {
  /** How deep the phrase stands (the top phrase is 0). */
  depth: number;
  /** The phrase's label as written (`''` for the group of several top nodes). */
  label: string;
  /** The label (or tag) of the child chosen as head, and the word it leads down to. */
  headLabel: string;
  headWord: string;
  /** The step of the table (or the rule) that chose it: `VP (line 12): left each VP … [matched VP]`. */
  reason: string;
  /** The table line of that step, when a step chose it. */
  line?: number;
  /**
   * Restructuring steps that changed what hangs from what in this phrase,
   * past head choice: `join-fixed-expressions (en-content line 20): "because of": "of" hangs from "because" as fixed`,
   * `attach-late-conjuncts (en-content line 12): "went" is a conjunct of "rained"; "but" hangs from the conjunct after it`.
   */
  restructured?: string[];
}

/**
 * For each phrase of a tree, outermost first, the head chosen and the step of
 * the head table that chose it, as `treebridge heads explain` shows.
 * Undefined for a tree without words.
 */
export function explainHeads(tree: Tree, options: ConversionOptions | ResolvedConversion): HeadExplanation[] | undefined {
  const { settings } = 'settings' in options ? options : resolveConversionOptions(options);
  const prepared = prepareTree(tree, settings.traces);
  if (!prepared) return undefined;
  findHeads(prepared.root, settings.heads, settings.coordination);
  const attachments = attachDependents(prepared.root, prepared.words, settings.heads, settings.coordination, settings.punctuation);
  const notes = new Map<ConversionNode, string[]>();
  for (const phrase of phrasesTopDown(prepared.root)) {
    const late = phrase.coordination?.late;
    if (!late) continue;
    const form = (i: number) => `"${headWordOf(phrase.children[i]!).form}"`;
    const [head, ...others] = phrase.coordination!.conjuncts;
    const hanging = phrase.coordination!.coordinators.map(form);
    const note = `${attachLateConjunctsStep} (${settings.heads.name} line ${late.line}): ${others.map(form).join(', ')} ${others.length > 1 ? 'are conjuncts' : 'is a conjunct'} of ${form(head!)}; ${hanging.join(', ')} ${hanging.length > 1 ? 'hang' : 'hangs'} from the conjunct after ${hanging.length > 1 ? 'each' : 'it'}`;
    notes.set(phrase, [note]);
  }
  for (const joined of joinFixedExpressions(prepared.root, attachments, settings.heads)) {
    const forms = joined.words.map((index) => prepared.words[index - 1]!.form);
    const hanging = forms.slice(1).map((form) => `"${form}"`).join(', ');
    const note = `${joinFixedExpressionsStep} (${settings.heads.name} line ${joined.line}): "${joined.text}": ${hanging} ${forms.length > 2 ? 'hang' : 'hangs'} from "${forms[0]}" as fixed`;
    notes.set(joined.phrase, [...(notes.get(joined.phrase) ?? []), note]);
  }
  const explanations: HeadExplanation[] = [];
  const stack: Array<{ node: ConversionNode; depth: number }> = [{ node: prepared.root, depth: 0 }];
  while (stack.length > 0) {
    const { node, depth } = stack.pop()!;
    if (node.kind !== 'phrase') continue;
    const head = node.children[node.head!.child]!;
    explanations.push({
      depth,
      label: node.label,
      headLabel: head.kind === 'word' ? head.pos : head.label,
      headWord: headWordOf(node).form,
      reason: node.head!.reason,
      ...(node.head!.line === undefined ? {} : { line: node.head!.line }),
      ...(notes.has(node) ? { restructured: notes.get(node) } : {}),
    });
    for (let i = node.children.length - 1; i >= 0; i--) stack.push({ node: node.children[i]!, depth: depth + 1 });
  }
  return explanations;
}
