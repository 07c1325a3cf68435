// Package samples holds framecheck's demo scenario, embedded so that
// `framecheck demo` runs from any folder with no files at hand.
//
// # The building
//
// The Dunmarrow Rigging Loft on Pellgrove Quay (a made-up workshop in a
// made-up harbour) is 36 ft by 24 ft on wall centre-lines. DemoPlan is
// one ASCII DXF R2000 in inches with two plans side by side: the second
// floor at the origin and the roof 600 in to the east. DemoProject is its
// project file (framecheck.toml). Both are written by the program in
// samples/demogen and checked by this package's tests; samples/README.md
// tells the same story for people.
//
// # What each part exercises
//
// Second floor (layer JOIST-FLOOR, 2x6 exterior walls drawn as two lines
// 5.5 in apart on WALL-EXT, a 2x4 interior wall 3.5 in thick on WALL-INT,
// a single-line flush beam on BEAM-FLUSH at y = 144 in):
//
//   - F1, west bay, 12 joists 2x10 @ 16 (callout on a span line): one
//     piece continuous over the interior wall, three bearings, spans
//     144 + 144 in, zone FLOOR (D 12, L 40 psf). Negative moment over the
//     wall puts the bottom edge in compression; unbraced (lu = 144 in,
//     le = 1.84 lu) fb/Fb' = 700/605 = 1.16. Two blocking rows already
//     drawn on BLOCKING-FLOOR at mid-span (lu = 72 in) bring it to
//     700/942 = 0.74: passes as drawn, no rows to add.
//   - F2, south-east bay, 7 joists with no callout: the project default
//     2x12 @ 16, south wall to the flush beam (hangers), span 144 in,
//     passes (bending 0.46). Its fourth joist (x = 256 in) stops 6 in
//     short of the beam: an error member; its neighbours still count it
//     for tributary width.
//   - F3, balcony, 7 joists 2x12 @ 16 (callout): flush beam to the south
//     wall, then a 42 in cantilever past the wall centre-line. They cross
//     from zone FLOOR into BALCONY (L 60 psf), so they take the envelope
//     with a message. Pattern loading governs: bending-top 0.62 (live on
//     the back-span only), cantilever tip deflection 0.52 of 2a/360.
//   - F4, storage bay, 14 joists drawn 2x10 @ 16 (callout), flush beam
//     to the north wall, span 144 in, zone STORAGE (L 125 psf): fails
//     bending (fb 1845 psi against Fb' 1139 psi, 1.62) and live-load
//     deflection (0.49 in against L/360 = 0.40 in, 1.23). Sizing at the
//     same spacing picks 2x14 (0.97); 2x12 @ 12 would pass at 0.90.
//
// Roof (layer JOIST-ROOF, 2x10 @ 24 from the [[lumber.by_layer]]
// override, east-west over the exterior walls and two single-line
// dropped beams on BEAM-DROPPED at x = 144 and 264 in, so three runs):
//
//   - R1, west end bay, span 144 in, zone ROOF-EDGE (D 8, W up 75 psf):
//     net uplift 0.6D+0.6W = 40.2 psf compresses the bottom edge, braced
//     only at the bearings: fb 812 psi against Fb' 628 psi (CL 0.345),
//     1.29, fails; one row at mid-span gives CL 0.596, 0.75: 1 row.
//   - R2, middle bay, span 120 in, zone ROOF-FIELD (W up 40 psf): net
//     19.2 psf, fb 269 psi against Fb' 733 psi unbraced, 0.37: no rows.
//   - R3, east end bay, span 168 in, zone ROOF-EDGE: fb 1105 psi; bare
//     2.01, one row 1.14 (still fails), two rows at third points 0.85:
//     2 rows. With 2x12 by_layer it needs 1 row (0.96).
//
// Entities on GRID, DIMS, ARCH-OUTLINE, GENERAL-NOTES and TITLE (lines,
// texts, a title-block polyline) have no role and must be ignored.
// Load zones are closed LWPOLYLINEs on LOAD-ZONE-FLOOR / LOAD-ZONE-ROOF
// with the zone name as TEXT inside; ROOF-EDGE is drawn twice.
package samples

import _ "embed" // for the go:embed directives below

// DemoPlanName is the file name of the demo plan, as reports should show it.
const DemoPlanName = "plan.dxf"

// DemoPlan is demo/plan.dxf: the framing plans of the Dunmarrow Rigging
// Loft, ASCII DXF R2000 in inches. Regenerate it with
// `go run ./samples/demogen -o samples/demo`.
//
//go:embed demo/plan.dxf
var DemoPlan []byte

// DemoProject is demo/framecheck.toml, the project file for DemoPlan.
//
//go:embed demo/framecheck.toml
var DemoProject []byte
