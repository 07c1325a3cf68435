package check

import (
	"reflect"
	"testing"
)

// The factor list is shared between results with the same factors and
// cases, and is the same list a fresh build gives (common practice, no
// source: a cache must not change a result).
func TestFactorTraceCache(t *testing.T) {
	m := Member{ID: "F1", Size: "2x10", Species: "DF-L", Grade: "No.2", LengthIn: 144,
		Bearings:  []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 3.5}},
		SpacingIn: 16, TribIn: 16, Use: "floor", Loads: AreaLoads{DeadPsf: 12, LivePsf: 40},
		LiveLimit: 360, TotalLimit: 240, Repetitive: true}
	s := DefaultSettings()
	a := CheckMember(m, s)
	b := CheckMember(m, s)
	if len(a.Factors) == 0 || &a.Factors[0] != &b.Factors[0] {
		t.Fatal("equal members do not share the factor list")
	}
	e, err := newEngine(m, s)
	defer e.release()
	if err != nil {
		t.Fatal(err)
	}
	if err := e.solveStrength(); err != nil {
		t.Fatal(err)
	}
	if fresh := e.buildFactorTrace(); !reflect.DeepEqual(fresh, a.Factors) {
		t.Errorf("cached factors differ from a fresh build:\n%v\n%v", a.Factors, fresh)
	}
	// Another size or a wet member gets its own list.
	m2 := m
	m2.Size = "2x12"
	c := CheckMember(m2, s)
	if &c.Factors[0] == &a.Factors[0] {
		t.Error("a 2x12 shares the 2x10's factor list")
	}
	s.WetService = true
	w := CheckMember(m, s)
	if &w.Factors[0] == &a.Factors[0] {
		t.Error("a wet-service member shares the dry member's factor list")
	}
}
