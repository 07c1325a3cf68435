package export

import (
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"slices"
	"sort"
	"strings"
	"testing"
)

// contractKeys are the key names fixed by issue 5 (results.json contract).
var contractKeys = map[string][]string{
	"top": {"schema", "plan", "drawing_units", "members", "marks", "blocking_rows", "takeoff", "summary", "assumptions"},
	"member": {"id", "mark", "layer", "handle", "start", "end", "length_in", "bearings_at_in", "spans_in",
		"overhangs_in", "trib_in", "size", "species", "grade", "zone", "checks", "governing", "max_ratio",
		"blocking_rows_per_span", "blocking_at_in", "status", "messages"},
	"check":   {"kind", "combo", "actual", "allowable", "unit", "ratio", "trace"},
	"summary": {"members", "pass", "fail", "error"},
}

func hasKeys(t *testing.T, what string, obj map[string]any, keys []string) {
	t.Helper()
	for _, k := range keys {
		if _, ok := obj[k]; !ok {
			t.Errorf("%s: key %q missing", what, k)
		}
	}
}

func TestWriteJSONContract(t *testing.T) {
	r := loadFixture(t)
	r.Schema = "" // WriteJSON fills it
	path := filepath.Join(t.TempDir(), "results.json")
	if err := WriteJSON(path, r); err != nil {
		t.Fatal(err)
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var top map[string]any
	if err := json.Unmarshal(data, &top); err != nil {
		t.Fatal(err)
	}
	hasKeys(t, "top level", top, contractKeys["top"])
	if top["schema"] != "framecheck-results/1" {
		t.Errorf("schema = %v", top["schema"])
	}
	members := top["members"].([]any)
	if len(members) != 4 {
		t.Fatalf("%d members, want 4", len(members))
	}
	for i, m := range members {
		mm := m.(map[string]any)
		hasKeys(t, "member", mm, contractKeys["member"])
		for _, c := range mm["checks"].([]any) {
			hasKeys(t, "check", c.(map[string]any), contractKeys["check"])
		}
		if i == 3 {
			if mm["status"] != "fail" || mm["max_ratio"] != 1.12 || mm["governing"] != "bending-bottom" {
				t.Errorf("M4 = %v %v %v, want fail 1.12 bending-bottom", mm["status"], mm["max_ratio"], mm["governing"])
			}
			if s := mm["start"].([]any); s[0] != 0.0 || s[1] != 56.0 {
				t.Errorf("M4 start = %v, want [0 56]", s)
			}
		}
	}
	hasKeys(t, "summary", top["summary"].(map[string]any), contractKeys["summary"])
	// Inch coordinates for the markup stay out of the file.
	if strings.Contains(string(data), "StartIn") || strings.Contains(string(data), "start_in") {
		t.Error("inch coordinates leaked into the JSON")
	}
	// Round trip through the Go types gives the same Results.
	var back Results
	if err := json.Unmarshal(data, &back); err != nil {
		t.Fatal(err)
	}
	r.Schema = Schema
	a, _ := json.Marshal(r)
	b, _ := json.Marshal(&back)
	if string(a) != string(b) {
		t.Error("round trip changed the results")
	}
}

func TestWriteJSONEmptyListsAreArrays(t *testing.T) {
	r := &Results{Members: []Member{{ID: "M1", Status: StatusPass, Checks: []Check{{Kind: KindShear}}}}}
	path := filepath.Join(t.TempDir(), "r.json")
	if err := WriteJSON(path, r); err != nil {
		t.Fatal(err)
	}
	data, _ := os.ReadFile(path)
	if strings.Contains(string(data), "null") {
		t.Errorf("null in output:\n%s", data)
	}
	var top map[string]any
	if err := json.Unmarshal(data, &top); err != nil {
		t.Fatal(err)
	}
	m := top["members"].([]any)[0].(map[string]any)
	for _, k := range []string{"bearings_at_in", "spans_in", "checks", "blocking_rows_per_span", "blocking_at_in", "messages"} {
		if _, ok := m[k].([]any); !ok {
			t.Errorf("%s = %#v, want a list", k, m[k])
		}
	}
}

func TestWriteJSONNonFinite(t *testing.T) {
	r := loadFixture(t)
	r.Members[1].Checks[0].Ratio = math.NaN()
	r.Members[1].MaxRatio = math.Inf(1)
	r.Members[2].Checks[1].Trace = []TraceItem{{Name: "RB", Value: math.Inf(-1)}}
	r.Takeoff.Totals.BoardFeet = math.NaN()
	origMsgs := len(r.Members[1].Messages)

	path := filepath.Join(t.TempDir(), "results.json")
	err := WriteJSON(path, r)
	var nf *NonFiniteError
	if !errors.As(err, &nf) || !errors.Is(err, ErrNonFinite) {
		t.Fatalf("err = %v, want a *NonFiniteError", err)
	}
	want := []string{
		"members[1].checks[0].ratio = NaN",
		"members[1].max_ratio = +Inf",
		"members[2].checks[1].trace[0].value = -Inf",
		"takeoff.totals.board_feet = NaN",
	}
	got := slices.Clone(nf.Fields)
	sort.Strings(got)
	if !slices.Equal(got, want) {
		t.Errorf("fields = %q, want %q", got, want)
	}
	data, rerr := os.ReadFile(path)
	if rerr != nil {
		t.Fatal(rerr)
	}
	var back Results
	if err := json.Unmarshal(data, &back); err != nil {
		t.Fatalf("file is not valid JSON: %v", err)
	}
	m1, m2 := back.Members[1], back.Members[2]
	if m1.Checks[0].Ratio != 0 || m1.MaxRatio != 0 || m1.Status != StatusError || len(m1.Messages) != 2 {
		t.Errorf("M2 = ratio %v max %v status %q messages %q", m1.Checks[0].Ratio, m1.MaxRatio, m1.Status, m1.Messages)
	}
	if m2.Status != StatusError {
		t.Errorf("M3 status %q, want error", m2.Status)
	}
	// The fixture has 3 pass, 1 fail; two passing members became errors.
	if s := back.Summary; s.Pass != 1 || s.Fail != 1 || s.Error != 2 || s.Members != 4 {
		t.Errorf("summary = %+v, want 4 members, 1 pass, 1 fail, 2 error", s)
	}
	// The caller's results are untouched.
	if !math.IsNaN(r.Members[1].Checks[0].Ratio) || r.Members[1].Status != StatusPass || len(r.Members[1].Messages) != origMsgs {
		t.Error("WriteJSON modified its argument")
	}
}

func TestSanitizeCleanReturnsSame(t *testing.T) {
	r := loadFixture(t)
	got, fields := Sanitize(r)
	if got != r || fields != nil {
		t.Errorf("Sanitize of clean results = %p %v, want the same pointer and no fields", got, fields)
	}
}

func TestWriteJSONRefusesDrawingPath(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "plan.DXF")
	if err := os.WriteFile(path, []byte("drawing"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := WriteJSON(path, loadFixture(t)); !errors.Is(err, ErrSameFile) {
		t.Fatalf("err = %v, want ErrSameFile", err)
	}
	if err := WriteXLSX(path, loadFixture(t)); !errors.Is(err, ErrSameFile) {
		t.Fatalf("xlsx err = %v, want ErrSameFile", err)
	}
	if b, _ := os.ReadFile(path); string(b) != "drawing" {
		t.Error("drawing was overwritten")
	}
}
