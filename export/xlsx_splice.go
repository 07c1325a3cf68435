package export

import (
	"archive/zip"
	"bytes"
	"encoding/xml"
	"errors"
	"fmt"
	"io"
	"path"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"time"
)

// dimensionRE matches a worksheet's <dimension ref="..."/> element
// (ECMA-376 Part 1, 18.3.1.35), which spliceSheets sets to the table's
// full range.
var dimensionRE = regexp.MustCompile(`<dimension ref="[^"]*"\s*(/>|></dimension>)`)

// splicedSheet is a sheet whose rows are written here, in blocks on every
// core (rowBlocks), rather than by excelize: excelize writes its columns,
// title and header rows, frozen pane and autofilter, and spliceSheets adds
// the rows.
type splicedSheet struct {
	name string
	cols []column
	rows int
	// row fills s with data row i's cells (0-based), len(cols) of them;
	// it is called from several goroutines at once.
	row func(s *rowCells, i int)
}

// spliceSheets copies the workbook book (a zip that excelize wrote, in
// which each of sheets holds its title and header rows only) to w, with
// each sheet's rows added to its data: every other part is copied as it
// is, still compressed; a spliced sheet's part is rewritten from its head
// (everything up to </sheetData>), the rows and its tail. Each sheet's
// part is found by its name through the workbook and its relationships
// (sheetParts).
func spliceSheets(w io.Writer, book []byte, st *styles, sheets []splicedSheet) error {
	zr, err := zip.NewReader(bytes.NewReader(book), int64(len(book)))
	if err != nil {
		return err
	}
	parts, err := sheetParts(zr)
	if err != nil {
		return err
	}
	byPart := map[string]*splicedSheet{}
	for i := range sheets {
		ss := &sheets[i]
		if len(ss.cols) > len(colNames) {
			return fmt.Errorf("sheet %s: %d columns, at most %d can be spliced", ss.name, len(ss.cols), len(colNames))
		}
		part, ok := parts[ss.name]
		if !ok {
			return fmt.Errorf("the workbook has no sheet %s", ss.name)
		}
		byPart[part] = ss
	}
	// the other streamed sheets' dimensions, set to their used range
	dimOf := map[string]string{}
	for name, dim := range st.dims {
		if part, ok := parts[name]; ok && byPart[part] == nil {
			dimOf[part] = dim
		}
	}
	zw := zip.NewWriter(w)
	for _, f := range partOrder(zr.File) {
		ss := byPart[f.Name]
		if ss == nil {
			var err error
			if dim, ok := dimOf[f.Name]; ok {
				err = writeDimensionedPart(zw, f, dim)
			} else {
				err = copyPart(zw, f)
			}
			if err != nil {
				return err
			}
			continue
		}
		delete(byPart, f.Name)
		if err := writeSplicedPart(zw, f, st, ss); err != nil {
			return fmt.Errorf("%s (sheet %s): %w", f.Name, ss.name, err)
		}
	}
	for part, ss := range byPart {
		return fmt.Errorf("the workbook has no part %s for the sheet %s", part, ss.name)
	}
	return zw.Close()
}

// Relationship types and the workbook part (ECMA-376 Part 1, 12.3.23 and
// 15.2.12; Part 2, 9.3 package relationships).
const (
	workbookPart     = "xl/workbook.xml"
	workbookRelsPart = "xl/_rels/workbook.xml.rels"
	relNS            = "http://schemas.openxmlformats.org/officeDocument/2006/relationships"
	worksheetRelType = relNS + "/worksheet"
)

// sheetParts maps each worksheet's name to its part in the package, as
// the workbook part lists the sheets (<sheet name="..." r:id="..."/>) and
// its relationships part gives each relationship's target, relative to
// the workbook's folder xl/ unless it starts with "/" (ECMA-376 Part 2,
// 9.3.2 and Annex A, part names).
func sheetParts(zr *zip.Reader) (map[string]string, error) {
	var wb struct {
		Sheets []struct {
			Name string `xml:"name,attr"`
			RID  string `xml:"http://schemas.openxmlformats.org/officeDocument/2006/relationships id,attr"`
		} `xml:"sheets>sheet"`
	}
	var rels struct {
		Rels []struct {
			ID     string `xml:"Id,attr"`
			Type   string `xml:"Type,attr"`
			Target string `xml:"Target,attr"`
		} `xml:"Relationship"`
	}
	if err := readXMLPart(zr, workbookPart, &wb); err != nil {
		return nil, err
	}
	if err := readXMLPart(zr, workbookRelsPart, &rels); err != nil {
		return nil, err
	}
	targets := map[string]string{}
	for _, r := range rels.Rels {
		if r.Type != worksheetRelType {
			continue
		}
		if strings.HasPrefix(r.Target, "/") {
			targets[r.ID] = strings.TrimPrefix(path.Clean(r.Target), "/")
		} else {
			targets[r.ID] = path.Join("xl", r.Target)
		}
	}
	out := map[string]string{}
	for _, s := range wb.Sheets {
		t, ok := targets[s.RID]
		if !ok {
			return nil, fmt.Errorf("%s: sheet %s: no worksheet relationship %q in %s", workbookPart, s.Name, s.RID, workbookRelsPart)
		}
		out[s.Name] = t
	}
	return out, nil
}

