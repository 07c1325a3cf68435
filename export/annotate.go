package export

import (
	"bufio"
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"fmt"
	"hash"
	"io"
	"math"
	"os"
	"slices"
	"strconv"
	"strings"
	"sync/atomic"
)

// dxfFacts is what the first pass over a drawing learns.
type dxfFacts struct {
	Version      string // $ACADVER, "" when absent
	HandSeed     string // $HANDSEED as read, "" when absent
	MaxHandle    uint64 // largest entity/record handle (group 5 or 105)
	HasHeader    bool
	HasTables    bool
	HasLayerTab  bool
	HasEntities  bool
	HasEOF       bool
	Layers       map[string]bool // upper-case layer names in the LAYER table
	LayerColours []int           // group 62 of each layer not ours (negative: switched off)
	// Lo and Hi bound the entities' points (groups 10-13, 20-23 in
	// ENTITIES), drawing units; HasExtent says any was seen.
	Lo, Hi       [2]float64
	HasExtent    bool
	LayerTable   string // handle of the LAYER table head
	Layer0LType  string // linetype of layer "0"
	Layer0Plot   string // group 390 of layer "0" (R2000+)
	ModelSpace   string // handle of the *Model_Space block record
	EOL          string // line ending of the first line
	FirstSection string // name of the section that follows HEADER/CLASSES
	// edits are the places where the copy differs from the input, in
	// input order (annotate_copy.go); EOFOff and EOFLine are where the
	// EOF pair starts.
	edits   []dxfEdit
	EOFOff  int64
	EOFLine int
}

// modern reports R13 or later: subclass markers and owner handles.
func (f *dxfFacts) modern() bool { return f.Version > "AC1009" }

// handles reports whether new records and entities need handles.
func (f *dxfFacts) handles() bool { return f.modern() || f.HandSeed != "" }

// scanDXF reads the drawing once and gathers dxfFacts; path names it in errors.
func scanDXF(in io.Reader, path string) (*dxfFacts, error) {
	return scanPairs(newPairReader(in, path))
}

// scanDXFBytes is scanDXF of a drawing in memory, read without a copy.
func scanDXFBytes(data []byte, path string) (*dxfFacts, error) {
	return scanPairs(newBytesPairReader(data, path))
}

