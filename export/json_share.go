package export

import (
	"bufio"
	"bytes"
	"fmt"
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
	fields []sharedField
}

type sharedField struct {
	name string
	json []byte // "key":value
	ok   bool   // still alike in every member met
}

// add compares the fields of one more member (b, spans) with those met so
// far.
func (s *markShare) add(b []byte, spans []fieldSpan) {
	s.n++
	if s.n == 1 {
		for _, f := range spans {
			if !unsharedKeys[f.name] {
				s.fields = append(s.fields, sharedField{name: f.name, json: bytes.Clone(b[f.start:f.end]), ok: true})
			}
		}
		return
	}
	j := 0
	for i := range s.fields {
		f := &s.fields[i]
		if !f.ok {
			continue
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

// writeObject writes the spans of b not in skip (in order, a subsequence
// of spans) as one JSON object.
func writeObject(w *bufio.Writer, b []byte, spans []fieldSpan, skip []sharedField) {
	w.WriteByte('{')
	first := true
	p := 0
	for _, f := range spans {
		if p < len(skip) && skip[p].name == f.name {
			p++
			continue
		}
		if !first {
			w.WriteByte(',')
		}
		first = false
		w.Write(b[f.start:f.end])
	}
	w.WriteByte('}')
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

// shareByMark encodes every member once to find, for each entry of
// r.Marks (the first of each name; its index in markAt), the fields all
// its members have alike.
func shareByMark(r *Results, me *memberEncoder, calcs *calcTable, markAt map[string]int) ([]*markShare, error) {
	shares := make([]*markShare, len(r.Marks))
	for i := range r.Marks {
		if _, ok := markAt[r.Marks[i].Mark]; !ok {
			markAt[r.Marks[i].Mark] = i
			shares[i] = &markShare{}
		}
	}
	if len(markAt) == 0 {
		return shares, nil
	}
	me.shareOnly = true // what is never shared need not be written
	for i := range r.Members {
		k, ok := markAt[r.Members[i].Mark]
		if !ok {
			continue
		}
		m := memberForJSON(r.Members[i], calcs.id(&r.Members[i]))
		b, err := me.encode(&m, &r.Members[i])
		if err != nil {
			return nil, fmt.Errorf("members[%d]: %w", i, err)
		}
		shares[k].add(b, me.spans)
	}
	me.shareOnly = false
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
		b, err := me.encode(&m, &r.Members[i])
		if err != nil {
			return fmt.Errorf("members[%d]: %w", i, err)
		}
		var sk []sharedField
		if k, ok := markAt[m.Mark]; ok {
			sk = skip[k]
		}
		w.WriteString("  ")
		writeObject(w, b, me.spans, sk)
		if i < len(r.Members)-1 {
			w.WriteByte(',')
		}
		w.WriteByte('\n')
	}
	w.WriteString(" ]")
	return nil
}
