package dxfw

import (
	"bytes"
	"strconv"
	"strings"
)

// structHandles are the handles of the file's fixed structure: tables,
// their standard records, the two block records with their BLOCK/ENDBLK
// pairs, and the two dictionaries of the OBJECTS section.
type structHandles struct {
	vport, ltype, layer, style, view, ucs, appid, dimstyle, blockRecord string

	activeVport                    string
	ltByBlock, ltByLayer, ltCont   string
	layer0                         string
	layers                         []string // one per Writer.layers
	styleStandard, appidACAD       string
	dimStandard                    string
	msRecord, psRecord             string
	msBlock, msEnd, psBlock, psEnd string
	rootDict, groupDict            string
}

func (w *Writer) allocStruct() structHandles {
	var h structHandles
	for _, p := range []*string{&h.rootDict, &h.groupDict, &h.vport, &h.ltype, &h.layer,
		&h.style, &h.view, &h.ucs, &h.appid, &h.dimstyle, &h.blockRecord,
		&h.activeVport, &h.ltByBlock, &h.ltByLayer, &h.ltCont, &h.layer0} {
		*p = w.handle()
	}
	for range w.layers {
		h.layers = append(h.layers, w.handle())
	}
	for _, p := range []*string{&h.styleStandard, &h.appidACAD, &h.dimStandard,
		&h.msRecord, &h.psRecord, &h.msBlock, &h.msEnd, &h.psBlock, &h.psEnd} {
		*p = w.handle()
	}
	return h
}

func section(b *bytes.Buffer, name string) {
	pair(b, 0, "SECTION")
	pair(b, 2, name)
}

func point(b *bytes.Buffer, code int, x, y float64) {
	pair(b, code, num(x))
	pair(b, code+10, num(y))
	pair(b, code+20, "0.0")
}

func (w *Writer) header(b *bytes.Buffer) {
	section(b, "HEADER")
	hv := func(name string, code int, v string) {
		pair(b, 9, name)
		pair(b, code, v)
	}
	hv("$ACADVER", 1, "AC1015")
	hv("$DWGCODEPAGE", 3, "ANSI_1252")
	pair(b, 9, "$INSBASE")
	point(b, 10, 0, 0)
	pair(b, 9, "$EXTMIN")
	point(b, 10, w.min[0], w.min[1])
	pair(b, 9, "$EXTMAX")
	point(b, 10, w.max[0], w.max[1])
	pair(b, 9, "$LIMMIN")
	pair(b, 10, num(w.min[0]))
	pair(b, 20, num(w.min[1]))
	pair(b, 9, "$LIMMAX")
	pair(b, 10, num(w.max[0]))
	pair(b, 20, num(w.max[1]))
	hv("$LUNITS", 70, "4")                                              // architectural
	hv("$MEASUREMENT", 70, "0")                                         // imperial
	hv("$INSUNITS", 70, "1")                                            // inches
	hv("$HANDSEED", 5, strings.ToUpper(strconv.FormatUint(w.next, 16))) // next unused handle
	pair(b, 0, "ENDSEC")
}

