package project

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"sort"
	"strings"

	"github.com/BurntSushi/toml"
)

// LoadProject reads and checks a project file. Problems in the file come
// back as ProjectErrors, each naming the file, line and key.
func LoadProject(path string) (*Project, error) {
	data, err := readLimited(path, maxProjectBytes)
	if errors.Is(err, fs.ErrNotExist) {
		return nil, fmt.Errorf("project file %s not found; 'framecheck init -o %s' writes a starter one to edit: %w", path, path, err)
	}
	if errors.Is(err, errTooLarge) {
		return nil, fmt.Errorf("project file %s: %w (the limit is %d MiB; a project file is a few kilobytes of text)", path, err, maxProjectBytes>>20)
	}
	if err != nil {
		return nil, err
	}
	p, err := ParseProject(path, data)
	if err == nil {
		p.sha256, p.size = sha256Hex(data), int64(len(data))
	}
	return p, err
}

// maxProjectBytes bounds the project file and the materials file it
// names: a real one is a few kilobytes (common practice, no source);
// /dev/zero or a drawing given by mistake is refused at once, not read
// until memory runs out.
const maxProjectBytes = 4 << 20

// errTooLarge is the error of readLimited for a file past its limit.
var errTooLarge = errors.New("larger than the limit")

// readLimited reads the whole of a regular file of at most limit bytes.
// It reads at most limit+1 bytes from anything else (a device, a pipe).
func readLimited(path string, limit int64) ([]byte, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	if st, err := f.Stat(); err == nil && st.Mode().IsRegular() && st.Size() > limit {
		return nil, fmt.Errorf("%w: %d bytes", errTooLarge, st.Size())
	} else if err == nil && st.IsDir() {
		return nil, fmt.Errorf("%s is a folder, not a file", path)
	}
	data, err := io.ReadAll(io.LimitReader(f, limit+1))
	if err != nil {
		return nil, err
	}
	if int64(len(data)) > limit {
		return nil, fmt.Errorf("%w: more than %d bytes", errTooLarge, limit)
	}
	return data, nil
}

// ParseProject checks project-file text; name is used in messages. Every
// problem found is reported, sorted by line, as ProjectErrors: TOML syntax
// (first error only), unknown keys with the closest valid one, wrong types
// and values out of range with what is allowed.
func ParseProject(name string, data []byte) (*Project, error) {
	var raw map[string]any
	if _, err := toml.Decode(string(data), &raw); err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, ProjectErrors{{File: name, Line: syntaxLine(data, pe), Msg: "TOML syntax: " + pe.Message}}
		}
		return nil, ProjectErrors{{File: name, Msg: err.Error()}}
	}
	p := &Project{File: name, given: map[string]bool{}}
	ld := &loader{file: name, lines: keyLines(string(data)), p: p}
	ld.project(ld.table(raw, "", "the top level", ""))
	for _, t := range ld.tables {
		ld.unknownKeys(t)
	}
	if len(ld.errs) > 0 {
		ld.errs.sort()
		return nil, ld.errs
	}
	return p, nil
}

// syntaxLine is the 1-based line of a TOML syntax error, counted from its
// byte offset: BurntSushi/toml v1.6.0 reports an error found at the
// newline that ends a line (an unclosed "[design") on the next line.
func syntaxLine(data []byte, pe toml.ParseError) int {
	if s := pe.Position.Start; s >= 0 && s <= len(data) {
		return 1 + bytes.Count(data[:s], []byte("\n"))
	}
	return pe.Position.Line
}

// loader walks the decoded TOML, filling a Project and gathering problems.
type loader struct {
	file   string
	lines  map[string]int
	p      *Project
	errs   ProjectErrors
	tables []*table
}

// table is one TOML table being read.
type table struct {
	m     map[string]any
	path  string // internal path: "", "drawing", "zone[1]"
	show  string // as the user knows it: "[drawing]", "[[zone]]"
	label string // prefix in the defaults list: "drawing.", "[[zone]] ROOF: "
	known []knownKey
}

