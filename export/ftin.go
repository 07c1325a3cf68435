package export

import (
	"math"
	"strconv"
	"strings"
)

// FtIn formats a length in inches as feet and inches to the nearest 1/16
// in, the way framing plans write it: 150.5 -> 12'-6 1/2", 8 -> 0'-8",
// 144 -> 12'-0". A non-finite length gives "n/a".
func FtIn(in float64) string {
	var buf [40]byte
	return string(appendFtIn(buf[:0], in))
}

// AppendFtIn appends FtIn(in) to b, without allocating when b has room.
func AppendFtIn(b []byte, in float64) []byte { return appendFtIn(b, in) }

// appendFtIn appends FtIn(in) to b without allocating. Appended by hand
// rather than with fmt: a plan's schedule, locations and labels format
// hundreds of thousands of lengths.
func appendFtIn(b []byte, in float64) []byte {
	if math.IsNaN(in) || math.IsInf(in, 0) {
		return append(b, "n/a"...)
	}
	if in < 0 {
		b = append(b, '-')
		in = -in
	}
	sixteenths := int64(math.Round(in * 16))
	ft := sixteenths / (12 * 16)
	rem := sixteenths % (12 * 16)
	whole := rem / 16
	frac := rem % 16
	b = strconv.AppendInt(b, ft, 10)
	b = append(b, "'-"...)
	b = strconv.AppendInt(b, whole, 10)
	if frac != 0 {
		num, den := frac, int64(16)
		for num%2 == 0 {
			num /= 2
			den /= 2
		}
		b = append(b, ' ')
		b = strconv.AppendInt(b, num, 10)
		b = append(b, '/')
		b = strconv.AppendInt(b, den, 10)
	}
	return append(b, '"')
}

// ftInList formats lengths as "12'-0\" + 10'-6\"".
func ftInList(ins []float64) string {
	parts := make([]string, len(ins))
	for i, v := range ins {
		parts[i] = FtIn(v)
	}
	return strings.Join(parts, " + ")
}

// SpansText writes a member's or a mark's spans with its cantilevers at
// the ends they are at, as a framing schedule lists them:
// 3'-6" cantilever + 12'-0" + 12'-0". An overhang under 0.01 in is none.
func SpansText(spansIn []float64, overhangsIn [2]float64) string {
	parts := make([]string, 0, len(spansIn)+2)
	if overhangsIn[0] >= 0.01 {
		parts = append(parts, FtIn(overhangsIn[0])+" cantilever")
	}
	for _, v := range spansIn {
		parts = append(parts, FtIn(v))
	}
	if overhangsIn[1] >= 0.01 {
		parts = append(parts, FtIn(overhangsIn[1])+" cantilever")
	}
	return strings.Join(parts, " + ")
}

// intList formats []int as "1, 2".
func intList(ns []int) string {
	parts := make([]string, len(ns))
	for i, n := range ns {
		parts[i] = strconv.Itoa(n)
	}
	return strings.Join(parts, ", ")
}

// numList formats lengths in inches to 0.01 as "14.5, 14.5".
func numList(vs []float64) string {
	parts := make([]string, len(vs))
	for i, v := range vs {
		p := strings.TrimRight(strconv.FormatFloat(v, 'f', 2, 64), "0")
		p = strings.TrimSuffix(p, ".")
		if p == "-0" {
			p = "0"
		}
		parts[i] = p
	}
	return strings.Join(parts, ", ")
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
