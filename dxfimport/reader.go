package dxfimport

import (
	"fmt"
	"io"
	"os"
	"sort"
	"strings"
	"unicode/utf8"
)

// Options tune the reader. The zero value reads the units from the header
// and uses the default limits.
type Options struct {
	// Units overrides $INSUNITS: "in", "ft", "mm", "cm" or "m"; "" uses
	// the header.
	Units string
	// MaxInsertDepth limits nested block inserts (0 = DefaultMaxInsertDepth).
	// A block that inserts itself is always caught.
	MaxInsertDepth int
	// MaxEntities limits the entities in the result (0 = no limit of the
	// caller's; HardMaxEntities always applies). An INSERT or MINSERT that
	// would pass the limit is left out whole and reported as an error issue.
	MaxEntities int
	// Keep, when not nil, says which layers' entities the caller uses.
	// Entities on other layers are read (and their syntax checked) but
	// not kept: they are counted in Drawing.Dropped by layer and kind, so
	// memory follows the kept entities, and MaxEntities applies to them
	// alone. An INSERT that would pass the limit but places nothing on a
	// kept layer is left out with a warning, not an error. Keep is called
	// once per layer name.
	Keep func(layer string) bool
}

// DefaultMaxInsertDepth is the nesting limit used when
// Options.MaxInsertDepth is 0.
const DefaultMaxInsertDepth = 16

// HardMaxEntities is the most entities a Drawing ever holds, whatever
// Options.MaxEntities says: a few gigabytes of memory. It keeps a small
// file with nested MINSERT arrays from exhausting memory or time.
const HardMaxEntities = 10_000_000

// ReadFile opens the named file read-only and reads it with Read.
func ReadFile(name string, opt Options) (*Drawing, error) {
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	return Read(f, name, opt)
}

// Read reads an ASCII DXF drawing from r; name is used in positions and
// errors. It returns the model-space entities with every INSERT expanded,
// in world inches. Malformed input gives a *ParseError; findings that do
// not stop the reading are in Drawing.Issues.
func Read(r io.Reader, name string, opt Options) (*Drawing, error) {
	if err := checkUnits(opt.Units); err != nil {
		return nil, err
	}
	rd := &reader{
		tr:     NewTagReader(r, name),
		opt:    opt,
		names:  map[string]string{"0": "0"},
		blocks: map[string]*block{},
		d: &Drawing{
			File:    name,
			ToInch:  1,
			Skipped: map[string]int{},
			Dropped: map[string]map[Kind]int{},
		},
	}
	if rd.opt.MaxInsertDepth <= 0 {
		rd.opt.MaxInsertDepth = DefaultMaxInsertDepth
	}
	if rd.opt.MaxEntities <= 0 || rd.opt.MaxEntities > HardMaxEntities {
		rd.opt.MaxEntities = HardMaxEntities
	}
	if err := rd.run(); err != nil {
		return nil, err
	}
	return rd.d, nil
}

// reader holds the state of one Read.
type reader struct {
	tr     *TagReader
	opt    Options
	d      *Drawing
	unread bool

	names        map[string]string // interned layer and type names
	cp1252       bool              // pre-2007 file in code page 1252
	warnedDecode bool
	codepage     string

	unitsFixed   bool
	sawInsUnits  bool
	insUnitsLine int

	g         group
	blocks    map[string]*block
	cur       *block  // block being read, nil in ENTITIES
	poly      *local  // open POLYLINE awaiting VERTEX/SEQEND
	polyN     vec3    // its extrusion
	polyElev  float64 // its elevation (OCS Z)
	polySkip  bool    // skipping a POLYLINE's VERTEX/SEQEND
	deferred  []local // model-space inserts of blocks not yet defined
	finishing bool
	ents      entityStore
	slab      slab
	work      int  // block copies placed so far
	stop      bool // the entity limit was hit: expand no more
	warned    map[string]bool
	kept      map[string]bool // Options.Keep by layer name
	keepsMemo map[string]bool // keepsAny by block and inherited layer
}

// next reads the next pair into r.tr, skipping 999 comments.
func (r *reader) next() error {
	if r.unread {
		r.unread = false
		return nil
	}
	for {
		if err := r.tr.next(); err != nil {
			return err
		}
		if r.tr.code != 999 {
			return nil
		}
	}
}

// errf returns a ParseError at the current pair.
func (r *reader) errf(sentinel error, format string, args ...any) error {
	return &ParseError{File: r.d.File, Line: max(r.tr.start, 1), Code: r.tr.code,
		Err: wrapf(sentinel, format, args...)}
}

// is reports whether the current pair is (code, value).
func (r *reader) is(code int, value string) bool {
	return r.tr.code == code && string(r.tr.value) == value
}

