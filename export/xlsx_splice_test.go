package export

import (
	"archive/zip"
	"bytes"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"reflect"
	"regexp"
	"slices"
	"strings"
	"testing"

	"github.com/xuri/excelize/v2"
)

// bigLoadPath makes a load path in the shape of a plan with beams: beams,
// posts, connections (more than two blocks of rows) and foundation lines,
// with text XML must escape or clean, non-finite numbers, loads that round
// and failing and erroring rows.
func bigLoadPath(beams, posts, conns, found int) *LoadPath {
	lp := &LoadPath{
		Beams:       make([]PathBeam, beams),
		Posts:       make([]PathPost, posts),
		Connections: make([]Connection, conns),
		Foundation:  make([]FoundationLine, found),
	}
	loads := func(i int) TypeLoads {
		f := float64(i)
		return TypeLoads{DeadLb: 10.5 + f, LiveLb: 40.49 * f, RoofLiveLb: f / 3, SnowLb: 1e6 + f, WindDownLb: 0.5, WindUpLb: -f / 7}
	}
	for i := range lp.Beams {
		ratio := 0.2 + float64(i%100)/90
		status := StatusPass
		if ratio > 1 {
			status = StatusFail
		}
		lp.Beams[i] = PathBeam{
			ID: fmt.Sprintf("B%d", i+1), Mark: fmt.Sprintf("B%d", i%30+1), Kind: "flush-beam", Layer: "BEAMS", Source: fmt.Sprintf("plan.dxf:%d (handle %X)", 100+i, 0x2F0+i),
			SpansIn: []float64{152.8125, 96}, Size: "3-1.75x11.875", Species: "Douglas Fir-Larch", Grade: "No.1",
			Supports: []string{"P1", "wall W2"}, Carries: []string{"M1", "M2", "M3", "M4", "M5", "M6", "M7", "M8", "M9"},
			Checks:    []Check{{Kind: KindBendingTop, Combo: "D+L", Ratio: ratio}, {Kind: KindShear, Combo: "D+0.75L+0.75S", Ratio: ratio / 2}},
			Governing: KindBendingTop, MaxRatio: ratio, Status: status,
		}
	}
	lp.Beams[1].Layer, lp.Beams[1].Messages = "  BEAM & <LOFT>  ", []string{"tab\there", "cr\rhere", "bad \xff byte", "snowman ☃"}
	lp.Beams[2].Status, lp.Beams[2].MaxRatio, lp.Beams[2].Checks, lp.Beams[2].Governing = StatusError, math.NaN(), nil, ""
	for i := range lp.Posts {
		p := PathPost{ID: fmt.Sprintf("P%d", i+1), Source: "plan.dxf:77", Size: "6x6", Species: "Douglas Fir-Larch", Grade: "No.1",
			HeightIn: 96 + float64(i%5), Checked: true, Loads: loads(i), DownLb: 1234.0001 + float64(i), DownCombo: "D+L",
			UpLb: float64(i%3) * 10.2, UpCombo: "0.6D+0.6W", Checks: []Check{{Kind: "column", Ratio: float64(i%40) / 30}}, Status: StatusPass}
		if i%40 > 30 {
			p.Status = StatusFail
		}
		lp.Posts[i] = p
	}
	lp.Posts[3].Checked, lp.Posts[3].Status, lp.Posts[3].HeightIn, lp.Posts[3].Checks = false, "", 0, nil
	lp.Posts[4].Status, lp.Posts[4].Messages = StatusError, []string{"no size <on> the post", strings.Repeat("long ", 7000)}
	lp.Posts[5].DownLb = math.Inf(1)
	for i := range lp.Connections {
		lp.Connections[i] = Connection{Kind: []string{"hanger", "joist on beam", "post cap", "post base"}[i%4], Member: fmt.Sprintf("M%d", i+1),
			Bearing: i%2 + 1, Carrier: fmt.Sprintf("B%d", i%300+1), Loads: loads(i), DownLb: 96.00000000000001 * float64(i%50),
			DownCombo: "D+L", UpLb: float64(i%7) / 3, UpCombo: "0.6D+0.6W"}
	}
	lp.Connections[6].Loads.DeadLb = math.NaN()
	for i := range lp.Foundation {
		fl := FoundationLine{Kind: "post", ID: fmt.Sprintf("P%d", i+1), Source: "plan.dxf:90", Loads: loads(i)}
		if i%3 == 0 {
			fl.Kind, fl.ID, fl.LengthIn, fl.PerFoot = "wall", fmt.Sprintf("W%d", i+1), 240+float64(i), loads(i+1)
		}
		lp.Foundation[i] = fl
	}
	return lp
}

