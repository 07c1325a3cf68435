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
	var fields []string
	v, changed := sanitizeValue(reflect.ValueOf(*r), "", &fields)
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
		m.Messages = append(slices.Clip(m.Messages), "non-finite value written as 0: "+f)
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

// sanitizeValue returns v, or a copy of v with non-finite floats set to 0
// (copying only the structs and slices on the way to such a value), and
// whether it changed anything. Fields tagged json:"-" are left alone: they
// never reach the file.
func sanitizeValue(v reflect.Value, path string, fields *[]string) (reflect.Value, bool) {
	switch v.Kind() {
	case reflect.Float32, reflect.Float64:
		f := v.Float()
		if math.IsNaN(f) || math.IsInf(f, 0) {
			*fields = append(*fields, fmt.Sprintf("%s = %v", path, f))
			return reflect.Zero(v.Type()), true
		}
	case reflect.Struct:
		var cp reflect.Value
		t := v.Type()
		for i := 0; i < t.NumField(); i++ {
			sf := t.Field(i)
			name := jsonName(sf)
			if !sf.IsExported() || name == "-" {
				continue
			}
			p := name
			if path != "" {
				p = path + "." + name
			}
			nv, changed := sanitizeValue(v.Field(i), p, fields)
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
		var cp reflect.Value
		for i := 0; i < v.Len(); i++ {
			nv, changed := sanitizeValue(v.Index(i), fmt.Sprintf("%s[%d]", path, i), fields)
			if !changed {
				continue
			}
			if !cp.IsValid() {
				if v.Kind() == reflect.Slice {
					cp = reflect.MakeSlice(v.Type(), v.Len(), v.Len())
					reflect.Copy(cp, v)
				} else {
					cp = reflect.New(v.Type()).Elem()
					cp.Set(v)
				}
			}
			cp.Index(i).Set(nv)
		}
		if cp.IsValid() {
			return cp, true
		}
	}
	return v, false
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

// WriteJSON writes r as results.json to path, atomically. Schema is filled
// in when empty. Lists are written as [] rather than null. NaN and ±Inf never
// reach the file: they are written as 0 and reported, after a successful
// write, as a *NonFiniteError (see Sanitize). A path ending in .dxf is
// refused so that a results file can never replace a drawing.
func WriteJSON(path string, r *Results) error {
	if err := refuseDrawing(path); err != nil {
		return err
	}
	clean, fields := Sanitize(r)
	if clean.Schema == "" {
		cp := *clean
		cp.Schema = Schema
		clean = &cp
	}
	err := writeAtomic(path, func(w *bufio.Writer) error {
		enc := json.NewEncoder(w)
		enc.SetIndent("", " ")
		return enc.Encode(clean)
	})
	if err != nil {
		return err
	}
	if len(fields) > 0 {
		return &NonFiniteError{Path: path, Fields: fields}
	}
	return nil
}

// orEmpty returns s, or an empty non-nil slice when s is nil, so that the
// JSON shows [] rather than null.
func orEmpty[T any](s []T) []T {
	if s == nil {
		return []T{}
	}
	return s
}

// MarshalJSON writes r with empty lists as [].
func (r Results) MarshalJSON() ([]byte, error) {
	type plain Results
	p := plain(r)
	p.Members = orEmpty(p.Members)
	p.Marks = orEmpty(p.Marks)
	p.BlockingRows = orEmpty(p.BlockingRows)
	return json.Marshal(p)
}

// MarshalJSON writes m with empty lists as [].
func (m Member) MarshalJSON() ([]byte, error) {
	type plain Member
	p := plain(m)
	p.BearingsAtIn = orEmpty(p.BearingsAtIn)
	p.SpansIn = orEmpty(p.SpansIn)
	p.Checks = orEmpty(p.Checks)
	p.BlockingRowsPerSpan = orEmpty(p.BlockingRowsPerSpan)
	p.BlockingAtIn = orEmpty(p.BlockingAtIn)
	p.Messages = orEmpty(p.Messages)
	return json.Marshal(p)
}

// MarshalJSON writes c with an empty trace as [].
func (c Check) MarshalJSON() ([]byte, error) {
	type plain Check
	p := plain(c)
	p.Trace = orEmpty(p.Trace)
	return json.Marshal(p)
}

// MarshalJSON writes m with empty lists as [].
func (m Mark) MarshalJSON() ([]byte, error) {
	type plain Mark
	p := plain(m)
	p.SpansIn = orEmpty(p.SpansIn)
	p.BlockingRowsPerSpan = orEmpty(p.BlockingRowsPerSpan)
	return json.Marshal(p)
}

// MarshalJSON writes b with empty lists as [].
func (b BlockingRow) MarshalJSON() ([]byte, error) {
	type plain BlockingRow
	p := plain(b)
	p.ClearIn = orEmpty(p.ClearIn)
	p.Members = orEmpty(p.Members)
	return json.Marshal(p)
}

// MarshalJSON writes t with empty lists as [].
func (t Takeoff) MarshalJSON() ([]byte, error) {
	type plain Takeoff
	p := plain(t)
	p.Joists = orEmpty(p.Joists)
	p.Blocking = orEmpty(p.Blocking)
	p.Hangers = orEmpty(p.Hangers)
	return json.Marshal(p)
}

// MarshalJSON writes a with empty lists as [].
func (a Assumptions) MarshalJSON() ([]byte, error) {
	type plain Assumptions
	p := plain(a)
	p.CodeEditions = orEmpty(p.CodeEditions)
	p.Combinations = orEmpty(p.Combinations)
	p.Switches = orEmpty(p.Switches)
	p.Zones = orEmpty(p.Zones)
	p.DesignValues = orEmpty(p.DesignValues)
	p.Notes = orEmpty(p.Notes)
	return json.Marshal(p)
}
