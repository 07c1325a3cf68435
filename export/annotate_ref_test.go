package export

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"
)

// copyAnnotated is the copy as it was written before issue 18: the second
// pass re-reads every pair of the drawing and writes it back. Kept here as
// the reference the range copy (copyEdited) is held to, byte for byte.
func copyAnnotated(pr *pairReader, w *bufio.Writer, facts *dxfFacts, m *Markup) error {
	a := newAnnotator(w, facts, m)
	var ctx dxfContext
	var headerVar string
	seededHeader, layerCountDone, emitted := false, false, false
	raw := func(p pair) {
		w.WriteString(p.RawCode)
		w.WriteString(p.RawValue)
	}
	for {
		p, err := pr.next()
		if err != nil {
			if err == io.EOF {
				return &DXFError{File: pr.file, Line: pr.line, Err: ErrNoEOF}
			}
			return err
		}
		// Decisions that come before the pair is written.
		if p.Code == 0 {
			switch strings.ToUpper(p.Value) {
			case "ENDSEC":
				switch ctx.Section {
				case "HEADER":
					if a.em.handles && !seededHeader {
						a.em.pair(9, "$HANDSEED")
						a.em.pair(5, strconv.FormatUint(a.newSeed, 16))
					}
				case "TABLES":
					if !facts.HasLayerTab {
						a.layerTable()
					}
				case "ENTITIES":
					if !emitted {
						a.em.markup(m, a.colours)
						emitted = true
					}
				}
			case "ENDTAB":
				if ctx.Table == "LAYER" {
					a.layers()
				}
			case "SECTION":
				// Look ahead at the section name: a drawing without TABLES
				// gets one before its BLOCKS or ENTITIES section.
				name, err := pr.next()
				if err != nil {
					if err == io.EOF {
						return &DXFError{File: pr.file, Line: pr.line, Err: ErrNoEOF}
					}
					return err
				}
				up := strings.ToUpper(name.Value)
				if !facts.HasTables && (up == "BLOCKS" || up == "ENTITIES") {
					a.tablesSection()
					facts.HasTables, facts.HasLayerTab = true, true
				}
				raw(p)
				raw(name)
				ctx.step(p)
				ctx.step(name)
				continue
			case "EOF":
				if !facts.HasTables {
					a.tablesSection()
				}
				if facts.HasEntities && !emitted {
					return &DXFError{File: pr.file, Line: p.Line, Err: errors.New("EOF inside the ENTITIES section (no ENDSEC)")}
				}
				if !facts.HasEntities {
					a.em.pair(0, "SECTION")
					a.em.pair(2, "ENTITIES")
					a.em.markup(m, a.colours)
					a.em.pair(0, "ENDSEC")
				}
				raw(p)
				// Whatever follows EOF is copied as it is.
				_, err := io.Copy(w, pr.r)
				return err
			}
		}
		// Values that change.
		switch {
		case ctx.Section == "HEADER" && p.Code == 9:
			headerVar = strings.ToUpper(p.Value)
		case ctx.Section == "HEADER" && headerVar == "$HANDSEED" && p.Code == 5 && a.em.handles:
			w.WriteString(p.RawCode)
			w.WriteString(strconv.FormatUint(a.newSeed, 16) + facts.EOL)
			seededHeader = true
			ctx.step(p)
			continue
		case ctx.Table == "LAYER" && ctx.TableHead && p.Code == 70 && !layerCountDone:
			n, err := strconv.Atoi(p.Value)
			if err != nil {
				return &DXFError{File: pr.file, Line: p.Line, Err: fmt.Errorf("LAYER table count %q: want an integer", p.Value)}
			}
			w.WriteString(p.RawCode)
			w.WriteString(strconv.Itoa(n+len(a.newLayers)) + facts.EOL)
			layerCountDone = true
			ctx.step(p)
			continue
		}
		raw(p)
		ctx.step(p)
	}
}
