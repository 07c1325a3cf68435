package beam

import (
	"fmt"
	"math"
	"sort"
)

// PartialLoad is a uniform line load WPli (lb/in, positive downward) from
// FromIn to ToIn along the beam (FromIn < ToIn, both within the beam). A
// load over the whole beam is the partial load from 0 to LengthIn.
type PartialLoad struct {
	FromIn, ToIn float64
	WPli         float64
}

// PointLoad is a concentrated force PLb (lb, positive downward) at AtIn.
type PointLoad struct {
	AtIn float64
	PLb  float64
}

// Loads is a general load set: partial uniform loads, which may overlap
// (they add), and point loads, which may sit anywhere on the beam,
// supports and ends included (a point load on a support goes straight into
// its reaction).
type Loads struct {
	Partial []PartialLoad
	Points  []PointLoad
}

// SolveLoads analyses the beam under a general load set. The solution is
// exact, as Solve's is: the beam is cut into pieces at the supports, at
// both ends of every partial load and at every point load, so that each
// piece carries one uniform load. The interior support moments come from
// the three-moment equation in its general form (each span's loads enter
// through the end rotations of the span as a simple beam, closed forms
// below); shear and moment then follow piece by piece from statics, and
// deflection from integrating EI y” = -M with zero deflection at the
// supports and continuous slope. Errors wrap ErrBadBeam or ErrBadLoad.
func (b Beam) SolveLoads(l Loads) (*Response, error) {
	r := new(Response)
	if err := b.SolveLoadsInto(r, l); err != nil {
		return nil, err
	}
	return r, nil
}

// SolveLoadsInto is SolveLoads writing into r, reusing its storage. On
// error r is left empty.
func (b Beam) SolveLoadsInto(r *Response, l Loads) error {
	return b.solveLoadsInto(r, l, nil)
}

// solveLoadsInto is SolveLoadsInto with the cuts given (SolveLoadsCutInto),
// or found here when nil.
func (b Beam) solveLoadsInto(r *Response, l Loads, cuts []float64) error {
	if err := b.Validate(); err != nil {
		r.reset(0, 0)
		return err
	}
	if err := b.checkGeneral(l); err != nil {
		r.reset(0, 0)
		return err
	}
	if cuts == nil {
		cuts = b.cuts(l)
	}
	r.reset(len(cuts)-1, len(b.SupportsAtIn))
	if err := b.fillGeneral(r, cuts, l); err != nil {
		r.reset(0, 0)
		return err
	}
	return nil
}

// Cuts returns the points SolveLoads cuts the beam at for a load set at
// the positions of l (the cuts do not depend on the loads' magnitudes),
// or an error when the beam or l is invalid. A caller solving many load
// sets at the same positions (the load cases of one member) finds them
// once and hands them to SolveLoadsCutInto.
func (b Beam) Cuts(l Loads) ([]float64, error) {
	if err := b.Validate(); err != nil {
		return nil, err
	}
	if err := b.checkGeneral(l); err != nil {
		return nil, err
	}
	return b.cuts(l), nil
}

// SolveLoadsCutInto is SolveLoadsInto with the cuts given: cuts must be
// what Cuts returns for a load set whose partial loads span the same
// stretches and whose point loads sit at the same places as l's (which
// is not checked), and is not changed; nil cuts are found here, as
// SolveLoadsInto finds them.
func (b Beam) SolveLoadsCutInto(r *Response, l Loads, cuts []float64) error {
	return b.solveLoadsInto(r, l, cuts)
}

// tolPos is how far, as a fraction of the beam length, a load position may
// lie outside the beam (rounding of a caller's coordinates), and how close
// two cut points must be to count as one.
const tolPos = 1e-9

