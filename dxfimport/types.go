package dxfimport

import (
	"fmt"
	"sort"
	"strconv"
	"strings"
)

// Pos says where something came from in the input drawing. It travels with
// every entity into framing and on into the outputs, so a message about a
// member can name the file, line, handle and layer of the line it was drawn
// with.
type Pos struct {
	File   string // input name as given by the caller
	Line   int    // 1-based line of the entity's "0" group code; 0 if unknown
	Handle string // entity handle (group 5), "" if the file has none
	Layer  string // layer name as written in the file
}

// String formats p as "plan.dxf:4410 (handle 2F1, layer JOISTS)".
func (p Pos) String() string {
	// one allocation: a large plan names a hundred thousand places
	var b strings.Builder
	b.Grow(len(p.File) + len(p.Handle) + len(p.Layer) + 40)
	b.WriteString(p.File)
	if p.Line > 0 {
		var n [20]byte
		b.WriteByte(':')
		b.Write(strconv.AppendInt(n[:0], int64(p.Line), 10))
	}
	if p.Handle != "" || p.Layer != "" {
		b.WriteString(" (")
		if p.Handle != "" {
			b.WriteString("handle ")
			b.WriteString(p.Handle)
			if p.Layer != "" {
				b.WriteString(", ")
			}
		}
		if p.Layer != "" {
			b.WriteString("layer ")
			b.WriteString(p.Layer)
		}
		b.WriteByte(')')
	}
	return b.String()
}

// Point is a 2D point. Inside a Drawing all coordinates are world
// coordinates in inches (block inserts expanded, drawing units converted).
type Point struct{ X, Y float64 }

// Kind is an entity type that the reader keeps.
type Kind int

// The entity kinds kept by the reader; everything else is counted in
// Drawing.Skipped.
const (
	KindLine Kind = iota + 1
	KindLWPolyline
	KindPolyline // old-style POLYLINE/VERTEX/SEQEND (2D)
	KindText
	KindMText
	KindPoint
	KindCircle
	KindArc
)

var kindNames = map[Kind]string{
	KindLine: "LINE", KindLWPolyline: "LWPOLYLINE", KindPolyline: "POLYLINE",
	KindText: "TEXT", KindMText: "MTEXT", KindPoint: "POINT",
	KindCircle: "CIRCLE", KindArc: "ARC",
}

// String returns the DXF entity name of k.
func (k Kind) String() string {
	if s, ok := kindNames[k]; ok {
		return s
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// Entity is one drawing entity in world coordinates, inches.
//
//   - LINE: Points holds start and end.
//   - LWPOLYLINE, POLYLINE: Points holds the vertices, Bulges one bulge per
//     vertex (nil when every bulge is zero), Closed the closed flag.
//   - TEXT, MTEXT: Points[0] is the insertion point, Text the plain text
//     (MTEXT formatting stripped, \P turned into "\n"), HeightIn the height.
//   - POINT: Points[0]. CIRCLE, ARC: Points[0] is the centre, RadiusIn,
//     and for ARC StartDeg/EndDeg (counter-clockwise, world frame).
type Entity struct {
	Kind     Kind
	Pos      Pos // Pos.Layer is the effective layer (block rule for layer "0" applied)
	Points   []Point
	Bulges   []float64
	Closed   bool
	Text     string
	HeightIn float64
	RadiusIn float64
	StartDeg float64
	EndDeg   float64
	// RotationDeg is the TEXT/MTEXT baseline direction, degrees
	// counter-clockwise from world +X.
	RotationDeg float64
	// From is the position of the model-space INSERT this entity was
	// expanded from (the outermost one for nested blocks), shared by all
	// entities of that insert; nil for an entity drawn in model space.
	// Pos then refers to the entity's definition inside the block.
	From *Pos
}

// Layer is an entry of the LAYER table.
type Layer struct {
	Name   string
	Color  int  // ACI colour number, absolute value of group 62
	On     bool // false when group 62 is negative
	Frozen bool // bit 1 of group 70
}

// Drawing is what the reader returns: header facts, layers, and the
// entities of model space with every INSERT expanded.
type Drawing struct {
	File     string
	Version  string  // $ACADVER, e.g. "AC1009", "AC1015"
	InsUnits int     // $INSUNITS as read, 0 when missing or unitless
	Units    string  // "in", "ft", "mm", "cm", "m": from Options.Units or $INSUNITS; "" if unknown
	ToInch   float64 // factor applied to drawing coordinates to get inches
	ExtMin   Point   // $EXTMIN in inches (zero when absent)
	ExtMax   Point   // $EXTMAX in inches
	HandSeed string  // $HANDSEED as read (hex), "" when absent
	Layers   []Layer
	Entities []Entity
	// Skipped counts what was read but not kept, by entity type or
	// "SECTION:<name>"; never fatal.
	Skipped map[string]int
	// Dropped counts the entities on layers Options.Keep left out, by
	// layer and kind (block inserts expanded); empty when Keep is nil.
	Dropped map[string]map[Kind]int
	// Issues holds the non-fatal findings (missing units, unknown
	// entities, a nested insert too deep, ...).
	Issues IssueList
}

// Severity of an Issue.
type Severity int

// Severities, from least to most serious. Only SevError makes
// IssueList.Err non-nil.
const (
	SevInfo Severity = iota
	SevWarning
	SevError
)

// String returns "info", "warning" or "error".
func (s Severity) String() string {
	switch s {
	case SevInfo:
		return "info"
	case SevWarning:
		return "warning"
	default:
		return "error"
	}
}

// Issue is one finding about the input. Codes are stable and grouped by
// range: DXF1xx input, FRM2xx geometry, CHK3xx design.
type Issue struct {
	Pos      Pos
	Code     string
	Severity Severity
	Msg      string
}

// Error formats the issue as "plan.dxf:12 (handle 2F): warning DXF101: msg".
func (i Issue) Error() string {
	return fmt.Sprintf("%s: %s %s: %s", i.Pos, i.Severity, i.Code, i.Msg)
}

// IssueList gathers findings; modelled on go/scanner.ErrorList.
type IssueList []Issue

// Add appends an issue.
func (l *IssueList) Add(pos Pos, code string, sev Severity, format string, args ...any) {
	*l = append(*l, Issue{Pos: pos, Code: code, Severity: sev, Msg: fmt.Sprintf(format, args...)})
}

// Sort orders the list by file, line, then code.
func (l IssueList) Sort() {
	sort.SliceStable(l, func(i, j int) bool {
		a, b := l[i].Pos, l[j].Pos
		if a.File != b.File {
			return a.File < b.File
		}
		if a.Line != b.Line {
			return a.Line < b.Line
		}
		return l[i].Code < l[j].Code
	})
}

// Err returns nil when the list holds no error-severity issue, else an
// error listing the error-severity issues.
func (l IssueList) Err() error {
	var errs IssueList
	for _, i := range l {
		if i.Severity == SevError {
			errs = append(errs, i)
		}
	}
	if len(errs) == 0 {
		return nil
	}
	return errs
}

// Error implements error for a list of issues.
func (l IssueList) Error() string {
	switch len(l) {
	case 0:
		return "no issues"
	case 1:
		return l[0].Error()
	}
	return fmt.Sprintf("%s (and %d more)", l[0].Error(), len(l)-1)
}
