#!/usr/bin/python3
"""Peer for the Steiner suite: networkx's steiner_tree (metric-closure MST method) on one
instance in the plain Steiner text format. Prints one JSON line {"instance","cost","ms"}.
Parallel edges are merged to the lightest one, as a simple Graph needs. Only the call to
steiner_tree is timed. Run with /usr/bin/python3 (networkx 2.8.8 from Debian)."""
import json
import os
import sys
import time

import networkx as nx
from networkx.algorithms.approximation import steiner_tree


def read_instance(path):
    g = nx.Graph()
    terminals = []
    section = ''
    with open(path) as f:
        for raw in f:
            parts = raw.split()
            if not parts:
                continue
            head = parts[0].upper()
            if head == 'SECTION':
                section = parts[1].upper() if len(parts) > 1 else ''
            elif head == 'END':
                section = ''
            elif head == 'EOF':
                break
            elif section == 'GRAPH' and head == 'NODES':
                g.add_nodes_from(range(1, int(parts[1]) + 1))
            elif section == 'GRAPH' and head == 'E':
                u, v, w = int(parts[1]), int(parts[2]), float(parts[3])
                if u == v:
                    continue
                if g.has_edge(u, v) and g[u][v]['weight'] <= w:
                    continue
                g.add_edge(u, v, weight=w)
            elif section == 'TERMINALS' and head == 'T':
                terminals.append(int(parts[1]))
    return g, sorted(set(terminals))


def main():
    path = sys.argv[1]
    g, terminals = read_instance(path)
    t0 = time.perf_counter()
    tree = steiner_tree(g, terminals, weight='weight')
    ms = (time.perf_counter() - t0) * 1000.0
    cost = sum(d['weight'] for _, _, d in tree.edges(data=True))
    spans = all(tree.has_node(t) for t in terminals) and nx.is_connected(tree)
    print(json.dumps({'instance': os.path.basename(path), 'cost': cost, 'ms': round(ms, 1), 'spans': spans}))


if __name__ == '__main__':
    main()
