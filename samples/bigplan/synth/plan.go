package synth

import (
	"fmt"
	"io"
	"slices"

	"framecheck/samples/internal/dxfw"
)

// Layer names; the roles come from Project's glob patterns.
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
	lyNotes       = "GENERAL-NOTES"
	lyPost        = "POST-1" // only with Options.Beams
)

var layers = []dxfw.Layer{
	{Name: lyJoistFloor, Color: 3}, {Name: lyJoistRoof, Color: 4}, {Name: lyWallExt, Color: 7},
	{Name: lyWallInt, Color: 8}, {Name: lyBeamFlush, Color: 1}, {Name: lyBeamDropped, Color: 6},
	{Name: lyBlocking, Color: 30}, {Name: lyZoneFloor, Color: 5}, {Name: lyZoneRoof, Color: 5},
	{Name: lyNote, Color: 2}, {Name: lyGrid, Color: 9}, {Name: lyNotes, Color: 7},
}

// Geometry constants, inches.
const (
	extWallIn    = 5.5   // 2x6 stud wall, drawn as two lines
	intWallIn    = 3.5   // 2x4 stud wall
	runGapIn     = 160.0 // clear space between neighbouring runs
	rowPitchIn   = 640.0 // rows of units, origin to origin
	zoneMarginIn = 60.0  // the unit's grid line and note beyond its runs
	zoneFaceIn   = 0.75  // zone outline beyond the centre-line of a run's edge joist: its outer face
	runsPerUnit  = 4
	shortByIn    = 6.0 // a joist drawn this short of its beam
)

// Options says what plan to draw.
type Options struct {
	Joists int  // number of joists; at least 1
	R12    bool // AC1009 instead of AC1015
	// Outlines draws each joist as a rectangle of four LINEs 1.5 in wide
	// instead of its centre line: the same plan, four times the joist lines.
	Outlines bool
	// Beams draws posts under every beam line (the flush beam of each
	// flush-beam and storage run, the two dropped beams of each roof run)
	// on layer POST-1, so that each beam bears on posts and is checked as
	// a member; use ProjectFor(o) as its project file, which gives the
	// beams' and posts' sizes. The joists, walls and beam lines are those
	// of the plan without Beams, so the two compare like for like.
	Beams bool
}

// Stats is what the plan holds, by construction.
type Stats struct {
	Joists, Runs, Units int
	// ShortJoists are drawn 6 in short of their flush beam: each is an
	// error member (reaches no support at that end).
	ShortJoists int
	// StorageInterior are the joists of STORAGE units with a neighbour on
	// each side (16 in tributary width): 2x10 at 16 in, spans of 120 in or
	// more, D 12 and L 125 psf. By hand (NDS 2018 Supplement Table 4A,
	// DF-L No.2 Fb 900 psi, CF 1.1; Cr 1.15 per NDS 4.3.9, CD 1.0):
	// Fb' = 1139 psi; at 120 in, w = 137 psf x 16/12 = 182.7 plf,
	// M = wL^2/8 = 27,400 lb-in, fb = M / 21.39 in^3 = 1281 psi, ratio
	// 1.12; longer spans more. So each one fails bending (or is an error
	// member if drawn short). Edge joists carry half and may pass.
	StorageInterior int
	// RoofEdgeRuns are the runs in ROOF-EDGE units (net uplift 40.2 psf).
	RoofEdgeRuns int
	// Kinds counts joists by run kind.
	Kinds map[string]int
	// Beams is the number of beam lines drawn and Posts the number of
	// posts under them (Options.Beams; both 0 without it).
	Beams, Posts int
}

// runKind is what a run is drawn as.
type runKind int

const (
	kindSimple runKind = iota
	kindFlush
	kindContinuous
	kindCantilever
	kindStorage
	kindRoof
)

var kindNames = [...]string{"simple", "flush-beam", "continuous", "cantilever", "storage", "roof"}

// unitZones is the repeating pattern of unit zones.
var unitZones = [...]string{"FLOOR", "FLOOR", "ROOF-FIELD", "STORAGE", "FLOOR",
	"BALCONY", "ROOF-EDGE", "FLOOR", "ROOF-EDGE", "FLOOR"}

// floorKinds are the four runs of a FLOOR unit.
var floorKinds = [runsPerUnit]runKind{kindSimple, kindFlush, kindContinuous, kindSimple}

// spansIn are the spans runs cycle through; continuous runs use the first
// three for each of their two spans.
var spansIn = [...]float64{120, 132, 144, 156, 168, 180, 192}

// joistCounts are the run sizes runs cycle through.
var joistCounts = [...]int{9, 13, 17, 21, 25, 29}

// run is one run as drawn, origin at the first joist's bearing line.
type run struct {
	kind         runKind
	zone         string
	count        int
	ocIn, spanIn float64
	cantIn       float64 // cantilever past the second wall
	callout      string  // "" = none
	short        int     // index of the joist drawn short, or -1
	x0, y0       float64
}