// readXMLPart decodes the XML part name of zr into v.
func readXMLPart(zr *zip.Reader, name string, v any) error {
	f, err := zr.Open(name)
	if err != nil {
		return err
	}
	defer f.Close()
	if err := xml.NewDecoder(f).Decode(v); err != nil {
		return fmt.Errorf("%s: %w", name, err)
	}
	return nil
}

// partOrder returns the parts of a workbook in a fixed order, so that the
// same results give a byte-identical schedule.xlsx (excelize writes its
// parts in map order, which varies from run to run): [Content_Types].xml
// and the package relationships first, as ECMA-376 Part 2 lays a package
// out by custom, then every other part by name.
func partOrder(files []*zip.File) []*zip.File {
	rank := func(name string) int {
		switch name {
		case "[Content_Types].xml":
			return 0
		case "_rels/.rels":
			return 1
		}
		return 2
	}
	out := append([]*zip.File(nil), files...)
	sort.SliceStable(out, func(i, j int) bool {
		ri, rj := rank(out[i].Name), rank(out[j].Name)
		if ri != rj {
			return ri < rj
		}
		return out[i].Name < out[j].Name
	})
	return out
}

// copyPart copies a part as it is, still compressed, with a fixed time.
func copyPart(zw *zip.Writer, f *zip.File) error {
	fh := f.FileHeader
	fixTime(&fh)
	r, err := f.OpenRaw()
	if err != nil {
		return err
	}
	w, err := zw.CreateRaw(&fh)
	if err != nil {
		return err
	}
	_, err = io.Copy(w, r)
	return err
}

// fixTime gives a part the zip format's zero date and time (what excelize
// writes), whatever the clock says: the file then depends on the results
// alone.
func fixTime(fh *zip.FileHeader) {
	fh.Modified = time.Time{}
	fh.ModifiedTime, fh.ModifiedDate = 0, 0
}

// readPart returns the uncompressed bytes of the part f.
func readPart(f *zip.File) ([]byte, error) {
	rc, err := f.Open()
	if err != nil {
		return nil, err
	}
	defer rc.Close()
	return io.ReadAll(rc)
}

// writeDimensionedPart writes the sheet part f with its dimension set to
// the range dim (ECMA-376 Part 1, 18.3.1.35), deflated afresh.
func writeDimensionedPart(zw *zip.Writer, f *zip.File, dim string) error {
	data, err := readPart(f)
	if err != nil {
		return err
	}
	if !dimensionRE.Match(data) {
		return fmt.Errorf("%s: no dimension element to set", f.Name)
	}
	data = dimensionRE.ReplaceAll(data, []byte(`<dimension ref="`+dim+`"/>`))
	fh := f.FileHeader
	fixTime(&fh)
	fh.Method = zip.Deflate
	fh.CompressedSize64, fh.UncompressedSize64, fh.CRC32 = 0, 0, 0
	fh.CompressedSize, fh.UncompressedSize = 0, 0
	out, err := zw.CreateHeader(&fh)
	if err != nil {
		return err
	}
	_, err = out.Write(data)
	return err
}

// writeSplicedPart writes the sheet part f with ss's rows put in before
// </sheetData>.
func writeSplicedPart(zw *zip.Writer, f *zip.File, st *styles, ss *splicedSheet) error {
	data, err := readPart(f)
	if err != nil {
		return err
	}
	// The part must end with the header row: the last header cell just
	// before </sheetData>, and no data row.
	cut := bytes.LastIndex(data, []byte("</sheetData>"))
	lastHead := []byte("<t>" + ss.cols[len(ss.cols)-1].Head + "</t></is></c></row>")
	if cut < 0 || !bytes.HasSuffix(data[:cut], lastHead) ||
		!bytes.Contains(data[:cut], []byte(`<row r="`+strconv.Itoa(HeaderRow)+`"`)) ||
		bytes.Contains(data[:cut], []byte(`<row r="`+strconv.Itoa(HeaderRow+1)+`"`)) {
		return errors.New("not the sheet as expected (its header row, and no other row after it, before </sheetData>)")
	}
	head, tail := data[:cut], data[cut:]
	// The dimension covers the whole table (excelize's stream writer
	// leaves it "A1", and a reader that trusts it, such as openpyxl's
	// read-only mode, then sees one cell).
	last := colNames[len(ss.cols)-1] + strconv.Itoa(ss.rows+HeaderRow)
	head = dimensionRE.ReplaceAll(head, []byte(`<dimension ref="A1:`+last+`"/>`))

	var part deflatedPart
	part.add(head, deflatePiece(head))
	err = rowBlocks(st, ss.rows, len(ss.cols), ss.row, func(b rowBlock) error {
		part.add(b.raw, b.deflated)
		return nil
	})
	if err != nil {
		return err
	}
	part.add(tail, deflatePiece(tail))
	end := finalBlock()
	part.cmp += uint64(len(end))
	part.pieces = append(part.pieces, end)

	fh := f.FileHeader
	fixTime(&fh)
	fh.Method = zip.Deflate
	fh.CRC32 = part.crc
	fh.CompressedSize64 = part.cmp
	fh.UncompressedSize64 = part.raw
	fh.CompressedSize, fh.UncompressedSize = 0, 0
	fh.Flags &^= 0x8 // sizes and CRC are known: no data descriptor
	out, err := zw.CreateRaw(&fh)
	if err != nil {
		return err
	}
	for _, p := range part.pieces {
		if _, err := out.Write(p); err != nil {
			return err
		}
	}
	return nil
}
