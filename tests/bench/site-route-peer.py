#!/usr/bin/python3
"""Peer for tests/bench/site-route.ts: Mehlhorn's Steiner tree construction (K. Mehlhorn, "A faster
approximation algorithm for the Steiner problem in graphs", Inf. Process. Lett. 27, 1988) written on
networkx's own Dijkstra and minimum-spanning-tree functions, run on the routing grid that Furrow
exported (plain move costs, no bend states).

Input file: first line "n m k", then one line of k terminal node ids, then m lines "u v weight length".
Prints one JSON object: cost and length of the tree, edges, seconds (graph load excluded), networkx version.
"""
import json
import sys
import time

import networkx as nx


def main():
    with open(sys.argv[1]) as f:
        n, m, k = map(int, f.readline().split())
        terms = list(map(int, f.readline().split()))
        g = nx.Graph()
        for _ in range(m):
            u, v, w, l = f.readline().split()
            g.add_edge(int(u), int(v), weight=float(w), length=float(l))
    t0 = time.perf_counter()
    # 1. Voronoi regions: one Dijkstra from a super source joined to every terminal at cost 0.
    src = -1
    g.add_weighted_edges_from(((src, t, 0.0) for t in terms), weight="weight")
    pred, dist = nx.dijkstra_predecessor_and_distance(g, src, weight="weight")
    g.remove_node(src)
    owner = {t: t for t in terms}

    def region(v):
        chain = []
        while v not in owner:
            chain.append(v)
            v = pred[v][0]
        o = owner[v]
        for c in chain:
            owner[c] = o
        return o

    # 2. Terminal graph from the boundary edges between regions (cheapest per pair).
    best = {}
    for u, v, w in g.edges(data="weight"):
        if u not in dist or v not in dist:
            continue
        a, b = region(u), region(v)
        if a == b:
            continue
        c = dist[u] + w + dist[v]
        key = (a, b) if a < b else (b, a)
        if key not in best or c < best[key][0]:
            best[key] = (c, u, v)
    tg = nx.Graph()
    tg.add_nodes_from(terms)
    for (a, b), (c, u, v) in best.items():
        tg.add_edge(a, b, weight=c, via=(u, v))
    mst = nx.minimum_spanning_tree(tg, weight="weight")

    # 3. Expand each MST edge into its grid path, take the MST of their union, prune non-terminal leaves.
    def to_source(v):
        path = [v]
        while v not in terms_set:
            v = pred[v][0]
            path.append(v)
        return path

    terms_set = set(terms)
    sub = nx.Graph()
    for a, b, data in mst.edges(data=True):
        u, v = data["via"]
        pu, pv = to_source(u), to_source(v)
        for p in (pu, pv):
            for x, y in zip(p, p[1:]):
                sub.add_edge(x, y, **g.edges[x, y])
        sub.add_edge(u, v, **g.edges[u, v])
    sub.add_nodes_from(terms)
    tree = nx.minimum_spanning_tree(sub, weight="weight")
    leaves = [v for v in tree.nodes if tree.degree(v) == 1 and v not in terms_set]
    while leaves:
        nxt = []
        for v in leaves:
            if v not in tree:
                continue
            nb = list(tree.neighbors(v))
            tree.remove_node(v)
            for w in nb:
                if tree.degree(w) == 1 and w not in terms_set:
                    nxt.append(w)
        leaves = nxt
    secs = time.perf_counter() - t0
    cost = sum(d["weight"] for _, _, d in tree.edges(data=True))
    length = sum(d["length"] for _, _, d in tree.edges(data=True))
    print(json.dumps({"cost": cost, "length": length, "edges": tree.number_of_edges(), "seconds": secs,
                      "spans": all(t in tree for t in terms) and nx.is_connected(tree), "networkx": nx.__version__}))


main()
