import type { ConstituentNode, Tree } from '../../model/constituency.js';
import { formatLabel } from '../../model/label.js';
import { escapeLeaf, literalTagTest, readEmptyLeaf } from './leaves.js';
import { defaultLiteralTags } from './read-options.js';
import { MAX_TREE_DEPTH } from '../../model/limits.js';

/**
 * How trees are laid out:
 * - `line`: one tree per line;
 * - `indented`: a bracket that does not fit on a line of {@link WriteOptions.width}
 *   puts each child on a line of its own, two spaces deeper; trees are separated by a blank line.
 * Either layout reads back as the same tree.
 */
export type Layout = 'line' | 'indented';

export interface WriteOptions {
  /** Default `line`. */
  layout?: Layout;
  /** Widest line the indented layout keeps a bracket on; default 72. */
  width?: number;
  /** Label of the identifier node; default `ID`. */
  idLabel?: string;
}

/**
 * Writes one tree as a bracketing, ending with a line feed (and a blank line in
 * the indented layout). Trees of any depth are written without recursion. A
 * bracketing holds only continuous phrases: a discontinuous tree must be given
 * *ICH* traces first (insertTraces; writeTree in traces/ does both). A tree that
 * a bracketing cannot hold (see {@link unwritableReason}) throws; check it first.
 */
export function writeBracketing(tree: Tree, options: WriteOptions = {}): string {
  if (tree.discontinuous) throw new Error(`tree ${tree.id ?? '(no id)'} is discontinuous: give it *ICH* traces (insertTraces) before writing it as a bracketing`);
  const reason = unwritableReason(tree);
  if (reason) throw new Error(`cannot write tree ${tree.id ?? '(no id)'} as a bracketing: ${reason}`);
  const brackets = new Brackets();
  const parts = tree.children.map((child) => brackets.add(child));
  if (tree.id !== undefined) parts.push(brackets.bracket(options.idLabel ?? 'ID', escapeLeaf(tree.id), []));
  let top: number;
  if (tree.wrapper) top = brackets.bracket(tree.wrapper.label, undefined, parts);
  else if (parts.length === 1) top = parts[0]!;
  else top = brackets.bracket('', undefined, parts); // several nodes and no wrapper: the empty outer bracket keeps them together
  if ((options.layout ?? 'line') === 'line') return brackets.line(top) + '\n';
  return brackets.indented(top, options.width ?? 72) + '\n\n';
}

/** Writes a node on one line. */
export function writeNode(node: ConstituentNode): string {
  const brackets = new Brackets();
  return brackets.line(brackets.add(node));
}

/** Labels of notes and of the identifier node, as the reader takes them by default. */
const META_LABELS = new Set(['CODE', 'META']);
const ID_LABEL = 'ID';

/** Whitespace, brackets, or nothing at all: what a label or leaf of a bracketing cannot hold. */
// Only the characters the reader takes as space (split-trees: space, tab, line feed, carriage return,
// form feed, vertical tab) break a label or a word; other spaces (U+00A0, U+FEFF …) are word characters.
const BROKEN_LABEL = /[ \t\n\r\f\v()]/;
const SPACE = /[ \t\n\r\f\v]/;

/**
 * Why a tree cannot be written as a bracketing that reads back as the same
 * tree, or undefined when it can: a label or tag with a space or a bracket in
 * it (possible in trees read from XML or built from CoNLL-U), an empty tag, a
 * word with a space in it or none at all, a word that would read back as an
 * empty element (`0` or `*…` under a tag that is not literal, see
 * {@link defaultLiteralTags}), an identifier with a space, nesting deeper than
 * the readers accept ({@link MAX_TREE_DEPTH}).
 */
