import { diagnose, type Report } from '../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../diagnostics/codes.js';
import type { ConstituentNode, Tree } from '../model/constituency.js';
import { formatLabel } from '../model/label.js';
import { nodesOf } from '../model/traverse.js';

/**
 * Checks that indices pair up within a tree (bracketing conventions, Bies et
 * al. 1995, from memory): a trace `*T*-n` and a gapped node `=n` need exactly
 * one node with coindex `-n`; a coindex nothing points to is suspicious.
 */
export function checkCoindexing(tree: Tree, report: Report): void {
  const antecedents = new Map<number, ConstituentNode[]>();
  const pointers = new Map<number, ConstituentNode[]>();
  const add = (map: Map<number, ConstituentNode[]>, index: number, node: ConstituentNode) => {
    const list = map.get(index);
    if (list) list.push(node);
    else map.set(index, [node]);
  };
  for (const node of nodesOf(tree)) {
    if (node.type !== 'phrase' && node.type !== 'empty') continue;
    if (node.label.coindex !== undefined) add(antecedents, node.label.coindex, node);
    if (node.label.gapIndex !== undefined) add(pointers, node.label.gapIndex, node);
    if (node.type === 'empty' && node.refIndex !== undefined) add(pointers, node.refIndex, node);
  }
  const warn = (code: DiagnosticCode, node: ConstituentNode, message: string, notes?: string[]) => {
    if (!tree.source || !node.position) return;
    report(diagnose(code, message, { file: tree.file ?? '-', offset: node.position.start, end: node.position.end, lines: tree.source }, notes));
  };
  const at = (node: ConstituentNode) => {
    const point = node.position && tree.source?.pointAt(node.position.start);
    return point ? `${point.line}:${point.column}` : 'a generated node';
  };
  const name = (node: ConstituentNode) =>
    node.type === 'empty' ? `(${formatLabel(node.label)} ${node.text})` : node.type === 'phrase' ? formatLabel(node.label) : node.type;

  for (const [index, nodes] of antecedents) {
    // An empty element may share its antecedent's coindex (`(NP-SBJ-1 *exp*)` … `(NP-1 …)`): that pair is a link, not a clash.
    const overt = nodes.filter((node) => node.type !== 'empty');
    if (overt.length > 1) {
      warn('duplicate-antecedent', overt[1]!, `coindex ${index} is carried by ${overt.length} nodes: ${overt.map(name).join(', ')}`, [
        `first carried by ${name(overt[0]!)} at ${at(overt[0]!)}`,
      ]);
    }
    if (nodes.length === 1 && !pointers.has(index)) {
      warn('unreferenced-coindex', nodes[0]!, `${name(nodes[0]!)} carries coindex ${index}, but no trace or gapping index points to it`);
    }
  }
  for (const [index, nodes] of pointers) {
    if (antecedents.has(index)) continue;
    for (const node of nodes) {
      if (node.type === 'empty') warn('trace-without-antecedent', node, `${name(node)} points to index ${index}, which no node carries`);
      else warn('gap-without-antecedent', node, `${name(node)} is gapped with index ${index}, which no node carries`);
    }
  }
}
