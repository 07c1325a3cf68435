package framing

import (
	"fmt"
	"math"
	"strconv"
)

// markKey is what makes two members identical for design (DOMAIN.md
// "Marks"): size, species and grade, spans and overhangs rounded up to
// 1 in, spacing and tributary width rounded to 0.5 in, zones (same
// loads) and where each acts (to 1 in), bearing kinds and lengths (to 0.25 in) and drawn blocking
// positions from the first bearing (to 1 in). Tributary width is in the
// key because an edge joist carries less load than its interior
// neighbours at the same spacing.
func markKey(m *Member) string {
	b := make([]byte, 0, 128)
	num := func(v float64, sep byte) {
		b = strconv.AppendFloat(b, v, 'g', -1, 64) // as %g
		b = append(b, sep)
	}
	b = append(b, m.Size...)
	b = append(b, '|')
	b = append(b, m.Species...)
	b = append(b, '|')
	b = append(b, m.Grade...)
	b = append(b, '|')
	for _, s := range m.Spans() {
		num(math.Ceil(s-1e-6), ',')
	}
	b = append(b, '|')
	num(math.Ceil(m.OverhangStartIn-1e-6), '|')
	num(math.Ceil(m.OverhangEndIn-1e-6), '|')
	num(math.Round(m.SpacingIn*2)/2, '|')
	num(math.Round(m.TribIn*2)/2, '|')
	for i, z := range m.Zones {
		if i > 0 {
			b = append(b, ',')
		}
		b = append(b, z...)
	}
	// where each zone acts, from the first bearing, to 1 in
	zref := 0.0
	if len(m.Bearings) > 0 {
		zref = m.Bearings[0].AtIn
	}
	for _, zp := range m.ZonePieces {
		b = append(b, ';')
		b = append(b, zp.Zone...)
		b = append(b, ':')
		num(math.Round(zp.ToIn-zref), ',')
	}
	b = append(b, '|')
	for _, br := range m.Bearings {
		b = append(b, br.Kind...)
		b = append(b, ':')
		num(math.Round(br.LengthIn*4)/4, ',')
	}
	b = append(b, '|')
	ref := 0.0
	if len(m.Bearings) > 0 {
		ref = m.Bearings[0].AtIn
	}
	for _, at := range m.ExistingBlockingAtIn {
		num(math.Round(at-ref), ',')
	}
	return string(b)
}

// AssignMarks names groups of members identical for design J1, J2, ...
// in order of first appearance in Plan.Members (sorted by midpoint y,
// then x), so the same drawing always gets the same marks. Call it after
// sizes are final. Error members get no mark.
func AssignMarks(p *Plan) {
	marks := map[string]string{}
	// point loads drawn on a member make it a member of its own kind: where
	// (from its first bearing, to 1 in) and what they carry
	loads := map[int]string{}
	for _, pl := range p.PointLoads {
		if pl.Member < 0 || pl.Member >= len(p.Members) {
			continue
		}
		ref := 0.0
		if bs := p.Members[pl.Member].Bearings; len(bs) > 0 {
			ref = bs[0].AtIn
		}
		l := pl.Loads
		loads[pl.Member] += fmt.Sprintf("|P%g:%s:%g,%g,%g,%g,%g,%g", math.Round(pl.AtIn-ref), pl.Name,
			l.DeadLb, l.LiveLb, l.RoofLiveLb, l.SnowLb, l.WindDownLb, l.WindUpLb)
	}
	for k := range p.Members {
		m := &p.Members[k]
		if m.Error {
			m.Mark = ""
			continue
		}
		key := markKey(m) + loads[k]
		mk, ok := marks[key]
		if !ok {
			mk = fmt.Sprintf("J%d", len(marks)+1)
			marks[key] = mk
		}
		m.Mark = mk
	}
}
