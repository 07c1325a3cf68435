package dxfw

import (
	"bytes"
	"strconv"
	"strings"
)

// allocStructR12 takes the handles of an R12 file's fixed structure:
// tables and their standard records, and the two BLOCK/ENDBLK pairs.
func (w *Writer) allocStructR12() structHandles {
	var h structHandles
	for _, p := range []*string{&h.vport, &h.ltype, &h.layer, &h.style, &h.view, &h.ucs,
		&h.appid, &h.dimstyle, &h.activeVport, &h.ltCont, &h.layer0} {
		*p = w.handle()
	}
	for range w.layers {
		h.layers = append(h.layers, w.handle())
	}
	for _, p := range []*string{&h.styleStandard, &h.appidACAD, &h.dimStandard,
		&h.msBlock, &h.msEnd, &h.psBlock, &h.psEnd} {
		*p = w.handle()
	}
	return h
}

func (w *Writer) headerR12(b *bytes.Buffer) {
	section(b, "HEADER")
	pair(b, 9, "$ACADVER")
	pair(b, 1, "AC1009")
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
	pair(b, 9, "$LUNITS")
	pair(b, 70, "4") // architectural
	pair(b, 9, "$HANDLING")
	pair(b, 70, "1") // handles on
	pair(b, 9, "$HANDSEED")
	pair(b, 5, strings.ToUpper(strconv.FormatUint(w.next, 16)))
	pair(b, 0, "ENDSEC")
}

// tableR12 writes an R12 TABLE header; the caller writes the records and
// ENDTAB.
func tableR12(b *bytes.Buffer, name, h string, count int) {
	pair(b, 0, "TABLE")
	pair(b, 2, name)
	pair(b, 5, h)
	pair(b, 70, strconv.Itoa(count))
}

// recordR12 writes the common start of an R12 table record.
func recordR12(b *bytes.Buffer, kind, h, name string) {
	pair(b, 0, kind)
	pair(b, 5, h)
	pair(b, 2, name)
	pair(b, 70, "0")
}

func (w *Writer) tablesR12(b *bytes.Buffer) {
	h := &w.h
	section(b, "TABLES")

	tableR12(b, "VPORT", h.vport, 1)
	recordR12(b, "VPORT", h.activeVport, "*ACTIVE")
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

	tableR12(b, "LTYPE", h.ltype, 1)
	recordR12(b, "LTYPE", h.ltCont, "CONTINUOUS")
	pair(b, 3, "Solid line")
	pair(b, 72, "65")
	pair(b, 73, "0")
	pair(b, 40, "0.0")
	pair(b, 0, "ENDTAB")

	tableR12(b, "LAYER", h.layer, 1+len(w.layers))
	layerRec := func(hd, name string, color int) {
		recordR12(b, "LAYER", hd, name)
		pair(b, 62, strconv.Itoa(color))
		pair(b, 6, "CONTINUOUS")
	}
	layerRec(h.layer0, "0", 7)
	for i, l := range w.layers {
		layerRec(h.layers[i], l.Name, l.Color)
	}
	pair(b, 0, "ENDTAB")

	tableR12(b, "STYLE", h.style, 1)
	recordR12(b, "STYLE", h.styleStandard, "STANDARD")
	pair(b, 40, "0.0")
	pair(b, 41, "1.0")
	pair(b, 50, "0.0")
	pair(b, 71, "0")
	pair(b, 42, "6.0")
	pair(b, 3, "txt")
	pair(b, 4, "")
	pair(b, 0, "ENDTAB")

	tableR12(b, "VIEW", h.view, 0)
	pair(b, 0, "ENDTAB")
	tableR12(b, "UCS", h.ucs, 0)
	pair(b, 0, "ENDTAB")

	tableR12(b, "APPID", h.appid, 1)
	recordR12(b, "APPID", h.appidACAD, "ACAD")
	pair(b, 0, "ENDTAB")

	tableR12(b, "DIMSTYLE", h.dimstyle, 1)
	recordR12(b, "DIMSTYLE", h.dimStandard, "STANDARD")
	pair(b, 0, "ENDTAB")

	pair(b, 0, "ENDSEC")
}

func (w *Writer) blocksR12(b *bytes.Buffer) {
	h := &w.h
	section(b, "BLOCKS")
	for _, blk := range []struct {
		begin, end, name string
		paper            bool
	}{
		{h.msBlock, h.msEnd, "$MODEL_SPACE", false},
		{h.psBlock, h.psEnd, "$PAPER_SPACE", true},
	} {
		pair(b, 0, "BLOCK")
		pair(b, 5, blk.begin)
		if blk.paper {
			pair(b, 67, "1")
		}
		pair(b, 8, "0")
		pair(b, 2, blk.name)
		pair(b, 70, "0")
		point(b, 10, 0, 0)
		pair(b, 3, blk.name)
		pair(b, 1, "")
		pair(b, 0, "ENDBLK")
		pair(b, 5, blk.end)
		if blk.paper {
			pair(b, 67, "1")
		}
		pair(b, 8, "0")
	}
	pair(b, 0, "ENDSEC")
}
