#!/usr/bin/python3
"""Build the Furrow demo site: Brackenrise Business Park, Ostrey County (an invented place).

Writes site.dxf (R2000, metres, $INSUNITS 6), services.csv and roles.json beside this script.
Deterministic: ezdxf's fixed-metadata switch pins dates and GUIDs; handles are sequential.
Run with the system Python that has ezdxf and shapely:  /usr/bin/python3 assets/demo/make_demo.py
"""

import json
import math
import os

import ezdxf
from ezdxf import path as ezpath
from shapely.geometry import Point, Polygon, LineString

# A local-grid-like frame: large coordinates exercise the importer's local-origin handling.
X0 = 512000.0
Y0 = 4180000.0
HERE = os.path.dirname(os.path.abspath(__file__))

Q = math.tan(math.radians(90.0) / 4.0)  # bulge of a quarter arc (bulge = tan(angle / 4))


def g(x, y):
    """Local site metres -> drawing coordinates."""
    return (X0 + x, Y0 + y)


# --- buildings (local metres); each ring counter-clockwise ------------------------------------
BUILDINGS = {
    "B1": [(20, 50), (60, 50), (60, 85), (20, 85)],
    "B2": [(70, 55), (130, 55), (130, 85), (70, 85)],
    "B3": [(20, 10), (75, 10), (75, 25), (45, 25), (45, 40), (20, 40)],  # L-shape
    "B4": [(160, 55), (200, 55), (200, 85), (160, 85)],
    "B5": [(210, 60), (250, 60), (250, 85), (210, 85)],
    "B6": [(262, 15), (290, 15), (290, 85), (270, 85), (270, 45), (262, 45)],  # L-shape
    "B7": [(20, 120), (55, 120), (55, 160), (20, 160)],
    "B8": [(65, 120), (125, 120), (125, 175), (65, 175)],  # has a courtyard
    "B9": [(135, 125), (165, 125), (165, 150), (135, 150)],
    "B10": [(175, 120), (230, 120), (230, 140), (200, 140), (200, 170), (175, 170)],  # L-shape
    "B11": [(240, 120), (285, 120), (285, 152), (240, 152)],
    "B12": [(240, 160), (285, 160), (285, 190), (240, 190)],
}
COURTYARDS = {"B8": [(82, 137), (108, 137), (108, 160), (82, 160)]}
NAMES = {
    "B1": "RIDGEWAY LAB", "B2": "OSTREY PRINT WORKS", "B3": "TANSY COLD STORE", "B4": "UNIT 4 OFFICES",
    "B5": "UNIT 5 OFFICES", "B6": "FENWRIGHT JOINERY", "B7": "CLINIC", "B8": "COURTYARD HOUSE",
    "B9": "PAVILION", "B10": "WORKSHOPS", "B11": "DEPOT NORTH", "B12": "DEPOT ANNEX",
}

# Service points on a wall facing the road (or the nearest open side), with the utilities each needs.
SERVICES = [
    ("S1", "B1", (45, 85), "power;telecom;water"),
    ("S2", "B2", (100, 85), "power;telecom;water;gas"),
    ("S3", "B3", (32, 40), "power;telecom"),
    ("S4", "B4", (180, 85), "power;telecom;water;gas"),
    ("S5", "B5", (230, 85), "power;telecom;water"),
    ("S6", "B6", (280, 85), "power;telecom;water;gas"),
    ("S7", "B7", (40, 120), "power;telecom;water"),
    ("S8", "B8", (95, 120), "power;telecom;water;gas"),
    ("S9", "B9", (150, 125), "power;telecom"),
    ("S10", "B10", (190, 120), "power;telecom;water;gas"),
    ("S11", "B11", (262, 120), "power;telecom;water"),
    ("S12", "B12", (240, 172), "power;telecom;water;gas"),
]
# One point of connection at the south property line, beside the entrance, in the verge.
CONNECTION = ("POC1", (125, 0.5), "power;telecom;water;gas")

BOUNDARY = [(0, 0), (300, 0), (300, 200), (40, 200), (0, 170)]

# Pavement: (vertex, bulge to next vertex). Entry road + east-west road, rounded ends, filleted junction.
ROAD = [
    ((140, 0), 0), ((150, 0), 0), ((150, 91), -Q), ((154, 95), 0), ((285, 95), 1.0),
    ((285, 105), 0), ((15, 105), 1.0), ((15, 95), 0), ((136, 95), -Q), ((140, 91), 0),
]


