import { diagnose, type Report } from '../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../diagnostics/codes.js';
import type { DependencySentence, DependencyWord, EmptyNode } from '../model/dependency.js';
import { fieldColumn } from '../formats/conllu/conllu-line.js';
import { universalTags } from '../tables/load-pos-map.js';
import { featureProblem, type FeatureInventory } from '../tables/load-feature-inventory.js';

/**
 * What UD checks at the word level, beyond the format (UD v2; CHECK-VALUES
 * §6, §9): UPOS one of the 17 tags; every feature and value in the inventory
 * (a warning: treebanks declare their own with --features); every DEPS head a
 * word or empty node of the sentence, and never the word itself.
 */
export function checkWordColumns(sentence: DependencySentence, report: Report, features: FeatureInventory | undefined): void {
  if (!sentence.source) return;
  const ids = new Set<string>(['0']);
  for (const line of sentence.lines) if (line.type !== 'multiword') ids.add(line.id);
  // A problem covers `length` characters from `offsetInField` (one pair of FEATS or DEPS), else the whole column.
  const at = (line: DependencyWord | EmptyNode, field: number, offsetInField: number, code: DiagnosticCode, message: string, length?: number) => {
    if (!line.position) return;
    const fields = [line.id, line.form, line.lemma, line.upos, line.xpos, line.feats, line.head, line.deprel, line.deps, line.misc];
    const offset = line.position.start + fieldColumn(fields, field) - 1 + offsetInField;
    const end = offset + (length ?? fields[field]!.length - offsetInField);
    report(diagnose(code, message, { file: sentence.file ?? '-', offset, end, lines: sentence.source! }));
  };
  for (const line of sentence.lines) {
    if (line.type === 'multiword') continue;
    if (line.upos !== '_' && !universalTags.has(line.upos)) at(line, 3, 0, 'unknown-upos', `UPOS "${line.upos}" is not one of the 17 Universal POS tags`);
    if (features && line.feats !== '_') {
      let offset = 0;
      for (const pair of line.feats.split('|')) {
        const equals = pair.indexOf('=');
        const problem = equals > 0 ? featureProblem(features, pair.slice(0, equals), pair.slice(equals + 1)) : undefined;
        if (problem) at(line, 5, offset, 'unknown-feature', problem, pair.length);
        offset += pair.length + 1;
      }
    }
    if (line.deps !== '_') {
      let offset = 0;
      for (const pair of line.deps.split('|')) {
        const head = pair.slice(0, pair.indexOf(':'));
        // A head of the wrong shape is the reader's to report (deps-shape).
        if (!/^\d+(\.\d+)?$/.test(head)) {
          offset += pair.length + 1;
          continue;
        }
        if (head === line.id) at(line, 8, offset, 'deps-target', `DEPS of ${line.id} points at ${line.id} itself`, pair.length);
        else if (head !== '' && !ids.has(head)) at(line, 8, offset, 'deps-target', `DEPS head ${head} is no word or empty node of this sentence`, pair.length);
        offset += pair.length + 1;
      }
    }
  }
}
