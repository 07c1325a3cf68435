package beam

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// eiTest is E*I of a 2x10 Douglas Fir-Larch No.2 joist: E = 1,600,000 psi
// times I = 98.93 in^4 (NDS 2018 Supplement Table 4A, checked:
// docs/VERIFIED.md; I = b d^3/12 of the Table 1A dressed size, Table 1B
// itself from memory: verify). Any positive EI would do: the checks below scale
// with it.
const eiTest = 1.6e6 * 98.93

// near reports whether got is within tol (relative to max(|want|, scale))
// of want, and fails t otherwise, naming what and its source.
func near(t *testing.T, what string, got, want, tol, scale float64, source string) {
	t.Helper()
	ref := math.Max(math.Abs(want), scale)
	if ref == 0 {
		ref = 1
	}
	if math.Abs(got-want) > tol*ref || math.IsNaN(got) {
		t.Errorf("%s = %.10g, want %.10g (tol %g) [%s]", what, got, want, tol, source)
	}
}

func mustSolve(t *testing.T, b Beam, w ...float64) *Response {
	t.Helper()
	r, err := b.Solve(w)
	if err != nil {
		t.Fatalf("Solve(%+v, %v): %v", b, w, err)
	}
	return r
}

// Closed-form tolerance: the analysis is exact up to rounding, so 1e-9
// relative is ample and still catches any wrong coefficient.
const tolExact = 1e-9

func TestSimpleSpanUniform(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, simple beam - uniformly distributed load (Case 1, checked against the stored copy at scribd.com/document/38194547/MV-Diagrams, p. 4-190: R = wl/2, Mmax = wl^2/8, max deflection 5wl^4/384EI); any mechanics of materials text, closed form"
	L, w := 192.0, 8.5 // 16 ft span, 102 plf
	b := Beam{LengthIn: L, SupportsAtIn: []float64{0, L}, EILbIn2: eiTest}
	r := mustSolve(t, b, w)
	R := r.Reactions()
	near(t, "R left", R[0], w*L/2, tolExact, 0, src)
	near(t, "R right", R[1], w*L/2, tolExact, 0, src)
	near(t, "M mid", r.Moment(L/2), w*L*L/8, tolExact, 0, src)
	near(t, "defl mid", r.Deflection(L/2), 5*w*L*L*L*L/(384*eiTest), tolExact, 0, src)
	mp, xp, mn, xn := r.MomentExtremes(0, L)
	near(t, "M max", mp, w*L*L/8, tolExact, 0, src)
	near(t, "x of M max", xp, L/2, tolExact, 0, src)
	if mn != 0 || xn != 0 {
		t.Errorf("MomentExtremes negative = %g at %g, want 0 at from=0 (simple span has no hogging) [%s]", mn, xn, src)
	}
	d, xd := r.MaxDeflection(0, L)
	near(t, "max defl", d, 5*w*L*L*L*L/(384*eiTest), tolExact, 0, src)
	near(t, "x of max defl", xd, L/2, 1e-6, 0, src)
	vl, vr := r.ShearEachSide(0)
	near(t, "V right of left support", vr, w*L/2, tolExact, 0, src)
	if vl != 0 {
		t.Errorf("V left of the beam end = %g, want 0", vl)
	}
	vl, vr = r.ShearEachSide(L / 4)
	near(t, "V at L/4 (left)", vl, w*L/4, tolExact, 0, src)
	near(t, "V at L/4 (right)", vr, w*L/4, tolExact, 0, src)
	if sc := r.MomentSignChanges(); sc != nil {
		t.Errorf("MomentSignChanges = %v, want none for a simple span [%s]", sc, src)
	}
	// End slope wL^3/24EI, same source.
	near(t, "slope at 0", r.Slope(0), w*L*L*L/(24*eiTest), tolExact, 0, src)
}

