package check

import (
	"strings"
	"testing"
)

// TestPostWithoutAxialValues: a post is never passed without a check. A
// glulam post (the built-in glulam table holds the bending stress classes
// of NDS 2018 Supplement Table 5A, no Fc; common practice, no source: a
// glulam column is graded by the axially loaded combinations) would make
// Fc* 0 and CP NaN; a height so small that FcE overflows makes CP NaN too.
// Either is an error saying why, never a pass with no check.
func TestPostWithoutAxialValues(t *testing.T) {
	p := Post{ID: "P1", Size: "5.125x6", Species: "Glulam", Grade: "24F-1.8E", HeightIn: 96,
		Loads: PostLoads{DeadLb: 2000, LiveLb: 4000}}
	r := CheckPost(p, DefaultSettings())
	if r.Status != StatusError || len(r.Checks) != 0 || !strings.Contains(strings.Join(r.Messages, " "), "Table 5A") {
		t.Errorf("glulam post: status %s, %d checks, messages %v; want an error naming Table 5A", r.Status, len(r.Checks), r.Messages)
	}

	p = Post{ID: "P2", Size: "6x6", Species: "Douglas Fir-Larch", Grade: "No.1", HeightIn: 1e-300,
		Loads: PostLoads{DeadLb: 2000, LiveLb: 4000}}
	r = CheckPost(p, DefaultSettings())
	if r.Status != StatusError || !strings.Contains(strings.Join(r.Messages, " "), "could not be checked") {
		t.Errorf("post 1e-300 in high: status %s, messages %v; want an error", r.Status, r.Messages)
	}
	// A post in uplift only has no compression to check: it passes, its
	// net uplift left to the connector (ASCE 7-16 2.4.1, 0.6D + 0.6W).
	p.HeightIn, p.Loads = 96, PostLoads{DeadLb: 100, WindUpLb: 2000}
	if r := CheckPost(p, DefaultSettings()); r.Status != StatusPass || r.UpLb <= 0 {
		t.Errorf("uplift-only post: status %s, uplift %v, messages %v", r.Status, r.UpLb, r.Messages)
	}
}
