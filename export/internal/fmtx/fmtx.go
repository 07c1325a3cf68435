// Package fmtx is the one place where the writers of package export turn
// numbers and load combination names into text, so that every output
// writes them alike:
//
//   - stresses (psi) to the nearest 1;
//   - lengths (in) to 0.01;
//   - forces (lb) and moments (lb-in) to the nearest 1;
//   - section properties (in^2, in^3, in^4) to 0.01;
//   - area loads (psf) and line loads (plf) to 0.1;
//   - ratios to 0.01 in tables (Ratio) and 0.001 in traces (RatioTrace);
//   - factors and other unitless values to 0.001, trailing zeros dropped;
//   - thousands separators in text outputs (every function here); the
//     sheets store numbers as numbers and leave grouping to the cell's
//     number format;
//   - load combinations as ASCE 7-16 2.4.1 writes them, "D + 0.75L +
//     0.75(Lr or S)" (Combo), from the engine's compact names.
//
// A non-finite number is "n/a"; a negative zero is "0". No output ever
// shows an exponent ("1.4e-05 in" reads "0.00 in").
package fmtx

import (
	"math"
	"strconv"
	"strings"
	"sync"
	"sync/atomic"
)

// fixed formats v with prec decimals, "-0" as "0", and thousands
// separators in the whole part.
func fixed(v float64, prec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "n/a"
	}
	s := strconv.FormatFloat(v, 'f', prec, 64)
	neg := strings.HasPrefix(s, "-")
	s = strings.TrimPrefix(s, "-")
	whole, frac, _ := strings.Cut(s, ".")
	if strings.Trim(whole+frac, "0") == "" {
		neg = false
	}
	var b strings.Builder
	if neg {
		b.WriteByte('-')
	}
	for i, d := range whole {
		if i > 0 && (len(whole)-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteRune(d)
	}
	if frac != "" {
		b.WriteByte('.')
		b.WriteString(frac)
	}
	return b.String()
}

// trimmed is fixed with trailing zeros (and a bare point) dropped.
func trimmed(v float64, prec int) string {
	s := fixed(v, prec)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(s, "0")
		s = strings.TrimSuffix(s, ".")
	}
	if s == "-0" {
		s = "0"
	}
	return s
}

// Psi is a stress to the nearest 1 psi: 52.468 -> "52", 1600000 ->
// "1,600,000".
func Psi(v float64) string { return fixed(v, 0) }

// In is a length in inches to 0.01: 0.0000142 -> "0.00", 7.25 -> "7.25".
func In(v float64) string { return fixed(v, 2) }

// Lb is a force (or a moment in lb-in) to the nearest 1: 7128 -> "7,128".
func Lb(v float64) string { return fixed(v, 0) }

// Ratio is a ratio for a table, to 0.01: 1.6204 -> "1.62".
func Ratio(v float64) string { return fixed(v, 2) }

// RatioTrace is a ratio in a written-out calculation, to 0.001.
func RatioTrace(v float64) string { return fixed(v, 3) }

// Factor is a unitless value (an adjustment factor, RB, lu/d) to 0.001
// with trailing zeros dropped: 0.9 -> "0.9", 0.5964 -> "0.596".
func Factor(v float64) string { return trimmed(v, 3) }

// Load is an area or line load (psf, plf) to 0.1, trailing zero dropped.
func Load(v float64) string { return trimmed(v, 1) }

// Value formats v by its unit, as the rules above say; an unknown unit
// gets Factor's form.
func Value(v float64, unit string) string {
	switch strings.TrimSpace(unit) {
	case "psi", "ksi":
		return Psi(v)
	case "in", "ft":
		return In(v)
	case "lb", "lbf", "lb-in", "in-lb", "lb-ft":
		return Lb(v)
	case "in^2", "in^3", "in^4", "in2", "in3", "in4", "in²", "in³", "in⁴":
		return In(v)
	case "psf", "plf", "pcf":
		return Load(v)
	case "lb/in", "pli":
		return trimmed(v, 2)
	}
	return Factor(v)
}

// Combo spells a load combination as ASCE 7-16 2.4.1 does: spaces around
// "+", "(Lr or S)" for the engine's "(LrorS)", "0.6W (up)" for the
// engine's "0.6W(up)": "D+0.75L+0.75(LrorS)" -> "D + 0.75L + 0.75(Lr or
// S)". What follows a comma or a space (", span 1", " (live-type loads on
// span 2)") is kept as it is.
func Combo(name string) string {
	if c, ok := comboSpelt.Load(name); ok {
		return c.(string)
	}
	c := spellCombo(name)
	if comboCount.Add(1) <= maxCombosKept {
		comboSpelt.Store(name, c)
	}
	return c
}

// comboSpelt keeps Combo's answers: a plan names a few dozen combinations
// and its schedule, report and results spell them hundreds of thousands of
// times. At most maxCombosKept are kept (comboCount counts the names
// offered).
var (
	comboSpelt sync.Map // name -> spelt
	comboCount atomic.Int64
)

const maxCombosKept = 4096

// spellCombo is Combo, worked out.
func spellCombo(name string) string {
	head, tail := name, ""
	if i := strings.IndexAny(name, ", "); i >= 0 {
		head, tail = name[:i], name[i:]
	}
	head = strings.ReplaceAll(head, "LrorS", "Lr or S")
	head = strings.ReplaceAll(head, "(up)", " (up)")
	head = strings.ReplaceAll(head, "(down)", " (down)")
	head = strings.ReplaceAll(head, "+", " + ")
	return head + tail
}

// GroupDigits puts thousands separators into every whole number of five
// or more digits in a written-out substitution ("1600000(1)(1)(1)" ->
// "1,600,000(1)(1)(1)"), leaving decimals after a point alone, so a value
// reads the same in the substitution as in its result.
func GroupDigits(s string) string {
	var b strings.Builder
	for i := 0; i < len(s); {
		c := s[i]
		if c < '0' || c > '9' || (i > 0 && (s[i-1] == '.' || s[i-1] == ',')) {
			b.WriteByte(c)
			i++
			continue
		}
		j := i
		for j < len(s) && s[j] >= '0' && s[j] <= '9' {
			j++
		}
		run := s[i:j]
		if len(run) >= 5 {
			for k, d := range run {
				if k > 0 && (len(run)-k)%3 == 0 {
					b.WriteByte(',')
				}
				b.WriteRune(d)
			}
		} else {
			b.WriteString(run)
		}
		i = j
	}
	return b.String()
}
