package export

import (
	"bufio"
	"bytes"
	"fmt"
	"slices"
	"strconv"
	"strings"
)

// What results.json (schema 3) leaves out of each member because it can
// be had exactly elsewhere (docs/RESULTS-SCHEMA.md "What is written once
// and referred to"):
//
//   - "source" when it is the drawing's file ("source_file"), the DXF line
//     ("line"), handle and layer as sourceText writes them; "line" is
//     written instead;
//   - "location" when locationText gives it from "source_file", the
//     handle, line, layer and the ends as written (start, end times the
//     drawing unit);
//   - every field that all members of its mark (two or more) have alike,
//     byte for byte as written: written once in the mark's "shared".
//
// The writer derives each left-out value from what the file holds, as a
// reader does, and leaves it out only when that gives it back exactly;
// otherwise the member keeps it. ReadJSON fills all of it back in.

// sourceText is a member's Source as dxfimport.Pos.String writes it:
// "plan.dxf:4410 (handle 2F1, layer JOISTS)".
func sourceText(file string, line int, handle, layer string) string {
	return string(appendSource(nil, file, line, handle, layer))
}

// appendSource appends sourceText(file, line, handle, layer) to b.
func appendSource(b []byte, file string, line int, handle, layer string) []byte {
	b = append(b, file...)
	if line > 0 {
		b = append(b, ':')
		b = strconv.AppendInt(b, int64(line), 10)
	}
	if handle == "" && layer == "" {
		return b
	}
	b = append(b, " ("...)
	if handle != "" {
		b = append(b, "handle "...)
		b = append(b, handle...)
		if layer != "" {
			b = append(b, ", "...)
		}
	}
	if layer != "" {
		b = append(b, "layer "...)
		b = append(b, layer...)
	}
	return append(b, ')')
}

// sourceLine returns the DXF line of src when src is exactly
// sourceText(file, line, handle, layer) for a line above 0; scratch is
// room to compare in (returned, perhaps grown).
func sourceLine(src, file, handle, layer string, scratch []byte) (int, bool, []byte) {
	if file == "" || len(src) <= len(file)+1 || src[:len(file)] != file || src[len(file)] != ':' {
		return 0, false, scratch
	}
	rest := src[len(file)+1:]
	n, line := 0, 0
	for n < len(rest) && n < 10 && rest[n] >= '0' && rest[n] <= '9' {
		line = line*10 + int(rest[n]-'0')
		n++
	}
	if line <= 0 || rest[0] == '0' {
		return 0, false, scratch
	}
	scratch = appendSource(scratch[:0], file, line, handle, layer)
	return line, src == string(scratch), scratch
}

// sourceFileOf returns the file name the members' sources start with: that
// of the first member whose Source has the form sourceText writes with a
// line; "" when none has.
func sourceFileOf(ms []Member) string {
	for i := range ms {
		m := &ms[i]
		if m.Source == "" {
			continue
		}
		tail := sourceText("", 0, m.Handle, m.Layer)
		head, ok := strings.CutSuffix(m.Source, tail)
		if !ok {
			continue
		}
		k := strings.LastIndexByte(head, ':')
		if k <= 0 {
			continue
		}
		if _, ok, _ := sourceLine(m.Source, head[:k], m.Handle, m.Layer, nil); ok {
			return head[:k]
		}
	}
	return ""
}

// locationText is a member's Location as the command writes it: "plan.dxf
// handle 43 (layer JOIST-FLOOR), 49'-9 3/4", 2'-0" to 61'-11 1/4", 2'-0"":
// the file, the handle (or the DXF line when there is none), the layer and
// the ends (inches) in feet-inches plan coordinates.
func locationText(file, handle string, line int, layer string, a, b [2]float64) string {
	return string(appendLocation(nil, file, handle, line, layer, a, b))
}

// appendLocation appends locationText(file, handle, line, layer, a, b) to
// dst.
func appendLocation(dst []byte, file, handle string, line int, layer string, a, b [2]float64) []byte {
	start := len(dst)
	dst = append(dst, file...)
	switch {
	case handle != "":
		dst = append(dst, " handle "...)
		dst = append(dst, handle...)
	case line > 0:
		dst = append(dst, " line "...)
		dst = strconv.AppendInt(dst, int64(line), 10)
	}
	if layer != "" {
		dst = append(dst, " (layer "...)
		dst = append(dst, layer...)
		dst = append(dst, ')')
	}
	// The head trimmed as strings.TrimSpace trims it.
	head := bytes.TrimSpace(dst[start:])
	n := copy(dst[start:], head)
	dst = dst[:start+n]
	if n > 0 {
		dst = append(dst, ", "...)
	}
	dst = appendFtIn(dst, a[0])
	dst = append(dst, ", "...)
	dst = appendFtIn(dst, a[1])
	dst = append(dst, " to "...)
	dst = appendFtIn(dst, b[0])
	dst = append(dst, ", "...)
	dst = appendFtIn(dst, b[1])
	return dst
}

