/**
 * Drawings for the round-trip report, as SVG strings. A bracketing is drawn
 * as a span chart: each phrase a bar over exactly the words it spans, stacked
 * by depth above the row of words. A dependency tree is drawn as arcs above
 * the row of words, from each head to its dependent; arcs that cross are
 * dashed. Every corpus string is escaped.
 */
import type { ConstituentNode, Tree } from '../model/constituency.js';
import { nodesBottomUp } from '../model/traverse.js';
import { formatLabel } from '../model/label.js';

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

interface Box {
  x: number;
  width: number;
}

const CHAR = 7.2;
const GAP = 8;
const ROW = 22;
/** Width of one character of a phrase label (11px monospace). */
const LABEL_CHAR = 6.7;
/** Width of one character of a relation label (10px monospace). */
const RELATION_CHAR = 6.1;

/** Word boxes side by side, widths by text length. */
function layoutWords(words: string[]): { boxes: Box[]; width: number } {
  let x = 0;
  const boxes = words.map((word) => {
    const width = Math.max(28, word.length * CHAR + 12);
    const box = { x, width };
    x += width + GAP;
    return box;
  });
  return { boxes, width: Math.max(x - GAP, 1) };
}

function wordRow(words: string[], tags: string[], boxes: Box[], y: number, empties: ReadonlySet<number> = new Set()): string {
  return words
    .map((word, i) => {
      const { x, width } = boxes[i]!;
      return (
        `<rect class="${empties.has(i) ? 'word empty' : 'word'}" x="${x}" y="${y}" width="${width}" height="${ROW + 14}" rx="4"/>` +
        `<text class="form" x="${x + width / 2}" y="${y + 15}">${escapeHtml(word)}</text>` +
        `<text class="tag" x="${x + width / 2}" y="${y + 30}">${escapeHtml(tags[i] ?? '')}</text>`
      );
    })
    .join('');
}

/** A phrase to draw: its label, word span and level above the words. */
interface Bar {
  label: string;
  start: number;
  end: number;
  level: number;
  /** The legend class it is marked with, if any. */
  mark?: string | undefined;
}

/**
 * The span chart of a bracketing. `marked` gives a mark (a class of the
 * legend: lost, added, relabelled, wrong) to the phrases over a span of
 * words, keyed `start:end` (0-based, end exclusive). A label too long for its
 * bar is shortened with `…`; the whole label shows on hover and in a line
 * under the drawing.
 */
export function drawBracketing(tree: Tree, marked: ReadonlyMap<string, string> = new Map(), options: { empties?: boolean } = {}): string {
  // Slots along the row: the words, and with `empties` the empty elements and traces too (marked
  // `empty`: no dependency tree holds them). Spans for `marked` count words only.
  const words: string[] = [];
  const tags: string[] = [];
  const emptySlots = new Set<number>();
  const bars: Bar[] = [];
  let wordCount = 0;
  // Bottom-up: a phrase's bar spans its children's and stands one level above the highest of them.
  const spans = new Map<ConstituentNode, { start: number; end: number; level: number; firstWord: number; lastWord: number }>();
  for (const node of nodesBottomUp(tree.children)) {
    if (node.type === 'preterminal' || (node.type === 'empty' && options.empties)) {
      words.push(node.type === 'preterminal' ? node.word.form : node.text);
      tags.push(node.type === 'preterminal' ? node.pos : formatLabel(node.label));
      const slot = words.length - 1;
      if (node.type === 'empty') emptySlots.add(slot);
      else wordCount++;
      const word = node.type === 'preterminal' ? wordCount - 1 : -1;
      spans.set(node, { start: slot, end: slot + 1, level: 0, firstWord: word, lastWord: word });
      continue;
    }
    if (node.type !== 'phrase') continue;
    let start = Infinity;
    let end = -Infinity;
    let level = 0;
    let firstWord = Infinity;
    let lastWord = -1;
    for (const child of node.children) {
      const span = spans.get(child);
      if (!span) continue;
      start = Math.min(start, span.start);
      end = Math.max(end, span.end);
      level = Math.max(level, span.level);
      if (span.firstWord >= 0) firstWord = Math.min(firstWord, span.firstWord);
      lastWord = Math.max(lastWord, span.lastWord);
    }
    if (start === Infinity) continue;
    // A phrase over empty elements only is lost with them; others are marked by their word span.
    const key = lastWord < 0 ? undefined : `${firstWord}:${lastWord + 1}`;
    bars.push({ label: formatLabel(node.label), start, end, level: level + 1, mark: key === undefined ? 'empty' : marked.get(key) });
    spans.set(node, { start, end, level: level + 1, firstWord: lastWord < 0 ? -1 : firstWord, lastWord });
  }
  const { boxes, width } = layoutWords(words);
  const levels = Math.max(0, ...bars.map((b) => b.level));
  const top = levels * ROW;
  const shortened = new Set<string>();
  const rects = bars
    .map((bar) => {
      const x = boxes[bar.start]!.x;
      const right = boxes[bar.end - 1]!.x + boxes[bar.end - 1]!.width;
      const y = top - bar.level * ROW + 2;
      const cls = bar.mark ? `bar ${bar.mark}` : 'bar';
      // A label wider than its bar is shortened, never squeezed: letters keep their width.
      const room = Math.floor((right - x - 8) / LABEL_CHAR);
      const shown = bar.label.length <= room ? bar.label : `${bar.label.slice(0, Math.max(1, room - 1))}…`;
      if (shown !== bar.label) shortened.add(bar.label);
      return `<g><title>${escapeHtml(bar.label)}</title><rect class="${cls}" x="${x}" y="${y}" width="${right - x}" height="${ROW - 4}" rx="3"/><text class="label" x="${x + 4}" y="${y + 13}">${escapeHtml(shown)}</text></g>`;
    })
    .join('');
  const height = top + ROW + 16;
  const svg = `<svg class="bracketing" xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">${rects}${wordRow(words, tags, boxes, top, emptySlots)}</svg>`;
  return shortened.size === 0 ? svg : `${svg}<p class="labels">shortened: ${[...shortened].map(escapeHtml).join(' ')}</p>`;
}

