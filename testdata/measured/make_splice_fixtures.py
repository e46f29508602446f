#!/usr/bin/python3
"""Write the splice-plate and end-stub fixtures of `gaugeline reverify`
with an independent DXF writer (Debian's python3-ezdxf).

Run from anywhere:  /usr/bin/python3 testdata/measured/make_splice_fixtures.py

Every number here is an input (the job's hole pattern, a deliberate
fabrication error), not an expected result:
  ../jobs/us-double-splice.yaml  DS-12: 2 lines of 3 x 7/8-in bolts, end 1-1/2, pitch 3 in, gage 2 and
                                 gage2 4 (lines at y = 2 and 6 in), plate 8 in wide, edge 1-1/2 in, gap 1/4 in.
                                 Member A's holes at x = 1.5 4.5 7.5; the plate's free edge past them at
                                 7.5 + 1.5 = 9; member B's group A's mirrored about the joint, x = -0.25 - x.
                                 In the splice plate's frame (x' = 9 - x, y' = 8 - y; its CAM file's):
                                 A at x' = 7.5 4.5 1.5, B at x' = 9.25 + 1.5 ... = 10.75 13.75 16.75,
                                 y' = 6 and 2; the plate 2 x 9 + 0.25 = 18.25 in long.
  ../jobs/us-brace-16ft.yaml     BR-16: one end stub, 4 x 7/8-in bolts, end 1-1/2, pitch 3, gage 2-1/2 in:
                                 holes at x = 1.5 4.5 7.5 10.5, y = 2.5 from that end's cut end and the heel.
Hole size: AISC 360-22 Table J3.3, 7/8-in bolt standard hole 15/16 in.
"""
import csv
import os

import ezdxf

HERE = os.path.dirname(os.path.abspath(__file__))
HOLE = 15 / 16
PLATE_L, PLATE_W = 18.25, 8.0
A = [(x, y) for y in (6.0, 2.0) for x in (7.5, 4.5, 1.5)]
B = [(x, y) for y in (6.0, 2.0) for x in (10.75, 13.75, 16.75)]


def plate(name, holes, shift=(0.0, 0.0)):
    doc = ezdxf.new("R2000")
    doc.header["$INSUNITS"] = 1
    msp = doc.modelspace()
    sx, sy = shift
    corners = [(0, 0), (PLATE_L, 0), (PLATE_L, PLATE_W), (0, PLATE_W)]
    msp.add_lwpolyline([(x + sx, y + sy) for x, y in corners], close=True, dxfattribs={"layer": "contour"})
    for x, y in holes:
        msp.add_circle((x + sx, y + sy), HOLE / 2, dxfattribs={"layer": "holes"})
    msp.add_text("splice plate as measured", dxfattribs={"layer": "notes", "height": 0.25}).set_placement((1 + sx, PLATE_W + 1 + sy))
    doc.saveas(os.path.join(HERE, name))


def main():
    plate("ds-12-splice-nominal-r2000.dxf", A + B)
    off = list(B)
    off[1] = (off[1][0], off[1][1] + 0.25)  # B's second hole (BH2, x' = 13.75) drilled 1/4 in off across
    plate("ds-12-splice-b-off-shifted-r2000.dxf", A + off, shift=(0.5, 0.0))  # the whole plate 1/2 in along x
    short = list(B)
    short[2] = (short[2][0] + 0.5, short[2][1])  # B's third hole (BH3) 1/2 in toward the plate's far end: 1 in from it
    plate("ds-12-splice-b-end-r2000.dxf", A + short + [(12.25, 4.0)])  # and a hole not in the design, between B's lines
    with open(os.path.join(HERE, "br-16-end-stub.csv"), "w", newline="") as f:
        f.write("# BR-16 one end measured alone (an end stub), inches from that end's cut end and the heel\n")
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["id", "x", "y", "diameter"])
        for i, x in enumerate([1.5, 4.5, 7.5, 10.5]):
            w.writerow(["S%d" % (i + 1), "%.4f" % x, "2.5000", "%.4f" % HOLE])


if __name__ == "__main__":
    main()
