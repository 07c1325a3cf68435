package export

import (
	"slices"

	"framecheck/export/internal/fmtx"
)

// coveredRow is a mark the short package does not write out.
type coveredRow struct {
	Mark, Ratio, By string
	Count           int
}

// dropCovered leaves out of the short package (PackageGoverning) each
// passing mark whose governing member's every check ratio is at or below
// that of a written-out mark of the same size, species, grade, zone,
// spacing, spans, overhangs and blocking rows per span: an edge joist
// beside the interior joists of its run, say. Its calculation would show
// the same geometry under less load; the ratios, read from results, prove
// it check by check. Marks that fail or are in error are always written
// out.
func dropCovered(r *Results, calcs []markCalc) ([]markCalc, []coveredRow) {
	marks := map[string]*Mark{}
	for i := range r.Marks {
		marks[r.Marks[i].Mark] = &r.Marks[i]
	}
	gov := map[string]*Member{}
	for i := range r.Members {
		m := &r.Members[i]
		if g := gov[m.Mark]; g == nil || m.MaxRatio > g.MaxRatio {
			gov[m.Mark] = m
		}
	}
	same := func(a, b *Mark) bool {
		return a.Size == b.Size && a.Species == b.Species && a.Grade == b.Grade && a.Zone == b.Zone &&
			a.SpacingIn == b.SpacingIn && slices.Equal(a.SpansIn, b.SpansIn) && a.OverhangsIn == b.OverhangsIn &&
			slices.Equal(a.BlockingRowsPerSpan, b.BlockingRowsPerSpan)
	}
	below := func(a, b *Member) bool {
		if len(a.Checks) != len(b.Checks) {
			return false
		}
		for i := range a.Checks {
			if a.Checks[i].Kind != b.Checks[i].Kind || a.Checks[i].Ratio > b.Checks[i].Ratio {
				return false
			}
		}
		return true
	}
	// covers reports whether o's calculation covers c's: same geometry,
	// every ratio at or above; of two marks with equal ratios the first
	// covers the second.
	covers := func(o, c markCalc) bool {
		a, ga := marks[c.Mark], gov[c.Mark]
		b, gb := marks[o.Mark], gov[o.Mark]
		if o.Mark == c.Mark || a == nil || b == nil || ga == nil || gb == nil || a.Status != StatusPass || !same(a, b) || !below(ga, gb) {
			return false
		}
		return !below(gb, ga) || o.Mark < c.Mark
	}
	isCovered := make([]bool, len(calcs))
	for i, c := range calcs {
		for _, o := range calcs {
			if covers(o, c) {
				isCovered[i] = true
				break
			}
		}
	}
	var keep []markCalc
	var covered []coveredRow
	for i, c := range calcs {
		if !isCovered[i] {
			keep = append(keep, c)
			continue
		}
		// the cover named is written out: "below" is transitive, so the
		// largest mark of the group is kept and covers every other
		by := ""
		for j, o := range calcs {
			if !isCovered[j] && covers(o, c) {
				by = o.Mark
				break
			}
		}
		if by == "" {
			keep = append(keep, c)
			continue
		}
		covered = append(covered, coveredRow{Mark: c.Mark, Count: c.Count, Ratio: fmtx.Ratio(marks[c.Mark].MaxRatio), By: by})
	}
	return keep, covered
}
