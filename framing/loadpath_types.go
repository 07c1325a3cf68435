package framing

import "framecheck/dxfimport"

// The drawing side of the load path (issue 17): posts, point-load marks
// and beams as drawn. framing finds them and what bears on what; it
// computes no load (the load-path solver does).

// Post is a post drawn on a posts layer: a CIRCLE, a small closed outline
// (a closed polyline or lines meeting end to end, at most maxPostIn
// across) or a block insert.
type Post struct {
	ID string // "P1", "P2", ... by centre y, then x
	At Point  // centre: of the circle, the outline's box, or the insert's entities
	// DrawnAs is "circle", "outline" or "block".
	DrawnAs string
	// SizeIn and DepthIn are the outline's drawn sides, smaller first
	// (an outline drawn 5.5 x 5.5 is a 6x6); 0 for a circle or a block.
	SizeIn, DepthIn float64
	// Pos is the circle, the outline's first entity, or the INSERT of a
	// block (dxfimport.Entity.From).
	Pos dxfimport.Pos
	// Text is the size callout beside the post ("4x4", "6x6 DF #1"): a
	// text inside its block, or the nearest text on a posts or label
	// layer within max(12 in, 3 text heights); "" when none.
	Text    string
	TextPos dxfimport.Pos
}

// PointLoads are the loads of a point load by type, lb: D, L, Lr, S, and
// wind toward (WindDownLb) and away from (WindUpLb) the member, strength
// level as [[zone]] gives wind.
type PointLoads struct {
	DeadLb, LiveLb, RoofLiveLb, SnowLb, WindDownLb, WindUpLb float64
}

// PointLoadMark is a point load drawn on a point-load layer: a POINT,
// CIRCLE or block insert with a text beside it that either names a
// [[point_load]] of the project (Name) or gives the loads ("P: 1200 D,
// 800 L", Loads). Err says why a mark cannot be used (no text, a text
// that cannot be read, on no member); such a mark is also an error
// finding naming its handle.
type PointLoadMark struct {
	At      Point
	Text    string        // the text as drawn, "" when none was found
	Pos     dxfimport.Pos // the mark (the INSERT of a block)
	TextPos dxfimport.Pos
	Name    string // the [[point_load]] named (as Options.PointLoadNames spells it), "" when Loads are given
	Loads   PointLoads
	Err     string
	// Member is the index into Plan.Members of the joist the mark sits
	// on, Beam the index into Plan.Beams of the beam; -1 for none (at
	// most one of them is set). AtIn is the position along it from its
	// Start.
	Member, Beam int
	AtIn         float64
}

// Beam is a support on a layer whose kind is not bearing-wall (a dropped
// or flush beam, a header, a girder, a ledger), drawn as one line or as
// several parallel lines (its plies or its outline), with what it bears
// on and what bears on it.
type Beam struct {
	ID    string // "B1", "B2", ... by midpoint y, then x
	Kind  string // the support kind: dropped-beam, flush-beam, ledger
	Layer string
	// Supports are the indices into Plan.Supports of its lines; Lines
	// the entities it is drawn with, each once (end caps of an outline
	// too).
	Supports []int
	Lines    []dxfimport.Pos
	// Start and End are the ends of its centre line, oriented as members
	// are (Start has the smaller coordinate along the direction, whose
	// angle is in (-90, 90] degrees).
	Start, End Point
	LengthIn   float64
	// WidthIn is the drawn width across its lines (0 for one line);
	// Plies the number of plies drawn (lines - 1 of several parallel
	// lines, 1 for one line or an outline of two).
	WidthIn float64
	Plies   int
	// Callout is the raw text of the size callout near the beam on a
	// label layer ("(3) 2x12", "5 1/8 x 12 GLB 24F-1.8E"), "" when none;
	// CalloutPos its position. Size is the designation framing reads from
	// it with ReadCallout ("(3) 2x12", "4x12"), "" when it is not a sawn
	// size (glulam, SCL: read by the caller) or there is no callout.
	Callout    string
	CalloutPos dxfimport.Pos
	Size       string
	// Bearings are its own supports, sorted along it. A beam with fewer
	// than two stays a rigid support (Rigid true) with a warning.
	Bearings []BeamBearing
	Rigid    bool
	// Carried are the joist bearings on its lines, sorted along it.
	Carried []Carried
	// CarriedBeams are the indices into Plan.Beams of the beams that
	// bear on this one (the Index of their "beam" bearing).
	CarriedBeams []int
	// Strips are the floor or roof strips it carries beside edge joists
	// that run parallel to it: the half of the gap between them that is
	// the beam's (the joists carry the other half, FRM221), sorted along
	// it.
	Strips   []BeamStrip
	Messages []string
}

// BeamStrip is a strip of a load zone a beam carries beside an edge
// joist: from FromIn to ToIn along the beam from Start, WidthIn wide (half
// the gap to the joist), loaded as the zone Zone is.
type BeamStrip struct {
	FromIn, ToIn, WidthIn float64
	Zone                  string
	Member                int // the edge joist, index into Plan.Members
}

// Beam bearing kinds.
const (
	BeamOnPost = "post"
	BeamOnWall = "wall"
	BeamOnBeam = "beam"
)

// BeamBearing is one support of a beam.
type BeamBearing struct {
	AtIn     float64 // along the beam from Start (may be a little < 0 or > LengthIn)
	LengthIn float64 // bearing length: the post's drawn size, the wall's thickness or bearing_in, the carrying beam's width
	Kind     string  // "post", "wall" or "beam"
	// Index is the index into Plan.Posts, Plan.Supports or Plan.Beams by
	// Kind.
	Index int
	Pos   dxfimport.Pos // the post, wall line or carrying beam's first line
}

// Carried is a joist bearing on a beam.
type Carried struct {
	Member  int     // index into Plan.Members
	Bearing int     // index into that member's Bearings
	AtIn    float64 // along the beam from Start
}
