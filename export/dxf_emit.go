package export

import (
	"bufio"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// dxfEmitter writes our own pairs: layer records and markup entities, in
// the drawing's units and line ending, with handles when the drawing uses
// them.
type dxfEmitter struct {
	w        *bufio.Writer
	eol      string
	handles  bool   // give every record and entity a handle (group 5)
	subclass bool   // R13+: subclass markers (100) and owner (330)
	next     uint64 // next free handle
	owner    string // model space block record handle for entities (R13+)
	scratch  []byte // formats codes and numbers without allocating
	// codes holds each group code line written so far (code, end of
	// line), made once: a large plan's markup writes millions.
	codes [][]byte
	xy    []byte // a text's point, formatted once
}

func (e *dxfEmitter) pair(code int, value string) {
	e.code(code)
	e.w.WriteString(value)
	e.w.WriteString(e.eol)
}

// code writes a group code line, right-aligned in three columns.
func (e *dxfEmitter) code(code int) {
	if code >= 0 && code < 1072 { // the codes of the DXF Reference
		if code >= len(e.codes) {
			e.codes = append(e.codes, make([][]byte, code+1-len(e.codes))...)
		}
		if e.codes[code] == nil {
			e.codes[code] = appendCodeLine(nil, code, e.eol)
		}
		e.w.Write(e.codes[code])
		return
	}
	e.scratch = appendCodeLine(e.scratch[:0], code, e.eol)
	e.w.Write(e.scratch)
}

// appendCodeLine appends a group code right-aligned in three columns and
// the end of line.
func appendCodeLine(b []byte, code int, eol string) []byte {
	start := len(b)
	b = strconv.AppendInt(b, int64(code), 10)
	if n := len(b) - start; n < 3 {
		b = append(b, "   "[:3-n]...)
		copy(b[start+3-n:], b[start:start+n])
		copy(b[start:], "   "[:3-n])
	}
	return append(b, eol...)
}

// dxfDecimals is the finest decimal place of the numbers we write into a
// drawing: 1e-6 of a drawing unit, far below any drafting precision, so a
// text height of 1.7999999999999998 is written 1.8. Common practice, no
// source.
const dxfDecimals = 6

// num writes a number pair: v rounded to dxfDecimals decimal places of the
// drawing unit, trailing zeros dropped ("1.8", "120", "0"; never "-0"),
// without allocating.
func (e *dxfEmitter) num(code int, v float64) {
	e.code(code)
	e.scratch = appendDXFNum(e.scratch[:0], v)
	e.w.Write(e.scratch)
	e.w.WriteString(e.eol)
}

// raw writes a pair whose value is already formatted.
func (e *dxfEmitter) raw(code int, value []byte) {
	e.code(code)
	e.w.Write(value)
	e.w.WriteString(e.eol)
}

// appendDXFNum appends v as num writes it.
func appendDXFNum(b []byte, v float64) []byte {
	if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) >= 1e15 {
		return strconv.AppendFloat(b, v, 'f', -1, 64) // never a real plan; validate refuses non-finite
	}
	return appendFixed(b, v, dxfDecimals)
}

// handle writes group 5 with the next free handle, when handles are used.
func (e *dxfEmitter) handle() {
	if !e.handles {
		return
	}
	e.code(5)
	e.scratch = strconv.AppendUint(e.scratch[:0], e.next, 16)
	e.w.Write(e.scratch)
	e.w.WriteString(e.eol)
	e.next++
}

// entityHead writes the pairs every entity starts with; colour 0 means
// BYLAYER (no group 62).
func (e *dxfEmitter) entityHead(kind, layer, subclass string, colour int) {
	e.pair(0, kind)
	e.handle()
	if e.subclass {
		if e.owner != "" {
			e.pair(330, e.owner)
		}
		e.pair(100, "AcDbEntity")
	}
	e.pair(8, layer)
	if colour > 0 {
		e.pair(62, strconv.Itoa(colour))
	}
	if e.subclass {
		e.pair(100, subclass)
	}
}

// line writes a LINE from a to b (drawing units), colour 0 = BYLAYER.
func (e *dxfEmitter) line(layer string, a, b [2]float64, colour int) {
	e.entityHead("LINE", layer, "AcDbLine", colour)
	e.num(10, a[0])
	e.num(20, a[1])
	e.num(30, 0)
	e.num(11, b[0])
	e.num(21, b[1])
	e.num(31, 0)
}

