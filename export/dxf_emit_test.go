package export

import (
	"bufio"
	"bytes"
	"regexp"
	"testing"
)

// TestAppendDXFNum: numbers we write into a drawing carry the digits they
// hold, to 1e-6 of the drawing unit. Expected strings written out by hand
// (decimal rounding; common practice, no source).
func TestAppendDXFNum(t *testing.T) {
	cases := []struct {
		v    float64
		want string
	}{
		{1.7999999999999998, "1.8"}, {3.5999999999999996, "3.6"}, {120, "120"}, {-2.25, "-2.25"},
		{56.0 / 12, "4.666667"}, {-1.1102230246251565e-16, "0"}, {0, "0"}, {39104.00000000001, "39104"},
		{0.1 + 0.2, "0.3"}, {-0.0000004, "0"}, {1234.5678915, "1234.567892"},
	}
	for _, c := range cases {
		if got := string(appendDXFNum(nil, c.v)); got != c.want {
			t.Errorf("appendDXFNum(%v) = %s, want %s", c.v, got, c.want)
		}
	}
	buf := make([]byte, 0, 64)
	if n := testing.AllocsPerRun(100, func() { buf = appendDXFNum(buf[:0], 1.7999999999999998) }); n != 0 {
		t.Errorf("appendDXFNum allocates %v times", n)
	}
}

// TestMarkupNumbersCarryTheirDigits: every number of the markup written
// for the fixture (label heights, positions along members, the key) has
// at most 6 decimals, in feet as in inches.
func TestMarkupNumbersCarryTheirDigits(t *testing.T) {
	long := regexp.MustCompile(`(?m)^-?[0-9]+\.[0-9]{7,}\r?$`)
	for _, k := range []float64{1, 12, 1 / 25.4} {
		m := fixtureMarkup(t, k)
		var out bytes.Buffer
		w := bufio.NewWriter(&out)
		e := &dxfEmitter{w: w, eol: "\n"}
		e.markup(&m, map[string]int{})
		w.Flush()
		if out.Len() == 0 {
			t.Fatal("no markup written")
		}
		if s := long.Find(out.Bytes()); s != nil {
			t.Errorf("inches per unit %v: number %q carries more than 6 decimals", k, s)
		}
	}
}

// TestAppendCodeLine: group codes right-aligned in three columns, as the
// DXF Reference's examples (and AutoCAD's files) write them.
func TestAppendCodeLine(t *testing.T) {
	for code, want := range map[int]string{0: "  0\r\n", 5: "  5\r\n", 10: " 10\r\n", 100: "100\r\n", 1071: "1071\r\n", -1: " -1\r\n"} {
		if got := string(appendCodeLine([]byte("x"), code, "\r\n")); got != "x"+want {
			t.Errorf("code %d: %q, want %q", code, got, "x"+want)
		}
	}
}
