package export

import (
	"bytes"
	"math"
	"math/rand"
	"os"
	"path/filepath"
	"slices"
	"testing"
)

// rtTexts are strings JSON escapes or copies as they are; all valid UTF-8,
// so they read back unchanged.
var rtTexts = []string{"", "a", "D+L", "\u2028", "x\u2029", "<&>", "\x00", "\x7f", "é", "😀", "\"\\", "\t\n\r", "\ufffd"}

// rtNumbers are floats at the edges of encoding/json's two formats.
var rtNumbers = []float64{0, math.Copysign(0, -1), 1e-6, 9.99e-7, 1e-7, 1e21, 9.99e20, -1e21, 5e-324,
	math.MaxFloat64, -1e-10, 123456789, 0.1, 1.0 / 3}

// rtMembers returns n members drawn at random from a fixed seed: some share
// one checks slice (whole, or cut shorter), some share one factor list,
// some have their own checks, some none at all (error members), with nil
// and empty lists mixed.
func rtMembers(n int) []Member {
	r := rand.New(rand.NewSource(7))
	str := func() string {
		s := ""
		for i := r.Intn(3); i > 0; i-- {
			s += rtTexts[r.Intn(len(rtTexts))]
		}
		return s
	}
	num := func() float64 { return rtNumbers[r.Intn(len(rtNumbers))] }
	nums := func() []float64 {
		switch r.Intn(3) {
		case 0:
			return nil
		case 1:
			return []float64{}
		}
		return []float64{num(), num()}
	}
	trace := func() []TraceItem {
		if r.Intn(3) == 0 {
			return nil
		}
		return []TraceItem{{Name: str(), Value: num(), Unit: str(), Source: str(), Formula: str(), Subst: str()}}
	}
	shared := []Check{{Kind: KindBendingTop, Combo: "D+L", Actual: 1, Allowable: 2, Unit: "psi", Ratio: 0.5, Trace: trace()},
		{Kind: KindShear, Combo: "D+L", Ratio: 0.25, Trace: trace()}, {Kind: KindBearing, Ratio: 0.125}}
	factors := []TraceItem{{Name: "CD", Value: 1.25, Formula: "D+L"}, {Name: "CF", Value: 1.1}}
	ms := make([]Member, n)
	for i := range ms {
		m := Member{ID: str(), Mark: str(), Layer: str(), Handle: str(), Source: str(),
			Start: [2]float64{num(), num()}, End: [2]float64{num(), num()}, LengthIn: num(),
			BearingsAtIn: nums(), SpansIn: nums(), OverhangsIn: [2]float64{num(), num()}, TribIn: num(), SpacingIn: num(),
			Size: str(), Species: str(), Grade: str(), Zone: str(), Governing: str(), MaxRatio: num(),
			BlockingAtIn: nums(), Status: str()}
		if r.Intn(2) == 0 {
			m.BlockingRowsPerSpan = []int{r.Intn(3), -1}
		}
		if r.Intn(2) == 0 {
			m.BlockingSteps = []BlockingStep{{RowsPerSpan: 1, LuIn: num(), CL: num(), Ratio: num()}}
		}
		if r.Intn(2) == 0 {
			m.Info = []string{str()}
		}
		if r.Intn(2) == 0 {
			m.Messages = []string{str(), str()}
		}
		switch r.Intn(4) {
		case 1:
			m.Checks = shared
		case 2:
			m.Checks = shared[:r.Intn(len(shared)+1)]
		case 3:
			m.Checks = []Check{{Kind: str(), Combo: str(), Actual: num(), Allowable: num(), Unit: str(), Ratio: num(), Trace: trace()}}
		}
		if r.Intn(2) == 0 {
			m.Factors = factors
		}
		ms[i] = m
	}
	return ms
}

// TestMemberEncoderMatchesMarshalRandom holds the member encoder to
// encoding/json (the reference) on many members drawn at random, with
// every list nil, empty or set and numbers at the edges of the two float
// formats. Common practice, no source.
func TestMemberEncoderMatchesMarshalRandom(t *testing.T) {
	members := rtMembers(5000) // kept alive: the encoder caches by slice address
	encoderMatchesMarshal(t, members)
}

// TestJSONRoundTripSharedSlices: what WriteJSON writes, ReadJSON reads
// back with every member's checks, traces and factors as they were, for
// members sharing a checks slice whole or cut shorter, members with
// factors and no checks, and error members with neither; written again,
// the file is the same byte for byte. Common practice, no source.
func TestJSONRoundTripSharedSlices(t *testing.T) {
	dir := t.TempDir()
	r := &Results{Plan: "p.dxf", DrawingUnits: "in", Members: rtMembers(400)}
	first := filepath.Join(dir, "first.json")
	if err := WriteJSON(first, r); err != nil {
		t.Fatal(err)
	}
	back, err := ReadJSON(first)
	if err != nil {
		t.Fatal(err)
	}
	if len(back.Members) != len(r.Members) {
		t.Fatalf("%d members read back, want %d", len(back.Members), len(r.Members))
	}
	// Numbers come back as schema 3 writes them: rounded to SigDigits
	// significant digits (json_num.go).
	rounded := func(ts []TraceItem) []TraceItem {
		out := slices.Clone(ts)
		for i := range out {
			out[i].Value = round6(out[i].Value)
		}
		return out
	}
	sameItems := func(a, b []TraceItem) bool {
		return len(a) == len(b) && (len(a) == 0 || slices.Equal(a, rounded(b)))
	}
	for i := range r.Members {
		want, got := &r.Members[i], &back.Members[i]
		if len(got.Checks) != len(want.Checks) || !sameItems(got.Factors, want.Factors) {
			t.Fatalf("member %d: %d checks and factors %v read back, want %d and %v",
				i, len(got.Checks), got.Factors, len(want.Checks), want.Factors)
		}
		for j := range want.Checks {
			w, g := want.Checks[j], got.Checks[j]
			if g.Kind != w.Kind || g.Combo != w.Combo || g.Actual != round6(w.Actual) || g.Allowable != round6(w.Allowable) ||
				g.Unit != w.Unit || g.Ratio != round6(w.Ratio) || !sameItems(g.Trace, w.Trace) {
				t.Fatalf("member %d check %d: read back %+v, want %+v", i, j, g, w)
			}
		}
	}
	second := filepath.Join(dir, "second.json")
	if err := WriteJSON(second, back); err != nil {
		t.Fatal(err)
	}
	a, _ := os.ReadFile(first)
	b, _ := os.ReadFile(second)
	if !bytes.Equal(a, b) {
		t.Error("results.json written again from what ReadJSON read differs from the first")
	}
}
