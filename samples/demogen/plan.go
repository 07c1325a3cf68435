package main

import "framecheck/samples/internal/dxfw"

// The demo building is the Dunmarrow Rigging Loft on Pellgrove Quay, a
// made-up two-storey timber workshop in a made-up harbour. It is 36 ft by
// 24 ft on wall centre-lines (432 in by 288 in). The drawing holds two
// plans side by side, in inches ($INSUNITS = 1):
//
//   - the second-floor framing plan, origin at the south-west corner of the
//     walls' centre-lines (0, 0);
//   - the roof framing plan, the same footprint shifted roofOffsetXIn to the
//     east.
//
// Everything below is data: retune a run by editing its row. Coordinates
// are plan-local; addPlan shifts them by the plan's offset.

// roofOffsetXIn is the x shift of the roof plan from the floor plan.
const roofOffsetXIn = 600.0

// Layer names. Roles come from the project file's glob patterns
// (JOIST*, WALL*, BEAM-FLUSH*, BEAM-DROPPED*, BLOCKING*, LOAD-ZONE*,
// FRAMING-NOTE*); the last five layers have no role and must be ignored.
const (
	lyJoistFloor  = "JOIST-FLOOR"
	lyJoistRoof   = "JOIST-ROOF"
	lyWallExt     = "WALL-EXT"
	lyWallInt     = "WALL-INT"
	lyBeamFlush   = "BEAM-FLUSH"
	lyBeamDropped = "BEAM-DROPPED"
	lyBlocking    = "BLOCKING-FLOOR"
	lyZoneFloor   = "LOAD-ZONE-FLOOR"
	lyZoneRoof    = "LOAD-ZONE-ROOF"
	lyNote        = "FRAMING-NOTE"
	lyGrid        = "GRID"
	lyDims        = "DIMS"
	lyOutline     = "ARCH-OUTLINE"
	lyNotes       = "GENERAL-NOTES"
	lyTitle       = "TITLE"
	// The loading canopy north of the loft (the load path).
	lyJoistCanopy = "JOIST-CANOPY"
	lyWallCanopy  = "WALL-CANOPY"
	lyBeamGirder  = "BEAM-GIRDER"
	lyBeamHeader  = "BEAM-HEADER"
	lyPost        = "POST"
	lyPointLoad   = "POINT-LOAD"
)

// planLayers is the LAYER table after layer "0", with ACI colours.
var planLayers = []dxfw.Layer{
	{Name: lyJoistFloor, Color: 3}, {Name: lyJoistRoof, Color: 4}, {Name: lyWallExt, Color: 7},
	{Name: lyWallInt, Color: 8}, {Name: lyBeamFlush, Color: 1}, {Name: lyBeamDropped, Color: 6},
	{Name: lyBlocking, Color: 30}, {Name: lyZoneFloor, Color: 5}, {Name: lyZoneRoof, Color: 5},
	{Name: lyNote, Color: 2}, {Name: lyGrid, Color: 9}, {Name: lyDims, Color: 9},
	{Name: lyOutline, Color: 8}, {Name: lyNotes, Color: 7}, {Name: lyTitle, Color: 7},
	{Name: lyJoistCanopy, Color: 3}, {Name: lyWallCanopy, Color: 7}, {Name: lyBeamGirder, Color: 1},
	{Name: lyBeamHeader, Color: 6}, {Name: lyPost, Color: 1}, {Name: lyPointLoad, Color: 2},
}

// joistRun is a row of equal parallel joists drawn as LINEs. Joist i
// starts at (X0In, Y0In) shifted i*SpacingIn across the run and runs
// LengthIn along +y (floor) or +x (AlongX, roof).
type joistRun struct {
	Name      string // our label for the run (README, report)
	Layer     string
	Zone      string // the load zone the run is meant to fall in (documentation)
	X0In      float64
	Y0In      float64
	AlongX    bool
	Count     int
	SpacingIn float64
	LengthIn  float64
	// CantileverIn is the overhang at the start of each joist, past the
	// centre-line of the wall it crosses (0: the start bears on a support).
	CantileverIn float64
	// ShortIn shortens joist i at its far end by the given inches: a
	// drafting error that leaves the end off its support.
	ShortIn map[int]float64
}

// seg is a LINE on a layer, plan-local coordinates.
type seg struct {
	Layer          string
	X1, Y1, X2, Y2 float64
}

// label is a TEXT, plan-local coordinates.
type label struct {
	Layer    string
	X, Y     float64
	HeightIn float64
	RotDeg   float64
	Text     string
}

// zone is a closed load-zone outline with its name written inside at
// (TextX, TextY).
type zone struct {
	Layer        string
	Name         string
	Pts          [][2]float64
	TextX, TextY float64
}

