import { treeHeads } from '../analysis/heads.js';
import { CorpusStructureCounter, type CorpusStructure } from '../analysis/corpus-structure.js';
import { analyseTree, type TreeStructure } from '../analysis/structure.js';
import { diagnoseItem, itemName, type Report } from '../diagnostics/diagnostic.js';
import type { DependencySentence } from '../model/dependency.js';
import { checkHeads } from '../validate/check-dependency-tree.js';

/** The structure figures of a corpus, and how many sentences were left out because they are not trees. */
export interface StructureAnalysis {
  figures: CorpusStructure;
  /** Sentences whose heads do not form a tree (each reported). */
  notTrees: number;
}

/**
 * Measures the structure of dependency trees, as `treebridge stats` does:
 * projectivity, gap degree, edge degree, well-nestedness, arc lengths
 * (Kuhlmann & Nivre 2006; Nivre & Nilsson 2005). A sentence that is not a
 * tree is reported, at the word where its heads go wrong when the problem has
 * one, and left out. `each` hears every measured sentence with its structure.
 */
export async function analyseStructure(
  sentences: AsyncIterable<DependencySentence> | Iterable<DependencySentence>,
  report: Report = () => undefined,
  each?: (sentence: DependencySentence, structure: TreeStructure) => void | Promise<void>,
): Promise<StructureAnalysis> {
  const counter = new CorpusStructureCounter();
  let notTrees = 0;
  for await (const sentence of sentences) {
    const structure = measureSentence(sentence, report);
    if (!structure) {
      notTrees++;
      continue;
    }
    counter.add(structure);
    await each?.(sentence, structure);
  }
  return { figures: counter.result(), notTrees };
}

/**
 * The structure of one sentence; undefined (and reported, at the word where its
 * heads go wrong when the problem has one) when its heads do not form a tree.
 */
export function measureSentence(sentence: DependencySentence, report: Report): TreeStructure | undefined {
  const checked = treeHeads(sentence);
  if (!('problem' in checked)) return analyseTree(checked.heads);
  let said = false;
  checkHeads(sentence, (diagnostic) => {
    said ||= diagnostic.severity === 'error';
    report(diagnostic);
  });
  if (!said) report(diagnoseItem('not-a-tree', `sentence ${itemName(sentence)}: ${checked.problem}; left out`, sentence));
  return undefined;
}
