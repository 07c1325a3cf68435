package check

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"
)

// Combo is one ASD load combination as written, such as
// "D+0.75L+0.75(Lr or S)". It may stand for several cases: each "or" is
// one case per alternative, and a combination with W is evaluated with the
// wind toward the member (W down) and away from it (W up).
type Combo struct {
	Name  string                  // as written, spaces removed
	Cases [][numLoadTypes]float64 // load factors of each alternative case
}

// defaultComboSpecs are the basic ASD combinations of ASCE 7-16 2.4.1 for
// the loads framecheck knows (D, L, Lr, S, W; no rain, flood, ice or
// earthquake): combinations 1, 2, 3, 4, 5 (W part), 6a (W part) and 7.
// Checked against the ASD basic combinations of ASCE 7-10 2.4.1
// (engineeringexamples.net, "Nominal Load Combinations for Allowable Stress
// Design in ASCE 7-10") and ASCE 7-22 2.4.1 (callout.app/codes/asce-7-22-2-4-1),
// whose D, L, Lr, S and W terms are the same as these; the ASCE 7-16 text
// itself was not found in a stored copy.
var defaultComboSpecs = []string{
	"D",
	"D+L",
	"D+(Lr or S)",
	"D+0.75L+0.75(Lr or S)",
	"D+0.6W",
	"D+0.75L+0.75(0.6W)+0.75(Lr or S)",
	"0.6D+0.6W",
}

// DefaultCombos returns the ASCE 7-16 2.4.1 ASD combinations.
func DefaultCombos() []Combo {
	c, err := ParseCombos(defaultComboSpecs)
	if err != nil {
		panic("check: default combinations: " + err.Error())
	}
	return c
}

// ParseCombos reads combinations such as "D+0.75L+0.75(Lr or S)" or
// "0.6D+0.6W". Load names are D, L, Lr, S and W (case-sensitive L and Lr;
// "Lr" may also be written "LR"); a number before a name or a parenthesis
// multiplies it; "(A or B)" gives one case for each alternative.
func ParseCombos(specs []string) ([]Combo, error) {
	out := make([]Combo, 0, len(specs))
	for i, s := range specs {
		p := comboParser{src: strings.Join(strings.Fields(s), "")}
		cases, err := p.expr()
		if err == nil && p.pos < len(p.src) {
			err = fmt.Errorf("unexpected %q at column %d", p.src[p.pos:p.pos+1], p.pos+1)
		}
		if err == nil && len(cases) == 0 {
			err = fmt.Errorf("empty combination")
		}
		if err != nil {
			return nil, fmt.Errorf("combination %d %q: %w", i+1, s, err)
		}
		out = append(out, Combo{Name: p.src, Cases: cases})
	}
	return out, nil
}

// comboParser is a recursive-descent parser of the grammar
//
//	expr := term { "+" term }
//	term := [number ["*"]] atom
//	atom := name | "(" expr { "or" expr } ")"
type comboParser struct {
	src string
	pos int
}

type factorSet = [numLoadTypes]float64

func (p *comboParser) expr() ([]factorSet, error) {
	acc := []factorSet{{}}
	for {
		t, err := p.term()
		if err != nil {
			return nil, err
		}
		var next []factorSet
		for _, a := range acc {
			for _, b := range t {
				var s factorSet
				for k := range s {
					s[k] = a[k] + b[k]
				}
				next = append(next, s)
			}
		}
		acc = next
		if p.pos < len(p.src) && p.src[p.pos] == '+' {
			p.pos++
			continue
		}
		return acc, nil
	}
}

func (p *comboParser) term() ([]factorSet, error) {
	f := 1.0
	start := p.pos
	for p.pos < len(p.src) && (p.src[p.pos] == '.' || unicode.IsDigit(rune(p.src[p.pos]))) {
		p.pos++
	}
	if p.pos > start {
		v, err := strconv.ParseFloat(p.src[start:p.pos], 64)
		if err != nil || v <= 0 || math.IsInf(v, 0) {
			return nil, fmt.Errorf("bad factor %q at column %d", p.src[start:p.pos], start+1)
		}
		f = v
		if p.pos < len(p.src) && p.src[p.pos] == '*' {
			p.pos++
		}
	}
	cases, err := p.atom()
	if err != nil {
		return nil, err
	}
	for i := range cases {
		for k := range cases[i] {
			cases[i][k] *= f
		}
	}
	return cases, nil
}

func (p *comboParser) atom() ([]factorSet, error) {
	if p.pos >= len(p.src) {
		return nil, fmt.Errorf("want a load name (D, L, Lr, S, W) at the end")
	}
	if p.src[p.pos] == '(' {
		p.pos++
		var all []factorSet
		for {
			c, err := p.expr()
			if err != nil {
				return nil, err
			}
			all = append(all, c...)
			if strings.HasPrefix(strings.ToLower(p.src[p.pos:]), "or") {
				p.pos += 2
				continue
			}
			break
		}
		if p.pos >= len(p.src) || p.src[p.pos] != ')' {
			return nil, fmt.Errorf("want ) at column %d", p.pos+1)
		}
		p.pos++
		return all, nil
	}
	for _, n := range []struct {
		s string
		t LoadType
	}{{"Lr", LoadLr}, {"LR", LoadLr}, {"D", LoadD}, {"L", LoadL}, {"S", LoadS}, {"W", LoadW}} {
		if strings.HasPrefix(p.src[p.pos:], n.s) {
			// "or" after a name inside parentheses is read by atom's caller.
			p.pos += len(n.s)
			var s factorSet
			s[n.t] = 1
			return []factorSet{s}, nil
		}
	}
	return nil, fmt.Errorf("unknown load %q at column %d; valid: D, L, Lr, S, W", p.src[p.pos:p.pos+1], p.pos+1)
}

// ComboDurationFactor returns CD of a load case: that of its
// shortest-duration load with a non-zero load (NDS 2018 2.3.2), given the
// load magnitudes present (present[t] true when load type t is non-zero).
func ComboDurationFactor(factors [numLoadTypes]float64, present [numLoadTypes]bool) float64 {
	cd := 0.0
	for t := LoadType(0); t < numLoadTypes; t++ {
		if factors[t] > 0 && present[t] {
			cd = math.Max(cd, LoadDurationFactor(t))
		}
	}
	if cd == 0 {
		return LoadDurationFactor(LoadD)
	}
	return cd
}

// DeflectionLimits returns the IBC 2018 Table 1604.3 limits L/live and
// L/total for a member use ("floor" or "roof") and ceiling ("plaster",
// "non-plaster" or "none"): floor 360 and 240; roof with a plaster or
// stucco ceiling 360 and 240, non-plaster ceiling 240 and 180, no ceiling
// 180 and 120. Floors ignore the ceiling. Checked against IBC Table 1604.3
// as published at up.codes/s/serviceability (the 2015 edition and a later
// one, same rows): agrees.
func DeflectionLimits(use, ceiling string) (live, total float64, err error) {
	switch use {
	case "floor":
		return 360, 240, nil
	case "roof":
		switch ceiling {
		case "plaster", "stucco":
			return 360, 240, nil
		case "non-plaster", "nonplaster", "":
			return 240, 180, nil
		case "none":
			return 180, 120, nil
		}
		return 0, 0, fmt.Errorf("ceiling %q: want plaster, non-plaster or none", ceiling)
	}
	return 0, 0, fmt.Errorf("use %q: want floor or roof", use)
}
