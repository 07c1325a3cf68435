package export

import (
	"fmt"
	"math"
	"strconv"
)

// Markup is what the annotated DXF and the overlay draw, in inches (world
// coordinates of the plan after unit conversion). ToInch is the drawing's
// inch factor (inches per drawing unit: 1 for in, 12 for ft, 1/25.4 for mm);
// the writers divide by it to place the markup in the drawing's own units.
type Markup struct {
	ToInch        float64   // inches per drawing unit; must be > 0
	TextHeightIn  float64   // label height; 0 = LabelHeightIn of the markup's extent
	Highlights    []Segment // failing members, on LayerFail
	Errors        []Segment // members in error, on LayerError
	BlockingAdds  []Segment // blocking rows to add, on LayerBlocking
	BlockingNotes []Label   // "ADD BLOCKING 2 ROWS @ 1/3 PTS", one per run, on LayerBlocking
	Labels        []Label   // one per run and mark, beside the joists, on LayerLabel
	Reasons       []Label   // short reason beside each member in error, on LayerError
	IDs           []Label   // member ids beside their lines, on LayerID
	Uplifts       []Label   // ASD uplift reaction at each flagged bearing, on LayerUplift
	// PlanLo and PlanHi bound the plan (inches); the key goes to the right
	// of them. Annotate widens them to every entity of the drawing. Zero
	// values: the markup's own bounds.
	PlanLo, PlanHi [2]float64
	// UsedACI are colours the plan uses that our layers should avoid, for
	// the overlay (Annotate reads the drawing's LAYER table itself).
	UsedACI []int
	// NoKey leaves the key out.
	NoKey bool
	// Stamp is the key's line naming the project and the tool version
	// (MarkupStamp); "" leaves it out.
	Stamp     string
	Generated []Segment // members laid out in bays (not drawn), on LayerGenerated
}

// Segment is a straight line in inches; Ref names what it marks (member or
// blocking row id) for messages.
type Segment struct {
	A, B [2]float64
	Ref  string
}

// Label is a text centred on At (inches), rotated AngleDeg counter-clockwise;
// HeightIn 0 means the markup's text height.
type Label struct {
	At       [2]float64
	AngleDeg float64
	Text     string
	HeightIn float64
}

// IDHeightFactor is the height of a member id against the labels' (common
// practice, no source: ids are secondary and must not crowd the labels).
const IDHeightFactor = 0.5

// MarkupFromResults builds the markup for r:
//   - a highlight over each failing member (LayerFail) and each member in
//     error (LayerError), with the error's short reason beside it
//     (ErrorReason of its first message);
//   - one label per run and mark (RunLabel: "J12 2x10@16 BENDING 1.62",
//     the worst member's governing check and ratio), placed midway between
//     the two middle joists of the group, along them, so that it lies
//     beside the joist lines, never on them;
//   - each member's id in small text beside its line (LayerID);
//   - a line for each blocking row to add and one note per run
//     (BlockingNote) beside its first row;
//   - "uplift N lb" beside each flagged bearing of r.Uplift;
//   - a line on each generated member (LayerGenerated).
//
// Inch coordinates are taken from StartIn/EndIn (PointIn) when set, else
// from Start/End (Point) times toInch. The text height is LabelHeightIn of
// the members' extent, capped at 0.6 of the smallest positive spacing or
// trib width so that labels stay between neighbouring joists.
func MarkupFromResults(r *Results, toInch float64) Markup {
	m := Markup{ToInch: toInch, Stamp: MarkupStamp(r)}
	minGap := math.Inf(1)
	lo := [2]float64{math.Inf(1), math.Inf(1)}
	hi := [2]float64{math.Inf(-1), math.Inf(-1)}
	grow := func(p [2]float64) {
		lo = [2]float64{math.Min(lo[0], p[0]), math.Min(lo[1], p[1])}
		hi = [2]float64{math.Max(hi[0], p[0]), math.Max(hi[1], p[1])}
	}
	ends := make([][2][2]float64, len(r.Members))
	for i := range r.Members {
		mb := &r.Members[i]
		a, b := inches(mb.Start, mb.End, mb.StartIn, mb.EndIn, toInch)
		ends[i] = [2][2]float64{a, b}
		grow(a)
		grow(b)
		switch mb.Status {
		case StatusFail:
			m.Highlights = append(m.Highlights, Segment{A: a, B: b, Ref: mb.ID})
		case StatusError:
			m.Errors = append(m.Errors, Segment{A: a, B: b, Ref: mb.ID})
		}
		if mb.Generated {
			m.Generated = append(m.Generated, Segment{A: a, B: b, Ref: mb.ID})
		}
		for _, g := range []float64{mb.SpacingIn, mb.TribIn} {
			if g > 0 && g < minGap {
				minGap = g
			}
		}
	}
	for i := range r.BlockingRows {
		br := &r.BlockingRows[i]
		if br.Existing {
			continue
		}
		a, b := inches(br.Start, br.End, br.StartIn, br.EndIn, toInch)
		m.BlockingAdds = append(m.BlockingAdds, Segment{A: a, B: b, Ref: br.ID})
	}
	h := 1.0
	if !math.IsInf(lo[0], 1) {
		h = LabelHeightIn(math.Max(hi[0]-lo[0], hi[1]-lo[1]))
		m.PlanLo, m.PlanHi = lo, hi
	} else {
		h = LabelHeightIn(m.extent())
	}
	if !math.IsInf(minGap, 1) && h > 0.6*minGap {
		h = 0.6 * minGap
	}
	m.TextHeightIn = h
	var side []float64
	m.Labels, m.IDs, side = runLabels(r, ends, h)
	m.Reasons = errorReasons(r, ends, h)
	m.BlockingNotes = blockingNotes(r, toInch, h)
	m.Uplifts = upliftLabels(r, toInch, h, side)
	pathMarkup(&m, r, toInch, h)
	return m
}

