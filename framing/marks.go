package framing

import (
	"fmt"
	"math"
	"strconv"

	"framecheck/internal/par"
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
		b = appendG(b, v)
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
func AssignMarks(p *Plan) { AssignMarksKept(p, nil, nil) }

// nameKey is markKey without the size: what a mark's name is kept by
// (species, grade, spans, spacing, tributary width, zones, bearings,
// drawn blocking), so that a size changed on the drawing in a revision,
// or by --size, keeps the mark's name.
// appendG appends v as strconv's 'g' format with the shortest precision
// (%g) writes it, the keys' format since marks.json first kept them. The
// keys' numbers are mostly whole inches: those below 1e6 (where 'g' turns
// to an exponent) are written as integers, the same text without the
// float conversion; minus zero keeps its sign as 'g' writes it.
func appendG(b []byte, v float64) []byte {
	if v == math.Trunc(v) && math.Abs(v) < 1e6 {
		if v == 0 && math.Signbit(v) {
			return append(b, "-0"...)
		}
		return strconv.AppendInt(b, int64(v), 10)
	}
	return strconv.AppendFloat(b, v, 'g', -1, 64)
}

func nameKey(m *Member) string { return markKey(m)[len(m.Size)+1:] }

// MarkKeys returns the key each member's mark name is kept by (nameKey),
// "" for an error member.
func MarkKeys(p *Plan) []string {
	keys := make([]string, len(p.Members))
	loads := pointLoadKeys(p)
	// each member's key reads it alone: on every core, each range
	// writing its own
	par.Ranges(len(p.Members), func(lo, hi int) {
		for k := lo; k < hi; k++ {
			if !p.Members[k].Error {
				keys[k] = nameKey(&p.Members[k]) + loads[k]
			}
		}
	})
	return keys
}

// pointLoadKeys returns, by member, what the point loads drawn on it add
// to its key: where (from its first bearing, to 1 in) and what they carry.
// Members identical but for a point load are not identical for design.
func pointLoadKeys(p *Plan) map[int]string {
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
	return loads
}

// AssignMarksKept names the marks of p as AssignMarks does, but keeps the
// names of an earlier run: known maps a key (MarkKeys) to its mark name
// (as returned before). drawn[k] is member k's key (MarkKeys; nil: taken
// now). The key leaves the size out, so a size changed on the drawing
// or picked by --size renames no mark. Members with one key but
// different sizes are different marks: the first one's size keeps the
// key's name, each other is known by the key and its size. A key met for the first
// time gets the next free name, after every name known, in order of
// first appearance, the drawn keys first and then those of sizes split
// off (so that, numbered afresh, the marks as drawn get the same names
// with or without --size). It returns known with this run's keys added
// (a new map; known is not changed).
func AssignMarksKept(p *Plan, drawn []string, known map[string]string) map[string]string {
	out := make(map[string]string, len(known))
	next := 0
	for k, v := range known {
		out[k] = v
		if n, ok := markNumber(v); ok && n > next {
			next = n
		}
	}
	firstSize := map[string]string{} // drawn key -> the size its first member got
	keys := make([]string, len(p.Members))
	loads := pointLoadKeys(p)
	split := make([]bool, len(p.Members))
	for k := range p.Members {
		m := &p.Members[k]
		if m.Error {
			continue
		}
		var key string
		if drawn != nil && drawn[k] != "" {
			key = drawn[k]
		} else {
			key = nameKey(m) + loads[k]
		}
		if fs, ok := firstSize[key]; !ok {
			firstSize[key] = m.Size
		} else if fs != m.Size {
			key += "|sized " + m.Size
			split[k] = true
		}
		keys[k] = key
	}
	for _, pass := range []bool{false, true} {
		for k := range p.Members {
			m := &p.Members[k]
			if m.Error {
				m.Mark = ""
				continue
			}
			if split[k] != pass {
				continue
			}
			mk, ok := out[keys[k]]
			if !ok {
				next++
				mk = fmt.Sprintf("J%d", next)
				out[keys[k]] = mk
			}
			m.Mark = mk
		}
	}
	return out
}

// markNumber reads the number of a mark name "J12".
func markNumber(name string) (int, bool) {
	if len(name) < 2 || name[0] != 'J' {
		return 0, false
	}
	n, err := strconv.Atoi(name[1:])
	return n, err == nil && n > 0
}
