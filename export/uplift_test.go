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
	"strings"
	"testing"
)

// TestUpliftEncoderMatchesMarshal holds the field-by-field writer of the
// uplift bearings to encoding/json (the reference), with text JSON escapes
// and numbers at the edges of its two float formats. Common practice, no
// source.
func TestUpliftEncoderMatchesMarshal(t *testing.T) {
	var bs []UpliftBearing
	for i, s := range rtTexts {
		v := rtNumbers[i%len(rtNumbers)]
		bs = append(bs, UpliftBearing{Member: s, Mark: s + "J", Bearing: i - 3, Support: s, SupportLayer: "WALL" + s,
			SupportHandle: s, SupportKind: s, AtIn: v, Point: [2]float64{-v, v / 3}, PointIn: [2]float64{1, 2},
			UpliftLb: v, Combo: s, CD: 1.6, Flagged: i%2 == 0})
	}
	bs = append(bs, UpliftBearing{})
	for i := range bs {
		want, err := json.Marshal(bs[i])
		if err != nil {
			t.Fatal(err)
		}
		got, err := encodeUpliftBearing(nil, &bs[i], nil)
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(got, want) {
			t.Errorf("bearing %d:\n got  %s\n want %s", i, got, want)
		}
	}
	// The whole section, empty and not, reads back as encoding/json reads it.
	for _, u := range []UpliftReport{{ReportLb: 50}, {ReportLb: 0.5, Bearings: bs}} {
		var buf bytes.Buffer
		w := bufio.NewWriter(&buf)
		if err := writeUpliftJSON(w, &u, nil); err != nil {
			t.Fatal(err)
		}
		w.Flush()
		var back UpliftReport
		if err := json.Unmarshal(buf.Bytes(), &back); err != nil {
			t.Fatalf("%v:\n%s", err, buf.Bytes())
		}
		want := u
		want.Bearings = append([]UpliftBearing{}, u.Bearings...)
		for i := range want.Bearings {
			want.Bearings[i].PointIn = [2]float64{} // not in the file
		}
		if !reflect.DeepEqual(back, want) {
			t.Errorf("section read back %+v, want %+v", back, want)
		}
	}
	if _, err := encodeUpliftBearing(nil, &UpliftBearing{UpliftLb: math.NaN()}, nil); err == nil {
		t.Error("NaN uplift encoded without an error")
	}
}

// TestUpliftJSONRoundTrip: the fixture's uplift section (a 0.8 lb uplift
// listed, not flagged, and four flagged bearings) goes through WriteJSON
// and ReadJSON unchanged but for the inch points, which stay out of the
// file; every key of the contract is there. Common practice, no source.
func TestUpliftJSONRoundTrip(t *testing.T) {
	r := loadFixture(t)
	r.Uplift.Bearings[1].PointIn = [2]float64{5, 6}
	path := filepath.Join(t.TempDir(), "results.json")
	if err := WriteJSON(path, r); err != nil {
		t.Fatal(err)
	}
	back, err := ReadJSON(path)
	if err != nil {
		t.Fatal(err)
	}
	want := r.Uplift
	want.Bearings = append([]UpliftBearing(nil), r.Uplift.Bearings...)
	want.Bearings[1].PointIn = [2]float64{}
	if !reflect.DeepEqual(back.Uplift, want) {
		t.Errorf("uplift read back\n %+v\nwant\n %+v", back.Uplift, want)
	}
	if back.Uplift.Bearings[0].UpliftLb != 0.8 || back.Uplift.Bearings[0].Flagged {
		t.Errorf("the 0.8 lb uplift: %+v, want listed and not flagged", back.Uplift.Bearings[0])
	}
	var top map[string]json.RawMessage
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if err := json.Unmarshal(data, &top); err != nil {
		t.Fatal(err)
	}
	var sec struct {
		ReportLb *float64         `json:"report_lb"`
		Bearings []map[string]any `json:"bearings"`
	}
	if err := json.Unmarshal(top["uplift"], &sec); err != nil {
		t.Fatalf("uplift section: %v", err)
	}
	// A bearing's mark is its member's and its support its layer and
	// handle: both derived, not written (docs/RESULTS-SCHEMA.md).
	for i, b := range sec.Bearings {
		if _, ok := b["mark"]; ok {
			t.Errorf("uplift bearing %d writes its member's mark", i)
		}
		if _, ok := b["support"]; ok && b["support_handle"] != "" {
			t.Errorf("uplift bearing %d writes a support its layer and handle give", i)
		}
	}
	var all map[string]any
	if err := json.Unmarshal(data, &all); err != nil {
		t.Fatal(err)
	}
	filledMembers(t, all)
	for i, b := range all["uplift"].(map[string]any)["bearings"].([]any) {
		sec.Bearings[i] = b.(map[string]any)
	}
	if sec.ReportLb == nil || *sec.ReportLb != 50 || len(sec.Bearings) != 5 {
		t.Fatalf("uplift section: report_lb %v, %d bearings; want 50 and 5", sec.ReportLb, len(sec.Bearings))
	}
	hasKeys(t, "uplift bearing", sec.Bearings[0], []string{"member", "mark", "bearing", "support", "support_layer",
		"support_handle", "support_kind", "at_in", "point", "uplift_lb", "combo", "cd", "flagged"})
	if strings.Contains(string(top["uplift"]), "PointIn") {
		t.Error("inch points leaked into the JSON")
	}
	// A NaN uplift is written as 0 and reported, as for members.
	r.Uplift.Bearings[2].UpliftLb = math.Inf(1)
	err = WriteJSON(path, r)
	var nf *NonFiniteError
	if !errors.As(err, &nf) || len(nf.Fields) != 1 || nf.Fields[0] != "uplift.bearings[2].uplift_lb = +Inf" {
		t.Errorf("non-finite uplift: %v", err)
	}
}

