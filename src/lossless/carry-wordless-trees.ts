import type { Comment } from '../model/dependency.js';
import type { Tree } from '../model/constituency.js';
import { writeTree } from '../traces/write-tree.js';

/**
 * Lossless mode: a tree without words (a heading, a note, a bare identifier)
 * cannot be a CoNLL-U sentence, so it rides as a comment on a neighbouring
 * sentence: `# brackets-before = …` on the next sentence, or
 * `# brackets-after = …` on the last one of the output when none follows.
 * The value is the tree on one line; `%` and line breaks are percent-escaped.
 */
export type CarrySide = 'before' | 'after';

export function carryComment(tree: Tree, side: CarrySide): Comment {
  const line = writeTree(tree, { layout: 'line' }).trimEnd();
  return { type: 'comment', text: ` brackets-${side} = ${line.replace(/[%\r\n]/g, (c) => `%${c.charCodeAt(0).toString(16).padStart(2, '0')}`)}` };
}

/** The one-line bracketings carried on a side of a sentence, unescaped, in order. */
export function carriedTexts(comments: readonly Comment[], side: CarrySide): string[] {
  const pattern = new RegExp(`^\\s*brackets-${side}\\s*=\\s*`);
  return comments.filter((c) => pattern.test(c.text)).map((c) => c.text.replace(pattern, '').replace(/%([0-9a-f]{2})/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16))));
}
