package check

import (
	"math"
	"strconv"
	"strings"
)

// tracer collects TraceItems and formats numbers for them.
type tracer struct {
	items []TraceItem
	buf   []byte
}

// traceArena hands out trace slices from one allocation per result.
type traceArena struct {
	items []TraceItem
	buf   []byte
}

// tracer returns a tracer whose items take up to n entries of the arena.
func (a *traceArena) tracer(n int) tracer {
	if cap(a.items)-len(a.items) < n {
		a.items = make([]TraceItem, 0, max(96, n))
	}
	if a.buf == nil {
		a.buf = make([]byte, 0, 128)
	}
	l := len(a.items)
	a.items = a.items[:l+n]
	return tracer{items: a.items[l : l : l+n], buf: a.buf}
}

func (t *tracer) add(sym string, v float64, unit, formula, subst, ref string) {
	if t.items == nil {
		t.items = make([]TraceItem, 0, 16)
	}
	t.items = append(t.items, TraceItem{Symbol: sym, Value: v, Unit: unit, Formula: formula, Subst: subst, Ref: ref})
}

// f replaces each %s in format with the next value, printed as num does.
func (t *tracer) f(format string, vals ...float64) string {
	if t.buf == nil {
		t.buf = make([]byte, 0, 128)
	}
	t.buf = t.buf[:0]
	i := 0
	for {
		j := strings.Index(format, "%s")
		if j < 0 || i >= len(vals) {
			t.buf = append(t.buf, format...)
			break
		}
		t.buf = append(t.buf, format[:j]...)
		t.buf = appendNum(t.buf, vals[i])
		i++
		format = format[j+2:]
	}
	return string(t.buf)
}

// appendNum prints v with about four significant figures: whole numbers
// from 1000 up, then at most 1, 2 or 3 decimals, trailing zeros dropped.
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
	n := len(b)
	b = strconv.AppendFloat(b, v, 'f', prec, 64)
	if prec > 0 {
		for b[len(b)-1] == '0' {
			b = b[:len(b)-1]
		}
		if b[len(b)-1] == '.' {
			b = b[:len(b)-1]
		}
	}
	if string(b[n:]) == "-0" {
		b = append(b[:n], '0')
	}
	return b
}

// num formats v as appendNum does.
func num(v float64) string { return string(appendNum(nil, v)) }
