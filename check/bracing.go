package check

import (
	"math"
	"strconv"
	"strings"
)

// The bracing a result relies on is stated in its bending traces (issue 13
// item 6; DOMAIN.md "Bracing relied on"): bearings brace both edges, which
// assumes full-depth blocking, a rim board or hangers at every bearing,
// interior ones included; the sheathing holds the top edge when
// Settings.TopEdgeBraced; a ceiling fastened to the joists holds the bottom
// edge when Member.BottomBracedContinuous; drawn rows and rows to add
// brace both edges at their positions; inflection points count for the
// bottom edge only under Settings.BraceAtInflection.

// braceRec is the bracing of one result, recorded for its trace. The
// slices are the Result's own (or new), never the engine's.
type braceRec struct {
	spansIn      []float64 // the Result's spans: bearings follow from the first
	drawn, added []float64 // member positions
	ips          []float64 // inflection points counted for the governing bottom-edge case, member positions
	firstIn      float64   // first bearing, member position
	nPts         int32     // bracing points of the edges: bearings and rows in the member
	topHeld      bool      // sheathing (Settings.TopEdgeBraced)
	bottomHeld   bool      // ceiling (Member.BottomBracedContinuous)
	continuous   bool      // the member has interior supports
	// topAt are the points holding the top edge of a member braced there
	// only (Member.TopBracedAtPoints: a beam, at the joists bearing on
	// it), member positions; topAtPoints says it is such a member
	topAt       []float64
	topAtPoints bool
	ipRule      bool    // inflection points count (Settings.BraceAtInflection)
	how         rowsHow // how the rows to add were placed
}

// rowsHow says how a result's rows to add were placed, for its trace.
type rowsHow uint8

const (
	rowsSolved rowsHow = iota // by the solver, where the edge still failed (rows drawn)
	rowsEven                  // n per span, evenly spaced (no rows drawn)
	rowsGiven                 // given: the rows of its run (CheckWithRowsAt)
	rowsFrom                  // the rows of its run, and more where the edge still failed (CheckMemberFrom)
)

// rowsHowText is the note after the positions of the rows to add.
var rowsHowText = [...]string{
	rowsSolved: " in (placed where the edge still failed, clear of the drawn rows)",
	rowsEven:   " in (evenly spaced in every span)",
	rowsGiven:  " in (the rows of its run)",
	rowsFrom:   " in (the rows of its run, and rows placed where the edge still failed)",
}

// braceRecord records r's bracing; nPts is the number of bracing points
// of an edge without the inflection points, ips (analysis coordinates)
// the governing bottom-edge case's inflection points counted.
func (e *engine) braceRecord(r *Result, nPts int, ips []float64, how rowsHow) braceRec {
	b := braceRec{spansIn: r.SpansIn, firstIn: e.m.Bearings[0].AtIn, drawn: r.DrawnBlockingAtIn, added: r.BlockingAtIn,
		nPts: int32(nPts), topHeld: e.s.TopEdgeBraced, bottomHeld: e.m.BottomBracedContinuous,
		continuous: len(e.spanSegs) > 1, ipRule: e.inflectionRule(), how: how,
		topAtPoints: e.m.TopBracedAtPoints, topAt: e.m.TopBracingAtIn}
	for _, x := range ips {
		b.ips = append(b.ips, x+e.x0)
	}
	return b
}

// heldText is the formula of CL = 1 for an edge held continuously.
func (b *braceRec) heldText(top bool) string {
	if top {
		return "top edge held continuously by the sheathing (design.top_edge_braced = true)"
	}
	return "bottom edge held continuously by a ceiling fastened to the joists (zone ceiling_braces_bottom = true)"
}

// pointsText lists an edge's bracing points in words, for the trace item
// "bracing points" of an edge braced at points.
func (b *braceRec) pointsText(top bool) string {
	var s strings.Builder
	s.WriteString("bearings at ")
	at := b.firstIn
	s.WriteString(posText(at))
	for _, sp := range b.spansIn {
		at += sp
		s.WriteString(", ")
		s.WriteString(posText(at))
	}
	s.WriteString(" in, each bracing both edges (assumes blocking, a rim board or hangers there)")
	if len(b.drawn) > 0 {
		s.WriteString("; drawn rows at ")
		s.WriteString(numsText(b.drawn))
		s.WriteString(" in (existing)")
	}
	if len(b.added) > 0 {
		s.WriteString("; rows to add at ")
		s.WriteString(numsText(b.added))
		s.WriteString(rowsHowText[b.how])
	}
	if top {
		switch {
		case b.topAtPoints && len(b.topAt) > 0:
			s.WriteString("; top edge also held where members bear on it, at ")
			s.WriteString(numsText(b.topAt))
			s.WriteString(" in (a beam: not by the sheathing)")
		case b.topAtPoints:
			s.WriteString("; top edge held at its bearings only (a beam: not by the sheathing)")
		default:
			s.WriteString("; top edge not held by the sheathing (design.top_edge_braced = false)")
		}
		return s.String()
	}
	if b.continuous {
		switch {
		case b.ipRule && len(b.ips) > 0:
			s.WriteString("; inflection points counted as braces (design.brace_at_inflection = true) at ")
			s.WriteString(numsText(b.ips))
			s.WriteString(" in")
		case b.ipRule:
			s.WriteString("; inflection points counted as braces (design.brace_at_inflection = true), none in the governing case")
		default:
			s.WriteString("; inflection points not counted as braces (design.brace_at_inflection = false)")
		}
	}
	return s.String()
}

// numsText prints positions as "48, 96.25".
func numsText(v []float64) string {
	var s strings.Builder
	for i, x := range v {
		if i > 0 {
			s.WriteString(", ")
		}
		s.WriteString(posText(x))
	}
	return s.String()
}

// posText prints a position along a member to 0.01 in, with no trailing
// zeros ("146.25", "56"): the report re-measures it from the datum and
// prints it to 1/16 in, which the 3 or 4 significant digits of the
// trace's other numbers would not give (146.3 for 146.25).
func posText(x float64) string {
	return strconv.FormatFloat(math.Round(x*100)/100+0, 'f', -1, 64)
}
