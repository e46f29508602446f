// Package section is the catalog of angle sizes and of W, WT, C and MC
// shapes, and the section properties computed from their geometry.
//
// Units: lengths in millimetres (units.Length), areas in mm² (units.Area),
// second moments in mm⁴ (plain float64, there being no typed quantity for
// them). US designations and dimensions are stored in exact inches (whole
// sixteenths) and converted on lookup; SI ones in millimetres.
//
// Axes: the origin is at the heel, the outer corner of the angle. Leg A, the
// connected leg, runs along +y; leg B, the outstanding leg, runs along +x;
// both outer faces lie on the axes, so every coordinate in the section is
// positive. Props.Xbar is the centroid's x, its distance from the outer face
// of leg A: the shear-lag eccentricity x̄ of AISC 360 Table D3.1 when leg A
// is bolted. Props.Ybar is the centroid's y. Iaa and Ibb are second moments
// about the centroidal axes parallel to leg A and leg B (AISC's y-y and x-x
// when leg A is vertical); Imin is the minor principal one (AISC z-z,
// EN 10056-1 v-v). Second moments are positive; no sign convention arises
// because the product of inertia is not exported.
//
// Geometry: an angle is two rectangles (leg A at full length, leg B beyond
// leg A's thickness), plus the root fillet piece of area (1 − π/4)·R1² in
// the inner corner, less a piece of area (1 − π/4)·R2² at the inner corner
// of each toe. The corner pieces are computed exactly (square less quarter
// disc, each with its own centroid and second moments), not as points.
//
// Catalogs:
//
//   - US: the common angle sizes of the AISC Steel Construction Manual,
//     Table 1-7, as the AISC Shapes Database v15.0 lists them, with each
//     size's published A, x̄, ȳ, rx, ry, rz and detailing kdet (K), read
//     (angle_table.go). Properties returns the published values (the
//     database's take in the root fillet and rounded toes); Geometric
//     gives the two-rectangle section (R1 = R2 = 0), used for drawing and
//     as a check on every row: the two agree within 1.7 % in A, 2.3 % in
//     x̄ and ȳ, 1.5 % in rx and ry and 2.6 % in rz.
//   - SI: EN 10056-1 equal and unequal angles with their root and toe radii
//     r1, r2, read from two section tables of the standard's angles (the
//     SCI Blue Book; ArcelorMittal's catalogue for the sizes it lacks);
//     K = T + R1. Properties are the geometry's (radii included); against
//     every published row (en10056_test.go) they agree within 0.6 % in A,
//     e (ey, ez) and iv. L135x65x8, L135x65x10 and L150x75x9 are in neither
//     table and stay from memory.
//
// Catalog order is the order of the source table: AISC lists large sizes
// and thick plates first, EN 10056-1 small first.
//
// Rolled shapes (shapes.go; LookupW, LookupWT, LookupC): a small US catalog
// of W, WT, C and MC sizes by their nominal dimensions d, bf, tw, tf and
// kdes, and for W and WT the detailing k1 (Shape.K1, a WT's that of the W
// it is cut from), read from the AISC Shapes Database v15.0. No SI sizes
// yet.
//
//   - Axes: x across the flanges, y along the web (stem). Ix and Iy are
//     about the centroidal axes parallel to x and y; Rx, Ry their radii.
//     Xbar is measured from a flange toe for W and WT (bf/2) and from the
//     back of the web for channels (x̄, the shear-lag eccentricity of a
//     web-bolted channel); Ybar from a flange's outer face: ȳ of a WT, the
//     eccentricity of a flange-bolted tee, and d/2 for W and channels.
//   - W and WT: rectangles (flanges, web or stem) plus a root fillet in
//     each web-flange corner of radius kdes − tf, computed exactly (square
//     less quarter disc). Within 1 % of the table in A, ȳ, rx and ry.
//   - C: tf is the average flange thickness, taken halfway along the
//     flange's inner face, which slopes 2 in 12 (CSlope); the flange is a
//     trapezoid of area (bf − tw)·tf. The fillet and the rounded toes are
//     left out (A runs up to 1 % low). Within 1.5 % of the table.
//   - MC: modelled with parallel flanges (their slope varies and was not
//     read in a source); that puts x̄ and ry 4 to 6 % high, so the catalog
//     carries the tabulated x̄ and ry (ShapeProps.Carried; Iy = A·ry²).
//     Geometry gives the uncorrected values.
package section
