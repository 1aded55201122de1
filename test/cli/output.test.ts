// The command's output gathers text into large pieces before the stream sees it: whatever the
// sizes of the texts and the characters in them, the bytes that arrive are the text written, in
// order (UTF-8, as Node's own Buffer.from encodes the whole), and nothing arrives before a piece is
// full or the output is committed.
import { Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Output, type CliIO } from '../../src/cli/io.js';

function collecting(): { io: CliIO; chunks: Buffer[] } {
  const chunks: Buffer[] = [];
  const stdout = new Writable({
    write(chunk: Buffer, _encoding, done) {
      chunks.push(Buffer.from(chunk));
      done();
    },
  });
  return { io: { stdin: process.stdin, stdout, stderr: stdout } as unknown as CliIO, chunks };
}

describe('output in pieces', () => {
  it('delivers every text whole and in order, across piece boundaries, with characters of several bytes', async () => {
    const piece = fc.oneof(fc.string({ maxLength: 40 }), fc.string({ unit: 'grapheme', maxLength: 3000 }), fc.constant('þ'.repeat(100_000)), fc.constant('x'.repeat(Output.PIECE - 1)));
    await fc.assert(
      fc.asyncProperty(fc.array(piece, { maxLength: 12 }), async (texts) => {
        const { io, chunks } = collecting();
        const output = Output.to(undefined, io);
        for (const text of texts) await output.write(text);
        await output.commit();
        expect(Buffer.concat(chunks).equals(Buffer.from(texts.join(''), 'utf8'))).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it('sends nothing until a piece is full or the output is committed', async () => {
    const { io, chunks } = collecting();
    const output = Output.to(undefined, io);
    await output.write('ferry\n'.repeat(1000));
    expect(chunks).toHaveLength(0);
    await output.commit();
    expect(Buffer.concat(chunks).toString('utf8')).toBe('ferry\n'.repeat(1000));
  });
});