func TestTwoEqualSpans(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, continuous beam - two equal spans - uniformly distributed load (reactions 3/8, 10/8, 3/8 wl and support moment wl^2/8 checked against Civil Engineering Formulas Table 2.1, digilib.universitaspertamina.ac.id/ebook/Civil Engineering Formulas, page 96); three-moment equation by hand: 4 M L = -2 wL^3/4"
	L, w := 144.0, 6.0
	b := Beam{LengthIn: 2 * L, SupportsAtIn: []float64{0, L, 2 * L}, EILbIn2: eiTest}
	r := mustSolve(t, b, w, w)
	R := r.Reactions()
	near(t, "R end", R[0], 0.375*w*L, tolExact, 0, src)
	near(t, "R interior", R[1], 1.25*w*L, tolExact, 0, src)
	near(t, "R other end", R[2], 0.375*w*L, tolExact, 0, src)
	near(t, "M interior support", r.Moment(L), -w*L*L/8, tolExact, 0, src)
	mp, xp, mn, xn := r.MomentExtremes(0, 2*L)
	near(t, "M max positive (9wL^2/128)", mp, 9*w*L*L/128, tolExact, 0, src)
	near(t, "x of M max positive (3L/8)", xp, 3*L/8, tolExact, 0, src)
	near(t, "M max negative", mn, -w*L*L/8, tolExact, 0, src)
	near(t, "x of M max negative", xn, L, tolExact, 0, src)
	vl, vr := r.ShearEachSide(L)
	near(t, "V left of interior support (-5wL/8)", vl, -0.625*w*L, tolExact, 0, src)
	near(t, "V right of interior support (+5wL/8)", vr, 0.625*w*L, tolExact, 0, src)
	// Zero moment at 0.75 L from each end support: M = 3wLx/8 - wx^2/2 = 0.
	sc := r.MomentSignChanges()
	if len(sc) != 2 {
		t.Fatalf("MomentSignChanges = %v, want 2 points [%s]", sc, src)
	}
	near(t, "inflection 1", sc[0], 0.75*L, tolExact, 0, src)
	near(t, "inflection 2", sc[1], 2*L-0.75*L, tolExact, 0, src)
	// Max deflection of each span: the elastic curve of a span is
	// y = w x (L^3 - 3 L x^2 + 2 x^3) / (48 EI) (same diagram, from memory:
	// verify); y' = 0 gives 8u^3 - 9u^2 + 1 = 0, u = x/L = (1+sqrt(33))/16
	// = 0.4215 L, and the tables round y to wL^4/(185 EI).
	u := (1 + math.Sqrt(33)) / 16
	d, xd := r.MaxDeflection(0, L)
	near(t, "max defl", d, w*L*L*L*L/(48*eiTest)*(u-3*u*u*u+2*u*u*u*u), tolExact, 0, src)
	near(t, "max defl (wL^4/185EI, table rounding)", d, w*L*L*L*L/(185*eiTest), 0.005, 0, src)
	near(t, "x of max defl", xd, u*L, 1e-8, 0, src)
	near(t, "x of max defl (0.4215 L)", xd/L, 0.4215, 1e-3, 0, src)
}

func TestThreeEqualSpans(t *testing.T) {
	const src = "continuous beam - three equal spans - uniformly distributed load, coefficients 0.4/1.1/-0.1/0.08 checked against Civil Engineering Formulas Table 2.1 (digilib.universitaspertamina.ac.id, page 96), 0.025 from memory: verify; three-moment equation by hand: 4M1 + M2 = -wL^2/2, symmetric -> M = -wL^2/10"
	L, w := 120.0, 3.5
	b := Beam{LengthIn: 3 * L, SupportsAtIn: []float64{0, L, 2 * L, 3 * L}, EILbIn2: eiTest}
	r := mustSolve(t, b, w, w, w)
	R := r.Reactions()
	want := []float64{0.4, 1.1, 1.1, 0.4}
	for i := range R {
		near(t, "reaction", R[i], want[i]*w*L, tolExact, 0, src)
	}
	near(t, "M support 1", r.Moment(L), -0.1*w*L*L, tolExact, 0, src)
	near(t, "M support 2", r.Moment(2*L), -0.1*w*L*L, tolExact, 0, src)
	mp, _, _, _ := r.MomentExtremes(0, L)
	near(t, "M+ end span", mp, 0.08*w*L*L, tolExact, 0, src)
	mp, xp, _, _ := r.MomentExtremes(L, 2*L)
	near(t, "M+ centre span", mp, 0.025*w*L*L, tolExact, 0, src)
	near(t, "x of M+ centre span", xp, 1.5*L, tolExact, 0, src)
}

