package export

import (
	"bytes"
	"framecheck/export/internal/fmtx"
	"hash/crc32"
	"math"
	"runtime"
	"strconv"
	"strings"
	"sync"
	"unicode/utf16"
	"unicode/utf8"

	"github.com/klauspost/compress/flate"
	"github.com/xuri/excelize/v2"
)

// The Members sheet holds one row of 26 cells per member: 2.6 million
// cells at 100,000 members, where excelize's stream writer spends about
// half a microsecond a cell (2 s in all). So excelize writes the workbook
// (styles, every other sheet, the Members sheet's columns, header row,
// frozen pane and autofilter) and the member rows are written here as
// SpreadsheetML (ECMA-376 Part 1, 18.3.1.73 row, 18.3.1.4 c, 18.3.1.53
// is: inline strings), in blocks of rows that are built and deflated on
// every core at once, then spliced into excelize's sheet part
// (spliceSheets). The Uplift sheet (xlsx_uplift.go) and the load path's
// sheets (xlsx_loadpath.go) take the same way. The cells are the same values, with the same styles, that the
// sheet helpers hand to excelize's stream writer (xcell.excelizeCell).

// rowsPerBlock is how many rows one block holds (about 3 MB of XML for
// member rows, 1 MB for connections).
const rowsPerBlock = 2048

// rowCells builds one row's cells with the schedule's styles.
type rowCells struct {
	st    *styles
	fail  bool
	store []xcell
}

// xcell is one cell of a row: its style and its value, of the kind it
// says, held typed (an excelize.Cell holds its value in an interface,
// which for a number or a text is an allocation a cell: 2.6 million at
// 100,000 members).
type xcell struct {
	style int
	kind  xcellKind
	text  string
	num   float64
	i     int
}

type xcellKind uint8

const (
	xEmpty xcellKind = iota // a styled cell without a value
	xText
	xNum
	xInt
)

// excelizeCell returns c as excelize writes it (the stream writer, for
// the sheets written cell by cell and the tests' reference).
func (c *xcell) excelizeCell() excelize.Cell {
	switch c.kind {
	case xText:
		return excelize.Cell{StyleID: c.style, Value: c.text}
	case xNum:
		return excelize.Cell{StyleID: c.style, Value: c.num}
	case xInt:
		return excelize.Cell{StyleID: c.style, Value: c.i}
	}
	return excelize.Cell{StyleID: c.style}
}

// begin starts a row; fail shades it.
func (s *rowCells) begin(fail bool) {
	s.fail = fail
	s.store = s.store[:0]
}

func (s *rowCells) style(k cellKind) int {
	if s.fail {
		return s.st.fail[k]
	}
	return s.st.plain[k]
}

// text adds a text cell; an empty one is a styled cell without a value.
func (s *rowCells) text(v string) {
	if v == "" {
		s.store = append(s.store, xcell{style: s.style(cText)})
		return
	}
	s.store = append(s.store, xcell{style: s.style(cText), kind: xText, text: v})
}

// num adds a number cell with format k; non-finite numbers become "n/a".
func (s *rowCells) num(v float64, k cellKind) {
	if !finite(v) {
		s.store = append(s.store, xcell{style: s.style(cText), kind: xText, text: "n/a"})
		return
	}
	s.store = append(s.store, xcell{style: s.style(k), kind: xNum, num: v})
}

// integer adds an integer cell.
func (s *rowCells) integer(v int) {
	s.store = append(s.store, xcell{style: s.style(cInt), kind: xInt, i: v})
}

// ratio adds a ratio cell, bold red over 1.00; ok=false leaves it blank.
func (s *rowCells) ratio(v float64, ok bool) {
	switch {
	case !ok:
		s.store = append(s.store, xcell{style: s.style(cText)})
	case finite(v) && v > 1.0:
		id := s.st.highOK
		if s.fail {
			id = s.st.high
		}
		s.store = append(s.store, xcell{style: id, kind: xNum, num: v})
	default:
		s.num(v, cRatio)
	}
}

// memberRow fills s with member m's cells, in membersColumns order.
func memberRow(s *rowCells, m *Member) {
	s.begin(m.Status != StatusPass)
	s.text(m.ID)
	s.text(m.Mark)
	s.text(m.Size)
	s.text(speciesGrade(m.Species, m.Grade))
	s.text(ftInList(m.SpansIn))
	if m.OverhangsIn[0] != 0 || m.OverhangsIn[1] != 0 {
		s.text(FtIn(m.OverhangsIn[0]) + " / " + FtIn(m.OverhangsIn[1]))
	} else {
		s.text("")
	}
	s.text(FtIn(m.LengthIn))
	s.num(m.SpacingIn, cIn)
	s.num(m.TribIn, cIn)
	s.text(m.Zone)
	var kindRatio [6]float64
	var kindSeen [6]bool
	for _, c := range m.Checks {
		for k, kind := range CheckKinds {
			if c.Kind == kind && (!kindSeen[k] || c.Ratio > kindRatio[k] || !finite(c.Ratio)) {
				kindRatio[k], kindSeen[k] = c.Ratio, true
			}
		}
	}
	for k := range CheckKinds {
		s.ratio(kindRatio[k], kindSeen[k])
	}
	g, ok := governingCheck(m)
	s.text(m.Governing)
	if ok {
		s.text(fmtx.Combo(g.Combo))
	} else {
		s.text("")
	}
	s.ratio(m.MaxRatio, len(m.Checks) > 0 || m.MaxRatio != 0)
	rowsPerSpan(s, m.BlockingRowsPerSpan)
	s.text(ftInList(m.fromFaceList(m.BlockingAtIn)))
	s.text(m.Status)
	s.text(m.Layer)
	s.text(m.Handle)
	s.text(m.Location)
	msgs := strings.Join(m.Messages, "; ")
	if m.Generated {
		msgs = strings.TrimSuffix(generatedNote+"; "+msgs, "; ")
	}
	s.text(msgs)
}

