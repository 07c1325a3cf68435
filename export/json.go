package export

import (
	"bufio"
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"sync"

	"framecheck/internal/par"
)

// ErrNonFinite marks a results file written with NaN or Inf values
// replaced. See NonFiniteError.
var ErrNonFinite = errors.New("non-finite numbers replaced by 0")

// NonFiniteError reports the fields of a Results that held NaN or ±Inf.
// WriteJSON returns it after writing the file successfully, with every such
// value written as 0 and its member marked "error" with a message, so a
// caller may treat it as a warning (errors.Is(err, ErrNonFinite)).
type NonFiniteError struct {
	Path   string   // output file
	Fields []string // e.g. "members[3].checks[1].ratio = NaN"
}

func (e *NonFiniteError) Error() string {
	const show = 5
	list := e.Fields
	more := ""
	if len(list) > show {
		more = fmt.Sprintf(" and %d more", len(list)-show)
		list = list[:show]
	}
	return fmt.Sprintf("export: %s: %d %v: %s%s", e.Path, len(e.Fields), ErrNonFinite, strings.Join(list, "; "), more)
}

// Unwrap returns ErrNonFinite.
func (e *NonFiniteError) Unwrap() error { return ErrNonFinite }

// Sanitize returns r with every NaN or ±Inf number replaced by 0, and the
// list of fields it replaced (JSON names, e.g. "members[3].checks[1].ratio
// = NaN"). A member holding such a value gets status "error" and a message
// naming the field, and the summary is recounted for it. r itself is never
// modified; when nothing needs replacing, Sanitize returns r itself.
func Sanitize(r *Results) (*Results, []string) {
	return SanitizeNoted(r, FiniteNote{})
}

// FiniteNote is what NoteFinite found of a Results' members and uplift
// report: Sanitize's look at them, taken earlier (while other work still
// runs). It holds for those slices as they were: SanitizeNoted looks again
// at a slice replaced since; a caller must not change their numbers in
// place after noting them.
type FiniteNote struct {
	members   *Member
	nMembers  int
	membersOK bool
	uplift    *UpliftReport
	bearings  *UpliftBearing
	nBearings int
	upliftOK  bool
}

// NoteFinite looks at r's members and uplift report as Sanitize would
// (whether every number of theirs that reaches the outputs is finite),
// for SanitizeNoted.
func NoteFinite(r *Results) FiniteNote {
	n := FiniteNote{nMembers: len(r.Members), membersOK: membersFinite(r.Members),
		uplift: &r.Uplift, nBearings: len(r.Uplift.Bearings), upliftOK: upliftFinite(&r.Uplift)}
	if len(r.Members) > 0 {
		n.members = &r.Members[0]
	}
	if len(r.Uplift.Bearings) > 0 {
		n.bearings = &r.Uplift.Bearings[0]
	}
	return n
}

// SanitizeNoted is Sanitize, taking from note (NoteFinite of r) whether
// r's members and uplift report are finite rather than looking again;
// what note does not hold for (a zero note, a slice replaced since) is
// looked at as Sanitize does.
func SanitizeNoted(r *Results, note FiniteNote) (*Results, []string) {
	var fields []string
	var v reflect.Value
	var changed bool
	membersOK := note.membersOK
	if !note.holdsMembers(r) {
		membersOK = membersFinite(r.Members)
	}
	if membersOK {
		// The common case, typed and fast: walk the rest reflectively,
		// with the members (nearly all of a large plan), the uplift
		// bearings and the load path, when finite, left out.
		upOK := note.upliftOK
		if !note.holdsUplift(r) {
			upOK = upliftFinite(&r.Uplift)
		}
		pathOK := r.LoadPath != nil && loadPathFinite(r.LoadPath)
		rest := *r
		rest.Members = nil
		if upOK {
			rest.Uplift.Bearings = nil
		}
		if pathOK {
			rest.LoadPath = nil
		}
		v, changed = sanitizeValue(reflect.ValueOf(rest), make([]pathSeg, 0, 8), &fields, map[cleanSlice]bool{})
		if changed {
			out := v.Interface().(Results)
			out.Members = r.Members
			if upOK {
				out.Uplift.Bearings = r.Uplift.Bearings
			}
			if pathOK {
				out.LoadPath = r.LoadPath
			}
			v = reflect.ValueOf(out)
		}
	} else {
		v, changed = sanitizeValue(reflect.ValueOf(*r), make([]pathSeg, 0, 8), &fields, map[cleanSlice]bool{})
	}
	if !changed {
		return r, nil
	}
	out := v.Interface().(Results)
	flagged := map[int]bool{}
	for _, f := range fields {
		i, ok := memberIndex(f)
		if !ok {
			continue
		}
		m := &out.Members[i]
		msg := "non-finite value written as 0: " + f
		if strings.Contains(f, ".trace[") || strings.Contains(f, ".factors[") {
			msg += " (results.json holds it in the member's calculation)"
		}
		m.Messages = append(slices.Clip(m.Messages), msg)
		if !flagged[i] && m.Status != StatusError {
			switch m.Status {
			case StatusPass:
				out.Summary.Pass--
			case StatusFail:
				out.Summary.Fail--
			}
			out.Summary.Error++
			m.Status = StatusError
		}
		flagged[i] = true
	}
	return &out, fields
}