func TestValidate(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name string
		b    Beam
		want string // the message names the problem
	}{
		{"zero length", Beam{0, []float64{0, 0}, 1}, "length 0 in"},
		{"negative length", Beam{-10, []float64{0, 10}, 1}, "length -10 in"},
		{"NaN length", Beam{nan, []float64{0, 10}, 1}, "length NaN in"},
		{"Inf length", Beam{inf, []float64{0, 10}, 1}, "length +Inf in"},
		{"zero EI", Beam{10, []float64{0, 10}, 0}, "EI 0 lb*in^2"},
		{"negative EI", Beam{10, []float64{0, 10}, -5}, "EI -5 lb*in^2"},
		{"NaN EI", Beam{10, []float64{0, 10}, nan}, "EI NaN"},
		{"no supports", Beam{10, nil, 1}, "0 support(s): want at least 2"},
		{"one support", Beam{10, []float64{5}, 1}, "1 support(s): want at least 2"},
		{"support NaN", Beam{10, []float64{0, nan}, 1}, "support[1] at NaN in"},
		{"support Inf", Beam{10, []float64{0, inf}, 1}, "support[1] at +Inf in"},
		{"support below 0", Beam{10, []float64{-1, 10}, 1}, "support[0] at -1 in lies outside the beam [0, 10] in"},
		{"support past end", Beam{10, []float64{0, 10.5}, 1}, "support[1] at 10.5 in lies outside"},
		{"unsorted", Beam{10, []float64{0, 8, 4}, 1}, "support[2] at 4 in comes before support[1] at 8 in"},
		{"coincident", Beam{10, []float64{0, 5, 5, 10}, 1}, "support[1] and support[2] coincide at 5 in"},
	}
	for _, c := range cases {
		err := c.b.Validate()
		if !errors.Is(err, ErrBadBeam) {
			t.Errorf("%s: Validate() = %v, want an error wrapping ErrBadBeam", c.name, err)
			continue
		}
		if !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: Validate() = %q, want it to contain %q", c.name, err, c.want)
		}
		if _, err2 := c.b.Solve([]float64{1, 1, 1}); !errors.Is(err2, ErrBadBeam) {
			t.Errorf("%s: Solve error = %v, want ErrBadBeam", c.name, err2)
		}
		_ = c.b.Segments() // must not panic
	}
	ok := Beam{120, []float64{0, 120}, 1e8}
	if err := ok.Validate(); err != nil {
		t.Errorf("valid beam: %v", err)
	}
	for _, w := range [][]float64{nil, {1, 2}, {nan}, {inf}} {
		if _, err := ok.Solve(w); !errors.Is(err, ErrBadLoad) {
			t.Errorf("Solve(%v) = %v, want ErrBadLoad", w, err)
		}
	}
}

func TestOverhangLoadOnOverhangOnly(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, beam overhanging one support - uniformly distributed load on overhang (from memory: verify); superposition by hand: tip = wa^4/8EI + a * (wa^2/2) l/(3EI)"
	l, a, w := 168.0, 36.0, 9.0
	b := Beam{LengthIn: l + a, SupportsAtIn: []float64{0, l}, EILbIn2: eiTest}
	for _, sgn := range []float64{1, -1} { // -1: uplift, the mirror image
		r := mustSolve(t, b, 0, sgn*w)
		R := r.Reactions()
		near(t, "R1 (held down)", R[0], sgn*-w*a*a/(2*l), tolExact, 0, src)
		near(t, "R2", R[1], sgn*w*a*(2*l+a)/(2*l), tolExact, 0, src)
		near(t, "M at R2", r.Moment(l), sgn*-w*a*a/2, tolExact, 0, src)
		near(t, "tip deflection", r.Deflection(l+a), sgn*w*a*a*a*(4*l+3*a)/(24*eiTest), tolExact, 0, src)
		// Back span lifts by wa^2 l^2/(18 sqrt3 EI) = 0.03208 wa^2l^2/EI at l/sqrt3.
		d, x := r.MaxDeflection(0, l)
		near(t, "back-span uplift", d, -sgn*w*a*a*l*l/(18*math.Sqrt(3)*eiTest), tolExact, 0, src)
		near(t, "x of back-span uplift", x, l/math.Sqrt(3), 1e-8, 0, src)
		d, x = r.MaxDeflection(0, l+a)
		near(t, "largest deflection is the tip", d, sgn*w*a*a*a*(4*l+3*a)/(24*eiTest), tolExact, 0, src)
		near(t, "x of largest deflection", x, l+a, tolExact, 0, src)
		mp, _, mn, xn := r.MomentExtremes(0, l+a)
		if sgn > 0 {
			near(t, "M- at support", mn, -w*a*a/2, tolExact, 0, src)
			near(t, "x of M-", xn, l, tolExact, 0, src)
			if mp != 0 {
				t.Errorf("gravity on overhang only: M+ = %g, want 0 [%s]", mp, src)
			}
		} else {
			near(t, "uplift M+ at support", mp, w*a*a/2, tolExact, 0, src)
			if mn != 0 {
				t.Errorf("uplift on overhang only: M- = %g, want 0 [%s]", mn, src)
			}
		}
		if sc := r.MomentSignChanges(); sc != nil {
			t.Errorf("MomentSignChanges = %v, want none (one sign throughout) [%s]", sc, src)
		}
	}
}

