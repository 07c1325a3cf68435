package export

import (
	"archive/zip"
	"bufio"
	"bytes"
	"fmt"
	"io"
	"strconv"

	"github.com/klauspost/compress/flate"
	"github.com/xuri/excelize/v2"
)

// Sheet names of schedule.xlsx, in workbook order.
const (
	SheetMembers  = "Members"
	SheetMarks    = "Marks"
	SheetBlocking = "Blocking"
	SheetTakeoff  = "Takeoff"
	SheetUplift   = "Uplift"
	SheetInputs   = "Inputs"
	SheetNotes    = "Notes"
)

// SheetNames lists the sheets of schedule.xlsx in order.
var SheetNames = []string{SheetMembers, SheetMarks, SheetBlocking, SheetTakeoff, SheetUplift, SheetInputs, SheetNotes}

// WriteXLSX writes the member schedule with takeoff to path, atomically:
// excelize builds the workbook (styles, every sheet, streamed), and the
// rows of the large sheets (Members, one row per member, and the load
// path's Beams, Posts, Connections and Foundation) are written by
// spliceSheets in blocks on every core, so that 100,000 members take well
// under a second. Each sheet has a frozen header row, an autofilter over its table and
// set column widths; ratios show as 0.00, lengths as ft-in text (with the
// inches as a number beside them where sorting needs it); failing and
// erroring members' rows are shaded and ratios over 1.00 are bold red. A
// non-finite number is written as the text "n/a". A path ending in .dxf is
// refused.
func WriteXLSX(path string, r *Results) error {
	return writeXLSX(path, r, false)
}

// writeXLSX is WriteXLSX; with stream set every row of every sheet is
// written by excelize's stream writer, cell by cell, and nothing is
// spliced: the workbook the spliced rows must read back as (the tests'
// reference, and how the schedule was written before).
func writeXLSX(path string, r *Results, stream bool) error {
	if err := refuseDrawing(path); err != nil {
		return err
	}
	f := excelize.NewFile()
	defer f.Close()
	f.SetZipWriter(fastZip)
	st, err := newStyles(f)
	if err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	st.title = SheetTitle(r)
	// Before any sheet is streamed: called after, it makes excelize read
	// the streamed Members sheet back into memory and write it out again
	// (at 10,000 members the schedule took 2.3 s instead of 0.3 s).
	f.SetActiveSheet(0)
	// the Uplift sheet and the load path's sheets (their rows grouped
	// once, for the sheets' sizes and their rows)
	var pathSheets []splicedSheet
	if r.LoadPath != nil {
		pathSheets = loadPathSheets(r.LoadPath)
	}
	uplift := upliftSheet(r)
	writers := []func(*excelize.File, *styles, *Results) error{
		func(f *excelize.File, st *styles, r *Results) error { return writeMembers(f, st, r, stream) },
		writeMarks, writeBlocking, writeTakeoff,
		func(f *excelize.File, st *styles, r *Results) error {
			return writeSplicedSheets(f, st, []splicedSheet{uplift}, stream)
		},
		func(f *excelize.File, st *styles, r *Results) error {
			return writeSplicedSheets(f, st, pathSheets, stream)
		},
		writeInputs, writeNotes,
	}
	for _, w := range writers {
		if err := w(f, st, r); err != nil {
			return fmt.Errorf("export: %s: %w", path, err)
		}
	}
	var spliced []splicedSheet
	if !stream {
		spliced = append(spliced, splicedSheet{name: SheetMembers, cols: membersColumns, rows: len(r.Members),
			row: func(s *rowCells, i int) { memberRow(s, &r.Members[i]) }})
		spliced = append(spliced, uplift)
		spliced = append(spliced, pathSheets...)
	}
	// The workbook without those rows is small; the rows are added to it
	// as it is copied to the file (xlsx_splice.go).
	var book bytes.Buffer
	if err := f.Write(&book); err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	return writeAtomic(path, func(w *bufio.Writer) error {
		return spliceSheets(w, book.Bytes(), st, spliced)
	})
}

