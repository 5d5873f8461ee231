"""Independent checks for Furrow's DXF writer, run with /usr/bin/python3 (ezdxf 0.18).

  make <dir>          write input drawings (R12 and R2000/R2018, metres and feet) with ezdxf
  audit <file> [orig] print JSON: ezdxf audit errors, per-layer model-space counts, and a raw
                      tag-level check of handles, owners and $HANDSEED (ezdxf's low-level tagger)
  audit-many <files>  the same for each file, as one JSON list
"""
import json
import sys

import ezdxf
from ezdxf.lldxf.tagger import ascii_tags_loader


def make(outdir):
    # An invented site, Quillby Yard: two buildings, a road edge, a fence, a tree block, notes.
    for ver, tag in (("R12", "r12"), ("R2000", "r2000"), ("R2018", "r2018")):
        for units, code, k in (("m", 6, 1.0), ("ft", 2, 1 / 0.3048)):
            doc = ezdxf.new(ver)
            if ver != "R12":
                doc.header["$INSUNITS"] = code
            for name, color in (("BLDG", 3), ("ROAD-EDGE", 8), ("FENCE", 2), ("TREES", 3), ("NOTES", 7)):
                doc.layers.add(name, color=color)
            msp = doc.modelspace()
            ox, oy = 631200.0, 5402100.0  # a large, plausible local frame
            def P(x, y):
                return (ox + x * k, oy + y * k)
            boxes = [[(10, 10), (40, 10), (40, 30), (10, 30)], [(60, 12), (85, 12), (85, 40), (60, 40)]]
            for b in boxes:
                pts = [P(x, y) for x, y in b]
                if ver == "R12":
                    msp.add_polyline2d(pts, close=True, dxfattribs={"layer": "BLDG"})
                else:
                    msp.add_lwpolyline(pts, close=True, dxfattribs={"layer": "BLDG"})
            msp.add_line(P(0, 0), P(100, 0), dxfattribs={"layer": "ROAD-EDGE"})
            msp.add_line(P(0, 50), P(100, 50), dxfattribs={"layer": "FENCE"})
            blk = doc.blocks.new(name="TREE")
            blk.add_circle((0, 0), 1.5 * k)
            for x in (20, 50, 75):
                msp.add_blockref("TREE", P(x, 45), dxfattribs={"layer": "TREES"})
            msp.add_text("QUILLBY YARD", dxfattribs={"layer": "NOTES", "height": 2 * k, "insert": P(5, 55)})
            doc.saveas(f"{outdir}/site-{tag}-{units}.dxf")


def raw_check(path):
    """Handles unique, entities owned by *Model_Space, $HANDSEED above every handle (DXF reference)."""
    with open(path, "rt", encoding="cp1252", errors="replace") as fh:
        tags = list(ascii_tags_loader(fh))
    handles, seed, section, var = [], None, None, None
    ms_record, owners = None, []
    i = 0
    rec_type, rec_name, rec_handle, rec_owner = None, None, None, None

    def close():
        nonlocal ms_record
        if section == "TABLES" and rec_type == "BLOCK_RECORD" and (rec_name or "").upper() == "*MODEL_SPACE":
            ms_record = rec_handle
        if section == "ENTITIES" and rec_type not in (None, "ENDSEC", "SECTION"):
            owners.append((rec_type, rec_handle, rec_owner))

    while i < len(tags):
        code, value = tags[i].code, tags[i].value
        if code == 0:
            close()
            rec_type, rec_name, rec_handle, rec_owner = value, None, None, None
            if value == "SECTION":
                section = tags[i + 1].value
        elif section == "HEADER":
            if code == 9:
                var = value
            elif var == "$HANDSEED" and code == 5:
                seed = int(value, 16)
        else:
            # in DIMSTYLE records group 5 is the arrow block name (the handle is 105)
            if code == 105 or (code == 5 and rec_type != "DIMSTYLE"):
                handles.append(int(value, 16))
                rec_handle = value
            elif code == 330 and rec_owner is None:
                rec_owner = value
            elif code == 2 and rec_name is None:
                rec_name = value
        i += 1
    close()
    bad_owners = [o for o in owners if ms_record is not None and o[0] not in ("VERTEX", "SEQEND") and o[2] != ms_record]
    return {
        "handles": len(handles),
        "handlesUnique": len(handles) == len(set(handles)),
        "maxHandle": max(handles) if handles else -1,
        "handseed": seed,
        "modelSpaceRecord": ms_record,
        "entitiesNotOwnedByModelSpace": len(bad_owners),
    }


def polyline(e):
    if e.dxftype() == "LWPOLYLINE":
        pts = [[x, y] for x, y in e.get_points("xy")]
    else:
        pts = [[v.dxf.location.x, v.dxf.location.y] for v in e.vertices]
    return {"layer": e.dxf.layer, "closed": bool(e.closed if e.dxftype() == "LWPOLYLINE" else e.is_closed), "points": pts}


def audit(path):
    doc = ezdxf.readfile(path)
    auditor = doc.audit()
    counts = {}
    for e in doc.modelspace():
        layer = e.dxf.layer
        counts[layer] = counts.get(layer, 0) + 1
    texts = [e.dxf.text for e in doc.modelspace().query("TEXT")]
    return {
        "version": doc.dxfversion,
        "insunits": doc.header.get("$INSUNITS", None),
        "errors": len(auditor.errors),
        "errorMessages": [str(e.message) for e in auditor.errors][:10],
        "counts": counts,
        "layers": sorted(layer.dxf.name for layer in doc.layers),
        "texts": texts,
        "polylines": [polyline(e) for e in doc.modelspace().query("LWPOLYLINE POLYLINE")],
        "raw": raw_check(path),
    }


if __name__ == "__main__":
    if sys.argv[1] == "make":
        make(sys.argv[2])
    elif sys.argv[1] == "audit-many":
        print(json.dumps([audit(p) for p in sys.argv[2:]]))
    else:
        print(json.dumps(audit(sys.argv[2])))
