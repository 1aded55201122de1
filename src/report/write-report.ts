import type { BracketSample, DependencySample, RoundTripReport, RoundTripSample } from '../evaluate/roundtrip.js';
import { lossKinds } from '../evaluate/roundtrip.js';
import { analyseTree } from '../analysis/structure.js';
import type { DependencySentence } from '../model/dependency.js';
import { drawBracketing, drawDependencies, escapeHtml } from './draw.js';
import { legend, page } from './legend.js';

/** The anchor of a drawn sentence: its place among the drawn ones, as ids may hold any character. */
export const anchorOf = (index: number) => `s${index + 1}`;

/** A sentence's name as shown: without the folders of its file (`harbour.psd:12`), the whole name on hover. */
export function shownId(id: string): string {
  const short = id.replace(/^.*[/\\]/, '');
  return short === id ? escapeHtml(id) : `<span title="${escapeHtml(id)}">${escapeHtml(short)}</span>`;
}

/**
 * The round-trip report as one self-contained HTML page (no script, no
 * outside asset): the scores, the table of losses whose examples link to the
 * drawn sentences, a table of contents, then the sentences drawn evenly from
 * the whole input (the caller's sample), each once with every loss it has.
 * Brackets direction: the original bracketing (lost and relabelled brackets
 * marked, its empty elements listed), the dependency tree in between (arcs
 * that cross marked), the bracketing that came back (added brackets marked).
 * Dependencies direction: the original sentence, the bracketing in between,
 * the sentence that came back with changed arcs marked. The drawings of one
 * sentence share one scroll area.
 */
export function writeReport(report: RoundTripReport, samples: RoundTripSample[]): string {
  const percent = (v: number) => `${(100 * v).toFixed(2)}%`;
  const share = (count: number) => (report.base ? ((100 * count) / report.base).toFixed(2) : '0.00');
  const scores = report.brackets
    ? `bracket F1 ${percent(report.brackets.f1)} (precision ${percent(report.brackets.precision)}, recall ${percent(report.brackets.recall)}), labelled F1 ${percent(report.brackets.labelledF1)}, crossing brackets ${report.brackets.crossing}`
    : `UAS ${percent(report.attachment!.uas)}, LAS ${percent(report.attachment!.las)}`;
  const link = (index: number) => `<a href="#${anchorOf(index)}">${shownId(samples[index]!.id)}</a>`;
  const rows = lossKinds
    .map((kind) => {
      const drawn = samples.map((sample, index) => (sample.kinds.includes(kind) ? index : -1)).filter((index) => index >= 0);
      const examples = drawn.length === 0 ? (report.losses[kind] > 0 ? 'none among the drawn sentences' : '') : drawn.slice(0, 8).map(link).join(' ');
      return `<tr id="loss-${kind}"><td>${kind}</td><td class="n">${report.losses[kind]}</td><td class="n">${share(report.losses[kind])}</td><td>${examples}</td></tr>`;
    })
    .join('');
  const unit = report.direction === 'brackets' ? 'gold brackets' : 'words';
  const contents = samples.map((sample, index) => `<li>${link(index)} <small>${sample.kinds.join(', ')}</small></li>`).join('');
  const marks = report.direction === 'brackets' ? (['lost', 'empty', 'relabelled', 'added', 'crossing'] as const) : (['crossing', 'changed'] as const);
  return page(
    'treebridge round trip',
    `<h1>Round trip: ${report.direction === 'brackets' ? 'brackets → dependencies → brackets' : 'dependencies → brackets → dependencies'}</h1>` +
      `<p>${report.sentences} sentences, ${report.exactMatch} back exactly; ${scores}.</p>` +
      `<table class="summary"><thead><tr><th>loss</th><th>count</th><th>per 100 ${unit}</th><th>drawn below</th></tr></thead><tbody>${rows}</tbody></table>` +
      legend([...marks]) +
      `<nav class="contents"><h2 id="contents">${samples.length} sentences with losses, drawn evenly from the whole input</h2><ol>${contents}</ol></nav>` +
      samples.map((sample, index) => drawSample(sample, index)).join(''),
  );
}

function drawSample(sample: RoundTripSample, index: number): string {
  const header = `<h3 id="${anchorOf(index)}">${shownId(sample.id)}</h3><p>${sample.kinds.join(', ')}</p>`;
  return `<section class="sentence">${header}${sample.direction === 'brackets' ? bracketViews(sample) : dependencyViews(sample)}</section>`;
}

function bracketViews(sample: BracketSample): string {
  const original = new Map<string, string>([...[...sample.lost].map((span) => [span, 'lost'] as const), ...[...sample.relabelled].map((span) => [span, 'relabelled'] as const)]);
  const empties = sample.emptyElements.length === 0 ? '' : `<p class="labels">empty elements and traces, which no dependency tree holds: ${sample.emptyElements.map(escapeHtml).join(' · ')}</p>`;
  return (
    `<div class="views">` +
    figure(drawBracketing(sample.original, original, { empties: true }) + empties, 'original') +
    figure(drawSentence(sample.dependencies, 'xpos'), 'dependencies') +
    figure(drawBracketing(sample.rebuilt, new Map([...sample.added].map((span) => [span, 'added']))), 'back') +
    `</div>`
  );
}

function dependencyViews(sample: DependencySample): string {
  return (
    `<div class="views">` +
    figure(drawSentence(sample.original, 'upos'), 'original') +
    figure(drawBracketing(sample.rebuilt), 'bracketing') +
    figure(drawSentence(sample.back, 'upos', new Map([...sample.changed].map((word) => [word, 'changed']))), 'back') +
    `</div>`
  );
}

export function figure(drawing: string, caption: string): string {
  return `<figure>${drawing}<figcaption>${caption}</figcaption></figure>`;
}

/** The basic tree of a sentence (multiword tokens and empty nodes left out), arcs that cross marked. */
export function drawSentence(sentence: DependencySentence, tag: 'upos' | 'xpos', marked?: ReadonlyMap<number, string>): string {
  const words = sentence.lines.filter((l) => l.type === 'word');
  const heads = words.map((l) => Number(l.head));
  const crossing = new Set(analyseTree([0, ...heads]).nonProjectiveArcs.map((a) => a.dependent));
  return drawDependencies(
    words.map((l) => l.form),
    // Words rebuilt from brackets may carry only the bracketing's tag.
    words.map((l) => (l[tag] !== '_' ? l[tag] : l.upos !== '_' ? l.upos : l.xpos)),
    heads,
    words.map((l) => l.deprel),
    crossing,
    marked,
  );
}
