package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"framecheck/check"
	"framecheck/project"
)

// lengthFlag is a flag.Value holding one length in inches.
type lengthFlag struct{ in float64 }

func (l *lengthFlag) String() string { return project.FmtNum(l.in) + "in" }

func (l *lengthFlag) Set(s string) error {
	v, err := project.ParseLength(s)
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
		s[i] = project.FmtNum(v)
	}
	return strings.Join(s, ",")
}

func (l *spanFlag) Set(s string) error {
	for _, part := range strings.Split(s, ",") {
		v, err := project.ParseLength(part)
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
	at, err := project.ParseLength(strings.TrimSpace(parts[0]))
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