// circle is a CIRCLE (a post, a point-load mark), plan-local.
type circle struct {
	Layer     string
	X, Y, RIn float64
}

// plan is one framing plan of the drawing.
type plan struct {
	OffsetXIn float64
	Runs      []joistRun
	Lines     []seg // supports, span lines, blocking, grid, dimensions, outlines
	Zones     []zone
	Labels    []label
	Circles   []circle
}

// Exterior walls: 2x6 stud walls drawn as two lines 5.5 in apart, centre
// lines on x = 0, x = 432, y = 0, y = 288. Outer face +-2.75 in outside,
// inner face 2.75 in inside.
func exteriorWalls() []seg {
	const o, i = 2.75, 2.75
	return []seg{
		{lyWallExt, -o, -o, 432 + o, -o}, {lyWallExt, 432 + o, -o, 432 + o, 288 + o},
		{lyWallExt, 432 + o, 288 + o, -o, 288 + o}, {lyWallExt, -o, 288 + o, -o, -o},
		{lyWallExt, i, i, 432 - i, i}, {lyWallExt, 432 - i, i, 432 - i, 288 - i},
		{lyWallExt, 432 - i, 288 - i, i, 288 - i}, {lyWallExt, i, 288 - i, i, i},
	}
}

// gridAndDims draws grid lines A-B / 1-3 on the wall centre-lines and an
// overall dimension string on each plan (ignored layers).
func gridAndDims() ([]seg, []label) {
	lines := []seg{
		{lyGrid, 0, -70, 0, 330}, {lyGrid, 432, -70, 432, 330},
		{lyGrid, -40, 0, 472, 0}, {lyGrid, -40, 288, 472, 288},
		{lyDims, 0, -84, 432, -84}, {lyDims, 0, -90, 0, -78}, {lyDims, 432, -90, 432, -78},
		{lyDims, 490, 0, 490, 288}, {lyDims, 484, 0, 496, 0}, {lyDims, 484, 288, 496, 288},
	}
	labels := []label{
		{lyGrid, -3, 336, 8, 0, "A"}, {lyGrid, 429, 336, 8, 0, "B"},
		{lyGrid, -56, -4, 8, 0, "1"}, {lyGrid, -56, 284, 8, 0, "3"},
		{lyDims, 196, -80, 6, 0, `36'-0"`}, {lyDims, 486, 128, 6, 90, `24'-0"`},
	}
	return lines, labels
}

// floorPlan is the second floor: D 12 psf, L 40 psf (FLOOR), a storage
// bay at L 125 psf (STORAGE) and a balcony (BALCONY).
func floorPlan() plan {
	p := plan{OffsetXIn: 0}
	p.Runs = []joistRun{
		// F1: 2x10 @ 16 continuous over the interior wall: three bearings,
		// spans 144 + 144 (centre-lines y = 0, 144, 288). Ends 0.5 in inside
		// the exterior walls' outer faces.
		{Name: "F1 west bay, continuous", Layer: lyJoistFloor, Zone: "FLOOR",
			X0In: 16, Y0In: -2.25, Count: 12, SpacingIn: 16, LengthIn: 292.5},
		// F2: south wall to the flush beam (beam line y = 144), span 144,
		// no callout: takes the project's default size. Joist 3 (x = 256)
		// stops 6 in short of the beam: an error member.
		{Name: "F2 south-east bay", Layer: lyJoistFloor, Zone: "FLOOR",
			X0In: 208, Y0In: -2.25, Count: 7, SpacingIn: 16, LengthIn: 145.75,
			ShortIn: map[int]float64{3: 5.5}},
		// F3: balcony joists: flush beam to the south wall, then 42 in past
		// the wall centre-line as a cantilever.
		{Name: "F3 balcony cantilever", Layer: lyJoistFloor, Zone: "BALCONY",
			X0In: 320, Y0In: -42, Count: 7, SpacingIn: 16, LengthIn: 185.5, CantileverIn: 42},
		// F4: storage bay, flush beam to the north wall, span 144, drawn
		// 2x10 @ 16: undersized for 125 psf.
		{Name: "F4 storage bay", Layer: lyJoistFloor, Zone: "STORAGE",
			X0In: 208, Y0In: 144.5, Count: 14, SpacingIn: 16, LengthIn: 145.75},
	}
	p.Lines = append(p.Lines, exteriorWalls()...)
	p.Lines = append(p.Lines,
		// Interior 2x4 bearing wall, two lines 3.5 in apart, centre y = 144,
		// under the west bay only.
		seg{lyWallInt, 2.75, 142.25, 200, 142.25}, seg{lyWallInt, 2.75, 145.75, 200, 145.75},
		// Flush beam on its centre-line, joists hang from it in hangers.
		seg{lyBeamFlush, 200, 144, 429.25, 144},
		// Blocking already drawn at mid-span of both F1 spans.
		seg{lyBlocking, 10, 72, 198, 72}, seg{lyBlocking, 10, 216, 198, 216},
		// Span lines the size callouts sit on.
		seg{lyNote, 10, 108, 198, 108},  // F1
		seg{lyNote, 202, 228, 422, 228}, // F4
		seg{lyNote, 314, 60, 422, 60},   // F3
		// Balcony deck edge and guard (architectural outline, ignored).
		seg{lyOutline, 312, -2.75, 312, -43.5}, seg{lyOutline, 312, -43.5, 424, -43.5},
		seg{lyOutline, 424, -43.5, 424, -2.75},
	)
	p.Labels = []label{
		{lyNote, 30, 111, 6, 0, `2x10 @ 16" o.c.`},
		{lyNote, 230, 231, 6, 0, `2x10 @ 16" o.c.`},
		{lyNote, 326, 63, 6, 0, `2x12 @ 16" o.c.`},
		{lyNotes, 20, 40, 5, 0, "EXPOSED JOISTS - NO CEILING BELOW"},
		{lyTitle, 0, -130, 12, 0, "SECOND FLOOR FRAMING PLAN"},
	}
	p.Zones = []zone{
		{lyZoneFloor, "FLOOR", [][2]float64{{-8, -4}, {440, -4}, {440, 144}, {200, 144}, {200, 296}, {-8, 296}}, 230, 100},
		{lyZoneFloor, "STORAGE", [][2]float64{{200, 144}, {440, 144}, {440, 296}, {200, 296}}, 280, 262},
		{lyZoneFloor, "BALCONY", [][2]float64{{310, -50}, {426, -50}, {426, -4}, {310, -4}}, 340, -30},
	}
	g, gl := gridAndDims()
	p.Lines = append(p.Lines, g...)
	p.Labels = append(p.Labels, gl...)
	addCanopy(&p)
	return p
}

