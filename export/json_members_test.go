package export

import (
	"bytes"
	"encoding/json"
	"reflect"
	"slices"
	"strconv"
	"testing"
)

// TestMemberEncoderMatchesMarshal: the piecewise member encoder writes the
// same bytes as encoding/json on the whole member with the checks' traces
// left out (the reference), for members sharing check and factor slices,
// with nil and empty lists, omitted optional fields and text that JSON
// escapes.
func TestMemberEncoderMatchesMarshal(t *testing.T) {
	trace := []TraceItem{{Name: "M", Value: 7128, Unit: "lb-in", Source: "analysis"},
		{Name: "lu/d", Value: 7.78, Formula: "lu / d < 7 & \"x\"", Subst: "72 / 9.25"}}
	checks := []Check{{Kind: "bending-top", Combo: "D+L", Actual: 333.2, Allowable: 1309.3, Unit: "psi", Ratio: 0.2545, Trace: trace},
		{Kind: "shear", Combo: "D+L", Ratio: 0.1}} // nil trace: written as []
	factors := []TraceItem{{Name: "CF", Value: 1.1, Source: "NDS 2018 Table 4A"}}
	base := Member{ID: "M1", Mark: "J1", Layer: "JOIST", Handle: "2A", Source: "plan.dxf:12 (handle 2A)",
		Start: [2]float64{0, -2.25}, End: [2]float64{0, 122.25}, LengthIn: 124.5,
		BearingsAtIn: []float64{2.25, 122.25}, SpansIn: []float64{120}, TribIn: 16, SpacingIn: 16,
		Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", Zone: "FLOOR<1>",
		Checks: checks, Governing: "bending-top", MaxRatio: 0.2545, Status: "pass",
		Factors: factors, Info: []string{"NDS 4.4.1.2"}}
	var members []Member
	for i := 0; i < 4; i++ { // the same slices met again come from the cache
		m := base
		m.ID = string(rune('A' + i))
		members = append(members, m)
	}
	bare := base
	bare.Checks, bare.Factors, bare.Info, bare.Messages, bare.Source = nil, nil, nil, nil, ""
	members = append(members, bare)
	empty := base
	empty.Checks, empty.Factors = []Check{}, []TraceItem{}
	members = append(members, empty)
	members = append(members, Member{})
	members = append(members, fullMember(t), awkwardJSONMember())

	e := encoderMatchesMarshal(t, members)
	if len(e.cache) == 0 {
		t.Error("shared slices were never cached")
	}
}

// fullMember returns a Member with every field set to something that is
// not its zero value, by reflection, so that a field added to Member and
// not to the encoder makes TestMemberEncoderMatchesMarshal fail.
func fullMember(t *testing.T) Member {
	var m Member
	fillFull(t, reflect.ValueOf(&m).Elem())
	return m
}

// floatLeaves returns the path (field and element indexes) of every
// float64 reachable from v's exported fields; with jsonOnly, leaving out
// the fields tagged json:"-".
func floatLeaves(v reflect.Value, jsonOnly bool) [][]int {
	var paths [][]int
	var walk func(v reflect.Value, path []int)
	walk = func(v reflect.Value, path []int) {
		switch v.Kind() {
		case reflect.Float64:
			paths = append(paths, slices.Clone(path))
		case reflect.Struct:
			for i := 0; i < v.NumField(); i++ {
				if f := v.Type().Field(i); f.IsExported() && !(jsonOnly && f.Tag.Get("json") == "-") {
					walk(v.Field(i), append(path, i))
				}
			}
		case reflect.Slice, reflect.Array:
			for i := 0; i < v.Len(); i++ {
				walk(v.Index(i), append(path, i))
			}
		}
	}
	walk(v, nil)
	return paths
}

// leafAt returns the value at path (floatLeaves) from v.
func leafAt(v reflect.Value, path []int) reflect.Value {
	for _, i := range path {
		if v.Kind() == reflect.Struct {
			v = v.Field(i)
		} else {
			v = v.Index(i)
		}
	}
	return v
}

// fillFull sets every exported field reachable from v: a distinct string,
// number or true each, two items in every slice.
func fillFull(t *testing.T, v reflect.Value) {
	t.Helper()
	n := 0
	var fill func(f reflect.Value)
	fill = func(f reflect.Value) {
		n++
		switch f.Kind() {
		case reflect.String:
			f.SetString("s" + strconv.Itoa(n))
		case reflect.Float64:
			f.SetFloat(float64(n) + 0.25)
		case reflect.Int:
			f.SetInt(int64(n))
		case reflect.Bool:
			f.SetBool(true)
		case reflect.Array:
			for i := 0; i < f.Len(); i++ {
				fill(f.Index(i))
			}
		case reflect.Slice:
			s := reflect.MakeSlice(f.Type(), 2, 2)
			for i := 0; i < 2; i++ {
				fill(s.Index(i))
			}
			f.Set(s)
		case reflect.Struct:
			for i := 0; i < f.NumField(); i++ {
				if f.Type().Field(i).IsExported() {
					fill(f.Field(i))
				}
			}
		default:
			t.Fatalf("fillFull: no filler for %s", f.Type())
		}
	}
	fill(v)
}

// awkwardJSONMember has text encoding/json escapes and numbers it writes
// in exponent form.
func awkwardJSONMember() Member {
	return Member{ID: "M<1>&\"q\"", Layer: "tab\there\nline", Handle: "bad \xff byte", Zone: "ZÖNE \u2028 sep",
		Source: "plan.dxf:1 (handle 2A)", Start: [2]float64{1e-7, -2e21}, End: [2]float64{123456789.125, -0.0000015},
		LengthIn: 1e21, SpansIn: []float64{5e-324}, Messages: []string{"a\u0001b", "☃"}, Info: []string{"<info>"},
		BlockingSteps: []BlockingStep{{RowsPerSpan: 1, LuIn: 72.5, CL: 0.59, Ratio: 1.0000000000000002}},
		Status:        StatusFail}
}

// encoderMatchesMarshal encodes members with one memberEncoder and fails
// the test on the first that differs from encoding/json's bytes for the
// same member with its checks' traces left out. It returns the encoder.
func encoderMatchesMarshal(t *testing.T, members []Member) *memberEncoder {
	t.Helper()
	e := newMemberEncoder(layoutV2)
	for i := range members {
		m := memberForJSON(members[i], "C1")
		ref := m
		ref.Checks = nil
		for _, c := range m.Checks {
			c.Trace = nil
			ref.Checks = append(ref.Checks, c)
		}
		if m.Checks != nil && ref.Checks == nil {
			ref.Checks = []Check{}
		}
		want, err := json.Marshal(ref)
		if err != nil {
			t.Fatal(err)
		}
		got, err := e.encode(&m, &members[i])
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(got, want) {
			t.Fatalf("member %d:\n got  %s\n want %s", i, got, want)
		}
	}
	return e
}
