package export

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/xuri/excelize/v2"
)

func writeFixtureXLSX(t *testing.T, r *Results) *excelize.File {
	t.Helper()
	path := filepath.Join(t.TempDir(), "schedule.xlsx")
	if err := WriteXLSX(path, r); err != nil {
		t.Fatal(err)
	}
	f, err := excelize.OpenFile(path)
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { f.Close() })
	return f
}

func TestWriteXLSXSheets(t *testing.T) {
	r := loadFixture(t)
	f := writeFixtureXLSX(t, r)
	if got := f.GetSheetList(); !slices.Equal(got, SheetNames) {
		t.Fatalf("sheets = %v, want %v", got, SheetNames)
	}
	wantRows := map[string]int{
		SheetMembers:  1 + len(r.Members),
		SheetMarks:    1 + len(r.Marks),
		SheetBlocking: 1 + len(r.BlockingRows),
		SheetTakeoff:  1 + 2 + 4, // one joist line, one blocking line, no hangers, four totals
		SheetUplift:   1 + 2,     // the fixture's uplift is on two wall lines
		SheetNotes:    1 + len(Cautions) + len(r.Assumptions.Notes) + len(layerNotes),
	}
	for sheet, n := range wantRows {
		rows, err := tableRowsOf(f, sheet)
		if err != nil {
			t.Fatal(err)
		}
		if len(rows) != n {
			t.Errorf("%s: %d rows, want %d", sheet, len(rows), n)
		}
	}
	filters := 0
	for _, dn := range f.GetDefinedName() {
		if dn.Name == "_xlnm._FilterDatabase" {
			filters++
		}
	}
	if filters != len(SheetNames) {
		t.Errorf("%d autofilters, want one per sheet (%d)", filters, len(SheetNames))
	}
	for _, sheet := range SheetNames {
		p, err := f.GetPanes(sheet)
		if err != nil {
			t.Fatal(err)
		}
		if !p.Freeze || p.YSplit != HeaderRow || p.TopLeftCell != "A4" {
			t.Errorf("%s: panes %+v, want the header row frozen", sheet, p)
		}
	}
}

// cellAt returns the cell name of the column headed head in row.
func cellAt(t *testing.T, f *excelize.File, sheet, head string, row int) string {
	t.Helper()
	rows, err := tableRowsOf(f, sheet)
	if err != nil {
		t.Fatal(err)
	}
	col := slices.Index(rows[0], head)
	if col < 0 {
		t.Fatalf("%s: no column %q in %q", sheet, head, rows[0])
	}
	name, _ := excelize.CoordinatesToCellName(col+1, row+TitleRows) // row counts from the header
	return name
}

func TestWriteXLSXCells(t *testing.T) {
	r := loadFixture(t)
	f := writeFixtureXLSX(t, r)
	get := func(sheet, head string, row int) string {
		v, err := f.GetCellValue(sheet, cellAt(t, f, sheet, head, row))
		if err != nil {
			t.Fatal(err)
		}
		return v
	}
	// Row 5 is M4, the failing member: ratio 1.12 shown as 0.00.
	checks := []struct {
		sheet, head string
		row         int
		want        string
	}{
		{SheetMembers, "ID", 5, "M4"},
		{SheetMembers, "Max ratio", 5, "1.12"},
		{SheetMembers, "Bending bottom", 5, "1.12"},
		{SheetMembers, "Shear", 5, ""},
		{SheetMembers, "Governing", 5, "bending-bottom"},
		{SheetMembers, "Combination", 5, "0.6D + 0.6W"}, // as ASCE 7-16 2.4.1 writes it
		{SheetMembers, "Status", 5, "fail"},
		{SheetMembers, "Spans (ft-in)", 2, `12'-0"`}, // 144 in
		{SheetMembers, BlockingAtHeader, 4, `6'-0"`}, // 72 in, datum 0 in the fixture
		{SheetMembers, "Species / grade", 2, "Douglas Fir-Larch No.2"},
		{SheetMarks, "Count", 3, "2"},
		{SheetBlocking, "Clear length of each piece (in)", 2, "14.5, 14.5"},
		{SheetBlocking, "Drawn or add", 3, "drawn"},
		{SheetTakeoff, "Board feet", 2, "64.0"},
		{SheetTakeoff, "Item", 7, "Total lumber"},
		{SheetTakeoff, "Board feet", 7, "68.8"},
		{SheetInputs, "Value", 2, "plan_r12.dxf"},
	}
	for _, c := range checks {
		if got := get(c.sheet, c.head, c.row); got != c.want {
			t.Errorf("%s %s row %d = %q, want %q", c.sheet, c.head, c.row, got, c.want)
		}
	}
	notes, _ := tableRowsOf(f, SheetNotes)
	var all strings.Builder
	for _, row := range notes {
		all.WriteString(strings.Join(row, " "))
	}
	for _, c := range Cautions {
		if !strings.Contains(all.String(), c) {
			t.Errorf("Notes lacks caution %q", c)
		}
	}
}

