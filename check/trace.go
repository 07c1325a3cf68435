package check

import (
	"math"
	"strconv"
	"strings"
	"unsafe"
)

// refAnalysis is the Ref of trace values taken from the structural
// analysis (package check/beam) under the check's governing case.
const refAnalysis = "structural analysis (check/beam), exact for uniform loads"

// tracer collects TraceItems and formats numbers for them.
type tracer struct {
	items []TraceItem
	text  *textArena
}

// textArena holds the text of the substitution strings of one result in
// few allocations: each string is appended to buf and handed out as a
// string sharing buf's bytes. Bytes once handed out are never written
// again (buf only grows, and a full buf is replaced, not reused), which is
// what makes the unsafe.String view immutable as Go requires.
type textArena struct {
	buf []byte
}

// traceArena hands out trace slices from one allocation per result.
type traceArena struct {
	items []TraceItem
	text  textArena
}

// tracer returns a tracer whose items take up to n entries of the arena.
func (a *traceArena) tracer(n int) tracer {
	if cap(a.items)-len(a.items) < n {
		a.items = make([]TraceItem, 0, max(64, n))
	}
	l := len(a.items)
	a.items = a.items[:l+n]
	return tracer{items: a.items[l : l : l+n], text: &a.text}
}

func (t *tracer) add(sym string, v float64, unit, formula, subst, ref string) {
	if t.items == nil {
		t.items = make([]TraceItem, 0, 16)
	}
	t.items = append(t.items, TraceItem{Symbol: sym, Value: v, Unit: unit, Formula: formula, Subst: subst, Ref: ref})
}

// f replaces each %s in format with the next value, printed as num does.
func (t *tracer) f(format string, vals ...float64) string {
	if t.text == nil {
		t.text = &textArena{}
	}
	ta := t.text
	if cap(ta.buf)-len(ta.buf) < len(format)+24*len(vals) {
		ta.buf = make([]byte, 0, max(1024, 2*(len(format)+24*len(vals))))
	}
	start := len(ta.buf)
	b := ta.buf
	i := 0
	for {
		j := strings.Index(format, "%s")
		if j < 0 || i >= len(vals) {
			b = append(b, format...)
			break
		}
		b = append(b, format[:j]...)
		b = appendNum(b, vals[i])
		i++
		format = format[j+2:]
	}
	if cap(b) != cap(ta.buf) { // outgrew the estimate: keep the copy, leave buf alone
		return string(b[start:])
	}
	ta.buf = b
	if len(b) == start {
		return ""
	}
	return unsafe.String(&b[start], len(b)-start)
}

// appendNum prints v with about four significant figures: whole numbers
// from 1000 up, then at most 1, 2 or 3 decimals, trailing zeros dropped.
// It rounds half away from zero through an integer, which is exact for the
// magnitudes a joist check meets (below 1e15); larger or non-finite values
// go through strconv.
func appendNum(b []byte, v float64) []byte {
	a := math.Abs(v)
	prec := 3
	switch {
	case a >= 1000:
		prec = 0
	case a >= 100:
		prec = 1
	case a >= 10:
		prec = 2
	}
	if !(a < 1e15) {
		return strconv.AppendFloat(b, v, 'g', 6, 64)
	}
	scales := [4]int64{1, 10, 100, 1000}
	n := int64(math.Floor(a*float64(scales[prec]) + 0.5))
	if n == 0 {
		return append(b, '0')
	}
	if v < 0 {
		b = append(b, '-')
	}
	ip, fp := n/scales[prec], n%scales[prec]
	b = strconv.AppendInt(b, ip, 10)
	if fp == 0 {
		return b
	}
	// fp has prec digits with leading zeros; drop its trailing zeros.
	for fp%10 == 0 {
		fp /= 10
		prec--
	}
	b = append(b, '.')
	for d := prec - 1; d >= 0; d-- {
		b = append(b, byte('0'+fp/scales[d]%10))
	}
	return b
}

// num formats v as appendNum does.
func num(v float64) string { return string(appendNum(nil, v)) }