// scanPairs finds the facts of the drawing pr reads.
func scanPairs(pr *pairReader) (*dxfFacts, error) {
	path := pr.file
	facts := &dxfFacts{Layers: map[string]bool{}, EOL: "\n"}
	var ctx dxfContext
	var plan editPlan
	var headerVar, recHandle, recName string
	first := true
	for {
		p, err := pr.next()
		if err == io.EOF {
			break
		}
		if err != nil {
			return nil, err
		}
		if first {
			if strings.HasSuffix(p.RawCode, "\r\n") {
				facts.EOL = "\r\n"
			}
			first = false
		}
		wasSect := ctx.wantSect
		afterSection := plan.afterSection
		facts.planEdit(p, &ctx, &plan)
		ctx.step(p)
		if wasSect && !ctx.wantSect {
			switch ctx.Section {
			case "HEADER":
				facts.HasHeader = true
			case "TABLES":
				facts.HasTables = true
			case "ENTITIES":
				facts.HasEntities = true
			}
		}
		if p.Code == 0 && strings.EqualFold(p.Value, "EOF") {
			facts.HasEOF = true
			facts.EOFOff, facts.EOFLine = p.Off, p.Line
			if afterSection {
				// The copy takes the pair after SECTION as its name, so
				// this EOF does not end the drawing for it.
				return nil, &DXFError{File: path, Line: p.Line, Err: errors.New("EOF right after SECTION (no section name)")}
			}
			break
		}
		if p.Code == 0 {
			recHandle, recName = "", ""
		}
		switch {
		case ctx.Section == "HEADER" && p.Code == 9:
			headerVar = strings.ToUpper(p.Value)
			continue
		case ctx.Section == "HEADER":
			switch headerVar {
			case "$ACADVER":
				facts.Version = strings.ToUpper(p.Value)
			case "$HANDSEED":
				facts.HandSeed = p.Value
			}
			continue
		}
		// Group 5 is a handle everywhere except in an R12 DIMSTYLE record,
		// where it names the arrow block (DIMBLK) and 105 is the handle.
		isHandle := p.Code == 105 || (p.Code == 5 && !(ctx.Table == "DIMSTYLE" && ctx.Record == "DIMSTYLE"))
		if isHandle {
			h, err := strconv.ParseUint(p.Value, 16, 64)
			if err != nil {
				return nil, &DXFError{File: path, Line: p.Line, Err: fmt.Errorf("code %d: handle %q is not hexadecimal", p.Code, p.Value)}
			}
			facts.MaxHandle = max(facts.MaxHandle, h)
			recHandle = p.Value
		}
		if ctx.Section == "ENTITIES" && p.Code >= 10 && p.Code <= 23 && p.Code%10 <= 3 {
			facts.extend(p)
		}
		if ctx.Section != "TABLES" {
			continue
		}
		if ctx.Table == "LAYER" {
			facts.HasLayerTab = true
			if ctx.TableHead && p.Code == 5 {
				facts.LayerTable = p.Value
			}
			if ctx.Record == "LAYER" {
				switch p.Code {
				case 2:
					recName = p.Value
					facts.Layers[strings.ToUpper(p.Value)] = true
				case 62:
					if c, err := strconv.Atoi(strings.TrimSpace(p.Value)); err == nil && !isOurLayer(recName) {
						facts.LayerColours = append(facts.LayerColours, c)
					}
				case 6:
					if recName == "0" {
						facts.Layer0LType = p.Value
					}
				case 390:
					if recName == "0" {
						facts.Layer0Plot = p.Value
					}
				}
			}
		}
		if ctx.Table == "BLOCK_RECORD" && ctx.Record == "BLOCK_RECORD" && p.Code == 2 &&
			strings.EqualFold(p.Value, "*Model_Space") {
			facts.ModelSpace = recHandle
		}
	}
	if !facts.HasEOF {
		return nil, &DXFError{File: path, Line: pr.line, Err: ErrNoEOF}
	}
	if facts.modern() && !facts.HasTables {
		return nil, &DXFError{File: path, Err: errors.New("R13+ drawing without a TABLES section: cannot add layers")}
	}
	return facts, nil
}

// extend widens the entities' extent by a coordinate pair's value: groups
// 10-13 are x, 20-23 y (an x comes before its y).
func (f *dxfFacts) extend(p pair) {
	v, err := strconv.ParseFloat(strings.TrimSpace(p.Value), 64)
	if err != nil || !finite(v) {
		return
	}
	i := 0
	if p.Code >= 20 {
		i = 1
	}
	if !f.HasExtent {
		f.Lo, f.Hi = [2]float64{math.Inf(1), math.Inf(1)}, [2]float64{math.Inf(-1), math.Inf(-1)}
		f.HasExtent = true
	}
	f.Lo[i] = math.Min(f.Lo[i], v)
	f.Hi[i] = math.Max(f.Hi[i], v)
}

// Annotate copies the drawing inputPath to outputPath and adds the markup m
// on layers of our own (LayerFail, LayerBlocking, LayerLabel). The copy is
// made pair by pair: every original line is written back byte for byte
// except the two values that must change, $HANDSEED and the LAYER table's
// entry count (group 70). Our layer records go at the end of the
// LAYER table (a TABLES section or LAYER table is created in an R12 file that
// has none); our entities go at the end of ENTITIES (created before EOF when
// absent). Drawings that use handles (R13+, or R12 with $HANDSEED) get
// new handles above both $HANDSEED and every handle in the file, and
// $HANDSEED is moved past them. The output is written atomically; outputPath
// naming the input file is refused with ErrSameFile, and a binary or
// truncated input with a *DXFError.
func Annotate(inputPath, outputPath string, m Markup) error {
	if sameFile(inputPath, outputPath) {
		return fmt.Errorf("export: %s: %w", outputPath, ErrSameFile)
	}
	if err := m.validate(); err != nil {
		return fmt.Errorf("export: %s: %w", outputPath, err)
	}
	in, err := os.Open(inputPath)
	if err != nil {
		return fmt.Errorf("export: %w", err)
	}
	defer in.Close()
	return annotate(in, inputPath, outputPath, m)
}

