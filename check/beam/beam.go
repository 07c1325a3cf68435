package beam

import (
	"errors"
	"fmt"
	"math"
)

// Sentinel causes wrapped by the errors of Validate and Solve; test them
// with errors.Is.
var (
	// ErrBadBeam: the geometry or stiffness of the Beam is unusable.
	ErrBadBeam = errors.New("beam: invalid beam")
	// ErrBadLoad: the load vector given to Solve is unusable.
	ErrBadLoad = errors.New("beam: invalid load")
)

// minGapFrac is the smallest distance between two supports, as a fraction
// of the beam length, below which they count as one point (coincident
// supports): a span that short would make the analysis ill-conditioned.
const minGapFrac = 1e-9

// Beam is a prismatic member on point supports; x runs from 0 (left end)
// to LengthIn.
type Beam struct {
	LengthIn     float64   // total length, in
	SupportsAtIn []float64 // support positions, in; sorted ascending, at least 2, each within [0, LengthIn]
	EILbIn2      float64   // E*I in lb*in^2 (deflections then come out in inches)
}

// Segment is a piece of the beam between key points: a left cantilever
// [0, s0] when s0 > 0, each span [s_i, s_i+1], a right cantilever
// [s_last, L] when s_last < L.
type Segment struct {
	FromIn, ToIn float64 // ends of the piece, in, FromIn < ToIn
	Cantilever   bool    // true for an overhang past the first or last support
}

// Validate reports whether b can be analysed: a finite length > 0, a
// finite EI > 0, at least two finite supports within [0, LengthIn],
// strictly ascending and not coincident. The error wraps ErrBadBeam.
func (b Beam) Validate() error {
	if !finite(b.LengthIn) || b.LengthIn <= 0 {
		return fmt.Errorf("%w: length %v in: want a finite length > 0", ErrBadBeam, b.LengthIn)
	}
	if !finite(b.EILbIn2) || b.EILbIn2 <= 0 {
		return fmt.Errorf("%w: EI %v lb*in^2: want a finite stiffness > 0", ErrBadBeam, b.EILbIn2)
	}
	n := len(b.SupportsAtIn)
	if n < 2 {
		return fmt.Errorf("%w: %d support(s): want at least 2", ErrBadBeam, n)
	}
	minGap := b.LengthIn * minGapFrac
	for i, s := range b.SupportsAtIn {
		if !finite(s) {
			return fmt.Errorf("%w: support[%d] at %v in: want a finite position", ErrBadBeam, i, s)
		}
		if s < 0 || s > b.LengthIn {
			return fmt.Errorf("%w: support[%d] at %g in lies outside the beam [0, %g] in", ErrBadBeam, i, s, b.LengthIn)
		}
		if i == 0 {
			continue
		}
		p := b.SupportsAtIn[i-1]
		if s < p {
			return fmt.Errorf("%w: support[%d] at %g in comes before support[%d] at %g in: want supports sorted ascending",
				ErrBadBeam, i, s, i-1, p)
		}
		if s-p <= minGap {
			return fmt.Errorf("%w: support[%d] and support[%d] coincide at %g in", ErrBadBeam, i-1, i, s)
		}
	}
	return nil
}

// hasCantilevers reports whether b has a left and a right overhang. It
// assumes b is valid.
func (b Beam) hasCantilevers() (left, right bool) {
	s := b.SupportsAtIn
	return s[0] > 0, s[len(s)-1] < b.LengthIn
}

// NumSegments returns len(b.Segments()) without allocating; 0 when b has
// fewer than two supports.
func (b Beam) NumSegments() int {
	n := len(b.SupportsAtIn)
	if n < 2 {
		return 0
	}
	m := n - 1
	left, right := b.hasCantilevers()
	if left {
		m++
	}
	if right {
		m++
	}
	return m
}

// Segments returns the pieces of b from left to right: the left
// cantilever (if any), each span between adjacent supports, the right
// cantilever (if any). It returns nil when b has fewer than two supports.
func (b Beam) Segments() []Segment {
	m := b.NumSegments()
	if m == 0 {
		return nil
	}
	s := b.SupportsAtIn
	out := make([]Segment, 0, m)
	left, right := b.hasCantilevers()
	if left {
		out = append(out, Segment{FromIn: 0, ToIn: s[0], Cantilever: true})
	}
	for i := 0; i+1 < len(s); i++ {
		out = append(out, Segment{FromIn: s[i], ToIn: s[i+1]})
	}
	if right {
		out = append(out, Segment{FromIn: s[len(s)-1], ToIn: b.LengthIn, Cantilever: true})
	}
	return out
}

