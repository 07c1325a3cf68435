package pipeline

import (
	"fmt"
	"math"
	"sort"

	"framecheck/check"
	"framecheck/framing"
)

// decideRunRows decides the blocking rows of every run and checks each
// member with its run's rows (DOMAIN.md "Blocking rows"): the run gets the
// most rows any member needs, and every member of the run is braced by
// them and checked with them.
//
// A run with no rows drawn inside its spans gets n rows evenly spaced in
// every span, n the most any member needs (check.CheckWithRows). A run with
// drawn rows gets a set of positions (drawnRunRows): rows are counted from
// each member's first bearing, so members whose drawn starts differ still
// line up, as framing.PlaceRows lays them.
func decideRunRows(plan *framing.Plan, inputs []check.Member, shifts []float64, usable []bool, settings check.Settings, o *Outcome) {
	// Members identical for design checked with the same rows share one result.
	withRows := map[string]check.Result{}
	for ri, run := range plan.Runs {
		if runHasDrawnRows(run, inputs, usable) {
			if at := drawnRunRows(plan, run, inputs, shifts, usable, settings, o, withRows); len(at) > 0 {
				o.Rows = append(o.Rows, plan.PlaceRows(ri, at)...)
			}
			continue
		}
		n, ref := 0, -1
		for _, k := range run.Members {
			if !usable[k] {
				continue
			}
			if r := o.Results[k].RowsPerSpan(); ref < 0 || r > n {
				n, ref = r, k
			}
		}
		if n == 0 || ref < 0 {
			continue
		}
		for _, k := range run.Members {
			if usable[k] && o.Results[k].RowsPerSpan() != n {
				cm := inputs[k]
				cm.Size = o.Results[k].Size
				key := fmt.Sprintf("%d|%s", n, check.MemberKey(cm))
				r, ok := withRows[key]
				if !ok {
					r = check.CheckWithRows(cm, settings, n)
					withRows[key] = r
				}
				r.ID = cm.ID
				o.Results[k] = unshift(r, shifts[k])
			}
		}
		// Positions along the run's first member, from its Start:
		// PlaceRows offsets each member by its own first bearing.
		first := &plan.Members[run.Members[0]]
		refM := &plan.Members[ref]
		var at []float64
		for _, x := range o.Results[ref].BlockingAtIn {
			at = append(at, x-firstBearing(refM)+firstBearing(first))
		}
		o.Rows = append(o.Rows, plan.PlaceRows(ri, at)...)
	}
}

// runHasDrawnRows reports whether a usable member of run has a drawn row
// inside a span.
func runHasDrawnRows(run framing.Run, inputs []check.Member, usable []bool) bool {
	for _, k := range run.Members {
		if usable[k] && inputs[k].HasDrawnRowsInSpans() {
			return true
		}
	}
	return false
}

// samePosIn is how close two row positions must be to be one row.
const samePosIn = 0.01

// drawnRunRows decides the rows to add across a run with drawn rows and
// checks its members with them; it returns their positions along the run's
// first member from its Start (for PlaceRows), nil when none are needed.
//
// The member needing the most added rows gives the first set; each other
// member needing rows is then solved from that set (check.CheckMemberFrom
// keeps the set and adds rows only where its bottom edge still fails), so
// the set only grows and, since a row added never lengthens an unbraced
// stretch, every member solved earlier still passes with it. Finally every
// usable member is checked with the run's set (check.CheckWithRowsAt),
// which leaves out, member by member, a row within d of one of its drawn
// rows.
func drawnRunRows(plan *framing.Plan, run framing.Run, inputs []check.Member, shifts []float64, usable []bool,
	settings check.Settings, o *Outcome, cache map[string]check.Result) []float64 {
	// rel: positions from each member's first bearing
	toCheck := func(k int, rel []float64) []float64 {
		at := make([]float64, len(rel))
		for i, x := range rel {
			at[i] = x + firstBearing(&plan.Members[k]) + shifts[k]
		}
		return at
	}
	toRel := func(k int, at []float64) []float64 {
		rel := make([]float64, len(at))
		for i, x := range at {
			rel[i] = x - firstBearing(&plan.Members[k])
		}
		return rel
	}
	input := func(k int) check.Member {
		cm := inputs[k]
		cm.Size = o.Results[k].Size
		return cm
	}
	run1 := func(kind string, k int, rel []float64, f func(check.Member, check.Settings, []float64) check.Result) check.Result {
		cm := input(k)
		at := toCheck(k, rel)
		key := fmt.Sprintf("%s|%v|%s", kind, at, check.MemberKey(cm))
		r, ok := cache[key]
		if !ok {
			r = f(cm, settings, at)
			cache[key] = r
		}
		r.ID = cm.ID
		return unshift(r, shifts[k])
	}
	var order []int
	for _, k := range run.Members {
		if usable[k] && len(o.Results[k].BlockingAtIn) > 0 {
			order = append(order, k)
		}
	}
	sort.SliceStable(order, func(i, j int) bool {
		return len(o.Results[order[i]].BlockingAtIn) > len(o.Results[order[j]].BlockingAtIn)
	})
	var rel []float64
	for _, k := range order {
		if rel == nil {
			rel = toRel(k, o.Results[k].BlockingAtIn)
			continue
		}
		r := run1("from", k, rel, check.CheckMemberFrom)
		rel = unionPositions(rel, toRel(k, r.BlockingAtIn))
	}
	if len(rel) == 0 {
		return nil
	}
	for _, k := range run.Members {
		if usable[k] {
			o.Results[k] = run1("at", k, rel, check.CheckWithRowsAt)
		}
	}
	first := run.Members[0]
	at := make([]float64, len(rel))
	for i, x := range rel {
		at[i] = x + firstBearing(&plan.Members[first])
	}
	return at
}

// unionPositions returns the positions of a and b, sorted, with those
// within samePosIn of one before left out.
func unionPositions(a, b []float64) []float64 {
	out := append(append([]float64(nil), a...), b...)
	sort.Float64s(out)
	n := 0
	for _, x := range out {
		if n > 0 && math.Abs(x-out[n-1]) <= samePosIn {
			continue
		}
		out[n] = x
		n++
	}
	return out[:n]
}
