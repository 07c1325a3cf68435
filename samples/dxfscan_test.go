package samples

import (
	"bufio"
	"bytes"
	"fmt"
	"strconv"
	"strings"
)

// scan is what the tests read from plan.dxf's group codes themselves,
// without dxfimport, to compare with ezdxf's reading of the same file.
type scan struct {
	acadVer    string
	insUnits   int
	handSeed   uint64
	extMin     [2]float64
	extMax     [2]float64
	handles    []uint64                  // every 5 and 105 outside the header
	tableLayer []string                  // names in the LAYER table
	counts     map[string]map[string]int // layer -> entity type -> count, ENTITIES section
	points     [][2]float64              // every 10/20 and 11/21 point of the ENTITIES section
	texts      map[string][]string       // layer -> TEXT values
}

type tag struct {
	code  int
	value string
	line  int
}

// readTags splits an ASCII DXF into (code, value) pairs.
func readTags(data []byte) ([]tag, error) {
	var tags []tag
	sc := bufio.NewScanner(bytes.NewReader(data))
	n := 0
	for sc.Scan() {
		n++
		codeLine := strings.TrimSpace(sc.Text())
		if !sc.Scan() {
			return nil, fmt.Errorf("line %d: group code %q without a value", n, codeLine)
		}
		n++
		code, err := strconv.Atoi(codeLine)
		if err != nil {
			return nil, fmt.Errorf("line %d: bad group code %q", n-1, codeLine)
		}
		tags = append(tags, tag{code, strings.TrimRight(sc.Text(), "\r"), n - 1})
	}
	return tags, sc.Err()
}

// scanDXF reads the facts the tests need. It expects the layout our
// writer produces: one entity per "0" tag, x in 10/11 followed by y in
// 20/21.
func scanDXF(data []byte) (*scan, error) {
	tags, err := readTags(data)
	if err != nil {
		return nil, err
	}
	s := &scan{counts: map[string]map[string]int{}, texts: map[string][]string{}}
	var section, header, kind, layer, text, table string
	var x, y [2]float64
	var hasPt [2]bool
	flush := func() {
		if section != "ENTITIES" || kind == "" {
			return
		}
		if s.counts[layer] == nil {
			s.counts[layer] = map[string]int{}
		}
		s.counts[layer][kind]++
		if kind == "TEXT" {
			s.texts[layer] = append(s.texts[layer], text)
		}
	}
	for i, t := range tags {
		switch {
		case t.code == 0:
			flush()
			kind, layer, text = "", "", ""
			if t.value == "SECTION" && i+1 < len(tags) {
				section = tags[i+1].value
				continue
			}
			if t.value == "TABLE" && i+1 < len(tags) {
				table = tags[i+1].value
			}
			if section == "ENTITIES" && t.value != "ENDSEC" {
				kind = t.value
			}
		case section == "HEADER" && t.code == 9:
			header = t.value
		case section == "HEADER":
			if err := s.headerValue(header, t); err != nil {
				return nil, fmt.Errorf("line %d: %s: %v", t.line, header, err)
			}
		case t.code == 5 || t.code == 105:
			h, err := strconv.ParseUint(t.value, 16, 64)
			if err != nil {
				return nil, fmt.Errorf("line %d: bad handle %q", t.line, t.value)
			}
			s.handles = append(s.handles, h)
		case section == "TABLES" && table == "LAYER" && t.code == 2 && tags[i-1].code != 0:
			s.tableLayer = append(s.tableLayer, t.value)
		case section == "ENTITIES" && t.code == 8:
			layer = t.value
		case section == "ENTITIES" && t.code == 1:
			text = t.value
		case section == "ENTITIES" && (t.code == 10 || t.code == 11 || t.code == 20 || t.code == 21):
			v, err := strconv.ParseFloat(t.value, 64)
			if err != nil {
				return nil, fmt.Errorf("line %d: bad number %q", t.line, t.value)
			}
			k := t.code % 10
			if t.code < 20 {
				x[k], hasPt[k] = v, true
			} else if hasPt[k] {
				y[k] = v
				s.points = append(s.points, [2]float64{x[k], y[k]})
				hasPt[k] = false
			}
		}
	}
	return s, nil
}

func (s *scan) headerValue(name string, t tag) error {
	var err error
	switch name {
	case "$ACADVER":
		s.acadVer = t.value
	case "$INSUNITS":
		s.insUnits, err = strconv.Atoi(t.value)
	case "$HANDSEED":
		s.handSeed, err = strconv.ParseUint(t.value, 16, 64)
	case "$EXTMIN", "$EXTMAX":
		p := &s.extMin
		if name == "$EXTMAX" {
			p = &s.extMax
		}
		if t.code == 10 || t.code == 20 {
			p[t.code/10-1], err = strconv.ParseFloat(t.value, 64)
		}
	}
	return err
}