// fastZip is the workbook's zip writer with deflate at flate.BestSpeed:
// the default level took 1.1 s of a 100,000-member schedule's 2.8 s;
// BestSpeed takes a third of that for a file a third larger (14 MB
// instead of 11 MB). The deflater is github.com/klauspost/compress's,
// compress/flate's API and format: at level 1 it deflated the
// 100,000-member Members sheet's XML (115 MB) in 0.085 s where
// compress/flate took 0.172 s, to 4.7 MB instead of 5.1 MB. The tests
// read the parts back with compress/flate.
func fastZip(w io.Writer) excelize.ZipWriter {
	zw := zip.NewWriter(w)
	zw.RegisterCompressor(zip.Deflate, func(out io.Writer) (io.WriteCloser, error) {
		return flate.NewWriter(out, flate.BestSpeed)
	})
	return zw
}

// cellKind picks a number format.
type cellKind int

const (
	cText  cellKind = iota
	cNum1           // 0.0
	cRatio          // 0.00
	cInt            // 0
	cIn             // 0.00: inches (the formatting rule: in to 0.01)
	cLb             // #,##0: pounds and psi to the nearest 1, grouped
	cGen            // General: a value of any kind (the Inputs sheet)
	nKinds
)

// TitleRows is the number of rows above each sheet's header row: the
// project's title block and the tool version (SheetTitle).
const TitleRows = 2

// HeaderRow is the 1-based row of each sheet's header; its data start on
// the row after it.
const HeaderRow = TitleRows + 1

// SheetTitle is the title block written in the first rows of every sheet:
// the project (name, number, address) and who, revision and date, then
// the plan and the framecheck version. Empty project fields are left out.
func SheetTitle(r *Results) [TitleRows]string {
	lines := r.Project.Lines()
	var t [TitleRows]string
	v := r.ToolVersion
	if v == "" {
		v = "version not stamped"
	}
	tail := "plan " + r.Plan + "; framecheck " + v
	switch len(lines) {
	case 0:
		t[0], t[1] = "Joist check: "+r.Plan, tail
	case 1:
		t[0], t[1] = lines[0], tail
	default:
		t[0], t[1] = lines[0], lines[1]+"; "+tail
	}
	return t
}

// styles holds the style ids: plain, in a failing row, and a ratio over 1.
type styles struct {
	title [TitleRows]string // SheetTitle of the results
	// dims is each streamed sheet's used range ("A1:K20"), by sheet
	// name, for its dimension element (spliceSheets): excelize's stream
	// writer leaves "A1", and a reader that trusts the dimension (such as
	// openpyxl's read-only mode) then sees one cell
	dims   map[string]string
	bold   int // the first title row
	header int
	plain  [nKinds]int
	fail   [nKinds]int
	high   int // ratio > 1.00
	highOK int // ratio > 1.00 in a row not otherwise marked (should not happen)
}

func newStyles(f *excelize.File) (*styles, error) {
	st := styles{dims: map[string]string{}}
	var err error
	if st.bold, err = f.NewStyle(&excelize.Style{Font: &excelize.Font{Bold: true, Size: 12}}); err != nil {
		return nil, err
	}
	st.header, err = f.NewStyle(&excelize.Style{
		Font:      &excelize.Font{Bold: true},
		Fill:      excelize.Fill{Type: "pattern", Pattern: 1, Color: []string{"D9D9D9"}},
		Border:    []excelize.Border{{Type: "bottom", Color: "000000", Style: 1}},
		Alignment: &excelize.Alignment{WrapText: true, Vertical: "top"},
	})
	if err != nil {
		return nil, err
	}
	formats := [nKinds]string{cText: "@", cNum1: "0.0", cRatio: "0.00", cInt: "0", cIn: "0.00", cLb: "#,##0", cGen: "General"}
	failFill := excelize.Fill{Type: "pattern", Pattern: 1, Color: []string{"F8CBAD"}}
	for k := cellKind(0); k < nKinds; k++ {
		fm := formats[k]
		if st.plain[k], err = f.NewStyle(&excelize.Style{CustomNumFmt: &fm}); err != nil {
			return nil, err
		}
		if st.fail[k], err = f.NewStyle(&excelize.Style{CustomNumFmt: &fm, Fill: failFill}); err != nil {
			return nil, err
		}
	}
	ratio := formats[cRatio]
	red := &excelize.Font{Bold: true, Color: "C00000"}
	if st.high, err = f.NewStyle(&excelize.Style{CustomNumFmt: &ratio, Fill: failFill, Font: red}); err != nil {
		return nil, err
	}
	if st.highOK, err = f.NewStyle(&excelize.Style{CustomNumFmt: &ratio, Font: red}); err != nil {
		return nil, err
	}
	return &st, nil
}

