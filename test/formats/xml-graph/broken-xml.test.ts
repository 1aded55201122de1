// Malicious and broken XML: each gives a clear error with code and position and
// no side effect. The encoding's well-formedness rules are those of Extensible
// Markup Language 1.0 (W3C); the entity-expansion attack is the one known as
// "billion laughs" (common practice to test).
import { describe, expect, it } from 'vitest';
import type { Diagnostic } from '../../../src/diagnostics/diagnostic.js';
import { readXmlGraphText, type XmlReadOptions } from '../../../src/formats/xml-graph/read-xml-graph.js';

const good = (id: string) =>
  `<s id="${id}"><graph root="${id}_p"><terminals><t id="${id}_1" word="Gulls" pos="NNS"/><t id="${id}_2" word="circled" pos="VBD"/></terminals>` +
  `<nonterminals><nt id="${id}_p" cat="S"><edge label="SBJ" idref="${id}_1"/><edge label="--" idref="${id}_2"/></nt></nonterminals></graph></s>\n`;

const document = (...sentences: string[]) => `<?xml version="1.0"?>\n<corpus><body>\n${sentences.join('')}</body></corpus>\n`;

function read(text: string, options: XmlReadOptions = {}) {
  const problems: Diagnostic[] = [];
  const prototypeKeys = Object.getOwnPropertyNames(Object.prototype).sort();
  const trees = readXmlGraphText(text, { file: 'bad.xml', ...options }, (d) => problems.push(d));
  // No side effect: nothing was added to the prototypes every object shares.
  expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeKeys);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  return { ids: trees.map((t) => t.id), problems: problems.map((p) => `${p.code} ${p.line}:${p.column}`), messages: problems.map((p) => `${p.message} | ${(p.notes ?? []).join(' | ')}`) };
}

describe('hostile XML', () => {
  it('refuses an entity expansion attempt declared in a DTD, before expanding anything', () => {
    const lol = '<!DOCTYPE corpus [\n<!ENTITY lol "lol">\n<!ENTITY lol2 "&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;">\n<!ENTITY lol3 "&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;">\n]>\n';
    const result = read(`<?xml version="1.0"?>\n${lol}<corpus><body>${good('a').replace('Gulls', '&lol3;')}</body></corpus>`);
    expect(result.problems).toEqual(['xml-doctype 2:1']);
    expect(result.ids).toEqual([]);
    expect(result.messages[0]).toMatch(/reads no DTD and expands no entity/);
  });

  it('refuses an external DTD without fetching it', () => {
    const result = read(`<?xml version="1.0"?>\n<!DOCTYPE corpus SYSTEM "file:///etc/passwd">\n<corpus><body>${good('a')}</body></corpus>`);
    expect(result.problems).toEqual(['xml-doctype 2:1']);
  });

  it('does not expand an undeclared entity, and says which ones it does expand', () => {
    const result = read(document(good('a'), good('b').replace('Gulls', '&xxe;')));
    expect(result.ids).toEqual(['a']);
    expect(result.problems).toEqual(['xml-malformed 4:58']);
    expect(result.messages[0]).toMatch(/&lt; &gt; &amp; &quot; &apos;/);
    expect(result.messages[0]).toMatch(/in sentence b; the rest of the file is not read/);
  });

  it('keeps attributes named __proto__ and constructor as data, and says so', () => {
    const result = read(document(good('a').replace('pos="NNS"', 'pos="NNS" __proto__="polluted" constructor="x"')));
    expect(result.problems).toEqual(['xml-object-name 3:40', 'xml-object-name 3:40']);
    expect(result.messages[0]).toMatch(/attribute __proto__ of <t> is kept as plain data/);
    expect(result.ids).toEqual(['a']);
  });

  it('stops at a file that nests elements past the limit', () => {
    const deep = '<x>'.repeat(100) + '</x>'.repeat(100);
    const result = read(`<corpus>${deep}</corpus>`);
    // The 64th <x> is the 65th element open: 8 + 63 × 3 characters in.
    expect(result.problems).toEqual(['xml-too-deep 1:198']);
  });

  it('stops at a sentence longer than the limit instead of holding it', () => {
    const long = good('b').replace('Gulls', 'G'.repeat(5000));
    const result = read(document(good('a'), long), { limits: { maxSentenceLength: 1000 } });
    expect(result.ids).toEqual(['a']);
    expect(result.problems).toEqual(['xml-too-large 4:1']);
  });

  it('refuses an attribute given twice', () => {
    const result = read(document(good('a').replace('pos="NNS"', 'pos="NNS" pos="VB"')));
    expect(result.problems).toEqual(['xml-malformed 3:40']);
    expect(result.messages[0]).toMatch(/attribute pos is given twice in <t>/);
  });
});