func (ld *loader) table(m map[string]any, path, show, label string) *table {
	t := &table{m: m, path: path, show: show, label: label}
	ld.tables = append(ld.tables, t)
	return t
}

// errorf reports a problem at the key of an internal path, once.
func (ld *loader) errorf(path, format string, args ...any) {
	e := &ProjectError{File: ld.file, Line: lineOf(ld.lines, path), Key: displayKey(path), Msg: fmt.Sprintf(format, args...)}
	for _, x := range ld.errs {
		if *x == *e {
			return
		}
	}
	ld.errs = append(ld.errs, e)
}

func (ld *loader) defaulted(t *table, key, format string, args ...any) {
	ld.p.defaults = append(ld.p.defaults, t.label+key+" = "+fmt.Sprintf(format, args...))
}

// get returns the value of key in t, marking the key valid and, when
// present, given.
func (ld *loader) get(t *table, key, show string) (any, string, bool) {
	if show == "" {
		show = key
	}
	t.known = append(t.known, knownKey{key, show})
	path := joinPath(t.path, key)
	v, ok := t.m[key]
	if ok {
		ld.p.given[path] = true
	}
	return v, path, ok
}

// num reads a number (integer or float) checked by rule; unit goes into
// messages. A key in inches ("in", its name ending in _in) also takes a
// length as the trade writes it, as a string: "3 1/2\"", "1'-0\"", "89mm";
// a bare number there is inches, as the key's name says.
func (ld *loader) num(t *table, key, unit string, dst *float64, rule func(float64) string) {
	v, path, ok := ld.get(t, key, "")
	if !ok {
		ld.defaulted(t, key, "%s", FmtNum(*dst))
		return
	}
	var x float64
	switch n := v.(type) {
	case int64:
		x = float64(n)
	case float64:
		x = n
	case string:
		if unit != "in" {
			ld.errorf(path, "expected a number (%s, %s), got %s", unit, rule(-1), describe(v))
			return
		}
		l, err := ParseLengthIn(n)
		if err != nil {
			ld.errorf(path, "expected a number of inches or a length with its unit (%s): %v", rule(-1), err)
			return
		}
		x = l
	default:
		ld.errorf(path, "expected a number (%s, %s), got %s", unit, rule(-1), describe(v))
		return
	}
	if msg := rule(x); msg != "" {
		ld.errorf(path, "%s (%s), got %s", msg, unit, FmtNum(x))
		return
	}
	*dst = x
}

// enum reads a string that must be one of allowed (case-insensitive).
func (ld *loader) enum(t *table, key string, dst *string, allowed []string) {
	v, path, ok := ld.get(t, key, "")
	if !ok {
		ld.defaulted(t, key, "%q", *dst)
		return
	}
	s, isStr := v.(string)
	for _, a := range allowed {
		if isStr && strings.EqualFold(s, a) {
			*dst = a
			return
		}
	}
	ld.errorf(path, "expected one of %s, got %s", strings.Join(quoteAll(allowed), " | "), describe(v))
}

// A canonizer returns the canonical form of a string value, or "" and the
// rule the value breaks.
type canonizer func(string) (canon, rule string)

// text reads a non-empty string, put in canonical form by canon when it
// is not nil.
func (ld *loader) text(t *table, key string, dst *string, canon canonizer) {
	v, path, ok := ld.get(t, key, "")
	if !ok {
		if *dst != "" {
			ld.defaulted(t, key, "%q", *dst)
		}
		return
	}
	s, isStr := v.(string)
	s = strings.TrimSpace(s)
	switch {
	case !isStr:
		ld.errorf(path, "expected a string, got %s", describe(v))
	case s == "":
		ld.errorf(path, "must not be empty")
	case canon != nil:
		if c, rule := canon(s); rule != "" {
			ld.errorf(path, "expected %s, got %q", rule, s)
		} else {
			*dst = c
		}
	default:
		*dst = s
	}
}