func TestOverhangUniformEverywhere(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, beam overhanging one support - uniformly distributed load (from memory: verify); superposition by hand of the simple span and the overhang case"
	l, a, w := 180.0, 48.0, 5.0
	b := Beam{LengthIn: l + a, SupportsAtIn: []float64{0, l}, EILbIn2: eiTest}
	r := mustSolve(t, b, w, w)
	R := r.Reactions()
	near(t, "R1", R[0], w*(l*l-a*a)/(2*l), tolExact, 0, src)
	near(t, "R2", R[1], w*(l+a)*(l+a)/(2*l), tolExact, 0, src)
	near(t, "M at R2 (-wa^2/2)", r.Moment(l), -w*a*a/2, tolExact, 0, src)
	mp, xp, _, _ := r.MomentExtremes(0, l+a)
	near(t, "M+ max", mp, w*(l+a)*(l+a)*(l-a)*(l-a)/(8*l*l), tolExact, 0, src)
	near(t, "x of M+ max", xp, (l*l-a*a)/(2*l), tolExact, 0, src)
	near(t, "tip deflection", r.Deflection(l+a), w*a*(4*a*a*l-l*l*l+3*a*a*a)/(24*eiTest), tolExact, 0, src)
	// Zero moment where R1 x - w x^2/2 = 0: x = 2 R1 / w = (l^2-a^2)/l.
	sc := r.MomentSignChanges()
	if len(sc) != 1 {
		t.Fatalf("MomentSignChanges = %v, want one point [%s]", sc, src)
	}
	near(t, "inflection", sc[0], (l*l-a*a)/l, tolExact, 0, src)
}

func TestLeftOverhangMirrorsRight(t *testing.T) {
	// Mirror symmetry (common practice, no source): the same beam turned
	// end for end gives the same reactions reversed and the responses at
	// L - x; shear changes sign.
	l, a, w := 150.0, 30.0, 7.0
	right := mustSolve(t, Beam{LengthIn: l + a, SupportsAtIn: []float64{0, l}, EILbIn2: eiTest}, 2*w, w)
	left := mustSolve(t, Beam{LengthIn: l + a, SupportsAtIn: []float64{a, l + a}, EILbIn2: eiTest}, w, 2*w)
	near(t, "R mirror 0", left.Reactions()[0], right.Reactions()[1], tolExact, 0, "symmetry")
	near(t, "R mirror 1", left.Reactions()[1], right.Reactions()[0], tolExact, 0, "symmetry")
	for _, x := range []float64{0, 10, a, 70, l, l + a} {
		near(t, "M mirror", left.Moment(x), right.Moment(l+a-x), tolExact, w*l*l, "symmetry")
		near(t, "defl mirror", left.Deflection(x), right.Deflection(l+a-x), 1e-8, 1e-3, "symmetry")
		ll, lr := left.ShearEachSide(x)
		rl, rr := right.ShearEachSide(l + a - x)
		near(t, "V mirror (left side)", ll, -rr, tolExact, w*l, "symmetry")
		near(t, "V mirror (right side)", lr, -rl, tolExact, w*l, "symmetry")
	}
	// Left-cantilever tip, overhang load only: wa^3(4l+3a)/24EI as above.
	r := mustSolve(t, Beam{LengthIn: l + a, SupportsAtIn: []float64{a, l + a}, EILbIn2: eiTest}, w, 0)
	near(t, "left tip deflection", r.Deflection(0), w*a*a*a*(4*l+3*a)/(24*eiTest), tolExact, 0,
		"AISC Beam Diagrams and Formulas, beam overhanging one support - load on overhang (from memory: verify)")
}

