package export

import (
	"bufio"
	"fmt"
	"math"
	"strings"
)

// UnitToInch returns the inches per drawing unit for a unit name of the
// project file (in, ft, mm, cm, m): 1, 12, 1/25.4, 1/2.54, 1/0.0254 (exact
// by the definition of the inch, 25.4 mm). ok is false for any other name.
func UnitToInch(units string) (factor float64, ok bool) {
	switch strings.ToLower(units) {
	case "in":
		return 1, true
	case "ft":
		return 12, true
	case "mm":
		return 1 / 25.4, true
	case "cm":
		return 1 / 2.54, true
	case "m":
		return 1 / 0.0254, true
	}
	return 0, false
}

// WriteOverlay writes the markup alone as a minimal R12 (AC1009) DXF, to
// attach to the plan as a reference at 0,0 scale 1: a HEADER with the
// extents, an LTYPE, STYLE and LAYER table holding layer 0 and our layers,
// and the markup entities, without handles. Coordinates are in the plan's
// drawing units, named by units (in, ft, mm, cm, m); units "" means
// m.ToInch gives the factor, and a named unit overrides m.ToInch. The file
// is written atomically; the caller must not pass the input drawing's path
// (use a name of its own, e.g. plan.framecheck-overlay.dxf).
func WriteOverlay(path string, m Markup, units string) error {
	if units != "" {
		f, ok := UnitToInch(units)
		if !ok {
			return fmt.Errorf("export: %s: drawing units %q: want in, ft, mm, cm or m", path, units)
		}
		m.ToInch = f
	}
	if err := m.validate(); err != nil {
		return fmt.Errorf("export: %s: %w", path, err)
	}
	return writeAtomic(path, func(w *bufio.Writer) error {
		writeOverlay(w, &m, units)
		return nil
	})
}

func writeOverlay(w *bufio.Writer, m *Markup, units string) {
	e := &dxfEmitter{w: w, eol: "\n"}
	if units == "" {
		units = fmt.Sprintf("%g in per unit", m.ToInch)
	}
	e.pair(999, "framecheck markup overlay; drawing units: "+units)
	lo, hi := m.bounds()
	e.pair(0, "SECTION")
	e.pair(2, "HEADER")
	e.pair(9, "$ACADVER")
	e.pair(1, "AC1009")
	e.pair(9, "$EXTMIN")
	e.num(10, lo[0]/m.ToInch)
	e.num(20, lo[1]/m.ToInch)
	e.num(30, 0)
	e.pair(9, "$EXTMAX")
	e.num(10, hi[0]/m.ToInch)
	e.num(20, hi[1]/m.ToInch)
	e.num(30, 0)
	e.pair(0, "ENDSEC")

	e.pair(0, "SECTION")
	e.pair(2, "TABLES")
	e.pair(0, "TABLE")
	e.pair(2, "LTYPE")
	e.pair(70, "1")
	e.pair(0, "LTYPE")
	e.pair(2, "CONTINUOUS")
	e.pair(70, "0")
	e.pair(3, "Solid line")
	e.pair(72, "65")
	e.pair(73, "0")
	e.num(40, 0)
	e.pair(0, "ENDTAB")
	e.pair(0, "TABLE")
	e.pair(2, "LAYER")
	n := 0
	for _, l := range markupLayers {
		if m.usesLayer(l.Name) {
			n++
		}
	}
	e.pair(70, fmt.Sprint(n+1))
	e.layer("0", 7, 0, "CONTINUOUS", "", "")
	colours := chooseColours(usedSet(m.UsedACI))
	for _, l := range markupLayers {
		if !m.usesLayer(l.Name) {
			continue
		}
		e.layer(l.Name, colours[l.Name], l.LineWeight, "CONTINUOUS", "", "")
	}
	e.pair(0, "ENDTAB")
	e.pair(0, "TABLE")
	e.pair(2, "STYLE")
	e.pair(70, "1")
	e.pair(0, "STYLE")
	e.pair(2, "STANDARD")
	e.pair(70, "0")
	e.num(40, 0)
	e.num(41, 1)
	e.num(50, 0)
	e.pair(71, "0")
	e.num(42, 2.5)
	e.pair(3, "txt")
	e.pair(4, "")
	e.pair(0, "ENDTAB")
	e.pair(0, "ENDSEC")

	e.pair(0, "SECTION")
	e.pair(2, "ENTITIES")
	e.markup(m, colours)
	e.pair(0, "ENDSEC")
	e.pair(0, "EOF")
}

// bounds returns the corners of the markup's bounding box in inches (zero
// when the markup is empty).
func (m *Markup) bounds() (lo, hi [2]float64) {
	lo = [2]float64{math.Inf(1), math.Inf(1)}
	hi = [2]float64{math.Inf(-1), math.Inf(-1)}
	add := func(p [2]float64) {
		lo[0], lo[1] = math.Min(lo[0], p[0]), math.Min(lo[1], p[1])
		hi[0], hi[1] = math.Max(hi[0], p[0]), math.Max(hi[1], p[1])
	}
	for _, s := range m.Highlights {
		add(s.A)
		add(s.B)
	}
	for _, g := range [][]Segment{m.Errors, m.BlockingAdds} {
		for _, s := range g {
			add(s.A)
			add(s.B)
		}
	}
	for _, s := range m.Generated {
		add(s.A)
		add(s.B)
	}
	for _, g := range m.labelGroups() {
		for _, l := range g.Labels {
			add(l.At)
		}
	}
	if math.IsInf(lo[0], 1) {
		return [2]float64{}, [2]float64{}
	}
	return lo, hi
}
