package beam

import "math"

// overlap returns the local interval [t1, t2] of segment s inside
// [from, to], and false when they do not meet.
func overlap(s *seg, from, to float64) (t1, t2 float64, ok bool) {
	if to < s.a || from > s.b {
		return 0, 0, false
	}
	t1, t2 = 0, s.l
	if from > s.a {
		t1 = from - s.a
	}
	if to < s.b {
		t2 = to - s.a
	}
	return t1, t2, true
}

// clampTo limits x to [lo, hi] (x = a + (from - a) may round past from).
func clampTo(x, lo, hi float64) float64 { return math.Min(math.Max(x, lo), hi) }

// span returns the ordered, clamped interval [from, to].
func (r *Response) span(fromIn, toIn float64) (float64, float64) {
	if fromIn > toIn {
		fromIn, toIn = toIn, fromIn
	}
	return r.clamp(fromIn), r.clamp(toIn)
}

// MomentExtremes returns the largest positive and the most negative
// moment on [from, to] (exact: moment is piecewise quadratic), with where
// they occur; 0 and from when none. The range may be given either way
// round (from is then the smaller end) and is clamped to the beam; on a
// tie the leftmost point is returned.
func (r *Response) MomentExtremes(fromIn, toIn float64) (maxPos, xPos, maxNeg, xNeg float64) {
	from, to := r.span(fromIn, toIn)
	xPos, xNeg = from, from
	for i := range r.segs {
		s := &r.segs[i]
		t1, t2, ok := overlap(s, from, to)
		if !ok {
			continue
		}
		ts := [3]float64{t1, -1, t2} // left to right: ties go to the leftmost
		if s.w != 0 {
			if tv := s.v0 / s.w; tv > t1 && tv < t2 {
				ts[1] = tv
			}
		}
		for _, t := range ts {
			if t < 0 {
				continue
			}
			m, x := s.moment(t), clampTo(s.a+t, from, to)
			if m > maxPos {
				maxPos, xPos = m, x
			}
			if m < maxNeg {
				maxNeg, xNeg = m, x
			}
		}
	}
	return maxPos, xPos, maxNeg, xNeg
}

// momentRoots returns the zeros of the moment of s strictly inside
// (tol, l - tol), sorted, as (t1, t2, count).
func (s *seg) momentRoots(tol float64) (float64, float64, int) {
	// M(t) = -w/2 t^2 + v0 t + ma
	var r [2]float64
	k := 0
	add := func(t float64) {
		if t > tol && t < s.l-tol {
			r[k] = t
			k++
		}
	}
	if s.w == 0 {
		if s.v0 != 0 {
			add(-s.ma / s.v0)
		}
	} else {
		d := s.v0*s.v0 + 2*s.w*s.ma
		if d > 0 {
			q := s.v0 + math.Copysign(math.Sqrt(d), s.v0)
			if q != 0 {
				t1, t2 := q/s.w, -2*s.ma/q
				if t1 > t2 {
					t1, t2 = t2, t1
				}
				add(t1)
				add(t2)
			}
		}
	}
	return r[0], r[1], k
}

// MomentSignChanges returns the x where the moment changes sign, sorted
// (exact roots per segment). The beam is cut into stretches where the
// moment is positive, negative or identically zero (an unloaded
// overhang); the points returned are the boundaries between neighbouring
// stretches of different sign, so each piece between two consecutive
// points (and the beam ends) has one sign, which the moment at its
// midpoint shows. A moment that only touches zero (at a simple end
// support, say) is not a change. Moments within 1e-9 of the largest
// moment on the beam count as zero. Returns nil when there is none.
func (r *Response) MomentSignChanges() []float64 {
	var buf [16]float64
	out := r.AppendMomentSignChanges(buf[:0])
	if len(out) == 0 {
		return nil
	}
	return append([]float64(nil), out...)
}