func TestTwoUnequalSpans(t *testing.T) {
	// Independent hand derivation (compatibility): with M the moment over
	// the interior support, the rotation there of the left span taken
	// alone is w1 L1^3/24EI + M L1/3EI and of the right span
	// w2 L2^3/24EI + M L2/3EI (simple-span end rotations, any mechanics of
	// materials text); continuity makes their sum zero:
	//   M = -(w1 L1^3 + w2 L2^3) / (8 (L1 + L2)).
	// Statics per span: R0 = w1 L1/2 + M/L1, R2 = w2 L2/2 + M/L2.
	const src = "compatibility at the interior support, derived by hand in the comment"
	L1, L2, w1, w2 := 120.0, 204.0, 4.0, 6.5
	b := Beam{LengthIn: L1 + L2, SupportsAtIn: []float64{0, L1, L1 + L2}, EILbIn2: eiTest}
	r := mustSolve(t, b, w1, w2)
	M := -(w1*L1*L1*L1 + w2*L2*L2*L2) / (8 * (L1 + L2))
	R := r.Reactions()
	near(t, "M interior", r.Moment(L1), M, tolExact, 0, src)
	near(t, "R0", R[0], w1*L1/2+M/L1, tolExact, 0, src)
	near(t, "R2", R[2], w2*L2/2+M/L2, tolExact, 0, src)
	near(t, "R1", R[1], w1*L1+w2*L2-(w1*L1/2+M/L1)-(w2*L2/2+M/L2), tolExact, 0, src)
	// The slope is continuous over the interior support.
	s := &r.segs[0]
	near(t, "slope continuity", s.slope(s.l, r.invEI), r.segs[1].th0, tolExact, 0, src)
}

func TestTwoEqualSpansOneLoaded(t *testing.T) {
	const src = "AISC Steel Construction Manual, Beam Diagrams and Formulas, continuous beam - two equal spans - uniform load on one span: R1 = 7wl/16, R2 = 5wl/8, R3 = -wl/16, M over support = -wl^2/16, M max = 49wl^2/512 at 7l/16 (from memory: verify)"
	l, w := 132.0, 10.0
	b := Beam{LengthIn: 2 * l, SupportsAtIn: []float64{0, l, 2 * l}, EILbIn2: eiTest}
	r := mustSolve(t, b, w, 0)
	R := r.Reactions()
	near(t, "R1", R[0], 7*w*l/16, tolExact, 0, src)
	near(t, "R2", R[1], 5*w*l/8, tolExact, 0, src)
	near(t, "R3", R[2], -w*l/16, tolExact, 0, src)
	mp, xp, mn, xn := r.MomentExtremes(0, 2*l)
	near(t, "M+", mp, 49*w*l*l/512, tolExact, 0, src)
	near(t, "x of M+", xp, 7*l/16, tolExact, 0, src)
	near(t, "M-", mn, -w*l*l/16, tolExact, 0, src)
	near(t, "x of M-", xn, l, tolExact, 0, src)
	sc := r.MomentSignChanges()
	if len(sc) != 1 {
		t.Fatalf("MomentSignChanges = %v, want one point [%s]", sc, src)
	}
	near(t, "inflection (2 R1/w = 7l/8)", sc[0], 7*l/8, tolExact, 0, src)
}

func TestSegments(t *testing.T) {
	// Key points of a member with both overhangs (definition of Segment).
	b := Beam{LengthIn: 300, SupportsAtIn: []float64{20, 140, 280}, EILbIn2: 1}
	want := []Segment{{0, 20, true}, {20, 140, false}, {140, 280, false}, {280, 300, true}}
	got := b.Segments()
	if len(got) != len(want) || b.NumSegments() != len(want) {
		t.Fatalf("Segments() = %v (NumSegments %d), want %v", got, b.NumSegments(), want)
	}
	for i := range want {
		if got[i] != want[i] {
			t.Errorf("segment %d = %+v, want %+v", i, got[i], want[i])
		}
	}
	// Supports at both ends: spans only.
	b = Beam{LengthIn: 300, SupportsAtIn: []float64{0, 300}, EILbIn2: 1}
	if got := b.Segments(); len(got) != 1 || got[0] != (Segment{0, 300, false}) {
		t.Errorf("Segments() = %v, want one span [0, 300]", got)
	}
	_, err := b.Solve([]float64{1, 2})
	if !errors.Is(err, ErrBadLoad) || !strings.Contains(err.Error(), "2 line loads for 1 segments") {
		t.Errorf("Solve with 2 loads on 1 segment: %v", err)
	}
	_, err = b.Solve([]float64{math.NaN()})
	if !errors.Is(err, ErrBadLoad) || !strings.Contains(err.Error(), "load on segment 0 is NaN lb/in") {
		t.Errorf("Solve with a NaN load: %v", err)
	}
	_, err = Beam{LengthIn: 1e300, SupportsAtIn: []float64{0, 1e300}, EILbIn2: 1}.Solve([]float64{1e300})
	if !errors.Is(err, ErrBadLoad) || !strings.Contains(err.Error(), "overflow") {
		t.Errorf("Solve with overflowing results: %v", err)
	}
}