// appendLocationOf appends a member's location as derived from the values
// results.json holds: its ends in drawing units as written (rounded),
// toInch inches per drawing unit. ok is false when nothing can be derived
// (no file, unknown units).
func appendLocationOf(dst []byte, file, handle string, line int, layer string, start, end [2]float64, toInch float64) ([]byte, bool) {
	if file == "" || toInch <= 0 {
		return dst, false
	}
	in := func(p [2]float64) [2]float64 {
		return [2]float64{roundPlanCoord(p[0]) * toInch, roundPlanCoord(p[1]) * toInch}
	}
	return appendLocation(dst, file, handle, line, layer, in(start), in(end)), true
}

// locationOf is appendLocationOf as a string.
func locationOf(file, handle string, line int, layer string, start, end [2]float64, toInch float64) (string, bool) {
	b, ok := appendLocationOf(nil, file, handle, line, layer, start, end, toInch)
	return string(b), ok
}

// upliftSupportText is an uplift bearing's support as the command names a
// support line with a handle: "WALL-EXT handle 2F1"; "" without a handle.
func upliftSupportText(layer, handle string) string {
	if handle == "" {
		return ""
	}
	return strings.TrimSpace(layer + " handle " + handle)
}

// unsharedKeys are the member fields never moved to the mark: who and
// where each member is.
var unsharedKeys = map[string]bool{"id": true, "mark": true, "handle": true, "line": true,
	"source": true, "location": true, "start": true, "end": true}

// fieldSpan is one top-level field of an encoded member: "key":value at
// b[start:end].
type fieldSpan struct {
	name       string
	start, end int
}

// markShare gathers the fields that every member of one mark has alike.
type markShare struct {
	n      int // members met
	first  shareItem
	fields []sharedField
}

type sharedField struct {
	name string
	json []byte // "key":value
	ok   bool   // still alike in every member met
	eq   func(a, b *shareItem) bool
}

// shareItem is a member as the sharing pass compares it: with the ids of
// its calculation and info list.
type shareItem struct {
	m          *Member
	calc, info string
}

// shareEq holds, for each shareable field, a comparison of the Go values
// that is true only when the field is written alike (equal values give
// equal bytes; nil and empty lists are written alike). The sharing pass
// compares bytes only where it is false. TestShareEqImpliesSameBytes holds
// it to the encoder, field by field and leaf by leaf.
var shareEq = map[string]func(a, b *shareItem) bool{
	"run":      func(a, b *shareItem) bool { return a.m.Run == b.m.Run },
	"layer":    func(a, b *shareItem) bool { return a.m.Layer == b.m.Layer },
	"datum_in": func(a, b *shareItem) bool { return a.m.DatumIn == b.m.DatumIn },
	"generated": func(a, b *shareItem) bool {
		return a.m.Generated == b.m.Generated
	},
	"length_in":      func(a, b *shareItem) bool { return a.m.LengthIn == b.m.LengthIn },
	"bearings_at_in": func(a, b *shareItem) bool { return slices.Equal(a.m.BearingsAtIn, b.m.BearingsAtIn) },
	"spans_in":       func(a, b *shareItem) bool { return slices.Equal(a.m.SpansIn, b.m.SpansIn) },
	"overhangs_in":   func(a, b *shareItem) bool { return a.m.OverhangsIn == b.m.OverhangsIn },
	"trib_in":        func(a, b *shareItem) bool { return a.m.TribIn == b.m.TribIn },
	"spacing_in":     func(a, b *shareItem) bool { return a.m.SpacingIn == b.m.SpacingIn },
	"size":           func(a, b *shareItem) bool { return a.m.Size == b.m.Size },
	"species":        func(a, b *shareItem) bool { return a.m.Species == b.m.Species },
	"grade":          func(a, b *shareItem) bool { return a.m.Grade == b.m.Grade },
	"zone":           func(a, b *shareItem) bool { return a.m.Zone == b.m.Zone },
	"zone_pieces":    func(a, b *shareItem) bool { return slices.Equal(a.m.ZonePieces, b.m.ZonePieces) },
	"point_loads":    func(a, b *shareItem) bool { return slices.Equal(a.m.PointLoads, b.m.PointLoads) },
	"calculation":    func(a, b *shareItem) bool { return a.calc == b.calc },
	"governing":      func(a, b *shareItem) bool { return a.m.Governing == b.m.Governing },
	"max_ratio":      func(a, b *shareItem) bool { return a.m.MaxRatio == b.m.MaxRatio },
	"blocking_rows_per_span": func(a, b *shareItem) bool {
		return slices.Equal(a.m.BlockingRowsPerSpan, b.m.BlockingRowsPerSpan)
	},
	"blocking_at_in": func(a, b *shareItem) bool { return slices.Equal(a.m.BlockingAtIn, b.m.BlockingAtIn) },
	"blocking_from_face_in": func(a, b *shareItem) bool {
		return slices.Equal(a.m.BlockingFromFaceIn, b.m.BlockingFromFaceIn)
	},
	"drawn_blocking_at_in": func(a, b *shareItem) bool {
		return slices.Equal(a.m.DrawnBlockingAtIn, b.m.DrawnBlockingAtIn)
	},
	"blocking_steps": func(a, b *shareItem) bool {
		return slices.EqualFunc(a.m.BlockingSteps, b.m.BlockingSteps, func(x, y BlockingStep) bool {
			return x.RowsPerSpan == y.RowsPerSpan && slices.Equal(x.AtIn, y.AtIn) && x.LuIn == y.LuIn && x.CL == y.CL && x.Ratio == y.Ratio
		})
	},
	"info_list": func(a, b *shareItem) bool { return a.info == b.info },
	"status":    func(a, b *shareItem) bool { return a.m.Status == b.m.Status },
	"messages":  func(a, b *shareItem) bool { return slices.Equal(a.m.Messages, b.m.Messages) },
}

