package export

import (
	"bufio"
	"errors"
	"io"
	"strconv"
	"strings"
)

// The annotated copy is the input with a few edits (issue 18): the first
// pass (scanDXF) notes where they go, and the copy passes the unchanged
// byte ranges between them through as they are, without reading the
// drawing's pairs a second time. The edits are those the pair-by-pair copy
// made (annotate_ref_test.go keeps it, and the tests hold this copy to it
// byte for byte): our layer records before the LAYER table's ENDTAB, its
// entry count, $HANDSEED, our entities before the ENTITIES section's
// ENDSEC, and the sections a drawing lacks.

// editKind is what the copy does at an edit.
type editKind uint8

const (
	editHandSeed    editKind = iota // replace a $HANDSEED value (when the drawing uses handles)
	editHeaderEnd                   // before HEADER's ENDSEC: $HANDSEED, when not written yet
	editTablesEnd                   // before TABLES' ENDSEC: a LAYER table, when the drawing has none
	editLayerEndtab                 // before a LAYER table's ENDTAB: our layer records
	editLayerCount                  // replace the LAYER table's entry count
	editEntitiesEnd                 // before the first ENTITIES ENDSEC: our markup
	editTablesFirst                 // before the first BLOCKS or ENTITIES section: a TABLES section, when none
)

// dxfEdit is one edit: at byte Off (an insertion), or replacing the value
// line [Off, End) of the pair at Line whose value is Value.
type dxfEdit struct {
	Kind  editKind
	Off   int64
	End   int64
	Line  int
	Value string
}

// editPlan is planEdit's state across pairs.
type editPlan struct {
	headerVar      string
	layerCountDone bool
	emitted        bool
	tablesFirst    bool
	afterSection   bool // the previous pair was 0/SECTION
	sectionOff     int64
}

// planEdit notes the edit pair p calls for; ctx is the context before p.
func (f *dxfFacts) planEdit(p pair, ctx *dxfContext, pl *editPlan) {
	if pl.afterSection {
		// The copy takes this pair as the section's name.
		pl.afterSection = false
		if up := strings.ToUpper(p.Value); !pl.tablesFirst && (up == "BLOCKS" || up == "ENTITIES") {
			f.edits = append(f.edits, dxfEdit{Kind: editTablesFirst, Off: pl.sectionOff})
			pl.tablesFirst = true
		}
		return
	}
	if p.Code == 0 {
		switch strings.ToUpper(p.Value) {
		case "ENDSEC":
			switch ctx.Section {
			case "HEADER":
				f.edits = append(f.edits, dxfEdit{Kind: editHeaderEnd, Off: p.Off})
			case "TABLES":
				f.edits = append(f.edits, dxfEdit{Kind: editTablesEnd, Off: p.Off})
			case "ENTITIES":
				if !pl.emitted {
					f.edits = append(f.edits, dxfEdit{Kind: editEntitiesEnd, Off: p.Off})
					pl.emitted = true
				}
			}
		case "ENDTAB":
			if ctx.Table == "LAYER" {
				f.edits = append(f.edits, dxfEdit{Kind: editLayerEndtab, Off: p.Off})
			}
		case "SECTION":
			pl.afterSection, pl.sectionOff = true, p.Off
		}
		return
	}
	valOff := p.Off + int64(len(p.RawCode))
	valEnd := valOff + int64(len(p.RawValue))
	switch {
	case ctx.Section == "HEADER" && p.Code == 9:
		pl.headerVar = strings.ToUpper(p.Value)
	case ctx.Section == "HEADER" && pl.headerVar == "$HANDSEED" && p.Code == 5:
		f.edits = append(f.edits, dxfEdit{Kind: editHandSeed, Off: valOff, End: valEnd, Line: p.Line})
	case ctx.Table == "LAYER" && ctx.TableHead && p.Code == 70 && !pl.layerCountDone:
		f.edits = append(f.edits, dxfEdit{Kind: editLayerCount, Off: valOff, End: valEnd, Line: p.Line, Value: p.Value})
		pl.layerCountDone = true
	}
}

// copyEdited writes the annotated copy of the drawing read from in (at its
// start) to w: the input's bytes between the edits facts noted, and what
// each edit writes.
func copyEdited(in io.Reader, name string, w *bufio.Writer, facts *dxfFacts, m *Markup) error {
	a := newAnnotator(w, facts, m)
	var pos int64
	upTo := func(off int64) error {
		if off > pos {
			n, err := io.CopyN(w, in, off-pos)
			pos += n
			if err != nil {
				return &DXFError{File: name, Err: err}
			}
		}
		return nil
	}
	skipTo := func(off int64) error {
		if off > pos {
			n, err := io.CopyN(io.Discard, in, off-pos)
			pos += n
			if err != nil {
				return &DXFError{File: name, Err: err}
			}
		}
		return nil
	}
	seeded, emitted, tablesAdded := false, false, false
	for _, e := range facts.edits {
		if err := upTo(e.Off); err != nil {
			return err
		}
		switch e.Kind {
		case editHandSeed:
			if !a.em.handles {
				continue
			}
			if err := skipTo(e.End); err != nil {
				return err
			}
			w.WriteString(strconv.FormatUint(a.newSeed, 16) + facts.EOL)
			seeded = true
		case editHeaderEnd:
			if a.em.handles && !seeded {
				a.em.pair(9, "$HANDSEED")
				a.em.pair(5, strconv.FormatUint(a.newSeed, 16))
			}
		case editTablesEnd:
			if !facts.HasLayerTab {
				a.layerTable()
			}
		case editLayerEndtab:
			a.layers()
		case editLayerCount:
			n, err := strconv.Atoi(e.Value)
			if err != nil {
				return &DXFError{File: name, Line: e.Line, Err: errors.New("LAYER table count " + strconv.Quote(e.Value) + ": want an integer")}
			}
			if err := skipTo(e.End); err != nil {
				return err
			}
			w.WriteString(strconv.Itoa(n+len(a.newLayers)) + facts.EOL)
		case editEntitiesEnd:
			a.em.markup(m, a.colours)
			emitted = true
		case editTablesFirst:
			if !facts.HasTables {
				a.tablesSection()
				tablesAdded = true
			}
		}
	}
	if err := upTo(facts.EOFOff); err != nil {
		return err
	}
	if !facts.HasTables && !tablesAdded {
		a.tablesSection()
	}
	if facts.HasEntities && !emitted {
		return &DXFError{File: name, Line: facts.EOFLine, Err: errors.New("EOF inside the ENTITIES section (no ENDSEC)")}
	}
	if !facts.HasEntities {
		a.em.pair(0, "SECTION")
		a.em.pair(2, "ENTITIES")
		a.em.markup(m, a.colours)
		a.em.pair(0, "ENDSEC")
	}
	// The EOF pair and whatever follows it, as they are.
	if _, err := io.Copy(w, in); err != nil {
		return &DXFError{File: name, Err: err}
	}
	return nil
}
