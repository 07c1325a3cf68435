package export

import (
	"cmp"
	"framecheck/export/internal/fmtx"
	"slices"
	"strconv"
)

// upliftSection is the report's "Uplift at the bearings" section: the
// support lines with their totals, then each bearing, flagged first.
type upliftSection struct {
	ReportLb       string
	Count, Flagged int
	Lines          []upliftLineRow
	Rows           []upliftRow
	More           int // bearings not listed (see results.json)
}

type upliftLineRow struct {
	Support, Kind               string
	Count, Flagged              int
	Max, Total, Need, CD, Combo string
	Members                     string
}

type upliftRow struct {
	Member, Mark, Support, At, Uplift, Combo, CD string
	Flagged                                      bool
}

// upliftRowsShown is how many bearings the report lists one by one.
const upliftRowsShown = 200

// lbText prints a force to 0.1 lb, or "n/a".
func lbText(v float64) string {
	if !finite(v) {
		return "n/a"
	}
	return fmtx.Lb(DemandLb(v)) // a connector demand: up to the next pound
}

// buildUplift fills the report's uplift section from r.Uplift: flagged
// bearings first (largest uplift first), then those listed only.
func buildUplift(r *Results) upliftSection {
	u := upliftSection{ReportLb: fmtNum(r.Uplift.ReportLb), Count: len(r.Uplift.Bearings)}
	for _, l := range UpliftLines(r.Uplift.Bearings) {
		row := upliftLineRow{Support: l.Support, Kind: l.Kind, Count: l.Count, Flagged: l.Flagged,
			Max: lbText(l.MaxLb), Total: lbText(l.TotalLb), CD: fmtNum(l.CD), Combo: l.Combo, Members: memberList(l.Members)}
		if l.Flagged > 0 {
			row.Need = lbText(l.MaxLb)
		} else {
			row.Need = "not flagged"
		}
		u.Lines = append(u.Lines, row)
	}
	order := make([]int, 0, len(r.Uplift.Bearings))
	for i, b := range r.Uplift.Bearings {
		if b.Flagged {
			u.Flagged++
		}
		order = append(order, i)
	}
	// Flagged first, larger uplift first, then in results.json's order
	// (stable).
	bs := r.Uplift.Bearings
	flagRank := func(b *UpliftBearing) int {
		if b.Flagged {
			return 0
		}
		return 1
	}
	slices.SortStableFunc(order, func(a, b int) int {
		return cmp.Or(cmp.Compare(flagRank(&bs[a]), flagRank(&bs[b])), cmp.Compare(ratioKey(bs[b].UpliftLb), ratioKey(bs[a].UpliftLb)))
	})
	for n, i := range order {
		if n == upliftRowsShown {
			u.More = len(order) - n
			break
		}
		b := &bs[i]
		support := b.Support
		if support == "" {
			support = unknownSupport
		}
		u.Rows = append(u.Rows, upliftRow{Member: b.Member, Mark: b.Mark,
			Support: support + " (bearing " + strconv.Itoa(b.Bearing) + ")", At: FtIn(b.FromFaceIn),
			Uplift: lbText(b.UpliftLb), Combo: b.Combo, CD: fmtNum(b.CD), Flagged: b.Flagged})
	}
	return u
}
