package framing

import "framecheck/dxfimport"

// Plan is what Group returns: the members of a framing plan and what was
// found about the drawing on the way.
type Plan struct {
	Members  []Member      // sorted by midpoint y, then x; Member.ID is "M" + 1-based index
	Runs     []Run         // adjacent parallel joists sharing their bearings
	Supports []Support     // support lines after double-wall merging
	Zones    []ZoneOutline // load-zone outlines with their names
	// DrawnBlocking are the blocking pieces drawn on joist layers: they
	// brace the members they join and are counted in the takeoff as
	// existing blocking; they are not members.
	DrawnBlocking []DrawnBlock
	// Posts, PointLoads and Beams are the load path as drawn (issue 17;
	// loadpath_types.go): extra information, not used by the joists'
	// checks.
	Posts      []Post
	PointLoads []PointLoadMark
	Beams      []Beam
	Issues     dxfimport.IssueList
	// Ignored counts entities framing did not use, by layer: every entity
	// on a layer with no role, and entities of a kind the layer's role has
	// no use for (key "LAYER (TEXT)").
	Ignored map[string]int

	// internal state kept for PlaceRows
	across []float64 // per member: offset across its direction group, in
	dirs   []Point   // per member: unit vector Start->End
}

// Bearing is one support of a member.
type Bearing struct {
	AtIn     float64       // centre-line, along the member from Start (may be slightly < 0 or > LengthIn when the end stops short)
	LengthIn float64       // bearing length: the support's bearing_in, or a double-line wall's thickness
	Kind     string        // support kind: bearing-wall, dropped-beam, flush-beam, ledger
	Pos      dxfimport.Pos // the support line (the first of a double-line wall's two)
	// Support is the index into Plan.Supports of the support line (or
	// merged double line) the member bears on; -1 when unknown.
	Support int
	// WidthIn is the width of a support drawn with several lines,
	// measured along the member: LengthIn is shorter where the member
	// stops inside it. 0 for a single line (the support's face is then
	// LengthIn/2 from the centre-line).
	WidthIn float64
}

// FaceIn returns the position along the member of the bearing's face
// toward +dir (dir +1: toward End, -1: toward Start): the centre-line plus
// or minus half the support's drawn width (or of the bearing length for a
// single line).
func (b Bearing) FaceIn(dir float64) float64 {
	w := b.WidthIn
	if w <= 0 {
		w = b.LengthIn
	}
	return b.AtIn + dir*w/2
}

// ZonePiece is a stretch of a member, along it from Start, lying in one
// load zone.
type ZonePiece struct {
	FromIn, ToIn float64
	Zone         string
}

// Member is one joist ready for design.
type Member struct {
	ID         string
	Pos        dxfimport.Pos // the joist line as drawn
	Layer      string
	Start, End Point // oriented along the member's direction group (see doc.go)
	LengthIn   float64
	// DrawnThicknessIn is the width of the member's outline when it is
	// drawn as one (two parallel lines or a rectangle: Start-End is then
	// its centre line), 0 when it is drawn as its centre line.
	DrawnThicknessIn float64
	// Plies is the number of pieces drawn side by side for a member drawn
	// as outlines (1 for one outline, 2 or more for a built-up member,
	// which is an error member for now); 0 for a centre line.
	Plies int
	// Generated marks a joist that is not drawn: framing laid it out in a
	// bay shown by a span symbol and a size callout (bays.go). Pos is then
	// the bay's outline or span line.
	Generated bool

	Bearings []Bearing // sorted along the member
	// Cantilever lengths past the first/last bearing centre; 0 when the
	// end stops within lb/2 + snap tolerance of the bearing centre-line.
	OverhangStartIn, OverhangEndIn float64

	TribIn           float64 // tributary width = TribLeftIn + TribRightIn
	TribLeftIn       float64 // left of Start->End: half the gap to the neighbour, or the edge distance
	TribRightIn      float64
	SpacingIn        float64 // trib width of an interior joist, the one gap of an edge joist, 0 alone
	CalloutSpacingIn float64 // nominal spacing of the size callout, 0 when none

	Size, Species, Grade string   // callout > by_layer > project default
	Zones                []string // the zones loading the member, sorted
	// SlopeFactor is the sloped length over the plan length of a rafter
	// drawn in plan (1 / cos of the slope), set by the caller from the
	// roof pitch; 0 or 1 for a flat member. The takeoff orders the sloped
	// length.
	SlopeFactor float64
	// ZonePieces are the stretches of the member in each zone, from Start
	// to End, when it crosses zone edges (nil when one zone loads all of
	// it): each zone loads the member where it acts (DOMAIN.md "Loads").
	ZonePieces []ZonePiece

	ExistingBlockingAtIn []float64 // drawn blocking rows crossing the member, along it from Start
	Run                  int       // index into Plan.Runs
	// Neighbours are the indices (into Plan.Members) of the nearest
	// overlapping parallel joist on each side across the member's
	// direction group, lower offset first; -1 where there is none. Error
	// members are neighbours too. NeighbourGapsIn are the distances to them.
	Neighbours      [2]int
	NeighbourGapsIn [2]float64
	HangersStart    bool // Start frames into a flush beam
	HangersEnd      bool
	Mark            string // set by AssignMarks

	// Error marks an unusable member (an end with no support, conflicting
	// callouts, no zone); it still counts as a neighbour for tribs.
	Error    bool
	Messages []string
}

// SlopedLengthIn returns the member's length along its slope: LengthIn
// (drawn in plan) times SlopeFactor when that is set.
func (m *Member) SlopedLengthIn() float64 {
	if m.SlopeFactor > 1 {
		return m.LengthIn * m.SlopeFactor
	}
	return m.LengthIn
}

// Spans returns the centre-to-centre distances between consecutive
// bearings, in.
func (m *Member) Spans() []float64 {
	var s []float64
	for i := 1; i < len(m.Bearings); i++ {
		s = append(s, m.Bearings[i].AtIn-m.Bearings[i-1].AtIn)
	}
	return s
}

// Run is a set of adjacent parallel joists sharing the same supports,
// ordered across (see doc.go for the direction).
type Run struct {
	ID      string // "R1", "R2", ... in order of the run's first member
	Members []int  // indices into Plan.Members
}

// Support is one support line after double-wall merging. A double-line
// wall appears once, on its mid-line, with Double set and ThicknessIn the
// distance between its lines.
type Support struct {
	Kind        string
	A, B        Point
	BearingIn   float64 // the spec's bearing length, or the wall thickness when Double
	Double      bool
	ThicknessIn float64
	Pos         dxfimport.Pos // first line
	PosB        dxfimport.Pos // second line of a double-line wall
}

// ZoneOutline is a load-zone outline and the name written inside it.
type ZoneOutline struct {
	Name    string
	Points  []Point // closed; last vertex not repeated
	AreaIn2 float64
	Pos     dxfimport.Pos
}