// run reads the sections up to 0 EOF.
func (r *reader) run() error {
	for {
		err := r.next()
		if err == io.EOF {
			// Strict: a DXF ends with 0/EOF; without it the file may
			// have been cut off at a section boundary.
			return &ParseError{File: r.d.File, Line: max(r.tr.start, 1), Code: -1,
				Err: wrapf(ErrTruncated, "no 0/EOF marker after the last section: the file is cut off")}
		}
		if err != nil {
			return err
		}
		if r.is(0, "EOF") {
			break
		}
		if !r.is(0, "SECTION") {
			return r.errf(ErrStructure, "want 0/SECTION or 0/EOF, got %d/%q", r.tr.code, clip(r.tr.value))
		}
		start := r.tr.start
		if err := r.next(); err != nil {
			return r.eofErr(err, "SECTION", start)
		}
		if r.tr.code != 2 {
			return r.errf(ErrStructure, "want the section name (code 2) after 0/SECTION")
		}
		name := strings.TrimSpace(string(r.tr.value))
		switch name {
		case "HEADER":
			err = r.readHeader(start)
		case "TABLES":
			err = r.readTables(start)
		case "BLOCKS":
			err = r.readBlocks(start)
		case "ENTITIES":
			r.fixUnits()
			err = r.readEntities(start)
		default:
			r.d.Skipped["SECTION:"+name]++
			err = r.skipSection(name, start)
		}
		if err != nil {
			return err
		}
	}
	r.finish()
	return nil
}

// eofErr turns io.EOF inside a section into ErrTruncated.
func (r *reader) eofErr(err error, what string, start int) error {
	if err != io.EOF {
		return err
	}
	return &ParseError{File: r.d.File, Line: max(r.tr.start, 1), Code: -1,
		Err: wrapf(ErrTruncated, "the file ends inside %s (started at line %d)", what, start)}
}

// skipSection reads up to the section's ENDSEC.
func (r *reader) skipSection(name string, start int) error {
	for {
		if err := r.next(); err != nil {
			return r.eofErr(err, "section "+name, start)
		}
		if r.is(0, "ENDSEC") {
			return nil
		}
	}
}

// readHeader reads the header variables the drawing needs.
func (r *reader) readHeader(start int) error {
	var v string
	d := r.d
	var ext [2]Point
	for {
		if err := r.next(); err != nil {
			return r.eofErr(err, "section HEADER", start)
		}
		t := r.tr
		code := t.code
		if code == 0 {
			if r.is(0, "ENDSEC") {
				d.ExtMin, d.ExtMax = ext[0], ext[1]
				r.cp1252 = d.Version < "AC1021" && strings.EqualFold(r.codepage, "ANSI_1252")
				if d.Version < "AC1021" && r.codepage != "" && !r.cp1252 {
					d.Issues.Add(Pos{File: d.File}, "DXF106", SevWarning,
						"code page %s is not supported: text outside ASCII is read as UTF-8, or as ANSI_1252 where it is not valid UTF-8", r.codepage)
				}
				return nil
			}
			return r.errf(ErrStructure, "want 9/$NAME or 0/ENDSEC in the HEADER, got 0/%q", clip(t.value))
		}
		if code == 9 {
			v = strings.TrimSpace(string(t.value))
			continue
		}
		var err error
		switch {
		case v == "$ACADVER" && code == 1:
			d.Version = strings.TrimSpace(string(t.value))
		case v == "$INSUNITS" && code == 70:
			d.InsUnits, err = r.intVal()
			r.sawInsUnits, r.insUnitsLine = true, t.start
		case v == "$HANDSEED" && code == 5:
			d.HandSeed = strings.TrimSpace(string(t.value))
		case v == "$DWGCODEPAGE" && code == 3:
			r.codepage = strings.TrimSpace(string(t.value))
		case (v == "$EXTMIN" || v == "$EXTMAX") && (code == 10 || code == 20):
			var f float64
			f, err = r.floatVal()
			i := 0
			if v == "$EXTMAX" {
				i = 1
			}
			if code == 10 {
				ext[i].X = f
			} else {
				ext[i].Y = f
			}
		}
		if err != nil {
			return err
		}
	}
}

// floatVal parses the current value as a number.
func (r *reader) floatVal() (float64, error) {
	f, ok := parseFloat(r.tr.value)
	if !ok {
		return 0, r.errf(ErrBadNumber, "want a number, got %q", clip(r.tr.value))
	}
	return f, nil
}

// intVal parses the current value as an integer.
func (r *reader) intVal() (int, error) {
	n, ok := parseInt(r.tr.value)
	if !ok {
		return 0, r.errf(ErrBadNumber, "want an integer, got %q", clip(r.tr.value))
	}
	return n, nil
}

