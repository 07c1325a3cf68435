package check

import (
	"fmt"
	"math"
	"reflect"
	"testing"
)

// TestMemberKey: identical check inputs but for the ID share a key, and a
// change to any one field gives another key (checkAll checks one member
// per key and copies its result to the others).
func TestMemberKey(t *testing.T) {
	base := Member{ID: "M1", Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 146.25,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 1.5}, {AtIn: 144, LengthIn: 5.5}}, SpacingIn: 16, TribIn: 16,
		Use: "floor", Loads: AreaLoads{DeadPsf: 12, LivePsf: 40}, LiveLimit: 360, TotalLimit: 240,
		BlockingAtIn: []float64{72}, Repetitive: true}
	other := base
	other.ID = "M2"
	if MemberKey(base) != MemberKey(other) {
		t.Fatal("members differing only in ID have different keys")
	}
	seen := map[string]string{MemberKey(base): "base"}
	v := reflect.ValueOf(base)
	for i := 0; i < v.NumField(); i++ {
		name := v.Type().Field(i).Name
		if name == "ID" {
			continue
		}
		m := base
		m.Bearings = append([]Bearing(nil), base.Bearings...)
		if !perturb(reflect.ValueOf(&m).Elem().Field(i)) {
			t.Fatalf("field %s: test does not know how to change a %s", name, v.Field(i).Type())
		}
		k := MemberKey(m)
		if prev, dup := seen[k]; dup {
			t.Errorf("changing %s gives the key of %s", name, prev)
		}
		seen[k] = name
	}
	// -0 and 0 differ, as they did when the key was the %v text.
	z := base
	z.OverhangEndIn = negZero()
	if (MemberKey(z) == MemberKey(base)) != (fmt.Sprint(z.OverhangEndIn) == fmt.Sprint(base.OverhangEndIn)) {
		t.Error("-0 and 0 keyed unlike their printed form")
	}
}

func negZero() float64 {
	x := 0.0
	return -x
}

// perturb changes v in place; false if it does not know v's kind.
func perturb(v reflect.Value) bool {
	switch v.Kind() {
	case reflect.String:
		v.SetString(v.String() + "x")
	case reflect.Float64:
		v.SetFloat(v.Float() + 0.5)
	case reflect.Bool:
		v.SetBool(!v.Bool())
	case reflect.Slice:
		v.Set(reflect.Append(v, reflect.Zero(v.Type().Elem())))
	case reflect.Struct:
		return perturb(v.Field(0))
	case reflect.Ptr:
		if v.IsNil() {
			v.Set(reflect.New(v.Type().Elem()))
			return true
		}
		return perturb(v.Elem())
	default:
		return false
	}
	return true
}

// TestAppendMemberKey: the key appended from a pointer is MemberKey's,
// byte for byte, whatever the ID, and leaves the member as it was
// (common practice, no source).
func TestAppendMemberKey(t *testing.T) {
	m := Member{ID: "M7", Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 144,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 3.5}, {AtIn: 144, LengthIn: 1.5, Hanger: true}}, SpacingIn: 16, TribIn: 16}
	n := m
	n.ID = ""
	want := "prefix" + string(appendKey(nil, reflect.ValueOf(n))) // the whole struct walked, ID empty
	if got := string(AppendMemberKey([]byte("prefix"), &m)); got != want {
		t.Fatalf("AppendMemberKey %q, want %q", got, want)
	}
	if "prefix"+MemberKey(m) != want || m.ID != "M7" {
		t.Errorf("MemberKey differs, or the ID was cleared")
	}
}

// TestCompiledKeyAsReflection: the encoders compiled from Member's type
// write, byte for byte, what the reflection walk (appendKey) writes of the
// member with its ID cleared, and AppendMemberKeyUnnamed what it writes
// of the member with its point loads' names cleared too, on members with
// every slice filled, empty and nil; neither changes the member (common
// practice, no source).
func TestCompiledKeyAsReflection(t *testing.T) {
	full := Member{ID: "B3", Size: "(3) 2x12", Species: "Douglas Fir-Larch", Grade: "No.2", LengthIn: 304,
		Bearings: []Bearing{{AtIn: 0, LengthIn: 5.5, SupportSpecies: "Hem-Fir", SupportGrade: "No.1"},
			{AtIn: 152, LengthIn: 5.5, Hanger: true, Beam: SupportBeam{Species: "Douglas Fir-Larch", Grade: "No.1", Size: "6x14", EndIn: 3}},
			{AtIn: 304, LengthIn: 5.5}},
		OverhangStartIn: negZero(), OverhangEndIn: 0.25, SpacingIn: 16, TribIn: 96, Use: "floor",
		Loads:         AreaLoads{DeadPsf: 12, LivePsf: 40, WindUpPsf: -3, UpliftDeadPsf: 7.2, HasUpliftDead: true},
		LoadPieces:    []LoadPiece{{FromIn: 0, ToIn: 100, Zone: "Z1", Loads: AreaLoads{SnowPsf: 30}}, {FromIn: 100, ToIn: 304, Zone: "Z2"}},
		PointLoads:    []PointLoad{{AtIn: 16, DeadLb: 120.5, LiveLb: 400, Name: "M1"}, {AtIn: 32, WindUpLb: 80, UpliftDeadLb: 30, HasUpliftDead: true, Name: "M2"}},
		SelfWeightPlf: 16.9, TopBracedAtPoints: true, TopBracingAtIn: []float64{16, 32}, LiveLimit: 360, TotalLimit: 240,
		BottomBracedContinuous: true, BlockingAtIn: []float64{math.Inf(1), math.NaN()}, Repetitive: true, PitchRise12: 4, LongTermLimit: 240}
	empty := full
	empty.Bearings, empty.LoadPieces, empty.PointLoads, empty.TopBracingAtIn, empty.BlockingAtIn =
		[]Bearing{}, []LoadPiece{}, []PointLoad{}, []float64{}, []float64{}
	for _, m := range []Member{full, empty, {}, {ID: "only"}} {
		before := fmt.Sprintf("%#v", m)
		n := m
		n.ID = ""
		want := string(appendKey([]byte("p"), reflect.ValueOf(n)))
		if got := string(AppendMemberKey([]byte("p"), &m)); got != want {
			t.Errorf("%s: compiled key %q, reflection %q", m.ID, got, want)
		}
		n.PointLoads = append([]PointLoad(nil), m.PointLoads...)
		for i := range n.PointLoads {
			n.PointLoads[i].Name = ""
		}
		want = string(appendKey([]byte("p"), reflect.ValueOf(n)))
		if got := string(AppendMemberKeyUnnamed([]byte("p"), &m)); got != want {
			t.Errorf("%s: unnamed key %q, want %q", m.ID, got, want)
		}
		if after := fmt.Sprintf("%#v", m); after != before {
			t.Errorf("keying changed the member: %s", after)
		}
	}
	// the names are all the unnamed key leaves out
	a, b := full, full
	b.PointLoads = append([]PointLoad(nil), full.PointLoads...)
	b.PointLoads[0].Name, b.PointLoads[1].Name = "J9", ""
	if string(AppendMemberKeyUnnamed(nil, &a)) != string(AppendMemberKeyUnnamed(nil, &b)) {
		t.Error("point loads differing in name only key apart")
	}
	b.PointLoads[1].DeadLb++
	if string(AppendMemberKeyUnnamed(nil, &a)) == string(AppendMemberKeyUnnamed(nil, &b)) {
		t.Error("point loads of different loads share a key")
	}
}
