import type { Report } from '../diagnostics/diagnostic.js';
import { convertTree, type ConversionSettings } from '../convert/convert-tree.js';
import { headVector } from '../analysis/heads.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import type { Candidate } from '../tables/label-pattern.js';
import type { LabelContext } from '../tables/table-model.js';
import { emptyTally, pairWithGold, type PairingTally } from './pair-with-gold.js';

/**
 * One attachment of the training data, as label rules see it: the keys a
 * learned rule can test, and the gold relation.
 */
interface LabelSample {
  /** The dependent's exact label as a pattern: `NP-SBJ`, `NP-` (no function tags), `DT-`. */
  dependent: string;
  parent: string;
  head: string;
  side: 'left' | 'right';
  role: LabelContext['role'];
  relation: string;
}

/** A learned label rule: a relation for the attachments meeting every condition, with its support. */
export interface LearnedLabelRule {
  relation: string;
  conditions: Array<[key: 'role' | 'dependent' | 'parent' | 'head' | 'side', value: string]>;
  /** Attachments the rule decides in the training data, and how many of them it decides rightly. */
  decided: number;
  right: number;
}

/** A learned label table: rules tried in order, the relation when none applies, and the training figures. */
export interface LearnedLabels {
  rules: LearnedLabelRule[];
  otherwise: string;
  /** Attachments learned from (words whose converted head is the gold head), and those the table labels rightly. */
  attachments: number;
  right: number;
  sentences: number;
}

/**
 * The label of a candidate as an exact pattern: its category with its function
 * tags, or `X-` without any (a category such as `-LRB-`, with hyphens of its
 * own, stands as it is).
 */
function exactLabel(candidate: Candidate): string {
  if (candidate.functions.length > 0) return [candidate.category, ...candidate.functions].join('-');
  return candidate.category.includes('-') ? candidate.category : `${candidate.category}-`;
}

/**
 * Converts trees paired with gold sentences (as heads score pairs them) and
 * collects, for every word whose converted head is its gold head, what label
 * rules see of its attachment and its gold relation.
 */
export async function collectLabelSamples(
  trees: AsyncIterable<Tree>,
  gold: AsyncIterable<DependencySentence>,
  settings: ConversionSettings,
  report: Report = () => undefined,
  tally: PairingTally = emptyTally(),
  unscored?: (word: DependencyWord) => boolean,
): Promise<{ samples: LabelSample[]; sentences: number }> {
  const samples: LabelSample[] = [];
  let sentences = 0;
  for await (const pair of pairWithGold(trees, gold, settings.traces, report, tally, unscored)) {
    const conversion = convertTree(pair.tree, settings, pair.id, pair.id);
    const heads = headVector(pair.gold);
    if (!conversion || !heads) continue;
    sentences++;
    const goldWords = pair.gold.lines.filter((l): l is DependencyWord => l.type === 'word');
    const ours = conversion.sentence.lines.filter((l): l is DependencyWord => l.type === 'word');
    conversion.words.forEach((word, i) => {
      const context = conversion.contexts[i];
      const goldWord = goldWords[i];
      if (!context || !goldWord || unscored?.(goldWord)) return;
      if (Number(ours[i]?.head) !== heads[word.index]) return;
      const sample: LabelSample = {
        dependent: exactLabel(context.dependent),
        parent: context.parent.category,
        head: context.head.category,
        side: context.side,
        role: context.role,
        relation: goldWord.deprel,
      };
      // Labels a condition cannot hold (commas, brackets, spaces) are left to the role rules and `otherwise`.
      if ([sample.dependent, sample.parent, sample.head].some((value) => /[\s,[\]=*]/.test(value))) sample.dependent = '';
      samples.push(sample);
    });
  }
  return { samples, sentences };
}

/** The commonest relation among samples, and how many have it. */
function majority(samples: readonly LabelSample[]): { relation: string; count: number } {
  const counts = new Map<string, number>();
  for (const sample of samples) counts.set(sample.relation, (counts.get(sample.relation) ?? 0) + 1);
  let best = { relation: 'dep', count: 0 };
  for (const [relation, count] of counts) if (count > best.count || (count === best.count && relation < best.relation)) best = { relation, count };
  return best;
}

function groupBy<K extends string>(samples: readonly LabelSample[], key: (sample: LabelSample) => K): Map<K, LabelSample[]> {
  const groups = new Map<K, LabelSample[]>();
  for (const sample of samples) {
    const k = key(sample);
    const list = groups.get(k);
    if (list) list.push(sample);
    else groups.set(k, [sample]);
  }
  return groups;
}