// generatedNote opens the Messages cell of a generated member (Handle is
// then its bay's outline or span line).
const generatedNote = "generated: not drawn, laid out in the bay of this handle from its span symbol and callout"

// rowsPerSpan adds the blocking rows per span as a number when every span
// has the same count (or there is one span), as text ("1, 2") otherwise,
// and empty when the member has none.
func rowsPerSpan(s *rowCells, rows []int) {
	if len(rows) == 0 {
		s.text("")
		return
	}
	for _, n := range rows[1:] {
		if n != rows[0] {
			s.text(intList(rows))
			return
		}
	}
	s.integer(rows[0])
}

// colNames are the column letters A, B, ... of the spliced sheets: as many
// as the widest of them has (spliceSheets checks).
var colNames = func() []string {
	out := make([]string, max(len(membersColumns), len(beamColumns), len(postColumns), len(connectionColumns), len(foundationColumns)))
	for i := range out {
		out[i], _ = excelize.ColumnNumberToName(i + 1)
	}
	return out
}()

// appendRow appends row number r with cells as a SpreadsheetML <row>.
// Its cells fill the columns from A without a gap, so they carry no
// reference: a cell without r is the one after the cell before it
// (ECMA-376 Part 1, 18.3.1.4: r is optional). A reference holding the
// row's number made every row's XML differ from the one above and halved
// what deflate finds to repeat: without them the Members sheet of
// 100,000 members deflates in half the time to a third of the size.
func appendRow(b []byte, r int, cells []xcell) []byte {
	b = append(b, `<row r="`...)
	b = strconv.AppendInt(b, int64(r), 10)
	b = append(b, `">`...)
	for i := range cells {
		c := &cells[i]
		b = append(b, `<c`...)
		if c.style != 0 {
			b = append(b, ` s="`...)
			b = strconv.AppendInt(b, int64(c.style), 10)
			b = append(b, '"')
		}
		switch c.kind {
		case xEmpty:
			b = append(b, `/>`...)
		case xText:
			b = append(b, ` t="inlineStr"><is><t`...)
			if c.text != strings.TrimSpace(c.text) {
				b = append(b, ` xml:space="preserve"`...)
			}
			b = append(b, '>')
			b = appendXMLText(b, c.text)
			b = append(b, `</t></is></c>`...)
		case xNum:
			b = append(b, `><v>`...)
			b = appendCellNumber(b, c.num)
			b = append(b, `</v></c>`...)
		case xInt:
			b = append(b, `><v>`...)
			b = strconv.AppendInt(b, int64(c.i), 10)
			b = append(b, `</v></c>`...)
		}
	}
	return append(b, `</row>`...)
}

// appendCellNumber writes a finite number as a cell value, the shortest
// decimal that reads back as v: plain digits, exponent form (xsd:double)
// only for magnitudes whose digits would run long.
func appendCellNumber(b []byte, v float64) []byte {
	if a := math.Abs(v); a != 0 && (a < 1e-20 || a >= 1e21) {
		return strconv.AppendFloat(b, v, 'E', -1, 64)
	}
	return strconv.AppendFloat(b, v, 'f', -1, 64)
}

// maxCellChars is the most UTF-16 units a cell holds (the spreadsheet
// limit of 32,767 characters).
const maxCellChars = 32767

// appendXMLText appends s as XML character data: &, < and > escaped,
// carriage returns and tabs as character references (so they survive
// reading), bytes that are not valid UTF-8 and characters XML 1.0 does
// not allow as U+FFFD, and at most maxCellChars UTF-16 units.
func appendXMLText(b []byte, s string) []byte {
	if len(s) <= maxCellChars && plainXMLText(s) {
		return append(b, s...) // most cells: nothing to escape or cut
	}
	units := 0
	for i := 0; i < len(s); {
		r, n := rune(s[i]), 1
		if r >= utf8.RuneSelf {
			r, n = utf8.DecodeRuneInString(s[i:])
		}
		if units += utf16.RuneLen(max(r, 0)); units > maxCellChars {
			break
		}
		switch {
		case r == '&':
			b = append(b, "&amp;"...)
		case r == '<':
			b = append(b, "&lt;"...)
		case r == '>':
			b = append(b, "&gt;"...)
		case r == '\r':
			b = append(b, "&#xD;"...)
		case r == '\t':
			b = append(b, "&#x9;"...)
		case r == '\n':
			b = append(b, '\n')
		case r == utf8.RuneError && n == 1, r < 0x20, r >= 0xD800 && r < 0xE000, r == 0xFFFE, r == 0xFFFF:
			b = utf8.AppendRune(b, '\uFFFD')
		default:
			b = append(b, s[i:i+n]...)
		}
		i += n
	}
	return b
}