// AppendMomentSignChanges appends the points of MomentSignChanges to dst
// and returns the extended slice, so a caller can reuse one buffer.
func (r *Response) AppendMomentSignChanges(dst []float64) []float64 {
	out := dst
	scale := 0.0
	for i := range r.segs {
		s := &r.segs[i]
		scale = math.Max(scale, math.Max(math.Abs(s.ma), math.Abs(s.mb)))
		if s.w != 0 {
			if tv := s.v0 / s.w; tv > 0 && tv < s.l {
				scale = math.Max(scale, math.Abs(s.moment(tv)))
			}
		}
	}
	if scale == 0 {
		return out
	}
	eps := 1e-9 * scale
	sign := func(m float64) int {
		switch {
		case m > eps:
			return 1
		case m < -eps:
			return -1
		}
		return 0
	}
	prev, have := 0, false
	for i := range r.segs {
		s := &r.segs[i]
		tol := 1e-9 * s.l
		t1, t2, k := s.momentRoots(tol)
		cuts := [4]float64{0, t1, t2}
		nc := 1 + k // cuts[:nc+1] = 0, the roots, l
		cuts[nc] = s.l
		for j := 0; j < nc; j++ {
			p, q := cuts[j], cuts[j+1]
			if q-p <= tol {
				continue
			}
			sg := sign(s.moment((p + q) / 2))
			if !have {
				prev, have = sg, true
				continue
			}
			if sg != prev {
				out = append(out, s.a+p)
				prev = sg
			}
		}
	}
	return out
}

// MaxDeflection returns the deflection of largest magnitude on [from,
// to] (signed, in, positive down) and its x; the range is taken as for
// MomentExtremes. Within each segment the extremes are at the interval
// ends or where the slope is zero; the slope is monotone between the
// zeros of the moment, so each such root is bracketed and found by
// safeguarded Newton iteration to about 1e-13 of the segment length.
func (r *Response) MaxDeflection(fromIn, toIn float64) (deflIn, xIn float64) {
	from, to := r.span(fromIn, toIn)
	xIn = from
	best := -1.0
	consider := func(s *seg, t float64) {
		y := s.defl(t, r.invEI)
		if math.Abs(y) > best {
			best, deflIn, xIn = math.Abs(y), y, clampTo(s.a+t, from, to)
		}
	}
	for i := range r.segs {
		s := &r.segs[i]
		t1, t2, ok := overlap(s, from, to)
		if !ok {
			continue
		}
		consider(s, t1)
		m1, m2, k := s.momentRoots(0)
		cuts := [4]float64{t1, t2, t2, t2}
		n := 1
		roots := [2]float64{m1, m2}
		for _, m := range roots[:k] {
			if m > t1 && m < t2 {
				cuts[n] = m
				n++
			}
		}
		cuts[n] = t2
		for j := 0; j < n; j++ {
			if t, ok := s.slopeRoot(cuts[j], cuts[j+1], r.invEI); ok {
				consider(s, t)
			}
		}
		consider(s, t2) // last: ties go to the leftmost point
	}
	return deflIn, xIn
}

// slopeRoot finds the zero of the slope of s in (p, q), where the slope
// is monotone, if the slope changes sign there.
func (s *seg) slopeRoot(p, q, invEI float64) (float64, bool) {
	fp, fq := s.slope(p, invEI), s.slope(q, invEI)
	if fp == 0 || fq == 0 || (fp > 0) == (fq > 0) {
		return 0, false
	}
	// Start from the secant (regula falsi) point, then Newton on y' with
	// y'' = -M/EI, falling back to bisection whenever a step leaves the
	// bracket; stop after a Newton step below 1e-7 of the segment.
	t := p + (q-p)*fp/(fp-fq)
	for it := 0; it < 60; it++ {
		f := s.slope(t, invEI)
		if f == 0 {
			return t, true
		}
		if (f > 0) == (fp > 0) {
			p = t
		} else {
			q = t
		}
		d := -s.moment(t) * invEI
		tn := t - f/d
		if d == 0 || !(tn > p && tn < q) {
			t = (p + q) / 2
			continue
		}
		// Newton converges quadratically here: after a step of 1e-7 l
		// the new point is within about (1e-7)^2 l of the root.
		if math.Abs(tn-t) <= 1e-7*s.l {
			return tn, true
		}
		t = tn
	}
	return t, true
}
