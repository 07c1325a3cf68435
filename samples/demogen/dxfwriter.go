package main

import (
	"bytes"
	"fmt"
	"math"
	"strconv"
)

// dxfWriter writes an ASCII DXF R2000 (AC1015) file as group-code/value
// pairs, following the DXF Reference's section layout: HEADER, CLASSES,
// TABLES (VPORT, LTYPE, LAYER, STYLE, VIEW, UCS, APPID, DIMSTYLE,
// BLOCK_RECORD), BLOCKS (*Model_Space, *Paper_Space), ENTITIES, OBJECTS
// (root dictionary and ACAD_GROUP). It knows only LINE, closed LWPOLYLINE
// and TEXT, the entities the demo plan needs.
//
// Every object gets a handle (group 5, or 105 for DIMSTYLE records) from
// one counter; $HANDSEED in the header is the next unused handle, so the
// header is written last, in front of the body. Output is deterministic:
// the same calls give the same bytes.
type dxfWriter struct {
	next     uint64 // next free handle
	layers   []dxfLayer
	h        structHandles
	msRecord string // model-space block record: owner (330) of every entity
	min, max [2]float64
	empty    bool // no point seen yet
	entities bytes.Buffer
}

// dxfLayer is one LAYER table entry.
type dxfLayer struct {
	Name  string
	Color int // ACI colour number
}

// newDXFWriter returns a writer whose LAYER table holds layer "0" and
// layers, in that order. The handles of the file's fixed structure are
// taken first, so entity handles follow them.
func newDXFWriter(layers []dxfLayer) *dxfWriter {
	w := &dxfWriter{next: 1, layers: layers, empty: true}
	w.h = w.allocStruct()
	w.msRecord = w.h.msRecord
	return w
}

// handle returns a fresh handle in upper-case hex.
func (w *dxfWriter) handle() string {
	h := fmt.Sprintf("%X", w.next)
	w.next++
	return h
}

// pair writes one group code (right-aligned in three columns, as CAD
// programs write it) and its value.
func pair(b *bytes.Buffer, code int, value string) {
	fmt.Fprintf(b, "%3d\n%s\n", code, value)
}

// num formats a coordinate or size: shortest exact decimal, never "-0".
func num(v float64) string {
	if v == 0 || math.Abs(v) < 1e-12 {
		return "0.0"
	}
	s := strconv.FormatFloat(v, 'f', -1, 64)
	if !bytes.ContainsRune([]byte(s), '.') {
		s += ".0"
	}
	return s
}

func (w *dxfWriter) see(x, y float64) {
	if w.empty {
		w.min = [2]float64{x, y}
		w.max = [2]float64{x, y}
		w.empty = false
		return
	}
	w.min[0] = math.Min(w.min[0], x)
	w.min[1] = math.Min(w.min[1], y)
	w.max[0] = math.Max(w.max[0], x)
	w.max[1] = math.Max(w.max[1], y)
}

// entityHead writes the common start of a model-space entity.
func (w *dxfWriter) entityHead(kind, layer string) {
	b := &w.entities
	pair(b, 0, kind)
	pair(b, 5, w.handle())
	pair(b, 330, w.msRecord)
	pair(b, 100, "AcDbEntity")
	pair(b, 8, layer)
}

// Line adds a LINE from (x1, y1) to (x2, y2).
func (w *dxfWriter) Line(layer string, x1, y1, x2, y2 float64) {
	w.entityHead("LINE", layer)
	b := &w.entities
	pair(b, 100, "AcDbLine")
	pair(b, 10, num(x1))
	pair(b, 20, num(y1))
	pair(b, 30, "0.0")
	pair(b, 11, num(x2))
	pair(b, 21, num(y2))
	pair(b, 31, "0.0")
	w.see(x1, y1)
	w.see(x2, y2)
}

// ClosedPolyline adds a closed LWPOLYLINE through pts (x, y pairs).
func (w *dxfWriter) ClosedPolyline(layer string, pts [][2]float64) {
	w.entityHead("LWPOLYLINE", layer)
	b := &w.entities
	pair(b, 100, "AcDbPolyline")
	pair(b, 90, strconv.Itoa(len(pts)))
	pair(b, 70, "1")
	pair(b, 43, "0.0")
	for _, p := range pts {
		pair(b, 10, num(p[0]))
		pair(b, 20, num(p[1]))
		w.see(p[0], p[1])
	}
}

// Text adds a single-line TEXT, left-aligned at (x, y), with height
// heightIn and rotation rotDeg (counter-clockwise).
func (w *dxfWriter) Text(layer string, x, y, heightIn, rotDeg float64, s string) {
	w.entityHead("TEXT", layer)
	b := &w.entities
	pair(b, 100, "AcDbText")
	pair(b, 10, num(x))
	pair(b, 20, num(y))
	pair(b, 30, "0.0")
	pair(b, 40, num(heightIn))
	pair(b, 1, s)
	if rotDeg != 0 {
		pair(b, 50, num(rotDeg))
	}
	pair(b, 7, "Standard")
	pair(b, 100, "AcDbText")
	w.see(x, y)
}
