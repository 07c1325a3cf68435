package beam

import (
	"errors"
	"math"
	"testing"
)

func mustSolveLoads(t *testing.T, b Beam, l Loads) *Response {
	t.Helper()
	r, err := b.SolveLoads(l)
	if err != nil {
		t.Fatalf("SolveLoads(%+v, %+v): %v", b, l, err)
	}
	return r
}

// AISC Steel Construction Manual, Beam Diagrams and Formulas, simple beam -
// concentrated load at any point: R1 = Pb/l, R2 = Pa/l, Mmax = Pab/l at the
// load, deflection at the load Pa^2b^2/(3EIl).
func TestSimpleSpanPointLoadAnywhere(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, simple beam - concentrated load at any point (closed form)"
	L, P, a := 180.0, 950.0, 55.0
	bb := L - a
	b := Beam{LengthIn: L, SupportsAtIn: []float64{0, L}, EILbIn2: eiTest}
	r := mustSolveLoads(t, b, Loads{Points: []PointLoad{{AtIn: a, PLb: P}}})
	R := r.Reactions()
	near(t, "R1", R[0], P*bb/L, tolExact, 0, src)
	near(t, "R2", R[1], P*a/L, tolExact, 0, src)
	near(t, "M at load", r.Moment(a), P*a*bb/L, tolExact, 0, src)
	near(t, "defl at load", r.Deflection(a), P*a*a*bb*bb/(3*eiTest*L), tolExact, 0, src)
	vl, vr := r.ShearEachSide(a)
	near(t, "V left of load", vl, P*bb/L, tolExact, 0, src)
	near(t, "V right of load", vr, -P*a/L, tolExact, 0, src)
	// Largest deflection: at x = sqrt(a(a + 2b)/3) when a > b; here a < b,
	// so by symmetry at l - sqrt(b(b + 2a)/3), value Pab(a + 2b) sqrt(3a(a + 2b)) / (27 EI l) with a, b swapped.
	xm := L - math.Sqrt(bb*(bb+2*a)/3)
	dmax := P * a * bb * (bb + 2*a) * math.Sqrt(3*bb*(bb+2*a)) / (27 * eiTest * L)
	d, x := r.MaxDeflection(0, L)
	near(t, "max defl", d, dmax, 1e-9, 0, src)
	near(t, "x of max defl", x, xm, 1e-6, L, src)
}

// AISC Beam Diagrams and Formulas, simple beam - uniform load partially
// distributed at one end: R1 = wa(2l - a)/(2l), R2 = wa^2/(2l), Mmax =
// R1^2/(2w) at x = R1/w.
func TestSimpleSpanPartialLoadAtOneEnd(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, simple beam - uniform load partially distributed at one end (closed form)"
	L, w, a := 200.0, 6.0, 80.0
	b := Beam{LengthIn: L, SupportsAtIn: []float64{0, L}, EILbIn2: eiTest}
	r := mustSolveLoads(t, b, Loads{Partial: []PartialLoad{{FromIn: 0, ToIn: a, WPli: w}}})
	R := r.Reactions()
	r1 := w * a * (2*L - a) / (2 * L)
	near(t, "R1", R[0], r1, tolExact, 0, src)
	near(t, "R2", R[1], w*a*a/(2*L), tolExact, 0, src)
	mp, xp, _, _ := r.MomentExtremes(0, L)
	near(t, "Mmax", mp, r1*r1/(2*w), tolExact, 0, src)
	near(t, "x of Mmax", xp, r1/w, tolExact, 0, src)
	// Deflection for x > a (same table): R2 (l - x)[2lx - x^2 - a^2]... checked
	// instead by the virtual-work integral below at mid-span.
	near(t, "defl mid", r.Deflection(L/2), virtualWorkDefl(b, r, L/2), 1e-7, 0, "unit-load method, numerical integration of M m / EI")
}

