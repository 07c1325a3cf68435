package check

import (
	"reflect"
	"strings"
	"testing"
)

// TestReactions_RoofJoistUplift checks the structured reactions of the
// uplift rafter (18 ft simple span, 2 ft tributary width, D 8 psf, Lr 20
// psf, W up 50 psf) against a hand calculation, statics, written out:
//
//	w_D  = 8 psf x 2 ft  = 16 plf;  w_Lr = 20 x 2 = 40 plf;  w_W = 50 x 2 = 100 plf (away)
//	0.6D + 0.6W (ASCE 7-16 2.4.1 combination 7): 0.6(16) - 0.6(100) = -50.4 plf (net uplift)
//	R_up   = w L / 2 = 50.4 plf x 18 ft / 2 = 453.6 lb at each bearing
//	D + Lr (combination 3): 16 + 40 = 56 plf;  R_down = 56 x 18 / 2 = 504 lb
//	CD of 0.6D + 0.6W = 1.6 (wind, NDS 2018 Table 2.3.2)
func TestReactions_RoofJoistUplift(t *testing.T) {
	r := CheckMember(upliftRafter("2x10"), DefaultSettings())
	if r.Status == StatusError {
		t.Fatalf("error: %v", r.Messages)
	}
	if len(r.Reactions) != 2 {
		t.Fatalf("%d reactions, want one per bearing (2)", len(r.Reactions))
	}
	const src = "statics, written out: w L / 2 under ASCE 7-16 2.4.1 combinations"
	for j, x := range []float64{0, 216} {
		re := r.Reactions[j]
		if re.Bearing != j || re.AtIn != x {
			t.Errorf("reaction %d: bearing %d at %g in, want %d at %g in", j, re.Bearing, re.AtIn, j, x)
		}
		expectNear(t, "uplift reaction", re.UpLb, 50.4*18/2, 1e-9, 1e-9, src)
		expectNear(t, "downward reaction", re.DownLb, 56.0*18/2, 1e-9, 1e-9, src)
		if re.UpCombo != "0.6D+0.6W(up)" || re.DownCombo != "D+Lr" {
			t.Errorf("reaction %d: combos %q (up), %q (down), want 0.6D+0.6W(up), D+Lr", j, re.UpCombo, re.DownCombo)
		}
		expectNear(t, "CD of the uplift case", re.UpCD, 1.6, 0, 0, "NDS 2018 Table 2.3.2, wind")
	}
	// The free-text note is gone: the reaction is data, not advice.
	for _, s := range r.Info {
		if l := strings.ToLower(s); strings.Contains(l, "uplift") || strings.Contains(l, "hold") {
			t.Errorf("info still carries an uplift note: %q", s)
		}
	}
}

// TestReactions_EndPartOfBearing: a joist end that runs 2 in past the last
// bearing centre-line, inside the wall (no overhang analysed), puts the
// load on those 2 in into that reaction. Statics, written out, with the
// uplift rafter's 0.6D + 0.6W line load of 50.4 plf = 4.2 lb/in:
//
//	R_start = 4.2 x 216 / 2 = 453.6 lb
//	R_end   = 453.6 + 4.2 x 2 = 462.0 lb
//
// and a joist that carries no wind suction has no uplift at all.
func TestReactions_EndPartOfBearing(t *testing.T) {
	m := upliftRafter("2x10")
	m.LengthIn = 218
	r := CheckMember(m, DefaultSettings())
	const src = "statics, written out"
	expectNear(t, "start uplift", r.Reactions[0].UpLb, 4.2*216/2, 1e-9, 1e-9, src)
	expectNear(t, "end uplift", r.Reactions[1].UpLb, 4.2*216/2+4.2*2, 1e-9, 1e-9, src)

	f := CheckMember(floorJoist("2x10", 168, 16), DefaultSettings())
	for _, re := range f.Reactions {
		if re.UpLb != 0 || re.UpCombo != "" || re.DownLb <= 0 {
			t.Errorf("floor joist: reaction %+v, want downward only", re)
		}
	}
}

// TestCheckMemberReactionsSame: CheckMemberReactions gives what
// CheckMember and ServiceReactions give one after the other (one analysis
// for both; common practice, no source), for a beam carrying joists, a
// two-span joist with drawn blocking, a roof joist under net uplift and a
// member that cannot be checked.
func TestCheckMemberReactionsSame(t *testing.T) {
	s := DefaultSettings()
	beam := Member{ID: "B1", Size: "4x12", Species: "Douglas Fir-Larch", Grade: "No.1", LengthIn: 144,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 3.5}}, Use: "floor",
		LiveLimit: 360, TotalLimit: 240, TopBracedAtPoints: true}
	for x := 12.0; x < 144; x += 12 {
		beam.PointLoads = append(beam.PointLoads, PointLoad{AtIn: x, DeadLb: 144, LiveLb: 480})
	}
	twoSpan := Member{ID: "M1", Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 290,
		Bearings:  []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 145, LengthIn: 3.5}, {AtIn: 290, LengthIn: 3.5}},
		SpacingIn: 16, TribIn: 16, Use: "floor", Loads: AreaLoads{DeadPsf: 15, LivePsf: 40},
		LiveLimit: 360, TotalLimit: 240, BlockingAtIn: []float64{72}, Repetitive: true}
	uplift := Member{ID: "M2", Size: "2x8", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 168,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 168, LengthIn: 3.5}}, SpacingIn: 24, TribIn: 24,
		Use: "roof", Loads: AreaLoads{DeadPsf: 10, RoofLivePsf: 20, WindUpPsf: 40}, LiveLimit: 240, TotalLimit: 180}
	bad := uplift
	bad.Size = "2x7"
	for _, m := range []Member{beam, twoSpan, uplift, bad} {
		r, rs, err := CheckMemberReactions(m, s)
		wantR := CheckMember(m, s)
		wantRs, wantErr := ServiceReactions(m, s)
		if !reflect.DeepEqual(r, wantR) {
			t.Errorf("%s: result differs from CheckMember's", m.ID)
		}
		if !reflect.DeepEqual(rs, wantRs) || (err == nil) != (wantErr == nil) {
			t.Errorf("%s: reactions %v (%v), ServiceReactions %v (%v)", m.ID, rs, err, wantRs, wantErr)
		}
	}
}