func (r *run) widthIn() float64 { return float64(r.count-1) * r.ocIn }

// zoneTopIn is how far the run's load zone reaches along +y from y0 (its
// first support line): to its last support line, or its cantilever's tip.
func (r *run) zoneTopIn() float64 {
	switch r.kind {
	case kindContinuous:
		return 2 * r.spanIn
	case kindCantilever:
		return r.spanIn + r.cantIn
	}
	return r.spanIn
}

// extentIn is how far the run reaches along +y from y0.
func (r *run) extentIn() float64 {
	switch r.kind {
	case kindContinuous:
		return 2*r.spanIn + extWallIn/2
	case kindCantilever:
		return r.spanIn + r.cantIn
	}
	return r.spanIn + extWallIn/2
}

// planRuns lays out the runs of an n-joist plan.
func planRuns(n int) (runs []run, units int, unitsPerRow int) {
	unitsPerRow = 1
	for estUnits := n / 76; unitsPerRow*unitsPerRow*3 < estUnits; unitsPerRow++ {
		// about as wide (~1900 in a unit) as deep (640 in a row)
	}
	left := n
	for ri := 0; left > 0; ri++ {
		u := ri / runsPerUnit
		zone := unitZones[u%len(unitZones)]
		r := run{zone: zone, ocIn: 16, short: -1,
			count:  joistCounts[(ri*5)%len(joistCounts)],
			spanIn: spansIn[(ri*3+u)%len(spansIn)]}
		switch zone {
		case "FLOOR":
			r.kind = floorKinds[ri%runsPerUnit]
		case "STORAGE":
			r.kind = kindStorage
		case "BALCONY":
			r.kind = kindCantilever
			r.cantIn = 24 + 12*float64(ri%2)
		default:
			r.kind, r.ocIn = kindRoof, 24
		}
		if r.kind == kindContinuous {
			r.spanIn = spansIn[(ri+u)%3]
		}
		if r.kind == kindSimple && (ri/runsPerUnit)%3 == 1 {
			r.ocIn = 12
		}
		if r.count > left {
			r.count = left
		}
		left -= r.count
		r.callout = callout(&r, ri)
		if r.kind == kindFlush && (ri/runsPerUnit)%5 == 0 && r.count >= 3 {
			r.short = 1
		}
		runs = append(runs, r)
	}
	units = (len(runs) + runsPerUnit - 1) / runsPerUnit
	// Place the runs: units side by side along x, unitsPerRow to a row.
	x := 0.0
	for ri := range runs {
		u := ri / runsPerUnit
		if u%unitsPerRow == 0 && ri%runsPerUnit == 0 {
			x = 0
		}
		runs[ri].x0 = x
		runs[ri].y0 = float64(u/unitsPerRow) * rowPitchIn
		x += runs[ri].widthIn() + runGapIn
	}
	return runs, units, unitsPerRow
}

// callout is the size callout drawn on the run, "" for none: floor runs
// but every fourth (which take the project default, 2x12), never roofs.
func callout(r *run, ri int) string {
	size := "2x10"
	switch {
	case r.kind == kindRoof:
		return ""
	case r.kind == kindStorage:
	case r.kind == kindCantilever || r.spanIn > 144:
		size = "2x12"
	case (ri/runsPerUnit+ri)%4 == 3:
		return ""
	}
	return fmt.Sprintf(`%s @ %g" o.c.`, size, r.ocIn)
}

// Build draws the plan and returns the DXF file and what it holds.
func Build(o Options) ([]byte, Stats) {
	w, st := draw(o)
	return w.Bytes(), st
}

// Write draws the plan into out.
func Write(out io.Writer, o Options) (Stats, error) {
	w, st := draw(o)
	_, err := w.WriteTo(out)
	return st, err
}

func draw(o Options) (*dxfw.Writer, Stats) {
	if o.Joists < 1 {
		o.Joists = 1
	}
	ls := layers
	if o.Beams {
		ls = append(slices.Clip(layers), dxfw.Layer{Name: lyPost, Color: 1})
	}
	w := dxfw.New(ls)
	if o.R12 {
		w = dxfw.NewR12(ls)
	}
	runs, units, _ := planRuns(o.Joists)
	st := Stats{Runs: len(runs), Units: units, Kinds: map[string]int{}}
	for ri := range runs {
		r := &runs[ri]
		nb, np := drawRun(w, r, o)
		st.Beams += nb
		st.Posts += np
		st.Joists += r.count
		st.Kinds[kindNames[r.kind]] += r.count
		if r.short >= 0 {
			st.ShortJoists++
		}
		if r.kind == kindStorage {
			st.StorageInterior += max(r.count-2, 0)
		}
		if r.zone == "ROOF-EDGE" {
			st.RoofEdgeRuns++
		}
	}
	for u := 0; u < units; u++ {
		lo := u * runsPerUnit
		hi := min(lo+runsPerUnit, len(runs))
		drawZone(w, u, runs[lo:hi])
	}
	return w, st
}