// AISC Beam Diagrams and Formulas, simple beam - uniform load partially
// distributed: R1 = wb(2c + b)/(2l), Mmax = R1(a + R1/(2w)) at x = a + R1/w,
// where the load of length b starts at a and ends c from the right support.
func TestSimpleSpanPartialLoadAnywhere(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, simple beam - uniform load partially distributed (closed form)"
	L, w := 240.0, 4.5
	a, bl := 60.0, 100.0
	c := L - a - bl
	b := Beam{LengthIn: L, SupportsAtIn: []float64{0, L}, EILbIn2: eiTest}
	r := mustSolveLoads(t, b, Loads{Partial: []PartialLoad{{FromIn: a, ToIn: a + bl, WPli: w}}})
	R := r.Reactions()
	r1 := w * bl * (2*c + bl) / (2 * L)
	near(t, "R1", R[0], r1, tolExact, 0, src)
	near(t, "R2", R[1], w*bl*(2*a+bl)/(2*L), tolExact, 0, src)
	mp, xp, _, _ := r.MomentExtremes(0, L)
	near(t, "Mmax", mp, r1*(a+r1/(2*w)), tolExact, 0, src)
	near(t, "x of Mmax", xp, a+r1/w, tolExact, 0, src)
	for _, x := range []float64{30, a + bl/2, 200} {
		near(t, "defl", r.Deflection(x), virtualWorkDefl(b, r, x), 1e-7, 0, "unit-load method, numerical integration of M m / EI")
	}
}

// AISC Beam Diagrams and Formulas, continuous beam - two equal spans -
// concentrated load at centre of one span: R1 = 13P/32, R2 = 11P/16, R3 =
// -3P/32, M at the load 13Pl/64, M at the centre support -3Pl/32.
func TestTwoSpansPointLoadOneSpan(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, continuous beam - two equal spans - concentrated load at center of one span (closed form)"
	l, P := 144.0, 1000.0
	b := Beam{LengthIn: 2 * l, SupportsAtIn: []float64{0, l, 2 * l}, EILbIn2: eiTest}
	r := mustSolveLoads(t, b, Loads{Points: []PointLoad{{AtIn: l / 2, PLb: P}}})
	R := r.Reactions()
	near(t, "R1", R[0], 13*P/32, tolExact, P, src)
	near(t, "R2", R[1], 11*P/16, tolExact, P, src)
	near(t, "R3", R[2], -3*P/32, tolExact, P, src)
	near(t, "M at load", r.Moment(l/2), 13*P*l/64, tolExact, P*l, src)
	near(t, "M at support", r.SupportMoments()[1], -3*P*l/32, tolExact, P*l, src)
}

// Statics: a cantilever of length a past the right support of a simple
// span l with a point load P at its tip: R1 = -Pa/l, R2 = P(l + a)/l, M
// over the support -Pa, tip deflection Pa^2(l + a)/(3EI) (AISC Beam
// Diagrams and Formulas, beam overhanging one support - concentrated load
// at end of overhang).
func TestOverhangPointAtTip(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, beam overhanging one support - concentrated load at end of overhang (closed form)"
	l, a, P := 150.0, 40.0, 300.0
	b := Beam{LengthIn: l + a, SupportsAtIn: []float64{0, l}, EILbIn2: eiTest}
	r := mustSolveLoads(t, b, Loads{Points: []PointLoad{{AtIn: l + a, PLb: P}}})
	R := r.Reactions()
	near(t, "R1", R[0], -P*a/l, tolExact, P, src)
	near(t, "R2", R[1], P*(l+a)/l, tolExact, P, src)
	near(t, "M support", r.Moment(l), -P*a, tolExact, P*a, src)
	near(t, "tip defl", r.Deflection(l+a), P*a*a*(l+a)/(3*eiTest), tolExact, 0, src)
	// The same load on the mirrored beam (overhang on the left).
	bm := Beam{LengthIn: l + a, SupportsAtIn: []float64{a, l + a}, EILbIn2: eiTest}
	rm := mustSolveLoads(t, bm, Loads{Points: []PointLoad{{AtIn: 0, PLb: P}}})
	near(t, "mirror R left", rm.Reactions()[0], P*(l+a)/l, tolExact, P, src)
	near(t, "mirror tip defl", rm.Deflection(0), P*a*a*(l+a)/(3*eiTest), tolExact, 0, src)
}