def rounded_rect(x0, y0, x1, y1, r):
    """Closed rectangle with quarter-arc corners of radius r, as (vertex, bulge) pairs, CCW."""
    return [
        ((x0 + r, y0), 0), ((x1 - r, y0), Q), ((x1, y0 + r), 0), ((x1, y1 - r), Q),
        ((x1 - r, y1), 0), ((x0 + r, y1), Q), ((x0, y1 - r), 0), ((x0, y0 + r), Q),
    ]


PARKING = [rounded_rect(85, 12, 141, 45, 4), rounded_rect(149, 12, 245, 45, 4)]

# Pond: an irregular closed outline with bulged (arc) edges.
POND = [((140, 166), 0.35), ((152, 162), 0.3), ((162, 170), 0.4), ((158, 182), 0.3), ((146, 184), 0.45)]
TREE_ZONE = ((58, 188), 6.0)  # tree-protection circle

FENCE = [(138, 2), (2, 2), (2, 169), (40.5, 198), (298, 198), (298, 2), (152, 2)]
EX_WATER = [[(2, 110), (298, 110)], [(137, 0), (137, 110)]]
STREET = [[(-20, -3), (320, -3)], [(-20, -15), (320, -15)]]
CONTOURS = [
    ([(-5, 30), (60, 48), (140, 52), (220, 40), (305, 58)], "101.0"),
    ([(-5, 90), (70, 102), (160, 112), (240, 96), (305, 118)], "102.0"),
    ([(-5, 150), (80, 164), (170, 190), (250, 158), (305, 178)], "103.0"),
]
TREES = [(8, 60), (8, 90), (8, 130), (292, 100), (292, 140), (200, 192), (130, 192)]

LAYERS = {
    # name: (ACI colour, role)
    "BLDG-OUTLINE": (7, "building"),
    "PAVE-ROAD": (8, "pavement"),
    "PAVE-PARKING": (9, "pavement"),
    "PROP-LINE": (1, "boundary"),
    "FENCE-CHAINLINK": (3, "crossing"),
    "EXIST-WATER": (5, "crossing"),
    "POND-EDGE": (4, "keep-out"),
    "TREE-PROTECT": (3, "keep-out"),
    "STREET-CURB": (8, "ignore"),
    "TOPO-CONTOUR": (252, "ignore"),
    "PLANT-TREE": (3, "ignore"),
    "ANNO-TEXT": (7, "ignore"),
}


def add_closed(msp, pts, layer):
    msp.add_lwpolyline([g(x, y) for x, y in pts], close=True, dxfattribs={"layer": layer})


def add_bulged(msp, verts, layer):
    data = [(*g(x, y), 0.0, 0.0, b) for (x, y), b in verts]
    msp.add_lwpolyline(data, format="xyseb", close=True, dxfattribs={"layer": layer})