export function unwritableReason(tree: Tree, literalTags: readonly string[] = defaultLiteralTags): string | undefined {
  const literal = literalTagTest([...literalTags]);
  // Labels the reader gives a meaning of its own: notes, the empty-element tag, and the identifier beside a tree.
  const special = (label: string) => META_LABELS.has(label) || label === ID_LABEL || label === '-NONE-';
  if (tree.wrapper && BROKEN_LABEL.test(tree.wrapper.label)) return `the outer label ${JSON.stringify(tree.wrapper.label)} holds a space or a bracket`;
  if (tree.id !== undefined && (tree.id === '' || SPACE.test(tree.id))) return `the identifier ${JSON.stringify(tree.id)} is empty or holds a space`;
  // Depth counts brackets as the reader does: the outer one (or the top node) is 1, a word's tag 1 more.
  const outer = tree.wrapper || tree.children.length !== 1 || tree.id !== undefined ? 1 : 0;
  const stack = tree.children.map((node) => ({ node, depth: outer + 1 }));
  while (stack.length > 0) {
    const { node, depth } = stack.pop()!;
    if (depth > MAX_TREE_DEPTH) return `it would be nested deeper than ${MAX_TREE_DEPTH} brackets, more than a bracketing may be`;
    const push = (children: ConstituentNode[]) => {
      for (const child of children) stack.push({ node: child, depth: depth + 1 });
    };
    switch (node.type) {
      case 'phrase': {
        const label = formatLabel(node.label);
        if (label === '' || BROKEN_LABEL.test(label)) return `the label ${JSON.stringify(label)} is empty or holds a space or a bracket`;
        if (special(label)) return `the phrase label ${label} has a meaning of its own in a bracketing (a note, an identifier or an empty element)`;
        push(node.children);
        break;
      }
      case 'preterminal': {
        const tag = node.functions && node.functions.length > 0 ? [node.pos, ...node.functions].join('-') : node.pos;
        if (tag === '' || BROKEN_LABEL.test(tag)) return `the tag ${JSON.stringify(tag)} is empty or holds a space or a bracket`;
        if (special(tag)) return `the word ${JSON.stringify(node.word.form)} is tagged ${tag}, which has a meaning of its own in a bracketing (a note, an identifier or an empty element)`;
        const { form, lemma } = node.word;
        if (form === '' || SPACE.test(form)) return `the word ${JSON.stringify(form)} is empty or holds a space`;
        if (lemma !== undefined && (lemma === '' || SPACE.test(lemma))) return `the lemma ${JSON.stringify(lemma)} of "${form}" is empty or holds a space`;
        const leaf = lemma === undefined ? form : `${form}-${lemma}`;
        if (readEmptyLeaf(leaf, node.pos, literal)) return `the word ${JSON.stringify(leaf)} under ${JSON.stringify(node.pos)} would read back as an empty element`;
        break;
      }
      case 'empty': {
        const label = formatLabel(node.label);
        if (label === '' || BROKEN_LABEL.test(label)) return `the label ${JSON.stringify(label)} is empty or holds a space or a bracket`;
        if (node.text === '' || BROKEN_LABEL.test(node.text)) return `the empty element ${JSON.stringify(node.text)} is empty or holds a space or a bracket`;
        break;
      }
      case 'meta':
        if (node.label === '' || BROKEN_LABEL.test(node.label)) return `the label ${JSON.stringify(node.label)} is empty or holds a space or a bracket`;
        push(node.children);
        break;
    }
  }
  return undefined;
}

/**
 * The brackets of one tree to write, held in flat arrays (label, leaf,
 * children by number) so that writing needs no recursion however deep the tree.
 */
class Brackets {
  private readonly labels: string[] = [];
  private readonly leaves: Array<string | undefined> = [];
  private readonly children: number[][] = [];
  /** Length of each bracket written on one line; filled on first need. */
  private readonly widths: number[] = [];

  bracket(label: string, leaf: string | undefined, children: number[]): number {
    this.labels.push(label);
    this.leaves.push(leaf);
    this.children.push(children);
    return this.labels.length - 1;
  }