// holdsMembers reports whether n was noted of r's members as they are.
func (n FiniteNote) holdsMembers(r *Results) bool {
	return n.nMembers == len(r.Members) && (len(r.Members) == 0 || n.members == &r.Members[0]) && (n.members != nil || n.uplift != nil)
}

// holdsUplift reports whether n was noted of r's uplift report as it is.
func (n FiniteNote) holdsUplift(r *Results) bool {
	return n.uplift == &r.Uplift && n.nBearings == len(r.Uplift.Bearings) &&
		(len(r.Uplift.Bearings) == 0 || n.bearings == &r.Uplift.Bearings[0])
}

// membersFinite reports whether every number of the members that reaches
// results.json is finite, without reflection: Sanitize's fast path.
// Members checked alike share their checks and factors, so each shared
// slice is looked at once. TestMembersFiniteSeesEveryField holds it to
// every float64 field of Member.
func membersFinite(ms []Member) bool {
	type checksID struct {
		p *Check
		n int
	}
	type factorsID struct {
		p *TraceItem
		n int
	}
	seenChecks := map[checksID]bool{}
	seenFactors := map[factorsID]bool{}
	fin := func(vs ...float64) bool {
		for _, v := range vs {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return false
			}
		}
		return true
	}
	items := func(ts []TraceItem) bool {
		for i := range ts {
			if !fin(ts[i].Value) {
				return false
			}
		}
		return true
	}
	for i := range ms {
		m := &ms[i]
		if !fin(m.Start[0], m.Start[1], m.End[0], m.End[1], m.LengthIn, m.OverhangsIn[0], m.OverhangsIn[1],
			m.TribIn, m.SpacingIn, m.MaxRatio, m.DatumIn) || !fin(m.BearingsAtIn...) || !fin(m.SpansIn...) || !fin(m.BlockingAtIn...) ||
			!fin(m.DrawnBlockingAtIn...) || !fin(m.BlockingFromFaceIn...) {
			return false
		}
		for _, s := range m.BlockingSteps {
			if !fin(s.LuIn, s.CL, s.Ratio) || !fin(s.AtIn...) {
				return false
			}
		}
		for _, z := range m.ZonePieces {
			if !fin(z.FromIn, z.ToIn) {
				return false
			}
		}
		for _, p := range m.PointLoads {
			if !fin(p.AtIn, p.FromFaceIn, p.DeadLb, p.LiveLb, p.RoofLiveLb, p.SnowLb, p.WindDownLb, p.WindUpLb, p.UpliftDeadLb) {
				return false
			}
		}
		if len(m.Checks) > 0 && !seenChecks[checksID{&m.Checks[0], len(m.Checks)}] {
			for j := range m.Checks {
				c := &m.Checks[j]
				if !fin(c.Actual, c.Allowable, c.Ratio) || !items(c.Trace) {
					return false
				}
			}
			seenChecks[checksID{&m.Checks[0], len(m.Checks)}] = true
		}
		if len(m.Factors) > 0 && !seenFactors[factorsID{&m.Factors[0], len(m.Factors)}] {
			if !items(m.Factors) {
				return false
			}
			seenFactors[factorsID{&m.Factors[0], len(m.Factors)}] = true
		}
	}
	return true
}

