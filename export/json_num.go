package export

import (
	"math"
	"strconv"
)

// Numbers in results.json from schema 3 are written with the digits they
// carry (see Schema): lengths, loads, ratios and trace values as the
// shortest decimal of the value rounded to SigDigits significant digits,
// plan coordinates (start, end, point) rounded to CoordDecimals decimal
// places of the drawing unit. 2.2500000000000004 is written 2.25. The
// rounding is far below what the outputs print (ratios to 0.01, lengths to
// 1/16 in) and below what the checks can claim from their inputs. Common
// practice, no source.
const (
	SigDigits     = 6
	CoordDecimals = 6
)

// appendSig6 appends v rounded to SigDigits significant digits as its
// shortest decimal, in the format encoding/json uses for that rounded
// value (plain decimals from 1e-6 to under 1e21, exponent form outside),
// without allocating. appendSig6(b, v) equals appendJSONFloat(b,
// round6(v)); TestAppendSig6MatchesRound holds it to that. v must be
// finite.
func appendSig6(b []byte, v float64) []byte {
	if v == 0 {
		return append(b, '0')
	}
	if out, ok := appendSixteenths(b, v, SigDigits); ok {
		return out // most lengths of a plan: no float formatting needed
	}
	var tmp [32]byte
	e := strconv.AppendFloat(tmp[:0], v, 'e', SigDigits-1, 64) // [-]d.ddddde±XX
	neg := e[0] == '-'
	if neg {
		e = e[1:]
	}
	var digits [SigDigits]byte
	digits[0] = e[0]
	copy(digits[1:], e[2:2+SigDigits-1])
	rest := e[2+SigDigits-1:] // e±XX
	exp := 0
	for _, c := range rest[2:] {
		exp = exp*10 + int(c-'0')
	}
	if rest[1] == '-' {
		exp = -exp
	}
	if exp < -6 || exp >= 21 {
		return appendJSONFloat(b, round6(v)) // exponent form, rare
	}
	n := SigDigits
	for n > 1 && digits[n-1] == '0' {
		n--
	}
	if neg {
		b = append(b, '-')
	}
	point := exp + 1 // digits before the decimal point
	switch {
	case point <= 0:
		b = append(b, '0', '.')
		for i := point; i < 0; i++ {
			b = append(b, '0')
		}
		b = append(b, digits[:n]...)
	case point >= n:
		b = append(b, digits[:n]...)
		for i := n; i < point; i++ {
			b = append(b, '0')
		}
	default:
		b = append(b, digits[:point]...)
		b = append(b, '.')
		b = append(b, digits[point:n]...)
	}
	return b
}

// round6 returns v rounded to SigDigits significant digits (the nearest
// float64 to that decimal). Non-finite values are returned as they are.
func round6(v float64) float64 {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	var tmp [32]byte
	s := strconv.AppendFloat(tmp[:0], v, 'e', SigDigits-1, 64)
	r, err := strconv.ParseFloat(string(s), 64)
	if err != nil {
		return v
	}
	return r
}

// appendPlanCoord appends a plan coordinate rounded to CoordDecimals decimal
// places, trailing zeros dropped ("-2.25", "0"), without allocating. v
// must be finite.
func appendPlanCoord(b []byte, v float64) []byte {
	if math.Abs(v) >= 1e15 {
		return appendSig6(b, v) // 'f' would carry noise digits; never a real plan
	}
	return appendFixed(b, v, CoordDecimals)
}

// roundPlanCoord returns v as appendPlanCoord writes it, read back.
func roundPlanCoord(v float64) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	if s := v * 16; s == math.Trunc(s) && math.Abs(v) < 1e9 {
		return v + 0 // whole sixteenths are written exactly (appendSixteenths); -0 as 0
	}
	var tmp [40]byte
	r, err := strconv.ParseFloat(string(appendPlanCoord(tmp[:0], v)), 64)
	if err != nil {
		return v
	}
	return r
}

