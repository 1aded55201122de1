import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as treebridge from '../src/index.js';
import * as cli from '../src/cli/index.js';
import { projectRoot } from './support/corpora.js';

// Pins the public export list: a change here is a change of the library's interface.
describe('the public interface', () => {
  it('exports exactly these values', () => {
    expect(Object.keys(treebridge).sort()).toEqual([
      'AttachmentScorer',
      'BracketedValidator',
      'ConlluValidator',
      'LineIndex',
      'MAX_TREE_DEPTH',
      'MAX_TREE_LENGTH',
      'OptionsError',
      'PosMap',
      'TableError',
      'analyseStructure',
      'analyseTree',
      'bracketOptionsSchema',
      'buildBrackets',
      'checkOptions',
      'childrenOf',
      'compileHeadTable',
      'compileLabelTable',
      'conversionDefaults',
      'conversionOptionsSchema',
      'convertText',
      'convertTree',
      'convertTrees',
      'countDiscontinuousPhrases',
      'defaultLiteralTags',
      'diagnosticCodes',
      'explainHeads',
      'formatDiagnostic',
      'formatFeatures',
      'formatLabel',
      'headVector',
      'insertTraces',
      'isMetaOnly',
      'liftNonProjective',
      'loadCategoryTable',
      'loadFeatureInventory',
      'loadHeadTable',
      'loadLabelTable',
      'loadPosMap',
      'lossKinds',
      'namingSchema',
      'nodesOf',
      'parseLabel',
      'preterminalsOf',
      'readBracketed',
      'readBracketedBatches',
      'readBracketedFile',
      'readBracketedFileBatches',
      'readBracketedText',
      'readConllu',
      'readConlluFile',
      'readConlluText',
      'readXmlGraphFile',
      'readXmlGraphText',
      'readXmlGraphs',
      'resolveConversionOptions',
      'resolveTraces',
      'roundTrip',
      'scoreHeads',
      'sentIdOf',
      'shippedTables',
      'suggestHeads',
      'suggestLabels',
      'terminalsInOrder',
      'toBrackets',
      'treeHeads',
      'universalRelations',
      'universalTags',
      'unwritableReason',
      'unwritableSentenceReason',
      'validateBracketed',
      'validateConllu',
      'version',
      'writeBracketing',
      'writeNode',
      'writeRoundTripReport',
      'writeSentence',
      'writeTree',
      'writeXmlSentence',
      'xmlDocumentEnd',
      'xmlDocumentStart',
    ]);
  });

  it('keeps the command line in a subpath of its own', () => {
    expect(Object.keys(cli).sort()).toEqual(['ExitCode', 'runCli']);
    expect('runCli' in treebridge).toBe(false);
  });

  // The library is for programs that have their own command line: loading it
  // must not load ours, nor the parser of options or the progress bar.
  it('loads no module of the command line when the library is imported', () => {
    const entry = join(projectRoot, 'dist/src/index.js');
    if (!existsSync(entry)) throw new Error(`${entry} is missing: run npm run build`);
    const record = join(mkdtempSync(join(tmpdir(), 'treebridge-loads-')), 'urls');
    // The hook runs on a thread of its own: it writes each module it resolves
    // to a file, synchronously, so the list is complete when the process ends.
    const hook = [
      'import { appendFileSync } from "node:fs";',
      'let record;',
      'export function initialize(data) { record = data.record; }',
      'export async function resolve(specifier, context, next) {',
      '  const result = await next(specifier, context);',
      '  appendFileSync(record, result.url + "\\n");',
      '  return result;',
      '}',
    ].join('\n');
    const register = `import { register } from 'node:module'; register('data:text/javascript,' + encodeURIComponent(${JSON.stringify(hook)}), { data: { record: ${JSON.stringify(record)} } });`;
    execFileSync(process.execPath, ['--import', 'data:text/javascript,' + encodeURIComponent(register), '--input-type=module', '-e', `await import(${JSON.stringify(entry)});`]);
    const urls = readFileSync(record, 'utf8').split('\n').filter(Boolean);
    expect(urls.some((url) => url.endsWith('/dist/src/index.js'))).toBe(true);
    expect(urls.filter((url) => /\/(cli|bin)\/|commander|cli-progress/.test(url))).toEqual([]);
  });
});