// pathMarkup adds the load path's beams: a line over each failing beam
// (LayerFail) or beam in error (LayerError), and a label beside each beam,
// offset from its line by one text height: "B1 (3) 2x12 BENDING 0.85".
func pathMarkup(m *Markup, r *Results, toInch, h float64) {
	if r.LoadPath == nil {
		return
	}
	for _, b := range r.LoadPath.Beams {
		a, e := inches(b.Start, b.End, b.StartIn, b.EndIn, toInch)
		switch b.Status {
		case StatusFail:
			m.Highlights = append(m.Highlights, Segment{A: a, B: e, Ref: b.ID})
		case StatusError:
			m.Errors = append(m.Errors, Segment{A: a, B: e, Ref: b.ID})
		}
		text := b.ID + " " + b.Size
		if b.Status == StatusError {
			text += " ERROR"
		} else if b.Governing != "" {
			text += " " + CheckWord(b.Governing) + " " + strconv.FormatFloat(b.MaxRatio, 'f', 2, 64)
		}
		dx, dy := e[0]-a[0], e[1]-a[1]
		l := math.Hypot(dx, dy)
		if l == 0 {
			continue
		}
		nx, ny := -dy/l, dx/l // beside the line, not on it
		mid := [2]float64{(a[0]+e[0])/2 + nx*1.5*h, (a[1]+e[1])/2 + ny*1.5*h}
		m.Labels = append(m.Labels, Label{At: mid, AngleDeg: readableAngle(a, e), Text: text})
	}
}

// readableAngle is the direction from a to b in degrees, turned into
// (-90, 90] so that text along it reads left to right or upwards.
func readableAngle(a, b [2]float64) float64 {
	ang := math.Atan2(b[1]-a[1], b[0]-a[0]) * 180 / math.Pi
	for ang > 90 {
		ang -= 180
	}
	for ang <= -90 {
		ang += 180
	}
	return ang
}

// normal is the unit normal of the readable direction of a-b (its left
// side as the text reads); zero for a zero-length line.
func normal(a, b [2]float64) [2]float64 {
	rad := readableAngle(a, b) * math.Pi / 180
	if a == b {
		return [2]float64{}
	}
	return [2]float64{-math.Sin(rad), math.Cos(rad)}
}

