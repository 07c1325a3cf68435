package export

import (
	"encoding/json"
	"fmt"
	"math"
	"reflect"
	"strconv"
	"unicode/utf8"
)

// memberEncoder writes a member field by field and without reflection
// (results.json holds one line per member, 100,000 of them on a large
// plan). In layout 2 it writes exactly what json.Marshal does for
// memberForJSON(m) with the checks' traces left out, encoding each distinct
// checks slice once (members checked alike share it);
// TestMemberEncoderMatchesMarshal holds it to encoding/json, with every
// field of Member set: a field added to Member and not here fails it. In
// layout 3 (WriteJSON) the same fields less the checks, the info lines as
// an id of "info_lists", and numbers as json_num.go writes them.
type memberEncoder struct {
	lay jsonLayout
	// infos numbers the distinct info lists (schema 3).
	infos *infoTable
	// seen holds the slices met once; cache the JSON of those met again.
	// A plan whose members are all different caches nothing.
	seen  map[cleanSlice]bool
	cache map[cleanSlice][]byte
	buf   []byte // the last member written, reused
	// spans are the top-level fields of the last member written (layout
	// 3), for leaving out those its mark shares (json_share.go).
	spans []fieldSpan
	// srcFile and toInch let layout 3 write a member's "line" for its
	// source and leave out a location that can be derived (json_share.go);
	// srcFile "" derives nothing.
	srcFile string
	toInch  float64
	scratch []byte
	// shareOnly leaves out the fields never shared (unsharedKeys): the
	// first pass, which finds what the members of each mark share.
	shareOnly bool
	// skip are the fields the next member's mark shares, in the order they
	// are written: left out of it (layout 3).
	skip []sharedField
}

func newMemberEncoder(lay jsonLayout) *memberEncoder {
	return &memberEncoder{lay: lay, infos: newInfoTable(), seen: map[cleanSlice]bool{}, cache: map[cleanSlice][]byte{}}
}

// encode returns the JSON of member m (already through memberForJSON),
// whose Checks came from orig's. The bytes are valid until the next call.
// A NaN or infinite number is an error, as with encoding/json.
func (e *memberEncoder) encode(m, orig *Member) ([]byte, error) {
	var w jsonOut
	w.round = e.lay.refs
	w.rec = e.lay.refs
	w.spans = e.spans[:0]
	w.skip = e.skip
	w.b = append(e.buf[:0], '{')
	who := !e.shareOnly // who and where the member is (never shared)
	if who {
		w.str("id", m.ID)
		w.str("mark", m.Mark)
	}
	if m.Run != "" {
		w.str("run", m.Run)
	}
	w.str("layer", m.Layer)
	if who {
		w.str("handle", m.Handle)
	}
	switch {
	case e.shareOnly:
	case e.lay.refs:
		e.placeV3(&w, m)
	default:
		if m.Source != "" {
			w.str("source", m.Source)
		}
		if m.Location != "" {
			w.str("location", m.Location)
		}
	}
	w.num("datum_in", m.DatumIn)
	if m.Generated && !w.skipped("generated") {
		w.key("generated")
		w.b = append(w.b, "true"...)
	}
	if who {
		w.coords("start", m.Start[:])
		w.coords("end", m.End[:])
	}
	w.num("length_in", m.LengthIn)
	w.floats("bearings_at_in", m.BearingsAtIn)
	w.floats("spans_in", m.SpansIn)
	w.floats("overhangs_in", m.OverhangsIn[:])
	w.num("trib_in", m.TribIn)
	w.num("spacing_in", m.SpacingIn)
	w.str("size", m.Size)
	w.str("species", m.Species)
	w.str("grade", m.Grade)
	w.str("zone", m.Zone)
	if len(m.ZonePieces) > 0 && !w.skipped("zone_pieces") {
		w.objects("zone_pieces", len(m.ZonePieces), func(i int) {
			z := m.ZonePieces[i]
			w.str("zone", z.Zone)
			w.num("from_in", z.FromIn)
			w.num("to_in", z.ToIn)
		})
	}
	if len(m.PointLoads) > 0 && !w.skipped("point_loads") {
		w.objects("point_loads", len(m.PointLoads), func(i int) {
			p := &m.PointLoads[i]
			if p.Name != "" {
				w.str("name", p.Name)
			}
			w.num("at_in", p.AtIn)
			w.num("from_face_in", p.FromFaceIn)
			w.num("dead_lb", p.DeadLb)
			w.num("live_lb", p.LiveLb)
			w.num("roof_live_lb", p.RoofLiveLb)
			w.num("snow_lb", p.SnowLb)
			w.num("wind_down_lb", p.WindDownLb)
			w.num("wind_up_lb", p.WindUpLb)
			w.num("uplift_dead_lb", p.UpliftDeadLb)
		})
	}
	if m.Calculation != "" {
		w.str("calculation", m.Calculation)
	}
	if !e.lay.refs { // schema 3: the checks are the calculation's
		checks, err := e.checksJSON(orig.Checks)
		if err != nil {
			return nil, err
		}
		w.key("checks")
		if m.Checks == nil {
			w.b = append(w.b, "null"...)
		} else {
			w.b = append(w.b, checks...)
		}
	}
	w.str("governing", m.Governing)
	w.num("max_ratio", m.MaxRatio)
	w.ints("blocking_rows_per_span", m.BlockingRowsPerSpan)
	w.floats("blocking_at_in", m.BlockingAtIn)
	if len(m.BlockingFromFaceIn) > 0 {
		w.floats("blocking_from_face_in", m.BlockingFromFaceIn)
	}
	if len(m.DrawnBlockingAtIn) > 0 {
		w.floats("drawn_blocking_at_in", m.DrawnBlockingAtIn)
	}
	if len(m.BlockingSteps) > 0 && !w.skipped("blocking_steps") {
		w.objects("blocking_steps", len(m.BlockingSteps), func(i int) {
			s := m.BlockingSteps[i]
			w.key("rows_per_span")
			w.b = strconv.AppendInt(w.b, int64(s.RowsPerSpan), 10)
			if len(s.AtIn) > 0 {
				w.floats("added_at_in", s.AtIn)
			}
			w.num("lu_in", s.LuIn)
			w.num("cl", s.CL)
			w.num("ratio", s.Ratio)
		})
	}
	if len(m.Info) > 0 {
		if e.lay.refs {
			w.str("info_list", e.infos.id(m.Info))
		} else {
			w.strs("info", m.Info)
		}
	}
	if len(m.Factors) > 0 { // never in the file (see memberForJSON); kept for parity
		b, err := json.Marshal(m.Factors)
		if err != nil {
			return nil, err
		}
		w.key("factors")
		w.b = append(w.b, b...)
	}
	w.str("status", m.Status)
	w.strs("messages", m.Messages)
	if w.err != nil {
		return nil, w.err
	}
	if len(w.skip) > 0 { // its mark shares a field it does not have: never so
		return nil, fmt.Errorf("member %s: field %q of its mark's \"shared\" not met", m.ID, w.skip[0].name)
	}
	if n := len(w.spans); n > 0 {
		w.spans[n-1].end = len(w.b)
	}
	e.spans = w.spans
	e.buf = append(w.b, '}')
	return e.buf, nil
}