// Solve analyses the beam with a uniform line load wPli[k] (lb/in,
// positive = downward, gravity; negative = upward, uplift) on segment k
// (len(wPli) == len(b.Segments())). Errors wrap ErrBadBeam or ErrBadLoad.
// It makes one allocation, sized to the beam; SolveInto makes none.
func (b Beam) Solve(wPli []float64) (*Response, error) {
	m, err := b.checkLoads(wPli)
	if err != nil {
		return nil, err
	}
	r := newResponse(m, len(b.SupportsAtIn))
	if err := b.fill(r, wPli); err != nil {
		return nil, err
	}
	return r, nil
}

// SolveInto is Solve writing into r, reusing r's storage: once r has held
// a beam with as many segments it allocates nothing. On error r is left
// empty (every query returns 0).
func (b Beam) SolveInto(r *Response, wPli []float64) error {
	m, err := b.checkLoads(wPli)
	if err != nil {
		r.reset(0, 0)
		return err
	}
	r.reset(m, len(b.SupportsAtIn))
	if err := b.fill(r, wPli); err != nil {
		r.reset(0, 0)
		return err
	}
	return nil
}

// checkLoads validates b and wPli and returns the number of segments.
func (b Beam) checkLoads(wPli []float64) (int, error) {
	if err := b.Validate(); err != nil {
		return 0, err
	}
	m := b.NumSegments()
	if len(wPli) != m {
		return 0, fmt.Errorf("%w: %d line loads for %d segments: want one per segment", ErrBadLoad, len(wPli), m)
	}
	for k, w := range wPli {
		if !finite(w) {
			return 0, fmt.Errorf("%w: load on segment %d is %v lb/in: want a finite value", ErrBadLoad, k, w)
		}
	}
	return m, nil
}

// fill solves the valid beam b under wPli into r, already sized for it
// and zeroed. Its only error is an overflow (loads or lengths near the
// float64 range), which wraps ErrBadLoad.
func (b Beam) fill(r *Response, wPli []float64) error {
	sup := b.SupportsAtIn
	n := len(sup)
	m := len(r.segs)
	r.lengthIn = b.LengthIn
	r.invEI = 1 / b.EILbIn2
	left, right := b.hasCantilevers()

	// Geometry and loads of each segment.
	segs := r.segs
	k := 0
	if left {
		segs[0] = seg{a: 0, b: sup[0], w: wPli[0]}
		k = 1
	}
	first := k // index of the first span between supports
	for i := 0; i+1 < n; i++ {
		segs[k] = seg{a: sup[i], b: sup[i+1], w: wPli[k]}
		k++
	}
	if right {
		segs[k] = seg{a: sup[n-1], b: b.LengthIn, w: wPli[k]}
	}
	for i := range segs {
		segs[i].l = segs[i].b - segs[i].a
	}

	// Support moments: the end supports carry the (statically known)
	// cantilever moments; the interior ones come from the three-moment
	// equation.
	ms := r.supportM
	if left {
		c := segs[0]
		ms[0] = -c.w * c.l * c.l / 2
	}
	if right {
		c := segs[m-1]
		ms[n-1] = -c.w * c.l * c.l / 2
	}
	threeMoment(ms, segs[first:first+n-1])

	// Shear at the left end of each segment.
	for i := range segs {
		s := &segs[i]
		switch {
		case left && i == 0:
			s.ma, s.mb, s.v0 = 0, ms[0], 0
		case right && i == m-1:
			s.ma, s.mb, s.v0 = ms[n-1], 0, s.w*s.l
		default:
			j := i - first
			s.ma, s.mb = ms[j], ms[j+1]
			s.v0 = s.w*s.l/2 + (s.mb-s.ma)/s.l
		}
	}

	// Reactions: jump in shear at each support.
	for j := 0; j < n; j++ {
		si := first + j // segment starting at support j (if any)
		var vr, vl float64
		if si < m {
			vr = segs[si].v0
		}
		if si-1 >= 0 {
			p := segs[si-1]
			vl = p.v0 - p.w*p.l
		}
		r.reactions[j] = vr - vl
	}

	// Deflection: each span has zero deflection at both supports, which
	// fixes its left-end slope; the cantilevers follow the slope of the
	// span next to them (continuity of slope over the end supports).
	ie := r.invEI
	for i := first; i < first+n-1; i++ {
		s := &segs[i]
		l := s.l
		s.y0 = 0
		s.th0 = (s.ma*l/2 + s.v0*l*l/6 - s.w*l*l*l/24) * ie
	}
	if left {
		c := &segs[0]
		thS := segs[first].th0
		l := c.l
		c.th0 = thS - c.w*l*l*l/6*ie
		c.y0 = -c.th0*l - c.w*l*l*l*l/24*ie
	}
	if right {
		c := &segs[m-1]
		c.y0 = 0
		c.th0 = segs[m-2].slope(segs[m-2].l, ie)
	}

	// Overflow shows in the reactions or the end deflections/slopes.
	check := 0.0
	for _, v := range r.buf {
		check += v
	}
	for i := range segs {
		check += segs[i].y0 + segs[i].th0 + segs[i].v0
	}
	if !finite(check) {
		return fmt.Errorf("%w: results overflow: loads %v lb/in on a %g in beam with EI %g lb*in^2 are out of range",
			ErrBadLoad, wPli, b.LengthIn, b.EILbIn2)
	}
	return nil
}

