package project

import (
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"
)

// Length spellings (common practice, no source): feet and inches as
// framers write them, or one number with a unit. 1 in = 25.4 mm exactly
// (NIST SP 811, appendix B).
var (
	// 14'-6", 14' 6", 14'6, 14ft 6in, 1'-4 1/2", 14', 14ft, 14 feet
	feetRE = regexp.MustCompile(`^(\d+(?:\.\d*)?|\.\d+)\s*(?:'|ft|feet|foot)\s*(.*)$`)
	// the inches after the feet: 6", 6, 6in, 4 1/2", 1/2"
	inchRestRE = regexp.MustCompile(`^-?\s*(?:(\d+(?:\.\d*)?|\.\d+)(?:(?:\s+|\s*-\s*)(\d+)\s*/\s*(\d+))?|(\d+)\s*/\s*(\d+))\s*(?:"|''|in|inch|inches)?$`)
	// one number with its unit: 168in, 168", 3-1/2", 3 1/2 in, 4.2m, 350mm, 35cm, 1/2"
	unitRE = regexp.MustCompile(`^(?:(\d+(?:\.\d*)?|\.\d+)(?:(?:\s+|\s*-\s*)(\d+)\s*/\s*(\d+))?|(\d+)\s*/\s*(\d+))\s*("|''|in|inch|inches|mm|cm|m)$`)
	bareRE = regexp.MustCompile(`^(\d+(?:\.\d*)?|\.\d+)$`)
)

// unitToIn is the number of inches in one unit of unitRE.
var unitToIn = map[string]float64{`"`: 1, "''": 1, "in": 1, "inch": 1, "inches": 1, "mm": 1 / 25.4, "cm": 1 / 2.54, "m": 1 / 0.0254}

// ParseLength reads a length as the trade writes it and returns inches:
// feet and inches (14'-6", 14' 6", 14'6", 14ft 6in, 14', 14ft, 1'-4 1/2"),
// or a number with a unit (168in, 168", 6", 3-1/2", 4.2m, 350mm, 35cm).
// A bare number is refused, naming both readings ("14 in or 14 ft? write
// 14ft or 14in"), except 0. Negative, infinite and not-a-number lengths
// are refused.
func ParseLength(s string) (float64, error) {
	return readLength(s, false)
}

// ParseLengthIn is ParseLength for a value whose unit the key or flag
// names (bearing_in): a bare number is inches.
func ParseLengthIn(s string) (float64, error) {
	return readLength(s, true)
}

func readLength(s string, bareIsInches bool) (float64, error) {
	t := strings.ToLower(strings.TrimSpace(s))
	t = strings.NewReplacer("”", `"`, "“", `"`, "″", `"`, "′", "'", "’", "'", "\u00a0", " ").Replace(t)
	bad := fmt.Errorf("length %q: want feet and inches or a number with its unit, such as 14'-6\", 14ft, 168in, 3 1/2\", 4.2m or 350mm", s)
	var in float64
	switch {
	case bareRE.MatchString(t):
		v, _ := strconv.ParseFloat(t, 64)
		if v != 0 && !bareIsInches {
			n := strings.TrimSuffix(strings.TrimSuffix(t, "."), ".0")
			return 0, fmt.Errorf("%s in or %s ft? write %sft or %sin", n, n, n, n)
		}
		in = v
	case feetRE.MatchString(t):
		m := feetRE.FindStringSubmatch(t)
		ft, _ := strconv.ParseFloat(m[1], 64)
		in = ft * 12
		if rest := strings.TrimSpace(m[2]); rest != "" {
			r := inchRestRE.FindStringSubmatch(rest)
			if r == nil {
				return 0, bad
			}
			in += numberWithFraction(r[1], r[2], r[3], r[4], r[5])
		}
	case unitRE.MatchString(t):
		m := unitRE.FindStringSubmatch(t)
		in = numberWithFraction(m[1], m[2], m[3], m[4], m[5]) * unitToIn[m[6]]
	default:
		return 0, bad
	}
	if math.IsNaN(in) || math.IsInf(in, 0) || in < 0 {
		return 0, bad
	}
	return in, nil
}

// numberWithFraction adds a whole or decimal number and a fraction n/d
// ("4 1/2"), or reads a fraction alone (fn/fd).
func numberWithFraction(num, n, d, fn, fd string) float64 {
	if fn != "" {
		return fraction(fn, fd)
	}
	v, _ := strconv.ParseFloat(num, 64)
	if n != "" {
		v += fraction(n, d)
	}
	return v
}

// fraction is n/d, or NaN when d is 0.
func fraction(n, d string) float64 {
	a, _ := strconv.ParseFloat(n, 64)
	b, _ := strconv.ParseFloat(d, 64)
	if b == 0 {
		return math.NaN()
	}
	return a / b
}