func TestSignChangesZeroStretch(t *testing.T) {
	// Documented behaviour of MomentSignChanges (no external source): an
	// unloaded overhang carries no moment at all, a stretch of its own, so
	// its bearing bounds the sagging span; a load on the overhang alone
	// makes the whole member hog, with no change.
	b := Beam{LengthIn: 200, SupportsAtIn: []float64{0, 160}, EILbIn2: eiTest}
	r := mustSolve(t, b, 5, 0)
	if sc := r.MomentSignChanges(); len(sc) != 1 || sc[0] != 160 {
		t.Errorf("span loaded, overhang not: MomentSignChanges = %v, want [160]", sc)
	}
	r = mustSolve(t, b, 0, 5)
	if sc := r.MomentSignChanges(); sc != nil {
		t.Errorf("overhang loaded alone: MomentSignChanges = %v, want none", sc)
	}
	r = mustSolve(t, b, 0, 0)
	if sc := r.MomentSignChanges(); sc != nil {
		t.Errorf("no load: MomentSignChanges = %v, want none", sc)
	}
	if mp, xp, mn, xn := r.MomentExtremes(50, 10); mp != 0 || mn != 0 || xp != 10 || xn != 10 {
		t.Errorf("no load: MomentExtremes(50, 10) = %g@%g, %g@%g, want zeros at from (10, the smaller end)", mp, xp, mn, xn)
	}
}

func TestSymmetricOverhangsBothEnds(t *testing.T) {
	// Hand derivation by statics and superposition (no table used): span
	// l between supports, overhang a at each end, uniform w everywhere.
	//   R = w (l + 2a) / 2 at each support;
	//   M over each support = -w a^2 / 2 (cantilever);
	//   M at mid-span = w l^2/8 - w a^2/2;
	//   mid-span deflection = 5 w l^4/(384 EI) - (w a^2/2) l^2/(8 EI)
	//     (equal end moments M bend a simple span by M l^2/8EI);
	//   tip deflection = w a^4/(8 EI)            (cantilever alone)
	//     + a (w a^2/2) l/(2 EI)                 (support rotation, end moments)
	//     - a w l^3/(24 EI)                      (support rotation, span load).
	// Closed forms from any mechanics of materials text (common practice).
	const src = "statics and superposition by hand, written in the comment"
	l, a, w := 192.0, 30.0, 4.5
	b := Beam{LengthIn: l + 2*a, SupportsAtIn: []float64{a, a + l}, EILbIn2: eiTest}
	r := mustSolve(t, b, w, w, w)
	R := r.Reactions()
	near(t, "R left", R[0], w*(l+2*a)/2, tolExact, 0, src)
	near(t, "R right", R[1], w*(l+2*a)/2, tolExact, 0, src)
	near(t, "M support", r.Moment(a), -w*a*a/2, tolExact, 0, src)
	near(t, "M mid-span", r.Moment(a+l/2), w*l*l/8-w*a*a/2, tolExact, 0, src)
	near(t, "mid-span deflection", r.Deflection(a+l/2), (5*w*l*l*l*l/384-w*a*a/2*l*l/8)/eiTest, tolExact, 0, src)
	tip := (w*a*a*a*a/8 + a*(w*a*a/2)*l/2 - a*w*l*l*l/24) / eiTest
	near(t, "left tip deflection", r.Deflection(0), tip, tolExact, 0, src)
	near(t, "right tip deflection", r.Deflection(l+2*a), tip, tolExact, 0, src)
	vl, vr := r.ShearEachSide(a)
	near(t, "V left of support (-wa)", vl, -w*a, tolExact, 0, src)
	near(t, "V right of support (R - wa)", vr, w*l/2, tolExact, 0, src)
}
