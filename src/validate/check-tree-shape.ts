import { diagnose, type Report } from '../diagnostics/diagnostic.js';
import type { Tree } from '../model/constituency.js';
import { isMetaOnly, preterminalsOf } from '../model/traverse.js';

/** Checks what a sentence should hold: one sentence node, and words. Returns the number of words. */
export function checkTreeShape(tree: Tree, report: Report): number {
  const words = preterminalsOf(tree).length;
  if (!tree.source || !tree.position) return words;
  const where = { file: tree.file ?? '-', offset: tree.position.start, end: tree.position.end, lines: tree.source };
  const sentenceNodes = tree.children.filter((child) => child.type !== 'meta');
  if (sentenceNodes.length > 1) {
    const labels = sentenceNodes.map((node) => (node.type === 'preterminal' ? node.pos : node.type === 'phrase' ? node.label.category : node.text));
    report(diagnose('several-roots', `the outer bracket holds ${sentenceNodes.length} sentence nodes: ${labels.join(', ')}`, where));
  }
  if (words === 0 && !isMetaOnly(tree)) report(diagnose('no-words', 'tree holds no words, only empty elements', where));
  return words;
}