  /** Adds a node and everything under it; returns its number. */
  add(root: ConstituentNode): number {
    const top = this.bracketOf(root);
    const pending: Array<{ node: ConstituentNode; at: number }> = [{ node: root, at: top }];
    while (pending.length > 0) {
      const { node, at } = pending.pop()!;
      if (node.type !== 'phrase' && node.type !== 'meta') continue;
      for (const child of node.children) {
        const number = this.bracketOf(child);
        this.children[at]!.push(number);
        pending.push({ node: child, at: number });
      }
    }
    return top;
  }

  private bracketOf(node: ConstituentNode): number {
    switch (node.type) {
      case 'phrase':
        return this.bracket(formatLabel(node.label), undefined, []);
      case 'preterminal': {
        const { form, lemma } = node.word;
        // Edge labels above a word (XML graph encoding) ride on the tag, where readers of bracketings look for them.
        const label = node.functions && node.functions.length > 0 ? [node.pos, ...node.functions].join('-') : node.pos;
        return this.bracket(label, escapeLeaf(lemma === undefined ? form : `${form}-${lemma}`), []);
      }
      case 'empty':
        return this.bracket(formatLabel(node.label), node.text, []);
      case 'meta':
        return this.bracket(node.label, node.text === undefined ? undefined : escapeMetaText(node.text), []);
    }
  }

  /** One line: `(label leaf)` or `(label child child …)`. */
  line(top: number): string {
    const out: string[] = [];
    // Tasks: a bracket number to open, or a piece of text to put out as it is.
    const tasks: Array<number | string> = [top];
    while (tasks.length > 0) {
      const task = tasks.pop()!;
      if (typeof task === 'string') {
        out.push(task);
        continue;
      }
      const leaf = this.leaves[task];
      out.push(`(${this.labels[task]} `);
      if (leaf !== undefined) {
        out.push(leaf, ')');
        continue;
      }
      const children = this.children[task]!;
      tasks.push(')');
      for (let k = children.length - 1; k >= 0; k--) {
        tasks.push(children[k]!);
        if (k > 0) tasks.push(' ');
      }
    }
    return out.join('');
  }

  /** The length of a bracket written on one line, for every bracket under `top`. */
  private measure(top: number): void {
    if (this.widths[top] !== undefined) return;
    const order: number[] = [];
    const stack = [top];
    while (stack.length > 0) {
      const at = stack.pop()!;
      order.push(at);
      stack.push(...this.children[at]!);
    }
    for (let k = order.length - 1; k >= 0; k--) {
      const at = order[k]!;
      const leaf = this.leaves[at];
      const children = this.children[at]!;
      let inside = leaf !== undefined ? leaf.length : Math.max(0, children.length - 1);
      if (leaf === undefined) for (const child of children) inside += this.widths[child]!;
      this.widths[at] = this.labels[at]!.length + inside + 3;
    }
  }

  /**
   * The indented layout: a bracket that fits in `width` from its indent stays
   * on one line; otherwise each child goes on a line of its own, two spaces
   * deeper. An unlabelled outer bracket puts its first child on its own line.
   */
  indented(top: number, width: number): string {
    this.measure(top);
    const out: string[] = [];
    const tasks: Array<{ at: number; indent: number } | string> = [{ at: top, indent: 0 }];
    while (tasks.length > 0) {
      const task = tasks.pop()!;
      if (typeof task === 'string') {
        out.push(task);
        continue;
      }
      const { at, indent } = task;
      if (this.leaves[at] !== undefined || indent + this.widths[at]! <= width) {
        out.push(this.line(at));
        continue;
      }
      const pad = '\n' + ' '.repeat(indent + 2);
      const children = this.children[at]!;
      const unlabelled = this.labels[at] === '';
      out.push(unlabelled ? '( ' : `(${this.labels[at]}`);
      tasks.push(')');
      for (let k = children.length - 1; k >= 0; k--) {
        tasks.push({ at: children[k]!, indent: indent + 2 });
        if (k > 0 || !unlabelled) tasks.push(pad);
      }
    }
    return out.join('');
  }
}

/** Meta text was read as space-separated leaves; each leaf is escaped on its own. */
function escapeMetaText(text: string): string {
  return text.split(' ').map(escapeLeaf).join(' ');
}
