"""Read bracketed files with NLTK (Debian package python3-nltk), a reference
library nobody here wrote: its s-expression block reader
(nltk.corpus.reader.util.read_sexpr_block) and its tree reader (nltk.Tree.fromstring).

  nltk-trees.py dump FILE...   one JSON line per tree: [labels in pre-order, leaves in order]
  nltk-trees.py time FILE...   one JSON object: trees, leaves, seconds spent reading, peak memory
  nltk-trees.py deps FILE...   CoNLL-U read by nltk.parse.DependencyGraph: one JSON line per sentence,
                               the head of each word in order
"""
import json
import resource
import sys
import time

from nltk import Tree
from nltk.corpus.reader.util import read_sexpr_block
from nltk.data import SeekableUnicodeStreamReader


def trees_of(paths):
    for path in paths:
        stream = SeekableUnicodeStreamReader(open(path, 'rb'), 'utf-8')
        while True:
            blocks = read_sexpr_block(stream)
            if not blocks:
                break
            for block in blocks:
                yield Tree.fromstring(block)


def outline(tree):
    labels = []

    def visit(node):
        labels.append(node.label())
        for child in node:
            if isinstance(child, Tree):
                visit(child)

    visit(tree)
    return [labels, tree.leaves()]


def main(mode, paths):
    if mode == 'dump':
        for tree in trees_of(paths):
            sys.stdout.write(json.dumps(outline(tree), ensure_ascii=False, separators=(',', ':')) + '\n')
    elif mode == 'time':
        trees = leaves = 0
        started = time.perf_counter()
        for tree in trees_of(paths):
            trees += 1
            leaves += len(tree.leaves())
        seconds = time.perf_counter() - started
        peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
        print(json.dumps({'trees': trees, 'words': leaves, 'seconds': seconds, 'peakMB': peak}))
    elif mode == 'deps':
        from nltk.parse import DependencyGraph
        for path in paths:
            with open(path, encoding='utf-8') as stream:
                blocks = stream.read().split('\n\n')
            for block in blocks:
                lines = [line for line in block.split('\n') if line and not line.startswith('#')]
                if not lines:
                    continue
                graph = DependencyGraph('\n'.join(lines), cell_separator='\t', top_relation_label='root')
                heads = [graph.nodes[i]['head'] for i in range(1, len(lines) + 1)]
                sys.stdout.write(json.dumps(heads, separators=(',', ':')) + '\n')
    else:
        sys.exit('usage: nltk-trees.py dump|time|deps FILE...')


main(sys.argv[1], sys.argv[2:])
