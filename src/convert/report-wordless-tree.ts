import { diagnose } from '../diagnostics/diagnostic.js';
import type { Report } from '../diagnostics/diagnostic.js';
import type { Tree } from '../model/constituency.js';

/** Reports a tree that had to be left out because it holds no words, so that no tree goes missing unsaid. */
export function reportWordlessTree(tree: Tree, report: Report): void {
  if (tree.source && tree.position) {
    report(diagnose('nothing-to-convert', 'tree has no words (only empty elements or notes); skipped', { file: tree.file ?? '-', offset: tree.position.start, lines: tree.source }));
  }
}
