import type { ConstituentNode, Tree } from '../../src/model/constituency.js';
import { formatLabel } from '../../src/model/label.js';

/**
 * A tree as [labels in pre-order, leaves in order], with the wrapper and the
 * identifier node where a general bracket reader sees them: the shape the
 * NLTK dump prints, so the two can be compared line by line.
 */
export function outline(tree: Tree): [string[], string[]] {
  const labels: string[] = [];
  const leaves: string[] = [];
  const visit = (node: ConstituentNode) => {
    switch (node.type) {
      case 'phrase':
        labels.push(formatLabel(node.label));
        node.children.forEach(visit);
        break;
      case 'preterminal':
        labels.push(node.pos);
        leaves.push(node.word.lemma === undefined ? node.word.form : `${node.word.form}-${node.word.lemma}`);
        break;
      case 'empty':
        labels.push(formatLabel(node.label));
        leaves.push(node.text);
        break;
      case 'meta':
        labels.push(node.label);
        if (node.text !== undefined) leaves.push(...node.text.split(' '));
        node.children.forEach(visit);
        break;
    }
  };
  if (tree.wrapper) labels.push(tree.wrapper.label);
  tree.children.forEach(visit);
  if (tree.id !== undefined) {
    labels.push('ID');
    leaves.push(tree.id);
  }
  return [labels, leaves];
}
