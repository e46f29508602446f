#!/usr/bin/python3
"""Write the measured-part fixtures of `gaugeline reverify` with an
independent DXF writer (Debian's python3-ezdxf), as a shop's CAM system, a
scanner or a CAD program would: R12, R2000 and R2018, with the noise such
files carry (MTEXT, TEXT, DIMENSION, HATCH, INSERT of a block holding a
circle, ARC, R12 POLYLINE, circles outside the part).

Run from anywhere:  /usr/bin/python3 testdata/measured/make_fixtures.py [--out DIR]
(--out writes elsewhere: the Go tests regenerate into a temporary folder
and check the committed files read the same.)

Every number here is an input (a designed hole pattern, a deliberate
fabrication error), not an expected result. The patterns follow the jobs:
  hb-7-qa.yaml, ../jobs/us-single-angle.yaml  3/4-in bolts, end 1-1/2, pitch 3, gage 2-1/2 (in)
  ../jobs/si-double-angle.yaml, td-21-sc.yaml M20, end 40, pitch 70, gage 55 (mm)
  ../jobs/si-slotted.yaml                     M20 short slots 22 x 26 transverse, end 40, pitch 65, gage 65 (mm)
Hole sizes are AISC 360-22 Table J3.3 / J3.3M nominal: 13/16 in, 22 mm.
"""
import argparse
import math
import os

import ezdxf

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = HERE
IN = 25.4

US_HOLES = [(1.5 + 3 * i, 2.5, 13 / 16) for i in range(4)]      # inches
US_LEG = 4.0                                                       # L4x4x1/2 connected leg
US_LENGTH = 10.5 + 6.0
TD_HOLES = [(40 + 70 * i, 55, 22.0) for i in range(3)]           # mm
TD_LEG = 100.0                                                     # L100x75x8 connected leg
TD_LENGTH = 180 + 160.0
KB_SLOTS = [(40 + 65 * i, 65, 22.0, 26.0) for i in range(4)]     # mm, width x length, long axis along y
KB_LEG = 120.0
KB_LENGTH = 235 + 160.0


def new(version, insunits):
    doc = ezdxf.new(version)
    if insunits is not None:
        doc.header["$INSUNITS"] = insunits
    for name in ("contour", "holes", "notes", "dimensions"):
        if name not in doc.layers:
            doc.layers.new(name)
    blk = doc.blocks.new("BOLTSYM")
    blk.add_circle((0, 0), 0.4 * scale_of(insunits))
    blk.add_line((-0.5 * scale_of(insunits), 0), (0.5 * scale_of(insunits), 0))
    return doc


def scale_of(insunits):
    return 25.4 if insunits == 4 else 1.0


def contour_lwpolyline(msp, w, h, rounded=0.0):
    """Closed outline; rounded > 0 rounds the two far corners with bulges."""
    if rounded:
        b = math.tan(math.pi / 8)  # a quarter circle
        pts = [(0, 0, 0), (w - rounded, 0, b), (w, rounded, 0), (w, h - rounded, b), (w - rounded, h, 0), (0, h, 0)]
        msp.add_lwpolyline(pts, format="xyb", close=True, dxfattribs={"layer": "contour"})
    else:
        msp.add_lwpolyline([(0, 0), (w, 0), (w, h), (0, h)], close=True, dxfattribs={"layer": "contour"})


def contour_polyline(msp, w, h):
    msp.add_polyline2d([(0, 0), (w, 0), (w, h), (0, h)], close=True, dxfattribs={"layer": "contour"})


def contour_lines(msp, w, h):
    pts = [(0, 0), (w, 0), (w, h), (0, h)]
    for a, b in zip(pts, pts[1:] + pts[:1]):
        msp.add_line(a, b, dxfattribs={"layer": "contour"})


