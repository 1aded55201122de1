import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import type { ConstituentNode, Phrase, SecondaryEdge, Tree } from '../../model/constituency.js';
import type { Label } from '../../model/label.js';
import { parseLabel } from '../../model/label.js';
import type { LineIndex } from '../../model/line-index.js';
import { sortByFirstTerminal } from '../../model/terminal-order.js';
import { readEmptyLeaf } from '../bracketed/leaves.js';
import type { EdgeRecord, NodeRecord, SentenceRecord } from './graph-records.js';
import { ABSENT, EMPTY, EMPTY_POS, KIND, NOTE, NOTE_BRACKETS, WRAPPER } from './xml-graph-names.js';
import { readBracketedText } from '../bracketed/read-bracketed.js';
import { MAX_TREE_DEPTH } from '../../model/limits.js';

/** Attributes the model holds in fields of its own; every other attribute is kept in `attributes`. */
const TERMINAL_FIELDS = new Set(['id', 'word', 'lemma', 'pos', KIND]);
const PHRASE_FIELDS = new Set(['id', 'cat', 'coindex', 'gapindex', KIND]);

/** Deepest graph accepted: the same limit as bracketings (see model/limits). */
const MAX_GRAPH_DEPTH = MAX_TREE_DEPTH;

/**
 * Builds the tree of one sentence of the XML graph encoding, after checking
 * that the graph is one: every id unique, every edge pointing at a node, no
 * node with two parents, no cycle, a root that exists. A node no edge reaches
 * is reported and hung under the root, so no word is lost. Each problem
 * names the sentence and the element, with the element's position; a graph
 * with an error is reported and yields no tree.
 */
