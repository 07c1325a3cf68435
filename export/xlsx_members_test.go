package export

import (
	"archive/zip"
	"bytes"
	"compress/flate"
	"encoding/xml"
	"io"
	"math"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/xuri/excelize/v2"
)

// referenceMembersXLSX writes the Members sheet of r with excelize's own
// stream writer, cell by cell: what the spliced rows must read back as.
func referenceMembersXLSX(t *testing.T, r *Results) *excelize.File {
	t.Helper()
	f := excelize.NewFile()
	t.Cleanup(func() { f.Close() })
	st, err := newStyles(f)
	if err != nil {
		t.Fatal(err)
	}
	f.SetActiveSheet(0)
	s, err := newSheet(f, st, SheetMembers, membersColumns)
	if err != nil {
		t.Fatal(err)
	}
	for i := range r.Members {
		memberRow(&s.rowCells, &r.Members[i])
		if err := s.end(); err != nil {
			t.Fatal(err)
		}
	}
	if err := s.close(); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "reference.xlsx")
	if err := f.SaveAs(path); err != nil {
		t.Fatal(err)
	}
	g, err := excelize.OpenFile(path, excelize.Options{RawCellValue: true})
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { g.Close() })
	return g
}

// awkwardMembers is members whose text XML must escape or clean, and
// numbers excelize writes in special ways.
func awkwardMembers() []Member {
	r := bigResults(5000) // more than two blocks of rows
	ms := r.Members
	ms[1].Layer = "  JOIST & <LOFT>  "
	ms[2].Messages = []string{"tab\there", "line\nbreak", "cr\rhere", "bell\x07", "bad \xff byte", "snowman ☃ and 𝄞"}
	ms[3].Zone = "ZÖNE \"quoted\" 'single'"
	ms[4].Messages = []string{strings.Repeat("long message ", 3000)} // past 32,767 characters
	ms[5].Checks[0].Ratio, ms[5].MaxRatio = math.NaN(), math.NaN()
	ms[6].Status, ms[6].Checks, ms[6].MaxRatio, ms[6].Governing = StatusError, nil, 0, ""
	ms[7].SpacingIn, ms[7].TribIn = 1e-9, 123456789012345678
	ms[8].OverhangsIn = [2]float64{24, 0}
	return ms
}

// TestMembersRowsMatchExcelize: the member rows written here and spliced
// into the workbook read back, through excelize's reader, exactly as the
// same cells written by excelize's stream writer do: every value and every
// style, row by row (excelize as the independent reference; the schedule
// was written only with it before).
func TestMembersRowsMatchExcelize(t *testing.T) {
	r := &Results{Plan: "p.dxf", DrawingUnits: "in", Members: awkwardMembers()}
	path := filepath.Join(t.TempDir(), "schedule.xlsx")
	if err := WriteXLSX(path, r); err != nil {
		t.Fatal(err)
	}
	got, err := excelize.OpenFile(path, excelize.Options{RawCellValue: true})
	if err != nil {
		t.Fatal(err)
	}
	defer got.Close()
	want := referenceMembersXLSX(t, r)
	gotRows, err := tableRowsOf(got, SheetMembers)
	if err != nil {
		t.Fatal(err)
	}
	wantRows, err := tableRowsOf(want, SheetMembers)
	if err != nil {
		t.Fatal(err)
	}
	if len(gotRows) != len(r.Members)+1 || len(gotRows) != len(wantRows) {
		t.Fatalf("%d rows, reference %d, want %d", len(gotRows), len(wantRows), len(r.Members)+1)
	}
	bad := 0
	for i := range wantRows {
		for j := range membersColumns {
			var g, w string
			if j < len(gotRows[i]) {
				g = gotRows[i][j]
			}
			if j < len(wantRows[i]) {
				w = wantRows[i][j]
			}
			cell, _ := excelize.CoordinatesToCellName(j+1, i+1)
			gs, _ := got.GetCellStyle(SheetMembers, cell)
			ws, _ := want.GetCellStyle(SheetMembers, cell)
			if g != w && sameNumber(g, w) {
				g = w
			}
			if g != w || gs != ws {
				if bad++; bad <= 10 {
					t.Errorf("%s: %.60q style %d, reference %.60q style %d", cell, g, gs, w, ws)
				}
			}
		}
	}
	// The autofilter and the frozen header cover the table.
	if panes, err := got.GetPanes(SheetMembers); err != nil || !panes.Freeze || panes.YSplit != HeaderRow {
		t.Errorf("panes %+v, %v: want the header row frozen", panes, err)
	}
}