// sheetDataRE matches a sheet part's rows: a spliced sheet's part must
// equal the reference outside them and its dimension.
var sheetDataRE = regexp.MustCompile(`(?s)<sheetData>.*</sheetData>`)

// TestSplicedSheetsMatchExcelize: the workbook whose Members and load-path
// rows are spliced reads back, through excelize's reader, exactly as the
// one excelize's stream writer writes cell by cell (excelize as the
// independent reference; the schedule was written only with it before):
// every value and style of every row of those sheets, and every other part
// of the package byte for byte: styles, the workbook with its autofilter
// ranges, and each spliced sheet's columns, widths, frozen pane and
// autofilter outside its rows; the spliced sheets' dimension is the whole
// table (excelize's stream writer leaves it "A1").
func TestSplicedSheetsMatchExcelize(t *testing.T) {
	r := bigResults(3000)
	r.Members[1].Layer = "  JOIST & <LOFT>  "
	r.LoadPath = bigLoadPath(300, 700, 2*rowsPerBlock+7, 50)
	r.Uplift = bigUplift(2*rowsPerBlock + 40)
	uplifts := len(UpliftLines(r.Uplift.Bearings))
	if uplifts <= rowsPerBlock {
		t.Fatalf("%d uplift lines: too few to fill two blocks", uplifts)
	}
	spliced, stream := writeBothXLSX(t, r)
	gotParts, wantParts := zipParts(t, spliced), zipParts(t, stream)
	sheets := append([]string{SheetMembers, SheetUplift}, LoadPathSheetNames...)
	zr, err := zip.OpenReader(spliced)
	if err != nil {
		t.Fatal(err)
	}
	names, err := sheetParts(&zr.Reader)
	zr.Close()
	if err != nil {
		t.Fatal(err)
	}
	isSpliced := map[string]bool{}
	for _, s := range sheets {
		isSpliced[names[s]] = true
	}
	if len(gotParts) != len(wantParts) {
		t.Errorf("%d parts, reference %d", len(gotParts), len(wantParts))
	}
	for name, want := range wantParts {
		got, ok := gotParts[name]
		switch {
		case !ok:
			t.Errorf("no part %s", name)
		case isSpliced[name]:
			g, w := sheetDataRE.ReplaceAll(got, nil), sheetDataRE.ReplaceAll(want, nil)
			g, w = dimensionRE.ReplaceAll(g, nil), dimensionRE.ReplaceAll(w, nil)
			if !bytes.Equal(g, w) {
				t.Errorf("%s outside its rows:\n%s\nreference:\n%s", name, g, w)
			}
		case !bytes.Equal(got, want):
			t.Errorf("%s differs from the reference:\n%.2000s\nreference:\n%.2000s", name, got, want)
		}
	}

	got, err := excelize.OpenFile(spliced, excelize.Options{RawCellValue: true})
	if err != nil {
		t.Fatal(err)
	}
	defer got.Close()
	want, err := excelize.OpenFile(stream, excelize.Options{RawCellValue: true})
	if err != nil {
		t.Fatal(err)
	}
	defer want.Close()
	lp := r.LoadPath
	counts := map[string]int{SheetMembers: len(r.Members), SheetBeams: len(lp.Beams), SheetPosts: len(postGroups(lp.Posts)),
		SheetConnections: len(connectionGroups(lp.Connections)), SheetFoundation: len(foundationGroups(lp.Foundation)),
		SheetUplift: uplifts}
	widths := map[string]int{SheetMembers: len(membersColumns), SheetBeams: len(beamColumns), SheetPosts: len(postColumns),
		SheetConnections: len(connectionColumns), SheetFoundation: len(foundationColumns), SheetUplift: len(upliftColumns)}
	for _, sheet := range sheets {
		lastCol, _ := excelize.ColumnNumberToName(widths[sheet])
		dim := fmt.Sprintf(`<dimension ref="A1:%s%d"/>`, lastCol, HeaderRow+counts[sheet])
		if !bytes.Contains(gotParts[names[sheet]], []byte(dim)) {
			t.Errorf("%s: no %s", sheet, dim)
		}
		gotRows, err := got.GetRows(sheet)
		if err != nil {
			t.Fatal(err)
		}
		wantRows, err := want.GetRows(sheet)
		if err != nil {
			t.Fatal(err)
		}
		if len(gotRows) != HeaderRow+counts[sheet] || len(wantRows) != len(gotRows) {
			t.Fatalf("%s: %d rows, reference %d, want %d", sheet, len(gotRows), len(wantRows), HeaderRow+counts[sheet])
		}
		bad := 0
		for i := range wantRows {
			for j := 0; j < widths[sheet]; j++ {
				var g, w string
				if j < len(gotRows[i]) {
					g = gotRows[i][j]
				}
				if j < len(wantRows[i]) {
					w = wantRows[i][j]
				}
				cell, _ := excelize.CoordinatesToCellName(j+1, i+1)
				gs, err1 := got.GetCellStyle(sheet, cell)
				ws, err2 := want.GetCellStyle(sheet, cell)
				if err1 != nil || err2 != nil {
					t.Fatal(err1, err2)
				}
				if g != w && sameNumber(g, w) {
					g = w
				}
				if g != w || gs != ws {
					if bad++; bad <= 10 {
						t.Errorf("%s!%s: %.60q style %d, reference %.60q style %d", sheet, cell, g, gs, w, ws)
					}
				}
			}
		}
	}
	// The rows do hold what they were built from (the comparison is not of
	// two empty sheets): a shaded failing post and an "n/a".
	nanRow := 0
	for i, g := range connectionGroups(lp.Connections) {
		if g.items[0] == 6 {
			nanRow = HeaderRow + 1 + i
		}
	}
	if v, _ := got.GetCellValue(SheetConnections, fmt.Sprintf("F%d", nanRow)); v != "n/a" {
		t.Errorf("Connections!F%d %q, want n/a (NaN dead load)", nanRow, v)
	}
	if v, _ := got.GetCellValue(SheetBeams, "A4"); v != "B1" {
		t.Errorf("Beams!A4 %q, want B1", v)
	}
}

