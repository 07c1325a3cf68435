package export

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// results.json written with its head prepared before the load path and
// the notes were known is the file written at once from the finished
// results, byte for byte (the members' calculations numbered first, the
// load path's after them); a head prepared for other members, or from a
// member holding a value that is not finite, is not used.
func TestWriteJSONWithPreparedHead(t *testing.T) {
	dir := t.TempDir()
	plain, with := filepath.Join(dir, "plain.json"), filepath.Join(dir, "with.json")
	same := func(t *testing.T, r *Results, prep *JSONPrep) {
		t.Helper()
		if err := WriteJSON(plain, r); err != nil {
			t.Fatal(err)
		}
		if err := WriteJSONWith(with, r, prep); err != nil {
			t.Fatal(err)
		}
		a, _ := os.ReadFile(plain)
		b, _ := os.ReadFile(with)
		if !bytes.Equal(a, b) {
			t.Fatalf("prepared head gives another file (%d bytes, %d at once)", len(b), len(a))
		}
	}
	for _, base := range []*Results{loadFixture(t), bigResults(500)} {
		r := *base
		r.LoadPath, r.Assumptions = nil, Assumptions{}
		prep := PrepareJSON(&r)
		// what a run sets once its load path is solved
		r.LoadPath = refsLoadPath()
		r.Assumptions = base.Assumptions
		r.Assumptions.Notes = append(r.Assumptions.Notes, "a note known late")
		same(t, &r, prep)
		if !strings.Contains(string(mustRead(t, with)), `"load_path"`) {
			t.Fatal("no load path written")
		}
		// the encoding goes on once: the same prep again starts afresh
		same(t, &r, prep)

		other := r
		other.Members = append([]Member(nil), r.Members...)
		prep = PrepareJSON(&other)
		r.Members[0].Mark = "J999"
		same(t, &r, prep)
	}
	// a value that is not finite: Sanitize's copy is written, not the head
	r := *bigResults(50)
	r.Members[3].MaxRatio = math.NaN()
	prep := PrepareJSON(&r)
	if err := WriteJSONWith(with, &r, prep); err == nil {
		t.Fatal("a NaN written without a NonFiniteError")
	}
	if err := WriteJSON(plain, &r); err == nil {
		t.Fatal("a NaN written without a NonFiniteError")
	}
	if !bytes.Equal(mustRead(t, plain), mustRead(t, with)) {
		t.Fatal("a head prepared from a NaN was used")
	}
}

// The head ends with the members: the calculations and every field after
// them are the tail's.
func TestPreparedHeadEndsWithMembers(t *testing.T) {
	r := bigResults(20)
	p := PrepareJSON(r).headFor(r.Members)
	if p == nil {
		t.Fatal("not prepared")
	}
	head := string(p.head)
	if !strings.Contains(head, `"members": [`) || strings.Contains(head, `"calculations"`) || !strings.HasSuffix(strings.TrimSpace(head), "]") {
		t.Fatalf("head does not end with the members: ...%s", head[max(0, len(head)-200):])
	}
}

func mustRead(t *testing.T, path string) []byte {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return b
}