// loadPathFinite reports whether every number of lp is finite (those
// results.json leaves out too), without reflection: Sanitize's fast path
// for a plan's load path (a hundred thousand joints at 100,000 joists).
// Beams and posts checked alike share their lists of checks, each looked
// at once. TestLoadPathFiniteSeesEveryField holds it to every float64 of
// LoadPath.
func loadPathFinite(lp *LoadPath) bool {
	// 0*v is 0 for a finite v, NaN for NaN and ±Inf: a sum of such
	// products is 0 only when every v is finite (and never overflows)
	zero := func(l *TypeLoads) float64 {
		return 0*l.DeadLb + 0*l.LiveLb + 0*l.RoofLiveLb + 0*l.SnowLb + 0*l.WindDownLb + 0*l.WindUpLb + 0*l.UpliftDeadLb
	}
	fin := func(vs ...float64) bool {
		for _, v := range vs {
			if 0*v != 0 {
				return false
			}
		}
		return true
	}
	type checksID struct {
		p *Check
		n int
	}
	seen := map[checksID]bool{}
	checks := func(cs []Check) bool {
		if len(cs) == 0 || seen[checksID{&cs[0], len(cs)}] {
			return true
		}
		for i := range cs {
			c := &cs[i]
			if !fin(c.Actual, c.Allowable, c.Ratio) {
				return false
			}
			for j := range c.Trace {
				if 0*c.Trace[j].Value != 0 {
					return false
				}
			}
		}
		seen[checksID{&cs[0], len(cs)}] = true
		return true
	}
	if zero(&lp.Applied)+zero(&lp.Delivered) != 0 {
		return false
	}
	for i := range lp.Beams {
		b := &lp.Beams[i]
		if !fin(b.Start[0], b.Start[1], b.End[0], b.End[1], b.StartIn[0], b.StartIn[1], b.EndIn[0], b.EndIn[1],
			b.LengthIn, b.MaxRatio) || !fin(b.SpansIn...) || !checks(b.Checks) {
			return false
		}
	}
	for i := range lp.Posts {
		p := &lp.Posts[i]
		if 0*p.At[0]+0*p.At[1]+0*p.AtIn[0]+0*p.AtIn[1]+0*p.HeightIn+0*p.DownLb+0*p.UpLb+zero(&p.Loads) != 0 || !checks(p.Checks) {
			return false
		}
	}
	for i := range lp.Connections {
		c := &lp.Connections[i]
		if 0*c.DownLb+0*c.UpLb+zero(&c.Loads) != 0 {
			return false
		}
	}
	for i := range lp.Foundation {
		f := &lp.Foundation[i]
		if 0*f.LengthIn+zero(&f.Loads)+zero(&f.PerFoot) != 0 {
			return false
		}
	}
	return true
}

// memberIndex parses "members[12]...." into 12.
func memberIndex(field string) (int, bool) {
	rest, ok := strings.CutPrefix(field, "members[")
	if !ok {
		return 0, false
	}
	n, _, ok := strings.Cut(rest, "]")
	if !ok {
		return 0, false
	}
	i, err := strconv.Atoi(n)
	return i, err == nil
}

// pathSeg is one step of a field path: a JSON name, or an index when
// Name is "".
type pathSeg struct {
	Name  string
	Index int
}

// joinPath formats segments as "members[3].checks[1].ratio".
func joinPath(segs []pathSeg) string {
	var b strings.Builder
	for _, s := range segs {
		if s.Name == "" {
			fmt.Fprintf(&b, "[%d]", s.Index)
			continue
		}
		if b.Len() > 0 {
			b.WriteByte('.')
		}
		b.WriteString(s.Name)
	}
	return b.String()
}