// bigUplift returns uplift at two bearings of each of n members, on n
// support lines (every second bearing below the report threshold), with
// text to escape in the names (common practice, no source).
func bigUplift(n int) UpliftReport {
	u := UpliftReport{ReportLb: 100}
	for i := range n {
		for j := 1; j <= 2; j++ {
			u.Bearings = append(u.Bearings, UpliftBearing{Member: fmt.Sprintf("M%d", i+1), Bearing: j,
				Support: fmt.Sprintf("WALL <&> handle %X", 0x200+(i+j)%n), SupportKind: "bearing-wall",
				UpliftLb: float64(50 + 97*j + i%300), Combo: "0.6D+0.6W(up)", CD: 1.6})
		}
	}
	return u
}

// TestUpliftSheetNone: with no uplift the Uplift sheet's one row says so,
// spliced as excelize writes it (common practice, no source).
func TestUpliftSheetNone(t *testing.T) {
	r := bigResults(20)
	spliced, stream := writeBothXLSX(t, r)
	var rows [2][][]string
	for i, path := range []string{spliced, stream} {
		f, err := excelize.OpenFile(path)
		if err != nil {
			t.Fatal(err)
		}
		rows[i], err = f.GetRows(SheetUplift)
		f.Close()
		if err != nil {
			t.Fatal(err)
		}
	}
	if fmt.Sprint(rows[0]) != fmt.Sprint(rows[1]) {
		t.Errorf("spliced %q, reference %q", rows[0], rows[1])
	}
	if len(rows[0]) != HeaderRow+1 || rows[0][HeaderRow][0] != "none" ||
		!strings.HasPrefix(rows[0][HeaderRow][len(upliftColumns)-1], "No bearing has a net uplift") {
		t.Errorf("rows %q, want the header and one row saying none", rows[0])
	}
}

// writeBothXLSX writes r's schedule spliced (as WriteXLSX does) and
// streamed cell by cell by excelize (the reference), into a fresh folder.
func writeBothXLSX(t *testing.T, r *Results) (spliced, stream string) {
	t.Helper()
	dir := t.TempDir()
	spliced, stream = filepath.Join(dir, "spliced.xlsx"), filepath.Join(dir, "stream.xlsx")
	if err := writeXLSX(spliced, r, false); err != nil {
		t.Fatal(err)
	}
	if err := writeXLSX(stream, r, true); err != nil {
		t.Fatal(err)
	}
	return spliced, stream
}

// zipParts reads every part of the zip at path, uncompressed.
func zipParts(t *testing.T, path string) map[string][]byte {
	t.Helper()
	zr, err := zip.OpenReader(path)
	if err != nil {
		t.Fatal(err)
	}
	defer zr.Close()
	out := map[string][]byte{}
	for _, f := range zr.File {
		rc, err := f.Open()
		if err != nil {
			t.Fatal(err)
		}
		b, err := io.ReadAll(rc) // fails on a CRC or size mismatch
		rc.Close()
		if err != nil {
			t.Fatalf("%s: %v", f.Name, err)
		}
		out[f.Name] = b
	}
	return out
}

