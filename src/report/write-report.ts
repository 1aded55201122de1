import type { RoundTripReport, RoundTripSample } from '../evaluate/roundtrip.js';
import { lossKinds } from '../evaluate/roundtrip.js';
import { analyseTree } from '../analysis/structure.js';
import type { DependencySentence } from '../model/dependency.js';
import { drawBracketing, drawDependencies, escapeHtml } from './draw.js';

const STYLE = `
body { font: 14px/1.45 system-ui, sans-serif; margin: 2rem; color: #1f2933; background: #fbfaf7; }
h1 { font-size: 1.4rem; } h2 { font-size: 1.15rem; margin-top: 2.5rem; border-bottom: 2px solid #d9d4c7; }
table.summary { border-collapse: collapse; } table.summary td, table.summary th { padding: 0.2rem 0.8rem; border-bottom: 1px solid #e4e0d5; text-align: left; }
table.summary td.n { text-align: right; font-variant-numeric: tabular-nums; }
section.sentence { margin: 1.2rem 0 2rem; content-visibility: auto; contain-intrinsic-size: auto 320px; } .views { display: flex; gap: 1.5rem; flex-wrap: wrap; align-items: flex-end; }
figure { margin: 0; overflow-x: auto; max-width: 100%; } figcaption { font-size: 0.8rem; color: #6b6557; }
svg text { font: 11px ui-monospace, monospace; text-anchor: middle; fill: #1f2933; }
svg text.label { text-anchor: start; } svg text.tag { fill: #7a7466; font-size: 10px; } svg text.relation { fill: #44546a; font-size: 10px; }
rect.word { fill: #ffffff; stroke: #b8b2a3; } rect.bar { fill: #ece6d8; stroke: #8c7f62; }
rect.bar.lost { fill: #f6dcd6; stroke: #b03a2e; stroke-dasharray: 4 2; } rect.bar.added { fill: #d9efe0; stroke: #2f7d4f; stroke-dasharray: 2 2; }
path.arc { fill: none; stroke: #44546a; stroke-width: 1.2; } path.arc.crossing { stroke: #c46210; stroke-dasharray: 5 3; stroke-width: 1.6; } path.arc.changed { stroke: #b03a2e; stroke-width: 2; } path.tip { fill: #44546a; }
.legend span { display: inline-block; margin-right: 1rem; } .key { display: inline-block; width: 1.6em; height: 0.8em; margin-right: 0.3em; vertical-align: middle; border: 1px solid; }
`;

/**
 * The round-trip report as one self-contained HTML page (no outside assets):
 * the summary table, then per kind of loss up to `limit` sentences, each drawn
 * three times. Brackets direction: the original bracketing (lost brackets
 * marked), the dependency tree in between (arcs that cross dashed), the
 * bracketing that came back (added brackets marked). Dependencies direction:
 * the original sentence, the bracketing in between, and the sentence that came
 * back with changed arcs marked.
 */
export function writeReport(report: RoundTripReport, samples: RoundTripSample[], limit: number): string {
  const percent = (v: number) => `${(100 * v).toFixed(2)}%`;
  const share = (count: number) => (report.base ? ((100 * count) / report.base).toFixed(2) : '0.00');
  const scores = report.brackets
    ? `bracket F1 ${percent(report.brackets.f1)} (precision ${percent(report.brackets.precision)}, recall ${percent(report.brackets.recall)}), labelled F1 ${percent(report.brackets.labelledF1)}, crossing brackets ${report.brackets.crossing}`
    : `UAS ${percent(report.attachment!.uas)}, LAS ${percent(report.attachment!.las)}`;
  const rows = lossKinds
    .map((kind) => `<tr><td>${kind}</td><td class="n">${report.losses[kind]}</td><td class="n">${share(report.losses[kind])}</td><td>${report.examples[kind].map(escapeHtml).join(' ')}</td></tr>`)
    .join('');
  const sections = lossKinds
    .map((kind) => {
      const chosen = samples.filter((s) => s.kinds.includes(kind)).slice(0, limit);
      if (chosen.length === 0) return '';
      return `<h2 id="${kind}">${kind}: ${report.losses[kind]}</h2>` + chosen.map(drawSample).join('');
    })
    .join('');
  return (
    `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>treebridge round trip</title><style>${STYLE}</style></head><body>` +
    `<h1>Round trip: ${report.direction === 'brackets' ? 'brackets → dependencies → brackets' : 'dependencies → brackets → dependencies'}</h1>` +
    `<p>${report.sentences} sentences, ${report.exactMatch} back exactly; ${scores}.</p>` +
    `<table class="summary"><thead><tr><th>loss</th><th>count</th><th>per 100 ${report.direction === 'brackets' ? 'gold brackets' : 'words'}</th><th>examples</th></tr></thead><tbody>${rows}</tbody></table>` +
    `<p class="legend"><span><i class="key" style="background:#f6dcd6;border-color:#b03a2e"></i>bracket lost</span><span><i class="key" style="background:#d9efe0;border-color:#2f7d4f"></i>bracket added</span><span><i class="key" style="border-color:#c46210;border-style:dashed"></i>non-projective arc</span><span><i class="key" style="border-color:#b03a2e;border-width:2px"></i>arc changed on the way back</span></p>` +
    sections +
    `</body></html>\n`
  );
}

function drawSample(sample: RoundTripSample): string {
  const views =
    sample.direction === 'brackets'
      ? [
          figure(drawBracketing(sample.original, sample.lost, 'lost'), 'original'),
          figure(drawSentence(sample.dependencies, 'xpos'), 'dependencies'),
          figure(drawBracketing(sample.rebuilt, sample.added, 'added'), 'back'),
        ]
      : [
          figure(drawSentence(sample.original, 'upos'), 'original'),
          figure(drawBracketing(sample.rebuilt, new Set(), 'added'), 'bracketing'),
          figure(drawSentence(sample.back, 'upos', sample.changed), 'back'),
        ];
  return `<section class="sentence"><h3>${escapeHtml(sample.id)}</h3><div class="views">${views.join('')}</div></section>`;
}

function figure(svg: string, caption: string): string {
  return `<figure>${svg}<figcaption>${caption}</figcaption></figure>`;
}

/** The basic tree of a sentence (multiword tokens and empty nodes left out), arcs that cross dashed. */
function drawSentence(sentence: DependencySentence, tag: 'upos' | 'xpos', changed?: ReadonlySet<number>): string {
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
    changed,
  );
}
