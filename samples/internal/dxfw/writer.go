package dxfw

import (
	"bytes"
	"io"
	"math"
	"strconv"
	"strings"
)

// Writer collects the entities of one DXF file; Bytes or WriteTo returns
// the whole file.
type Writer struct {
	r12      bool
	next     uint64 // next free handle
	layers   []Layer
	h        structHandles
	msRecord string // R2000 model-space block record: owner (330) of every entity
	min, max [2]float64
	empty    bool // no point seen yet
	entities bytes.Buffer
}

// Layer is one LAYER table entry.
type Layer struct {
	Name  string
	Color int // ACI colour number
}

// New returns an R2000 (AC1015) writer whose LAYER table holds layer "0"
// and layers, in that order. The handles of the file's fixed structure are
// taken first, so entity handles follow them.
func New(layers []Layer) *Writer {
	w := &Writer{next: 1, layers: layers, empty: true}
	w.h = w.allocStruct()
	w.msRecord = w.h.msRecord
	return w
}

// NewR12 returns an R12 (AC1009) writer whose LAYER table holds layer "0"
// and layers, in that order.
func NewR12(layers []Layer) *Writer {
	w := &Writer{r12: true, next: 1, layers: layers, empty: true}
	w.h = w.allocStructR12()
	return w
}

// handle returns a fresh handle in upper-case hex.
func (w *Writer) handle() string {
	h := strings.ToUpper(strconv.FormatUint(w.next, 16))
	w.next++
	return h
}

// pair writes one group code (right-aligned in three columns, as CAD
// programs write it) and its value.
func pair(b *bytes.Buffer, code int, value string) {
	switch {
	case code >= 0 && code < 10:
		b.WriteString("  ")
	case code >= 10 && code < 100:
		b.WriteByte(' ')
	}
	var d [20]byte
	b.Write(strconv.AppendInt(d[:0], int64(code), 10))
	b.WriteByte('\n')
	b.WriteString(value)
	b.WriteByte('\n')
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

func (w *Writer) see(x, y float64) {
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
func (w *Writer) entityHead(kind, layer string) {
	b := &w.entities
	pair(b, 0, kind)
	pair(b, 5, w.handle())
	if w.r12 {
		pair(b, 8, layer)
		return
	}
	pair(b, 330, w.msRecord)
	pair(b, 100, "AcDbEntity")
	pair(b, 8, layer)
}

// subclass writes an R2000 subclass marker; R12 has none.
func (w *Writer) subclass(name string) {
	if !w.r12 {
		pair(&w.entities, 100, name)
	}
}

// Line adds a LINE from (x1, y1) to (x2, y2).
// Circle writes a CIRCLE of radius r centred on (x, y).
func (w *Writer) Circle(layer string, x, y, r float64) {
	w.entityHead("CIRCLE", layer)
	b := &w.entities
	w.subclass("AcDbCircle")
	pair(b, 10, num(x))
	pair(b, 20, num(y))
	pair(b, 30, "0.0")
	pair(b, 40, num(r))
	w.see(x-r, y-r)
	w.see(x+r, y+r)
}

func (w *Writer) Line(layer string, x1, y1, x2, y2 float64) {
	w.entityHead("LINE", layer)
	b := &w.entities
	w.subclass("AcDbLine")
	pair(b, 10, num(x1))
	pair(b, 20, num(y1))
	pair(b, 30, "0.0")
	pair(b, 11, num(x2))
	pair(b, 21, num(y2))
	pair(b, 31, "0.0")
	w.see(x1, y1)
	w.see(x2, y2)
}

// ClosedPolyline adds a closed polyline through pts (x, y pairs): an
// LWPOLYLINE in R2000, a POLYLINE with VERTEX entities and SEQEND in R12.
func (w *Writer) ClosedPolyline(layer string, pts [][2]float64) {
	if w.r12 {
		w.closedPolylineR12(layer, pts)
		return
	}
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

func (w *Writer) closedPolylineR12(layer string, pts [][2]float64) {
	w.entityHead("POLYLINE", layer)
	b := &w.entities
	pair(b, 66, "1") // vertices follow
	pair(b, 10, "0.0")
	pair(b, 20, "0.0")
	pair(b, 30, "0.0")
	pair(b, 70, "1") // closed
	for _, p := range pts {
		w.entityHead("VERTEX", layer)
		pair(b, 10, num(p[0]))
		pair(b, 20, num(p[1]))
		pair(b, 30, "0.0")
		w.see(p[0], p[1])
	}
	w.entityHead("SEQEND", layer)
}

// Text adds a single-line TEXT, left-aligned at (x, y), with height
// heightIn and rotation rotDeg (counter-clockwise).
func (w *Writer) Text(layer string, x, y, heightIn, rotDeg float64, s string) {
	w.entityHead("TEXT", layer)
	b := &w.entities
	w.subclass("AcDbText")
	pair(b, 10, num(x))
	pair(b, 20, num(y))
	pair(b, 30, "0.0")
	pair(b, 40, num(heightIn))
	pair(b, 1, s)
	if rotDeg != 0 {
		pair(b, 50, num(rotDeg))
	}
	if w.r12 {
		pair(b, 7, "STANDARD")
		return
	}
	pair(b, 7, "Standard")
	pair(b, 100, "AcDbText")
}

// Bytes returns the whole file. Call it once, after the last entity.
func (w *Writer) Bytes() []byte {
	var b bytes.Buffer
	w.WriteTo(&b)
	return b.Bytes()
}

// WriteTo writes the whole file to out. Call it once, after the last
// entity.
func (w *Writer) WriteTo(out io.Writer) (int64, error) {
	var head, tail bytes.Buffer
	if w.r12 {
		w.headerR12(&head)
		w.tablesR12(&head)
		w.blocksR12(&head)
	} else {
		w.header(&head)
		section(&head, "CLASSES")
		pair(&head, 0, "ENDSEC")
		w.tables(&head)
		w.blocks(&head)
	}
	section(&head, "ENTITIES")
	pair(&tail, 0, "ENDSEC")
	if !w.r12 {
		w.objects(&tail)
	}
	pair(&tail, 0, "EOF")
	var n int64
	for _, part := range [][]byte{head.Bytes(), w.entities.Bytes(), tail.Bytes()} {
		k, err := out.Write(part)
		n += int64(k)
		if err != nil {
			return n, err
		}
	}
	return n, nil
}
