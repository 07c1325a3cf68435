package dxfimport

import (
	"bytes"
	"io"
	"strings"
)

// rtag is one pair of a group; its value is arena[off:end].
type rtag struct {
	code, line int
	off, end   int
}

// group is the pairs of one entity or table entry, from its 0/TYPE pair
// up to (not including) the next code 0. It is reused from one group to
// the next, so reading an entity allocates nothing per pair.
type group struct {
	typ    string
	line   int
	handle string
	tags   []rtag
	arena  []byte
}

func (g *group) raw(t rtag) []byte { return g.arena[t.off:t.end] }

// readGroup reads the group starting at the current 0/TYPE pair. It
// leaves the next 0 pair unread.
func (r *reader) readGroup() (*group, error) {
	g := &r.g
	g.typ = r.typeName(r.tr.value)
	g.line = r.tr.start
	g.handle = ""
	g.tags = g.tags[:0]
	g.arena = g.arena[:0]
	for {
		err := r.next()
		if err == io.EOF {
			return g, &ParseError{File: r.d.File, Line: max(r.tr.start, 1), Code: -1,
				Err: wrapf(ErrTruncated, "the file ends inside 0/%s (line %d)", g.typ, g.line)}
		}
		if err != nil {
			return g, err
		}
		if r.tr.code == 0 {
			r.unread = true
			return g, nil
		}
		off := len(g.arena)
		g.arena = append(g.arena, r.tr.value...)
		g.tags = append(g.tags, rtag{code: r.tr.code, line: r.tr.start, off: off, end: len(g.arena)})
		if r.tr.code == 5 && g.handle == "" {
			g.handle = r.slab.str(bytes.TrimSpace(r.tr.value))
		}
	}
}

// typeName interns an entity type name.
func (r *reader) typeName(b []byte) string {
	if s, ok := r.names[string(b)]; ok {
		return s
	}
	s := strings.TrimSpace(string(b))
	r.names[string(b)] = s
	return s
}

// gErr returns a ParseError at pair t of g.
func (r *reader) gErr(g *group, t rtag, sentinel error, format string, args ...any) error {
	return &ParseError{File: r.d.File, Line: t.line, Code: t.code, Handle: g.handle,
		Err: wrapf(sentinel, format, args...)}
}

// gFloat parses pair t of g as a number.
func (r *reader) gFloat(g *group, t rtag) (float64, error) {
	f, ok := parseFloat(g.raw(t))
	if !ok {
		return 0, r.gErr(g, t, ErrBadNumber, "want a number in %s, got %q", g.typ, clip(g.raw(t)))
	}
	return f, nil
}

// gInt parses pair t of g as an integer.
func (r *reader) gInt(g *group, t rtag) (int, error) {
	n, ok := parseInt(g.raw(t))
	if !ok {
		return 0, r.gErr(g, t, ErrBadNumber, "want an integer in %s, got %q", g.typ, clip(g.raw(t)))
	}
	return n, nil
}

// readBlocks reads block definitions.
func (r *reader) readBlocks(start int) error {
	if err := r.next(); err != nil {
		return r.eofErr(err, "section BLOCKS", start)
	}
	for {
		if r.tr.code != 0 {
			return r.errf(ErrStructure, "want an entity (code 0) in BLOCKS")
		}
		if r.is(0, "ENDSEC") {
			r.endEntity()
			r.cur = nil
			return nil
		}
		g, err := r.readGroup()
		if err != nil {
			return err
		}
		switch g.typ {
		case "BLOCK":
			r.endEntity()
			b, err := r.blockHeader(g)
			if err != nil {
				return err
			}
			r.cur = b
		case "ENDBLK":
			r.endEntity()
			r.cur = nil
		default:
			if r.cur == nil {
				r.d.Skipped["outside BLOCK"]++
			} else if err := r.entity(g); err != nil {
				return err
			}
		}
		if err := r.next(); err != nil {
			return r.eofErr(err, "section BLOCKS", start)
		}
	}
}

// blockHeader reads a 0/BLOCK group.
func (r *reader) blockHeader(g *group) (*block, error) {
	b := &block{line: g.line}
	for _, t := range g.tags {
		var err error
		switch t.code {
		case 2:
			b.name = r.str(g.raw(t))
		case 10:
			b.base.X, err = r.gFloat(g, t)
		case 20:
			b.base.Y, err = r.gFloat(g, t)
		}
		if err != nil {
			return nil, err
		}
	}
	r.blocks[strings.ToUpper(b.name)] = b
	return b, nil
}

// readEntities reads model-space entities.
func (r *reader) readEntities(start int) error {
	r.cur = nil
	if err := r.next(); err != nil {
		return r.eofErr(err, "section ENTITIES", start)
	}
	for {
		if r.tr.code != 0 {
			return r.errf(ErrStructure, "want an entity (code 0) in ENTITIES")
		}
		if r.is(0, "ENDSEC") {
			r.endEntity()
			return nil
		}
		g, err := r.readGroup()
		if err != nil {
			return err
		}
		if err := r.entity(g); err != nil {
			return err
		}
		if err := r.next(); err != nil {
			return r.eofErr(err, "section ENTITIES", start)
		}
	}
}

// slab hands out small points slices and strings cut from larger blocks,
// so that reading an entity costs no allocation of its own for them.
type slab struct {
	pts []Point
	sb  strings.Builder
}

// newPoints returns n zero points with capacity n.
func (r *reader) newPoints(n int) []Point {
	s := &r.slab
	if n > 64 {
		return make([]Point, n)
	}
	if len(s.pts)+n > cap(s.pts) {
		s.pts = make([]Point, 0, 2048)
	}
	k := len(s.pts)
	s.pts = s.pts[:k+n]
	return s.pts[k : k+n : k+n]
}

// str returns b as a string. The bytes go to an append-only builder: the
// strings already handed out never change when it grows.
func (s *slab) str(b []byte) string {
	if len(b) == 0 {
		return ""
	}
	if s.sb.Len()+len(b) > 16<<10 {
		s.sb = strings.Builder{}
	}
	if s.sb.Cap() == 0 {
		s.sb.Grow(16 << 10)
	}
	k := s.sb.Len()
	s.sb.Write(b)
	return s.sb.String()[k:]
}
