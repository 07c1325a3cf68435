package export

import (
	"bytes"
	"encoding/json"
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

	e := newMemberEncoder()
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
			t.Errorf("member %d:\n got  %s\n want %s", i, got, want)
		}
	}
	if len(e.cache) == 0 {
		t.Error("shared slices were never cached")
	}
}
