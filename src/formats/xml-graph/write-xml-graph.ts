import xml2js from 'xml2js';
import type { ConstituentNode, Tree } from '../../model/constituency.js';
import { formatLabel } from '../../model/label.js';
import { numberTerminals, terminalsInOrder, type Terminal } from '../../model/terminal-order.js';
import { writeNode } from '../bracketed/write-bracketed.js';
import { ABSENT, KIND, WRAPPER } from './xml-graph-names.js';

/** xml2js builds elements from objects: `$` holds attributes, other keys child elements. */
interface ElementObject {
  $: Record<string, string>;
  [child: string]: unknown;
}

const builder = new xml2js.Builder({ headless: true, renderOpts: { pretty: true, indent: '  ', newline: '\n' } });

/** The start of a document, up to the first sentence. */
export function xmlDocumentStart(): string {
  return '<?xml version="1.0" encoding="UTF-8"?>\n<corpus>\n<head/>\n<body>\n';
}

/** The end of a document, after the last sentence. */
export function xmlDocumentEnd(): string {
  return '</body>\n</corpus>\n';
}

/**
 * Writes one tree as a sentence of the XML graph encoding: terminals in
 * sentence order, a nonterminal per phrase whose edges carry the children's
 * function tags as labels, secondary edges as `secedge`. Works for
 * discontinuous trees and bracketed ones alike. Ids read from a file are
 * kept when every node has one and none repeats; otherwise they are made
 * from `ordinal` (`s3_1`, `s3_p1`). What the encoding has no place for rides
 * in attributes of ours (see xml-graph-names): empty elements and notes as
 * terminals with `kind`, the outer wrapper bracket as a nonterminal with
 * `kind="wrapper"`, coindex and gapping index as `coindex` and `gapindex`.
 */
export function writeXmlSentence(tree: Tree, ordinal: number): string {
  const numbered = numberTerminals(tree);
  const terminals = terminalsInOrder(numbered);
  const phrases: ConstituentNode[] = [];
  const collect = (node: ConstituentNode) => {
    if (node.type !== 'phrase') return;
    phrases.push(node);
    node.children.forEach(collect);
  };
  numbered.children.forEach(collect);
  const ids = idsFor(terminals, phrases, ordinal);

  const secondary = new Map<ConstituentNode, ElementObject[]>();
  for (const edge of numbered.secondaryEdges ?? []) {
    const list = secondary.get(edge.from) ?? [];
    list.push({ $: attributes([['label', edge.label], ['idref', ids.get(edge.to)!]]) });
    secondary.set(edge.from, list);
  }
  const withSecondary = (element: ElementObject, node: ConstituentNode) => {
    const edges = secondary.get(node);
    if (edges) element.secedge = edges;
    return element;
  };

  const nonterminals: ElementObject[] = phrases.map((node) => {
    const phrase = node as Extract<ConstituentNode, { type: 'phrase' }>;
    const pairs: Array<[string, string]> = [['id', ids.get(phrase)!], ['cat', phrase.label.category || '']];
    if (phrase.label.coindex !== undefined) pairs.push(['coindex', String(phrase.label.coindex)]);
    if (phrase.label.gapIndex !== undefined) pairs.push(['gapindex', String(phrase.label.gapIndex)]);
    for (const entry of phrase.attributes ?? []) pairs.push(entry);
    const element: ElementObject = { $: attributes(pairs), edge: phrase.children.map((child) => edgeTo(child, ids)) };
    return withSecondary(element, phrase);
  });
  let root: string;
  const wrapped = numbered.wrapper !== undefined || numbered.children.length !== 1;
  if (wrapped) {
    root = `s${ordinal}_root`;
    nonterminals.unshift({
      $: attributes([['id', root], ['cat', numbered.wrapper?.label ?? ''], [KIND, WRAPPER]]),
      edge: numbered.children.map((child) => edgeTo(child, ids)),
    });
  } else root = ids.get(numbered.children[0]!)!;

  const sentence: ElementObject = {
    $: attributes([['id', numbered.id ?? `s${ordinal}`], ...(numbered.attributes ?? [])]),
    graph: {
      $: attributes([['root', root]]),
      terminals: terminals.length > 0 ? { t: terminals.map((terminal) => withSecondary(terminalElement(terminal, ids), terminal)) } : '',
      nonterminals: nonterminals.length > 0 ? { nt: nonterminals } : '',
    },
  };
  return builder.buildObject({ s: sentence }) + '\n';
}

function edgeTo(child: ConstituentNode, ids: Map<ConstituentNode, string>): ElementObject {
  let functions: readonly string[] = [];
  if (child.type === 'phrase') functions = child.label.functions;
  else if (child.type === 'preterminal') functions = child.functions ?? [];
  return { $: attributes([['label', functions.length > 0 ? functions.join('-') : ABSENT], ['idref', ids.get(child)!]]) };
}

function terminalElement(terminal: Terminal, ids: Map<ConstituentNode, string>): ElementObject {
  const id = ids.get(terminal)!;
  switch (terminal.type) {
    case 'preterminal': {
      const pairs: Array<[string, string]> = [['id', id], ['word', terminal.word.form]];
      if (terminal.word.lemma !== undefined) pairs.push(['lemma', terminal.word.lemma]);
      pairs.push(['pos', terminal.pos]);
      for (const entry of terminal.attributes ?? []) pairs.push(entry);
      return { $: attributes(pairs) };
    }
    case 'empty':
      return { $: attributes([['id', id], ['word', terminal.text], ['pos', formatLabel(terminal.label)], [KIND, 'empty']]) };
    case 'meta': {
      const text = terminal.text ?? terminal.children.map(writeNode).join(' ');
      return { $: attributes([['id', id], ['word', text], ['pos', terminal.label], [KIND, 'note']]) };
    }
  }
}

/** The ids read from the file when they are complete and unique, else ids made from the sentence's ordinal. */
function idsFor(terminals: Terminal[], phrases: ConstituentNode[], ordinal: number): Map<ConstituentNode, string> {
  const ids = new Map<ConstituentNode, string>();
  const seen = new Set<string>();
  let complete = true;
  for (const node of [...terminals, ...phrases]) {
    const id = node.type === 'phrase' || node.type === 'preterminal' || node.type === 'empty' || node.type === 'meta' ? node.xmlId : undefined;
    if (id === undefined || seen.has(id) || id === `s${ordinal}_root`) {
      complete = false;
      break;
    }
    seen.add(id);
    ids.set(node, id);
  }
  if (complete) return ids;
  ids.clear();
  terminals.forEach((terminal, i) => ids.set(terminal, `s${ordinal}_${i + 1}`));
  phrases.forEach((phrase, i) => ids.set(phrase, `s${ordinal}_p${i + 1}`));
  return ids;
}

/**
 * An attribute object whose keys are own properties even when a name is
 * `__proto__`: assignment would set the object's prototype instead.
 */
function attributes(pairs: Iterable<[string, string]>): Record<string, string> {
  const object: Record<string, string> = {};
  for (const [name, value] of pairs) Object.defineProperty(object, name, { value, enumerable: true, writable: true, configurable: true });
  return object;
}
