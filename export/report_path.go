package export

import (
	"math"
	"sort"
	"strings"

	"framecheck/export/internal/fmtx"
)

// pathSection is the report's load path section.
type pathSection struct {
	Summary, Balance string
	Beams            []pathBeamRow
	Posts            []pathPostRow
	Joints           []pathJointRow
	Foundation       []pathFoundRow
}

type pathCheckRow struct{ Kind, Combo, Actual, Allowable, Unit, Ratio string }

type pathBeamRow struct {
	ID, Mark, Kind, Size, Spans, Supports, Carries, Governing, Ratio, Status, Messages string
	Bad                                                                                bool
	Checks                                                                             []pathCheckRow
}

type pathPostRow struct {
	ID, Size, D, L, Lr, S, Down, Up, Ratio, Status string
	Bad                                            bool
}

type pathJointRow struct {
	Kind, Down, DownAt, Up, UpAt string
	Count                        int
}

type pathFoundRow struct{ Kind, ID, D, L, Lr, S, Wd, Wu, Unit string }

// buildPath fills the load path section from r.LoadPath; nil without one.
func buildPath(r *Results) *pathSection {
	lp := r.LoadPath
	if lp == nil {
		return nil
	}
	lb := func(v float64) string { return fmtx.Lb(math.Round(v)) }
	s := &pathSection{Summary: LoadPathSummary(lp)}
	a, d := lp.Applied, lp.Delivered
	s.Balance = "D " + lb(a.DeadLb) + " lb put on, " + lb(d.DeadLb) + " lb delivered; L " + lb(a.LiveLb) + " / " + lb(d.LiveLb) +
		" lb; Lr " + lb(a.RoofLiveLb) + " / " + lb(d.RoofLiveLb) + " lb; S " + lb(a.SnowLb) + " / " + lb(d.SnowLb) + " lb"
	// Each mark's checks are listed for its beam with the largest ratio,
	// as the joists' calculations are by mark; a beam that does not pass
	// has its own listed too.
	governing := map[string]int{}
	for i, b := range lp.Beams {
		if g, ok := governing[b.Mark]; !ok || b.MaxRatio > lp.Beams[g].MaxRatio {
			governing[b.Mark] = i
		}
	}
	for i, b := range lp.Beams {
		row := pathBeamRow{ID: b.ID, Mark: b.Mark, Kind: b.Kind, Size: b.Size, Spans: ftInList(b.SpansIn),
			Supports: strings.Join(b.Supports, ", "), Carries: memberList(b.Carries), Governing: b.Governing,
			Ratio: fmtx.Ratio(b.MaxRatio), Status: b.Status, Bad: b.Status != StatusPass, Messages: strings.Join(b.Messages, "; ")}
		listed := governing[b.Mark] == i || b.Mark == "" || row.Bad
		for _, c := range b.Checks {
			if !listed {
				break
			}
			row.Checks = append(row.Checks, pathCheckRow{Kind: c.Kind, Combo: c.Combo, Actual: fmtNum(c.Actual),
				Allowable: fmtNum(c.Allowable), Unit: c.Unit, Ratio: fmtx.Ratio(c.Ratio)})
		}
		s.Beams = append(s.Beams, row)
	}
	for _, p := range lp.Posts {
		ratio := "not checked"
		if p.Checked {
			m := 0.0
			for _, c := range p.Checks {
				m = math.Max(m, c.Ratio)
			}
			ratio = fmtx.Ratio(m)
		}
		s.Posts = append(s.Posts, pathPostRow{ID: p.ID, Size: p.Size, D: lb(p.Loads.DeadLb), L: lb(p.Loads.LiveLb),
			Lr: lb(p.Loads.RoofLiveLb), S: lb(p.Loads.SnowLb), Down: fmtx.Lb(DemandLb(p.DownLb)), Up: fmtx.Lb(DemandLb(p.UpLb)),
			Ratio: ratio, Status: p.Status, Bad: p.Status == StatusFail || p.Status == StatusError})
	}
	byKind := map[string]*pathJointRow{}
	var down, up = map[string]float64{}, map[string]float64{}
	for _, c := range lp.Connections {
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
		s.Joints = append(s.Joints, *j)
	}
	sort.Slice(s.Joints, func(i, k int) bool { return s.Joints[i].Kind < s.Joints[k].Kind })
	for _, f := range lp.Foundation {
		l, unit := f.Loads, "lb"
		if f.Kind == "wall" {
			l, unit = f.PerFoot, "plf"
		}
		s.Foundation = append(s.Foundation, pathFoundRow{Kind: f.Kind, ID: f.ID, D: lb(l.DeadLb), L: lb(l.LiveLb), Lr: lb(l.RoofLiveLb),
			S: lb(l.SnowLb), Wd: lb(l.WindDownLb), Wu: lb(l.WindUpLb), Unit: unit})
	}
	return s
}
