package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync/atomic"

	"framecheck/check"
	"framecheck/export"
	"framecheck/framing"
	"framecheck/internal/par"
	"framecheck/loadpath"
	"framecheck/pipeline"
)

// exportLoadPath maps what the load path found onto results.json's
// load_path section and the sheets built from it; nil without one.
func exportLoadPath(o *outcome, toInch float64) *export.LoadPath {
	po := o.Path
	if po == nil || po.Solved == nil {
		return nil
	}
	plan := o.Plan
	lp := &export.LoadPath{Applied: typeLoads(po.Solved.Applied), Delivered: typeLoads(po.Solved.Delivered),
		// sized once: a large plan's load path has a hundred thousand joints
		Beams: make([]export.PathBeam, 0, len(po.Beams)), Posts: make([]export.PathPost, 0, len(po.Posts)),
		Connections: make([]export.Connection, 0, len(po.Posts)+len(po.Joints)),
		Foundation:  make([]export.FoundationLine, 0, len(po.Posts)+len(po.Walls))}
	wallID := map[int]string{}
	for i, w := range po.Walls {
		wallID[w.Support] = fmt.Sprintf("W%d", i+1)
	}
	// The joints first, on every core (a large plan has a hundred
	// thousand), each range writing its own, after the posts' bases; then
	// put side by side, joints alike, while the rest is mapped. A joint
	// is never of a post base's kind, so no group spans the two: the
	// bases put side by side, then the joints, are all of them put so
	// (export.OrderConnections). Were one of that kind, all are ordered
	// at once at the end.
	nPosts := len(po.Posts)
	lp.Connections = lp.Connections[:nPosts+len(po.Joints)]
	var baseKinds atomic.Bool
	par.Ranges(len(po.Joints), func(lo, hi int) {
		for x := lo; x < hi; x++ {
			jt := &po.Joints[x]
			c := export.Connection{Kind: jt.Kind, Member: po.IDs[jt.Member], Bearing: jt.Bearing + 1, Loads: typeLoads(jt.Loads),
				DownLb: jt.DownLb, DownCombo: jt.DownCombo, UpLb: jt.UpLb, UpCombo: jt.UpCombo}
			switch jt.Carrier.Kind {
			case loadpath.Member:
				c.Carrier = po.IDs[jt.Carrier.Index]
			case loadpath.Post:
				c.Carrier = plan.Posts[jt.Carrier.Index].ID
			case loadpath.Wall:
				c.Carrier = wallCarrier(jt.Carrier.Index)
			default:
				c.Carrier = "rigid support"
			}
			if c.Kind == postBase {
				baseKinds.Store(true)
			}
			lp.Connections[nPosts+x] = c
		}
	})
	apart := !baseKinds.Load()
	ordered := make(chan struct{})
	go func() {
		if apart {
			export.OrderConnections(lp.Connections[nPosts:])
		}
		close(ordered)
	}()
	// Every list of checks converted first, once per list, in order
	// (beams and posts alike share one); the items then read them on
	// every core.
	var lists pathLists
	beamList := make([]int, len(po.Beams))
	for i := range po.Beams {
		beamList[i] = lists.add(po.Beams[i].Res.Checks)
	}
	for i := range po.Posts {
		if p := &po.Posts[i]; len(p.Unknown) == 0 && p.Checked {
			lists.add(p.Out.Result.Checks)
		}
	}
	checks := lists.convert()
	beamChecks := make([][]export.Check, len(po.Beams))
	for i, l := range beamList {
		if l >= 0 {
			beamChecks[i] = lists.out[l]
		}
	}
	// The posts, on every core (a large plan has tens of thousands), each
	// range writing its own items.
	lp.Posts = lp.Posts[:nPosts]
	lp.Foundation = lp.Foundation[:nPosts]
	par.Ranges(nPosts, func(lo, hi int) {
		for i := lo; i < hi; i++ {
			p := &po.Posts[i]
			pt := p.Post
			ep := export.PathPost{ID: pt.ID, Source: pt.Pos.String(), At: [2]float64{pt.At.X / toInch, pt.At.Y / toInch},
				AtIn: [2]float64{pt.At.X, pt.At.Y}, Size: p.Size, HeightIn: p.HeightIn, Checked: p.Checked, Loads: typeLoads(p.Out.Loads)}
			for _, pc := range p.Out.Cases {
				if pc.PLb > ep.DownLb {
					ep.DownLb, ep.DownCombo = pc.PLb, pc.Name
				}
				if -pc.PLb > ep.UpLb {
					ep.UpLb, ep.UpCombo = -pc.PLb, pc.Name
				}
			}
			if len(p.Unknown) > 0 {
				ep.Status = check.StatusError
				ep.Messages = []string{fmt.Sprintf("carries %s, which could not be checked: the load it brings is not known, so this post "+
					"is not checked; check the beam, then the post", strings.Join(p.Unknown, ", "))}
			} else if p.Checked {
				r := p.Out.Result
				ep.Species, ep.Grade, ep.Status, ep.Messages = r.DesignVals.Species, r.DesignVals.Grade, r.Status, r.Messages
				ep.Checks = checks.converted(r.Checks)
			} else {
				ep.Messages = []string{"no size or height: its load is reported, not checked (give a size beside it and [[post]] height_in)"}
			}
			lp.Posts[i] = ep
			lp.Connections[i] = export.Connection{Kind: postBase, Member: pt.ID, Bearing: 1, Carrier: "foundation",
				Loads: ep.Loads, DownLb: ep.DownLb, DownCombo: ep.DownCombo, UpLb: ep.UpLb, UpCombo: ep.UpCombo}
			lp.Foundation[i] = export.FoundationLine{Kind: "post", ID: pt.ID, Source: ep.Source, Loads: ep.Loads}
		}
	})
	lp.Beams = lp.Beams[:len(po.Beams)]
	keys := make([]string, len(po.Beams))
	par.Ranges(len(po.Beams), func(lo, hi int) {
		for i := lo; i < hi; i++ {
			lp.Beams[i], keys[i] = pathBeam(plan, &po.Beams[i], wallID, beamChecks[i], toInch)
		}
	})
	// marks in the beams' order: B1 the first beam's, then each new one
	marks := map[string]string{}
	for i := range lp.Beams {
		if marks[keys[i]] == "" {
			marks[keys[i]] = "B" + strconv.Itoa(len(marks)+1)
		}
		lp.Beams[i].Mark = marks[keys[i]]
	}
	for i, w := range po.Walls {
		if w.Loads == (loadpath.Loads{HasUpliftDead: w.Loads.HasUpliftDead, UpliftDeadLb: w.Loads.UpliftDeadLb}) {
			continue // nothing reaches it
		}
		fl := export.FoundationLine{Kind: "wall", ID: fmt.Sprintf("W%d", i+1), LengthIn: w.LengthIn, Loads: typeLoads(w.Loads),
			Source: plan.Supports[w.Support].Pos.String()}
		if ft := w.LengthIn / 12; ft > 0 {
			l := fl.Loads
			fl.PerFoot = export.TypeLoads{DeadLb: l.DeadLb / ft, LiveLb: l.LiveLb / ft, RoofLiveLb: l.RoofLiveLb / ft, SnowLb: l.SnowLb / ft,
				WindDownLb: l.WindDownLb / ft, WindUpLb: l.WindUpLb / ft, UpliftDeadLb: l.UpliftDeadLb / ft}
		}
		lp.Foundation = append(lp.Foundation, fl)
	}
	// What reaches supports the path does not follow (beams left rigid,
	// supports with check = false) is on no wall line or post: one line
	// of its own, so that the foundation lines add up to what is delivered.
	if r := po.Solved.ToRigid; r != (loadpath.Loads{HasUpliftDead: r.HasUpliftDead, UpliftDeadLb: r.UpliftDeadLb}) {
		lp.Foundation = append(lp.Foundation, export.FoundationLine{Kind: "rigid", ID: "rigid supports", Loads: typeLoads(r),
			Source: "supports the load path does not follow (beams left rigid, [[support]] check = false): what they stand on is not checked here"})
	}
	<-ordered
	if apart {
		export.OrderConnections(lp.Connections[:nPosts])
	} else {
		export.OrderConnections(lp.Connections)
	}
	return lp
}

