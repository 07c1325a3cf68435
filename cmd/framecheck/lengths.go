package main

import (
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"

	"framecheck/check"
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

// parseLength reads a length as the trade writes it and returns inches:
// feet and inches (14'-6", 14' 6", 14'6", 14ft 6in, 14', 14ft, 1'-4 1/2"),
// or a number with a unit (168in, 168", 6", 3-1/2", 4.2m, 350mm, 35cm).
// A bare number is refused, naming both readings ("14 in or 14 ft? write
// 14ft or 14in"), except 0. Negative, infinite and not-a-number lengths
// are refused.
func parseLength(s string) (float64, error) {
	return readLength(s, false)
}

// parseLengthIn is parseLength for a value whose unit the key or flag
// names (bearing_in): a bare number is inches.
func parseLengthIn(s string) (float64, error) {
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

// lengthFlag is a flag.Value holding one length in inches.
type lengthFlag struct{ in float64 }

func (l *lengthFlag) String() string { return fmtNum(l.in) + "in" }

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

// pointFlag collects --point values: POS,TYPE=LB,... with POS a length
// from the first bearing (trade forms, unit required) and TYPE one of D,
// L, Lr, S, Wdown, Wup (lb; Wup a magnitude).
type pointFlag struct{ loads []check.PointLoad }

func (p *pointFlag) String() string { return fmt.Sprintf("%d point loads", len(p.loads)) }

func (p *pointFlag) Set(s string) error {
	parts := strings.Split(s, ",")
	at, err := parseLength(strings.TrimSpace(parts[0]))
	if err != nil {
		return fmt.Errorf("position: %v", err)
	}
	if len(parts) < 2 {
		return fmt.Errorf("%q: want POS,TYPE=LB[,TYPE=LB...], such as 7ft,D=400,L=300", s)
	}
	pl := check.PointLoad{AtIn: at}
	for _, kv := range parts[1:] {
		k, v, ok := strings.Cut(strings.TrimSpace(kv), "=")
		n, err := strconv.ParseFloat(strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(v), "lb")), 64)
		if !ok || err != nil || !(n >= 0) || math.IsInf(n, 0) {
			return fmt.Errorf("%q: want TYPE=LB with a load of 0 lb or more, such as D=400", kv)
		}
		switch strings.ToLower(strings.TrimSpace(k)) {
		case "d":
			pl.DeadLb += n
		case "l":
			pl.LiveLb += n
		case "lr":
			pl.RoofLiveLb += n
		case "s":
			pl.SnowLb += n
		case "wdown":
			pl.WindDownLb += n
		case "wup":
			pl.WindUpLb += n
		default:
			return fmt.Errorf("%q: load type %q: want D, L, Lr, S, Wdown or Wup", kv, k)
		}
	}
	p.loads = append(p.loads, pl)
	return nil
}
