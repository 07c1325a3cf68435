package main

import (
	"encoding/json"
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"sort"
)

// marksName is the file in OUTDIR that keeps the marks' names between
// runs: each mark's defining key (framing.MarkKeys: species, grade,
// spans, spacing, tributary width, zones, bearings, drawn blocking; not
// the size) and its name. The next run into the same folder reads it, so a
// mark keeps its name across runs and revisions of the plan, and --size
// never renames one.
const marksName = "marks.json"

// marksSchema is the version of marks.json's layout.
const marksSchema = 1

// marksFile is marks.json.
type marksFile struct {
	Schema int         `json:"schema"`
	About  string      `json:"about"`
	Marks  []markEntry `json:"marks"`
}

// markEntry is one mark's name and the key that defines it.
type markEntry struct {
	Mark string `json:"mark"`
	Key  string `json:"key"`
}

var markNameRE = regexp.MustCompile(`^J[1-9][0-9]*$`)

// readMarks reads OUTDIR's marks.json: nil and no error when there is
// none. A file that cannot be read, or holds a name twice or a name not
// of the form J12, is an error (the caller names the marks afresh and
// says so).
func readMarks(dir string) (map[string]string, error) {
	p := filepath.Join(dir, marksName)
	data, err := os.ReadFile(p)
	if errors.Is(err, fs.ErrNotExist) {
		return nil, nil
	}
	if err != nil {
		return nil, err
	}
	var f marksFile
	if err := json.Unmarshal(data, &f); err != nil {
		return nil, fmt.Errorf("%s: %v", p, err)
	}
	if f.Schema != marksSchema {
		return nil, fmt.Errorf("%s: schema %d, want %d", p, f.Schema, marksSchema)
	}
	out := make(map[string]string, len(f.Marks))
	names := map[string]bool{}
	for i, e := range f.Marks {
		switch {
		case !markNameRE.MatchString(e.Mark):
			return nil, fmt.Errorf("%s: marks[%d]: mark %q, want J and a number", p, i, e.Mark)
		case e.Key == "":
			return nil, fmt.Errorf("%s: marks[%d] (%s): no key", p, i, e.Mark)
		case names[e.Mark]:
			return nil, fmt.Errorf("%s: marks[%d]: mark %s named twice", p, i, e.Mark)
		}
		if _, dup := out[e.Key]; dup {
			return nil, fmt.Errorf("%s: marks[%d] (%s): key given twice", p, i, e.Mark)
		}
		names[e.Mark] = true
		out[e.Key] = e.Mark
	}
	return out, nil
}

// marksJSON writes the mapping key -> mark name as marks.json, in mark
// order.
func marksJSON(m map[string]string) ([]byte, error) {
	f := marksFile{Schema: marksSchema, About: "framecheck keeps each mark's name here (by the key that defines it) " +
		"and reuses it on the next run into this folder; delete this file to number the marks afresh"}
	for k, v := range m {
		f.Marks = append(f.Marks, markEntry{Mark: v, Key: k})
	}
	sort.Slice(f.Marks, func(i, j int) bool { return markLess(f.Marks[i].Mark, f.Marks[j].Mark) })
	data, err := json.MarshalIndent(f, "", "  ")
	if err != nil {
		return nil, err
	}
	return append(data, '\n'), nil
}