// threeMoment fills the interior support moments ms[1:len(ms)-1] from the
// three-moment (Clapeyron) equation for uniform loads, given the end
// support moments ms[0] and ms[len-1]; spans[j] lies between supports j
// and j+1. For interior support i, with L_i, w_i the span to its left and
// L_i+1, w_i+1 the span to its right (sagging moments positive):
//
//	L_i M_i-1 + 2 (L_i + L_i+1) M_i + L_i+1 M_i+1 = -(w_i L_i^3 + w_i+1 L_i+1^3) / 4
//
// The system is tridiagonal and diagonally dominant; it is solved by the
// Thomas algorithm without pivoting.
func threeMoment(ms []float64, spans []seg) {
	n := len(ms)
	if n <= 2 {
		return
	}
	var cBuf, dBuf, lBuf, rBuf [16]float64
	cp, dp, lens, rhs := cBuf[:], dBuf[:], lBuf[:], rBuf[:]
	if n > len(cBuf) {
		cp, dp, lens, rhs = make([]float64, n), make([]float64, n), make([]float64, n), make([]float64, n)
	}
	for j := 0; j < n-1; j++ {
		lens[j] = spans[j].l
	}
	for i := 1; i <= n-2; i++ {
		sl, sr := spans[i-1], spans[i]
		rhs[i] = -(sl.w*sl.l*sl.l*sl.l + sr.w*sr.l*sr.l*sr.l) / 4
	}
	solveMoments(ms, lens, rhs, cp, dp)
}

// solveMoments solves the three-moment equations
//
//	L_i M_i-1 + 2 (L_i + L_i+1) M_i + L_i+1 M_i+1 = rhs_i,  i = 1 .. n-2
//
// for the interior support moments ms[1:n-1], with ms[0] and ms[n-1]
// given, lens[j] the span between supports j and j+1 and cp, dp scratch
// of length n, by the Thomas algorithm without pivoting (the system is
// diagonally dominant).
func solveMoments(ms, lens, rhs, cp, dp []float64) {
	n := len(ms)
	for i := 1; i <= n-2; i++ {
		lower, upper := lens[i-1], lens[i]
		diag, r := 2*(lower+upper), rhs[i]
		if i == 1 {
			r -= lower * ms[0]
			lower = 0
		}
		if i == n-2 {
			r -= upper * ms[n-1]
			upper = 0
		}
		den := diag
		if i > 1 {
			den -= lower * cp[i-1]
			r -= lower * dp[i-1]
		}
		cp[i] = upper / den
		dp[i] = r / den
	}
	ms[n-2] = dp[n-2]
	for i := n - 3; i >= 1; i-- {
		ms[i] = dp[i] - cp[i]*ms[i+1]
	}
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
