import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readConlluText } from '../../../src/formats/conllu/read-conllu.js';
import { SentenceCutter, STRETCH_SIZE, type Stretch } from '../../../src/formats/conllu/sentence-cutter.js';
import { openConlluReader, readConlluStretch } from '../../../src/formats/conllu/read-conllu.js';

/** Sentences of invented words, some with CR LF line ends, extra blank lines or a byte-order mark first. */
function corpus(count: number, seed: number): string {
  const lines: string[] = [seed % 3 === 0 ? '\uFEFF# sent_id = s0' : '# sent_id = s0'];
  for (let k = 0; k < count; k++) {
    if (k > 0) lines.push(`# sent_id = s${k}`);
    const end = (k * seed) % 11 === 5 ? '\r' : '';
    for (let w = 1; w <= 3 + ((k + seed) % 5); w++) lines.push(`${w}\tgull${k}\tgull\tNOUN\tNN\t_\t${w === 1 ? 0 : 1}\t${w === 1 ? 'root' : 'dep'}\t_\t_${end}`);
    lines.push((k * seed) % 13 === 7 ? '\n' : '');
  }
  return lines.join('\n') + '\n';
}

function cut(text: string, sizes: number[]): Stretch[] {
  const cutter = new SentenceCutter();
  const out: Stretch[] = [];
  let at = 0;
  for (let k = 0; at < text.length; k++) {
    const size = sizes[k % sizes.length]!;
    out.push(...cutter.push(text.slice(at, at + size)));
    at += size;
  }
  out.push(cutter.end());
  return out;
}

describe('cutting CoNLL-U into stretches at sentence boundaries', () => {
  it('cuts where the text says, however it arrives, and each stretch knows its offset and line', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 50 }), fc.array(fc.integer({ min: 1, max: 40_000 }), { minLength: 1, maxLength: 5 }), (seed, sizes) => {
        const text = corpus(4000, seed);
        const whole = cut(text, [text.length]);
        const pieces = cut(text, sizes);
        expect(pieces.map((s) => [s.text.length, s.start])).toEqual(whole.map((s) => [s.text.length, s.start]));
        expect(whole.map((s) => s.text).join('')).toBe(text);
        expect(whole.length).toBeGreaterThan(3);
        for (const stretch of whole.slice(0, -1)) {
          expect(stretch.text.length).toBeGreaterThanOrEqual(STRETCH_SIZE);
          expect(stretch.text).toMatch(/\n\r?\n$/);
          expect(stretch.clean && stretch.endsClean).toBe(true);
        }
      }),
      { numRuns: 15 },
    );
  });

  it('reads each stretch on its own as the whole file reads: the same sentences at the same places, the same problems', () => {
    for (const seed of [3, 7, 26]) {
      const text = corpus(4000, seed);
      const problems: string[] = [];
      const sentences = readConlluText(text, { file: 'x' }, (d) => problems.push(`${d.line}:${d.column} ${d.code}`));
      const apart: string[] = [];
      const read: string[] = [];
      const stretches = cut(text, [text.length]);
      stretches.forEach((stretch, k) =>
        readConlluStretch(stretch.text, stretch.start, k === stretches.length - 1, 'x', (d) => apart.push(`${d.line}:${d.column} ${d.code}`), (s) => read.push(`${s.id}@${s.position!.start}`)),
      );
      expect(read).toEqual(sentences.map((s) => `${s.id}@${s.position!.start}`));
      expect(apart).toEqual(problems);
      expect(problems.length).toBeGreaterThan(0);
    }
  });

  it('cuts inside a sentence only when none ends for longer than a sentence may be, and marks what follows', { timeout: 60_000 }, () => {
    const cutter = new SentenceCutter();
    const line = `1\t${'a'.repeat(1000)}\ta\tNOUN\tNN\t_\t0\troot\t_\t_\n`;
    const out: Stretch[] = [];
    for (let k = 0; k < 17_500; k++) out.push(...cutter.push(line));
    out.push(cutter.end());
    expect(out.length).toBe(2);
    expect(out[0]!.endsClean).toBe(false);
    expect(out[1]!.clean).toBe(false);
    // One reader over both, as the command does from there on, reports the overlong sentence once.
    const problems: string[] = [];
    const reader = openConlluReader('x', (d) => problems.push(d.code), out[0]!.start);
    reader.push(out[0]!.text);
    reader.push(out[1]!.text);
    reader.end();
    expect(problems).toContain('missing-blank-line');
  });
});