/**
 * Learns a label table from attachments with gold relations: for the parts
 * of coordination and punctuation (role) the commonest relation; then, for
 * every dependent label, its commonest relation, refined where the data shows
 * a clear difference by the phrase it attaches in and its side of the head,
 * and then by the head's category. A refinement is written only when its
 * relation differs from the one above it and decides at least `support`
 * attachments better. Rules are written most specific first, so the first
 * that applies is the right one.
 */
export function learnLabels(samples: readonly LabelSample[], sentences: number, support = 5): LearnedLabels {
  const rules: LearnedLabelRule[] = [];
  const overall = majority(samples);
  const general: LearnedLabelRule[] = [];
  const specific: LearnedLabelRule[] = [];
  const byRole = groupBy(samples, (s) => s.role);
  for (const [role, group] of byRole) {
    if (role === 'other' || role === 'raised') continue;
    const top = majority(group);
    if (top.count >= support) rules.push({ relation: top.relation, conditions: [['role', role]], decided: group.length, right: top.count });
  }
  const ruled = new Set(rules.map((rule) => rule.conditions[0]![1]));
  const rest = samples.filter((s) => !ruled.has(s.role));
  for (const [dependent, group] of groupBy(rest, (s) => s.dependent)) {
    if (dependent === '') continue;
    const top = majority(group);
    const base: LearnedLabelRule = { relation: top.relation, conditions: [['dependent', dependent]], decided: group.length, right: top.count };
    for (const [where, inner] of groupBy(group, (s) => `${s.parent}\t${s.side}`)) {
      const [parent, side] = where.split('\t') as [string, string];
      const innerTop = majority(inner);
      const above = inner.filter((s) => s.relation === top.relation).length;
      let refined: LearnedLabelRule | undefined;
      if (innerTop.relation !== top.relation && innerTop.count - above >= support) {
        refined = { relation: innerTop.relation, conditions: [['dependent', dependent], ['parent', parent], ['side', side]], decided: inner.length, right: innerTop.count };
      }
      const relationHere = refined?.relation ?? top.relation;
      for (const [head, innermost] of groupBy(inner, (s) => s.head)) {
        const headTop = majority(innermost);
        const aboveHere = innermost.filter((s) => s.relation === relationHere).length;
        if (headTop.relation !== relationHere && headTop.count - aboveHere >= support) {
          specific.push({
            relation: headTop.relation,
            conditions: [['dependent', dependent], ['parent', parent], ['side', side], ['head', head]],
            decided: innermost.length,
            right: headTop.count,
          });
        }
      }
      if (refined) general.push(refined);
    }
    // Without a rule of its own, a dependent takes `otherwise`: one is written only where it does better.
    if (top.relation !== overall.relation && top.count - group.filter((s) => s.relation === overall.relation).length >= 2) rules.push(base);
  }
  // Most specific first: head-refined rules, then phrase-and-side ones, then one per dependent label.
  const ordered = [...rules.filter((r) => r.conditions[0]![0] === 'role'), ...specific, ...general, ...rules.filter((r) => r.conditions[0]![0] !== 'role')];
  const table: LearnedLabels = { rules: ordered, otherwise: overall.relation, attachments: samples.length, right: 0, sentences };
  table.right = samples.filter((s) => labelOf(table, s) === s.relation).length;
  return table;
}

/** The relation a learned table gives a sample: its first rule whose conditions all hold. */
function labelOf(table: LearnedLabels, sample: LabelSample): string {
  for (const rule of table.rules) if (rule.conditions.every(([key, value]) => sample[key] === value)) return rule.relation;
  return table.otherwise;
}

/** Writes a learned label table in the table language, each rule with its support as a comment. */
export function writeLearnedLabels(name: string, table: LearnedLabels): string {
  const share = (n: number, of: number) => `${n.toLocaleString('en-US')} of ${of.toLocaleString('en-US')}`;
  const lines = [
    `# ${name}: a label table suggested by treebridge heads suggest --labels from ${table.sentences.toLocaleString('en-US')} sentences`,
    `# with gold dependencies: ${share(table.right, table.attachments)} attachments with the gold head get the gold relation.`,
    '# Rules are tried in order; the first whose conditions all hold gives the relation. Each comment',
    '# gives how many attachments of the data the rule decides, and how many of them rightly.',
    '# Review and edit it like any table.',
    '',
    `table ${name}`,
    '',
  ];
  for (const rule of table.rules) {
    lines.push(`# ${share(rule.right, rule.decided)}`);
    lines.push(`label ${rule.relation} ${rule.conditions.map(([key, value]) => `${key}=${value}`).join(' ')}`);
  }
  lines.push('', `otherwise ${table.otherwise}`, '');
  return lines.join('\n');
}
