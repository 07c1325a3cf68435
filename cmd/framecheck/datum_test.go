package main

import (
	"html/template"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/xuri/excelize/v2"

	"framecheck/export"
)

// TestOneDatumAcrossOutputs: a blocking row to add is at one position,
// measured from the face of its members' first bearing, in results.json
// (inches), the Members and Blocking sheets (read back with excelize) and
// the report. Demo row R1-B1 crosses the roof joists at x = 672 in; their
// first bearing is the double-line WALL-EXT wall whose inner line (the
// face toward the span) is at x = 602.75 in, so the row is 672 - 602.75 =
// 69.25 in = 5'-9 1/4" from it (geometry of the demo plan, written out).
func TestOneDatumAcrossOutputs(t *testing.T) {
	dir := t.TempDir()
	_, _, _, r := runDemoTo(t, dir)
	const wantIn = 69.25
	const wantText = `5'-9 1/4"`
	if r.Datum == "" || !strings.Contains(r.Datum, "face of its first bearing") {
		t.Errorf("results.json datum %q", r.Datum)
	}
	var row *export.BlockingRow
	for i := range r.BlockingRows {
		if r.BlockingRows[i].ID == "R1-B1" {
			row = &r.BlockingRows[i]
		}
	}
	if row == nil {
		t.Fatal("demo has no row R1-B1")
	}
	if math.Abs(row.FromFaceIn-wantIn) > 1e-9 || export.FtIn(row.FromFaceIn) != wantText {
		t.Errorf("R1-B1 from_face_in %v, want %v", row.FromFaceIn, wantIn)
	}
	// Every member the row crosses that gets it lists it at the same place.
	withRow := 0
	for _, id := range row.Members {
		m := memberByID(t, r, id)
		if len(m.BlockingAtIn) == 0 {
			continue
		}
		withRow++
		if !slices.ContainsFunc(m.BlockingFromFaceIn, func(v float64) bool { return math.Abs(v-wantIn) < 1e-9 }) {
			t.Errorf("%s blocking_from_face_in %v, want %v in it", id, m.BlockingFromFaceIn, wantIn)
		}
	}
	if withRow == 0 {
		t.Fatal("no member lists row R1-B1")
	}

	f, err := excelize.OpenFile(filepath.Join(dir, "schedule.xlsx"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	col := func(sheet, head string) (int, [][]string) {
		rows, err := f.GetRows(sheet)
		if err != nil || len(rows) < export.HeaderRow {
			t.Fatalf("%s: %v", sheet, err)
		}
		rows = rows[export.TitleRows:] // the header first
		for c, h := range rows[0] {
			if h == head {
				return c, rows
			}
		}
		t.Fatalf("%s: no column %q in %q", sheet, head, rows[0])
		return 0, nil
	}
	c, rows := col("Members", export.BlockingAtHeader)
	for _, rw := range rows[1:] {
		if len(rw) > c && slices.Contains(row.Members, rw[0]) && rw[c] != "" && !strings.Contains(rw[c], wantText) {
			t.Errorf("Members %s: blocking %q, want %s in it", rw[0], rw[c], wantText)
		}
	}
	c, rows = col("Blocking", export.PositionHeader)
	found := false
	for _, rw := range rows[1:] {
		if rw[0] == "R1-B1" {
			found = true
			if rw[c] != wantText {
				t.Errorf("Blocking R1-B1 position %q, want %s", rw[c], wantText)
			}
			if v, _ := f.GetCellValue("Blocking", "E2"); v != "69.25" && rw[c+1] != "69.25" {
				t.Errorf("Blocking R1-B1 position in inches %q, want 69.25", rw[c+1])
			}
		}
	}
	if !found {
		t.Error("Blocking sheet has no R1-B1")
	}
	html, err := os.ReadFile(filepath.Join(dir, "report.html"))
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(html), template.HTMLEscapeString(wantText)) {
		t.Errorf("report.html does not give the row at %s", wantText)
	}
	// M1 starts 2.25 in before its first bearing's centre-line and the
	// row is 74.25 in from its start: neither figure may be printed as a
	// position (the lu subtraction "74.25 - 2.25" is a length, and stays).
	for _, bad := range []string{"from start", "bearings at 2.25", "rows to add at 74.25"} {
		if strings.Contains(string(html), bad) {
			t.Errorf("report.html still measures from the member's drawn start: %q", bad)
		}
	}
}

// TestPlanPointsFtIn: a finding's plan point in drawing units becomes
// feet-inches plan coordinates: 256 in = 21'-4", 138 in = 11'-6"; in a
// drawing in feet 21.5 ft = 21'-6" (arithmetic, written out).
func TestPlanPointsFtIn(t *testing.T) {
	for _, tc := range []struct {
		msg    string
		toInch float64
		want   string
	}{
		{"M14 end (256.00, 138.00) reaches no support", 1, `M14 end (21'-4", 11'-6") reaches no support`},
		{"M2 end (21.50, -1.25) reaches no support", 12, `M2 end (21'-6", -1'-3") reaches no support`},
		{"no point here (layer A, 3)", 1, "no point here (layer A, 3)"},
	} {
		if got := planPointsFtIn(tc.msg, tc.toInch); got != tc.want {
			t.Errorf("planPointsFtIn(%q) = %q, want %q", tc.msg, got, tc.want)
		}
	}
}