func (ld *loader) boolean(t *table, key string, dst *bool) {
	v, path, ok := ld.get(t, key, "")
	if !ok {
		ld.defaulted(t, key, "%t", *dst)
		return
	}
	b, isBool := v.(bool)
	if !isBool {
		ld.errorf(path, "expected true or false, got %s", describe(v))
		return
	}
	*dst = b
}

// list reads a non-empty array of non-empty strings; canon as for text.
func (ld *loader) list(t *table, key string, dst *[]string, canon canonizer) {
	v, path, ok := ld.get(t, key, "")
	if !ok {
		if *dst != nil {
			ld.defaulted(t, key, "%s", FmtList(*dst))
		}
		return
	}
	out, msg := stringList(v, canon)
	if msg != "" {
		ld.errorf(path, "%s", msg)
		return
	}
	*dst = out
}

func stringList(v any, canon canonizer) ([]string, string) {
	a, ok := v.([]any)
	if !ok {
		return nil, fmt.Sprintf("expected an array of strings such as [\"A*\", \"B*\"], got %s", describe(v))
	}
	if len(a) == 0 {
		return nil, "must list at least one entry"
	}
	out := make([]string, 0, len(a))
	for i, e := range a {
		s, isStr := e.(string)
		s = strings.TrimSpace(s)
		switch {
		case !isStr:
			return nil, fmt.Sprintf("entry %d: expected a string, got %s", i+1, describe(e))
		case s == "":
			return nil, fmt.Sprintf("entry %d is empty", i+1)
		case canon != nil:
			c, rule := canon(s)
			if rule != "" {
				return nil, fmt.Sprintf("entry %d: expected %s, got %q", i+1, rule, s)
			}
			s = c
		}
		out = append(out, s)
	}
	return out, ""
}

// sub returns the table under key, or an empty one when it is absent.
func (ld *loader) sub(t *table, key string) *table {
	show := "[" + joinPath(displayKey(t.path), key) + "]"
	v, path, ok := ld.get(t, key, show)
	m, isMap := v.(map[string]any)
	if ok && !isMap {
		ld.errorf(path, "expected a table %s, got %s", show, describe(v))
	}
	if m == nil {
		m = map[string]any{}
	}
	return ld.table(m, path, show, displayKey(path)+".")
}

// arrayTables returns the elements of the array of tables under key; ok is
// false when the key is absent.
func (ld *loader) arrayTables(t *table, key string) (elems []*table, ok bool) {
	show := "[[" + joinPath(displayKey(t.path), key) + "]]"
	v, path, ok := ld.get(t, key, show)
	if !ok {
		return nil, false
	}
	var maps []map[string]any
	switch a := v.(type) {
	case []map[string]any:
		maps = a
	case []any:
		for _, e := range a {
			m, isMap := e.(map[string]any)
			if !isMap {
				maps = nil
				break
			}
			maps = append(maps, m)
		}
	}
	if maps == nil {
		ld.errorf(path, "expected one or more %s tables, got %s", show, describe(v))
		return nil, true
	}
	for i, m := range maps {
		p := fmt.Sprintf("%s[%d]", path, i)
		elems = append(elems, ld.table(m, p, show, fmt.Sprintf("%s %d: ", show, i+1)))
	}
	return elems, true
}

// unknownKeys reports every key of t that no getter asked for.
func (ld *loader) unknownKeys(t *table) {
	keys := make([]string, 0, len(t.m))
	for k := range t.m {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		valid := false
		for _, kk := range t.known {
			valid = valid || kk.name == k
		}
		if !valid {
			path := joinPath(t.path, k)
			ld.errorf(path, "unknown key in %s; %s", t.show, suggest(k, t.known, t.show))
		}
	}
}

func quoteAll(l []string) []string {
	out := make([]string, len(l))
	for i, s := range l {
		out[i] = fmt.Sprintf("%q", s)
	}
	return out
}

// sha256Hex is the SHA-256 of data in hexadecimal.
func sha256Hex(data []byte) string {
	h := sha256.Sum256(data)
	return hex.EncodeToString(h[:])
}