// A point load on a support goes straight into its reaction and bends
// nothing (statics).
func TestPointOnSupport(t *testing.T) {
	b := Beam{LengthIn: 200, SupportsAtIn: []float64{20, 120, 200}, EILbIn2: eiTest}
	r := mustSolveLoads(t, b, Loads{Points: []PointLoad{{AtIn: 120, PLb: 500}, {AtIn: 20, PLb: 70}}})
	R := r.Reactions()
	near(t, "R at 120", R[1], 500, tolExact, 500, "statics, no source needed")
	near(t, "R at 20", R[0], 70, tolExact, 500, "statics, no source needed")
	mp, _, mn, _ := r.MomentExtremes(0, 200)
	if math.Abs(mp) > 1e-9 || math.Abs(mn) > 1e-9 {
		t.Errorf("moments %g, %g: want none (statics)", mp, mn)
	}
}

// Whole-segment loads given as partial loads, cut in arbitrary pieces,
// must give Solve's response exactly (linearity and the same closed forms).
func TestGeneralMatchesSegmentLoadsRandom(t *testing.T) {
	rng := newRand(11, 29)
	for it := 0; it < 300; it++ {
		b, w := randomBeam(rng, 6)
		want, err := b.Solve(w)
		if err != nil {
			t.Fatal(err)
		}
		var l Loads
		for k, sg := range b.Segments() {
			// cut each segment's load into two or three pieces
			cut1 := sg.FromIn + (sg.ToIn-sg.FromIn)*rng.Float64()
			l.Partial = append(l.Partial, PartialLoad{sg.FromIn, cut1, w[k]}, PartialLoad{cut1, sg.ToIn, w[k]})
		}
		got, err := b.SolveLoads(l)
		if err != nil {
			t.Fatal(err)
		}
		scale := 0.0
		for _, v := range want.Reactions() {
			scale = math.Max(scale, math.Abs(v))
		}
		for j := range want.Reactions() {
			near(t, "reaction", got.Reactions()[j], want.Reactions()[j], 1e-9, scale, "Solve, segment loads")
			near(t, "support moment", got.SupportMoments()[j], want.SupportMoments()[j], 1e-9, scale*b.LengthIn, "Solve, segment loads")
		}
		ys := 0.0
		for x := 0.0; x <= b.LengthIn; x += b.LengthIn / 17 {
			ys = math.Max(ys, math.Abs(want.Deflection(x)))
		}
		for x := 0.0; x <= b.LengthIn; x += b.LengthIn / 17 {
			near(t, "moment", got.Moment(x), want.Moment(x), 1e-9, scale*b.LengthIn, "Solve, segment loads")
			near(t, "deflection", got.Deflection(x), want.Deflection(x), 1e-8, ys, "Solve, segment loads")
		}
	}
}

