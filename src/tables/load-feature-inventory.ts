import type { Diagnostic } from '../diagnostics/diagnostic.js';
import { diagnoseLine, lineOffsets } from '../diagnostics/diagnostic.js';
import { readTableText, requireTable, TableError } from './table-source.js';

/** Features and their values; a feature with no values listed admits any value. */
export type FeatureInventory = Map<string, Set<string> | undefined>;

/**
 * Reads a feature inventory (`headrules/NAME.features`, by shipped name or
 * path): one feature per line, its name and then its values; `#` lines are
 * comments. Layered features (`Number[psor]`) are checked by their plain name.
 */
export function loadFeatureInventory(nameOrPath: string, into: FeatureInventory = new Map()): FeatureInventory {
  const path = requireTable(nameOrPath, 'features');
  const problems: Diagnostic[] = [];
  const lines = readTableText(path, 'features').split('\n');
  const offsets = lineOffsets(lines);
  lines.forEach((raw, i) => {
    const line = raw.replace(/\r$/, '');
    if (/^\s*(#|$)/.test(line)) return;
    const [name, ...values] = line.trim().split(/\s+/);
    if (!/^[A-Z][A-Za-z0-9]*$/.test(name!)) {
      const column = line.indexOf(name!) + 1;
      problems.push(diagnoseLine('table-invalid', `"${name}" is not a feature name (capitalised letters and digits)`, { file: path, text: line, line: i + 1, lineOffset: offsets[i]!, column }));
      return;
    }
    if (values.length === 0) into.set(name!, undefined);
    else {
      const known = into.get(name!) ?? new Set<string>();
      for (const value of values) known.add(value);
      into.set(name!, known);
    }
  });
  if (problems.length > 0) throw new TableError(problems);
  return into;
}

/** Why a feature is not in an inventory, or undefined when it is. */
export function featureProblem(inventory: FeatureInventory, name: string, value: string): string | undefined {
  const plain = name.replace(/\[[a-z0-9]+\]$/, '');
  if (!inventory.has(plain)) return `feature ${name} is not one of the declared features`;
  const values = inventory.get(plain);
  const unknown = value.split(',').find((v) => values !== undefined && !values.has(v));
  return unknown === undefined ? undefined : `${unknown} is not a declared value of ${plain}`;
}