def noise(doc, msp, w, h, k):
    """What CAD and CAM files carry besides the part. k scales to the file's unit."""
    v = doc.dxfversion
    msp.add_text("PART MARK", dxfattribs={"layer": "notes", "height": 0.25 * k}).set_pos((0.5 * k, h + 0.5 * k))
    msp.add_blockref("BOLTSYM", (w / 2, h / 2 + 0.3 * k))          # a block with a circle: not a hole
    msp.add_blockref("BOLTSYM", (w + 3 * k, h + 3 * k))
    msp.add_arc((w + 2 * k, -2 * k), 0.5 * k, 0, 120)                 # a lone arc
    msp.add_polyline2d([(0, h + k), (w / 3, h + 2 * k), (w / 2, h + 2 * k)], dxfattribs={"layer": "notes"})  # R12 POLYLINE, open
    msp.add_circle((-3 * k, -3 * k), 0.3 * k, dxfattribs={"layer": "notes"})  # a circle outside the part
    dim = msp.add_linear_dim(base=(0, -1.5 * k), p1=(0, 0), p2=(w, 0), dxfattribs={"layer": "dimensions"})
    dim.render()
    if v != "AC1009":
        msp.add_mtext("NOTES:\\PDEBURR ALL HOLES", dxfattribs={"layer": "notes", "char_height": 0.2 * k}).set_location((w + k, h))
        hatch = msp.add_hatch(color=3, dxfattribs={"layer": "notes"})
        hatch.paths.add_polyline_path([(w + k, 0), (w + 2 * k, 0), (w + 2 * k, k), (w + k, k)], is_closed=True)
        msp.add_solid([(w + 3 * k, 0), (w + 4 * k, 0), (w + 3 * k, k)])


def save(doc, name):
    path = os.path.join(OUT, name)
    doc.saveas(path)
    print("wrote", name)


def write_us(name, version, holes, insunits=1, contour="lwpolyline"):
    k = scale_of(insunits)
    doc = new(version, insunits)
    msp = doc.modelspace()
    w, h = US_LENGTH * k, US_LEG * k
    {"lwpolyline": contour_lwpolyline, "polyline": contour_polyline, "lines": contour_lines}[contour](msp, w, h)
    for x, y, d in holes:
        msp.add_circle((x * k, y * k), d * k / 2, dxfattribs={"layer": "holes"})
    noise(doc, msp, w, h, k)
    save(doc, name)


def write_td(name, version, holes, transform=None, mirrored=(), rounded=0.0, contour="lwpolyline", extra_circles=False):
    doc = new(version, 4)
    msp = doc.modelspace()
    w, h = TD_LENGTH, TD_LEG
    tf = transform or (lambda p: p)
    if transform:
        pts = [tf(p) for p in [(0, 0), (w, 0), (w, h), (0, h)]]
        msp.add_lwpolyline(pts, close=True, dxfattribs={"layer": "contour"})
    elif contour == "polyline":
        contour_polyline(msp, w, h)
    else:
        contour_lwpolyline(msp, w, h, rounded)
    for i, (x, y, d) in enumerate(holes):
        cx, cy = tf((x, y))
        if i in mirrored:
            # drawn mirrored, as some CAD programs do: OCS extrusion (0, 0, -1), x negated
            msp.add_circle((-cx, cy), d / 2, dxfattribs={"layer": "holes", "extrusion": (0, 0, -1)})
        else:
            msp.add_circle((cx, cy), d / 2, dxfattribs={"layer": "holes"})
        if extra_circles:
            # a bolt-head symbol ring on another layer, concentric with the hole
            msp.add_circle((cx, cy), d, dxfattribs={"layer": "notes"})
    noise(doc, msp, w, h, 25.4)
    save(doc, name)


def write_kb(name, version):
    doc = new(version, 4)
    msp = doc.modelspace()
    w, h = KB_LENGTH, KB_LEG
    if version == "R12":
        contour_polyline(msp, w, h)
    else:
        contour_lwpolyline(msp, w, h)
    for x, y, wd, ln in KB_SLOTS:
        r, half = wd / 2, (ln - wd) / 2
        # stadium, long axis along y: right side up, top half circle, left side down, bottom half circle;
        # each bulge belongs to the vertex it follows
        pts = [(x + r, y - half, 0), (x + r, y + half, 1), (x - r, y + half, 0), (x - r, y - half, 1)]
        if version == "R12":
            pl = msp.add_polyline2d([(p[0], p[1]) for p in pts], close=True, dxfattribs={"layer": "holes"})
            for v, p in zip(pl.vertices, pts):
                v.dxf.bulge = p[2]
        else:
            msp.add_lwpolyline(pts, format="xyb", close=True, dxfattribs={"layer": "holes"})
    noise(doc, msp, w, h, 25.4)
    save(doc, name)