// upliftLabels places a label beside each flagged bearing of r.Uplift:
// "uplift 461 lb" (the ASD reaction rounded up to the pound), along its
// member, moved into the member from the bearing by about half its length
// plus half a text height (at most a quarter of the member), so that the
// labels of two members meeting at one support do not overlap, and off
// the member's line by 0.65 text height to its left as the text reads
// (common practice, no source: a text's width taken as 0.9 of its height
// per character).
func upliftLabels(r *Results, toInch, h float64, side []float64) []Label {
	n := 0
	for i := range r.Uplift.Bearings {
		if r.Uplift.Bearings[i].Flagged {
			n++
		}
	}
	if n == 0 {
		return nil
	}
	out := make([]Label, 0, n)
	// The bearings come in member order (as the command writes them): find
	// each member by walking the members alongside, and only for bearings
	// out of that order by a map of every member.
	var byID map[string]int
	next := 0
	member := func(id string) int {
		if byID == nil {
			for j := next; j < len(r.Members); j++ {
				if r.Members[j].ID == id {
					next = j
					return j
				}
			}
			// out of order (or unknown): from here on, the map
			byID = make(map[string]int, len(r.Members))
			for k := range r.Members {
				byID[r.Members[k].ID] = k
			}
		}
		if k, ok := byID[id]; ok {
			return k
		}
		return -1
	}
	for i := range r.Uplift.Bearings {
		u := &r.Uplift.Bearings[i]
		if !u.Flagged {
			continue
		}
		at := u.PointIn
		if at == ([2]float64{}) {
			at = [2]float64{u.Point[0] * toInch, u.Point[1] * toInch}
		}
		text := "uplift " + strconv.FormatFloat(DemandLb(u.UpliftLb), 'f', 0, 64) + " lb"
		ang := 0.0
		if k := member(u.Member); k >= 0 {
			mb := &r.Members[k]
			a, b := inches(mb.Start, mb.End, mb.StartIn, mb.EndIn, toInch)
			ang = readableAngle(a, b)
			// toward the member's midpoint
			mid := [2]float64{(a[0] + b[0]) / 2, (a[1] + b[1]) / 2}
			dx, dy := mid[0]-at[0], mid[1]-at[1]
			if dist := math.Hypot(dx, dy); dist > 0 {
				lenIn := math.Hypot(b[0]-a[0], b[1]-a[1])
				off := math.Min(0.45*h*float64(len(text))+0.5*h, lenIn/4)
				at = [2]float64{at[0] + dx/dist*off, at[1] + dy/dist*off}
			}
			nv := normal(a, b)
			d := 0.65 * h
			if k < len(side) && side[k] > 0 {
				d = -d // the run's label is on that side
			}
			at = [2]float64{at[0] + d*nv[0], at[1] + d*nv[1]}
		}
		out = append(out, Label{At: at, AngleDeg: ang, Text: text})
	}
	return out
}

func inches(start, end, startIn, endIn [2]float64, toInch float64) ([2]float64, [2]float64) {
	if startIn != ([2]float64{}) || endIn != ([2]float64{}) {
		return startIn, endIn
	}
	return [2]float64{start[0] * toInch, start[1] * toInch}, [2]float64{end[0] * toInch, end[1] * toInch}
}

// LabelHeightIn returns the label text height for a plan whose larger
// extent is extentIn inches: extent/120, at least 1 in and at most 24 in.
// A 40 ft plan gets 4 in text, which plots at about 3/32 in at 1/4" = 1'-0"
// (common practice, no source: readable, and fits between joists at 16 in).
func LabelHeightIn(extentIn float64) float64 {
	h := extentIn / 120
	return math.Min(math.Max(h, 1), 24)
}

// extent returns the larger side of the bounding box of every point of m.
func (m *Markup) extent() float64 {
	lo, hi := m.bounds()
	return math.Max(hi[0]-lo[0], hi[1]-lo[1])
}

// labelGroups lists m's label groups with their layers, in writing order.
func (m *Markup) labelGroups() []struct {
	Layer  string
	Labels []Label
} {
	return []struct {
		Layer  string
		Labels []Label
	}{{LayerLabel, m.Labels}, {LayerError, m.Reasons}, {LayerID, m.IDs},
		{LayerBlocking, m.BlockingNotes}, {LayerUplift, m.Uplifts}}
}

// validate checks that m can be written: a positive finite ToInch and
// finite coordinates.
func (m *Markup) validate() error {
	if !(m.ToInch > 0) || !finite(m.ToInch) {
		return fmt.Errorf("markup: inch factor %v: want a positive number of inches per drawing unit", m.ToInch)
	}
	if !finite(m.TextHeightIn) || m.TextHeightIn < 0 {
		return fmt.Errorf("markup: text height %v in: want a finite height >= 0", m.TextHeightIn)
	}
	for _, group := range [][]Segment{m.Highlights, m.Errors, m.BlockingAdds, m.Generated} {
		for _, s := range group {
			if !finite(s.A[0]) || !finite(s.A[1]) || !finite(s.B[0]) || !finite(s.B[1]) {
				return fmt.Errorf("markup: %s: non-finite coordinate %v %v", s.Ref, s.A, s.B)
			}
		}
	}
	for _, g := range m.labelGroups() {
		for _, l := range g.Labels {
			if !finite(l.At[0]) || !finite(l.At[1]) || !finite(l.AngleDeg) || !finite(l.HeightIn) || l.HeightIn < 0 {
				return fmt.Errorf("markup: label %q: non-finite position, angle or height", l.Text)
			}
		}
	}
	for _, p := range [][2]float64{m.PlanLo, m.PlanHi} {
		if !finite(p[0]) || !finite(p[1]) {
			return fmt.Errorf("markup: plan extents %v %v: non-finite", m.PlanLo, m.PlanHi)
		}
	}
	return nil
}

// textHeight returns the label height in inches.
func (m *Markup) textHeight() float64 {
	if m.TextHeightIn > 0 {
		return m.TextHeightIn
	}
	return LabelHeightIn(m.extent())
}
