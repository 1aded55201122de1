import { describe, expect, it } from 'vitest';
import * as treebridge from '../src/index.js';

// Pins the public export list: a change here is a change of the library's interface.
describe('the public interface', () => {
  it('exports exactly these values', () => {
    expect(Object.keys(treebridge).sort()).toEqual([
      'BracketedValidator',
      'LineIndex',
      'childrenOf',
      'countDiscontinuousPhrases',
      'diagnosticCodes',
      'formatDiagnostic',
      'formatLabel',
      'insertTraces',
      'isMetaOnly',
      'nodesOf',
      'parseLabel',
      'preterminalsOf',
      'readBracketed',
      'readBracketedBatches',
      'readBracketedFile',
      'readBracketedFileBatches',
      'readBracketedText',
      'readXmlGraphFile',
      'readXmlGraphText',
      'readXmlGraphs',
      'resolveTraces',
      'runCli',
      'terminalsInOrder',
      'writeNode',
      'writeTree',
      'writeXmlSentence',
      'xmlDocumentEnd',
      'xmlDocumentStart',
    ]);
  });
});
