// Package ncout writes a DSTV NC1 file (the German steel-construction
// association's open data-exchange standard for numerically controlled
// steel fabrication, "DSTV NC") of each piece of a cut sheet it is handed:
// the whole member and each plate. Like dxfout it draws what detail/sheet
// hands it (each Part: contour and holes in the part's frame) and knows
// nothing of limit states; the header's profile data it reads from the
// checked design (detail.Report) the sheet was laid out from.
//
// The layout was first written from memory of the standard's 7th edition
// ("Standard Description for Steel Structure Pieces for the Numerical
// Controls", DSTV, July 1998; only its title page and table of contents
// were read, at https://tr.scribd.com/document/35827607/En-Dstv-Standard-Description-for-Steel-Structure-Pieces-for-the-Numerical-Controls-V7).
// It has since been read against two open-source NC1 readers and the
// files other programs exported that their tests carry (readers_test.go
// names the files): Baseflow/DSTV.Net (C#) and tluijken/dstv (Rust). What
// they confirm: the header's 24 fields in the order below, each data line
// opened by two blanks, "**" comment lines, the length field "length" or
// "length, saw length", the profile codes, block ids of two capitals, a
// BO line "face x y diameter [depth]" or a slot's eight fields (depth
// with the letter l, then two elongations and an angle), AK lines "face x
// y radius", and a plate's header: height the width, flange width, flange
// and web thickness the thickness, weight in kg/m² (product2.NC1 writes
// 156.60 for a 20-mm plate, 7.83 kg/m² a mm; P465.nc and P1565.nc 80 and
// 160 for 10 and 20 mm). Free texts are cut at 80 characters, DSTV.Net's
// limit "according to specification". Still from memory: where each
// profile's y is measured from on its faces (the table below), the face
// of a tee's flange, a slot's reference point (we write its centre) and
// the radius field of rolled shapes (we write kdes − tf; one exported W
// file writes kdet − tf).
//
// A file is a sequence of blocks, each opened by its two-letter id on a
// line of its own: ST (the header), then AK (an outer contour) where the
// piece has one, BO (holes) where it has holes, and EN, which ends the
// file. Lines starting "**" are comments; every file carries the run
// stamp ("** gaugeline stamp: …") and the piece mark in comments right
// after ST. Data lines start with two blanks. The ST block has 24 data
// lines, in this order: order, drawing, phase, piece mark, steel grade,
// quantity, profile, profile code, length, profile height, flange width,
// flange thickness, web thickness, radius, weight per metre (kg/m; a
// plate's or flat bar's per square metre, kg/m²), painting surface per
// metre (m²/m), the four saw angles (web start, web end, flange start,
// flange end; 0: square cuts), and four lines of text. A field we have
// nothing for is written "-" (our choice).
//
// Units: millimetres and degrees, whatever the job's units (a US job's
// inches are converted exactly, ×25.4); numbers are written with three
// decimals (the standard, from memory, takes a decimal point and the
// places the writer needs), so a position reads back within 0.0005 mm.
//
// Profile codes and faces (from memory): the standard's face letters are
// v (front), o (top), u (bottom) and h (behind). On each face x runs along
// the piece from its start (our near cut end, x = 0 of the member frame)
// and y across the face. Our shapes map as follows:
//
//	shape          code  height       flange width  holes on  y on that face
//	angle, pair    L     connected A  outstanding B  v         from the heel (our y)
//	flat bar       B     width        thickness      v         from the edge y = 0 (our y)
//	channel, pair  U     depth d      bf             v (web)   from the flange at y = 0 (our y)
//	WT (flange)    T     depth d      bf             o         from the flange edge y = 0 (our y)
//	W (flanges)    I     depth d      bf             o and u   o: our y; u: bf − y
//	plate          B     width        thickness      v         the plate frame's y'
//
// A W's flanges are "drilled alike, seen from outside" (the sheet's
// note): seen from below, the bottom flange's y runs the other way, so a
// pattern off the web's centre line is mirrored there. A pair (double
// angle, double channel) is made "1 as shown and 1 opposite hand": where
// the opposite hand (the piece turned end for end: x → length − x) has
// other holes than the piece as shown, it is a file of its own,
// MARK-member-opp.nc1, each of the job's quantity; else one file of twice
// it.
//
// The outer contour (AK) is written for plates and flat bars (face v, the
// contour of the part, closed: its first point repeated last, a radius of
// 0 at each point); a rolled profile cut square needs none. Holes (BO):
// face, x, y, diameter; a slot adds the depth (0: through) with the
// slotted-hole letter l, then its elongation along x and along y (its
// length less its width) and its angle (0): x, y is the slot's centre.
//
// Marks appear in the header (the piece mark field) and in a comment,
// never on a contour or hole line. Output is byte-identical for the same
// sheet: no clock, fixed formats, "\n" line ends.
package ncout
