package export

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"slices"
	"sort"
	"strings"
	"testing"
)

// contractKeys are the key names fixed by issue 5 (results.json contract),
// with schema 2's calculations holding the traces and schema 3's holding
// the checks too (a member names its calculation, and its info lines by
// an id of "info_lists").
var contractKeys = map[string][]string{
	"top": {"schema", "plan", "drawing_units", "members", "calculations", "info_lists", "marks", "blocking_rows", "takeoff", "summary", "assumptions"},
	"member": {"id", "mark", "layer", "handle", "start", "end", "length_in", "bearings_at_in", "spans_in",
		"overhangs_in", "trib_in", "size", "species", "grade", "zone", "calculation", "governing", "max_ratio",
		"blocking_rows_per_span", "blocking_at_in", "status", "messages"},
	"check":       {"kind", "combo", "actual", "allowable", "unit", "ratio"},
	"calculation": {"checks", "factors"},
	"calc check":  {"kind", "combo", "actual", "allowable", "unit", "ratio", "trace"},
	"summary":     {"members", "pass", "fail", "error"},
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
	if top["schema"] != "framecheck-results/3" {
		t.Errorf("schema = %v", top["schema"])
	}
	members := filledMembers(t, top) // with what their marks share
	if len(members) != 4 {
		t.Fatalf("%d members, want 4", len(members))
	}
	calcs := top["calculations"].(map[string]any)
	for i, mm := range members {
		hasKeys(t, "member", mm, contractKeys["member"])
		calc, ok := calcs[mm["calculation"].(string)].(map[string]any)
		if !ok {
			t.Fatalf("member %d: calculation %v not in calculations", i, mm["calculation"])
		}
		hasKeys(t, "calculation", calc, contractKeys["calculation"])
		if _, ok := mm["checks"]; ok {
			t.Errorf("member %d: checks beside the member, want them in its calculation only", i)
		}
		for _, c := range calc["checks"].([]any) {
			hasKeys(t, "check", c.(map[string]any), contractKeys["check"])
			hasKeys(t, "calc check", c.(map[string]any), contractKeys["calc check"])
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
	// ReadJSON gives back the same Results, traces and factors in place.
	back, err := ReadJSON(path)
	if err != nil {
		t.Fatal(err)
	}
	for i := range back.Members {
		if back.Members[i].Calculation == "" {
			t.Errorf("member %d has no calculation", i)
		}
		back.Members[i].Calculation = ""
	}
	r.Schema = Schema
	a, _ := json.Marshal(r)
	b, _ := json.Marshal(back)
	if string(a) != string(b) {
		t.Errorf("round trip changed the results:\n%s\n%s", a, b)
	}
}

// TestWriteJSONTracesOnce: members checked alike (sharing their checks
// slice, as the command hands them over) get one calculation, written
// once; a member checked differently gets its own. Common practice, no
// source.
func TestWriteJSONTracesOnce(t *testing.T) {
	r := loadFixture(t)
	shared := r.Members[0]
	var many []Member
	for i := 0; i < 50; i++ {
		m := shared
		m.ID = "S" + string(rune('0'+i%10)) + string(rune('a'+i/10))
		many = append(many, m)
	}
	other := r.Members[3]
	r.Members = append(many, other)
	path := filepath.Join(t.TempDir(), "results.json")
	if err := WriteJSON(path, r); err != nil {
		t.Fatal(err)
	}
	data, _ := os.ReadFile(path)
	var top map[string]any
	if err := json.Unmarshal(data, &top); err != nil {
		t.Fatal(err)
	}
	if calcs := top["calculations"].(map[string]any); len(calcs) != 2 {
		t.Errorf("%d calculations, want 2", len(calcs))
	}
	for i, m := range filledMembers(t, top) {
		want := "C1"
		if i == 50 {
			want = "C2"
		}
		if m["calculation"] != want {
			t.Errorf("member %d: calculation %v, want %q", i, m["calculation"], want)
		}
	}
	if n := strings.Count(string(data), `"trace":`); n != len(shared.Checks)+len(other.Checks) {
		t.Errorf("%d traces written, want %d (each calculation's checks once)", n, len(shared.Checks)+len(other.Checks))
	}
	back, err := ReadJSON(path)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := back.Members[7].Checks[0].Trace, shared.Checks[0].Trace; !slices.Equal(got, want) {
		t.Errorf("member 7's trace read back %v, want %v", got, want)
	}
	if &back.Members[7].Checks[0] != &back.Members[8].Checks[0] {
		t.Error("members of one calculation do not share their checks after ReadJSON")
	}
}

// TestReadJSONErrors: a member whose calculation is missing or does not
// match is an error naming the file and the member; an unknown schema too.
func TestReadJSONErrors(t *testing.T) {
	cases := map[string]string{
		`{"schema":"framecheck-results/2","members":[{"id":"M1","calculation":"C9","checks":[]}],"calculations":{}}`:                                                                  "member M1: calculation \"C9\"",
		`{"schema":"framecheck-results/2","members":[{"id":"M2","calculation":"C1","checks":[{"kind":"shear"}]}],"calculations":{"C1":{"checks":[],"factors":[]}}}`:                   "member M2: 1 checks",
		`{"schema":"framecheck-results/2","members":[{"id":"M3","calculation":"C1","checks":[{"kind":"shear"}]}],"calculations":{"C1":{"checks":[{"kind":"bearing"}],"factors":[]}}}`: "member M3: check 1",
		`{"schema":"framecheck-results/9"}`: "schema",
		`{"schema":`:                        "x.json",
	}
	for in, want := range cases {
		_, err := ParseJSON("x.json", []byte(in))
		if err == nil || !strings.Contains(err.Error(), want) || !strings.Contains(err.Error(), "x.json") {
			t.Errorf("%s: error %v, want one containing %q", in, err, want)
		}
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
	for _, k := range []string{"bearings_at_in", "spans_in", "blocking_rows_per_span", "blocking_at_in", "messages"} {
		if _, ok := m[k].([]any); !ok {
			t.Errorf("%s = %#v, want a list", k, m[k])
		}
	}
	calc := top["calculations"].(map[string]any)[m["calculation"].(string)].(map[string]any)
	for _, k := range []string{"checks", "factors"} {
		if _, ok := calc[k].([]any); !ok {
			t.Errorf("calculation %s = %#v, want a list", k, calc[k])
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
	if !json.Valid(data) {
		t.Fatal("file is not valid JSON")
	}
	back, err := ReadJSON(path)
	if err != nil {
		t.Fatal(err)
	}
	m1, m2 := back.Members[1], back.Members[2]
	if m1.Checks[0].Ratio != 0 || m1.MaxRatio != 0 || m1.Status != StatusError || len(m1.Messages) != 2 {
		t.Errorf("M2 = ratio %v max %v status %q messages %q", m1.Checks[0].Ratio, m1.MaxRatio, m1.Status, m1.Messages)
	}
	if m2.Status != StatusError {
		t.Errorf("M3 status %q, want error", m2.Status)
	}
	// A trace value is not beside the check in the file: the message says
	// where it is.
	if msg := strings.Join(m2.Messages, "\n"); !strings.Contains(msg, "trace[0].value = -Inf (results.json holds it in the member's calculation)") {
		t.Errorf("M3 messages %q: want the trace value's place named", m2.Messages)
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

// TestSanitizeNotedAsSanitize: SanitizeNoted with a note taken earlier
// (NoteFinite) gives what Sanitize gives: the same results when clean,
// the same fields and members put in error when a member or an uplift
// bearing holds a NaN; a note of other results, or of members replaced
// since, is not taken for these. Common practice, no source.
func TestSanitizeNotedAsSanitize(t *testing.T) {
	clean := loadFixture(t)
	if got, fields := SanitizeNoted(clean, NoteFinite(clean)); got != clean || fields != nil {
		t.Errorf("noted clean results = %p %v, want the same pointer and no fields", got, fields)
	}
	poisoned := func() *Results {
		r := loadFixture(t)
		r.Members[1].MaxRatio = math.NaN()
		r.Uplift.Bearings = []UpliftBearing{{Member: r.Members[0].ID, UpliftLb: math.Inf(1)}}
		return r
	}
	want, wantFields := Sanitize(poisoned())
	r := poisoned()
	got, fields := SanitizeNoted(r, NoteFinite(r))
	if !slices.Equal(fields, wantFields) || len(fields) != 2 {
		t.Errorf("noted fields = %q, want %q", fields, wantFields)
	}
	if got.Members[1].Status != StatusError || got.Summary != want.Summary {
		t.Errorf("noted: member status %q, summary %+v; want error and %+v", got.Members[1].Status, got.Summary, want.Summary)
	}
	// a note of clean results says nothing of others
	r = poisoned()
	if _, fields := SanitizeNoted(r, NoteFinite(clean)); !slices.Equal(fields, wantFields) {
		t.Errorf("another's note: fields = %q, want %q", fields, wantFields)
	}
	// nor of these once their members are replaced
	r = loadFixture(t)
	note := NoteFinite(r)
	r.Members = slices.Clone(r.Members)
	r.Members[2].TribIn = math.Inf(-1)
	if _, fields := SanitizeNoted(r, note); len(fields) != 1 {
		t.Errorf("members replaced after the note: fields = %q, want the one -Inf", fields)
	}
	// a zero note is Sanitize
	r = poisoned()
	if _, fields := SanitizeNoted(r, FiniteNote{}); !slices.Equal(fields, wantFields) {
		t.Errorf("zero note: fields = %q, want %q", fields, wantFields)
	}
}

// TestWriteJSONNotedAsWriteJSON: results.json written with a note of its
// results is the file WriteJSON writes, and a NaN noted is still written as
// 0 and reported. Common practice, no source.
func TestWriteJSONNotedAsWriteJSON(t *testing.T) {
	dir := t.TempDir()
	for _, poison := range []bool{false, true} {
		r := loadFixture(t)
		if poison {
			r.Members[1].MaxRatio = math.NaN()
		}
		a, b := filepath.Join(dir, "a.json"), filepath.Join(dir, "b.json")
		errA, errB := WriteJSON(a, r), WriteJSONNoted(b, r, NoteFinite(r))
		if (errA == nil) != (errB == nil) || (errA != nil && errA.(*NonFiniteError).Fields[0] != errB.(*NonFiniteError).Fields[0]) {
			t.Errorf("poison %v: errors %v and %v", poison, errA, errB)
		}
		da, _ := os.ReadFile(a)
		db, _ := os.ReadFile(b)
		if len(da) == 0 || !bytes.Equal(da, db) {
			t.Errorf("poison %v: the files differ (%d and %d bytes)", poison, len(da), len(db))
		}
	}
}

// TestLoadPathFiniteSeesEveryField: Sanitize's typed look at the load
// path finds a NaN in every float64 of a LoadPath, one at a time (those
// results.json leaves out too), on a load path with every field set (a
// field added to the load path's types and not to loadPathFinite fails
// here); Sanitize then names what walking all of it names. Common
// practice, no source.
func TestLoadPathFiniteSeesEveryField(t *testing.T) {
	full := func() *LoadPath {
		var lp LoadPath
		fillFull(t, reflect.ValueOf(&lp).Elem())
		return &lp
	}
	if !loadPathFinite(full()) {
		t.Fatal("a load path of finite numbers is reported non-finite")
	}
	paths := floatLeaves(reflect.ValueOf(full()).Elem(), false)
	if len(paths) < 50 {
		t.Fatalf("only %d numbers found in a full load path", len(paths))
	}
	for _, path := range paths {
		lp := full()
		leafAt(reflect.ValueOf(lp).Elem(), path).SetFloat(math.Inf(1))
		if loadPathFinite(lp) {
			t.Errorf("+Inf at field path %v not seen", path)
		}
		// Sanitize names what the whole reflective walk names (nothing
		// for a field results.json leaves out)
		r := loadFixture(t)
		r.LoadPath = lp
		_, fields := Sanitize(r)
		var slow []string
		sanitizeValue(reflect.ValueOf(*r), nil, &slow, map[cleanSlice]bool{})
		if !slices.Equal(fields, slow) {
			t.Errorf("+Inf at field path %v: Sanitize names %q, the whole walk %q", path, fields, slow)
		}
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

// TestMembersFiniteSeesEveryField: Sanitize's typed fast path finds a NaN
// in every float64 of a Member that reaches results.json, one at a time,
// on a member with every field set (a field added to Member and not to
// membersFinite fails here). Common practice, no source.
func TestMembersFiniteSeesEveryField(t *testing.T) {
	if !membersFinite([]Member{fullMember(t)}) {
		t.Fatal("a member of finite numbers is reported non-finite")
	}
	// Count the float64 leaves that reach the JSON, then poison each.
	paths := floatLeaves(reflect.ValueOf(fullMember(t)), true)
	if len(paths) < 20 {
		t.Fatalf("only %d numbers found in a full member", len(paths))
	}
	for _, path := range paths {
		m := fullMember(t)
		leafAt(reflect.ValueOf(&m).Elem(), path).SetFloat(math.NaN())
		if membersFinite([]Member{m}) {
			t.Errorf("NaN at field path %v not seen", path)
		}
		if _, fields := Sanitize(&Results{Members: []Member{m}}); len(fields) != 1 {
			t.Errorf("NaN at field path %v: Sanitize reports %v", path, fields)
		}
	}
}
