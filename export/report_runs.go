package export

import (
	"math"
	"strconv"
)

// The plan of report.html draws members by runs: one <path> per run,
// status band and colour (members of a run that are alike share all
// three), holding one segment per member, in a <g> per band and status
// that carries the class, so that the page grows with the
// runs and marks rather than with the joists (issue 18). A path names its
// members in data-m, as index ranges into the member data ("0-23,40"), in
// the order of its segments; the page's script finds the member under the
// pointer as the nearest segment of the path (per-member detail on
// demand).

// planPath is one path being written: its members' indexes and its d.
type planPath struct {
	class, stroke string
	idx           []int
	d             []byte
	pen           [2]int64 // last point, hundredths of an inch, SVG frame
}

// hundredths returns v (inches) in hundredths, rounded; the SVG frame
// negates y (north up).
func hundredths(v float64) int64 { return int64(math.Round(v * 100)) }

// appendHundredths writes n/100 without trailing zeros, with a space
// before it when sep and n is not negative (a minus sign separates
// numbers by itself).
func appendHundredths(b []byte, n int64, sep bool) []byte {
	if sep && n >= 0 {
		b = append(b, ' ')
	}
	if n < 0 {
		b = append(b, '-')
		n = -n
	}
	b = strconv.AppendInt(b, n/100, 10)
	if f := n % 100; f != 0 {
		b = append(b, '.')
		if f%10 == 0 {
			b = append(b, byte('0'+f/10))
		} else {
			b = append(b, byte('0'+f/10), byte('0'+f%10))
		}
	}
	return b
}

// add appends member i's segment a-b (inches, drawing frame): a move from
// the pen to the nearer end, then a line to the other, relative to the
// pen (exact: every point is rounded to 0.01 in before differences are
// taken).
func (p *planPath) add(i int, a, b [2]float64) {
	s := [2]int64{hundredths(a[0]), hundredths(-a[1])}
	e := [2]int64{hundredths(b[0]), hundredths(-b[1])}
	if len(p.idx) == 0 {
		p.d = append(p.d, 'M')
		p.d = appendHundredths(p.d, s[0], false)
		p.d = appendHundredths(p.d, s[1], true)
	} else {
		dist := func(q [2]int64) int64 { return absInt(q[0]-p.pen[0]) + absInt(q[1]-p.pen[1]) }
		if dist(e) < dist(s) {
			s, e = e, s
		}
		p.d = append(p.d, 'm')
		p.d = appendHundredths(p.d, s[0]-p.pen[0], false)
		p.d = appendHundredths(p.d, s[1]-p.pen[1], true)
	}
	switch dx, dy := e[0]-s[0], e[1]-s[1]; {
	case dx == 0:
		p.d = append(p.d, 'v')
		p.d = appendHundredths(p.d, dy, false)
	case dy == 0:
		p.d = append(p.d, 'h')
		p.d = appendHundredths(p.d, dx, false)
	default:
		p.d = append(p.d, 'l')
		p.d = appendHundredths(p.d, dx, false)
		p.d = appendHundredths(p.d, dy, true)
	}
	p.pen = e
	p.idx = append(p.idx, i)
}

func absInt(v int64) int64 {
	if v < 0 {
		return -v
	}
	return v
}

// appendRanges writes ascending indexes as "0-23,40".
func appendRanges(b []byte, idx []int) []byte {
	for k := 0; k < len(idx); {
		j := k
		for j+1 < len(idx) && idx[j+1] == idx[j]+1 {
			j++
		}
		if k > 0 {
			b = append(b, ',')
		}
		b = strconv.AppendInt(b, int64(idx[k]), 10)
		if j > k {
			b = append(b, '-')
			b = strconv.AppendInt(b, int64(idx[j]), 10)
		}
		k = j + 1
	}
	return b
}

// appendMemberPaths writes the members as paths by run, band and colour,
// in the order each path's first member comes; a member whose ends are
// not finite is drawn nowhere (it is still in the member data and the
// tables).
func appendMemberPaths(buf []byte, r *Results, segs []memberSeg) []byte {
	type key struct{ run, class, stroke string }
	paths := map[key]*planPath{}
	var order []*planPath
	var colour []byte
	for i := range r.Members {
		m := &r.Members[i]
		s := segs[i]
		if !finite(s.a[0]) || !finite(s.a[1]) || !finite(s.b[0]) || !finite(s.b[1]) {
			continue
		}
		class := "j " + bandClass(m.MaxRatio, m.Status)
		switch m.Status {
		case StatusFail:
			class += " fail"
		case StatusError:
			class += " err"
		}
		colour = colour[:0]
		if m.Status == StatusError {
			colour = append(colour, errorColour...)
		} else {
			colour = appendColour(colour, m.MaxRatio)
		}
		k := key{m.Run, class, string(colour)}
		p, ok := paths[k]
		if !ok {
			p = &planPath{class: class, stroke: k.stroke}
			paths[k] = p
			order = append(order, p)
		}
		p.add(i, s.a, s.b)
	}
	// Paths of one band and status in one group carrying the class (the
	// CSS styles the group's paths), in the order the classes first come.
	var classes []string
	byClass := map[string][]*planPath{}
	for _, p := range order {
		if _, ok := byClass[p.class]; !ok {
			classes = append(classes, p.class)
		}
		byClass[p.class] = append(byClass[p.class], p)
	}
	for _, c := range classes {
		buf = append(buf, `<g class="`...)
		buf = append(buf, c...)
		buf = append(buf, "\">\n"...)
		for _, p := range byClass[c] {
			buf = append(buf, `<path stroke="`...)
			buf = append(buf, p.stroke...)
			buf = append(buf, `" data-m="`...)
			buf = appendRanges(buf, p.idx)
			buf = append(buf, `" d="`...)
			buf = append(buf, p.d...)
			buf = append(buf, "\"/>\n"...)
		}
		buf = append(buf, "</g>\n"...)
	}
	return buf
}

// memberSeg is a member's ends in inches, drawing frame.
type memberSeg struct{ a, b [2]float64 }
