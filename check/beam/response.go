package beam

import "math"

// seg is one analysed segment. With t = x - a the local coordinate
// (0 <= t <= l), the exact responses are
//
//	V(t)  = v0 - w t                                  (shear, = dM/dx)
//	M(t)  = ma (1 - t/l) + mb t/l + w t (l - t) / 2   (= ma + v0 t - w t^2/2)
//	y'(t) = th0 - (ma t + v0 t^2/2 - w t^3/6) / EI
//	y(t)  = y0 + th0 t - (ma t^2/2 + v0 t^3/6 - w t^4/24) / EI
//
// from EI d2y/dx2 = -M with y positive downward.
type seg struct {
	a, b, l float64 // ends and length, in
	w       float64 // line load, lb/in, positive down
	ma, mb  float64 // end moments, lb*in, sagging positive
	v0      float64 // shear just right of a, lb
	y0, th0 float64 // deflection (in, down) and slope at a
}

// moment returns M at local t; exact (bit for bit) at t = 0 and t = l.
func (s *seg) moment(t float64) float64 {
	u := t / s.l
	return s.ma*(1-u) + s.mb*u + s.w*t*(s.l-t)/2
}

func (s *seg) shear(t float64) float64 { return s.v0 - s.w*t }

func (s *seg) slope(t, invEI float64) float64 {
	return s.th0 - t*(s.ma+t*(s.v0/2-s.w*t/6))*invEI
}

func (s *seg) defl(t, invEI float64) float64 {
	return s.y0 + t*(s.th0-t*(s.ma/2+t*(s.v0/6-s.w*t/24))*invEI)
}

// Response is the solved state of a Beam under one set of segment loads:
// exact piecewise shear (linear), moment (quadratic) and deflection
// (quartic). Its methods take x in inches from the left end of the beam;
// x outside [0, LengthIn] is clamped to the nearest end. A Response is
// read-only after Solve and safe for concurrent readers. The zero
// Response is an empty one, ready for Beam.SolveInto. A Response may be
// copied, but copies share storage: SolveInto on one changes the other.
type Response struct {
	lengthIn  float64
	invEI     float64
	segs      []seg
	supportM  []float64
	reactions []float64
	buf       []float64 // backing store of supportM and reactions
}

// newResponse returns a zeroed Response for m segments and n supports in
// one allocation sized to the beam (the common 1 to 6 segment members),
// so that Solve stays cheap.
func newResponse(m, n int) *Response {
	switch {
	case m <= 1 && n <= 2:
		p := new(struct {
			r Response
			s [1]seg
			f [4]float64
		})
		p.r.attach(p.s[:m], p.f[:2*n])
		return &p.r
	case m <= 3 && n <= 4:
		p := new(struct {
			r Response
			s [3]seg
			f [8]float64
		})
		p.r.attach(p.s[:m], p.f[:2*n])
		return &p.r
	case m <= 6 && n <= 7:
		p := new(struct {
			r Response
			s [6]seg
			f [14]float64
		})
		p.r.attach(p.s[:m], p.f[:2*n])
		return &p.r
	}
	r := new(Response)
	r.attach(newStorage(m, n))
	return r
}

// newStorage returns zeroed storage for m segments and n supports, in one
// allocation for up to 6 segments.
func newStorage(m, n int) ([]seg, []float64) {
	switch {
	case m <= 1 && n <= 2:
		p := new(struct {
			s [1]seg
			f [4]float64
		})
		return p.s[:m], p.f[:2*n]
	case m <= 3 && n <= 4:
		p := new(struct {
			s [3]seg
			f [8]float64
		})
		return p.s[:m], p.f[:2*n]
	case m <= 6 && n <= 7:
		p := new(struct {
			s [6]seg
			f [14]float64
		})
		return p.s[:m], p.f[:2*n]
	}
	return make([]seg, m), make([]float64, 2*n)
}

// attach points r at zeroed storage: segs for the segments, f (2n long)
// for the support moments and reactions.
func (r *Response) attach(segs []seg, f []float64) {
	n := len(f) / 2
	r.segs, r.buf = segs, f
	r.supportM, r.reactions = f[:n:n], f[n:]
}

// reset sizes r for m segments and n supports, reusing its storage when
// large enough, and zeroes every value.
func (r *Response) reset(m, n int) {
	r.lengthIn, r.invEI = 0, 0
	if cap(r.segs) < m || cap(r.buf) < 2*n {
		r.attach(newStorage(m, n))
		return
	}
	segs, f := r.segs[:m], r.buf[:2*n]
	clear(segs)
	clear(f)
	r.attach(segs, f)
}

// Reactions returns the support reactions, lb, upward positive, one per
// support in the order of Beam.SupportsAtIn. The slice belongs to r: do
// not modify it, and copy it to keep it past a later SolveInto on r.
func (r *Response) Reactions() []float64 { return r.reactions }

// SupportMoments returns the bending moment at each support, lb*in,
// sagging positive (so negative over interior supports of a continuous
// beam under gravity). The slice belongs to r, as for Reactions.
func (r *Response) SupportMoments() []float64 { return r.supportM }

// LengthIn returns the length of the solved beam, in.
func (r *Response) LengthIn() float64 { return r.lengthIn }

// clamp limits x to [0, L].
func (r *Response) clamp(x float64) float64 {
	if x < 0 || math.IsNaN(x) {
		return 0
	}
	if x > r.lengthIn {
		return r.lengthIn
	}
	return x
}

// find returns the index of the segment holding x (already clamped); at a
// key point shared by two segments it returns the left one.
func (r *Response) find(x float64) int {
	segs := r.segs
	for i := range segs {
		if x <= segs[i].b {
			return i
		}
	}
	return len(segs) - 1
}

// Moment returns the bending moment at x, lb*in, positive = sagging (top
// edge in compression).
func (r *Response) Moment(xIn float64) float64 {
	if len(r.segs) == 0 {
		return 0
	}
	x := r.clamp(xIn)
	s := &r.segs[r.find(x)]
	return s.moment(x - s.a)
}

// ShearEachSide returns the shear just left and just right of x, lb,
// with shear = dM/dx = the sum of the upward forces left of the section
// (so +wL/2 at the left support of a simple span). Left of x = 0 and
// right of x = LengthIn the shear is 0; across a support the two differ
// by the reaction.
func (r *Response) ShearEachSide(xIn float64) (left, right float64) {
	if len(r.segs) == 0 || xIn < 0 || xIn > r.lengthIn || math.IsNaN(xIn) {
		return 0, 0
	}
	x := xIn
	segs := r.segs
	for i := range segs {
		s := &segs[i]
		if x > s.a && x <= s.b {
			left = s.shear(x - s.a)
		}
		if x >= s.a && x < s.b {
			right = s.shear(x - s.a)
		}
	}
	return left, right
}

// Slope returns dy/dx at x (radians, small-angle), with y positive
// downward: positive where the beam goes down towards +x.
func (r *Response) Slope(xIn float64) float64 {
	if len(r.segs) == 0 {
		return 0
	}
	x := r.clamp(xIn)
	s := &r.segs[r.find(x)]
	return s.slope(x-s.a, r.invEI)
}

// Deflection returns the deflection at x, in, positive = downward.
func (r *Response) Deflection(xIn float64) float64 {
	if len(r.segs) == 0 {
		return 0
	}
	x := r.clamp(xIn)
	s := &r.segs[r.find(x)]
	return s.defl(x-s.a, r.invEI)
}