/**
 * Arcs over words: `heads[i]` is the head of word i+1 (0: root); `crossing` names
 * dependents whose arc is non-projective; `marked` gives a mark of the legend
 * (changed, missed) to the arcs of some dependents. Relation labels stand at
 * the top of their arcs, over a halo that keeps them readable where arcs cross.
 */
export function drawDependencies(words: string[], tags: string[], heads: number[], relations: string[], crossing: ReadonlySet<number>, marked: ReadonlyMap<number, string> = new Map()): string {
  const { boxes, width } = layoutWords(words);
  const centre = (i: number) => boxes[i - 1]!.x + boxes[i - 1]!.width / 2;
  const tallest = Math.max(1, ...heads.map((h, i) => (h === 0 ? 0 : Math.abs(h - (i + 1)))));
  // Room above the tallest arc for labels moved up out of each other's way.
  const top = Math.min(tallest, 12) * 14 + 46;
  // Relation labels stand at the top of their arcs; a label that would overlap one already placed
  // moves up a line at a time (a few lines at most), so that labels of arcs of one height stay apart.
  const placed: Array<{ left: number; right: number; y: number }> = [];
  const placeLabel = (x: number, y: number, text: string) => {
    const half = (text.length * RELATION_CHAR) / 2 + 2;
    let at = y;
    for (let tries = 0; tries < 4 && placed.some((p) => p.left < x + half && x - half < p.right && Math.abs(p.y - at) < 11); tries++) at -= 11;
    placed.push({ left: x - half, right: x + half, y: at });
    return at;
  };
  const order = heads.map((head, i) => ({ head, i })).filter(({ head }) => head !== 0);
  // Shorter arcs first: their labels sit lowest and have least room to move.
  order.sort((a, b) => Math.abs(a.head - (a.i + 1)) - Math.abs(b.head - (b.i + 1)) || a.i - b.i);
  const drawn = new Map<number, string>();
  for (const { head, i } of order) {
    const from = centre(head);
    const to = centre(i + 1);
    const rise = Math.min(Math.abs(head - (i + 1)), 12) * 14 + 10;
    const cls = ['arc', crossing.has(i + 1) ? 'crossing' : '', marked.get(i + 1) ?? ''].filter(Boolean).join(' ');
    const relation = relations[i] ?? '';
    const y = placeLabel((from + to) / 2, top - rise * 0.75 + 3, relation);
    drawn.set(
      i,
      `<path class="${cls}" d="M ${from} ${top} C ${from} ${top - rise}, ${to} ${top - rise}, ${to} ${top - 2}" marker-end="url(#tip)"/>` +
        `<text class="relation" x="${(from + to) / 2}" y="${y}">${escapeHtml(relation)}</text>`,
    );
  }
  const arcs = heads.map((_, i) => drawn.get(i) ?? '').join('');
  const height = top + ROW + 16;
  const marker = '<defs><marker id="tip" viewBox="0 0 6 6" refX="5" refY="3" markerWidth="6" markerHeight="6" orient="auto"><path d="M0,0 L6,3 L0,6 z" class="tip"/></marker></defs>';
  return `<svg class="dependencies" xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">${marker}${arcs}${wordRow(words, tags, boxes, top)}</svg>`;
}