// readTables reads the LAYER table and skips the others.
func (r *reader) readTables(start int) error {
	table := ""
	if err := r.next(); err != nil {
		return r.eofErr(err, "section TABLES", start)
	}
	for {
		if r.tr.code != 0 {
			return r.errf(ErrStructure, "want 0/TABLE or 0/ENDSEC in TABLES")
		}
		if r.is(0, "ENDSEC") {
			return nil
		}
		g, err := r.readGroup()
		if err != nil {
			return r.eofErr(err, "section TABLES", start)
		}
		switch {
		case g.typ == "TABLE":
			table = ""
			for _, t := range g.tags {
				if t.code == 2 {
					table = strings.TrimSpace(string(g.raw(t)))
				}
			}
		case g.typ == "ENDTAB":
			table = ""
		case g.typ == "LAYER" && table == "LAYER":
			if err := r.addLayer(g); err != nil {
				return err
			}
		}
		if err := r.next(); err != nil {
			return r.eofErr(err, "section TABLES", start)
		}
	}
}

// addLayer adds one LAYER table entry.
func (r *reader) addLayer(g *group) error {
	l := Layer{On: true, Color: 7}
	for _, t := range g.tags {
		switch t.code {
		case 2:
			l.Name = r.name(g.raw(t))
		case 62:
			n, err := r.gInt(g, t)
			if err != nil {
				return err
			}
			l.On = n >= 0
			if n < 0 {
				n = -n
			}
			l.Color = n
		case 70:
			n, err := r.gInt(g, t)
			if err != nil {
				return err
			}
			l.Frozen = n&1 != 0
		}
	}
	r.d.Layers = append(r.d.Layers, l)
	return nil
}

// str decodes a string value: code page 1252 in pre-2007 files that say
// so, else UTF-8 (bytes that are not valid UTF-8 are read as 1252, with
// one warning), then \U+XXXX escapes.
func (r *reader) str(b []byte) string {
	var s string
	switch {
	case isASCII(b):
		s = string(b)
	case r.cp1252:
		s = decodeCP1252(b)
	case utf8.Valid(b):
		s = string(b)
	default:
		s = decodeCP1252(b)
		if !r.warnedDecode {
			r.warnedDecode = true
			r.d.Issues.Add(Pos{File: r.d.File}, "DXF106", SevWarning,
				"text that is not valid UTF-8 was read as code page 1252")
		}
	}
	return decodeEscapes(s)
}

// name returns an interned, decoded layer or block name.
func (r *reader) name(b []byte) string {
	if s, ok := r.names[string(b)]; ok {
		return s
	}
	s := r.str(b)
	r.names[string(b)] = s
	return s
}

// finish expands deferred inserts, converts the extents and summarises
// what was skipped.
func (r *reader) finish() {
	r.fixUnits()
	d := r.d
	r.cur = nil
	if r.poly != nil {
		r.closePoly()
	}
	r.finishing = true
	for i := range r.deferred {
		r.emitInsert(&r.deferred[i])
	}
	r.deferred = nil
	d.Entities = r.ents.slice()
	d.ExtMin = Point{d.ExtMin.X * d.ToInch, d.ExtMin.Y * d.ToInch}
	d.ExtMax = Point{d.ExtMax.X * d.ToInch, d.ExtMax.Y * d.ToInch}
	keys := make([]string, 0, len(d.Skipped))
	for k := range d.Skipped {
		if !routineSections[k] {
			keys = append(keys, k)
		}
	}
	if len(keys) > 0 {
		sort.Strings(keys)
		parts := make([]string, len(keys))
		for i, k := range keys {
			parts[i] = fmt.Sprintf("%s %d", k, d.Skipped[k])
		}
		d.Issues.Add(Pos{File: d.File}, "DXF102", SevInfo, "not read (nothing framecheck uses): %s", strings.Join(parts, ", "))
	}
}

// routineSections are sections every R13+ DXF has and that hold nothing
// the checks use (class definitions, non-graphical objects, the preview
// image). They are counted in Drawing.Skipped but not reported: a finding
// for them on every plan would only be noise.
var routineSections = map[string]bool{
	"SECTION:CLASSES":        true,
	"SECTION:OBJECTS":        true,
	"SECTION:THUMBNAILIMAGE": true,
}

// warnOnce adds an issue the first time key is seen.
func (r *reader) warnOnce(key string, pos Pos, code string, sev Severity, format string, args ...any) {
	if r.warned == nil {
		r.warned = map[string]bool{}
	}
	if r.warned[key] {
		return
	}
	r.warned[key] = true
	r.d.Issues.Add(pos, code, sev, format, args...)
}
