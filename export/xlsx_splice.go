package export

import (
	"archive/zip"
	"bytes"
	"errors"
	"fmt"
	"io"
	"regexp"
	"sort"
	"strconv"
	"time"
)

// membersPart is the zip part of the Members sheet: excelize names the
// first sheet's part sheet1.xml, and the Members sheet is the workbook's
// first (it is Sheet1 renamed). spliceMembers checks that the part holds
// the Members header before it adds rows to it.
const membersPart = "xl/worksheets/sheet1.xml"

// dimensionRE matches a worksheet's <dimension ref="..."/> element
// (ECMA-376 Part 1, 18.3.1.35), which spliceMembers sets to the table's
// full range.
var dimensionRE = regexp.MustCompile(`<dimension ref="[^"]*"\s*(/>|></dimension>)`)

// spliceMembers copies the workbook book (a zip that excelize wrote, whose
// Members sheet holds the header row only) to w, with the member rows
// added to the Members sheet's data: every other part is copied as it is,
// still compressed; the sheet part is rewritten from its head (everything
// up to </sheetData>), the rows and its tail.
func spliceMembers(w io.Writer, book []byte, st *styles, members []Member) error {
	zr, err := zip.NewReader(bytes.NewReader(book), int64(len(book)))
	if err != nil {
		return err
	}
	zw := zip.NewWriter(w)
	found := false
	for _, f := range partOrder(zr.File) {
		if f.Name != membersPart {
			if err := copyPart(zw, f); err != nil {
				return err
			}
			continue
		}
		found = true
		if err := writeMembersPart(zw, f, st, members); err != nil {
			return fmt.Errorf("%s: %w", membersPart, err)
		}
	}
	if !found {
		return errors.New("the workbook has no " + membersPart + " for the Members sheet")
	}
	return zw.Close()
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

// writeMembersPart writes the Members sheet part f with the member rows
// put in before </sheetData>.
func writeMembersPart(zw *zip.Writer, f *zip.File, st *styles, members []Member) error {
	rc, err := f.Open()
	if err != nil {
		return err
	}
	xml, err := io.ReadAll(rc)
	rc.Close()
	if err != nil {
		return err
	}
	cut := bytes.LastIndex(xml, []byte("</sheetData>"))
	if cut < 0 || !bytes.Contains(xml[:cut], []byte("<t>"+membersColumns[0].Head+"</t>")) {
		return errors.New("not the Members sheet as expected (no header row before </sheetData>)")
	}
	head, tail := xml[:cut], xml[cut:]
	last := colNames[len(colNames)-1] + strconv.Itoa(len(members)+HeaderRow)
	head = dimensionRE.ReplaceAll(head, []byte(`<dimension ref="A1:`+last+`"/>`))

	var part deflatedPart
	part.add(head, deflatePiece(head))
	err = memberBlocks(st, members, func(b rowBlock) error {
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
