package check

import "math"

// LoadReactions are the reactions at one bearing of a member under each
// load type alone, at service level (factor 1, every span loaded: no
// pattern), lb, as loads on the support: positive presses it down.
// WindUpLb is the magnitude of the pull on the support from the wind
// suction alone; UpliftDeadLb the reaction from the dead load relied on
// against uplift. A supporting member takes them as point loads per load
// type and forms its own combinations from them (DOMAIN.md "The load
// path").
type LoadReactions struct {
	Bearing                            int
	AtIn                               float64 // bearing centre-line, from the member start
	DeadLb, LiveLb, RoofLiveLb, SnowLb float64
	WindDownLb, WindUpLb               float64
	UpliftDeadLb                       float64
}

// PointLoad returns r as a point load at atIn on the supporting member.
func (r LoadReactions) PointLoad(atIn float64, name string) PointLoad {
	return PointLoad{AtIn: atIn, DeadLb: r.DeadLb, LiveLb: r.LiveLb, RoofLiveLb: r.RoofLiveLb, SnowLb: r.SnowLb,
		WindDownLb: r.WindDownLb, WindUpLb: r.WindUpLb, UpliftDeadLb: r.UpliftDeadLb, HasUpliftDead: true, Name: name}
}

// ServiceReactions returns each bearing's reactions by load type (see
// LoadReactions), the load on an end that is part of its bearing included,
// by statics of the member as analysed (three-moment equation for
// continuous members). Loads that would press a support the wrong way (a
// continuous member's end reaction under a load on the far span) keep
// their sign.
func ServiceReactions(m Member, s Settings) ([]LoadReactions, error) {
	e, err := newEngine(m, s)
	defer e.release()
	if err != nil {
		return nil, err
	}
	return e.serviceReactions()
}

// CheckMemberReactions is CheckMember and ServiceReactions of m from one
// analysis: the load path needs both of every beam.
func CheckMemberReactions(m Member, s Settings) (Result, []LoadReactions, error) {
	e, err := newEngine(m, s)
	defer e.release()
	if err != nil {
		return errorResult(m, e, err), nil, err
	}
	rs, rerr := e.serviceReactions()
	var r Result
	if e.drawnInSpans() {
		r = e.solveFrom(nil)
	} else {
		n, steps, bot := e.solveBlocking()
		r = e.result(n, bot)
		r.BlockingSteps = steps
	}
	return r, rs, rerr
}

func (e *engine) serviceReactions() ([]LoadReactions, error) {
	out := make([]LoadReactions, len(e.m.Bearings))
	for j, b := range e.m.Bearings {
		out[j] = LoadReactions{Bearing: j, AtIn: b.AtIn}
	}
	c := &e.svc
	if cap(c.w) < len(e.lps) {
		c.w = make([]float64, len(e.lps))
	}
	c.w = c.w[:len(e.lps)]
	all := uint32(1)<<len(e.segs) - 1
	last := len(e.m.Bearings) - 1
	for _, lt := range [...]struct {
		t   LoadType
		dir float64
		dst func(r *LoadReactions) *float64
	}{
		{LoadD, 0, func(r *LoadReactions) *float64 { return &r.DeadLb }},
		{LoadL, 0, func(r *LoadReactions) *float64 { return &r.LiveLb }},
		{LoadLr, 0, func(r *LoadReactions) *float64 { return &r.RoofLiveLb }},
		{LoadS, 0, func(r *LoadReactions) *float64 { return &r.SnowLb }},
		{LoadW, 1, func(r *LoadReactions) *float64 { return &r.WindDownLb }},
		{LoadW, -1, func(r *LoadReactions) *float64 { return &r.WindUpLb }},
		{LoadD, -1, func(r *LoadReactions) *float64 { return &r.UpliftDeadLb }},
	} {
		var f factorSet
		f[lt.t] = 1
		c.f, c.dir, c.pattern = f, lt.dir, all
		e.fillCase(c)
		if err := e.solve(&c.r, c.w, c.pts); err != nil {
			return nil, err
		}
		for j, b := range e.m.Bearings {
			r := c.r.Reactions()[j]
			// an end that is part of its bearing: the load on its piece
			// past the centre-line goes straight into the reaction
			if j == 0 && e.m.OverhangStartIn == 0 && b.AtIn > 0 {
				r += e.stubLoad(c, 0, b.AtIn, 0)
			}
			if j == last && e.m.OverhangEndIn == 0 && e.m.LengthIn > b.AtIn {
				r += e.stubLoad(c, b.AtIn, e.m.LengthIn, len(e.segs)-1)
			}
			if lt.t == LoadW && lt.dir < 0 {
				r = -r // the suction pulls the support up: a magnitude
			}
			*lt.dst(&out[j]) = r
		}
	}
	for j := range out {
		for _, p := range [...]*float64{&out[j].DeadLb, &out[j].LiveLb, &out[j].RoofLiveLb, &out[j].SnowLb,
			&out[j].WindDownLb, &out[j].WindUpLb, &out[j].UpliftDeadLb} {
			if math.Abs(*p) < 1e-9 {
				*p = 0
			}
		}
	}
	return out, nil
}