// addCanopy draws the loading canopy north of the loft, on the floor
// plan's sheet (y 400 to 544 in, so its members follow the loft's in the
// members' order): the load path of the demo. Ten 2x8 roof joists at 24 in
// span 144 in from a low wall (y = 400) to a glulam girder (y = 544) that
// hangs them in hangers and sits on two 6x6 posts (x = 0 and x = 240). The
// wall has a door opening from x = 96 to 144 in, bridged by a header that
// bears on the wall on both sides and carries the two joists over the
// opening. A hoist hangs from joist x = 60, 100 in from the wall (0.7 of
// the span): a point load. The zone outline reaches 20 in past the edge
// joists (x = -8 and 248): the canopy roof's overhang, which they carry.
func addCanopy(p *plan) {
	p.Runs = append(p.Runs, joistRun{Name: "C1 canopy", Layer: lyJoistCanopy, Zone: "CANOPY",
		X0In: 12, Y0In: 399.25, Count: 10, SpacingIn: 24, LengthIn: 144})
	p.Lines = append(p.Lines,
		seg{lyWallCanopy, -2, 400, 96, 400}, seg{lyWallCanopy, 144, 400, 242, 400},
		seg{lyBeamHeader, 90, 400, 150, 400},
		seg{lyBeamGirder, -6, 544, 246, 544},
		seg{lyNote, 6, 470, 234, 470},
	)
	p.Circles = append(p.Circles,
		circle{lyPost, 0, 544, 2.75}, circle{lyPost, 240, 544, 2.75},
		circle{lyPointLoad, 60, 500, 1.5},
	)
	p.Labels = append(p.Labels,
		label{lyNote, 160, 473, 6, 0, `2x8 @ 24" o.c.`},
		label{lyNote, 70, 552, 6, 0, "5 1/8 x 12 GLB 24F-1.8E"},
		label{lyPointLoad, 64, 503, 5, 0, "P: 400 D, 300 L"},
		label{lyNotes, 20, 580, 5, 0, "LOADING CANOPY - HOIST ON JOIST AT GRID 1.5"},
	)
	// The zone runs from the wall's centre-line to the girder's along the
	// joists (past either, its load would be on them, not on the joists)
	// and 8 in past the posts across them: the roof's overhang there,
	// which the edge joists carry.
	p.Zones = append(p.Zones, zone{lyZoneRoof, "CANOPY", [][2]float64{{-8, 400}, {248, 400}, {248, 544}, {-8, 544}}, 180, 430})
}