// plainXMLText reports whether s is ASCII that appendXMLText copies as it
// is: no control character but newline, no &, < or >.
func plainXMLText(s string) bool {
	for i := 0; i < len(s); i++ {
		if c := s[i]; (c < 0x20 && c != '\n') || c >= utf8.RuneSelf || c == '&' || c == '<' || c == '>' {
			return false
		}
	}
	return true
}

// rowBlock is one block of member rows, as XML and deflated.
type rowBlock struct {
	raw, deflated []byte
}

// rowBlocks builds rows rows of ncols cells, row i's cells by build (row
// numbers from HeaderRow+1, after the title rows and the header), in
// blocks on every core, and hands each block to emit in order.
// Each block is deflated on its own and ended with a sync flush, so the
// blocks joined make one deflate stream (RFC 1951, 3.2.3: a stream is a
// series of blocks; only the last has BFINAL set) once a final empty
// block follows. build must be safe to call from several goroutines at
// once (each has its own rowCells). emit must not keep b.raw: its buffer
// is used again for a later block.
func rowBlocks(st *styles, rows, ncols int, build func(s *rowCells, i int), emit func(rowBlock) error) error {
	blocks := (rows + rowsPerBlock - 1) / rowsPerBlock
	workers := min(runtime.GOMAXPROCS(0), max(blocks, 1))
	type done struct {
		i int
		b rowBlock
	}
	jobs := make(chan int)
	results := make(chan done, workers)
	// The blocks' XML buffers go round: once emitted, a block's buffer
	// is free for a block to come (100,000 members took 160 MB of fresh
	// memory, a new buffer per block, and the system's time to hand it
	// out page by page).
	free := make(chan []byte, 3*workers+1)
	// Workers may run at most 2*workers blocks ahead of the writer, so
	// memory stays a few blocks however large the plan.
	slots := make(chan struct{}, 2*workers)
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			rc := rowCells{st: st}
			var zbuf bytes.Buffer
			zw, _ := flate.NewWriter(&zbuf, flate.BestSpeed)
			for i := range jobs {
				lo, hi := i*rowsPerBlock, min((i+1)*rowsPerBlock, rows)
				var raw []byte
				select {
				case raw = <-free:
				default:
					raw = make([]byte, 0, (hi-lo)*ncols*64)
				}
				for k := lo; k < hi; k++ {
					build(&rc, k)
					raw = appendRow(raw, k+HeaderRow+1, rc.store)
				}
				zbuf.Reset()
				zw.Reset(&zbuf)
				zw.Write(raw)
				zw.Flush()
				results <- done{i, rowBlock{raw: raw, deflated: bytes.Clone(zbuf.Bytes())}}
			}
		}()
	}
	stop := make(chan struct{})
	go func() {
		defer close(jobs)
		for i := 0; i < blocks; i++ {
			select {
			case slots <- struct{}{}:
			case <-stop:
				return
			}
			select {
			case jobs <- i:
			case <-stop:
				return
			}
		}
	}()
	go func() {
		wg.Wait()
		close(results)
	}()
	pending := map[int]rowBlock{}
	next := 0
	var err error
	for d := range results {
		pending[d.i] = d.b
		for err == nil {
			b, ok := pending[next]
			if !ok {
				break
			}
			delete(pending, next)
			next++
			<-slots
			if err = emit(b); err != nil {
				close(stop)
			}
			select {
			case free <- b.raw[:0]:
			default:
			}
		}
		if err != nil {
			// Drain the workers' results so they can finish.
			for range results {
				<-slots
			}
			break
		}
	}
	return err
}

// deflatedPart is a zip part deflated piecewise, with what its local
// header needs.
type deflatedPart struct {
	pieces   [][]byte
	crc      uint32
	raw, cmp uint64
}

// add appends raw data already deflated (sync-flushed) as z.
func (p *deflatedPart) add(raw, z []byte) {
	p.crc = crc32.Update(p.crc, crc32.IEEETable, raw)
	p.raw += uint64(len(raw))
	p.cmp += uint64(len(z))
	p.pieces = append(p.pieces, z)
}

// deflatePiece deflates raw on its own with a sync flush.
func deflatePiece(raw []byte) []byte {
	var buf bytes.Buffer
	zw, _ := flate.NewWriter(&buf, flate.BestSpeed)
	zw.Write(raw)
	zw.Flush()
	return buf.Bytes()
}

// finalBlock is an empty deflate block with BFINAL set, ending a stream.
func finalBlock() []byte {
	var buf bytes.Buffer
	zw, _ := flate.NewWriter(&buf, flate.BestSpeed)
	zw.Close()
	return buf.Bytes()
}