// postBase is the kind of joint of a post on the foundation.
const postBase = "post base"

// pathBeam maps beam outcome bo as results.json's load_path lists it,
// but for its mark, and returns the key of its mark: beams of one size,
// lumber, spans (to the inch up), largest ratio (to 0.01) and status share
// one. checks are its checks as converted (pathLists).
func pathBeam(plan *framing.Plan, bo *pipeline.BeamOutcome, wallID map[int]string, checks []export.Check, toInch float64) (export.PathBeam, string) {
	b := bo.Beam
	eb := export.PathBeam{ID: b.ID, Kind: b.Kind, Layer: b.Layer, LengthIn: b.LengthIn,
		Start: [2]float64{b.Start.X / toInch, b.Start.Y / toInch}, End: [2]float64{b.End.X / toInch, b.End.Y / toInch},
		StartIn: [2]float64{b.Start.X, b.Start.Y}, EndIn: [2]float64{b.End.X, b.End.Y},
		Size: bo.Res.Size, Species: bo.Res.Species, Grade: bo.Res.Grade, Status: bo.Res.Status,
		Governing: bo.Res.Governing, MaxRatio: bo.Res.MaxRatio, Messages: append(append([]string(nil), b.Messages...), bo.Res.Messages...)}
	if len(b.Lines) > 0 {
		eb.Source = b.Lines[0].String()
	}
	if eb.Size == "" {
		eb.Size = bo.Input.Size
	}
	eb.SpansIn = bo.Res.SpansIn
	for _, br := range b.Bearings {
		switch br.Kind {
		case "post":
			eb.Supports = append(eb.Supports, plan.Posts[br.Index].ID)
		case "wall":
			eb.Supports = append(eb.Supports, "wall "+wallID[br.Index])
		default:
			eb.Supports = append(eb.Supports, plan.Beams[br.Index].ID)
		}
	}
	// the joists it carries, then the beams framing into it (an audit
	// found a girder's list empty where a beam bore on it)
	eb.Carries = make([]string, len(b.Carried), len(b.Carried)+len(b.CarriedBeams))
	for i, c := range b.Carried {
		eb.Carries[i] = plan.Members[c.Member].ID
	}
	for _, k := range b.CarriedBeams {
		if k >= 0 && k < len(plan.Beams) {
			eb.Carries = append(eb.Carries, plan.Beams[k].ID)
		}
	}
	eb.Checks = checks
	key := fmt.Sprintf("%s|%s|%s|%v|%.2f|%s", eb.Size, eb.Species, eb.Grade, roundUp(eb.SpansIn), eb.MaxRatio, eb.Status)
	return eb, key
}