// AnnotateBytes is Annotate for a drawing already in memory: input holds
// its bytes and name its path (for messages, and refused as outputPath).
// The run that checked those bytes annotates the very same ones, whatever
// became of the file meanwhile.
func AnnotateBytes(input []byte, name, outputPath string, m Markup) error {
	if sameFile(name, outputPath) {
		return fmt.Errorf("export: %s: %w", outputPath, ErrSameFile)
	}
	if err := m.validate(); err != nil {
		return fmt.Errorf("export: %s: %w", outputPath, err)
	}
	return annotate(bytes.NewReader(input), name, outputPath, m)
}

// DrawingScan is what the annotated copy must know of a drawing before
// copying it (its version, layers, handles, sections and line ends),
// found in one pass over its bytes by ScanDrawing, so that a run can find
// it while it still checks the plan (the pass is a tenth of a second at
// 100,000 joists, a core otherwise idle while the drawing is read).
type DrawingScan struct {
	done  chan struct{}
	input []byte
	facts *dxfFacts
	err   error
	used  atomic.Bool // the copy changes the facts: they serve once
}

// ScanDrawing starts the scan of input (the drawing's bytes, name its
// path for messages) and returns at once; AnnotateScanned waits for it.
// input must not change meanwhile.
func ScanDrawing(input []byte, name string) *DrawingScan {
	s := &DrawingScan{done: make(chan struct{}), input: input}
	go func() {
		defer close(s.done)
		s.facts, s.err = scanDXFBytes(input, name)
	}()
	return s
}

// AnnotateScanned is AnnotateBytes with the drawing's scan made ahead
// (ScanDrawing of the same bytes); with a scan of other bytes, or nil, or
// used already, the drawing is scanned here. The file is the same.
func AnnotateScanned(input []byte, name, outputPath string, m Markup, scan *DrawingScan) error {
	if sameFile(name, outputPath) {
		return fmt.Errorf("export: %s: %w", outputPath, ErrSameFile)
	}
	if err := m.validate(); err != nil {
		return fmt.Errorf("export: %s: %w", outputPath, err)
	}
	if scan == nil || len(scan.input) != len(input) || (len(input) > 0 && &scan.input[0] != &input[0]) || scan.used.Swap(true) {
		return annotate(bytes.NewReader(input), name, outputPath, m)
	}
	<-scan.done
	if scan.err != nil {
		return fmt.Errorf("export: %w", scan.err)
	}
	in := bytes.NewReader(input)
	return writeAtomic(outputPath, func(w *bufio.Writer) error {
		return copyEdited(in, name, w, scan.facts, &m)
	})
}

// Detach waits for the scan to end and lets go of the drawing's bytes:
// what the scan keeps of them is copied, so that the caller may drop them
// and annotate from the file instead (AnnotateScanFrom). AnnotateScanned
// then scans its bytes afresh.
func (s *DrawingScan) Detach() {
	<-s.done
	s.input = nil
	if s.facts != nil {
		s.facts.detach()
	}
}

// detach copies every string f holds, which the scan of a drawing in
// memory took from its bytes without copying (pairReader).
func (f *dxfFacts) detach() {
	for _, p := range []*string{&f.Version, &f.HandSeed, &f.LayerTable, &f.Layer0LType, &f.Layer0Plot,
		&f.ModelSpace, &f.EOL, &f.FirstSection} {
		*p = strings.Clone(*p)
	}
	layers := make(map[string]bool, len(f.Layers))
	for k, v := range f.Layers {
		layers[strings.Clone(k)] = v
	}
	f.Layers = layers
	for i := range f.edits {
		f.edits[i].Value = strings.Clone(f.edits[i].Value)
	}
}

