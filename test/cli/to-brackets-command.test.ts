import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';

// Our own sentence with a non-projective arc: "Ferries left early that the keeper trusted",
// where the relative clause (word 5 head "trusted") hangs from "Ferries" across "left early".
const crossing = [
  '# sent_id = cross-1',
  '# text = Ferries left early that the keeper trusted',
  '1\tFerries\tferry\tNOUN\tNNS\t_\t2\tnsubj\t_\t_',
  '2\tleft\tleave\tVERB\tVBD\t_\t0\troot\t_\t_',
  '3\tearly\tearly\tADV\tRB\t_\t2\tadvmod\t_\t_',
  '4\tthat\tthat\tPRON\tWDT\t_\t7\tobj\t_\t_',
  '5\tthe\tthe\tDET\tDT\t_\t6\tdet\t_\t_',
  '6\tkeeper\tkeeper\tNOUN\tNN\t_\t7\tnsubj\t_\t_',
  '7\ttrusted\ttrust\tVERB\tVBD\t_\t1\tacl:relcl\t_\t_',
  '',
  '',
].join('\n');

describe('treebridge to-brackets', () => {
  it('lifts a non-projective arc and marks it with a coindexed *ICH* trace in the phrase of its real head (Bies et al. 1995, from memory)', async () => {
    const { code, stdout, stderr } = await cli(['to-brackets', '--lifts', '-'], { stdin: crossing });
    expect(code).toBe(0);
    expect(stdout).toBe(
      '( (S (NP-nsubj (NOUN Ferries) (-NONE- *ICH*-1)) (VERB left) (ADVP-advmod (ADV early)) ' +
        '(S-acl:relcl-1 (NP-obj (PRON that)) (NP-nsubj (DP-det (DET the)) (NOUN keeper)) (VERB trusted))) (ID cross-1))\n',
    );
    expect(stderr).toBe('cross-1: lifted 7: 1→2\ntreebridge: 1 sentence read: 1 written, 0 skipped; 1 arc lifted in 1 sentence\n');
  });

  it('gives the original arcs back through to-deps --heads ud --traces resolve, in both shapes', async () => {
    for (const shape of ['flat', 'layered']) {
      const brackets = await cli(['to-brackets', '--shape', shape, '-'], { stdin: crossing });
      const back = await cli(['to-deps', '--heads', 'ud', '--traces', 'resolve', '-'], { stdin: brackets.stdout });
      const arcs = back.stdout.split('\n').filter((l) => /^\d/.test(l)).map((l) => l.split('\t').slice(6, 8).join(':'));
      expect(arcs, shape).toEqual(['2:nsubj', '0:root', '2:advmod', '7:obj', '6:det', '7:nsubj', '1:acl:relcl']);
    }
  });

  it('builds one phrase level per dependent in the layered shape, nearest first', async () => {
    const text = '# sent_id = l-1\n# text = the old keeper\n1\tthe\tthe\tDET\tDT\t_\t3\tdet\t_\t_\n2\told\told\tADJ\tJJ\t_\t3\tamod\t_\t_\n3\tkeeper\tkeeper\tNOUN\tNN\t_\t0\troot\t_\t_\n\n';
    const { stdout } = await cli(['to-brackets', '--shape', 'layered', '-'], { stdin: text });
    expect(stdout).toBe('( (NP (DP-det (DET the)) (NP (ADJP-amod (ADJ old)) (NOUN keeper))) (ID l-1))\n');
  });
});