// Random partial and point loads on random beams: equilibrium of forces
// and of moments about x = 0, zero deflection at the supports, and a
// deflection that agrees with the unit-load method (statics and virtual
// work, independent of the solver's own integration).
func TestGeneralStaticsRandom(t *testing.T) {
	rng := newRand(5, 77)
	for it := 0; it < 300; it++ {
		b, _ := randomBeam(rng, 5)
		L := b.LengthIn
		var l Loads
		var fy, mo float64 // total load and its moment about x = 0
		for k := 0; k < 1+rng.IntN(4); k++ {
			a, c := L*rng.Float64(), L*rng.Float64()
			if a > c {
				a, c = c, a
			}
			w := 20*rng.Float64() - 8
			l.Partial = append(l.Partial, PartialLoad{a, c, w})
			fy += w * (c - a)
			mo += w * (c - a) * (a + c) / 2
		}
		for k := 0; k < rng.IntN(4); k++ {
			x, p := L*rng.Float64(), 2000*rng.Float64()-500
			if rng.IntN(4) == 0 {
				x = b.SupportsAtIn[rng.IntN(len(b.SupportsAtIn))]
			}
			l.Points = append(l.Points, PointLoad{x, p})
			fy += p
			mo += p * x
		}
		r, err := b.SolveLoads(l)
		if err != nil {
			t.Fatal(err)
		}
		var rs, rm float64
		for j, x := range b.SupportsAtIn {
			rs += r.Reactions()[j]
			rm += r.Reactions()[j] * x
		}
		scale := math.Abs(fy) + 1
		near(t, "sum of reactions", rs, fy, 1e-9, scale, "statics")
		near(t, "moment of reactions", rm, mo, 1e-9, scale*L, "statics")
		ymax := 0.0
		for x := 0.0; x <= L; x += L / 50 {
			ymax = math.Max(ymax, math.Abs(r.Deflection(x)))
		}
		for _, x := range b.SupportsAtIn {
			near(t, "deflection at support", r.Deflection(x), 0, 1e-9, ymax, "support condition")
		}
		x := L * rng.Float64()
		near(t, "deflection by virtual work", r.Deflection(x), virtualWorkDefl(b, r, x), 2e-5, ymax, "unit-load method")
	}
}

func TestGeneralBadLoads(t *testing.T) {
	b := Beam{LengthIn: 100, SupportsAtIn: []float64{0, 100}, EILbIn2: eiTest}
	for _, l := range []Loads{
		{Partial: []PartialLoad{{0, 120, 1}}},
		{Partial: []PartialLoad{{50, 40, 1}}},
		{Partial: []PartialLoad{{0, 10, math.NaN()}}},
		{Points: []PointLoad{{-5, 10}}},
		{Points: []PointLoad{{5, math.Inf(1)}}},
	} {
		if _, err := b.SolveLoads(l); !errors.Is(err, ErrBadLoad) {
			t.Errorf("SolveLoads(%+v) error %v, want ErrBadLoad", l, err)
		}
	}
}

// virtualWorkDefl is the deflection at x by the unit-load method: the
// integral of M(s) m(s) / EI over the beam, with m the moment of a unit
// load at x on the same beam, solved by the segment-load solver from the
// point-load closed forms (Simpson's rule on a fine grid; each piece's
// moments are smooth between cuts).
func virtualWorkDefl(b Beam, r *Response, x float64) float64 {
	u, err := b.SolveLoads(Loads{Points: []PointLoad{{AtIn: x, PLb: 1}}})
	if err != nil {
		return math.NaN()
	}
	// integrate over each smooth piece of both responses
	cuts := append(append([]float64{}, b.SupportsAtIn...), 0, b.LengthIn, x)
	for _, s := range r.segs {
		cuts = append(cuts, s.a)
	}
	sortFloats(cuts)
	sum := 0.0
	for i := 0; i+1 < len(cuts); i++ {
		a, c := cuts[i], cuts[i+1]
		if c-a < 1e-12 {
			continue
		}
		const n = 64
		h := (c - a) / n
		f := func(s float64) float64 { return r.Moment(s) * u.Moment(s) }
		acc := f(a+1e-12*(c-a)) + f(c-1e-12*(c-a))
		for k := 1; k < n; k++ {
			wk := 2.0
			if k%2 == 1 {
				wk = 4
			}
			acc += wk * f(a+float64(k)*h)
		}
		sum += acc * h / 3
	}
	return sum / b.EILbIn2
}

func sortFloats(v []float64) {
	for i := 1; i < len(v); i++ {
		for j := i; j > 0 && v[j] < v[j-1]; j-- {
			v[j], v[j-1] = v[j-1], v[j]
		}
	}
}

