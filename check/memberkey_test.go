package check

import (
	"fmt"
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