def write_csv(name, header, rows, comment):
    with open(os.path.join(OUT, name), "w") as f:
        f.write("# " + comment + "\n")
        if header:
            f.write(header + "\n")
        f.write("\n")
        for r in rows:
            f.write(",".join(str(v) for v in r) + "\n")
    print("wrote", name)


def rotate(theta_deg, dx, dy):
    t = math.radians(theta_deg)
    c, s = math.cos(t), math.sin(t)
    return lambda p: (c * p[0] - s * p[1] + dx, s * p[0] + c * p[1] + dy)


def main():
    global OUT
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", default=HERE, help="folder to write to (default: beside this script)")
    OUT = ap.parse_args().out
    nominal = US_HOLES
    shifted = [(x + (0.1 if i == 1 else 0), y, d) for i, (x, y, d) in enumerate(US_HOLES)]
    end_short = [(0.9 if i == 0 else x, y, d) for i, (x, y, d) in enumerate(US_HOLES)]
    missing = [h for i, h in enumerate(US_HOLES) if i != 2]
    enlarged = [(x, y, 0.9 if i == 2 else d) for i, (x, y, d) in enumerate(US_HOLES)]

    write_us("hb-7-qa-nominal-r12.dxf", "R12", nominal, contour="polyline")
    write_us("hb-7-qa-nominal-mm-r2000.dxf", "R2000", nominal, insunits=4)
    write_us("hb-7-qa-shifted-r2018.dxf", "R2018", shifted, contour="lines")
    write_us("hb-7-qa-end-short-r2000.dxf", "R2000", end_short)
    write_us("hb-7-qa-missing-r12.dxf", "R12", missing, contour="polyline")
    write_us("hb-7-qa-enlarged-r2018.dxf", "R2018", enlarged)
    write_us("hb-7-nominal-r2000.dxf", "R2000", nominal)

    write_td("td-21-nominal-r2018.dxf", "R2018", TD_HOLES, mirrored=(1,), rounded=10.0)
    write_td("td-21-nominal-r12.dxf", "R12", TD_HOLES, contour="polyline", extra_circles=True)
    td_enl = [(x, y, 23.5 if i == 1 else d) for i, (x, y, d) in enumerate(TD_HOLES)]
    write_td("td-21-sc-enlarged-r2000.dxf", "R2000", td_enl)
    # a scan: the part lies rotated 2.5 degrees and shifted (123.4, -56.7) mm in the scanner's frame
    write_td("td-21-scanned-r2018.dxf", "R2018", TD_HOLES, transform=rotate(2.5, 123.4, -56.7))

    write_kb("kb-40-slots-r2018.dxf", "R2018")
    write_kb("kb-40-slots-r12.dxf", "R12")

    write_csv("hb-7-qa-nominal.csv", "x,y,diameter,id", [(x, y, d, "H%d" % (i + 1)) for i, (x, y, d) in enumerate(nominal)],
              "HB-7-QA as measured, inches (the job's units), all holes nominal")
    write_csv("hb-7-qa-shifted.csv", "x_in,y_in,diameter_in", shifted, "HB-7-QA, H2 drilled 0.1 in long")
    write_csv("hb-7-qa-mm.csv", "x_mm;y_mm;diameter_mm".replace(";", ","),
              [(round(x * IN, 3), round(y * IN, 3), round(d * IN, 3)) for x, y, d in nominal], "HB-7-QA measured in mm")
    write_csv("td-21-nominal.csv", None, TD_HOLES, "TD-21.b as measured, mm (the job's units), no header")


if __name__ == "__main__":
    main()