// TestSheetParts: a sheet's part is found through the workbook's
// relationships, whatever its file is called, with a target relative to
// xl/ or absolute (ECMA-376 Part 2, 9.3.2: relationship targets; Annex A:
// part names); a sheet whose relationship is missing is an error.
func TestSheetParts(t *testing.T) {
	build := func(rels string) *zip.Reader {
		var buf bytes.Buffer
		zw := zip.NewWriter(&buf)
		for name, body := range map[string]string{
			workbookPart: `<?xml version="1.0"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="` + relNS + `">` +
				`<sheets><sheet name="Members" sheetId="1" r:id="rId7"/><sheet name="Posts &amp; caps" sheetId="2" r:id="rId2"/></sheets></workbook>`,
			workbookRelsPart: `<?xml version="1.0"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">` + rels + `</Relationships>`,
		} {
			w, _ := zw.Create(name)
			w.Write([]byte(body))
		}
		zw.Close()
		zr, err := zip.NewReader(bytes.NewReader(buf.Bytes()), int64(buf.Len()))
		if err != nil {
			t.Fatal(err)
		}
		return zr
	}
	ws := worksheetRelType
	parts, err := sheetParts(build(`<Relationship Id="rId2" Type="` + ws + `" Target="/xl/worksheets/posts.xml"/>` +
		`<Relationship Id="rId3" Type="` + relNS + `/styles" Target="styles.xml"/>` +
		`<Relationship Id="rId7" Type="` + ws + `" Target="worksheets/sheet9.xml"/>`))
	if err != nil {
		t.Fatal(err)
	}
	if parts["Members"] != "xl/worksheets/sheet9.xml" || parts["Posts & caps"] != "xl/worksheets/posts.xml" || len(parts) != 2 {
		t.Errorf("parts %q", parts)
	}
	if _, err := sheetParts(build(`<Relationship Id="rId7" Type="` + ws + `" Target="worksheets/sheet1.xml"/>`)); err == nil ||
		!strings.Contains(err.Error(), "Posts & caps") {
		t.Errorf("missing relationship: error %v, want one naming the sheet", err)
	}
}

// TestConnectionGroups: the Connections sheet gives joints alike (kind,
// bearing, carrier, loads and demands as the sheet rounds them) one row
// naming them all, whether or not they come one after another, at most
// connMembersPerRow a row; every joint is in exactly one row, and a
// joint with a value that is not finite has its own (common practice,
// no source).
func TestConnectionGroups(t *testing.T) {
	hang := func(m, carrier string, dead float64) Connection {
		return Connection{Kind: "hanger", Member: m, Bearing: 2, Carrier: carrier, Loads: TypeLoads{DeadLb: dead, LiveLb: 320},
			DownLb: dead + 320, DownCombo: "D+L"}
	}
	var cs []Connection
	for i := 0; i < 2*connMembersPerRow+5; i++ {
		cs = append(cs, hang(fmt.Sprintf("M%d", i+1), "B1", 96.4)) // 96 lb as the sheet rounds it
		cs = append(cs, hang(fmt.Sprintf("N%d", i+1), "B2", 96))
	}
	cs = append(cs, hang("X1", "B1", 96.6), hang("X2", "B1", math.NaN()), hang("X3", "B1", math.NaN()))
	n205 := &cs[len(cs)-4]
	n205.UpLb, n205.UpCombo = 0.2, "0.6D+0.6W" // up 1 lb as the sheet rounds it up: a row of its own
	gs := connectionGroups(cs)
	// B1: 205 joints alike in rows of 100, 100, 5; B2: 204 in 100, 100, 4
	// and N205 alone; X1 with more dead load, X2, X3 each alone
	want := []int{100, 100, 100, 100, 5, 4, 1, 1, 1, 1}
	var got []int
	seen := make([]int, len(cs))
	for _, g := range gs {
		got = append(got, len(g.items))
		first := connKey(&cs[g.items[0]])
		for _, j := range g.items {
			seen[j]++
			if k := connKey(&cs[j]); k != first && !math.IsNaN(cs[j].Loads.DeadLb) {
				t.Errorf("joint %s in the row of %s: %+v vs %+v", cs[j].Member, cs[g.items[0]].Member, k, first)
			}
		}
	}
	slices.Sort(got)
	slices.Reverse(got)
	if !slices.Equal(got, want) {
		t.Errorf("rows of %v joints, want %v", got, want)
	}
	for j, n := range seen {
		if n != 1 {
			t.Errorf("joint %s in %d rows", cs[j].Member, n)
		}
	}
	if gs[0].items[1] != 2 || cs[gs[0].items[1]].Member != "M2" {
		t.Errorf("first row's joints %v, want M1, M2, ... (every other joint)", gs[0].items[:3])
	}
}