export function assembleGraph(record: SentenceRecord, file: string, lines: LineIndex, report: Report): Tree | undefined {
  const sentenceId = record.attributes.get('id');
  const where = `sentence ${sentenceId ?? '(no id)'}`;
  let failed = false;
  const problem = (code: DiagnosticCode, message: string, offset: number, notes?: string[]) => {
    const diagnostic = diagnose(code, `${where}: ${message}`, { file, offset, lines }, notes);
    if (diagnostic.severity === 'error') failed = true;
    report(diagnostic);
  };

  const byId = new Map<string, { record: NodeRecord; node: ConstituentNode }>();
  record.terminals.forEach((terminal, i) => register(terminal, terminalNode(terminal, i + 1)));
  for (const nonterminal of record.nonterminals) register(nonterminal, phraseNode(nonterminal, problem));
  function register(element: NodeRecord, node: ConstituentNode) {
    const id = element.attributes.get('id');
    if (id === undefined) return problem('graph-missing-attribute', `<${element.element}> without an id`, element.start);
    if (byId.has(id)) return problem('graph-duplicate-id', `two elements have id ${JSON.stringify(id)}`, element.start, [`the first is at offset ${byId.get(id)!.record.start}`]);
    byId.set(id, { record: element, node });
  }
  for (const terminal of record.terminals) {
    if (!terminal.attributes.has('word') && terminal.attributes.get(KIND) === undefined) problem('graph-missing-attribute', `terminal ${terminal.attributes.get('id') ?? '(no id)'} has no word`, terminal.start);
  }

  // Edges: each node gets at most one parent.
  const parentOf = new Map<ConstituentNode, { parent: ConstituentNode; edge: EdgeRecord }>();
  const secondaryEdges: SecondaryEdge[] = [];
  for (const element of record.nonterminals.length === 0 ? record.terminals : record.terminals.concat(record.nonterminals)) {
    const id = element.attributes.get('id');
    const from = id === undefined ? undefined : byId.get(id);
    if (!from || from.record !== element) continue;
    for (const edge of element.edges) {
      const target = resolve(edge, 'edge', id!);
      if (!target) continue;
      const earlier = parentOf.get(target);
      if (earlier) {
        problem('graph-several-parents', `node ${edge.idref} is the child of two nodes (edges in ${idOf(earlier.parent)} and ${id})`, edge.start, ['a tree gives every node one parent; extra links belong in <secedge>']);
        continue;
      }
      parentOf.set(target, { parent: from.node, edge });
      (from.node as Phrase).children.push(withEdgeLabel(target, edge.label));
    }
    for (const edge of element.secondaryEdges) {
      const target = resolve(edge, 'secedge', id!);
      if (target) secondaryEdges.push({ from: from.node, to: target, label: edge.label ?? ABSENT, position: { start: edge.start, end: edge.start } });
    }
  }
  function resolve(edge: EdgeRecord, element: string, owner: string): ConstituentNode | undefined {
    if (edge.idref === undefined) {
      problem('graph-missing-attribute', `<${element}> in ${owner} without an idref`, edge.start);
      return undefined;
    }
    const target = byId.get(edge.idref);
    if (!target) problem('graph-dangling-idref', `<${element}> in ${owner} points to ${JSON.stringify(edge.idref)}, which no node of the sentence has`, edge.start);
    return target?.node;
  }
  function idOf(node: ConstituentNode): string {
    for (const [id, entry] of byId) if (entry.node === node) return id;
    return '(no id)';
  }

  // The root, and the nodes it reaches.
  const rootEntry = record.root === undefined ? undefined : byId.get(record.root);
  if (!rootEntry) {
    problem('graph-no-root', record.root === undefined ? 'the graph names no root' : `the root ${JSON.stringify(record.root)} is no node of the sentence`, record.graphStart);
    return undefined;
  }
  if (parentOf.has(rootEntry.node)) problem('graph-cycle', `the root ${record.root} is itself the child of ${idOf(parentOf.get(rootEntry.node)!.parent)}`, rootEntry.record.start);
  if (failed) return undefined;
  // Following parents from any node must end at a node without parent; a cycle never does.
  // Depths found on one walk serve the later ones, so each node is walked once.
  const ON_PATH = -1;
  const depthOf = new Map<ConstituentNode, number>();
  for (const [id, { record: element, node }] of byId) {
    if (depthOf.has(node)) continue;
    const path: ConstituentNode[] = [];
    let current: ConstituentNode | undefined = node;
    while (current && !depthOf.has(current)) {
      depthOf.set(current, ON_PATH);
      path.push(current);
      current = parentOf.get(current)?.parent;
    }
    if (current && depthOf.get(current) === ON_PATH) {
      problem('graph-cycle', `node ${id} is its own ancestor through its edges`, element.start);
      return undefined;
    }
    let depth = current ? depthOf.get(current)! : -1;
    for (let i = path.length - 1; i >= 0; i--) depthOf.set(path[i]!, ++depth);
    if (depth > MAX_GRAPH_DEPTH) {
      problem('xml-too-deep', `node ${id} lies more than ${MAX_GRAPH_DEPTH} levels deep`, element.start);
      return undefined;
    }
  }
  const root = rootEntry.node;
  const unattached: Array<[string, { record: NodeRecord; node: ConstituentNode }]> = [];
  for (const entry of byId) if (entry[1].node !== root && !parentOf.has(entry[1].node)) unattached.push(entry);
  if (unattached.length > 0) {
    if (root.type !== 'phrase') {
      problem('graph-unattached', `${unattached.length} node(s) hang from no edge, and the root is a terminal`, unattached[0]![1].record.start);
      return undefined;
    }
    for (const [id, entry] of unattached) {
      problem('graph-unattached', `node ${id} hangs from no edge; it is put under the root`, entry.record.start);
      root.children.push(entry.node);
    }
  }
  for (const [id, entry] of byId) {
    if (entry.node.type === 'phrase' && entry.node.children.length === 0) {
      problem('graph-childless', `nonterminal ${id} has no children`, entry.record.start);
    }
  }
  if (failed) return undefined;
  for (const { node } of byId.values()) if (node.type === 'phrase') sortByFirstTerminal(node.children);

  const tree: Tree = { type: 'tree', children: [root], file, source: lines, position: { start: record.start, end: record.end }, discontinuous: true };
  if (root.type === 'phrase' && rootEntry.record.attributes.get(KIND) === WRAPPER) {
    tree.wrapper = { label: rootEntry.record.attributes.get('cat') ?? '' };
    tree.children = root.children;
  }
  if (sentenceId !== undefined) tree.id = sentenceId;
  const extra = new Map([...record.attributes].filter(([name]) => name !== 'id'));
  if (extra.size > 0) tree.attributes = extra;
  if (record.graphAttributes.size > 0) tree.graphAttributes = record.graphAttributes;
  if (secondaryEdges.length > 0) tree.secondaryEdges = secondaryEdges;
  return tree;
}

function others(attributes: Map<string, string>, fields: ReadonlySet<string>): Map<string, string> | undefined {
  let kept: Map<string, string> | undefined;
  for (const [name, value] of attributes) {
    if (fields.has(name)) continue;
    (kept ??= new Map()).set(name, value);
  }
  return kept;
}

