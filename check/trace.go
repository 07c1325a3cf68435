package check

import (
	"math"
	"strconv"
	"strings"
)

// refAnalysis is the Ref of trace values taken from the structural
// analysis (package check/beam) under the check's governing case.
const refAnalysis = "beam analysis, three-moment equation and statics (exact for uniform, partial and point loads)"

// Subst is a substitution line held as its format and numbers: each %s of
// Format is the next of Nums, printed as appendNum does, so that the text
// is formatted only by whoever reads it (Text, Append). A Subst without
// numbers is Format verbatim.
type Subst struct {
	Format string
	Nums   []float64
}

// Text returns s printed: "1.63(72) + 3(9.25)".
func (s Subst) Text() string {
	if len(s.Nums) == 0 {
		return s.Format
	}
	return string(s.Append(make([]byte, 0, len(s.Format)+8*len(s.Nums))))
}

// String returns s.Text(), so a Subst prints as its text.
func (s Subst) String() string { return s.Text() }

// Append appends s printed to b.
func (s Subst) Append(b []byte) []byte {
	format, i := s.Format, 0
	for {
		j := strings.Index(format, "%s")
		if j < 0 || i >= len(s.Nums) {
			return append(b, format...)
		}
		b = append(b, format[:j]...)
		b = appendNum(b, s.Nums[i])
		i++
		format = format[j+2:]
	}
}

// lit is a Subst that is plain text.
func lit(s string) Subst { return Subst{Format: s} }

// tracer collects TraceItems.
type tracer struct {
	items []TraceItem
	nums  *[]float64 // arena the numbers of Substs are copied into
}

// traceArena hands out trace items and the numbers of their Substs from
// few allocations per result. Parts once handed out are never written
// again (a full slice is replaced, not reused), so results never share
// memory that changes.
type traceArena struct {
	items []TraceItem
	nums  []float64
}

// reserve makes room for the trace of one result: items trace items and
// nums numbers of their Substs, so that a result's trace takes one
// allocation of each kind, sized to fit.
func (a *traceArena) reserve(items, nums int) {
	if cap(a.items)-len(a.items) < items {
		a.items = make([]TraceItem, 0, items)
	}
	if cap(a.nums)-len(a.nums) < nums {
		a.nums = make([]float64, 0, nums)
	}
}

// tracer returns a tracer whose items take up to n entries of the arena.
func (a *traceArena) tracer(n int) tracer {
	if cap(a.items)-len(a.items) < n {
		a.items = make([]TraceItem, 0, max(16, n))
	}
	l := len(a.items)
	a.items = a.items[:l+n]
	return tracer{items: a.items[l : l : l+n], nums: &a.nums}
}

func (t *tracer) add(sym string, v float64, unit, formula string, subst Subst, ref string) {
	if t.items == nil {
		t.items = make([]TraceItem, 0, 16)
	}
	t.items = append(t.items, TraceItem{Symbol: sym, Value: v, Unit: unit, Formula: formula, Subst: subst, Ref: ref})
}

// f returns format with vals as a Subst, the numbers copied to the arena.
func (t *tracer) f(format string, vals ...float64) Subst {
	if t.nums == nil {
		return Subst{Format: format, Nums: append([]float64(nil), vals...)}
	}
	a := *t.nums
	if cap(a)-len(a) < len(vals) {
		a = make([]float64, 0, max(32, len(vals)))
	}
	l := len(a)
	a = append(a, vals...)
	*t.nums = a
	return Subst{Format: format, Nums: a[l : l+len(vals) : l+len(vals)]}
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
