package export

import (
	"encoding/json"
	"reflect"
	"strings"
)

// memberEncoder writes a member exactly as json.Marshal does
// memberForJSON(m) with the checks' traces left out, but encodes each
// distinct checks slice once: members checked alike share it (the caller
// checks identical members once).
//
// The member is written in five pieces, in field order: the fields before
// Checks, "checks", the fields between Checks and Factors, "factors"
// (always empty in the file, so left out), the fields after. The three runs of plain fields are encoded with struct
// types built from Member's own fields (reflect.StructOf), so a field
// added to Member is written without a change here.
type memberEncoder struct {
	parts   [3]memberPart
	factors fieldTag
	checks  fieldTag
	// seen holds the slices met once; cache the JSON of those met again.
	// A plan whose members are all different caches nothing.
	seen  map[cleanSlice]bool
	cache map[cleanSlice][]byte
	buf   []byte // the last member written, reused
}

// memberPart is a run of Member's fields and a struct type holding them.
type memberPart struct {
	typ reflect.Type
	idx []int // Member field index of each field of typ
}

// fieldTag is a field's JSON key (quoted, with its colon) and whether it
// has omitempty.
type fieldTag struct {
	key       []byte
	omitEmpty bool
}

func newMemberEncoder() *memberEncoder {
	t := reflect.TypeFor[Member]()
	e := &memberEncoder{seen: map[cleanSlice]bool{}, cache: map[cleanSlice][]byte{}}
	part := 0
	var fields [3][]reflect.StructField
	for i := 0; i < t.NumField(); i++ {
		f := t.Field(i)
		switch f.Name {
		case "Checks":
			e.checks, part = tagOf(f), 1
			continue
		case "Factors":
			e.factors, part = tagOf(f), 2
			continue
		}
		fields[part] = append(fields[part], reflect.StructField{Name: f.Name, Type: f.Type, Tag: f.Tag})
		e.parts[part].idx = append(e.parts[part].idx, i)
	}
	for p := range e.parts {
		e.parts[p].typ = reflect.StructOf(fields[p])
	}
	return e
}

func tagOf(f reflect.StructField) fieldTag {
	name, opts, _ := strings.Cut(f.Tag.Get("json"), ",")
	if name == "" {
		name = f.Name
	}
	key, _ := json.Marshal(name)
	return fieldTag{key: append(key, ':'), omitEmpty: strings.Contains(","+opts+",", ",omitempty,")}
}

// encode returns the JSON of member m (already through memberForJSON),
// whose Checks and Factors came from orig's. The bytes are valid until
// the next call.
func (e *memberEncoder) encode(m, orig *Member) ([]byte, error) {
	v := reflect.ValueOf(m).Elem()
	out := append(e.buf[:0], '{')
	sep := func() {
		if len(out) > 1 {
			out = append(out, ',')
		}
	}
	for p := range e.parts {
		part := &e.parts[p]
		pv := reflect.New(part.typ).Elem()
		for j, i := range part.idx {
			pv.Field(j).Set(v.Field(i))
		}
		b, err := json.Marshal(pv.Interface())
		if err != nil {
			return nil, err
		}
		if inner := b[1 : len(b)-1]; len(inner) > 0 {
			sep()
			out = append(out, inner...)
		}
		switch p {
		case 0:
			b, err := e.checksJSON(orig.Checks)
			if err != nil {
				return nil, err
			}
			out = e.field(out, e.checks, b, len(m.Checks) == 0, m.Checks == nil)
		case 1:
			out = e.field(out, e.factors, nil, len(m.Factors) == 0, m.Factors == nil)
		}
	}
	e.buf = append(out, '}')
	return e.buf, nil
}

// field appends "name":value unless omitempty drops it.
func (e *memberEncoder) field(out []byte, t fieldTag, value []byte, empty, isNil bool) []byte {
	if empty && t.omitEmpty {
		return out
	}
	if len(out) > 1 {
		out = append(out, ',')
	}
	out = append(out, t.key...)
	if isNil {
		return append(out, "null"...)
	}
	return append(out, value...)
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
