package dxfimport

import "testing"

func TestMatchLayer(t *testing.T) {
	// Case-insensitive globs as PROJECT-FILE.md's [layers] describes
	// (common practice, no source).
	cases := []struct {
		pats  []string
		layer string
		want  bool
	}{
		{[]string{"JOIST*"}, "JOIST-ROOF", true},
		{[]string{"JOIST*"}, "joists", true},
		{[]string{"JOIST*"}, "A-JOIST", false},
		{[]string{"*-JST"}, "floor2-jst", true},
		{[]string{"*-JST"}, "floor2-jst-x", false},
		{[]string{"WALL?"}, "WALL1", true},
		{[]string{"WALL?"}, "WALL12", false},
		{[]string{"A*B*C"}, "AxxBxxBxC", true},
		{[]string{"A*B*C"}, "AxxBxxBxD", false},
		{nil, "JOIST", false},
		{[]string{"MUR*"}, "MURÖ-1", true},
		{[]string{"*"}, "", true},
	}
	for _, c := range cases {
		if got := MatchLayer(c.pats, c.layer); got != c.want {
			t.Errorf("MatchLayer(%q, %q) = %v, want %v", c.pats, c.layer, got, c.want)
		}
	}
}
