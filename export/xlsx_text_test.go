package export

import (
	"strings"
	"testing"
)

// TestAppendXMLText: cell text escaped as XML 1.0 requires (W3C XML 1.0
// section 2.4: & and < escaped, > escaped too by common practice; tab and
// carriage return as character references so they survive attribute-value
// normalisation), plain ASCII copied as it is, and a text longer than a
// cell holds (32,767 UTF-16 units, Excel's limit, from memory: verify) cut.
func TestAppendXMLText(t *testing.T) {
	cases := []struct{ in, want string }{
		{"plan.dxf handle 2A (layer JOIST-FLOOR), 0'-0\", -0'-2 1/4\"", "plan.dxf handle 2A (layer JOIST-FLOOR), 0'-0\", -0'-2 1/4\""},
		{"a&b<c>d", "a&amp;b&lt;c&gt;d"},
		{"x\ty\rz\nw", "x&#x9;y&#xD;z\nw"},
		{"é\x01", "é\uFFFD"},
		{"", ""},
	}
	for _, c := range cases {
		if got := string(appendXMLText(nil, c.in)); got != c.want {
			t.Errorf("appendXMLText(%q) = %q, want %q", c.in, got, c.want)
		}
	}
	long := strings.Repeat("a", maxCellChars+10)
	if got := appendXMLText(nil, long); len(got) != maxCellChars {
		t.Errorf("a text of %d ASCII characters written as %d, want cut to %d", len(long), len(got), maxCellChars)
	}
}
