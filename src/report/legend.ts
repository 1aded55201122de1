/**
 * The one legend of every report: what each mark means, its colours and
 * shapes, and the style sheet made from them. Drawings name marks by class
 * only; the colours live here.
 */
export interface Mark {
  /** The class drawings give the marked element. */
  name: string;
  meaning: string;
  fill: string;
  stroke: string;
  /** `dashed` or `dotted` outlines, or a solid `thick` line, so that marks differ in shape as well as colour. */
  line: 'solid' | 'dashed' | 'dotted' | 'thick';
}

export const marks: Record<'lost' | 'empty' | 'added' | 'relabelled' | 'wrong' | 'crossing' | 'changed' | 'missed', Mark> = {
  lost: { name: 'lost', meaning: 'bracket lost', fill: '#f6dcd6', stroke: '#b03a2e', line: 'dashed' },
  empty: { name: 'empty', meaning: 'empty element or trace, lost (no dependency tree holds it)', fill: '#f3f1ec', stroke: '#b03a2e', line: 'dotted' },
  added: { name: 'added', meaning: 'bracket added', fill: '#d9efe0', stroke: '#2f7d4f', line: 'dotted' },
  relabelled: { name: 'relabelled', meaning: 'same words, another label', fill: '#fdf0c4', stroke: '#9a7410', line: 'solid' },
  wrong: { name: 'wrong', meaning: 'phrase whose head the table chose wrongly', fill: '#e3dcf5', stroke: '#5b3fa8', line: 'thick' },
  crossing: { name: 'crossing', meaning: 'non-projective arc', fill: 'none', stroke: '#c46210', line: 'dashed' },
  changed: { name: 'changed', meaning: 'arc wrong, or changed on the way back', fill: 'none', stroke: '#b03a2e', line: 'thick' },
  missed: { name: 'missed', meaning: 'gold arc the conversion missed', fill: 'none', stroke: '#2f7d4f', line: 'thick' },
};

const dash = (line: Mark['line']) => (line === 'dashed' ? 'stroke-dasharray: 5 3;' : line === 'dotted' ? 'stroke-dasharray: 2 2;' : line === 'thick' ? 'stroke-width: 2.2;' : '');

const STYLE = `
body { font: 14px/1.45 system-ui, sans-serif; margin: 2rem; color: #1f2933; background: #fbfaf7; }
h1 { font-size: 1.4rem; } h2 { font-size: 1.15rem; margin-top: 2.5rem; border-bottom: 2px solid #d9d4c7; } h3 { font-size: 1rem; margin-bottom: 0.3rem; }
nav.contents ol { columns: 3; } a { color: #1d5a8a; overflow-wrap: anywhere; }
table.summary { border-collapse: collapse; } table.summary td, table.summary th { padding: 0.2rem 0.8rem; border-bottom: 1px solid #e4e0d5; text-align: left; vertical-align: top; }
table.summary { max-width: 100%; } table.summary td.n { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; } table.summary td.step { font: 12px ui-monospace, monospace; width: 45%; overflow-wrap: anywhere; } table.summary td.links { min-width: 20rem; }
section.sentence { margin: 1.2rem 0 2rem; } ul.problems { margin: 0.2rem 0 0.6rem; font-size: 0.9rem; }
.views { overflow-x: auto; max-width: 100%; border: 1px solid #e4e0d5; background: #fff; padding: 0.5rem; }
figure { margin: 0 0 0.8rem; } figcaption { font-size: 0.8rem; color: #6b6557; } p.labels { font: 11px ui-monospace, monospace; color: #6b6557; margin: 0.1rem 0 0; }
svg { display: block; } svg text { font: 11px ui-monospace, monospace; text-anchor: middle; fill: #1f2933; }
svg text.label { text-anchor: start; } svg text.tag { fill: #7a7466; font-size: 10px; } svg text.relation { fill: #44546a; font-size: 10px; paint-order: stroke; stroke: #fff; stroke-width: 3px; }
rect.word { fill: #ffffff; stroke: #b8b2a3; } rect.bar { fill: #ece6d8; stroke: #8c7f62; }
path.arc { fill: none; stroke: #44546a; stroke-width: 1.2; } path.tip { fill: #44546a; }
.legend span { display: inline-block; margin-right: 1rem; } .key { display: inline-block; width: 1.6em; height: 0.8em; margin-right: 0.3em; vertical-align: middle; border: 1px solid; }
${Object.values(marks)
  .map((mark) => `rect.bar.${mark.name}, rect.word.${mark.name} { fill: ${mark.fill}; stroke: ${mark.stroke}; ${dash(mark.line)} } path.arc.${mark.name} { stroke: ${mark.stroke}; ${dash(mark.line)} }`)
  .join('\n')}
`;

/** The legend of the given marks, as a line of keys. */
export function legend(names: Array<keyof typeof marks>): string {
  const keys = names.map((name) => {
    const mark = marks[name];
    const border = mark.line === 'dashed' ? 'dashed' : mark.line === 'dotted' ? 'dotted' : 'solid';
    const width = mark.line === 'thick' ? '2px' : '1px';
    return `<span><i class="key" style="background:${mark.fill === 'none' ? 'transparent' : mark.fill};border:${width} ${border} ${mark.stroke}"></i>${mark.meaning}</span>`;
  });
  return `<p class="legend">${keys.join('')}</p>`;
}

/** A whole page: self-contained, no script, no outside asset. */
export function page(title: string, body: string): string {
  return `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>${title}</title><style>${STYLE}</style></head><body>${body}</body></html>\n`;
}