// text writes a TEXT centred on at (drawing units), height h, rotated deg.
func (e *dxfEmitter) text(layer string, at [2]float64, h, deg float64, s string) {
	e.alignedText(layer, at, h, deg, s, 1)
}

// alignedText writes a TEXT whose horizontal alignment (group 72: 0 left,
// 1 centre) and vertical middle are at at (drawing units).
func (e *dxfEmitter) alignedText(layer string, at [2]float64, h, deg float64, s string, halign int) {
	e.entityHead("TEXT", layer, "AcDbText", 0)
	// The point is written twice (first and second alignment point):
	// formatted once.
	e.xy = appendDXFNum(e.xy[:0], at[0])
	nx := len(e.xy)
	e.xy = appendDXFNum(e.xy, at[1])
	e.raw(10, e.xy[:nx])
	e.raw(20, e.xy[nx:])
	e.num(30, 0)
	e.num(40, h)
	e.pair(1, cleanText(s))
	if deg != 0 {
		e.num(50, deg)
	}
	e.pair(72, strconv.Itoa(halign))
	e.raw(11, e.xy[:nx])
	e.raw(21, e.xy[nx:])
	e.num(31, 0)
	if e.subclass {
		e.pair(100, "AcDbText")
	}
	e.pair(73, "2") // middle
}

// cleanText keeps a label on one line and in ASCII: control characters
// become spaces and other non-ASCII characters the DXF escape \U+XXXX, so
// the file reads the same whatever its code page ($DWGCODEPAGE).
func cleanText(s string) string {
	clean := true
	for i := 0; i < len(s); i++ {
		if c := s[i]; c < 0x20 || c >= 0x7f {
			clean = false
			break
		}
	}
	if clean {
		return s // plain printable ASCII: nothing to change, nothing allocated
	}
	var b strings.Builder
	for _, r := range s {
		switch {
		case r < 0x20 || r == 0x7f:
			b.WriteByte(' ')
		case r < 0x80:
			b.WriteRune(r)
		case r <= 0xffff:
			fmt.Fprintf(&b, "\\U+%04X", r)
		default:
			b.WriteByte('?') // outside the basic plane: no DXF escape
		}
	}
	return b.String()
}

// layer writes one LAYER table record.
func (e *dxfEmitter) layer(name string, color, lineWeight int, ltype, tableHandle, plotStyle string) {
	e.pair(0, "LAYER")
	e.handle()
	if e.subclass {
		if tableHandle != "" {
			e.pair(330, tableHandle)
		}
		e.pair(100, "AcDbSymbolTableRecord")
		e.pair(100, "AcDbLayerTableRecord")
	}
	e.pair(2, name)
	e.pair(70, "0")
	e.pair(62, strconv.Itoa(color))
	e.pair(6, ltype)
	if e.subclass {
		e.pair(370, strconv.Itoa(lineWeight))
		if plotStyle != "" {
			e.pair(390, plotStyle)
		}
	}
}

// markupEntityCount is the number of entities markup writes for m.
func markupEntityCount(m *Markup) int {
	n := len(m.Highlights) + len(m.Errors) + len(m.BlockingAdds) + len(m.Generated) + m.keyCount()
	for _, g := range m.labelGroups() {
		n += len(g.Labels)
	}
	return n
}

// markup writes every markup entity of m, converted to drawing units, and
// the key, whose sample lines take the colours our layers were given.
func (e *dxfEmitter) markup(m *Markup, colours map[string]int) {
	k := m.ToInch
	du := func(p [2]float64) [2]float64 { return [2]float64{p[0] / k, p[1] / k} }
	for _, s := range m.Highlights {
		e.line(LayerFail, du(s.A), du(s.B), 0)
	}
	for _, s := range m.Errors {
		e.line(LayerError, du(s.A), du(s.B), 0)
	}
	for _, s := range m.BlockingAdds {
		e.line(LayerBlocking, du(s.A), du(s.B), 0)
	}
	for _, s := range m.Generated {
		e.line(LayerGenerated, du(s.A), du(s.B), 0)
	}
	h := m.textHeight()
	for _, g := range m.labelGroups() {
		for _, l := range g.Labels {
			lh := h
			if l.HeightIn > 0 {
				lh = l.HeightIn
			}
			e.text(g.Layer, du(l.At), lh/k, l.AngleDeg, l.Text)
		}
	}
	for _, it := range m.key(colours) {
		if it.Line {
			e.line(LayerKey, du(it.A), du(it.B), it.Colour)
		} else {
			e.alignedText(LayerKey, du(it.At), h/k, 0, it.Text, 0)
		}
	}
}
