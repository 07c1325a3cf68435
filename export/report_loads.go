package export

import (
	"fmt"
	"strconv"
	"strings"
)

// Load names of a combination as written in ASCE 7-16 2.4.1.
const (
	loadD  = "D"
	loadL  = "L"
	loadLr = "Lr"
	loadS  = "S"
	loadW  = "W"
)

// comboCase is one case of a combination: a load factor for each load name.
// "(Lr or S)" gives one case per alternative.
type comboCase map[string]float64

// parseCombo reads a combination such as "D+0.75L+0.75(Lr or S)" or
// "D+0.75L+0.75(0.6W)" into its cases, by the grammar
//
//	expr := term { "+" term }
//	term := [number ["*"]] atom
//	atom := name | "(" expr { "or" expr } ")"
//
// with names D, L, Lr (or LR), S and W. The report uses it only to print
// the line load of each combination; the checks themselves come from the
// engine's traces.
func parseCombo(s string) ([]comboCase, error) {
	p := comboReader{src: strings.Join(strings.Fields(s), "")}
	cases, err := p.expr()
	if err == nil && p.pos < len(p.src) {
		err = fmt.Errorf("unexpected %q at column %d", p.src[p.pos:p.pos+1], p.pos+1)
	}
	if err != nil {
		return nil, fmt.Errorf("combination %q: %w", s, err)
	}
	return cases, nil
}

type comboReader struct {
	src string
	pos int
}