// meet compares one more member of the mark with those met so far:
// field by field with shareEq, and by the bytes me writes (encoding
// the member at most once, only when a comparison of values cannot tell).
func (s *markShare) meet(it shareItem, me *memberEncoder) error {
	encode := func() ([]byte, []fieldSpan, error) {
		m := memberForJSON(*it.m, it.calc)
		b, err := me.encode(&m, it.m)
		return b, me.spans, err
	}
	s.n++
	if s.n == 1 {
		b, spans, err := encode()
		if err != nil {
			return err
		}
		s.first = it
		for _, f := range spans {
			if !unsharedKeys[f.name] {
				s.fields = append(s.fields, sharedField{name: f.name, json: bytes.Clone(b[f.start:f.end]), ok: true, eq: shareEq[f.name]})
			}
		}
		return nil
	}
	var b []byte
	var spans []fieldSpan
	encoded := false
	j := 0
	for i := range s.fields {
		f := &s.fields[i]
		if !f.ok || (f.eq != nil && f.eq(&s.first, &it)) {
			continue
		}
		if !encoded {
			var err error
			if b, spans, err = encode(); err != nil {
				return err
			}
			encoded = true
		}
		k := j
		for k < len(spans) && spans[k].name != f.name {
			k++
		}
		if k == len(spans) { // not in this member (or out of order)
			f.ok = false
			continue
		}
		f.ok = bytes.Equal(f.json, b[spans[k].start:spans[k].end])
		j = k + 1
	}
	return nil
}

// shared returns the fields to leave out of the members: none for a mark
// of one member.
func (s *markShare) shared() []sharedField {
	if s == nil || s.n < 2 {
		return nil
	}
	var out []sharedField
	for _, f := range s.fields {
		if f.ok {
			out = append(out, f)
		}
	}
	return out
}

// sharedJSON returns the mark's "shared" object.
func sharedJSON(fs []sharedField) []byte {
	b := []byte{'{'}
	for i, f := range fs {
		if i > 0 {
			b = append(b, ',')
		}
		b = append(b, f.json...)
	}
	return append(b, '}')
}

// shareByMark finds, for each entry of r.Marks (the first of each name;
// its index in markAt), the fields all its members have alike. It numbers
// the calculations and info lists in member order, as the members are
// written.
func shareByMark(r *Results, me *memberEncoder, calcs *calcTable, markAt map[string]int) ([]*markShare, error) {
	shares := make([]*markShare, len(r.Marks))
	for i := range r.Marks {
		if _, ok := markAt[r.Marks[i].Mark]; !ok {
			markAt[r.Marks[i].Mark] = i
			shares[i] = &markShare{}
		}
	}
	me.shareOnly = true // what is never shared need not be written
	defer func() { me.shareOnly = false }()
	for i := range r.Members {
		orig := &r.Members[i]
		it := shareItem{m: orig, calc: calcs.id(orig)}
		if len(orig.Info) > 0 {
			it.info = me.infos.id(orig.Info)
		}
		k, ok := markAt[orig.Mark]
		if !ok {
			continue
		}
		if err := shares[k].meet(it, me); err != nil {
			return nil, fmt.Errorf("members[%d]: %w", i, err)
		}
	}
	return shares, nil
}

// writeMembersV3 writes "members" as schema 3 does: each member without
// the fields its mark shares.
func writeMembersV3(w *bufio.Writer, key func(string), r *Results, me *memberEncoder, calcs *calcTable, shares []*markShare, markAt map[string]int) error {
	key("members")
	if len(r.Members) == 0 {
		w.WriteString("[]")
		return nil
	}
	skip := make([][]sharedField, len(shares))
	for i, s := range shares {
		skip[i] = s.shared()
	}
	w.WriteString("[\n")
	for i := range r.Members {
		m := memberForJSON(r.Members[i], calcs.id(&r.Members[i]))
		me.skip = nil
		if k, ok := markAt[m.Mark]; ok {
			me.skip = skip[k]
		}
		b, err := me.encode(&m, &r.Members[i])
		if err != nil {
			return fmt.Errorf("members[%d]: %w", i, err)
		}
		w.WriteString("  ")
		w.Write(b)
		if i < len(r.Members)-1 {
			w.WriteByte(',')
		}
		w.WriteByte('\n')
	}
	me.skip = nil
	w.WriteString(" ]")
	return nil
}