// checkGeneral validates a general load set against the beam.
func (b Beam) checkGeneral(l Loads) error {
	tol := tolPos * b.LengthIn
	for i, p := range l.Partial {
		if !finite(p.FromIn) || !finite(p.ToIn) || !finite(p.WPli) {
			return fmt.Errorf("%w: partial load %d (%v to %v in, %v lb/in): want finite values", ErrBadLoad, i, p.FromIn, p.ToIn, p.WPli)
		}
		if p.FromIn < -tol || p.ToIn > b.LengthIn+tol || p.ToIn < p.FromIn {
			return fmt.Errorf("%w: partial load %d from %g to %g in: want 0 <= from <= to <= %g in", ErrBadLoad, i, p.FromIn, p.ToIn, b.LengthIn)
		}
	}
	for i, p := range l.Points {
		if !finite(p.AtIn) || !finite(p.PLb) {
			return fmt.Errorf("%w: point load %d (%v lb at %v in): want finite values", ErrBadLoad, i, p.PLb, p.AtIn)
		}
		if p.AtIn < -tol || p.AtIn > b.LengthIn+tol {
			return fmt.Errorf("%w: point load %d at %g in lies outside the beam [0, %g] in", ErrBadLoad, i, p.AtIn, b.LengthIn)
		}
	}
	return nil
}

// cuts returns the sorted key points: the ends, the supports, the ends of
// the partial loads and the point loads, points closer than tolPos of the
// length merged (supports win, so they stay exact).
func (b Beam) cuts(l Loads) []float64 {
	L := b.LengthIn
	pts := make([]float64, 0, 2+len(b.SupportsAtIn)+2*len(l.Partial)+len(l.Points))
	pts = append(pts, 0, L)
	pts = append(pts, b.SupportsAtIn...)
	clampL := func(x float64) float64 { return math.Min(math.Max(x, 0), L) }
	for _, p := range l.Partial {
		pts = append(pts, clampL(p.FromIn), clampL(p.ToIn))
	}
	for _, p := range l.Points {
		pts = append(pts, clampL(p.AtIn))
	}
	sort.Float64s(pts)
	tol := tolPos * L
	out := pts[:1]
	for _, x := range pts[1:] {
		if x-out[len(out)-1] > tol {
			out = append(out, x)
		}
	}
	// Snap to the supports and ends exactly.
	fixed := append([]float64{0, L}, b.SupportsAtIn...)
	for i, x := range out {
		for _, s := range fixed {
			if math.Abs(x-s) <= tol {
				out[i] = s
			}
		}
	}
	return out
}

// nearestCut returns the index of the cut nearest x.
func nearestCut(cuts []float64, x float64) int {
	i := sort.SearchFloat64s(cuts, x)
	if i == len(cuts) || (i > 0 && x-cuts[i-1] < cuts[i]-x) {
		i--
	}
	return i
}

// simpleRotations returns EI times the end rotations (magnitudes, positive
// for downward load) of a simple span of length L under a uniform load w
// from c to e (local coordinates, 0 <= c <= e <= L). From the point-load
// rotations EI thetaL = P a b (L + b) / (6 L), EI thetaR = P a b (L + a) /
// (6 L) (AISC Steel Construction Manual, Beam Diagrams and Formulas, simple
// beam - concentrated load at any point) integrated over the loaded
// length:
//
//	EI thetaL = w / (6L) [L^2 x^2 - L x^3 + x^4/4] from c to e
//	EI thetaR = w / (6L) [L^2 x^2 / 2 - x^4/4]     from c to e
//
// which give w L^3 / 24 at both ends for a full uniform load.
func simpleRotations(L, w, c, e float64) (thL, thR float64) {
	fl := func(x float64) float64 { return x * x * (L*L - L*x + x*x/4) }
	fr := func(x float64) float64 { return x * x * (L*L/2 - x*x/4) }
	k := w / (6 * L)
	return k * (fl(e) - fl(c)), k * (fr(e) - fr(c))
}

// pointRotations returns EI times the end rotations of a simple span of
// length L under a point load P at a from its left end (AISC Beam Diagrams
// and Formulas, simple beam - concentrated load at any point).
func pointRotations(L, P, a float64) (thL, thR float64) {
	bb := L - a
	return P * a * bb * (L + bb) / (6 * L), P * a * bb * (L + a) / (6 * L)
}

