#!/usr/bin/python3
"""Write the whole-piece fixtures of `gaugeline reverify` with an
independent DXF writer (Debian's python3-ezdxf): a whole member with both
ends' holes, and a far end's own plate.

Run from anywhere:  /usr/bin/python3 testdata/measured/make_piece_fixtures.py

Every number here is an input (the job's hole pattern, a deliberate
fabrication error), not an expected result:
  ../jobs/us-brace-16ft.yaml   L4x4x1/2 (4-in connected leg), 16 ft = 192 in, far_end mirror,
                               7/8-in bolts, end 1-1/2, pitch 3, gage 2-1/2 (in): near holes at
                               x = 1.5 4.5 7.5 10.5, far holes at x = 192 - those, y = 2.5
  ../jobs/us-brace-two-ends.yaml  far end: 3 x 7/8-in bolts, end 1-1/2, pitch 3, gage 2-1/2 in,
                               plate 10 in wide, edge 1-1/2 in; in the plate's frame (x' = free
                               edge - x, y' = top side - y): holes at x' = 1.5 4.5 7.5, y' = 5
Hole size: AISC 360-22 Table J3.3, 7/8-in bolt standard hole 15/16 in.
"""
import csv
import os

import ezdxf

HERE = os.path.dirname(os.path.abspath(__file__))
HOLE = 15 / 16
LENGTH = 192.0
LEG = 4.0
NEAR = [(1.5 + 3 * i, 2.5) for i in range(4)]
FAR = [(LENGTH - x, y) for x, y in NEAR]


def part(name, length, width, holes):
    doc = ezdxf.new("R2000")
    doc.header["$INSUNITS"] = 1
    msp = doc.modelspace()
    msp.add_lwpolyline([(0, 0), (length, 0), (length, width), (0, width)], close=True, dxfattribs={"layer": "contour"})
    for x, y in holes:
        msp.add_circle((x, y), HOLE / 2, dxfattribs={"layer": "holes"})
    msp.add_text("as measured", dxfattribs={"layer": "notes", "height": 0.25}).set_placement((1, width + 1))
    doc.saveas(os.path.join(HERE, name))


def main():
    part("br-16-member-nominal-r2000.dxf", LENGTH, LEG, NEAR + FAR)
    off = list(FAR)
    off[2] = (off[2][0], off[2][1] + 0.25)   # F3 drilled 1/4 in off across the leg
    part("br-16-member-far-off-r2000.dxf", LENGTH, LEG, NEAR + off)
    part("br-16-member-short-r2000.dxf", LENGTH - 0.5, LEG, NEAR + FAR)  # cut 1/2 in short at the far end
    with open(os.path.join(HERE, "br-16-member-nominal.csv"), "w", newline="") as f:
        f.write("# BR-16 whole member as measured, inches from the near cut end and the heel\n")
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["id", "x", "y", "diameter"])
        for i, (x, y) in enumerate(NEAR + FAR):
            w.writerow(["M%d" % (i + 1), "%.4f" % x, "%.4f" % y, "%.4f" % HOLE])
    part("br-20-far-plate-r2000.dxf", 13.5, 10.0, [(1.5 + 3 * i, 5.0) for i in range(3)])


if __name__ == "__main__":
    main()
