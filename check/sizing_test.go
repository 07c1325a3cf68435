package check

import "testing"

// TestSize_DepthAgainstBlocking sizes the uplift roof joist of
// TestUplift_BlockingRows: 2x8 fails outright, 2x10 passes with three rows
// a span and 2x12 with two. With a light blocking weight the 2x10 is the
// economical choice; with a heavy one the deeper 2x12 (common practice, no
// source: the cost rule is framecheck's own).
func TestSize_DepthAgainstBlocking(t *testing.T) {
	m := upliftRafter("")
	s := DefaultSettings()
	cands := []string{"2x8", "2x10", "2x12"}
	light := Size(m, s, cands, 2)
	if len(light.Alternatives) != 3 || light.Alternatives[0].Pass || !light.Alternatives[1].Pass || !light.Alternatives[2].Pass {
		t.Fatalf("alternatives %+v", light.Alternatives)
	}
	r10, r12 := light.Alternatives[1].RowsPerSpan, light.Alternatives[2].RowsPerSpan
	if r12 >= r10 {
		t.Fatalf("rows 2x10 %d, 2x12 %d: want fewer rows for the deeper joist", r10, r12)
	}
	// Cost = bf/ft x 18 ft + rows x weight: 2x10 = 30 + 2 r10, 2x12 = 36 + 2 r12.
	expectNear(t, "2x10 cost", light.Alternatives[1].Cost, 20.0/12*18+float64(r10)*2, 1e-9, 0, "cost rule in Size's doc comment")
	if light.Chosen.Size != "2x10" || light.Chosen.Status != StatusPass {
		t.Errorf("light blocking: chose %s (%s), want 2x10", light.Chosen.Size, light.Chosen.Status)
	}
	heavy := Size(m, s, cands, 10)
	if heavy.Chosen.Size != "2x12" {
		t.Errorf("heavy blocking: chose %s, want 2x12 (alternatives %+v)", heavy.Chosen.Size, heavy.Alternatives)
	}
	none := Size(m, s, []string{"2x6", "2x8"}, 2)
	if none.Chosen.Status != StatusFail || none.Chosen.Size != "2x8" {
		t.Errorf("no passing size: chose %s (%s), want the closest, 2x8, failing", none.Chosen.Size, none.Chosen.Status)
	}
	bad := Size(m, s, []string{"2x9"}, 2)
	if bad.Chosen.Status != StatusError || bad.Alternatives[0].Pass {
		t.Errorf("bad candidate: %+v", bad)
	}
	if def := Size(m, s, nil, 2); len(def.Alternatives) != len(DefaultCandidates) {
		t.Errorf("default candidates: %d alternatives", len(def.Alternatives))
	}
}