func TestWriteXLSXHighlight(t *testing.T) {
	r := loadFixture(t)
	f := writeFixtureXLSX(t, r)
	style := func(head string, row int) *excelize.Style {
		id, err := f.GetCellStyle(SheetMembers, cellAt(t, f, SheetMembers, head, row))
		if err != nil {
			t.Fatal(err)
		}
		s, err := f.GetStyle(id)
		if err != nil {
			t.Fatal(err)
		}
		return s
	}
	failID, passID := style("ID", 5), style("ID", 2)
	if len(failID.Fill.Color) == 0 || len(passID.Fill.Color) != 0 {
		t.Errorf("fill: failing row %v, passing row %v; want only the failing row shaded", failID.Fill.Color, passID.Fill.Color)
	}
	hi, lo := style("Max ratio", 5), style("Max ratio", 2)
	if hi.Font == nil || !hi.Font.Bold {
		t.Error("ratio over 1.00 not bold")
	}
	if lo.Font != nil && lo.Font.Bold {
		t.Error("ratio under 1.00 bold")
	}
	for _, s := range []*excelize.Style{hi, lo} {
		if s.CustomNumFmt == nil || *s.CustomNumFmt != "0.00" {
			t.Errorf("ratio format %v, want 0.00", s.CustomNumFmt)
		}
	}
}

func TestWriteXLSXNonFinite(t *testing.T) {
	r := loadFixture(t)
	r.Members[0].MaxRatio = math.NaN()
	f := writeFixtureXLSX(t, r)
	v, _ := f.GetCellValue(SheetMembers, cellAt(t, f, SheetMembers, "Max ratio", 2))
	if v != "n/a" {
		t.Errorf("NaN ratio shows %q, want n/a", v)
	}
}

// bigResults makes n members in the fixture's shape, for the benchmark.
func bigResults(n int) *Results {
	r := &Results{Plan: "big.dxf", DrawingUnits: "in"}
	r.Members = make([]Member, n)
	for i := range r.Members {
		y := float64(i) * 16
		ratio := 0.3 + float64(i%90)/100
		status := StatusPass
		if ratio > 1 {
			status = StatusFail
		}
		r.Members[i] = Member{
			ID: fmt.Sprintf("M%d", i+1), Mark: fmt.Sprintf("J%d", i%40+1), Layer: "JOIST", Handle: fmt.Sprintf("%X", 0x100+i),
			Start: [2]float64{0, y}, End: [2]float64{144, y}, LengthIn: 144,
			BearingsAtIn: []float64{0, 144}, SpansIn: []float64{144}, TribIn: 16, SpacingIn: 16,
			Size: "2x10", Species: "Douglas Fir-Larch", Grade: "No.2", Zone: "FLOOR",
			Checks: []Check{
				{Kind: KindBendingTop, Combo: "D+L", Actual: 900 * ratio, Allowable: 900, Unit: "psi", Ratio: ratio},
				{Kind: KindShear, Combo: "D+L", Actual: 40, Allowable: 180, Unit: "psi", Ratio: 0.22},
				{Kind: KindDeflectionLive, Combo: "L", Actual: 0.2, Allowable: 0.4, Unit: "in", Ratio: 0.5},
				{Kind: KindDeflectionTotal, Combo: "D+L", Actual: 0.3, Allowable: 0.6, Unit: "in", Ratio: 0.5},
				{Kind: KindBearing, Combo: "D+L", Actual: 50, Allowable: 625, Unit: "psi", Ratio: 0.08},
			},
			Governing: KindBendingTop, MaxRatio: ratio, BlockingRowsPerSpan: []int{1}, BlockingAtIn: []float64{72},
			Status: status,
		}
	}
	return r
}

// BenchmarkWriteXLSX writes a 100,000-member schedule.
func BenchmarkWriteXLSX(b *testing.B) {
	r := bigResults(100_000)
	dir := b.TempDir()
	path := filepath.Join(dir, "schedule.xlsx")
	b.ReportAllocs()
	for b.Loop() {
		if err := WriteXLSX(path, r); err != nil {
			b.Fatal(err)
		}
	}
	if fi, err := os.Stat(path); err == nil {
		b.ReportMetric(float64(fi.Size())/1e6, "MB/file")
	}
}

// BenchmarkWriteJSON writes a 100,000-member results file.
func BenchmarkWriteJSON(b *testing.B) {
	r := bigResults(100_000)
	path := filepath.Join(b.TempDir(), "results.json")
	b.ReportAllocs()
	for b.Loop() {
		if err := WriteJSON(path, r); err != nil {
			b.Fatal(err)
		}
	}
}

// TestSheetTitleRows: every sheet starts with the project's title block and
// the tool version, above its header.
func TestSheetTitleRows(t *testing.T) {
	r := loadFixture(t)
	r.ToolVersion = "v1.2.3-test"
	r.Project = ProjectInfo{Name: "Garage loft", Number: "2026-041", Address: "12 Orchard Lane", Designer: "A. Designer",
		Checker: "B. Checker", Revision: "B", Date: "2026-12-04"}
	f := writeFixtureXLSX(t, r)
	for _, sheet := range SheetNames {
		rows, err := f.GetRows(sheet)
		if err != nil || len(rows) < HeaderRow {
			t.Fatalf("%s: %v %q", sheet, err, rows)
		}
		if rows[0][0] != "Garage loft, project 2026-041, 12 Orchard Lane" {
			t.Errorf("%s row 1 %q", sheet, rows[0][0])
		}
		if want := "designer A. Designer, checker B. Checker, revision B, 2026-12-04; plan " + r.Plan + "; framecheck v1.2.3-test"; rows[1][0] != want {
			t.Errorf("%s row 2 %q, want %q", sheet, rows[1][0], want)
		}
	}
}
