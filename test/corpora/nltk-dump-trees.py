"""Dump every tree of bracketed files as NLTK reads them, one JSON line per tree.

Reference library: NLTK (Debian package python3-nltk), its s-expression block
reader (nltk.corpus.reader.util.read_sexpr_block) and its tree reader
(nltk.Tree.fromstring). Each line is [labels in pre-order, leaves in order].
"""
import json
import sys

from nltk import Tree
from nltk.corpus.reader.util import read_sexpr_block
from nltk.data import SeekableUnicodeStreamReader


def labels_and_leaves(tree):
    labels = []

    def visit(node):
        labels.append(node.label())
        for child in node:
            if isinstance(child, Tree):
                visit(child)

    visit(tree)
    return [labels, tree.leaves()]


for path in sys.argv[1:]:
    stream = SeekableUnicodeStreamReader(open(path, 'rb'), 'utf-8')
    while True:
        blocks = read_sexpr_block(stream)
        if not blocks:
            break
        for block in blocks:
            tree = Tree.fromstring(block)
            sys.stdout.write(json.dumps(labels_and_leaves(tree), ensure_ascii=False, separators=(',', ':')) + '\n')