// fillGeneral solves the valid beam b under l into r, sized for the pieces
// between cuts.
func (b Beam) fillGeneral(r *Response, cuts []float64, l Loads) error {
	sup := b.SupportsAtIn
	n := len(sup)
	m := len(cuts) - 1
	r.lengthIn = b.LengthIn
	r.invEI = 1 / b.EILbIn2
	ie := r.invEI
	segs := r.segs

	// Pieces and their uniform loads.
	for i := 0; i < m; i++ {
		segs[i] = seg{a: cuts[i], b: cuts[i+1]}
		segs[i].l = segs[i].b - segs[i].a
	}
	// Point loads at each cut.
	pAt := make([]float64, len(cuts))
	for _, p := range l.Points {
		pAt[nearestCut(cuts, p.AtIn)] += p.PLb
	}
	// A partial load lies on the pieces between the cuts nearest its
	// ends. Merging cut points may move an end (by about tolPos of the
	// length, more where merges chain): the load is spread over the
	// pieces it lands on with its own total, so that statics hold
	// exactly, and one narrower than the cuts' resolution, landing on a
	// single cut, acts there as a point load of its total. With no merge
	// the pieces are the load's own ends and the ratio is 1.
	for _, p := range l.Partial {
		if p.WPli == 0 || p.ToIn <= p.FromIn {
			continue
		}
		i0, i1 := nearestCut(cuts, p.FromIn), nearestCut(cuts, p.ToIn)
		total := p.WPli * (p.ToIn - p.FromIn)
		if i1 == i0 {
			pAt[i0] += total
			continue
		}
		w := p.WPli
		if on := cuts[i1] - cuts[i0]; on != p.ToIn-p.FromIn {
			w = total / on
		}
		for i := i0; i < i1; i++ {
			segs[i].w += w
		}
	}
	// Index of the cut at each support.
	supCut := make([]int, n)
	for j, s := range sup {
		supCut[j] = nearestCut(cuts, s)
	}

	// Support moments. End supports: the cantilever moments by statics.
	ms := r.supportM
	for i := range ms {
		ms[i] = 0
	}
	first, last := supCut[0], supCut[n-1]
	for i := 0; i < first; i++ { // left cantilever pieces and points left of support 0
		s := segs[i]
		ms[0] -= s.w * s.l * (sup[0] - (s.a+s.b)/2)
		ms[0] -= pAt[i] * (sup[0] - cuts[i])
	}
	for i := last; i < m; i++ {
		s := segs[i]
		ms[n-1] -= s.w * s.l * ((s.a+s.b)/2 - sup[n-1])
		ms[n-1] -= pAt[i+1] * (cuts[i+1] - sup[n-1])
	}
	// Span end rotations of each span as a simple beam.
	thL := make([]float64, n-1)
	thR := make([]float64, n-1)
	for j := 0; j+1 < n; j++ {
		L := sup[j+1] - sup[j]
		for i := supCut[j]; i < supCut[j+1]; i++ {
			s := segs[i]
			if s.w != 0 {
				a, bR := simpleRotations(L, s.w, s.a-sup[j], s.b-sup[j])
				thL[j] += a
				thR[j] += bR
			}
			if i > supCut[j] && pAt[i] != 0 {
				a, bR := pointRotations(L, pAt[i], cuts[i]-sup[j])
				thL[j] += a
				thR[j] += bR
			}
		}
	}
	threeMomentGeneral(ms, sup, thL, thR)

	// Shear and moment piece by piece: each span from statics of the span
	// as a simple beam with its end moments; the cantilevers from their
	// free tips.
	walk := func(from, to int, m0, v0 float64) {
		mm, vv := m0, v0
		for i := from; i < to; i++ {
			if i > from {
				vv -= pAt[i]
			}
			s := &segs[i]
			s.ma, s.v0 = mm, vv
			mm = mm + vv*s.l - s.w*s.l*s.l/2
			vv -= s.w * s.l
			s.mb = mm
		}
	}
	if first > 0 {
		walk(0, first, 0, -pAt[0])
		segs[first-1].mb = ms[0]
	}
	for j := 0; j+1 < n; j++ {
		L := sup[j+1] - sup[j]
		// Left-end shear: moments of the span's loads about its right end.
		mr := 0.0
		for i := supCut[j]; i < supCut[j+1]; i++ {
			s := segs[i]
			mr += s.w * s.l * (sup[j+1] - (s.a+s.b)/2)
			if i > supCut[j] {
				mr += pAt[i] * (sup[j+1] - cuts[i])
			}
		}
		v0 := mr/L + (ms[j+1]-ms[j])/L
		walk(supCut[j], supCut[j+1], ms[j], v0)
		segs[supCut[j+1]-1].mb = ms[j+1]
	}
	if last < m {
		tot := 0.0
		for i := last; i < m; i++ {
			tot += segs[i].w*segs[i].l + pAt[i+1]
		}
		walk(last, m, ms[n-1], tot)
		segs[m-1].mb = 0
	}

	// Reactions: jump in shear at each support, plus a point load on it.
	for j := 0; j < n; j++ {
		c := supCut[j]
		var vr, vl float64
		if c < m {
			vr = segs[c].v0
		}
		if c > 0 {
			p := segs[c-1]
			vl = p.v0 - p.w*p.l
		}
		r.reactions[j] = vr - vl + pAt[c]
	}

	// Deflection: in each span, y = 0 at both supports; the slope at its
	// left support follows from the deflection at the right one, which is
	// linear in it. Cantilevers continue the slope of the span beside them.
	span := func(from, to int) {
		segs[from].y0, segs[from].th0 = 0, 0
		for i := from + 1; i < to; i++ {
			p := &segs[i-1]
			segs[i].y0, segs[i].th0 = p.defl(p.l, ie), p.slope(p.l, ie)
		}
		p := &segs[to-1]
		yEnd := p.defl(p.l, ie)
		th := -yEnd / (segs[to-1].b - segs[from].a)
		for i := from; i < to; i++ {
			segs[i].y0 += th * (segs[i].a - segs[from].a)
			segs[i].th0 += th
		}
	}
	for j := 0; j+1 < n; j++ {
		span(supCut[j], supCut[j+1])
	}
	// Left cantilever: backwards from support 0.
	yb, thb := 0.0, segs[first].th0
	for i := first - 1; i >= 0; i-- {
		s := &segs[i]
		l := s.l
		s.th0 = thb + (s.ma*l+s.v0*l*l/2-s.w*l*l*l/6)*ie
		s.y0 = yb - s.th0*l + (s.ma*l*l/2+s.v0*l*l*l/6-s.w*l*l*l*l/24)*ie
		yb, thb = s.y0, s.th0
	}
	// Right cantilever: forwards from the last support.
	for i := last; i < m; i++ {
		p := &segs[i-1]
		segs[i].y0, segs[i].th0 = p.defl(p.l, ie), p.slope(p.l, ie)
		if i == last {
			segs[i].y0 = 0
		}
	}

	check := 0.0
	for _, v := range r.buf {
		check += v
	}
	for i := range segs {
		check += segs[i].y0 + segs[i].th0 + segs[i].v0
	}
	if !finite(check) {
		return fmt.Errorf("%w: results overflow: loads on a %g in beam with EI %g lb*in^2 are out of range",
			ErrBadLoad, b.LengthIn, b.EILbIn2)
	}
	return nil
}

// threeMomentGeneral fills the interior support moments ms[1:n-1] from the
// three-moment (Clapeyron) equation with general span loads, given the end
// moments ms[0] and ms[n-1]. With thL[j], thR[j] EI times the end rotations
// of span j as a simple beam (Timoshenko and Young, Theory of Structures,
// three-moment equation; any structural analysis text):
//
//	L_i M_i-1 + 2 (L_i + L_i+1) M_i + L_i+1 M_i+1 = -6 (thR_i + thL_i+1)
//
// which is threeMoment's equation when each span carries one uniform load.
func threeMomentGeneral(ms, sup, thL, thR []float64) {
	n := len(ms)
	if n <= 2 {
		return
	}
	lens, rhs := make([]float64, n), make([]float64, n)
	for j := 0; j < n-1; j++ {
		lens[j] = sup[j+1] - sup[j]
	}
	for i := 1; i <= n-2; i++ {
		rhs[i] = -6 * (thR[i-1] + thL[i])
	}
	solveMoments(ms, lens, rhs, make([]float64, n), make([]float64, n))
}
