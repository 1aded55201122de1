"""Outside check of XML graph files: Python's standard xml.etree.ElementTree
(a reference library nobody on this project wrote) parses each file, and the
graph of every sentence is checked: one root that exists and has no parent,
every edge target exists, every terminal reached from the root exactly once,
no cycles. Prints one JSON object per file with counts and the problems found
(at most 20 listed).

Usage: python3 xml-graph-check.py FILE...
       python3 xml-graph-check.py --time FILE   (parse only; prints trees, seconds, peak memory)
"""
import json
import resource
import sys
import time
import xml.etree.ElementTree as ET


def time_parse(path):
    started = time.perf_counter()
    sentences = 0
    for _event, element in ET.iterparse(path, events=('end',)):
        if element.tag == 's':
            sentences += 1
            element.clear()
    seconds = time.perf_counter() - started
    peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    print(json.dumps({'trees': sentences, 'seconds': seconds, 'peakMB': peak}))


def check_sentence(s, problems):
    sid = s.get('id')
    graph = s.find('graph')
    if graph is None:
        problems.append(f'{sid}: no graph')
        return 0, 0, 0
    terminals = graph.findall('terminals/t')
    nonterminals = graph.findall('nonterminals/nt')
    ids = {}
    for node in terminals + nonterminals:
        nid = node.get('id')
        if nid is None or nid in ids:
            problems.append(f'{sid}: missing or repeated id {nid}')
        ids[nid] = node
    children = {nt.get('id'): [e.get('idref') for e in nt.findall('edge')] for nt in nonterminals}
    root = graph.get('root')
    if root not in ids:
        problems.append(f'{sid}: root {root} is no node')
        return len(terminals), len(nonterminals), 0
    parents = {}
    for parent, kids in children.items():
        for kid in kids:
            if kid not in ids:
                problems.append(f'{sid}: edge from {parent} to missing {kid}')
            elif kid in parents:
                problems.append(f'{sid}: {kid} has two parents')
            parents[kid] = parent
    if root in parents:
        problems.append(f'{sid}: the root has a parent')
    # Walk down from the root; a node met twice means a cycle or a shared child.
    reached = {}
    stack = [root]
    discontinuous = 0
    order = {t.get('id'): i for i, t in enumerate(terminals)}
    while stack:
        nid = stack.pop()
        reached[nid] = reached.get(nid, 0) + 1
        if reached[nid] > 1:
            problems.append(f'{sid}: {nid} reached twice (a cycle or a shared node)')
            continue
        stack.extend(k for k in children.get(nid, []) if k in ids)
    for t in terminals:
        if reached.get(t.get('id'), 0) != 1:
            problems.append(f'{sid}: terminal {t.get("id")} reached {reached.get(t.get("id"), 0)} times')
    for nid in ids:
        if nid not in reached:
            problems.append(f'{sid}: {nid} not reached from the root')

    # Phrases with gaps, from the terminal order alone.
    def yield_of(nid, seen):
        if nid in order:
            return [order[nid]]
        if nid in seen:
            return []
        seen.add(nid)
        out = []
        for k in children.get(nid, []):
            out.extend(yield_of(k, seen))
        return out
    for nt in nonterminals:
        y = yield_of(nt.get('id'), set())
        if y and max(y) - min(y) + 1 != len(y):
            discontinuous += 1
    return len(terminals), len(nonterminals), discontinuous


if sys.argv[1:2] == ['--time']:
    time_parse(sys.argv[2])
    sys.exit(0)

for path in sys.argv[1:]:
    problems = []
    sentences = terminals = nonterminals = discontinuous = 0
    for _event, element in ET.iterparse(path, events=('end',)):
        if element.tag != 's':
            continue
        sentences += 1
        t, n, d = check_sentence(element, problems)
        terminals += t
        nonterminals += n
        discontinuous += d
        element.clear()
    print(json.dumps({'file': path, 'sentences': sentences, 'terminals': terminals, 'nonterminals': nonterminals,
                      'discontinuous': discontinuous, 'problems': len(problems), 'examples': problems[:20]}))