def build():
    ezdxf.options.write_fixed_meta_data_for_testing = True
    doc = ezdxf.new("R2000", setup=False)
    doc.header["$INSUNITS"] = 6
    doc.header["$MEASUREMENT"] = 1
    for name, (color, _role) in LAYERS.items():
        doc.layers.add(name, color=color)
    msp = doc.modelspace()

    tree = doc.blocks.new(name="TREE-SYMBOL")
    tree.add_circle((0, 0), 2.5, dxfattribs={"layer": "0"})
    tree.add_line((-2.5, 0), (2.5, 0), dxfattribs={"layer": "0"})
    tree.add_line((0, -2.5), (0, 2.5), dxfattribs={"layer": "0"})

    add_closed(msp, BOUNDARY, "PROP-LINE")
    add_bulged(msp, ROAD, "PAVE-ROAD")
    for lot in PARKING:
        add_bulged(msp, lot, "PAVE-PARKING")
    for key in BUILDINGS:
        add_closed(msp, BUILDINGS[key], "BLDG-OUTLINE")
        if key in COURTYARDS:
            add_closed(msp, COURTYARDS[key], "BLDG-OUTLINE")
    add_bulged(msp, POND, "POND-EDGE")
    msp.add_circle(g(*TREE_ZONE[0]), TREE_ZONE[1], dxfattribs={"layer": "TREE-PROTECT"})
    msp.add_lwpolyline([g(x, y) for x, y in FENCE], dxfattribs={"layer": "FENCE-CHAINLINK"})
    for line in EX_WATER:
        msp.add_lwpolyline([g(x, y) for x, y in line], dxfattribs={"layer": "EXIST-WATER"})
    for line in STREET:
        msp.add_line(g(*line[0]), g(*line[1]), dxfattribs={"layer": "STREET-CURB"})
    for pts, label in CONTOURS:
        msp.add_spline([(*g(x, y), 0.0) for x, y in pts], dxfattribs={"layer": "TOPO-CONTOUR"})
        x, y = pts[2]
        msp.add_text(label, dxfattribs={"layer": "TOPO-CONTOUR", "height": 1.2, "insert": g(x, y + 0.8)})
    for x, y in TREES:
        msp.add_blockref("TREE-SYMBOL", g(x, y), dxfattribs={"layer": "PLANT-TREE"})

    def text(s, x, y, h):
        msp.add_text(s, dxfattribs={"layer": "ANNO-TEXT", "height": h, "insert": g(x, y)})

    text("BRACKENRISE BUSINESS PARK", 100, 205, 4.0)
    text("OSTREY COUNTY - SITE SURVEY - UNITS: METRES", 100, 212, 2.0)
    text("TANSY ROAD", 140, -11, 3.0)
    text("EXISTING WATER (APPROX.)", 180, 111, 1.2)
    text("POND", 146, 172, 2.0)
    text("TREE PROTECTION ZONE", 50, 178, 1.2)
    for key, ring in BUILDINGS.items():
        cx = sum(p[0] for p in ring) / len(ring)
        cy = sum(p[1] for p in ring) / len(ring)
        text(f"{key} {NAMES[key]}", cx - 8, cy, 1.5)
    return doc


def flatten(entity):
    return [(v.x - X0, v.y - Y0) for v in ezpath.make_path(entity).flattening(0.02)]


def self_check(doc):
    """Independent checks with shapely on the geometry as written (arcs flattened by ezdxf)."""
    polys = {key: Polygon(ring) for key, ring in BUILDINGS.items()}
    polys["B8"] = Polygon(BUILDINGS["B8"], [COURTYARDS["B8"]])
    keys = list(polys)
    for i, a in enumerate(keys):
        assert polys[a].is_valid, a
        for b in keys[i + 1:]:
            d = polys[a].distance(polys[b])
            assert d >= 6.0, f"gap {a}-{b} is {d:.2f} m (< 6 m)"
    keepouts = []
    for e in doc.modelspace():
        if e.dxf.layer in ("POND-EDGE", "TREE-PROTECT"):
            keepouts.append(Polygon(flatten(e)))
    assert len(keepouts) == 2
    for k in keepouts:
        for key, p in polys.items():
            assert p.distance(k) >= 6.0, f"{key} too close to a keep-out"
    boundary = Polygon(BOUNDARY)
    for key, p in polys.items():
        assert boundary.contains(p), key
    for sid, bkey, (x, y), _u in SERVICES:
        assert polys[bkey].exterior.distance(Point(x, y)) < 1e-9, f"{sid} is not on the wall of {bkey}"
    poc = Point(CONNECTION[1])
    assert boundary.contains(poc) and boundary.exterior.distance(poc) <= 1.0
    assert LineString(FENCE).distance(poc) > 1.0


def main():
    doc = build()
    self_check(doc)
    doc.saveas(os.path.join(HERE, "site.dxf"))
    with open(os.path.join(HERE, "services.csv"), "w", newline="\n") as f:
        f.write("id,x,y,role,utilities\n")
        cid, (cx, cy), cu = CONNECTION
        f.write(f"{cid},{X0 + cx:.3f},{Y0 + cy:.3f},connection,{cu}\n")
        for sid, _b, (x, y), u in SERVICES:
            f.write(f"{sid},{X0 + x:.3f},{Y0 + y:.3f},service,{u}\n")
    with open(os.path.join(HERE, "roles.json"), "w", newline="\n") as f:
        json.dump({name: role for name, (_c, role) in LAYERS.items()}, f, indent=2)
        f.write("\n")


if __name__ == "__main__":
    main()