// sheet is one streamed worksheet with a header row.
type sheet struct {
	rowCells
	f     *excelize.File
	sw    *excelize.StreamWriter
	name  string
	ncols int
	row   int
	cells []any           // pointers into excel, for SetRow
	excel []excelize.Cell // the row's cells as excelize takes them
}

// column is a header cell and its width in characters.
type column struct {
	Head  string
	Width float64
}

func newSheet(f *excelize.File, st *styles, name string, cols []column) (*sheet, error) {
	if name == SheetMembers {
		if err := f.SetSheetName("Sheet1", name); err != nil {
			return nil, err
		}
	} else if _, err := f.NewSheet(name); err != nil {
		return nil, err
	}
	sw, err := f.NewStreamWriter(name)
	if err != nil {
		return nil, err
	}
	for i, c := range cols {
		if err := sw.SetColWidth(i+1, i+1, c.Width); err != nil {
			return nil, err
		}
	}
	first := "A" + strconv.Itoa(HeaderRow+1)
	if err := sw.SetPanes(&excelize.Panes{Freeze: true, YSplit: HeaderRow, TopLeftCell: first, ActivePane: "bottomLeft"}); err != nil {
		return nil, err
	}
	s := &sheet{rowCells: rowCells{st: st}, f: f, sw: sw, name: name, ncols: len(cols)}
	for i, line := range st.title {
		style := 0
		if i == 0 {
			style = st.bold
		}
		if err := sw.SetRow("A"+strconv.Itoa(i+1), []any{excelize.Cell{StyleID: style, Value: line}}); err != nil {
			return nil, err
		}
	}
	head := make([]any, len(cols))
	for i, c := range cols {
		head[i] = excelize.Cell{StyleID: st.header, Value: c.Head}
	}
	s.row = HeaderRow
	if err := sw.SetRow("A"+strconv.Itoa(HeaderRow), head, excelize.RowOpts{Height: 30}); err != nil {
		return nil, err
	}
	return s, nil
}

// end writes the row.
func (s *sheet) end() error {
	s.row++
	cell, err := excelize.CoordinatesToCellName(1, s.row)
	if err != nil {
		return err
	}
	// Pointers, not values: a Cell boxed in an interface would be one
	// allocation per cell.
	s.excel = s.excel[:0]
	for i := range s.store {
		s.excel = append(s.excel, s.store[i].excelizeCell())
	}
	s.cells = s.cells[:0]
	for i := range s.excel {
		s.cells = append(s.cells, &s.excel[i])
	}
	return s.sw.SetRow(cell, s.cells)
}

// close sets the autofilter over the table, records the sheet's used
// range and flushes the sheet.
func (s *sheet) close() error {
	last, err := excelize.CoordinatesToCellName(s.ncols, max(s.row, HeaderRow+1))
	if err != nil {
		return err
	}
	if err := s.f.AutoFilter(s.name, "A"+strconv.Itoa(HeaderRow)+":"+last, nil); err != nil {
		return err
	}
	used, err := excelize.CoordinatesToCellName(s.ncols, s.row)
	if err != nil {
		return err
	}
	s.st.dims[s.name] = "A1:" + used
	return s.sw.Flush()
}
