package framing

import (
	"fmt"
	"math"
	"strings"
)

// markKey is what makes two members identical for design (DOMAIN.md
// "Marks"): size, species and grade, spans and overhangs rounded up to
// 1 in, spacing and tributary width rounded to 0.5 in, zones (same
// loads), bearing kinds and lengths (to 0.25 in) and drawn blocking
// positions from the first bearing (to 1 in). Tributary width is in the
// key because an edge joist carries less load than its interior
// neighbours at the same spacing.
func markKey(m *Member) string {
	var b strings.Builder
	fmt.Fprintf(&b, "%s|%s|%s|", m.Size, m.Species, m.Grade)
	for _, s := range m.Spans() {
		fmt.Fprintf(&b, "%g,", math.Ceil(s-1e-6))
	}
	fmt.Fprintf(&b, "|%g|%g|", math.Ceil(m.OverhangStartIn-1e-6), math.Ceil(m.OverhangEndIn-1e-6))
	fmt.Fprintf(&b, "%g|%g|", math.Round(m.SpacingIn*2)/2, math.Round(m.TribIn*2)/2)
	fmt.Fprintf(&b, "%s|", strings.Join(m.Zones, ","))
	for _, br := range m.Bearings {
		fmt.Fprintf(&b, "%s:%g,", br.Kind, math.Round(br.LengthIn*4)/4)
	}
	b.WriteString("|")
	ref := 0.0
	if len(m.Bearings) > 0 {
		ref = m.Bearings[0].AtIn
	}
	for _, at := range m.ExistingBlockingAtIn {
		fmt.Fprintf(&b, "%g,", math.Round(at-ref))
	}
	return b.String()
}

// AssignMarks names groups of members identical for design J1, J2, ...
// in order of first appearance in Plan.Members (sorted by midpoint y,
// then x), so the same drawing always gets the same marks. Call it after
// sizes are final. Error members get no mark.
func AssignMarks(p *Plan) {
	marks := map[string]string{}
	for k := range p.Members {
		m := &p.Members[k]
		if m.Error {
			m.Mark = ""
			continue
		}
		key := markKey(m)
		mk, ok := marks[key]
		if !ok {
			mk = fmt.Sprintf("J%d", len(marks)+1)
			marks[key] = mk
		}
		m.Mark = mk
	}
}
