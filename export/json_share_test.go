package export

import (
	"bufio"
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strconv"
	"strings"
	"testing"
)

// shareResults is a small plan in millimetres: mark J1 of three joists
// alike but for the last one's tributary width, mark J2 of one, a member
// whose source names another file and one whose location was given by
// hand, a member without a location, and uplift at bearings with and
// without a support handle.
func shareResults() *Results {
	base := Member{Mark: "J1", Layer: "JOISTS", Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2",
		Zone: "FLOOR", LengthIn: 124.50000000000001, BearingsAtIn: []float64{2.25, 122.25}, SpansIn: []float64{120},
		TribIn: 16, SpacingIn: 16, DatumIn: 5, Governing: KindBendingTop, MaxRatio: 0.42704813,
		BlockingAtIn: []float64{}, BlockingRowsPerSpan: []int{}, Status: StatusPass, Messages: []string{}}
	mk := func(id, handle string, line int, x float64) Member {
		m := base
		m.ID, m.Handle = id, handle
		m.Source = sourceText("plans/level 2.dxf", line, handle, m.Layer)
		m.Start = [2]float64{x, -57.15}
		m.End = [2]float64{x, 3105.15}
		in := func(p [2]float64) [2]float64 { return [2]float64{p[0] / 25.4, p[1] / 25.4} }
		m.Location = locationText("plans/level 2.dxf", handle, line, m.Layer, in(m.Start), in(m.End))
		return m
	}
	ms := []Member{mk("M1", "2A", 807, 0), mk("M2", "2B", 831, 406.4), mk("M3", "2C", 855, 812.8),
		mk("M4", "", 879, 1219.2), mk("M5", "2E", 903, 1625.6), mk("M6", "2F", 927, 2032)}
	ms[2].TribIn = 8                                                // J1 alike but for this
	ms[3].Mark = "J2"                                               // no handle: "line 879" in its location
	ms[4].Mark, ms[4].Source = "J3", "other.dxf:903 (layer JOISTS)" // another file: kept
	ms[5].Mark, ms[5].Location = "J3", "by hand"                    // not derivable: kept
	ms[1].Location = ""                                             // none: written as ""
	return &Results{Plan: "level 2.dxf", DrawingUnits: "mm", Members: ms,
		Marks: []Mark{{Mark: "J1", Count: 3}, {Mark: "J2", Count: 1}, {Mark: "J3", Count: 2}},
		Uplift: UpliftReport{ReportLb: 50, Bearings: []UpliftBearing{
			{Member: "M1", Mark: "J1", Bearing: 1, Support: "WALL handle 9", SupportLayer: "WALL", SupportHandle: "9",
				AtIn: -0.7500000000000001, FromFaceIn: 1e-15, Point: [2]float64{5328, -1.1102230246251565e-16},
				UpliftLb: 96.00000000000001, Combo: "0.6D+0.6W(up)", CD: 1.6, Flagged: true},
			{Member: "M4", Mark: "J9", Bearing: 2, Support: "WALL line 40", SupportLayer: "WALL", UpliftLb: 3, CD: 1.6},
		}},
		Takeoff: Takeoff{Totals: TakeoffTotals{BoardFeet: 2921764.333333288}}}
}

