#!/usr/bin/python3
"""Independent check of a routed trench network with shapely and networkx.

Input: a JSON file written by the test (obstacles, boundary, clearance, network). Output (stdout):
one JSON object with the measured minimum clearance of every trench segment, the stub
geometry checks, and whether the segments form one tree holding every routed terminal.
"""
import json
import math
import sys

import networkx as nx
from shapely.geometry import LineString, Point, Polygon
from shapely.ops import unary_union


def ring_pts(flat):
    return [(flat[i], flat[i + 1]) for i in range(0, len(flat), 2)]


def main():
    data = json.load(open(sys.argv[1]))
    obstacles = unary_union([Polygon(ring_pts(o["outer"]), [ring_pts(h) for h in o["holes"]]) for o in data["obstacles"]])
    buildings = [Polygon(ring_pts(o["outer"]), [ring_pts(h) for h in o["holes"]]) for o in data["buildings"]]
    boundary = Polygon(ring_pts(data["boundary"]))
    min_clear = math.inf
    worst = None
    outside = 0
    stub_bad = []
    g = nx.Graph()
    for seg in data["segments"]:
        pts = ring_pts(seg["points"])
        g.add_edge(seg["from"], seg["to"])
        line = LineString(pts)
        if seg["stub"]:
            # A stub is one straight piece from a point on a wall, perpendicular to that wall.
            if len(pts) != 2:
                stub_bad.append([seg["id"], "not straight"])
                continue
            p = Point(pts[0])
            hit = [b for b in buildings if b.exterior.distance(p) < 1e-6 or any(r.distance(p) < 1e-6 for r in b.interiors)]
            if not hit:
                continue  # a point of connection's stub: no wall
            b = hit[0]
            rings = [b.exterior] + list(b.interiors)
            ring = min(rings, key=lambda r: r.distance(p))
            cs = list(ring.coords)
            best = min(range(len(cs) - 1), key=lambda i: LineString([cs[i], cs[i + 1]]).distance(p))
            wx, wy = cs[best + 1][0] - cs[best][0], cs[best + 1][1] - cs[best][1]
            sx, sy = pts[1][0] - pts[0][0], pts[1][1] - pts[0][1]
            cosang = abs(wx * sx + wy * sy) / (math.hypot(wx, wy) * math.hypot(sx, sy))
            if cosang > 1e-6:
                stub_bad.append([seg["id"], "not perpendicular", cosang])
            if b.buffer(-1e-6).intersects(line):
                stub_bad.append([seg["id"], "enters the building"])
            continue
        d = line.distance(obstacles) if not obstacles.is_empty else math.inf
        if d < min_clear:
            min_clear, worst = d, seg["id"]
        if not boundary.buffer(1e-9).contains(line):
            outside += 1
    terms = [n["id"] for n in data["nodes"] if n["kind"] in ("service", "connection")]
    out = {
        "minClearance": None if min_clear == math.inf else min_clear,
        "worstSegment": worst,
        "segmentsOutsideBoundary": outside,
        "stubProblems": stub_bad,
        "isTree": g.number_of_nodes() > 0 and nx.is_tree(g),
        "terminalsInTree": sum(1 for t in terms if t in g),
        "terminals": len(terms),
    }
    print(json.dumps(out))


main()
