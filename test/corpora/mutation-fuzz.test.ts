// Mutation fuzzing over samples of the shared corpora: GUM (CC BY 4.0), IcePaHC (CC BY 4.0), UD
// English EWT and Czech CAC (CC BY-SA 4.0), and XML graphs written from IcePaHC. Each case cuts a
// window of a few sentences, breaks it (bytes dropped, repeated, swapped or inserted, lines swapped,
// fields changed) and runs one command on it. Every command must end, with exit 0, 1 or 2 only:
// never a crash (70: a fault of ours) and never a hang. Seeded, so a failure can be replayed.
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readBracketedText } from '../../src/formats/bracketed/read-bracketed.js';
import { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from '../../src/formats/xml-graph/write-xml-graph.js';
import { corpusFiles, projectRoot } from '../support/corpora.js';
import { random } from '../support/random-trees.js';

const CASES = Number(process.env.TREEBRIDGE_FUZZ_CASES ?? 10_500);
const folder = mkdtempSync(join(tmpdir(), 'treebridge-fuzz-'));

/** Windows of whole sentences from a text cut into records by `split`. */
function windows(text: string, split: RegExp, next: () => number, count: number, size = 4): string[] {
  const records = text.split(split).filter((r) => r.trim() !== '');
  return Array.from({ length: count }, () => {
    const start = Math.floor(next() * Math.max(1, records.length - size));
    return records.slice(start, start + 1 + Math.floor(next() * size)).join(split.source === '\\n\\n' ? '\n\n' : '\n') + '\n';
  });
}

const NASTY = ['(', ')', '((', '))', '\t', '\n', '\n\n', '\r\n', ' ', '\\', '<', '>', '&', '&#0;', '"', '#', '_', '0', '-1', '1.0', '*T*-9', '=', '-', '\u0000', '\u2028', '\uFEFF', 'é', '𝔉', '<s id="x">', '</s>', '<!DOCTYPE x>', '(ID x)', '(CODE y)', '1-2\t', '3.1\t'];

/** One mutation of a text, as bytes (some mutations make bytes that are not UTF-8). */
function mutate(text: string, next: () => number): Buffer {
  let bytes = Buffer.from(text, 'utf8');
  const steps = 1 + Math.floor(next() * 3);
  for (let s = 0; s < steps; s++) {
    const at = Math.floor(next() * (bytes.length + 1));
    const length = Math.floor(next() * Math.min(40, bytes.length + 1));
    switch (Math.floor(next() * 8)) {
      case 0: // drop a stretch
        bytes = Buffer.concat([bytes.subarray(0, at), bytes.subarray(at + length)]);
        break;
      case 1: // repeat a stretch
        bytes = Buffer.concat([bytes.subarray(0, at + length), bytes.subarray(at, at + length), bytes.subarray(at + length)]);
        break;
      case 2: // insert something nasty
        bytes = Buffer.concat([bytes.subarray(0, at), Buffer.from(NASTY[Math.floor(next() * NASTY.length)]!, 'utf8'), bytes.subarray(at)]);
        break;
      case 3: // bytes that are not UTF-8
        bytes = Buffer.concat([bytes.subarray(0, at), Buffer.from([0xff, 0xc3, 0x28, 0x80].slice(0, 1 + Math.floor(next() * 4))), bytes.subarray(at)]);
        break;
      case 4: // cut short
        bytes = bytes.subarray(0, at);
        break;
      case 5: {
        // swap two lines
        const lines = bytes.toString('utf8').split('\n');
        const i = Math.floor(next() * lines.length);
        const j = Math.floor(next() * lines.length);
        [lines[i], lines[j]] = [lines[j]!, lines[i]!];
        bytes = Buffer.from(lines.join('\n'), 'utf8');
        break;
      }
      case 6: {
        // change one tab-separated field, or one number
        const textNow = bytes.toString('utf8');
        const numbers = [...textNow.matchAll(/\d+/g)];
        if (numbers.length === 0) break;
        const pick = numbers[Math.floor(next() * numbers.length)]!;
        const replacement = String(Math.floor(next() * 60) - 5);
        bytes = Buffer.from(textNow.slice(0, pick.index) + replacement + textNow.slice(pick.index! + pick[0].length), 'utf8');
        break;
      }
      default: // swap two bytes
        if (bytes.length > 1) {
          const j = Math.floor(next() * bytes.length);
          const copy = Buffer.from(bytes);
          [copy[at % copy.length], copy[j]] = [copy[j]!, copy[at % copy.length]!];
          bytes = copy;
        }
    }
  }
  return bytes;
}

interface FuzzCase {
  args: string[];
  input: string;
  format: string;
}

function buildCases(): FuzzCase[] {
  const next = random(Number(process.env.TREEBRIDGE_FUZZ_SEED ?? 20261202));
  const pick = <T>(list: T[]) => list[Math.floor(next() * list.length)]!;
  const read = (files: string[], n: number) => Array.from({ length: n }, () => readFileSync(pick(files), 'utf8'));
  const ice = corpusFiles('icepahc', '.psd');
  const gumTrees = corpusFiles('gum/const', '.ptb');
  const gumDeps = corpusFiles('gum/dep', '.conllu');
  const ud = corpusFiles('ud', '.conllu');
  const per = Math.ceil(CASES / 3);
  // Bracketed windows from IcePaHC and GUM.
  const bracketed = [...read(ice, 6), ...read(gumTrees, 6)].flatMap((text) => windows(text, /\n(?=\()/, next, Math.ceil(per / 12)));
  // CoNLL-U windows from GUM and UD.
  const conllu = [...read(gumDeps, 6), ...read(ud, 2)].flatMap((text) => windows(text, /\n\n/, next, Math.ceil(per / 8)));
  // XML graphs written from IcePaHC trees (with their traces), in windows of a few sentences.
  const xml = read(ice, 4).flatMap((text) => {
    const trees = readBracketedText(text, { splitLemmas: true }, () => undefined);
    return Array.from({ length: Math.ceil(per / 4) }, () => {
      const start = Math.floor(next() * Math.max(1, trees.length - 3));
      const body = trees.slice(start, start + 1 + Math.floor(next() * 3)).map((tree, i) => {
        try {
          return writeXmlSentence(tree, i + 1);
        } catch {
          return '';
        }
      });
      return xmlDocumentStart() + body.join('') + xmlDocumentEnd();
    });
  });
  const commands: Record<string, string[][]> = {
    bracketed: [
      ['validate', '--lemmas'], ['rewrite'], ['rewrite', '--to', 'xml'], ['rewrite', '--traces', 'resolve', '--layout', 'indented'],
      ['to-deps', '--heads', 'penn-historical', '--lemmas'], ['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '--traces', 'resolve'],
      ['to-deps', '--heads', 'generic', '--lossless'], ['stats', '--heads', 'en-function'], ['roundtrip', '--heads', 'en-content'],
      ['roundtrip', '--heads', 'generic', '--lossless'], ['heads', 'explain', '--heads', 'penn-historical'],
    ],
    conllu: [['validate'], ['stats', '--arcs'], ['to-brackets'], ['to-brackets', '--to', 'xml'], ['to-brackets', '--lossless', '--shape', 'layered'], ['roundtrip']],
    xml: [['validate'], ['rewrite'], ['rewrite', '--to', 'xml'], ['to-deps', '--heads', 'penn-historical'], ['stats', '--heads', 'generic'], ['roundtrip', '--heads', 'generic']],
  };
  const cases: FuzzCase[] = [];
  for (const [format, samples] of [['bracketed', bracketed], ['conllu', conllu], ['xml', xml]] as const) {
    for (let k = 0; k < per; k++) {
      const command = pick(commands[format]!);
      const input = mutate(pick(samples), next);
      cases.push({ args: [...command, '--from', format === 'conllu' && command[0] === 'to-brackets' ? 'conllu' : format, '-'], input: input.toString('base64'), format });
    }
  }
  return cases;
}

/** Runs the cases in a driver process; a case that gives no answer for a minute is a hang, and the run goes on after it. */
async function runCases(cases: FuzzCase[]): Promise<{ codes: Map<number, string>; hangs: number[] }> {
  const file = join(folder, 'cases.json');
  writeFileSync(file, JSON.stringify(cases));
  const codes = new Map<number, string>();
  const hangs: number[] = [];
  let first = 0;
  while (first < cases.length) {
    const driver = spawn(process.execPath, [join(projectRoot, 'test/support/fuzz-driver.mjs'), file, String(first)], { stdio: ['ignore', 'pipe', 'inherit'] });
    let buffered = '';
    let last = first - 1;
    let timer: NodeJS.Timeout | undefined;
    const watch = () => {
      clearTimeout(timer);
      timer = setTimeout(() => driver.kill('SIGKILL'), 60_000);
    };
    watch();
    driver.stdout.setEncoding('utf8').on('data', (chunk: string) => {
      buffered += chunk;
      const lines = buffered.split('\n');
      buffered = lines.pop()!;
      for (const line of lines) {
        const space = line.indexOf(' ');
        last = Number(line.slice(0, space));
        codes.set(last, line.slice(space + 1));
      }
      watch();
    });
    await new Promise((resolve) => driver.on('close', resolve));
    clearTimeout(timer);
    if (last >= cases.length - 1) break;
    // The driver stopped before the end: the next case hung (or killed the process).
    hangs.push(last + 1);
    first = last + 2;
  }
  return { codes, hangs };
}

describe('mutation fuzzing of every command on broken corpus samples', () => {
  it(`runs ${CASES} cases across the three formats: 0 crashes, 0 hangs, exit codes 0, 1 or 2 only`, async () => {
    const cases = buildCases();
    if (!process.env.TREEBRIDGE_FUZZ_CASES) expect(cases.length).toBeGreaterThanOrEqual(10_000);
    const { codes, hangs } = await runCases(cases);
    const bad = [...codes].filter(([, code]) => !/^[012]$/.test(code));
    // Failing cases are kept for replay: the input and the command line.
    const saved = join(folder, 'failures');
    mkdirSync(saved, { recursive: true });
    for (const index of [...bad.map(([i]) => i), ...hangs].slice(0, 50)) {
      writeFileSync(join(saved, `case-${index}.input`), Buffer.from(cases[index]!.input, 'base64'));
      writeFileSync(join(saved, `case-${index}.args`), cases[index]!.args.join(' ') + '\n');
    }
    const byFormat = (format: string) => cases.filter((c) => c.format === format).length;
    console.log(`fuzz: ${cases.length} cases (${byFormat('bracketed')} bracketed, ${byFormat('conllu')} CoNLL-U, ${byFormat('xml')} XML); exit codes ${JSON.stringify(Object.fromEntries([...new Set(codes.values())].slice(0, 10).map((c) => [c, [...codes.values()].filter((x) => x === c).length])))}; failures saved in ${saved}`);
    expect(hangs.map((i) => cases[i]!.args.join(' '))).toEqual([]);
    expect(bad.slice(0, 10).map(([i, code]) => `${cases[i]!.args.join(' ')} → ${code}`)).toEqual([]);
    expect(codes.size + hangs.length).toBe(cases.length);
  });
});