// ErrDrawingChanged is the error of AnnotateScanFrom when the drawing it
// reads is not the one that was checked.
var ErrDrawingChanged = errors.New("the drawing changed on disk while it was being checked (written over in place); its annotated copy is not written: run the check again")

// AnnotateScanFrom is AnnotateScanned for a drawing no longer held in
// memory: in reads it again from its start (the file as opened for the
// check: a drawing replaced on disk meanwhile, as CAD programs save, is
// still read as it was), and size and sum (SHA-256, hex) are those of the
// bytes checked and scanned (ScanDrawing, then Detach). Every byte read is
// hashed on the way; when the bytes differ, the copy is not written and
// the error wraps ErrDrawingChanged. With no scan, or one used already,
// the drawing is scanned from in first.
func AnnotateScanFrom(in io.ReadSeeker, size int64, sum, name, outputPath string, m Markup, scan *DrawingScan) error {
	if sameFile(name, outputPath) {
		return fmt.Errorf("export: %s: %w", outputPath, ErrSameFile)
	}
	if err := m.validate(); err != nil {
		return fmt.Errorf("export: %s: %w", outputPath, err)
	}
	var facts *dxfFacts
	if scan == nil || scan.used.Swap(true) {
		f, err := scanDXF(in, name)
		if err != nil {
			return fmt.Errorf("export: %w", err)
		}
		if _, err := in.Seek(0, io.SeekStart); err != nil {
			return fmt.Errorf("export: %w", err)
		}
		facts = f
	} else {
		<-scan.done
		if scan.err != nil {
			return fmt.Errorf("export: %w", scan.err)
		}
		facts = scan.facts
	}
	return writeAtomic(outputPath, func(w *bufio.Writer) error {
		return copyChecked(in, size, sum, name, w, facts, &m)
	})
}

// copyChecked is copyEdited hashing every byte of in on the way, to the
// end: an error wrapping ErrDrawingChanged when they are not size bytes
// whose SHA-256 (hex) is sum.
//
// A copy that fails (a drawing cut short since, or one the copy cannot
// annotate) reads on to the end all the same, so that a changed drawing is
// said to be one; a drawing that cannot be read again at all is an error
// of the machine, not a *DXFError.
func copyChecked(in io.Reader, size int64, sum, name string, w *bufio.Writer, facts *dxfFacts, m *Markup) error {
	h := &countingHash{h: sha256.New()}
	cerr := copyEdited(io.TeeReader(in, h), name, w, facts, m)
	// what the copy left unread (nothing, for a whole drawing) is hashed
	// too: the bytes read must be the bytes checked
	if _, err := io.Copy(h, in); err != nil {
		return fmt.Errorf("%s: reading the drawing again for its annotated copy: %w", name, err)
	}
	if h.n != size || hex.EncodeToString(h.h.Sum(nil)) != sum {
		return fmt.Errorf("%s: %w", name, ErrDrawingChanged)
	}
	return cerr
}

// LayerColours waits for the scan and returns what DrawingLayerColours
// returns for the drawing scanned, nil when it could not be scanned; it
// needs neither the bytes (after Detach) nor the file again.
func (s *DrawingScan) LayerColours() []int {
	<-s.done
	if s.facts == nil {
		return nil
	}
	return slices.Clone(s.facts.LayerColours)
}

// countingHash hashes and counts what is written to it.
type countingHash struct {
	h hash.Hash
	n int64
}

func (c *countingHash) Write(b []byte) (int, error) {
	c.n += int64(len(b))
	return c.h.Write(b)
}

