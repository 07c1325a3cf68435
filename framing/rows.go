package framing

import (
	"fmt"
	"math"
)

// BlockingRow is one row of full-depth blocking across a run: a line at
// the same position along every member of the run, cut into one piece per
// bay between adjacent joists.
type BlockingRow struct {
	ID      string // "<run>-B<n>", e.g. "R2-B1", numbered along the member
	Run     string // Run.ID
	AtIn    float64
	From    Point     // on the run's first member (ordered across)
	To      Point     // on its last member
	Pieces  int       // bays crossed: members - 1, less any bay with no clear space (a doubled joist's plies) or already blocked by a drawn row
	ClearIn []float64 // clear length of each piece: gap between joists less the joist thickness
	Size    string    // the run's joist size (first member's)
}

// PlaceRows lays blocking rows to add across run at the positions atIn,
// measured along the run's first member from its Start. Each other member
// takes the row at the same distance from its own first bearing, so
// members whose drawn starts differ a little still line up. Members
// without bearings take atIn from their own Start. A bay whose two joists
// both have a drawn row (ExistingBlockingAtIn) within d of the row, d the
// dressed depth of the run's size, is blocked already: it gets no piece,
// and a row left with no piece that way is not laid (the takeoff counts
// only pieces to add; common practice, no source, for the tolerance: two
// rows closer than the joist is deep hold the same point).
func (p *Plan) PlaceRows(run int, atIn []float64) []BlockingRow {
	if run < 0 || run >= len(p.Runs) || len(p.Runs[run].Members) == 0 {
		return nil
	}
	r := p.Runs[run]
	ref := &p.Members[r.Members[0]]
	refB := 0.0
	if len(ref.Bearings) > 0 {
		refB = ref.Bearings[0].AtIn
	}
	size := ref.Size
	bIn, dIn, err := DressedSize(size)
	if err != nil {
		bIn, dIn = 0, 0
	}
	rows := make([]BlockingRow, 0, len(atIn))
	for _, at := range atIn {
		row := BlockingRow{ID: fmt.Sprintf("%s-B%d", r.ID, len(rows)+1), Run: r.ID, AtIn: at, Size: size}
		drawnBays, prevDrawn := 0, false
		for i, k := range r.Members {
			m := &p.Members[k]
			t := at
			if len(m.Bearings) > 0 {
				t = at - refB + m.Bearings[0].AtIn
			}
			q := lerp(m.Start, p.dir(k), t)
			drawn := drawnNear(m.ExistingBlockingAtIn, t, dIn)
			if i == 0 {
				row.From = q
			} else {
				// plies of a doubled joist leave no bay: no piece there
				gap := math.Abs(p.acrossOf(k, ref) - p.acrossOf(r.Members[i-1], ref))
				if clear := gap - bIn; clear > minNeighbourGapIn {
					if drawn && prevDrawn {
						drawnBays++
					} else {
						row.ClearIn = append(row.ClearIn, clear)
					}
				}
			}
			prevDrawn = drawn
			row.To = q
		}
		row.Pieces = len(row.ClearIn)
		if row.Pieces == 0 && drawnBays > 0 {
			continue
		}
		rows = append(rows, row)
	}
	return rows
}

// drawnNear reports whether a drawn row of drawn lies within tolIn of t.
func drawnNear(drawn []float64, t, tolIn float64) bool {
	for _, x := range drawn {
		if math.Abs(x-t) <= tolIn {
			return true
		}
	}
	return false
}

// dir returns member k's unit direction Start->End, from Group's record or,
// for a Plan built by hand, from its end points.
func (p *Plan) dir(k int) Point {
	if len(p.dirs) == len(p.Members) {
		return p.dirs[k]
	}
	return unit(sub(p.Members[k].End, p.Members[k].Start))
}

// acrossOf returns member k's offset across its direction group, from
// Group's record or, for a Plan built by hand, along the normal of ref.
func (p *Plan) acrossOf(k int, ref *Member) float64 {
	if len(p.across) == len(p.Members) {
		return p.across[k]
	}
	m := &p.Members[k]
	return dot(mid(m.Start, m.End), rot90(unit(sub(ref.End, ref.Start))))
}