// pathLists are the distinct lists of checks of a load path's beams and
// posts, converted once each (beams and posts checked alike share their
// check.Result's list: the load path analyses them once).
type pathLists struct {
	lists [][]check.CheckResult
	out   [][]export.Check
	index map[*check.CheckResult]int // by first check: the last list added
}

// add adds cs, when not already added, and returns its index (-1 for an
// empty list).
func (pl *pathLists) add(cs []check.CheckResult) int {
	if len(cs) == 0 {
		return -1
	}
	if pl.index == nil {
		pl.index = map[*check.CheckResult]int{}
	}
	if i, ok := pl.index[&cs[0]]; ok && len(pl.lists[i]) == len(cs) {
		return i
	}
	pl.index[&cs[0]] = len(pl.lists)
	pl.lists = append(pl.lists, cs)
	return len(pl.lists) - 1
}

// convert converts every list added, on every core, and returns them by
// their first check (pathChecks: what converted gives).
func (pl *pathLists) convert() pathChecks {
	pl.out = make([][]export.Check, len(pl.lists))
	par.Each(len(pl.lists), func(i int) {
		cs := pl.lists[i]
		out := make([]export.Check, len(cs))
		for j, c := range cs {
			out[j] = export.Check{Kind: c.Kind, Combo: c.Combo, Actual: c.Actual, Allowable: c.Allowable,
				Unit: c.Unit, Ratio: c.Ratio, Trace: exportTrace(c.Trace())}
		}
		pl.out[i] = out
	})
	pc := pathChecks{}
	for first, i := range pl.index {
		pc[first] = pl.out[i]
	}
	return pc
}

// wallCarrier names wall i (0-based) as a connection's carrier.
func wallCarrier(i int) string { return "wall W" + strconv.Itoa(i+1) }

// pathChecks are the lists of checks as converted (pathLists.convert), by
// their first check: beams and posts checked alike share their
// check.Result's list, and so share one converted list, which results.json
// writes once (its load path's "calculations").
type pathChecks map[*check.CheckResult][]export.Check

// converted returns cs as converted, nil when cs is empty: safe from
// several goroutines.
func (pc pathChecks) converted(cs []check.CheckResult) []export.Check {
	if len(cs) == 0 {
		return nil
	}
	return pc[&cs[0]]
}

func typeLoads(l loadpath.Loads) export.TypeLoads {
	return export.TypeLoads{DeadLb: l.DeadLb, LiveLb: l.LiveLb, RoofLiveLb: l.RoofLiveLb, SnowLb: l.SnowLb,
		WindDownLb: l.WindDownLb, WindUpLb: l.WindUpLb, UpliftDeadLb: l.UpliftDeadLb}
}

func roundUp(xs []float64) []float64 {
	out := make([]float64, len(xs))
	for i, x := range xs {
		out[i] = math.Ceil(x - 1e-6)
	}
	return out
}

// pathStatus reports whether a beam or a checked post of the load path
// fails or is in error: the run then exits 1 as for a joist.
func pathStatus(lp *export.LoadPath) (fail, errs int) {
	if lp == nil {
		return 0, 0
	}
	for _, b := range lp.Beams {
		switch b.Status {
		case check.StatusFail:
			fail++
		case check.StatusError:
			errs++
		}
	}
	for _, p := range lp.Posts {
		switch p.Status {
		case check.StatusFail:
			fail++
		case check.StatusError:
			errs++
		}
	}
	return fail, errs
}
