package export

import (
	"math"
	"sort"
	"strings"

	"framecheck/export/internal/fmtx"
)

// pathSection is the report's load path section. Its rows follow the
// beams' marks and the distinct rows of posts and foundation lines, not
// the number of items (issue 18): items alike share a row with their count
// and ids (memberList); an item that does not pass has its own row.
type pathSection struct {
	Summary, Balance string
	Beams            []pathBeamRow
	Posts            []pathPostRow
	Joints           []pathJointRow
	Foundation       []pathFoundRow
}

type pathCheckRow struct{ Kind, Combo, Actual, Allowable, Unit, Ratio string }

// pathBeamRow is one beam mark's passing beams (IDs, Count; Of names the
// beam whose checks are listed) or one beam listed by itself: one that does
// not pass, has messages or has no mark.
type pathBeamRow struct {
	IDs, Of, Mark, Kind, Size, Spans, Supports, Carries, Governing, Ratio, Status, Messages string
	Count                                                                                   int
	Bad                                                                                     bool
	Checks                                                                                  []pathCheckRow
}

// pathPostRow is the posts alike in every cell but their id, or one post
// that fails or is in error.
type pathPostRow struct {
	IDs, Size, D, L, Lr, S, Down, Up, Ratio, Status string
	Count                                           int
	Bad                                             bool
}

type pathJointRow struct {
	Kind, Down, DownAt, Up, UpAt string
	Count                        int
}

// pathFoundRow is the foundation lines alike in kind, every load and unit.
type pathFoundRow struct {
	Kind, IDs, D, L, Lr, S, Wd, Wu, Unit string
	Count                                int
}

// buildPath fills the load path section from r.LoadPath; nil without one.
func buildPath(r *Results) *pathSection {
	lp := r.LoadPath
	if lp == nil {
		return nil
	}
	// a plan's posts and walls repeat their loads: each distinct value
	// spelt once (by its bits: -0 is spelt as itself)
	spelt := map[uint64]string{}
	spell := func(v float64) string { // fmtx.Lb
		if t, ok := spelt[math.Float64bits(v)]; ok {
			return t
		}
		t := fmtx.Lb(v)
		spelt[math.Float64bits(v)] = t
		return t
	}
	lb := func(v float64) string { return spell(math.Round(v)) }
	s := &pathSection{Summary: LoadPathSummary(lp)}
	a, d := lp.Applied, lp.Delivered
	s.Balance = "D " + lb(a.DeadLb) + " lb put on, " + lb(d.DeadLb) + " lb delivered; L " + lb(a.LiveLb) + " / " + lb(d.LiveLb) +
		" lb; Lr " + lb(a.RoofLiveLb) + " / " + lb(d.RoofLiveLb) + " lb; S " + lb(a.SnowLb) + " / " + lb(d.SnowLb) +
		" lb; W toward " + lb(a.WindDownLb) + " / " + lb(d.WindDownLb) + " lb; W away " + lb(a.WindUpLb) + " / " + lb(d.WindUpLb) + " lb"
	s.Beams = pathBeams(lp.Beams)
	s.Posts = pathPosts(lp.Posts, lb, spell)
	s.Joints = pathJoints(lp.Connections)
	s.Foundation = pathFoundation(lp.Foundation, lb)
	return s
}

// pathBeams gives one row per beam mark, in the order of the mark's first
// beam, for the beams that pass without a message; its checks are those of
// its beam with the largest ratio, as the joists' calculations are by mark
// (a mark's beams have the same size, lumber and spans and ratios within
// 0.01). A beam that does not pass, has messages or has no mark has its
// own row with what it bears on and carries, its messages and its checks.
func pathBeams(beams []PathBeam) []pathBeamRow {
	var rows []pathBeamRow
	type group struct {
		row  int // index in rows
		ids  []string
		gov  int // index in beams of the largest ratio
		kind []string
	}
	groups := map[string]*group{}
	var order []*group
	for i := range beams {
		b := &beams[i]
		if b.Status != StatusPass || len(b.Messages) > 0 || b.Mark == "" {
			row := pathBeamRow{IDs: b.ID, Mark: b.Mark, Count: 1, Kind: b.Kind, Size: b.Size, Spans: ftInList(b.SpansIn),
				Supports: strings.Join(b.Supports, ", "), Carries: memberList(b.Carries), Governing: b.Governing,
				Ratio: fmtx.Ratio(b.MaxRatio), Status: b.Status, Bad: b.Status != StatusPass, Messages: strings.Join(b.Messages, "; "),
				Checks: pathChecks(b.Checks)}
			rows = append(rows, row)
			continue
		}
		g := groups[b.Mark]
		if g == nil {
			g = &group{row: len(rows), gov: i}
			groups[b.Mark] = g
			order = append(order, g)
			rows = append(rows, pathBeamRow{Mark: b.Mark, Status: StatusPass})
		}
		g.ids = append(g.ids, b.ID)
		if b.MaxRatio > beams[g.gov].MaxRatio {
			g.gov = i
		}
		if !containsString(g.kind, b.Kind) {
			g.kind = append(g.kind, b.Kind)
		}
	}
	for _, g := range order {
		b := &beams[g.gov]
		row := &rows[g.row]
		row.IDs, row.Count, row.Kind = memberList(g.ids), len(g.ids), strings.Join(g.kind, ", ")
		row.Size, row.Spans, row.Governing, row.Ratio = b.Size, ftInList(b.SpansIn), b.Governing, fmtx.Ratio(b.MaxRatio)
		row.Checks = pathChecks(b.Checks)
		if len(g.ids) == 1 {
			row.Supports, row.Carries = strings.Join(b.Supports, ", "), memberList(b.Carries)
		} else if len(row.Checks) > 0 {
			row.Of = b.ID
		}
	}
	return rows
}