// sanitizeValue returns v, or a copy of v with non-finite floats set to 0
// (copying only the structs and slices on the way to such a value), and
// whether it changed anything. Fields tagged json:"-" are left alone: they
// never reach the file. path is only formatted when a value is replaced.
// clean holds the slices already found clean: members checked alike share
// their check and trace slices, and each is walked once.
func sanitizeValue(v reflect.Value, path []pathSeg, fields *[]string, clean map[cleanSlice]bool) (reflect.Value, bool) {
	switch v.Kind() {
	case reflect.Float32, reflect.Float64:
		f := v.Float()
		if math.IsNaN(f) || math.IsInf(f, 0) {
			*fields = append(*fields, fmt.Sprintf("%s = %v", joinPath(path), f))
			return reflect.Zero(v.Type()), true
		}
	case reflect.Struct:
		var cp reflect.Value
		t := v.Type()
		for _, fi := range jsonFields(t) {
			i := fi.Index
			nv, changed := sanitizeValue(v.Field(i), append(path, pathSeg{Name: fi.Name}), fields, clean)
			if changed {
				if !cp.IsValid() {
					cp = reflect.New(t).Elem()
					cp.Set(v)
				}
				cp.Field(i).Set(nv)
			}
		}
		if cp.IsValid() {
			return cp, true
		}
	case reflect.Slice, reflect.Array:
		var id cleanSlice
		if v.Kind() == reflect.Slice && v.Len() > 0 {
			id = cleanSlice{v.Pointer(), v.Len(), v.Type()}
			if clean[id] {
				return v, false
			}
		}
		if cp, ok := mapElems(v, func(i int) (reflect.Value, bool) {
			return sanitizeValue(v.Index(i), append(path, pathSeg{Index: i}), fields, clean)
		}); ok {
			return cp, true
		}
		if id.n > 0 {
			clean[id] = true
		}
	}
	return v, false
}

// cleanSlice names a slice by its first element, length and type.
type cleanSlice struct {
	p uintptr
	n int
	t reflect.Type
}

// jsonField is an exported struct field that reaches the JSON.
type jsonField struct {
	Index int
	Name  string
}

var jsonFieldCache sync.Map // reflect.Type -> []jsonField

// jsonFields lists t's fields that reach the JSON, with their JSON names.
func jsonFields(t reflect.Type) []jsonField {
	if c, ok := jsonFieldCache.Load(t); ok {
		return c.([]jsonField)
	}
	var fs []jsonField
	for i := 0; i < t.NumField(); i++ {
		sf := t.Field(i)
		if name := jsonName(sf); sf.IsExported() && name != "-" {
			fs = append(fs, jsonField{Index: i, Name: name})
		}
	}
	jsonFieldCache.Store(t, fs)
	return fs
}

func jsonName(sf reflect.StructField) string {
	tag := sf.Tag.Get("json")
	if tag == "-" {
		return "-"
	}
	name, _, _ := strings.Cut(tag, ",")
	if name == "" {
		return sf.Name
	}
	return name
}

// WriteJSON writes r as results.json to path, atomically, in the layout of
// Schema (which it writes, whatever r.Schema holds): members without their
// traces and factors, which are in "calculations", written once for the
// members that share them (the same Checks slice). Lists are written as [] rather than null; each member, mark
// and blocking row is one line, so files diff well. NaN and ±Inf never
// reach the file: they are written as 0 and reported, after a successful
// write, as a *NonFiniteError (see Sanitize). A path ending in .dxf is
// refused so that a results file can never replace a drawing.
func WriteJSON(path string, r *Results) error {
	return WriteJSONNoted(path, r, FiniteNote{})
}

// WriteJSONNoted is WriteJSON, taking from note (NoteFinite of r) what it
// holds, as SanitizeNoted does.
func WriteJSONNoted(path string, r *Results, note FiniteNote) error {
	if err := refuseDrawing(path); err != nil {
		return err
	}
	clean, fields := SanitizeNoted(r, note)
	err := writeAtomic(path, func(w *bufio.Writer) error {
		return encodeResults(w, clean, layoutV3)
	})
	if err != nil {
		return err
	}
	if len(fields) > 0 {
		return &NonFiniteError{Path: path, Fields: fields}
	}
	return nil
}