// TestPostGroups: the Posts sheet gives posts alike (size, lumber, height,
// loads and demands as the sheet rounds them, ratio to 0.00, status,
// messages) one row naming them all, at most postMaxPerRow a row; a post
// that fails or is in error has its own row; every post is in exactly one
// row (common practice, no source).
func TestPostGroups(t *testing.T) {
	post := func(id string, dead float64) PathPost {
		return PathPost{ID: id, Size: "6x6", Species: "Douglas Fir-Larch", Grade: "No.1", HeightIn: 96, Checked: true,
			Loads: TypeLoads{DeadLb: dead, LiveLb: 4000}, DownLb: dead + 4000, DownCombo: "D+L",
			Checks: []Check{{Kind: "column", Ratio: 0.4012}}, Status: StatusPass}
	}
	var ps []PathPost
	for i := 0; i < postMaxPerRow+3; i++ {
		ps = append(ps, post(fmt.Sprintf("P%d", 2*i+1), 1200.2), post(fmt.Sprintf("P%d", 2*i+2), 1500))
	}
	ps[5].Checks = []Check{{Kind: "column", Ratio: 0.4049}} // 0.40 as shown: alike
	ps[7].Checks = []Check{{Kind: "column", Ratio: 0.4051}} // 0.41: its own row
	ps[9].Status, ps[11].Status = StatusFail, StatusFail    // alike, but failing: one row each
	ps[13].HeightIn = 120
	gs := postGroups(ps)
	seen := make([]int, len(ps))
	var sizes []int
	for _, g := range gs {
		sizes = append(sizes, len(g.items))
		for _, j := range g.items {
			seen[j]++
		}
	}
	for j, n := range seen {
		if n != 1 {
			t.Errorf("post %s in %d rows", ps[j].ID, n)
		}
	}
	// 1200.2 lb (P1, P3, ...): 103 posts alike -> rows of 100 and 3;
	// 1500 lb (P2, P4, ...): 103 less P8 (0.4051 reads 0.41), P10 and
	// P12 (failing) and P14 (10 ft high), each alone -> 99 (P6's 0.4049
	// reads 0.40 and stays)
	slices.Sort(sizes)
	slices.Reverse(sizes)
	want := []int{100, 99, 3, 1, 1, 1, 1}
	if !slices.Equal(sizes, want) {
		t.Errorf("rows of %v posts, want %v", sizes, want)
	}
}

// TestFoundationGroups: the Foundation sheet gives posts whose loads read
// the same (to the pound) one row naming them all; each wall line has
// its own row; every line is in exactly one row (common practice, no
// source).
func TestFoundationGroups(t *testing.T) {
	var fs []FoundationLine
	for i := 0; i < 5; i++ {
		fs = append(fs, FoundationLine{Kind: "post", ID: fmt.Sprintf("P%d", i+1), Loads: TypeLoads{DeadLb: 1200.2 + float64(i%2)*0.1, LiveLb: 4000}})
	}
	fs = append(fs, FoundationLine{Kind: "wall", ID: "W1", LengthIn: 240, Loads: TypeLoads{DeadLb: 1200.2, LiveLb: 4000}},
		FoundationLine{Kind: "wall", ID: "W2", LengthIn: 240, Loads: TypeLoads{DeadLb: 1200.2, LiveLb: 4000}},
		FoundationLine{Kind: "post", ID: "P6", Loads: TypeLoads{DeadLb: 1201, LiveLb: 4000}},
		FoundationLine{Kind: "post", ID: "P7", Loads: TypeLoads{DeadLb: math.NaN()}}, FoundationLine{Kind: "post", ID: "P8", Loads: TypeLoads{DeadLb: math.NaN()}})
	gs := foundationGroups(fs)
	var got [][]string
	for _, g := range gs {
		var ids []string
		for _, j := range g.items {
			ids = append(ids, fs[j].ID)
		}
		got = append(got, ids)
	}
	want := [][]string{{"P1", "P2", "P3", "P4", "P5"}, {"W1"}, {"W2"}, {"P6"}, {"P7"}, {"P8"}}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("rows %v, want %v", got, want)
	}
}
