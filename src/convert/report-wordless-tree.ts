import { diagnoseItem, type Report } from '../diagnostics/diagnostic.js';
import type { Tree } from '../model/constituency.js';

/** Reports a tree that had to be left out because it holds no words, so that no tree goes missing unsaid. */
export function reportWordlessTree(tree: Tree, report: Report): void {
  report(diagnoseItem('nothing-to-convert', 'tree has no words (only empty elements or notes); skipped', tree));
}