/** The model node of a terminal: a word, or an empty element or note when its kind (or `-NONE-` tag) says so. */
function terminalNode(element: NodeRecord, order: number): ConstituentNode {
  const attributes = element.attributes;
  const position = { start: element.start, end: element.end };
  const xmlId = attributes.get('id');
  const pos = attributes.get('pos') ?? ABSENT;
  const text = attributes.get('word') ?? '';
  const kind = attributes.get(KIND);
  if (kind === EMPTY || (kind === undefined && pos === EMPTY_POS)) {
    // Read as the bracketed reader reads a leaf under -NONE-, so both give the same kind and index.
    const parts = readEmptyLeaf(text, EMPTY_POS, () => false) ?? { kind: text };
    const node: ConstituentNode = { type: 'empty', label: parseLabel(pos), text, kind: parts.kind, refIndex: parts.refIndex, order, position };
    if (xmlId !== undefined) node.xmlId = xmlId;
    return node;
  }
  if (kind === NOTE_BRACKETS) {
    // The brackets of the note are read back by the bracketed reader; a note that does not parse stays text.
    const [parsed] = readBracketedText(`(${pos} ${text})`, { keepMeta: true }, () => undefined);
    const meta = parsed?.children[0];
    if (meta?.type === 'meta' && meta.children.length > 0) {
      const node: ConstituentNode = { type: 'meta', label: pos, children: withoutPositions(meta.children), order, position };
      if (xmlId !== undefined) node.xmlId = xmlId;
      return node;
    }
  }
  if (kind === NOTE || kind === NOTE_BRACKETS) {
    const node: ConstituentNode = { type: 'meta', label: pos, text, children: [], order, position };
    if (xmlId !== undefined) node.xmlId = xmlId;
    return node;
  }
  const word: ConstituentNode = { type: 'preterminal', pos, word: { type: 'word', form: text, order }, position };
  const lemma = attributes.get('lemma');
  if (lemma !== undefined) word.word.lemma = lemma;
  if (xmlId !== undefined) word.xmlId = xmlId;
  const kept = others(attributes, TERMINAL_FIELDS);
  if (kept) word.attributes = kept;
  return word;
}

function phraseNode(element: NodeRecord, problem: (code: DiagnosticCode, message: string, offset: number) => void): Phrase {
  const attributes = element.attributes;
  const label: { -readonly [K in keyof Label]: Label[K] } = { category: attributes.get('cat') ?? ABSENT, functions: [] };
  for (const [name, field] of [['coindex', 'coindex'], ['gapindex', 'gapIndex']] as const) {
    const value = attributes.get(name);
    if (value === undefined) continue;
    if (/^\d+$/.test(value) && String(Number(value)) === value) label[field] = Number(value);
    else problem('graph-bad-attribute', `${name}="${value}" on nonterminal ${attributes.get('id') ?? '(no id)'} is not a number`, element.start);
  }
  const phrase: Phrase = { type: 'phrase', label, children: [], position: { start: element.start, end: element.end } };
  const xmlId = attributes.get('id');
  if (xmlId !== undefined) phrase.xmlId = xmlId;
  const kept = others(attributes, PHRASE_FIELDS);
  if (kept) phrase.attributes = kept;
  return phrase;
}

/** The node as the child of an edge: the edge label becomes its function labels. */
function withEdgeLabel(node: ConstituentNode, edgeLabel: string | undefined): ConstituentNode {
  if (edgeLabel === undefined || edgeLabel === ABSENT || edgeLabel === '') return node;
  const functions = edgeLabel.split('-').filter((part) => part !== '');
  if (node.type === 'phrase') node.label = { ...node.label, functions };
  else if (node.type === 'preterminal') node.functions = functions;
  else if (node.type === 'empty') node.label = { ...node.label, functions: [...node.label.functions, ...functions] };
  return node;
}

/** Nodes parsed out of an attribute value have offsets into that value, not the file: they count as generated. */
function withoutPositions(nodes: ConstituentNode[]): ConstituentNode[] {
  return nodes.map((node) => {
    const { position: _position, ...rest } = node;
    if (rest.type === 'phrase' || rest.type === 'meta') return { ...rest, children: withoutPositions(rest.children) } as ConstituentNode;
    if (rest.type === 'preterminal') {
      const { position: _wordPosition, ...word } = rest.word;
      return { ...rest, word } as ConstituentNode;
    }
    return rest as ConstituentNode;
  });
}