describe('broken XML and broken graphs', () => {
  it('reports an unclosed tag at the end of the file, after reading the sentences before it', () => {
    const result = read(`<corpus><body>\n${good('a')}<s id="b"><graph root="b_1"><terminals><t id="b_1" word="x" pos="N"/>\n`);
    expect(result.ids).toEqual(['a']);
    expect(result.problems).toHaveLength(1);
    expect(result.problems[0]).toMatch(/^xml-malformed 3:/);
  });

  it('reports a mismatched closing tag', () => {
    const result = read(document(good('a').replace('</terminals>', '</terminal>')));
    expect(result.problems).toEqual(['xml-malformed 3:114']);
    expect(result.ids).toEqual([]);
  });

  it('names the sentence and the element a broken piece of XML stands in', () => {
    const result = read(document(good('a').replace('<edge label="--" idref="a_2"/>', '<edge label="--" idref="a_2"/> < ')));
    // The stray '<' stands at column 223, after the second edge (columns 192–221) and a space.
    expect(result.problems).toEqual(['xml-malformed 3:223']);
    expect(result.messages[0]).toMatch(/in sentence a, element <nt id="a_p">; the rest of the file is not read/);
  });

  it('reports a dangling idref with the sentence and element, and reads the next sentence', () => {
    const result = read(document(good('a').replace('idref="a_2"', 'idref="a_9"'), good('b')));
    expect(result.ids).toEqual(['b']);
    expect(result.problems).toEqual(['graph-dangling-idref 3:192']);
    expect(result.messages[0]).toMatch(/sentence a: <edge> in a_p points to "a_9"/);
  });

  it('reports a cycle', () => {
    const cyclic =
      '<s id="c"><graph root="c_r"><terminals><t id="c_1" word="x" pos="N"/></terminals><nonterminals>' +
      '<nt id="c_r" cat="S"><edge label="--" idref="c_1"/></nt>' +
      '<nt id="c_a" cat="NP"><edge label="--" idref="c_b"/></nt><nt id="c_b" cat="NP"><edge label="--" idref="c_a"/></nt>' +
      '</nonterminals></graph></s>\n';
    const result = read(document(cyclic, good('b')));
    expect(result.ids).toEqual(['b']);
    expect(result.problems).toEqual(['graph-cycle 3:152']);
  });

  it('reports a node with two parents, a repeated id and a missing root', () => {
    const twoParents = good('a').replace('<edge label="--" idref="a_2"/>', '<edge label="--" idref="a_2"/><edge label="--" idref="a_1"/>');
    const repeated = good('b').replace('id="b_2"', 'id="b_1"');
    const rootless = good('c').replace(' root="c_p"', '');
    const result = read(document(twoParents, repeated, rootless, good('d')));
    expect(result.ids).toEqual(['d']);
    expect(result.problems.map((p) => p.split(' ')[0])).toEqual(['graph-several-parents', 'graph-duplicate-id', 'graph-dangling-idref', 'graph-no-root']);
  });

  it('warns about text and CDATA inside a sentence, which the encoding does not have', () => {
    const result = read(document(good('a').replace('<graph', 'stray<![CDATA[more]]><graph')));
    expect(result.ids).toEqual(['a']);
    expect(result.problems.map((p) => p.split(' ')[0])).toEqual(['xml-unexpected-content', 'xml-unexpected-content']);
  });

  it('hangs a terminal that no edge reaches under the root, with a warning', () => {
    const loose = good('a').replace('</terminals>', '<t id="a_3" word="." pos="."/></terminals>');
    const result = read(document(loose));
    expect(result.ids).toEqual(['a']);
    expect(result.problems).toEqual(['graph-unattached 3:114']);
  });
});

describe('graphs too deep for the passes that walk them', () => {
  it('refuses a chain of nonterminals deeper than 2,000 levels, without exhausting the stack', () => {
    const n = 2100;
    const nts = Array.from({ length: n }, (_, i) => `<nt id="n${i}" cat="X"><edge label="--" idref="${i + 1 < n ? `n${i + 1}` : 't'}"/></nt>`).join('');
    const result = read(document(`<s id="deep"><graph root="n0"><terminals><t id="t" word="x" pos="N"/></terminals><nonterminals>${nts}</nonterminals></graph></s>\n`, good('b')));
    expect(result.ids).toEqual(['b']);
    expect(result.problems).toHaveLength(1);
    expect(result.problems[0]).toMatch(/^xml-too-deep 3:\d+$/);
  });
});
