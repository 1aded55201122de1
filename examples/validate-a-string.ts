// Checks CoNLL-U held in a string and prints each problem as the command line does.
import { formatDiagnostic, validateConllu } from 'treebridge';

const text = '# sent_id = gulls.1\n# text = Gulls circled\n1\tGulls\tgull\tNOUN\tNNS\tNumber=Plur\t2\tnsubj\t_\t_\n2\tcircled\tcircle\tVERBX\tVBD\t_\t0\troot\t_\t_\n\n';
const { summary, diagnostics } = validateConllu(text, { file: 'gulls.conllu' });
for (const diagnostic of diagnostics) console.log(formatDiagnostic(diagnostic));
console.log(`${summary.sentences} sentence, ${summary.errors} error, ${summary.warnings} warnings`);
