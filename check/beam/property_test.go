package beam

import (
	"flag"
	"math"
	"math/rand/v2"
	"testing"
)

// seedFlag shifts the seeds of the random tests, to run other cases:
// go test ./check/beam -args -seed=N
var seedFlag = flag.Uint64("seed", 0, "offset added to the random tests' seeds")

func newRand(a, b uint64) *rand.Rand { return rand.New(rand.NewPCG(a+*seedFlag, b)) }

// randomBeam returns a valid random beam with 2..maxSup supports, an
// overhang at either end half the time, and loads in [-20, 20] lb/in
// (a tenth of them zero, to exercise unloaded segments).
func randomBeam(rng *rand.Rand, maxSup int) (Beam, []float64) {
	n := 2 + rng.IntN(maxSup-1)
	x := 0.0
	var sup []float64
	if rng.IntN(2) == 0 {
		x = 6 + 60*rng.Float64() // left overhang
	}
	for i := 0; i < n; i++ {
		if i > 0 {
			x += 24 + 216*rng.Float64()
		}
		sup = append(sup, x)
	}
	L := x
	if rng.IntN(2) == 0 {
		L += 6 + 60*rng.Float64() // right overhang
	}
	b := Beam{LengthIn: L, SupportsAtIn: sup, EILbIn2: 1e7 + 1e9*rng.Float64()}
	w := make([]float64, b.NumSegments())
	for k := range w {
		if rng.IntN(10) > 0 {
			w[k] = -20 + 40*rng.Float64()
		}
	}
	return b, w
}

// staticsMoment is the moment at x from the free body left of x, using
// only the reactions and the loads (independent of the segment
// coefficients): sum R_j (x - s_j) over supports left of x minus the
// resultant of the load left of x times its lever arm.
func staticsMoment(b Beam, w []float64, R []float64, x float64) float64 {
	m := 0.0
	for j, s := range b.SupportsAtIn {
		if s < x {
			m += R[j] * (x - s)
		}
	}
	for k, sg := range b.Segments() {
		if sg.FromIn >= x {
			break
		}
		hi := math.Min(sg.ToIn, x)
		f := w[k] * (hi - sg.FromIn)
		m -= f * (x - (sg.FromIn+hi)/2)
	}
	return m
}

// TestEquilibriumRandom checks statics over random beams (common
// practice, no source): the reactions balance the load, their moment
// about x = 0 balances the load's, and the moment at every point equals
// that of the free body to its left.
func TestEquilibriumRandom(t *testing.T) {
	rng := newRand(1, 2)
	for it := 0; it < 500; it++ {
		b, w := randomBeam(rng, 12)
		r := mustSolve(t, b, w...)
		R := r.Reactions()
		var load, loadMoment, sumR, sumRM, scale float64
		for k, sg := range b.Segments() {
			f := w[k] * (sg.ToIn - sg.FromIn)
			load += f
			loadMoment += f * (sg.FromIn + sg.ToIn) / 2
			scale += math.Abs(f)
		}
		for j, s := range b.SupportsAtIn {
			sumR += R[j]
			sumRM += R[j] * s
		}
		if scale == 0 {
			continue
		}
		near(t, "sum of reactions", sumR, load, 1e-9, scale, "vertical equilibrium")
		near(t, "moment of reactions about 0", sumRM, loadMoment, 1e-9, scale*b.LengthIn, "moment equilibrium")
		for i := 0; i <= 50; i++ {
			x := b.LengthIn * float64(i) / 50
			near(t, "M vs free body", r.Moment(x), staticsMoment(b, w, R, x), 1e-9, scale*b.LengthIn, "free body left of x")
		}
		if t.Failed() {
			t.Fatalf("beam %+v loads %v", b, w)
		}
	}
}