// placeV3 writes where member m was drawn as schema 3 does: "line" rather
// than a source that sourceText gives back from it, and no location when
// locationOf gives it back from what the file holds ("location":"" when
// m has none but one could be derived).
func (e *memberEncoder) placeV3(w *jsonOut, m *Member) {
	line, ok := 0, false
	if m.Source != "" {
		line, ok, e.scratch = sourceLine(m.Source, e.srcFile, m.Handle, m.Layer, e.scratch)
		if ok {
			w.key("line")
			w.b = strconv.AppendInt(w.b, int64(line), 10)
		} else {
			w.str("source", m.Source)
		}
	}
	var derivable bool
	e.scratch, derivable = appendLocationOf(e.scratch[:0], e.srcFile, m.Handle, line, m.Layer, m.Start, m.End, e.toInch)
	if derivable && m.Location == string(e.scratch) {
		return
	}
	if m.Location != "" || derivable {
		w.str("location", m.Location)
	}
}

// jsonOut appends the fields of one JSON object.
type jsonOut struct {
	b     []byte
	first bool // no field written yet in the current object (after '{')
	err   error
	// rec records the top-level fields in spans; depth is the nesting
	// below the top-level object.
	rec   bool
	depth int
	spans []fieldSpan
	// skip are top-level fields to leave out, in the order they come.
	skip []sharedField
	// round writes numbers with the digits they carry (schema 3):
	// SigDigits significant digits, coordinates to CoordDecimals places.
	round bool
}

// key writes "name": with the comma before it when needed.
func (w *jsonOut) key(name string) {
	if len(w.b) > 1 && !w.first {
		w.b = append(w.b, ',')
	}
	w.first = false
	if w.rec && w.depth == 0 {
		if n := len(w.spans); n > 0 {
			w.spans[n-1].end = len(w.b) - 1 // before the comma
		}
		w.spans = append(w.spans, fieldSpan{name: name, start: len(w.b)})
	}
	w.b = append(w.b, '"')
	w.b = append(w.b, name...)
	w.b = append(w.b, '"', ':')
}

// skipped reports whether the top-level field name is to be left out
// (the next in skip), and takes it off skip.
func (w *jsonOut) skipped(name string) bool {
	if w.depth == 0 && len(w.skip) > 0 && w.skip[0].name == name {
		w.skip = w.skip[1:]
		return true
	}
	return false
}

