package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// lengthUnits maps the unit suffixes a length flag takes to inches.
var lengthUnits = []struct {
	suffix string
	toIn   float64
}{
	{"in", 1}, {`"`, 1}, {"ft", 12}, {"'", 12}, {"mm", 1 / 25.4}, {"cm", 1 / 2.54}, {"m", 1 / 0.0254},
}

// parseLength reads a length in inches from "168", "168in", "14ft",
// "14'", "14'6\"", "4.2m", "350mm" or "35cm" (1 in = 25.4 mm exactly).
// Negative, infinite and not-a-number lengths are refused.
func parseLength(s string) (float64, error) {
	t := strings.ToLower(strings.ReplaceAll(s, " ", ""))
	if ft, in, ok := strings.Cut(t, "'"); ok && in != "" {
		f, err1 := strconv.ParseFloat(ft, 64)
		i, err2 := parseLength(strings.TrimSuffix(in, `"`))
		if err1 != nil || err2 != nil || f < 0 || math.IsInf(f, 0) {
			return 0, fmt.Errorf("length %q: want feet'inches\" such as 14'6\"", s)
		}
		return f*12 + i, nil
	}
	factor := 1.0
	for _, u := range lengthUnits {
		if strings.HasSuffix(t, u.suffix) {
			t, factor = strings.TrimSuffix(t, u.suffix), u.toIn
			break
		}
	}
	v, err := strconv.ParseFloat(t, 64)
	if err != nil || v < 0 || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, fmt.Errorf("length %q: want a non-negative number of inches, or one with a unit (14ft, 3.5in, 4.2m, 350mm)", s)
	}
	return v * factor, nil
}

// lengthFlag is a flag.Value holding one length in inches.
type lengthFlag struct{ in float64 }

func (l *lengthFlag) String() string { return fmtNum(l.in) }

func (l *lengthFlag) Set(s string) error {
	v, err := parseLength(s)
	if err != nil {
		return err
	}
	l.in = v
	return nil
}

// spanFlag is a flag.Value collecting spans in inches; it may be repeated
// and each value may be a comma list.
type spanFlag struct{ in []float64 }

func (l *spanFlag) String() string {
	s := make([]string, len(l.in))
	for i, v := range l.in {
		s[i] = fmtNum(v)
	}
	return strings.Join(s, ",")
}

func (l *spanFlag) Set(s string) error {
	for _, part := range strings.Split(s, ",") {
		v, err := parseLength(part)
		if err != nil {
			return err
		}
		if v == 0 {
			return fmt.Errorf("span %q: must be greater than 0", part)
		}
		l.in = append(l.in, v)
	}
	return nil
}

// fmtIn formats a length in inches with its feet equivalent when it is
// more than a foot: "168 in (14 ft)", "170 in (14.17 ft)".
func fmtIn(in float64) string {
	s := strconv.FormatFloat(in, 'f', -1, 64)
	if r := math.Round(in*100) / 100; r != in {
		s = strconv.FormatFloat(r, 'f', -1, 64)
	}
	if in < 12 {
		return s + " in"
	}
	return fmt.Sprintf("%s in (%s ft)", s, strconv.FormatFloat(math.Round(in/12*100)/100, 'f', -1, 64))
}