// TestCompatibilityRandom integrates the free-body moment numerically
// (trapezoidal rule twice on a fine grid, independent of the analysis)
// and checks that the deflected shape through the first two supports also
// passes through every other support, and that it matches Deflection.
// Common practice, no source: EI d2y/dx2 = -M and y = 0 at each support.
func TestCompatibilityRandom(t *testing.T) {
	rng := newRand(3, 4)
	const n = 20000
	xs := make([]float64, n+1)
	y := make([]float64, n+1)
	for it := 0; it < 60; it++ {
		b, w := randomBeam(rng, 6)
		r := mustSolve(t, b, w...)
		R := r.Reactions()
		h := b.LengthIn / n
		// slope and deflection by the trapezoidal rule, up to a linear term
		slope, mPrev := 0.0, staticsMoment(b, w, R, 0)
		for i := 0; i <= n; i++ {
			xs[i] = float64(i) * h
			if i == 0 {
				continue
			}
			m := staticsMoment(b, w, R, xs[i])
			sPrev := slope
			slope += -(mPrev + m) / 2 * h / b.EILbIn2
			y[i] = y[i-1] + (sPrev+slope)/2*h
			mPrev = m
		}
		at := func(x float64) float64 { // linear interpolation on the grid
			i := int(math.Min(x/h, n-1))
			f := x/h - float64(i)
			return y[i]*(1-f) + y[i+1]*f
		}
		s0, s1 := b.SupportsAtIn[0], b.SupportsAtIn[1]
		y0, y1 := at(s0), at(s1)
		fix := func(x float64) float64 { return at(x) - y0 - (y1-y0)*(x-s0)/(s1-s0) }
		// Scale: the deflection a moment of the largest magnitude on the
		// beam would give over its length, M L^2 / EI, or the largest
		// deflection if larger (loads of both signs can cancel, leaving a
		// deflection far smaller than the trapezoidal rule's O(h^2) error
		// on the curvature). A wrong support moment errs by a sizeable
		// fraction of this scale, 1e-5 of it is well above the rule's error.
		dmax, _ := r.MaxDeflection(0, b.LengthIn)
		mp, _, mn, _ := r.MomentExtremes(0, b.LengthIn)
		scale := math.Max(math.Abs(dmax), math.Max(mp, -mn)*b.LengthIn*b.LengthIn/b.EILbIn2)
		if scale == 0 {
			continue
		}
		for _, s := range b.SupportsAtIn {
			near(t, "numerical deflection at support", fix(s), 0, 1e-5, scale, "compatibility")
		}
		for i := 0; i <= 40; i++ {
			x := b.LengthIn * float64(i) / 40
			near(t, "Deflection vs numerical", r.Deflection(x), fix(x), 1e-5, scale, "double integration")
		}
		if t.Failed() {
			t.Fatalf("beam %+v loads %v", b, w)
		}
	}
}

// TestQueriesAgainstSamplingRandom checks the exact extreme and root
// queries against dense sampling (common practice, no source).
func TestQueriesAgainstSamplingRandom(t *testing.T) {
	rng := newRand(5, 6)
	for it := 0; it < 300; it++ {
		b, w := randomBeam(rng, 6)
		r := mustSolve(t, b, w...)
		from := b.LengthIn * rng.Float64()
		to := from + (b.LengthIn-from)*rng.Float64()
		mp, xp, mn, xn := r.MomentExtremes(from, to)
		d, xd := r.MaxDeflection(from, to)
		var sp, sn, sd float64
		mScale, dScale := 0.0, 0.0
		const k = 4000
		// Sample a fine grid plus the supports, where the moment has a
		// kink that a grid alone would miss by O(h).
		xsamp := make([]float64, 0, k+1+len(b.SupportsAtIn))
		for i := 0; i <= k; i++ {
			xsamp = append(xsamp, from+(to-from)*float64(i)/k)
		}
		for _, s := range b.SupportsAtIn {
			if s >= from && s <= to {
				xsamp = append(xsamp, s)
			}
		}
		for _, x := range xsamp {
			m, y := r.Moment(x), r.Deflection(x)
			sp, sn = math.Max(sp, m), math.Min(sn, m)
			if math.Abs(y) > math.Abs(sd) {
				sd = y
			}
		}
		for i := 0; i <= k; i++ {
			x := b.LengthIn * float64(i) / k
			mScale = math.Max(mScale, math.Abs(r.Moment(x)))
			dScale = math.Max(dScale, math.Abs(r.Deflection(x)))
		}
		// The exact extreme is never below the sampled one, and the
		// sampling misses it by O(h^2) at most.
		if mp < sp-1e-9*mScale || mn > sn+1e-9*mScale || math.Abs(d) < math.Abs(sd)-1e-9*dScale {
			t.Fatalf("extremes below sampling: M+ %g<%g, M- %g>%g, y %g<%g; beam %+v w %v [%g,%g]",
				mp, sp, mn, sn, d, sd, b, w, from, to)
		}
		near(t, "M+ vs sampling", mp, sp, 1e-4, mScale, "sampling")
		near(t, "M- vs sampling", mn, sn, 1e-4, mScale, "sampling")
		near(t, "max defl vs sampling", d, sd, 1e-4, dScale, "sampling")
		if mp != 0 {
			near(t, "M(xPos)", r.Moment(xp), mp, 1e-12, mScale, "consistency")
		} else if xp != from {
			t.Errorf("no positive moment: xPos = %g, want from = %g", xp, from)
		}
		if mn != 0 {
			near(t, "M(xNeg)", r.Moment(xn), mn, 1e-12, mScale, "consistency")
		} else if xn != from {
			t.Errorf("no negative moment: xNeg = %g, want from = %g", xn, from)
		}
		near(t, "y(xDefl)", r.Deflection(xd), d, 1e-12, dScale, "consistency")
		for _, x := range []float64{xp, xn, xd} {
			if x < from || x > to {
				t.Fatalf("extreme at %g outside [%g, %g]", x, from, to)
			}
		}

		// Sign changes: M = 0 there, each piece has one sign, neighbours
		// differ.
		sc := r.MomentSignChanges()
		buf := r.AppendMomentSignChanges([]float64{-1})
		if len(buf) != len(sc)+1 || buf[0] != -1 {
			t.Fatalf("AppendMomentSignChanges = %v, want [-1] + %v", buf, sc)
		}
		for i := range sc {
			if buf[i+1] != sc[i] {
				t.Fatalf("AppendMomentSignChanges = %v, want [-1] + %v", buf, sc)
			}
		}
		cuts := append(append([]float64{0}, sc...), b.LengthIn)
		prev := 2
		for i := 0; i+1 < len(cuts); i++ {
			p, q := cuts[i], cuts[i+1]
			if q <= p {
				t.Fatalf("sign changes not increasing: %v", sc)
			}
			sg := signOf(r.Moment((p+q)/2), 1e-9*mScale)
			if sg == prev {
				t.Fatalf("pieces %d and %d share sign %d: changes %v; beam %+v w %v", i-1, i, sg, sc, b, w)
			}
			prev = sg
			for j := 1; j < 50; j++ {
				x := p + (q-p)*float64(j)/50
				if s := signOf(r.Moment(x), 1e-7*mScale); s != 0 && s != sg {
					t.Fatalf("moment %g at %g has sign %d inside a piece of sign %d [%g,%g]; beam %+v w %v",
						r.Moment(x), x, s, sg, p, q, b, w)
				}
			}
			if i > 0 {
				near(t, "M at sign change", r.Moment(p), 0, 1e-9, mScale, "root")
			}
		}
	}
}