func (w *jsonOut) str(name, v string) {
	if w.skipped(name) {
		return
	}
	w.key(name)
	w.b = appendJSONString(w.b, v)
}

func (w *jsonOut) num(name string, v float64) {
	if w.skipped(name) {
		return
	}
	w.key(name)
	w.float(v)
}

// float appends v as encoding/json writes a float64.
func (w *jsonOut) float(v float64) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		if w.err == nil {
			w.err = fmt.Errorf("json: unsupported value: %v", v)
		}
		w.b = append(w.b, '0')
		return
	}
	if w.round {
		w.b = appendNum(w.b, v)
		return
	}
	w.b = appendJSONFloat(w.b, v)
}

// coords writes plan coordinates: to CoordDecimals places when rounding.
func (w *jsonOut) coords(name string, vs []float64) {
	writeList(w, name, vs, func(v float64) {
		if w.round && !math.IsNaN(v) && !math.IsInf(v, 0) {
			w.b = appendPlanCoord(w.b, v)
			return
		}
		w.float(v)
	})
}

// floats writes a list of numbers; nil as null.
func (w *jsonOut) floats(name string, vs []float64) {
	writeList(w, name, vs, func(v float64) { w.float(v) })
}

// ints writes a list of integers; nil as null.
func (w *jsonOut) ints(name string, vs []int) {
	writeList(w, name, vs, func(v int) { w.b = strconv.AppendInt(w.b, int64(v), 10) })
}

// strs writes a list of strings; nil as null.
func (w *jsonOut) strs(name string, vs []string) {
	writeList(w, name, vs, func(v string) { w.b = appendJSONString(w.b, v) })
}

// writeList writes "name":[...] with each element written by one; a nil
// list as null, as encoding/json does.
func writeList[T any](w *jsonOut, name string, vs []T, one func(T)) {
	if w.skipped(name) {
		return
	}
	w.key(name)
	if vs == nil {
		w.b = append(w.b, "null"...)
		return
	}
	w.b = append(w.b, '[')
	for i, v := range vs {
		if i > 0 {
			w.b = append(w.b, ',')
		}
		one(v)
	}
	w.b = append(w.b, ']')
}

// appendJSONFloat appends v as encoding/json writes a finite float64: the
// shortest decimal that reads back as v, in exponent form below 1e-6 and
// from 1e21, with a one-digit negative exponent kept to one digit.
func appendJSONFloat(b []byte, v float64) []byte {
	format := byte('f')
	if a := math.Abs(v); a != 0 && (a < 1e-6 || a >= 1e21) {
		format = 'e'
	}
	b = strconv.AppendFloat(b, v, format, -1, 64)
	if format == 'e' {
		// e-07 -> e-7, as encoding/json does.
		if n := len(b); n >= 4 && b[n-4] == 'e' && b[n-3] == '-' && b[n-2] == '0' {
			b[n-2] = b[n-1]
			b = b[:n-1]
		}
	}
	return b
}

// appendJSONString appends s quoted. Plain ASCII without characters that
// JSON or HTML escaping touches is copied; anything else goes through
// encoding/json, so the bytes are always its own.
func appendJSONString(b []byte, s string) []byte {
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c < 0x20 || c >= utf8.RuneSelf || c == '"' || c == '\\' || c == '<' || c == '>' || c == '&' {
			q, _ := json.Marshal(s)
			return append(b, q...)
		}
	}
	b = append(b, '"')
	b = append(b, s...)
	return append(b, '"')
}

// checksJSON returns the JSON of a member's checks without their traces
// (results.json has those in the member's calculation), from the cache
// when the slice was met before. Equal slices give equal JSON.
func (e *memberEncoder) checksJSON(cs []Check) ([]byte, error) {
	if len(cs) == 0 {
		return []byte("[]"), nil
	}
	id := cleanSlice{reflect.ValueOf(cs).Pointer(), len(cs), reflect.TypeOf(cs)}
	if b, ok := e.cache[id]; ok {
		return b, nil
	}
	bare := make([]Check, len(cs))
	for i, c := range cs {
		c.Trace = nil
		bare[i] = c
	}
	b, err := json.Marshal(bare)
	if err != nil {
		return nil, err
	}
	if e.seen[id] {
		e.cache[id] = b
	}
	e.seen[id] = true
	return b, nil
}

// objects writes key name with a list of n objects, each written by item
// (its fields through w), in the nesting the other values are written in.
func (w *jsonOut) objects(name string, n int, item func(i int)) {
	w.key(name)
	w.depth++
	w.b = append(w.b, '[')
	for i := 0; i < n; i++ {
		if i > 0 {
			w.b = append(w.b, ',')
		}
		w.b = append(w.b, '{')
		w.first = true
		item(i)
		w.b = append(w.b, '}')
	}
	w.b = append(w.b, ']')
	w.first = false
	w.depth--
}