// roofPlan is the low-slope roof: joists run east-west at 24 in on centre
// over the exterior walls and two dropped beams (x = 144 and x = 264), so
// the three bays are three separate runs with spans 144, 120 and 168 in.
// The two end bays lie in the high-uplift ROOF-EDGE zone, the middle bay
// in ROOF-FIELD.
//
// Hand estimate of CL for the bottom edge under net uplift 0.6D+0.6W,
// NDS 2018 3.3.3 and Table 3.3.3, DF-L No.2 2x10 (b = 1.5, d = 9.25 in):
// Fb* = Fb CD CF Cr = 900 x 1.6 x 1.1 x 1.15 = 1821.6 psi,
// Emin' = 580,000 psi, FbE = 1.20 Emin' / RB^2, RB^2 = le d / b^2.
//
//	lu = 144 in (no blocking, west bay), lu/d = 15.6: le = 1.63 lu + 3d
//	   = 262.5 in, RB = 32.8, FbE = 645 psi, CL = 0.345, Fb' = 628 psi
//	lu =  72 in (one row, mid-span), lu/d = 7.8: le = 145.1 in,
//	   RB = 24.4, FbE = 1167 psi, CL = 0.596, Fb' = 1086 psi
//	lu = 168 in (no blocking, east bay): le = 301.6 in, RB = 35.2,
//	   FbE = 561 psi, CL = 0.302, Fb' = 550 psi
//	lu =  84 in (one row): le = 164.7 in, FbE = 1028 psi, CL = 0.534,
//	   Fb' = 972 psi
//	lu =  56 in (two rows, third points), lu/d = 6.05 < 7: le = 2.06 lu
//	   = 115.4 in, RB = 21.8, FbE = 1468 psi, CL = 0.716, Fb' = 1303 psi
//	lu = 120 in (no blocking, middle bay): le = 223.4 in, FbE = 758 psi,
//	   CL = 0.403, Fb' = 733 psi
//
// Net uplift ROOF-EDGE: 0.6 x 75 - 0.6 x 8 = 40.2 psf, w = 80.4 plf at
// 24 in: west bay M = w L^2/8 = 17,366 lb-in, fb = 812 psi: 1.29 with no
// blocking (fail), 0.75 with one row. East bay M = 23,638 lb-in, fb =
// 1105 psi: 2.01 bare, 1.14 with one row (fail), 0.85 with two rows.
// ROOF-FIELD: 0.6 x 40 - 0.6 x 8 = 19.2 psf, fb = 269 psi: 0.37 bare.
func roofPlan() plan {
	p := plan{OffsetXIn: roofOffsetXIn}
	p.Runs = []joistRun{
		{Name: "R1 west end bay", Layer: lyJoistRoof, Zone: "ROOF-EDGE",
			X0In: -2.25, Y0In: 24, AlongX: true, Count: 11, SpacingIn: 24, LengthIn: 145.5},
		{Name: "R2 middle bay", Layer: lyJoistRoof, Zone: "ROOF-FIELD",
			X0In: 144.75, Y0In: 24, AlongX: true, Count: 11, SpacingIn: 24, LengthIn: 118.5},
		{Name: "R3 east end bay", Layer: lyJoistRoof, Zone: "ROOF-EDGE",
			X0In: 264.75, Y0In: 24, AlongX: true, Count: 11, SpacingIn: 24, LengthIn: 169.5},
	}
	p.Lines = append(p.Lines, exteriorWalls()...)
	p.Lines = append(p.Lines,
		// Dropped beams on their centre-lines; joists butt over them, each
		// end 0.75 in short of the line.
		seg{lyBeamDropped, 144, 2.75, 144, 285.25},
		seg{lyBeamDropped, 264, 2.75, 264, 285.25},
		// Bay dimensions (ignored).
		seg{lyDims, 0, -60, 432, -60},
	)
	p.Labels = []label{
		{lyDims, 60, -56, 6, 0, `12'-0"`}, {lyDims, 190, -56, 6, 0, `10'-0"`},
		{lyDims, 330, -56, 6, 0, `14'-0"`},
		{lyNotes, 20, 300, 5, 0, "LOW-SLOPE ROOF - NO CEILING"},
		{lyTitle, 0, -130, 12, 0, "ROOF FRAMING PLAN"},
	}
	p.Zones = []zone{
		{lyZoneRoof, "ROOF-EDGE", [][2]float64{{-8, -8}, {144, -8}, {144, 296}, {-8, 296}}, 20, 150},
		{lyZoneRoof, "ROOF-FIELD", [][2]float64{{144, -8}, {264, -8}, {264, 296}, {144, 296}}, 166, 150},
		{lyZoneRoof, "ROOF-EDGE", [][2]float64{{264, -8}, {440, -8}, {440, 296}, {264, 296}}, 300, 150},
	}
	g, gl := gridAndDims()
	p.Lines = append(p.Lines, g...)
	p.Labels = append(p.Labels, gl...)
	return p
}