// annotate reads the drawing twice from in (facts, then the copy).
func annotate(in io.ReadSeeker, inputPath, outputPath string, m Markup) error {
	facts, err := scanDXF(in, inputPath)
	if err != nil {
		return fmt.Errorf("export: %w", err)
	}
	if _, err := in.Seek(0, io.SeekStart); err != nil {
		return fmt.Errorf("export: %w", err)
	}
	return writeAtomic(outputPath, func(w *bufio.Writer) error {
		return copyEdited(in, inputPath, w, facts, &m)
	})
}

// annotator holds the second pass's state.
type annotator struct {
	facts     *dxfFacts
	m         *Markup
	em        *dxfEmitter
	newLayers []int // indexes into markupLayers not yet in the drawing
	colours   map[string]int
	newSeed   uint64
}

// newAnnotator chooses our layers' colours, the layers to add, the
// handles and the markup's extent for a copy written to w.
func newAnnotator(w *bufio.Writer, facts *dxfFacts, m *Markup) *annotator {
	a := &annotator{facts: facts, m: m}
	a.colours = chooseColours(usedSet(append(append([]int(nil), facts.LayerColours...), m.UsedACI...)))
	if facts.HasExtent && finite(facts.Lo[0]) && finite(facts.Lo[1]) && finite(facts.Hi[0]) && finite(facts.Hi[1]) {
		k := m.ToInch
		lo, hi := [2]float64{facts.Lo[0] * k, facts.Lo[1] * k}, [2]float64{facts.Hi[0] * k, facts.Hi[1] * k}
		if m.PlanLo != ([2]float64{}) || m.PlanHi != ([2]float64{}) {
			lo = [2]float64{math.Min(lo[0], m.PlanLo[0]), math.Min(lo[1], m.PlanLo[1])}
			hi = [2]float64{math.Max(hi[0], m.PlanHi[0]), math.Max(hi[1], m.PlanHi[1])}
		}
		m.PlanLo, m.PlanHi = lo, hi
	}
	for i, l := range markupLayers {
		if !facts.Layers[strings.ToUpper(l.Name)] && m.usesLayer(l.Name) {
			a.newLayers = append(a.newLayers, i)
		}
	}
	start := facts.MaxHandle + 1
	if s, err := strconv.ParseUint(facts.HandSeed, 16, 64); err == nil && s > start {
		start = s
	}
	count := uint64(len(a.newLayers) + markupEntityCount(m))
	if !facts.HasLayerTab {
		count++ // the LAYER table head
	}
	a.newSeed = start + count
	a.em = &dxfEmitter{w: w, eol: facts.EOL, handles: facts.handles(), subclass: facts.modern(),
		next: start, owner: facts.ModelSpace}
	return a
}

// layers writes our new LAYER records.
func (a *annotator) layers() {
	ltype := a.facts.Layer0LType
	if ltype == "" {
		ltype = "CONTINUOUS"
	}
	for _, i := range a.newLayers {
		l := markupLayers[i]
		a.em.layer(l.Name, a.colours[l.Name], l.LineWeight, ltype, a.facts.LayerTable, a.facts.Layer0Plot)
	}
}

// layerTable writes a whole LAYER table holding our layers (for a TABLES
// section that has none).
func (a *annotator) layerTable() {
	a.em.pair(0, "TABLE")
	a.em.pair(2, "LAYER")
	if a.em.handles {
		a.facts.LayerTable = strconv.FormatUint(a.em.next, 16)
	}
	a.em.handle()
	if a.em.subclass {
		a.em.pair(330, "0")
		a.em.pair(100, "AcDbSymbolTable")
	}
	a.em.pair(70, strconv.Itoa(len(a.newLayers)))
	a.layers()
	a.em.pair(0, "ENDTAB")
}

// tablesSection writes a TABLES section with our LAYER table.
func (a *annotator) tablesSection() {
	a.em.pair(0, "SECTION")
	a.em.pair(2, "TABLES")
	a.layerTable()
	a.em.pair(0, "ENDSEC")
}
