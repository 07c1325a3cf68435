package main

import (
	"strings"
	"testing"
)

// TestTermText: control characters from a drawing reach the terminal
// escaped (issue 15 item 4); plain text is left alone; long text is cut
// with an ellipsis. Expected strings are written out by hand.
func TestTermText(t *testing.T) {
	cases := []struct{ in, want string }{
		{"JOIST-FLOOR", "JOIST-FLOOR"},
		{"étage 梁", "étage 梁"},
		{"A\x1b]0;pwned\x07B", `A\x1b]0;pwned\x07B`},
		{"\x1b[2J\x1b[H", `\x1b[2J\x1b[H`},
		{"x\u202ey", `x\u202ey`},
		{"c1\u009bz", `c1\u009bz`},
		{"bad\xffutf8", `bad\xffutf8`},
		{"two\nlines", "two\nlines"},
		{"del\x7f", `del\x7f`},
	}
	for _, c := range cases {
		if got := termText(c.in); got != c.want {
			t.Errorf("termText(%q) = %q, want %q", c.in, got, c.want)
		}
	}
	if got := termCell("two\nlines", 40); got != `two\x0alines` {
		t.Errorf("termCell newline: %q", got)
	}
	if got := termCell("ABCDEFGHIJ", 5); got != "ABCD…" {
		t.Errorf("termCell cut: %q, want ABCD…", got)
	}
	if got := termCell("ABCDE", 5); got != "ABCDE" {
		t.Errorf("termCell exact width: %q", got)
	}
	if got := termCell("\x1b\x1b\x1b", 6); got != `\x1b…` {
		t.Errorf("termCell escapes count toward the width: %q", got)
	}
	long := strings.Repeat("L", 1<<20)
	if got := termText(long); len(got) > maxTermLine+3 || !strings.HasSuffix(got, "…") {
		t.Errorf("a 1 MB name prints %d bytes", len(got))
	}
}

// Each line of a multi-line message is cut on its own.
func TestTermTextLines(t *testing.T) {
	in := strings.Repeat("x", 3000) + "\nsecond line"
	got := termText(in)
	if !strings.HasSuffix(got, "…\nsecond line") {
		t.Errorf("second line lost: ...%q", got[len(got)-30:])
	}
}