// TestWriteJSONShares: what members of a mark have alike is in the mark's
// "shared" and not in the members; a member's source is its "line" when
// that gives it back, its location absent when derivable; an uplift
// bearing's mark and support absent when derivable; and ReadJSON gives
// back every member and bearing as it was (numbers as schema 3 rounds
// them). Expected texts follow docs/RESULTS-SCHEMA.md; common practice,
// no source.
func TestWriteJSONShares(t *testing.T) {
	r := shareResults()
	path := filepath.Join(t.TempDir(), "results.json")
	if err := WriteJSON(path, r); err != nil {
		t.Fatal(err)
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var top struct {
		SourceFile string                       `json:"source_file"`
		Members    []map[string]any             `json:"members"`
		Marks      []map[string]json.RawMessage `json:"marks"`
		Uplift     struct {
			Bearings []map[string]any `json:"bearings"`
		} `json:"uplift"`
	}
	if err := json.Unmarshal(data, &top); err != nil {
		t.Fatal(err)
	}
	if top.SourceFile != "plans/level 2.dxf" {
		t.Errorf("source_file %q", top.SourceFile)
	}
	var shared map[string]any
	if err := json.Unmarshal(top.Marks[0]["shared"], &shared); err != nil {
		t.Fatalf("mark J1: shared %s: %v", top.Marks[0]["shared"], err)
	}
	for _, k := range []string{"layer", "size", "species", "grade", "zone", "length_in", "spans_in", "spacing_in", "max_ratio", "status", "messages"} {
		if _, ok := shared[k]; !ok {
			t.Errorf("mark J1 does not share %q: %v", k, shared)
		}
	}
	for _, k := range []string{"trib_in", "id", "handle", "start", "end", "line", "location"} {
		if _, ok := shared[k]; ok {
			t.Errorf("mark J1 shares %q", k)
		}
	}
	if shared["length_in"] != 124.5 || shared["max_ratio"] != 0.427048 {
		t.Errorf("mark J1 shares length %v, ratio %v; want 124.5 and 0.427048", shared["length_in"], shared["max_ratio"])
	}
	if sh, ok := top.Marks[1]["shared"]; ok {
		t.Errorf("mark J2 of one member shares %s", sh)
	}
	m1, m2, m3 := top.Members[0], top.Members[1], top.Members[2]
	if _, ok := m1["size"]; ok {
		t.Errorf("M1 writes the size its mark shares: %v", m1)
	}
	if m1["trib_in"] != 16.0 || m3["trib_in"] != 8.0 {
		t.Errorf("trib_in %v and %v, want each member's own", m1["trib_in"], m3["trib_in"])
	}
	if m1["line"] != 807.0 || m1["source"] != nil || m1["location"] != nil {
		t.Errorf("M1: line %v, source %v, location %v; want 807 and neither", m1["line"], m1["source"], m1["location"])
	}
	if loc, ok := m2["location"]; !ok || loc != "" {
		t.Errorf("M2 has no location: want \"location\": \"\", got %v", m2)
	}
	m4, m5, m6 := top.Members[3], top.Members[4], top.Members[5]
	if m4["line"] != 879.0 || m4["location"] != nil {
		t.Errorf("M4 (no handle): %v", m4)
	}
	if m5["source"] != "other.dxf:903 (layer JOISTS)" || m5["line"] != nil {
		t.Errorf("M5 (another file): %v", m5)
	}
	if m6["location"] != "by hand" {
		t.Errorf("M6 (location by hand): %v", m6)
	}
	b0, b1 := top.Uplift.Bearings[0], top.Uplift.Bearings[1]
	if _, ok := b0["mark"]; ok {
		t.Errorf("bearing 1 writes its member's mark: %v", b0)
	}
	if _, ok := b0["support"]; ok {
		t.Errorf("bearing 1 writes a support its layer and handle give: %v", b0)
	}
	if b1["mark"] != "J9" || b1["support"] != "WALL line 40" {
		t.Errorf("bearing 2 must keep its own mark and support: %v", b1)
	}
	for _, want := range []string{`"at_in":-0.75,`, `"from_face_in":0,`, `"point":[5328,0]`, `"uplift_lb":96,`, `"board_feet":2921764.333333}`} {
		if !strings.Contains(string(data), want) {
			t.Errorf("results.json lacks %s", want)
		}
	}

	back, err := ReadJSON(path)
	if err != nil {
		t.Fatal(err)
	}
	for i := range r.Members {
		want := r.Members[i]
		want.LengthIn = 124.5
		want.MaxRatio = 0.427048
		want.Checks = []Check{}
		if !reflect.DeepEqual(back.Members[i], want) {
			t.Errorf("member %d read back\n %+v\nwant\n %+v", i, back.Members[i], want)
		}
	}
	wantUp := r.Uplift
	wantUp.Bearings = append([]UpliftBearing{}, r.Uplift.Bearings...)
	wantUp.Bearings[0].AtIn, wantUp.Bearings[0].FromFaceIn, wantUp.Bearings[0].Point[1], wantUp.Bearings[0].UpliftLb = -0.75, 0, 0, 96
	if !reflect.DeepEqual(back.Uplift, wantUp) {
		t.Errorf("uplift read back\n %+v\nwant\n %+v", back.Uplift, wantUp)
	}
	if math.Abs(back.Takeoff.Totals.BoardFeet-2921764.333333) > 1e-9 {
		t.Errorf("board feet read back %v", back.Takeoff.Totals.BoardFeet)
	}
}

// TestShareEqImpliesSameBytes: wherever shareEq calls a field of two
// members alike, the encoder writes that field alike, for a member with
// every field set and each of its values changed in turn (a field whose
// comparison missed a value would be left out of a member whose value
// differs). Every shareable field the encoder writes has a comparison.
// Common practice, no source.
func TestShareEqImpliesSameBytes(t *testing.T) {
	type enc struct {
		b     []byte
		spans map[string]string
	}
	encodeShared := func(m *Member) (shareItem, enc) {
		e := newMemberEncoder(layoutV3)
		e.shareOnly = true
		calcs := newCalcTable()
		it := shareItem{m: m, calc: calcs.id(m)}
		if len(m.Info) > 0 {
			it.info = e.infos.id(m.Info)
		}
		jm := memberForJSON(*m, it.calc)
		b, err := e.encode(&jm, m)
		if err != nil {
			t.Fatal(err)
		}
		out := enc{b: append([]byte(nil), b...), spans: map[string]string{}}
		for _, f := range e.spans {
			out.spans[f.name] = string(b[f.start:f.end])
		}
		return it, out
	}
	full := fullMember(t)
	_, e0 := encodeShared(&full)
	for name := range e0.spans {
		if !unsharedKeys[name] && shareEq[name] == nil {
			t.Errorf("field %q is written and shareable but has no comparison in shareEq", name)
		}
	}
	var paths [][]int
	var walk func(v reflect.Value, path []int)
	walk = func(v reflect.Value, path []int) {
		switch v.Kind() {
		case reflect.String, reflect.Float64, reflect.Int, reflect.Bool:
			paths = append(paths, append([]int(nil), path...))
		case reflect.Struct:
			for i := 0; i < v.NumField(); i++ {
				if f := v.Type().Field(i); f.IsExported() {
					walk(v.Field(i), append(path, i))
				}
			}
		case reflect.Slice, reflect.Array:
			for i := 0; i < v.Len(); i++ {
				walk(v.Index(i), append(path, i))
			}
		}
	}
	walk(reflect.ValueOf(full), nil)
	if len(paths) < 40 {
		t.Fatalf("only %d values found in a full member", len(paths))
	}
	for _, path := range append(paths, nil) {
		a, b := fullMember(t), fullMember(t)
		v := reflect.ValueOf(&b).Elem()
		for _, i := range path {
			if v.Kind() == reflect.Struct {
				v = v.Field(i)
			} else {
				v = v.Index(i)
			}
		}
		switch v.Kind() {
		case reflect.String:
			v.SetString(v.String() + "x")
		case reflect.Float64:
			v.SetFloat(v.Float() + 1)
		case reflect.Int:
			v.SetInt(v.Int() + 1)
		case reflect.Bool:
			v.SetBool(!v.Bool())
		}
		ia, ea := encodeShared(&a)
		ib, eb := encodeShared(&b)
		for name, eq := range shareEq {
			if eq(&ia, &ib) && ea.spans[name] != eb.spans[name] {
				t.Errorf("value path %v: shareEq calls %q alike, written %s and %s", path, name, ea.spans[name], eb.spans[name])
			}
		}
	}
}

// TestSharedSameValuesAsSchema2Random: members drawn at random (texts JSON
// escapes, numbers at the edges of the formats, nil and empty lists) in a
// few marks, some copies of one another but for a field or two, written
// as schema 2 (every field in every member) and as schema 3 (what a mark's
// members share in the mark) and read back, are the same member by member;
// written again from what was read, schema 3 gives the same bytes. Common
// practice, no source.
func TestSharedSameValuesAsSchema2Random(t *testing.T) {
	dir := t.TempDir()
	ms := rtMembers(900)
	for i := range ms {
		ms[i].Mark = "J" + strconv.Itoa(i%4)
		if i%3 != 0 && i >= 4 { // most a copy of an earlier one of their mark, changed a little
			id, handle, start := ms[i].ID, ms[i].Handle, ms[i].Start
			ms[i] = ms[i-4]
			ms[i].ID, ms[i].Handle, ms[i].Start = id, handle, start
			if i%5 == 0 {
				ms[i].TribIn += 1
			}
		}
		if i%7 == 0 {
			ms[i].Source = sourceText("p.dxf", i+1, ms[i].Handle, ms[i].Layer)
		}
	}
	r := &Results{Plan: "p.dxf", DrawingUnits: "ft", Members: ms,
		Marks: []Mark{{Mark: "J0"}, {Mark: "J1"}, {Mark: "J2"}, {Mark: "J3"}, {Mark: "J1"}}}
	clean, _ := Sanitize(r)
	v2 := filepath.Join(dir, "v2.json")
	if err := writeAtomic(v2, func(w *bufio.Writer) error { return encodeResults(w, clean, layoutV2) }); err != nil {
		t.Fatal(err)
	}
	v3 := filepath.Join(dir, "v3.json")
	if err := WriteJSON(v3, r); err != nil && !errors.Is(err, ErrNonFinite) {
		t.Fatal(err)
	}
	data, _ := os.ReadFile(v3)
	if !bytes.Contains(data, []byte(`"shared":{`)) {
		t.Fatal("no mark shares anything: the test does not test sharing")
	}
	a, err := ReadJSON(v2)
	if err != nil {
		t.Fatal(err)
	}
	b, err := ReadJSON(v3)
	if err != nil {
		t.Fatal(err)
	}
	for i := range a.Members {
		sameValue(t, "members["+strconv.Itoa(i)+"]", reflect.ValueOf(a.Members[i]), reflect.ValueOf(b.Members[i]))
	}
	again := filepath.Join(dir, "again.json")
	if err := WriteJSON(again, b); err != nil && !errors.Is(err, ErrNonFinite) {
		t.Fatal(err)
	}
	if data2, _ := os.ReadFile(again); !bytes.Equal(data, data2) {
		t.Error("schema 3 written again from what ReadJSON read differs")
	}
}
