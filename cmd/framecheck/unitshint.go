package main

import (
	"fmt"
	"sort"

	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/framing"
)

// CodeUnitsDoubt is the warning that the joists' spans look like a drawing
// read in the wrong units.
const CodeUnitsDoubt = "RUN401"

// Spans outside these bounds are not house or light-commercial joists:
// a median span beyond them points at a drawing read in the wrong units
// (a plan in mm read as inches gives spans 25 times too long). Common
// practice, no source: sawn joists rarely span under 3 ft or over 40 ft.
const (
	plausibleMinSpanIn = 36.0
	plausibleMaxSpanIn = 480.0
)

// unitsDoubt returns a warning when the median of the members' longest
// spans is implausible for wood joists, naming the units the drawing was
// read in and where they came from; "" when the spans look right or no
// member has a span.
func unitsDoubt(plan *framing.Plan, d *dxfimport.Drawing, flagUnits, projectUnits string) string {
	var spans []float64
	for _, m := range plan.Members {
		longest := 0.0
		for _, s := range m.Spans() {
			longest = max(longest, s)
		}
		if longest > 0 {
			spans = append(spans, longest)
		}
	}
	if len(spans) == 0 {
		return ""
	}
	sort.Float64s(spans)
	med := spans[len(spans)/2]
	if med >= plausibleMinSpanIn && med <= plausibleMaxSpanIn {
		return ""
	}
	units, from := d.Units, "from the DXF header ($INSUNITS)"
	switch {
	case flagUnits != "":
		from = "from --units"
	case projectUnits != "":
		from = "from [drawing] units in the project file"
	case units == "":
		units, from = "in", "a guess: the drawing's $INSUNITS gives no units"
	}
	return fmt.Sprintf("the joists' median span is %s, not a joist span: are the drawing units right? "+
		"The drawing was read with units %q (%s); give the right ones with --units or [drawing] units",
		export.FtIn(med), units, from)
}