// sameNumber reports whether a and b are numbers within 1e-14 of each
// other: excelize writes a cell's number to 15 significant digits
// (truncated), the rows here the shortest exact decimal.
func sameNumber(a, b string) bool {
	x, err1 := strconv.ParseFloat(a, 64)
	y, err2 := strconv.ParseFloat(b, 64)
	return err1 == nil && err2 == nil && math.Abs(x-y) <= 1e-14*math.Max(math.Abs(x), math.Abs(y))
}

// TestMembersPartWellFormed: the spliced sheet part is one valid deflate
// stream whose XML parses, with its dimension set to the table, and the
// zip's CRC and sizes agree with it (archive/zip checks the CRC on read).
func TestMembersPartWellFormed(t *testing.T) {
	r := &Results{Members: awkwardMembers()}
	zr, parts := openSchedule(t, r)
	defer zr.Close()
	membersPart := parts[SheetMembers]
	for _, f := range zr.File {
		if f.Name != membersPart {
			continue
		}
		rc, err := f.Open()
		if err != nil {
			t.Fatal(err)
		}
		data, err := io.ReadAll(rc) // fails on a CRC or size mismatch
		rc.Close()
		if err != nil {
			t.Fatal(err)
		}
		if uint64(len(data)) != f.UncompressedSize64 {
			t.Errorf("%d bytes, header says %d", len(data), f.UncompressedSize64)
		}
		d := xml.NewDecoder(bytes.NewReader(data))
		rows := 0
		for {
			tok, err := d.Token()
			if err == io.EOF {
				break
			}
			if err != nil {
				t.Fatalf("sheet XML: %v", err)
			}
			if se, ok := tok.(xml.StartElement); ok && se.Name.Local == "row" {
				rows++
			}
		}
		if rows != len(r.Members)+HeaderRow {
			t.Errorf("%d rows in the XML, want %d", rows, len(r.Members)+HeaderRow)
		}
		if want := `<dimension ref="A1:Z5003"/>`; bytes.Contains(data, []byte("<dimension")) && !bytes.Contains(data, []byte(want)) {
			t.Errorf("dimension is not %s", want)
		}
		return
	}
	t.Fatalf("no %s in the workbook", membersPart)
}

// TestDeflatePiecesJoin: blocks deflated apart with a sync flush, then a
// final empty block, inflate as one stream to the blocks joined (RFC 1951
// 3.2.3; compress/flate as the independent reader).
func TestDeflatePiecesJoin(t *testing.T) {
	parts := [][]byte{[]byte("<head>"), bytes.Repeat([]byte("<row>x</row>"), 5000), {}, []byte("</tail>")}
	var z, want []byte
	for _, p := range parts {
		z = append(z, deflatePiece(p)...)
		want = append(want, p...)
	}
	z = append(z, finalBlock()...)
	got, err := io.ReadAll(flate.NewReader(bytes.NewReader(z)))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("inflated %d bytes, want %d", len(got), len(want))
	}
}

// TestMembersSheetEmpty: a plan without members gets a Members sheet with
// its header row only, readable by excelize.
func TestMembersSheetEmpty(t *testing.T) {
	f := writeFixtureXLSX(t, &Results{Plan: "empty.dxf"})
	rows, err := tableRowsOf(f, SheetMembers)
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != 1 || rows[0][0] != membersColumns[0].Head {
		t.Errorf("rows %q, want the header only", rows)
	}
}

// openSchedule writes r's schedule (WriteXLSX) into a fresh folder and
// opens it: the zip, to be closed by the caller, and its sheets' parts by
// sheet name (sheetParts).
func openSchedule(t *testing.T, r *Results) (*zip.ReadCloser, map[string]string) {
	t.Helper()
	path := filepath.Join(t.TempDir(), "schedule.xlsx")
	if err := WriteXLSX(path, r); err != nil {
		t.Fatal(err)
	}
	zr, err := zip.OpenReader(path)
	if err != nil {
		t.Fatal(err)
	}
	parts, err := sheetParts(&zr.Reader)
	if err != nil {
		zr.Close()
		t.Fatal(err)
	}
	return zr, parts
}