func (p *comboReader) expr() ([]comboCase, error) {
	acc := []comboCase{{}}
	for {
		t, err := p.term()
		if err != nil {
			return nil, err
		}
		next := make([]comboCase, 0, len(acc)*len(t))
		for _, a := range acc {
			for _, b := range t {
				c := comboCase{}
				for k, v := range a {
					c[k] += v
				}
				for k, v := range b {
					c[k] += v
				}
				next = append(next, c)
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

func (p *comboReader) term() ([]comboCase, error) {
	f := 1.0
	start := p.pos
	for p.pos < len(p.src) && (p.src[p.pos] == '.' || (p.src[p.pos] >= '0' && p.src[p.pos] <= '9')) {
		p.pos++
	}
	if p.pos > start {
		v, err := strconv.ParseFloat(p.src[start:p.pos], 64)
		if err != nil || !finite(v) || v <= 0 {
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
	for _, c := range cases {
		for k := range c {
			c[k] *= f
		}
	}
	return cases, nil
}

func (p *comboReader) atom() ([]comboCase, error) {
	if p.pos >= len(p.src) {
		return nil, fmt.Errorf("missing load name at column %d", p.pos+1)
	}
	if p.src[p.pos] == '(' {
		p.pos++
		var all []comboCase
		for {
			c, err := p.expr()
			if err != nil {
				return nil, err
			}
			all = append(all, c...)
			if strings.HasPrefix(p.src[p.pos:], "or") {
				p.pos += 2
				continue
			}
			break
		}
		if p.pos >= len(p.src) || p.src[p.pos] != ')' {
			return nil, fmt.Errorf("missing ) at column %d", p.pos+1)
		}
		p.pos++
		return all, nil
	}
	for _, name := range []string{"Lr", "LR", "D", "L", "S", "W"} {
		if strings.HasPrefix(p.src[p.pos:], name) {
			p.pos += len(name)
			if name == "LR" {
				name = loadLr
			}
			return []comboCase{{name: 1}}, nil
		}
	}
	return nil, fmt.Errorf("unknown load name at column %d (want D, L, Lr, S or W)", p.pos+1)
}

// comboLoad is one line of the "loads per combination" table.
type comboLoad struct {
	Combo, Case, Subst, WPlf, CD string
	// PSubst and PLb: the point loads' sum, for a member that carries any
	PSubst, PLb string
}

// zoneLineLoads returns w = p x trib for each load of the zone, plf, with
// W split into toward (+) and away from (-) the member.
func zoneLineLoads(z *Zone, tribIn float64) map[string]float64 {
	ft := tribIn / 12
	return map[string]float64{
		loadD: z.DeadPsf * ft, loadL: z.LivePsf * ft, loadLr: z.RoofLivePsf * ft, loadS: z.SnowPsf * ft,
		"W down": z.WindDownPsf * ft, "W up": -z.WindUpPsf * ft,
	}
}

// comboLoads evaluates each combination's line load on a member of zone z
// and tributary width tribIn: w = sum of factor x line load, one line per
// case, leaving out cases whose loads other than D are all zero (ASCE 7-16
// 2.4.1 combinations with an absent load add nothing) and cases that repeat
// an earlier one once the absent loads are dropped. p holds the member's
// point loads added up by load type (nil: none): a load type present only
// in them makes a case too, and each case adds them up as the line loads
// (P = sum of factor x P). cd maps a load case (caseKey of the engine's
// case name) to its CD from the member's factors.
func comboLoads(combos []string, z *Zone, tribIn float64, p map[string]float64, cd map[string]float64) ([]comboLoad, []string) {
	w := zoneLineLoads(z, tribIn)
	var out []comboLoad
	var problems []string
	seen := map[string]bool{}
	for _, name := range combos {
		cases, err := parseCombo(name)
		if err != nil {
			problems = append(problems, err.Error())
			continue
		}
		for _, c := range cases {
			for _, dir := range windCases(c, w, p) {
				l, ok := evalCase(c, w, p, dir)
				if !ok || seen[l.Case] {
					continue
				}
				seen[l.Case] = true
				l.Combo = name
				if v, ok := cd[caseKey(l.Case)]; ok {
					l.CD = fmtNum(v)
				}
				out = append(out, l)
			}
		}
	}
	return out, problems
}

// evalCase writes one case out, leaving out loads neither the zone nor
// the point loads p have: "D + 0.75 L" = "12 + 0.75(40)" = 42. ok is false
// when the case has no load other than D and is not D alone.
func evalCase(c comboCase, w, p map[string]float64, dir string) (comboLoad, bool) {
	var l comboLoad
	total, totalP, live, terms, pterms := 0.0, 0.0, false, 0, 0
	term := func(sum *string, n *int, f, v float64) {
		if *n > 0 {
			*sum += " + "
		}
		*n++
		if f == 1 {
			*sum += fmtNum(v)
		} else {
			*sum += fmtNum(f) + "(" + fmtNum(v) + ")"
		}
	}
	for _, k := range []string{loadD, loadL, loadLr, loadS, loadW} {
		f, ok := c[k]
		if !ok {
			continue
		}
		name := k
		if k == loadW {
			name = dir
		}
		wk, pk := w[name], p[name]
		if wk == 0 && pk == 0 {
			continue
		}
		if k != loadD {
			live = true
		}
		if l.Case != "" {
			l.Case += " + "
		}
		if f == 1 {
			l.Case += name
		} else {
			l.Case += fmtNum(f) + " " + name
		}
		if wk != 0 {
			total += f * wk
			term(&l.Subst, &terms, f, wk)
		}
		if pk != 0 {
			totalP += f * pk
			term(&l.PSubst, &pterms, f, pk)
		}
	}
	if !live && !(len(c) == 1 && c[loadD] != 0) {
		return l, false
	}
	l.WPlf = fmtNum(total)
	if p != nil {
		l.PLb = fmtNum(totalP)
	}
	return l, true
}

// windCases returns the wind directions a case is evaluated for: none when
// it has no W, else W down and W up (those with a load, on the tributary
// width or in the point loads p).
func windCases(c comboCase, w, p map[string]float64) []string {
	if _, ok := c[loadW]; !ok {
		return []string{""}
	}
	var dirs []string
	for _, d := range []string{"W down", "W up"} {
		if w[d] != 0 || p[d] != 0 {
			dirs = append(dirs, d)
		}
	}
	if len(dirs) == 0 {
		return []string{"W down"} // zero wind: dropped as trivial
	}
	return dirs
}

// caseKey folds a load-case name for matching the engine's names with the
// report's: spaces and parentheses dropped, so "D + 0.6 W up" and
// "D+0.6W(up)" are both "D+0.6Wup".
func caseKey(s string) string {
	return strings.NewReplacer(" ", "", "(", "", ")", "").Replace(s)
}
