import type { ConstituentNode, Tree } from '../../model/constituency.js';
import { formatLabel } from '../../model/label.js';
import { insertTraces } from '../../reverse/insert-traces.js';
import { escapeLeaf } from './leaves.js';

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
 * Writes one tree, ending with a line feed (and a blank line in the indented
 * layout). A discontinuous tree is first made continuous with `*ICH*` traces
 * (insert-traces), as a bracketing holds only continuous phrases.
 */
export function writeTree(tree: Tree, options: WriteOptions = {}): string {
  if (tree.discontinuous) tree = insertTraces(tree).tree;
  const parts = tree.children.map((child) => new Part(child));
  if (tree.id !== undefined) parts.push(Part.leaf(options.idLabel ?? 'ID', escapeLeaf(tree.id)));
  let top: Part;
  if (tree.wrapper) top = new Part(null, tree.wrapper.label, parts);
  else if (parts.length === 1) top = parts[0]!;
  else top = new Part(null, '', parts); // several nodes and no wrapper: the empty outer bracket keeps them together
  if ((options.layout ?? 'line') === 'line') return top.line() + '\n';
  return top.indented(0, options.width ?? 72) + '\n\n';
}

/** Writes a node on one line. */
export function writeNode(node: ConstituentNode): string {
  return new Part(node).line();
}

/** A bracket to write: a label with either one leaf or child brackets. */
class Part {
  readonly label: string;
  readonly leaf: string | undefined;
  readonly children: Part[];
  private oneLine: string | undefined;

  constructor(node: ConstituentNode | null, label = '', children: Part[] = [], leaf?: string) {
    if (node === null) {
      this.label = label;
      this.children = children;
      this.leaf = leaf;
      return;
    }
    switch (node.type) {
      case 'phrase':
        this.label = formatLabel(node.label);
        this.children = node.children.map((child) => new Part(child));
        break;
      case 'preterminal': {
        const { form, lemma } = node.word;
        // Edge labels above a word (XML graph encoding) ride on the tag, where readers of bracketings look for them.
        this.label = node.functions && node.functions.length > 0 ? [node.pos, ...node.functions].join('-') : node.pos;
        this.leaf = escapeLeaf(lemma === undefined ? form : `${form}-${lemma}`);
        this.children = [];
        break;
      }
      case 'empty':
        this.label = formatLabel(node.label);
        this.leaf = node.text;
        this.children = [];
        break;
      case 'meta':
        this.label = node.label;
        this.leaf = node.text === undefined ? undefined : escapeMetaText(node.text);
        this.children = node.children.map((child) => new Part(child));
        break;
    }
  }

  static leaf(label: string, text: string): Part {
    return new Part(null, label, [], text);
  }

  line(): string {
    if (this.oneLine === undefined) {
      const inside = this.leaf !== undefined ? [this.leaf] : this.children.map((child) => child.line());
      this.oneLine = `(${this.label} ${inside.join(' ')})`;
    }
    return this.oneLine;
  }

  indented(indent: number, width: number): string {
    const flat = this.line();
    if (this.leaf !== undefined || indent + flat.length <= width) return flat;
    const pad = ' '.repeat(indent + 2);
    const lines = this.children.map((child) => child.indented(indent + 2, width));
    // An unlabelled outer bracket has nothing to stand on its first line: its first child does.
    if (this.label === '') return `( ${lines.map((line, i) => (i === 0 ? line : pad + line)).join('\n')})`;
    return `(${this.label}\n${lines.map((line) => pad + line).join('\n')})`;
  }
}

/** Meta text was read as space-separated leaves; each leaf is escaped on its own. */
function escapeMetaText(text: string): string {
  return text.split(' ').map(escapeLeaf).join(' ');
}
