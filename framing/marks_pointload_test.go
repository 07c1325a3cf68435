package framing

import "testing"

// TestMarksTellPointLoads: members identical but for a point load drawn on
// one of them are not identical for design (DOMAIN.md "Marks": same loads),
// so they do not share a mark; two members with the same point load at the
// same place do.
func TestMarksTellPointLoads(t *testing.T) {
	p := newPlan().walls(-10, 100, 0, 144).joists(0, 144, 0, 16, 32, 48, 64)
	p.point("POINT-LOAD", 16, 72).text("POINT-LOAD", "P: 1200 D, 800 L", 18, 73, 3)
	p.point("POINT-LOAD", 48, 72).text("POINT-LOAD", "P: 1200 D, 800 L", 50, 73, 3)
	pl := p.group(loadPathOptions())
	AssignMarks(pl)
	mark := func(x float64) string { return pl.Members[memberIndex(t, pl, x, 72)].Mark }
	if mark(16) == mark(32) {
		t.Errorf("joist with a point load shares mark %s with a plain one", mark(16))
	}
	if mark(16) != mark(48) {
		t.Errorf("two joists with the same point load: marks %s and %s", mark(16), mark(48))
	}
}
