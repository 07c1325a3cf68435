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
	s := file
	if line > 0 {
		s += ":" + strconv.Itoa(line)
	}
	var extra string
	if handle != "" {
		extra = "handle " + handle
	}
	if layer != "" {
		if extra != "" {
			extra += ", "
		}
		extra += "layer " + layer
	}
	if extra != "" {
		s += " (" + extra + ")"
	}
	return s
}

// sourceLine returns the DXF line of src when src is exactly
// sourceText(file, line, handle, layer) for a line above 0.
func sourceLine(src, file, handle, layer string) (int, bool) {
	rest, ok := strings.CutPrefix(src, file+":")
	if !ok || file == "" {
		return 0, false
	}
	n := 0
	for n < len(rest) && rest[n] >= '0' && rest[n] <= '9' {
		n++
	}
	line, err := strconv.Atoi(rest[:n])
	if err != nil || line <= 0 || sourceText(file, line, handle, layer) != src {
		return 0, false
	}
	return line, true
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
		if _, ok := sourceLine(m.Source, head[:k], m.Handle, m.Layer); ok {
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
	s := file
	switch {
	case handle != "":
		s += " handle " + handle
	case line > 0:
		s += " line " + strconv.Itoa(line)
	}
	if layer != "" {
		s += " (layer " + layer + ")"
	}
	s = strings.TrimSpace(s)
	if s != "" {
		s += ", "
	}
	return s + FtIn(a[0]) + ", " + FtIn(a[1]) + " to " + FtIn(b[0]) + ", " + FtIn(b[1])
}

// locationOf derives a member's location from the values results.json
// holds: its ends in drawing units as written (rounded), toInch inches per
// drawing unit. ok is false when nothing can be derived (no file, unknown
// units).
func locationOf(file, handle string, line int, layer string, start, end [2]float64, toInch float64) (string, bool) {
	if file == "" || toInch <= 0 {
		return "", false
	}
	in := func(p [2]float64) [2]float64 {
		return [2]float64{roundPlanCoord(p[0]) * toInch, roundPlanCoord(p[1]) * toInch}
	}
	return locationText(file, handle, line, layer, in(start), in(end)), true
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
