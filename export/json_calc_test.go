package export

import (
	"encoding/json"
	"math"
	"math/rand/v2"
	"testing"
)

// TestCalculationEncoderMatchesMarshal: results.json's calculations are
// written byte for byte as encoding/json writes them (the library is the
// reference): empty and nil lists, every optional trace field, strings
// that JSON and HTML escaping touch, numbers in exponent form; a number
// that is not finite is refused, as encoding/json refuses it. Common
// practice, no source.
func TestCalculationEncoderMatchesMarshal(t *testing.T) {
	texts := []string{"", "CL", "M<1>&\"q\"", "tab\there", "bad \xff byte", "ZÖNE \u2028", "☃", "NDS 2018 3.3.3"}
	nums := []float64{0, -0.5, 1e-7, 2e21, 123456.125, -0.0000015, 5e-324, 1.0000000000000002, 42}
	rng := rand.New(rand.NewPCG(18, 17))
	pick := func() string { return texts[rng.IntN(len(texts))] }
	num := func() float64 { return nums[rng.IntN(len(nums))] }
	items := func() []TraceItem {
		switch rng.IntN(4) {
		case 0:
			return nil
		case 1:
			return []TraceItem{}
		}
		ts := make([]TraceItem, 1+rng.IntN(4))
		for i := range ts {
			ts[i] = TraceItem{Name: pick(), Value: num(), Unit: pick(), Source: pick(), Formula: pick(), Subst: pick()}
		}
		return ts
	}
	var cases []Calculation
	cases = append(cases, Calculation{}, Calculation{Checks: []CalcCheck{}, Factors: []TraceItem{}})
	for range 300 {
		c := Calculation{Factors: items()}
		if rng.IntN(5) > 0 {
			c.Checks = make([]CalcCheck, rng.IntN(4))
			for i := range c.Checks {
				c.Checks[i] = CalcCheck{Kind: pick(), Combo: pick(), Actual: num(), Allowable: num(), Unit: pick(), Ratio: num(), Trace: items()}
			}
		}
		cases = append(cases, c)
	}
	for i, c := range cases {
		want, err := json.Marshal(c)
		if err != nil {
			t.Fatal(err)
		}
		got, ok := appendCalculation(nil, &c)
		if !ok || string(got) != string(want) {
			t.Fatalf("case %d: ok %v\n got %s\nwant %s", i, ok, got, want)
		}
	}
	for _, bad := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		c := Calculation{Checks: []CalcCheck{{Kind: "shear", Trace: []TraceItem{{Name: "V", Value: bad}}}}}
		if _, ok := appendCalculation(nil, &c); ok {
			t.Errorf("%v: taken", bad)
		}
		if _, err := json.Marshal(c); err == nil {
			t.Errorf("%v: encoding/json took it", bad)
		}
	}
}
