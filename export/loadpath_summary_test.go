package export

import "testing"

// TestLoadPathSummary: the one-line count says how the checked posts
// came out, as it does for the beams (a post in error is never counted as
// merely "checked"), and how many were not checked.
func TestLoadPathSummary(t *testing.T) {
	lp := &LoadPath{
		Beams: []PathBeam{{ID: "B1", Status: StatusPass}, {ID: "B2", Status: StatusFail}},
		Posts: []PathPost{{ID: "P1", Checked: true, Status: StatusPass}, {ID: "P2", Checked: true, Status: StatusError},
			{ID: "P3"}},
	}
	want := "2 beams: 1 pass, 1 fail, 0 error; 2 posts checked: 1 pass, 0 fail, 1 error; 1 posts not checked (no size or height given)"
	if got := LoadPathSummary(lp); got != want {
		t.Errorf("LoadPathSummary:\n got %q\nwant %q", got, want)
	}
}
