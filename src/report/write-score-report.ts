import type { HeadSample } from '../evaluate/score-conversion.js';
import type { ConversionScore } from '../evaluate/score-conversion.js';
import type { PairingTally } from '../evaluate/pair-with-gold.js';
import { drawBracketing, escapeHtml } from './draw.js';
import { legend, page } from './legend.js';
import { anchorOf, drawSentence, figure, shownId } from './write-report.js';

/**
 * The tuning report of a head table as one self-contained HTML page (no
 * script, no outside asset): UAS, LAS and the oracle's UAS; wrong heads by the
 * phrase where words attach and by the table step that chose, each row
 * linking to its drawn examples; then sentences with wrong heads drawn evenly
 * from the whole input, each once with all its problems listed: the
 * bracketing with the phrases whose head the table chose wrongly marked, the
 * converted arcs with the wrong ones marked, and the gold arcs with the ones
 * the conversion missed marked, in one scroll area.
 */
export function writeScoreReport(score: ConversionScore, table: string, pairing: PairingTally): string {
  const { scorer, oracle, byParent, errors, samples } = score;
  const percent = (v: number) => `${(100 * v).toFixed(2)}%`;
  const link = (index: number) => `<a href="#${anchorOf(index)}">${shownId(samples[index]!.id)}</a>`;
  const drawnWhere = (test: (sample: HeadSample) => boolean) => {
    const drawn = samples.map((sample, index) => (test(sample) ? index : -1)).filter((index) => index >= 0);
    return drawn.length === 0 ? 'none among the drawn sentences' : drawn.slice(0, 8).map(link).join(' ');
  };
  const parentRows = byParent
    .filter((row) => row.errors > 0)
    .map(
      (row) =>
        `<tr id="phrase-${escapeHtml(row.category)}"><td>${escapeHtml(row.category)}</td><td class="n">${row.words}</td><td class="n">${row.errors}</td><td class="n">${((100 * row.errors) / row.words).toFixed(1)}%</td>` +
        `<td class="links">${drawnWhere((sample) => sample.errors.some((error) => error.parent === row.category))}</td></tr>`,
    )
    .join('');
  // Errors by the step that chose the head of the phrase where the word attaches, commonest first.
  const steps = new Map<string, { wrong: number; fixable: number }>();
  for (const error of errors) {
    const key = error.step ?? 'no step: coordination, or the first child when no step chose';
    const entry = steps.get(key) ?? { wrong: 0, fixable: 0 };
    entry.wrong++;
    if (error.oracleRight) entry.fixable++;
    steps.set(key, entry);
  }
  const stepRows = [...steps]
    .sort((a, b) => b[1].wrong - a[1].wrong)
    .slice(0, 40)
    .map(
      ([step, { wrong, fixable }]) =>
        `<tr><td class="step">${escapeHtml(step)}</td><td class="n">${wrong}</td><td class="n">${fixable}</td><td class="links">${drawnWhere((sample) => sample.errors.some((error) => (error.step ?? 'no step: coordination, or the first child when no step chose') === step))}</td></tr>`,
    )
    .join('');
  const contents = samples.map((sample, index) => `<li>${link(index)} <small>${sample.errors.length} wrong</small></li>`).join('');
  return page(
    `treebridge: ${escapeHtml(table)} against gold`,
    `<h1>Head table ${escapeHtml(table)} against gold dependencies</h1>` +
      `<p>${scorer.score.sentences} sentences, ${scorer.score.words} words scored (${pairing.paired} pairs; ${pairing.misaligned} misaligned and ${pairing.treesWithoutGold + pairing.goldWithoutTree} unpaired left out). ` +
      `UAS ${percent(scorer.uas)}, LAS ${percent(scorer.las)}; the oracle of head choice reaches UAS ${percent(oracle.uas)}.</p>` +
      `<nav class="contents"><a href="#by-phrase">wrong heads by phrase</a> · <a href="#by-step">by table step</a> · <a href="#examples">drawn sentences</a></nav>` +
      `<h2 id="by-phrase">Wrong heads by the phrase where the word attaches</h2>` +
      `<table class="summary"><thead><tr><th>phrase</th><th>words</th><th>wrong</th><th>share</th><th>drawn below</th></tr></thead><tbody>${parentRows}</tbody></table>` +
      `<h2 id="by-step">Wrong heads by the table step that chose</h2>` +
      `<p>"the oracle gets right": words a better choice in the same phrase would attach right.</p>` +
      `<table class="summary"><thead><tr><th>step</th><th>wrong</th><th>the oracle gets right</th><th>drawn below</th></tr></thead><tbody>${stepRows}</tbody></table>` +
      legend(['wrong', 'changed', 'missed', 'crossing']) +
      `<nav class="contents"><h2 id="examples">${samples.length} sentences with wrong heads, drawn evenly from the whole input</h2><ol>${contents}</ol></nav>` +
      samples.map(drawExample).join(''),
  );
}

function drawExample(sample: HeadSample, index: number): string {
  const problems = [
    ...sample.choices.map((choice) => `<li>${escapeHtml(choice.label)}: the table chose ${escapeHtml(choice.chosen)}, the gold head is under ${escapeHtml(choice.better)} <small>(${escapeHtml(choice.reason)})</small></li>`),
    ...sample.errors.map(
      (error) => `<li>word ${error.word} "${escapeHtml(error.form)}": head ${error.head}, gold ${error.goldHead} (${escapeHtml(error.goldRelation)}), attached in ${escapeHtml(error.parent)}${error.oracleRight ? '' : '; no head choice gets it right'}</li>`,
    ),
  ].join('');
  const wrongPhrases = new Map(sample.choices.map((choice) => [`${choice.start}:${choice.end}`, 'wrong']));
  const wrongArcs = new Map([...sample.wrong].map((word) => [word, 'changed']));
  const missedArcs = new Map([...sample.wrong].map((word) => [word, 'missed']));
  return (
    `<section class="sentence"><h3 id="${anchorOf(index)}">${shownId(sample.id)}</h3><ul class="problems">${problems}</ul>` +
    `<div class="views">` +
    figure(drawBracketing(sample.tree, wrongPhrases), 'bracketing') +
    figure(drawSentence(sample.converted, 'xpos', wrongArcs), 'converted') +
    figure(drawSentence(sample.gold, 'xpos', missedArcs), 'gold') +
    `</div></section>`
  );
}