// encodeResults writes r as JSON in layout lay: the top-level keys one per
// line, list items one per line.
func encodeResults(w *bufio.Writer, r *Results, lay jsonLayout) error {
	schema := lay.schema // the layout written here, whatever r.Schema says
	first := true
	key := func(name string) {
		if !first {
			w.WriteString(",\n")
		}
		first = false
		w.WriteString(" \"" + name + "\": ")
	}
	value := func(name string, v any) error {
		key(name)
		b, err := json.Marshal(v)
		if err != nil {
			return fmt.Errorf("%s: %w", name, err)
		}
		w.Write(b)
		return nil
	}
	listBytes := func(name string, n int, enc func(i int) ([]byte, error)) error {
		key(name)
		return writeJSONItems(w, name, n, "  ", " ", enc)
	}
	list := func(name string, n int, item func(i int) any) error {
		return listBytes(name, n, func(i int) ([]byte, error) { return json.Marshal(item(i)) })
	}
	me := newMemberEncoder(lay)
	calcs := newCalcTable()
	var paths *pathRefs // schema 3's load path references
	// Schema 3: the fields members of a mark share, found before the
	// members are written (json_share.go).
	var shares []*markShare
	markAt := map[string]int{}
	if lay.refs {
		me.srcFile = sourceFileOf(r.Members)
		me.toInch, _ = UnitToInch(r.DrawingUnits)
		var err error
		if shares, err = shareByMark(r, me, calcs, markAt); err != nil {
			return err
		}
	}
	// rounded returns v as schema 3 writes it (json_round.go).
	rounded := func(v any) any {
		if !lay.refs {
			return v
		}
		return roundedCopy(v)
	}
	w.WriteString("{\n")
	steps := []func() error{
		func() error { return value("schema", schema) },
		func() error {
			if r.ToolVersion == "" {
				return nil
			}
			return value("tool_version", r.ToolVersion)
		},
		func() error { return value("project", r.Project) },
		func() error { return value("plan", r.Plan) },
		func() error {
			if r.InputSHA256 == "" {
				return nil
			}
			return value("input_sha256", r.InputSHA256)
		},
		func() error { return value("drawing_units", r.DrawingUnits) },
		func() error {
			if r.Datum == "" {
				return nil
			}
			return value("datum", r.Datum)
		},
		func() error {
			if me.srcFile == "" {
				return nil
			}
			return value("source_file", me.srcFile)
		},
		func() error {
			if lay.refs {
				return writeMembersV3(w, key, r, me, calcs, shares, markAt)
			}
			return listBytes("members", len(r.Members), func(i int) ([]byte, error) {
				m := memberForJSON(r.Members[i], calcs.id(&r.Members[i]))
				return me.encode(&m, &r.Members[i])
			})
		},
		func() error {
			// the load path's beams and posts refer to calculations too,
			// numbered after the members'
			if lay.refs && r.LoadPath != nil {
				paths = loadPathRefs(r.LoadPath, calcs)
			}
			return calcs.write(w, key, lay.refs)
		},
		func() error {
			if !lay.refs {
				return nil
			}
			return me.infos.write(w, key)
		},
		func() error {
			return listBytes("marks", len(r.Marks), func(i int) ([]byte, error) {
				m := r.Marks[i]
				m.SpansIn = orEmpty(m.SpansIn)
				m.BlockingRowsPerSpan = orEmpty(m.BlockingRowsPerSpan)
				b, err := json.Marshal(rounded(m))
				if k, ok := markAt[m.Mark]; err != nil || !lay.refs || !ok || k != i {
					return b, err
				}
				if sh := shares[i].shared(); len(sh) > 0 {
					b = append(b[:len(b)-1], `,"shared":`...)
					b = append(b, sharedJSON(sh)...)
					b = append(b, '}')
				}
				return b, nil
			})
		},
		func() error {
			return list("blocking_rows", len(r.BlockingRows), func(i int) any {
				b := r.BlockingRows[i]
				b.ClearIn = orEmpty(b.ClearIn)
				b.Members = orEmpty(b.Members)
				return rounded(b)
			})
		},
		func() error {
			key("uplift")
			var marks map[string]string // member id to mark (schema 3)
			if lay.refs {
				marks = make(map[string]string, len(r.Members))
				for i := range r.Members {
					marks[r.Members[i].ID] = r.Members[i].Mark
				}
			}
			if err := writeUpliftJSON(w, &r.Uplift, marks); err != nil {
				return fmt.Errorf("uplift: %w", err)
			}
			return nil
		},
		func() error {
			if r.LoadPath == nil {
				return nil
			}
			key("load_path")
			if paths != nil {
				return writeLoadPathV3(w, r.LoadPath, paths)
			}
			return writeLoadPathJSON(w, r.LoadPath, rounded)
		},
		func() error {
			t := r.Takeoff
			t.Joists, t.Blocking, t.Hangers = orEmpty(t.Joists), orEmpty(t.Blocking), orEmpty(t.Hangers)
			return value("takeoff", rounded(t))
		},
		func() error { return value("summary", r.Summary) },
		func() error {
			a := r.Assumptions
			a.CodeEditions, a.Combinations = orEmpty(a.CodeEditions), orEmpty(a.Combinations)
			a.Switches, a.Zones = orEmpty(a.Switches), orEmpty(a.Zones)
			a.DesignValues, a.Notes = orEmpty(a.DesignValues), orEmpty(a.Notes)
			return value("assumptions", rounded(a))
		},
	}
	for _, step := range steps {
		if err := step(); err != nil {
			return err
		}
	}
	w.WriteString("\n}\n")
	return nil
}