func containsString(list []string, s string) bool {
	for _, v := range list {
		if v == s {
			return true
		}
	}
	return false
}

func pathChecks(cs []Check) []pathCheckRow {
	var out []pathCheckRow
	for _, c := range cs {
		out = append(out, pathCheckRow{Kind: c.Kind, Combo: c.Combo, Actual: fmtNum(c.Actual),
			Allowable: fmtNum(c.Allowable), Unit: c.Unit, Ratio: fmtx.Ratio(c.Ratio)})
	}
	return out
}

// pathPosts gives one row per distinct post row apart from its id, in
// the order of its first post; a post that fails or is in error has its
// own. lb spells a load rounded to the pound, spell one as it is (both as
// fmtx.Lb).
func pathPosts(posts []PathPost, lb, spell func(float64) string) []pathPostRow {
	// a demand spelt once per distinct load (posts alike carry the same)
	demands := map[uint64]string{}
	demand := func(v float64) string {
		t, ok := demands[math.Float64bits(v)]
		if !ok {
			t = spell(DemandLb(v))
			demands[math.Float64bits(v)] = t
		}
		return t
	}
	return groupedRows(len(posts), func(i int) (pathPostRow, bool) {
		p := &posts[i]
		ratio := "not checked"
		if p.Checked {
			ratio = fmtx.Ratio(postRatio(p))
		}
		row := pathPostRow{Size: p.Size, D: lb(p.Loads.DeadLb), L: lb(p.Loads.LiveLb), Lr: lb(p.Loads.RoofLiveLb), S: lb(p.Loads.SnowLb),
			Down: demand(p.DownLb), Up: demand(p.UpLb), Ratio: ratio, Status: p.Status,
			Bad: p.Status == StatusFail || p.Status == StatusError}
		return row, !row.Bad
	}, func(i int) string { return posts[i].ID }, func(r *pathPostRow, ids string, n int) { r.IDs, r.Count = ids, n })
}

// groupedRows gives one row per distinct row (row(i) of each of the n
// items, ok false for an item that has a row of its own), in the order of
// its first item, each with its items' ids listed (memberList) and
// counted (set).
func groupedRows[R comparable](n int, row func(i int) (R, bool), id func(i int) string, set func(r *R, ids string, n int)) []R {
	groups := groupRows(n, math.MaxInt, row)
	out := make([]R, len(groups))
	for k, g := range groups {
		out[k], _ = row(g.items[0])
		ids := make([]string, len(g.items))
		for x, j := range g.items {
			ids[x] = id(j)
		}
		set(&out[k], memberList(ids), len(ids))
	}
	return out
}

// pathJoints gives one row per kind of joint with its largest demands.
func pathJoints(conns []Connection) []pathJointRow {
	var out []pathJointRow
	byKind := map[string]*pathJointRow{}
	var down, up = map[string]float64{}, map[string]float64{}
	for _, c := range conns {
		j := byKind[c.Kind]
		if j == nil {
			j = &pathJointRow{Kind: c.Kind}
			byKind[c.Kind] = j
		}
		j.Count++
		if c.DownLb > down[c.Kind] {
			down[c.Kind], j.Down, j.DownAt = c.DownLb, fmtx.Lb(DemandLb(c.DownLb)), c.Member+" on "+c.Carrier+" ("+c.DownCombo+")"
		}
		if c.UpLb > up[c.Kind] {
			up[c.Kind], j.Up, j.UpAt = c.UpLb, fmtx.Lb(DemandLb(c.UpLb)), c.Member+" on "+c.Carrier+" ("+c.UpCombo+")"
		}
	}
	for _, j := range byKind {
		out = append(out, *j)
	}
	sort.Slice(out, func(i, k int) bool { return out[i].Kind < out[k].Kind })
	return out
}

// pathFoundation gives one row per distinct foundation row apart from its
// id (kind, loads as shown and unit), in the order of its first line.
func pathFoundation(lines []FoundationLine, lb func(float64) string) []pathFoundRow {
	return groupedRows(len(lines), func(i int) (pathFoundRow, bool) {
		f := &lines[i]
		l, unit := f.Loads, "lb"
		if f.Kind == "wall" {
			l, unit = f.PerFoot, "plf"
		}
		return pathFoundRow{Kind: f.Kind, D: lb(l.DeadLb), L: lb(l.LiveLb), Lr: lb(l.RoofLiveLb),
			S: lb(l.SnowLb), Wd: lb(l.WindDownLb), Wu: lb(l.WindUpLb), Unit: unit}, true
	}, func(i int) string { return lines[i].ID }, func(r *pathFoundRow, ids string, n int) { r.IDs, r.Count = ids, n })
}