// AISC Beam Diagrams and Formulas, continuous beam - two equal spans -
// uniform load on one span: R1 = 7wl/16, R2 = 5wl/8, R3 = -wl/16, M over the
// centre support -wl^2/16, Mmax = 49wl^2/512 at x = 7l/16. Given here as a
// partial load over the first span of the two-span beam, so the general
// three-moment equation carries it.
func TestTwoSpansPartialLoadOneSpan(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, continuous beam - two equal spans - uniform load on one span (closed form)"
	l, w := 150.0, 7.0
	b := Beam{LengthIn: 2 * l, SupportsAtIn: []float64{0, l, 2 * l}, EILbIn2: eiTest}
	r := mustSolveLoads(t, b, Loads{Partial: []PartialLoad{{FromIn: 0, ToIn: l, WPli: w}}})
	R := r.Reactions()
	near(t, "R1", R[0], 7*w*l/16, tolExact, w*l, src)
	near(t, "R2", R[1], 5*w*l/8, tolExact, w*l, src)
	near(t, "R3", R[2], -w*l/16, tolExact, w*l, src)
	near(t, "M support", r.SupportMoments()[1], -w*l*l/16, tolExact, w*l*l, src)
	mp, xp, _, _ := r.MomentExtremes(0, 2*l)
	near(t, "Mmax", mp, 49*w*l*l/512, tolExact, w*l*l, src)
	near(t, "x of Mmax", xp, 7*l/16, tolExact, l, src)
}

// TestSolveLoadsCutAsSolveLoads: solving with the cuts found once (Cuts,
// SolveLoadsCutInto) gives, value for value, what SolveLoads gives for
// every load set at the same positions, on random beams and loads (common
// practice, no source: the two paths run the same arithmetic).
func TestSolveLoadsCutAsSolveLoads(t *testing.T) {
	rng := newRand(91, 5)
	for trial := range 300 {
		b, _ := randomBeam(rng, 5)
		var l Loads
		for range rng.IntN(4) {
			a, c := rng.Float64()*b.LengthIn, rng.Float64()*b.LengthIn
			l.Partial = append(l.Partial, PartialLoad{FromIn: min(a, c), ToIn: max(a, c)})
		}
		for range rng.IntN(30) {
			at := rng.Float64() * b.LengthIn
			if rng.IntN(5) == 0 {
				at = b.SupportsAtIn[rng.IntN(len(b.SupportsAtIn))] // on a support
			}
			l.Points = append(l.Points, PointLoad{AtIn: at})
		}
		cuts, err := b.Cuts(l)
		if err != nil {
			t.Fatalf("trial %d: %v", trial, err)
		}
		var got Response
		for range 3 {
			for i := range l.Partial {
				l.Partial[i].WPli = -20 + 40*rng.Float64()
			}
			for i := range l.Points {
				l.Points[i].PLb = -2000 + 4000*rng.Float64()
			}
			want, err := b.SolveLoads(l)
			if err != nil {
				t.Fatalf("trial %d: %v", trial, err)
			}
			if err := b.SolveLoadsCutInto(&got, l, cuts); err != nil {
				t.Fatalf("trial %d: %v", trial, err)
			}
			for k := 0; k <= 50; k++ {
				x := b.LengthIn * float64(k) / 50
				if got.Moment(x) != want.Moment(x) || got.Deflection(x) != want.Deflection(x) || got.Slope(x) != want.Slope(x) {
					t.Fatalf("trial %d at %g in: M %g y %g, SolveLoads M %g y %g", trial, x, got.Moment(x), got.Deflection(x), want.Moment(x), want.Deflection(x))
				}
			}
			for j := range want.Reactions() {
				if got.Reactions()[j] != want.Reactions()[j] {
					t.Fatalf("trial %d: reaction %d %g, SolveLoads %g", trial, j, got.Reactions()[j], want.Reactions()[j])
				}
			}
		}
	}
	// a load off the beam is refused as SolveLoads refuses it
	b := Beam{LengthIn: 120, SupportsAtIn: []float64{0, 120}, EILbIn2: 1e8}
	if _, err := b.Cuts(Loads{Points: []PointLoad{{AtIn: 130, PLb: 1}}}); err == nil {
		t.Error("a point load off the beam: no error")
	}
}