// TestUpliftSheetGroupsBySupportLine: the Uplift sheet has one row per
// support line with the count, flagged count, largest and total uplift and
// the required connector capacity per bearing. Sums of the fixture,
// written out: wall handle 34 carries M2 (0.8 lb, not flagged), M3 (212.5)
// and M4 (160.2): 3 bearings, 2 flagged, largest 212.5, total 0.8 + 212.5
// + 160.2 = 373.5 lb; wall handle 35 carries M3 and M4: 2, 2, 212.5 and
// 372.7 lb. A line whose uplift is all below the threshold gets no
// required capacity.
func TestUpliftSheetGroupsBySupportLine(t *testing.T) {
	r := loadFixture(t)
	// A third line with only a small uplift.
	r.Uplift.Bearings = append(r.Uplift.Bearings, UpliftBearing{Member: "M1", Mark: "J1", Bearing: 1,
		Support: "LEDGER handle 99", SupportLayer: "LEDGER", SupportHandle: "99", SupportKind: "ledger",
		UpliftLb: 12.25, Combo: "0.6D+0.6W(up)", CD: 1.6})
	f := writeFixtureXLSX(t, r)
	rows, err := tableRowsOf(f, SheetUplift)
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != 4 {
		t.Fatalf("%d rows, want a header and 3 support lines: %q", len(rows), rows)
	}
	col := map[string]int{}
	for i, h := range rows[0] {
		col[h] = i
	}
	get := func(row []string, h string) string {
		i, ok := col[h]
		if !ok {
			t.Fatalf("no column %q in %q", h, rows[0])
		}
		if i >= len(row) {
			return ""
		}
		return row[i]
	}
	want := []struct {
		support, count, flagged, max, total, need, cd string
	}{
		// pounds shown to the nearest 1 (fmtx rules); the required
		// capacity stored rounded up to the pound
		{"WALL handle 34", "3", "2", "213", "374", "213", "1.60"},
		{"WALL handle 35", "2", "2", "213", "373", "213", "1.60"},
		{"LEDGER handle 99", "1", "0", "12", "12", "", "1.60"},
	}
	for i, w := range want {
		row := rows[i+1]
		got := []string{get(row, "Support line"), get(row, "Bearings with uplift"), get(row, "Flagged"),
			get(row, "Largest uplift (lb)"), get(row, "Total uplift (lb)"),
			get(row, "Required connector capacity per bearing, ASD (lb)"), get(row, "CD")}
		if !reflect.DeepEqual(got, []string{w.support, w.count, w.flagged, w.max, w.total, w.need, w.cd}) {
			t.Errorf("row %d = %q, want %+v", i+1, got, w)
		}
	}
	if m := get(rows[1], "Members"); m != "M2, M3, M4" {
		t.Errorf("members of wall 34: %q", m)
	}
	if n := get(rows[1], "Note"); !strings.Contains(n, "CD = 1.6") || !strings.Contains(n, "1 bearing(s) below 50 lb") {
		t.Errorf("note of wall 34: %q", n)
	}
	if n := get(rows[3], "Note"); !strings.Contains(n, "listed, not flagged") {
		t.Errorf("note of the ledger: %q", n)
	}
	for _, row := range rows {
		for _, c := range row {
			if strings.Contains(strings.ToLower(c), "hold it down") {
				t.Errorf("advice wording in the sheet: %q", c)
			}
		}
	}

	// No uplift at all: one row saying so.
	r.Uplift.Bearings = nil
	f = writeFixtureXLSX(t, r)
	rows, _ = tableRowsOf(f, SheetUplift)
	if len(rows) != 2 || rows[1][0] != "none" {
		t.Errorf("no uplift: rows %q", rows)
	}
}

