// The shared corpora through the command a user runs: GUM (CC BY 4.0) and
// IcePaHC (CC BY 4.0) from ../shared/corpora. Tree counts from the corpora's README.
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { corpusFiles } from '../support/corpora.js';

describe.each([
  ['GUM constituency trees', 'gum/const', '.ptb', 11_799],
  ['IcePaHC', 'icepahc', '.psd', 36_946],
])('treebridge validate --json on %s', (_name, folder, extension, trees) => {
  it('reports every tree and no error', async () => {
    const files = corpusFiles(folder, extension);
    const { code, stdout } = await cli(['validate', '--json', ...files]);
    const report = JSON.parse(stdout);
    expect({ code, files: report.files, trees: report.trees, errors: report.errors }).toEqual({
      code: 0,
      files: files.length,
      trees,
      errors: 0,
    });
  });
});