// memberForJSON returns m as a member of results.json names it: empty
// lists as [], its calculation's id in Calculation and no factors (they
// are in the calculation). The checks are left as they are; the member
// encoder writes them without their traces.
func memberForJSON(m Member, calc string) Member {
	m.BearingsAtIn = orEmpty(m.BearingsAtIn)
	m.SpansIn = orEmpty(m.SpansIn)
	m.Checks = orEmpty(m.Checks)
	m.BlockingRowsPerSpan = orEmpty(m.BlockingRowsPerSpan)
	m.BlockingAtIn = orEmpty(m.BlockingAtIn)
	m.Messages = orEmpty(m.Messages)
	m.Calculation = calc
	m.Factors = nil
	return m
}

// orEmpty returns s, or an empty non-nil slice when s is nil, so that the
// JSON shows [] rather than null.
func orEmpty[T any](s []T) []T {
	if s == nil {
		return []T{}
	}
	return s
}

// writeLoadPathJSON writes lp as json.Marshal would (the same keys, in
// order, null for a nil list), each beam, post, connection and foundation
// line encoded alone on its own line: the section stays streamed however
// many joints the plan has, as the members are. round gives a value as
// the layout writes it.
func writeLoadPathJSON(w *bufio.Writer, lp *LoadPath, round func(any) any) error {
	w.WriteString("{\n")
	list := func(name string, n int, isNil bool, item func(i int) any) error {
		return writeLoadPathList(w, name, n, isNil,
			blockEncoder(n, func(i int) ([]byte, error) { return json.Marshal(round(item(i))) }))
	}
	if err := list("beams", len(lp.Beams), lp.Beams == nil, func(i int) any { return lp.Beams[i] }); err != nil {
		return err
	}
	if err := list("posts", len(lp.Posts), lp.Posts == nil, func(i int) any { return lp.Posts[i] }); err != nil {
		return err
	}
	if err := list("connections", len(lp.Connections), lp.Connections == nil, func(i int) any { return lp.Connections[i] }); err != nil {
		return err
	}
	if err := list("foundation", len(lp.Foundation), lp.Foundation == nil, func(i int) any { return lp.Foundation[i] }); err != nil {
		return err
	}
	return writeLoadPathTotals(w, lp, func(l *TypeLoads) ([]byte, error) { return json.Marshal(round(*l)) })
}

// writeJSONItems writes n items encoded by enc as a JSON list of one item
// a line, each after indent, the closing bracket after closeIndent; [] when
// there are none.
func writeJSONItems(w *bufio.Writer, name string, n int, indent, closeIndent string, enc func(i int) ([]byte, error)) error {
	if n == 0 {
		w.WriteString("[]")
		return nil
	}
	w.WriteString("[\n")
	for i := 0; i < n; i++ {
		b, err := enc(i)
		if err != nil {
			return fmt.Errorf("%s[%d]: %w", name, i, err)
		}
		w.WriteString(indent)
		w.Write(b)
		if i < n-1 {
			w.WriteByte(',')
		}
		w.WriteByte('\n')
	}
	w.WriteString(closeIndent + "]")
	return nil
}

// encodeBlock is how many items blockEncoder encodes at a time.
const encodeBlock = 8192

// blockEncoder returns enc for a caller asking for items 0 to n-1 in
// order (writeJSONItems), encoding encodeBlock items at a time on every
// core (par.Ranges): the load path of a large plan has a hundred thousand
// connections, each encoded through reflection. enc must be safe to call
// from several goroutines; the bytes written are the same.
func blockEncoder(n int, enc func(i int) ([]byte, error)) func(i int) ([]byte, error) {
	var bufs [][]byte
	var errs []error
	lo := 0
	return func(i int) ([]byte, error) {
		if bufs == nil || i < lo || i >= lo+len(bufs) {
			lo = i
			m := min(encodeBlock, n-i)
			bufs, errs = make([][]byte, m), make([]error, m)
			par.Ranges(m, func(a, b int) {
				for k := a; k < b; k++ {
					bufs[k], errs[k] = enc(lo + k)
				}
			})
		}
		return bufs[i-lo], errs[i-lo]
	}
}