// TestReportUpliftSection: the report lists the uplift by support line and
// by bearing, flagged bearings first (largest first), the 0.8 lb uplift
// listed as such, and says what a connector must do without naming one.
// Common practice, no source.
func TestReportUpliftSection(t *testing.T) {
	r, g := loadReportFixture(t)
	r.Uplift = loadFixture(t).Uplift
	doc, _ := repWriteParse(t, r, g)
	sec := repByID(doc, "uplift")
	if sec == nil {
		t.Fatal("no uplift section")
	}
	text := repText(sec)
	for _, want := range []string{"5 bearings have a net uplift", "4 with 50 lb or more", "FC-UPLIFT", "1.6 for wind", "the designer picks the part"} {
		if !strings.Contains(text, want) {
			t.Errorf("uplift section lacks %q", want)
		}
	}
	if strings.Contains(strings.ToLower(text), "hold it down") {
		t.Error("advice wording in the uplift section")
	}
	lines := repRows(repByID(doc, "uplift-lines"))
	if len(lines) != 3 || lines[1][0] != "WALL handle 34" || lines[1][2] != "3" || lines[1][3] != "2" ||
		lines[1][5] != "374" || lines[1][6] != "213" { // demands up to the next pound
		t.Errorf("support lines %q", lines)
	}
	rows := repRows(repByID(doc, "uplift-bearings"))
	if len(rows) != 6 {
		t.Fatalf("%d bearing rows, want a header and 5: %q", len(rows), rows)
	}
	if rows[1][0] != "M3" || rows[1][4] != "213" || rows[1][7] != "flagged" {
		t.Errorf("first bearing row %q, want M3's 212.5 lb flagged", rows[1])
	}
	if last := rows[5]; last[0] != "M2" || last[4] != "1" || last[7] != "listed" {
		t.Errorf("last bearing row %q, want M2's 0.8 lb listed", last)
	}

	r.Uplift = UpliftReport{ReportLb: 50}
	doc, _ = repWriteParse(t, r, g)
	if !strings.Contains(repText(repByID(doc, "uplift")), "No bearing has a net uplift") {
		t.Error("no uplift: the section does not say so")
	}
}

// TestUpliftLabelsOutOfOrder: uplift bearings that do not come in member
// order still find their member (label along it, moved into it). Common
// practice, no source.
func TestUpliftLabelsOutOfOrder(t *testing.T) {
	r := &Results{Members: []Member{
		{ID: "M1", StartIn: [2]float64{0, 0}, EndIn: [2]float64{200, 0}, Status: StatusPass},
		{ID: "M2", StartIn: [2]float64{0, 0}, EndIn: [2]float64{0, 200}, Status: StatusPass},
	}, Uplift: UpliftReport{ReportLb: 50, Bearings: []UpliftBearing{
		{Member: "M2", Bearing: 2, PointIn: [2]float64{0, 200}, UpliftLb: 99.2, Flagged: true},
		{Member: "M1", Bearing: 1, PointIn: [2]float64{0, 0}, UpliftLb: 70, Flagged: true},
		{Member: "M9", Bearing: 1, PointIn: [2]float64{5, 5}, UpliftLb: 60, Flagged: true},
	}}}
	m := MarkupFromResults(r, 1)
	if len(m.Uplifts) != 3 {
		t.Fatalf("%d uplift labels", len(m.Uplifts))
	}
	// Beside the line: 0.65 h to its left as the text reads, h = 200/120 in.
	side := 0.65 * 200.0 / 120
	if l := m.Uplifts[0]; l.AngleDeg != 90 || math.Abs(l.At[0]+side) > 1e-9 || !(l.At[1] < 200) || l.Text != "uplift 100 lb" {
		t.Errorf("M2 label %+v, want along M2 (90 deg), beside it, below its end, 100 lb", l)
	}
	if l := m.Uplifts[1]; l.AngleDeg != 0 || !(l.At[0] > 0) || math.Abs(l.At[1]-side) > 1e-9 {
		t.Errorf("M1 label %+v, want along M1, beside it, right of its start", l)
	}
	if l := m.Uplifts[2]; l.At != [2]float64{5, 5} || l.AngleDeg != 0 {
		t.Errorf("label of an unknown member %+v, want at its point, 0 deg", l)
	}
}