func signOf(v, eps float64) int {
	switch {
	case v > eps:
		return 1
	case v < -eps:
		return -1
	}
	return 0
}

// TestLinearity checks superposition (common practice, no source): the
// response to w1 + w2 is the sum of the responses.
func TestLinearity(t *testing.T) {
	rng := newRand(7, 8)
	for it := 0; it < 200; it++ {
		b, w1 := randomBeam(rng, 6)
		w2 := make([]float64, len(w1))
		sum := make([]float64, len(w1))
		for k := range w2 {
			w2[k] = -20 + 40*rng.Float64()
			sum[k] = w1[k] + w2[k]
		}
		r1, r2, r12 := mustSolve(t, b, w1...), mustSolve(t, b, w2...), mustSolve(t, b, sum...)
		for i := 0; i <= 20; i++ {
			x := b.LengthIn * float64(i) / 20
			near(t, "M superposition", r12.Moment(x), r1.Moment(x)+r2.Moment(x), 1e-9, 1e4, "linearity")
			near(t, "y superposition", r12.Deflection(x), r1.Deflection(x)+r2.Deflection(x), 1e-9, 1e-2, "linearity")
		}
	}
}

// TestSolveIntoReuse checks that one Response can be reused across beams
// of different sizes, through the inline and the heap storage.
func TestSolveIntoReuse(t *testing.T) {
	rng := newRand(9, 10)
	var reused Response
	for it := 0; it < 200; it++ {
		b, w := randomBeam(rng, 14)
		fresh := mustSolve(t, b, w...)
		if err := b.SolveInto(&reused, w); err != nil {
			t.Fatal(err)
		}
		for j, R := range fresh.Reactions() {
			if reused.Reactions()[j] != R {
				t.Fatalf("reused reaction %d = %g, fresh %g", j, reused.Reactions()[j], R)
			}
		}
		for i := 0; i <= 10; i++ {
			x := b.LengthIn * float64(i) / 10
			if reused.Moment(x) != fresh.Moment(x) || reused.Deflection(x) != fresh.Deflection(x) {
				t.Fatalf("reused response differs at x=%g", x)
			}
		}
	}
	// A failed SolveInto leaves an empty response, not a stale one.
	if err := (Beam{LengthIn: -1}).SolveInto(&reused, nil); err == nil {
		t.Fatal("want an error")
	}
	if reused.Moment(1) != 0 || len(reused.Reactions()) != 0 {
		t.Error("response not cleared after a failed SolveInto")
	}
}