func (w *Writer) tables(b *bytes.Buffer) {
	h := &w.h
	section(b, "TABLES")

	table(b, "VPORT", h.vport, 1)
	record(b, "VPORT", h.activeVport, h.vport, "AcDbViewportTableRecord", "*Active")
	cx, cy := (w.min[0]+w.max[0])/2, (w.min[1]+w.max[1])/2
	heightIn := (w.max[1] - w.min[1]) * 1.1
	aspect := 1.0
	if heightIn > 0 {
		aspect = (w.max[0] - w.min[0]) * 1.1 / heightIn
	}
	pair(b, 10, "0.0")
	pair(b, 20, "0.0")
	pair(b, 11, "1.0")
	pair(b, 21, "1.0")
	pair(b, 12, num(cx))
	pair(b, 22, num(cy))
	pair(b, 40, num(heightIn))
	pair(b, 41, num(aspect))
	pair(b, 0, "ENDTAB")

	table(b, "LTYPE", h.ltype, 3)
	for _, lt := range []struct{ h, name, desc string }{
		{h.ltByBlock, "ByBlock", ""}, {h.ltByLayer, "ByLayer", ""}, {h.ltCont, "Continuous", "Solid line"},
	} {
		record(b, "LTYPE", lt.h, h.ltype, "AcDbLinetypeTableRecord", lt.name)
		pair(b, 3, lt.desc)
		pair(b, 72, "65")
		pair(b, 73, "0")
		pair(b, 40, "0.0")
	}
	pair(b, 0, "ENDTAB")

	table(b, "LAYER", h.layer, 1+len(w.layers))
	layerRec := func(hd, name string, color int) {
		record(b, "LAYER", hd, h.layer, "AcDbLayerTableRecord", name)
		pair(b, 62, strconv.Itoa(color))
		pair(b, 6, "Continuous")
	}
	layerRec(h.layer0, "0", 7)
	for i, l := range w.layers {
		layerRec(h.layers[i], l.Name, l.Color)
	}
	pair(b, 0, "ENDTAB")

	table(b, "STYLE", h.style, 1)
	record(b, "STYLE", h.styleStandard, h.style, "AcDbTextStyleTableRecord", "Standard")
	pair(b, 40, "0.0")
	pair(b, 41, "1.0")
	pair(b, 50, "0.0")
	pair(b, 71, "0")
	pair(b, 42, "6.0")
	pair(b, 3, "txt")
	pair(b, 4, "")
	pair(b, 0, "ENDTAB")

	table(b, "VIEW", h.view, 0)
	pair(b, 0, "ENDTAB")
	table(b, "UCS", h.ucs, 0)
	pair(b, 0, "ENDTAB")

	table(b, "APPID", h.appid, 1)
	record(b, "APPID", h.appidACAD, h.appid, "AcDbRegAppTableRecord", "ACAD")
	pair(b, 0, "ENDTAB")

	table(b, "DIMSTYLE", h.dimstyle, 1)
	pair(b, 100, "AcDbDimStyleTable")
	pair(b, 0, "DIMSTYLE")
	pair(b, 105, h.dimStandard) // DIMSTYLE records carry their handle in 105
	pair(b, 330, h.dimstyle)
	pair(b, 100, "AcDbSymbolTableRecord")
	pair(b, 100, "AcDbDimStyleTableRecord")
	pair(b, 2, "Standard")
	pair(b, 70, "0")
	pair(b, 0, "ENDTAB")

	table(b, "BLOCK_RECORD", h.blockRecord, 2)
	record(b, "BLOCK_RECORD", h.msRecord, h.blockRecord, "AcDbBlockTableRecord", "*Model_Space")
	record(b, "BLOCK_RECORD", h.psRecord, h.blockRecord, "AcDbBlockTableRecord", "*Paper_Space")
	pair(b, 0, "ENDTAB")

	pair(b, 0, "ENDSEC")
}

func (w *Writer) blocks(b *bytes.Buffer) {
	h := &w.h
	section(b, "BLOCKS")
	for _, blk := range []struct {
		begin, end, owner, name string
		paper                   bool
	}{
		{h.msBlock, h.msEnd, h.msRecord, "*Model_Space", false},
		{h.psBlock, h.psEnd, h.psRecord, "*Paper_Space", true},
	} {
		pair(b, 0, "BLOCK")
		pair(b, 5, blk.begin)
		pair(b, 330, blk.owner)
		pair(b, 100, "AcDbEntity")
		if blk.paper {
			pair(b, 67, "1")
		}
		pair(b, 8, "0")
		pair(b, 100, "AcDbBlockBegin")
		pair(b, 2, blk.name)
		pair(b, 70, "0")
		point(b, 10, 0, 0)
		pair(b, 3, blk.name)
		pair(b, 1, "")
		pair(b, 0, "ENDBLK")
		pair(b, 5, blk.end)
		pair(b, 330, blk.owner)
		pair(b, 100, "AcDbEntity")
		if blk.paper {
			pair(b, 67, "1")
		}
		pair(b, 8, "0")
		pair(b, 100, "AcDbBlockEnd")
	}
	pair(b, 0, "ENDSEC")
}

func (w *Writer) objects(b *bytes.Buffer) {
	h := &w.h
	section(b, "OBJECTS")
	pair(b, 0, "DICTIONARY")
	pair(b, 5, h.rootDict)
	pair(b, 330, "0")
	pair(b, 100, "AcDbDictionary")
	pair(b, 281, "1")
	pair(b, 3, "ACAD_GROUP")
	pair(b, 350, h.groupDict)
	pair(b, 0, "DICTIONARY")
	pair(b, 5, h.groupDict)
	pair(b, 330, h.rootDict)
	pair(b, 100, "AcDbDictionary")
	pair(b, 281, "1")
	pair(b, 0, "ENDSEC")
}

// table writes a TABLE header; the caller writes the records and ENDTAB.
func table(b *bytes.Buffer, name, h string, count int) {
	pair(b, 0, "TABLE")
	pair(b, 2, name)
	pair(b, 5, h)
	pair(b, 330, "0")
	pair(b, 100, "AcDbSymbolTable")
	pair(b, 70, strconv.Itoa(count))
}

// record writes the common start of a symbol-table record.
func record(b *bytes.Buffer, kind, h, owner, subclass, name string) {
	pair(b, 0, kind)
	pair(b, 5, h)
	pair(b, 330, owner)
	pair(b, 100, "AcDbSymbolTableRecord")
	pair(b, 100, subclass)
	pair(b, 2, name)
	pair(b, 70, "0")
}
