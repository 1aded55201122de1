import type { ConstituentNode, Phrase, Tree } from '../../model/constituency.js';
import { nodesTopDown } from '../../model/traverse.js';
import { formatLabel } from '../../model/label.js';
import { numberTerminals, terminalsInOrder, type Terminal } from '../../model/terminal-order.js';
import { writeNode } from '../bracketed/write-bracketed.js';
import { ABSENT, KIND, NOTE, NOTE_BRACKETS, WRAPPER, EMPTY, EMPTY_POS, WORD } from './xml-graph-names.js';

/** An element to write: its name, attributes in written order, and child elements. */
interface Element {
  name: string;
  attributes: Array<[string, string]>;
  children?: Element[];
}

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
 *
 * Throws when a string holds a character XML 1.0 cannot carry (most control
 * characters); callers report the tree.
 */
export function writeXmlSentence(tree: Tree, ordinal: number): string {
  const numbered = numberTerminals(tree);
  const terminals = terminalsInOrder(numbered);
  const phrases = nodesTopDown(numbered.children).filter((node): node is Phrase => node.type === 'phrase');
  const ids = idsFor(terminals, phrases, ordinal);

  const secondary = new Map<ConstituentNode, Element[]>();
  for (const edge of numbered.secondaryEdges ?? []) {
    const list = secondary.get(edge.from) ?? [];
    list.push({ name: 'secedge', attributes: [['label', edge.label], ['idref', ids.get(edge.to)!]] });
    secondary.set(edge.from, list);
  }
  const secondaryOf = (node: ConstituentNode) => secondary.get(node) ?? [];

  const nonterminals: Element[] = phrases.map((phrase) => {
    const attributes: Array<[string, string]> = [['id', ids.get(phrase)!], ['cat', phrase.label.category]];
    if (phrase.label.coindex !== undefined) attributes.push(['coindex', String(phrase.label.coindex)]);
    if (phrase.label.gapIndex !== undefined) attributes.push(['gapindex', String(phrase.label.gapIndex)]);
    attributes.push(...(phrase.attributes ?? []));
    return { name: 'nt', attributes, children: [...phrase.children.map((child) => edgeTo(child, ids)), ...secondaryOf(phrase)] };
  });
  let root: string;
  if (numbered.wrapper !== undefined || numbered.children.length !== 1) {
    root = `s${ordinal}_root`;
    nonterminals.unshift({
      name: 'nt',
      attributes: [['id', root], ['cat', numbered.wrapper?.label ?? ''], [KIND, WRAPPER]],
      children: numbered.children.map((child) => edgeTo(child, ids)),
    });
  } else root = ids.get(numbered.children[0]!)!;

  const sentence: Element = {
    name: 's',
    // A tree without an identifier gets none here either, so that it reads back as it was.
    attributes: [...(numbered.id === undefined ? [] : [['id', numbered.id] as [string, string]]), ...(numbered.attributes ?? [])],
    children: [
      {
        name: 'graph',
        attributes: [['root', root], ...(numbered.graphAttributes ?? [])],
        children: [
          { name: 'terminals', attributes: [], children: terminals.map((terminal) => ({ ...terminalElement(terminal, ids), children: secondaryOf(terminal) })) },
          { name: 'nonterminals', attributes: [], children: nonterminals },
        ],
      },
    ],
  };
  const lines: string[] = [];
  serialize(sentence, '', lines);
  return lines.join('\n') + '\n';
}

function edgeTo(child: ConstituentNode, ids: Map<ConstituentNode, string>): Element {
  let functions: readonly string[] = [];
  if (child.type === 'phrase') functions = child.label.functions;
  else if (child.type === 'preterminal') functions = child.functions ?? [];
  return { name: 'edge', attributes: [['label', functions.length > 0 ? functions.join('-') : ABSENT], ['idref', ids.get(child)!]] };
}

function terminalElement(terminal: Terminal, ids: Map<ConstituentNode, string>): Element {
  const id = ids.get(terminal)!;
  switch (terminal.type) {
    case 'preterminal': {
      const attributes: Array<[string, string]> = [['id', id], ['word', terminal.word.form]];
      if (terminal.word.lemma !== undefined) attributes.push(['lemma', terminal.word.lemma]);
      attributes.push(['pos', terminal.pos], ...(terminal.attributes ?? []));
      // A word tagged -NONE- says that it is a word, or it would read back as an empty element.
      if (terminal.pos === EMPTY_POS) attributes.push([KIND, WORD]);
      return { name: 't', attributes };
    }
    case 'empty':
      return { name: 't', attributes: [['id', id], ['word', terminal.text], ['pos', formatLabel(terminal.label)], [KIND, EMPTY]] };
    case 'meta':
      // A note that holds brackets keeps them as bracketed text, read back by the bracketed reader.
      if (terminal.children.length > 0) {
        return { name: 't', attributes: [['id', id], ['word', terminal.children.map(writeNode).join(' ')], ['pos', terminal.label], [KIND, NOTE_BRACKETS]] };
      }
      return { name: 't', attributes: [['id', id], ['word', terminal.text ?? ''], ['pos', terminal.label], [KIND, NOTE]] };
  }
}

/** The ids read from the file when they are complete and unique, else ids made from the sentence's ordinal. */
function idsFor(terminals: Terminal[], phrases: Phrase[], ordinal: number): Map<ConstituentNode, string> {
  const ids = new Map<ConstituentNode, string>();
  const seen = new Set<string>([`s${ordinal}_root`]);
  for (const node of [...terminals, ...phrases]) {
    const id = node.xmlId;
    if (id === undefined || seen.has(id)) {
      ids.clear();
      terminals.forEach((terminal, i) => ids.set(terminal, `s${ordinal}_${i + 1}`));
      phrases.forEach((phrase, i) => ids.set(phrase, `s${ordinal}_p${i + 1}`));
      return ids;
    }
    seen.add(id);
    ids.set(node, id);
  }
  return ids;
}

/**
 * Writes an element, two spaces deeper per level. Written here rather than
 * through xml2js's builder: the builder keeps attributes in a plain object,
 * where an attribute named `__proto__` (which a file may hold) vanishes.
 */
function serialize(element: Element, indent: string, lines: string[]): void {
  let open = `${indent}<${element.name}`;
  for (const [name, value] of element.attributes) open += ` ${name}="${escapeAttribute(value)}"`;
  const children = element.children ?? [];
  if (children.length === 0) {
    lines.push(open + '/>');
    return;
  }
  lines.push(open + '>');
  for (const child of children) serialize(child, indent + '  ', lines);
  lines.push(`${indent}</${element.name}>`);
}

/** Characters XML 1.0 cannot carry at all (Extensible Markup Language 1.0, §2.2 Char). */
const FORBIDDEN = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Escapes an attribute value; tab, line feed and carriage return as character references, so that attribute-value normalisation keeps them. */
function escapeAttribute(value: string): string {
  const forbidden = FORBIDDEN.exec(value);
  if (forbidden) throw new Error(`U+${forbidden[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')} cannot be written in XML`);
  if (!/[&<>"\t\n\r]/.test(value)) return value;
  return value
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/\t/g, '&#9;')
    .replace(/\n/g, '&#10;')
    .replace(/\r/g, '&#13;');
}