// FuzzSolve checks that no input makes Validate or Solve panic, and that
// every accepted input gives finite results in equilibrium.
func FuzzSolve(f *testing.F) {
	f.Add(240.0, 0.0, 120.0, 240.0, 3, 1e8, 1.0, 2.0, -3.0, 0.5)
	f.Add(300.0, 24.0, 150.0, 276.0, 3, 1e8, 1.0, 1.0, 1.0, 1.0)
	f.Add(100.0, 0.0, 100.0, 0.0, 2, 1e8, -5.0, 0.0, 0.0, 0.0)
	f.Add(1e300, 0.0, 1e300, 0.0, 2, 1e-300, 1e300, 0.0, 0.0, 0.0)
	f.Add(math.NaN(), 0.0, 1.0, 2.0, 3, 1.0, 1.0, 1.0, 1.0, 1.0)
	f.Add(10.0, 0.0, 5.0, 5.0, 3, 1.0, 1.0, 1.0, 1.0, 1.0)
	f.Fuzz(func(t *testing.T, L, s0, s1, s2 float64, n int, ei, w0, w1, w2, w3 float64) {
		sup := []float64{s0, s1, s2}
		if n < 0 {
			n = -n
		}
		sup = sup[:n%4]
		b := Beam{LengthIn: L, SupportsAtIn: sup, EILbIn2: ei}
		ws := []float64{w0, w1, w2, w3}
		m := b.NumSegments()
		if m > len(ws) {
			m = len(ws)
		}
		_ = b.Validate()
		_ = b.Segments()
		r, err := b.Solve(ws[:m])
		if err != nil {
			return
		}
		sumR, load, scale := 0.0, 0.0, 0.0
		for _, R := range r.Reactions() {
			sumR += R
		}
		shortest := L
		for k, sg := range b.Segments() {
			load += ws[k] * (sg.ToIn - sg.FromIn)
			scale += math.Abs(ws[k] * (sg.ToIn - sg.FromIn))
			if d := sg.ToIn - sg.FromIn; d > 0 {
				shortest = math.Min(shortest, d)
			}
		}
		// Rounding grows with the ratio of the longest to the shortest
		// segment (the three-moment system's conditioning): the fuzzer
		// finds spans of 1 in beside spans of miles.
		rel := 1e-8 + 1e-14*L/shortest
		if !finite(sumR) || math.Abs(sumR-load) > rel*scale {
			t.Fatalf("sum R = %g, load %g; beam %+v w %v", sumR, load, b, ws[:m])
		}
		for _, x := range []float64{-1, 0, L / 3, L / 2, L, L + 1} {
			_, _ = r.ShearEachSide(x)
			if v := r.Moment(x) + r.Deflection(x); math.IsNaN(v) {
				t.Fatalf("NaN response at %g; beam %+v w %v", x, b, ws[:m])
			}
		}
		_, _, _, _ = r.MomentExtremes(0, L)
		_, _ = r.MaxDeflection(0, L)
		_ = r.MomentSignChanges()
		// The same beam under general loads built from the same numbers:
		// a partial load and a point load (SolveLoads) must never panic
		// and must keep statics.
		a, c := math.Abs(math.Mod(w2, L)), math.Abs(math.Mod(w3, L))
		if a > c {
			a, c = c, a
		}
		gl := Loads{Partial: []PartialLoad{{FromIn: a, ToIn: c, WPli: w0}}, Points: []PointLoad{{AtIn: math.Abs(math.Mod(w1, L)), PLb: w1}}}
		rg, err := b.SolveLoads(gl)
		if err != nil {
			return
		}
		sumG, loadG := 0.0, w0*(c-a)+w1
		for _, R := range rg.Reactions() {
			sumG += R
		}
		// Cut points closer than tolPos of the length are merged, so each
		// end of the partial load may move by that much (by design).
		snap := 2 * math.Abs(w0) * tolPos * L
		if scaleG := math.Abs(w0*(c-a)) + math.Abs(w1); finite(sumG) && math.Abs(sumG-loadG) > (1e-7+1e-14*L/shortest)*scaleG+1e-9+snap {
			t.Fatalf("general loads: sum R = %g, load %g; beam %+v loads %+v", sumG, loadG, b, gl)
		}
		_, _, _, _ = rg.MomentExtremes(0, L)
		_, _ = rg.MaxDeflection(0, L)
		_ = rg.MomentSignChanges()
	})
}