// LenDecimals is the finest decimal place written for lengths, loads,
// ratios and quantities outside the calculations (results.json schema 3):
// 1e-6 (inch, lb, ratio), so arithmetic noise beside real values
// (-1.1102230246251565e-16 where 0 was meant, 1e-15 for a position at the
// datum) is written 0. Common practice, no source.
const LenDecimals = 6

// appendNum appends v as results.json writes lengths, loads, ratios and
// quantities outside the calculations: rounded to SigDigits significant
// digits and to no finer than LenDecimals decimal places, whichever is
// coarser, as the shortest decimal, without allocating. 2.2500000000000004
// is written 2.25, 0.0123456789 0.012346, 1e-16 0. v must be finite.
func appendNum(b []byte, v float64) []byte {
	if math.Abs(v) >= 0.1 { // 6 significant digits reach 1e-6 at most
		return appendSig6(b, v)
	}
	return appendFixed(b, v, LenDecimals)
}

// roundNum returns v as appendNum writes it, read back.
func roundNum(v float64) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	var tmp [40]byte
	r, err := strconv.ParseFloat(string(appendNum(tmp[:0], v)), 64)
	if err != nil {
		return v
	}
	return r
}

// appendFixed appends v rounded to dec decimal places, trailing zeros
// dropped ("-2.25", "0"; never "-0"), without allocating. v must be finite
// and below 1e15 in magnitude.
func appendFixed(b []byte, v float64, dec int) []byte {
	if dec >= 4 {
		if out, ok := appendSixteenths(b, v, 0); ok {
			return out // exact in 4 decimals
		}
	}
	start := len(b)
	b = strconv.AppendFloat(b, v, 'f', dec, 64)
	if dec > 0 {
		for b[len(b)-1] == '0' {
			b = b[:len(b)-1]
		}
		if b[len(b)-1] == '.' {
			b = b[:len(b)-1]
		}
	}
	if s := b[start:]; len(s) == 2 && s[0] == '-' && s[1] == '0' {
		b = append(b[:start], '0') // -0.0000001 rounds to 0
	}
	return b
}

// DemandLb is a connector or support demand as every output prints it:
// the load rounded as results.json writes it (appendNum), then up to the
// next pound, so a demand is never rounded down and arithmetic noise (a
// reaction of 96.00000000000001 lb where statics give 96) does not add a
// pound. Common practice, no source.
func DemandLb(v float64) float64 { return math.Ceil(roundNum(v)) }

// sixteenthDigits are the decimals of k/16 in full.
var sixteenthDigits = [16]string{"", "0625", "125", "1875", "25", "3125", "375", "4375",
	"5", "5625", "625", "6875", "75", "8125", "875", "9375"}

// appendSixteenths appends v as its exact decimal when v is a whole number
// of sixteenths below 1e9 in magnitude (what most lengths and coordinates
// of a plan in inches are) with at most maxSig significant digits (0: any);
// ok is false otherwise, and b is returned as it was. -0 is written 0. The
// exact decimal (at most 4 decimals) is what rounding to 6 significant
// digits or to 6 decimal places writes for such a value, without the cost
// of float formatting (TestAppendSixteenthsMatchesFormatting).
func appendSixteenths(b []byte, v float64, maxSig int) ([]byte, bool) {
	s := v * 16 // exact: a power of two
	if !(math.Abs(v) < 1e9) || s != math.Trunc(s) {
		return b, false
	}
	n := int64(s)
	neg := n < 0
	if neg {
		n = -n
	}
	ip, frac := n/16, sixteenthDigits[n%16]
	if maxSig > 0 && ip > 0 {
		d := 1
		for q := ip; q >= 10; q /= 10 {
			d++
		}
		if d+len(frac) > maxSig {
			return b, false
		}
	}
	if n == 0 {
		return append(b, '0'), true
	}
	if neg {
		b = append(b, '-')
	}
	b = strconv.AppendInt(b, ip, 10)
	if frac != "" {
		b = append(b, '.')
		b = append(b, frac...)
	}
	return b, true
}
