package export

import (
	"framecheck/export/internal/fmtx"
	"math"
	"strings"
	"testing"

	"golang.org/x/net/html"
)

// governing returns the member of a mark with the largest ratio, as the
// report's calculation must show.
func repGoverning(r *Results, mark string) *Member {
	var g *Member
	for i := range r.Members {
		m := &r.Members[i]
		if m.Mark == mark && (g == nil || m.MaxRatio > g.MaxRatio) {
			g = m
		}
	}
	return g
}

func TestWriteReportMarkTraces(t *testing.T) {
	r, g := loadReportFixture(t)
	doc, _ := repWriteParse(t, r, g)
	var sawSteps, sawSubst bool
	for _, mk := range r.Marks {
		art := repByID(doc, "mark-"+mk.Mark)
		if art == nil {
			t.Errorf("no calculation for mark %s", mk.Mark)
			continue
		}
		m := repGoverning(r, mk.Mark)
		if repAttr(art, "data-member") != m.ID {
			t.Errorf("%s: calculation of %s, want the governing member %s", mk.Mark, repAttr(art, "data-member"), m.ID)
		}
		var checks []*html.Node
		repWalk(art, func(n *html.Node) {
			if n.Type == html.ElementNode && n.Data == "div" && repHasClass(n, "check") {
				checks = append(checks, n)
			}
		})
		if len(checks) != len(m.Checks) {
			t.Errorf("%s: %d checks written, want %d", mk.Mark, len(checks), len(m.Checks))
			continue
		}
		for i, c := range m.Checks {
			n := checks[i]
			if repAttr(n, "data-kind") != c.Kind {
				t.Errorf("%s check %d: kind %q, want %q", mk.Mark, i, repAttr(n, "data-kind"), c.Kind)
			}
			lines := repEqLines(n)
			if len(lines) != len(c.Trace) {
				t.Errorf("%s %s: %d trace lines, want %d", mk.Mark, c.Kind, len(lines), len(c.Trace))
				continue
			}
			for j, it := range c.Trace {
				l := lines[j]
				// as an engineer writes it: F′b for Fb', Δ, √, ² (mathHTML)
				if l["sym"] != mathText(it.Name) {
					t.Errorf("%s %s line %d: symbol %q, want %q", mk.Mark, c.Kind, j, l["sym"], mathText(it.Name))
				}
				if !repCloseToUnit(l["val"], it.Value, it.Unit) {
					t.Errorf("%s %s %s: value %q, want %g", mk.Mark, c.Kind, it.Name, l["val"], it.Value)
				}
				if it.Subst != "" {
					sawSubst = true
					if l["s"] != powers.Replace(fmtx.GroupDigits(it.Subst)) || l["f"] != mathText(it.Formula) {
						t.Errorf("%s %s %s: %q = %q, want %q = %q", mk.Mark, c.Kind, it.Name, l["f"], l["s"], it.Formula, it.Subst)
					}
				}
				if it.Source != "" && l["src"] != it.Source {
					t.Errorf("%s %s %s: source %q, want %q", mk.Mark, c.Kind, it.Name, l["src"], it.Source)
				}
			}
			res := repText(repFirstClass(n, "result"))
			if !strings.Contains(res, strings.TrimSpace(repText(repFirstClass(n, "ratio")))) || !repCloseTo(repText(repFirstClass(n, "ratio")), c.Ratio) {
				t.Errorf("%s %s: result %q, want ratio %.3f", mk.Mark, c.Kind, res, c.Ratio)
			}
			if ok := c.Ratio <= 1; ok != strings.HasSuffix(res, ": OK") {
				t.Errorf("%s %s: result %q for ratio %.3f", mk.Mark, c.Kind, res, c.Ratio)
			}
		}
		// The blocking-row iterations, one table row each.
		var steps *html.Node
		repWalk(art, func(n *html.Node) {
			if n.Type == html.ElementNode && n.Data == "table" && repHasClass(n, "steps") {
				steps = n
			}
		})
		if len(m.BlockingSteps) == 0 {
			if steps != nil {
				t.Errorf("%s: blocking table without solver steps", mk.Mark)
			}
			continue
		}
		sawSteps = true
		rs := repRows(steps)
		if len(rs) != len(m.BlockingSteps)+1 {
			t.Fatalf("%s: %d step rows, want %d", mk.Mark, len(rs)-1, len(m.BlockingSteps))
		}
		for i, s := range m.BlockingSteps {
			row := rs[i+1]
			if !repCloseTo(row[0], float64(s.RowsPerSpan)) || !repCloseTo(row[1], s.LuIn) || !repCloseTo(row[2], s.CL) || !repCloseTo(row[3], s.Ratio) {
				t.Errorf("%s step %d: %v, want %+v", mk.Mark, i, row, s)
			}
		}
	}
	if !sawSteps || !sawSubst {
		t.Errorf("fixture exercised blocking steps %v, substitutions %v; want both", sawSteps, sawSubst)
	}
}

// eqLines returns the parts of each calculation line under n by class.
func repEqLines(n *html.Node) []map[string]string {
	var out []map[string]string
	repWalk(n, func(e *html.Node) {
		if e.Type != html.ElementNode || e.Data != "div" || !repHasClass(e, "eq") {
			return
		}
		parts := map[string]string{}
		for c := e.FirstChild; c != nil; c = c.NextSibling {
			if c.Type == html.ElementNode {
				parts[repAttr(c, "class")] = repText(c)
			}
		}
		out = append(out, parts)
	})
	return out
}

func TestParseCombo(t *testing.T) {
	// ASCE 7-16 2.4.1 combinations 4 and 6a as written there.
	cases, err := parseCombo("D + 0.75L + 0.75(Lr or S)")
	if err != nil {
		t.Fatal(err)
	}
	if len(cases) != 2 || cases[0][loadLr] != 0.75 || cases[1][loadS] != 0.75 || cases[0][loadL] != 0.75 || cases[1][loadD] != 1 {
		t.Errorf("cases %v", cases)
	}
	cases, err = parseCombo("D+0.75L+0.75(0.6W)+0.75(Lr or S)")
	if err != nil {
		t.Fatal(err)
	}
	if len(cases) != 2 || math.Abs(cases[0][loadW]-0.45) > 1e-12 {
		t.Errorf("cases %v, want W factor 0.75 x 0.6 = 0.45", cases)
	}
	for _, bad := range []string{"", "D+", "D+Q", "D+(L or S", "0D+L", "D+1e999L"} {
		if _, err := parseCombo(bad); err == nil {
			t.Errorf("parseCombo(%q): no error", bad)
		}
	}
}

func TestComboLoads(t *testing.T) {
	// w = p x trib: 10 psf x 16 in / 12 = 13.333 plf; 40 psf -> 53.333 plf;
	// closed form, no source needed beyond the arithmetic.
	z := &Zone{Name: "F", DeadPsf: 10, LivePsf: 40, WindUpPsf: 30}
	got, probs := comboLoads([]string{"D", "D+L", "D+(Lr or S)", "D+0.75L+0.75(Lr or S)", "0.6D+0.6W", "D+X"}, z, 16, nil, map[string]float64{"D+L": 1})
	if len(probs) != 1 {
		t.Errorf("problems %v, want one for D+X", probs)
	}
	want := map[string]float64{
		"D":   13.333,
		"D+L": 66.667,
		// both cases reduce to D + 0.75 L once Lr and S (absent) drop out: one line
		"D+0.75L+0.75(Lr or S)": 13.333 + 0.75*53.333,
		"0.6D+0.6W":             0.6*13.333 - 0.6*40, // net uplift: 30 psf x 16/12 = 40 plf away
	}
	if len(got) != len(want) {
		t.Fatalf("%d lines %+v, want %d (D+(Lr or S) has no Lr or S and is left out)", len(got), got, len(want))
	}
	for _, l := range got {
		w, ok := want[l.Combo]
		if !ok || !repCloseTo(l.WPlf, w) {
			t.Errorf("%s %s: w = %s, want %.3f", l.Combo, l.Case, l.WPlf, w)
		}
		if l.Combo == "D+0.75L+0.75(Lr or S)" && l.Case != "D + 0.75 L" {
			t.Errorf("case %q, want D + 0.75 L", l.Case)
		}
		if l.Combo == "D+L" && l.CD != "1" {
			t.Errorf("D+L: CD %q, want 1 from the factors", l.CD)
		}
	}
}

func TestFmtNum(t *testing.T) {
	for _, c := range []struct {
		v    float64
		want string
	}{
		{113.04, "113"}, {916.289, "916.3"}, {1138.6, "1,139"}, {1600000, "1,600,000"}, {0.8049, "0.805"},
		{-0.0001, "0"}, {12.5, "12.5"}, {-2500, "-2,500"}, {math.NaN(), "n/a"}, {math.Inf(-1), "n/a"},
	} {
		if got := fmtNum(c.v); got != c.want {
			t.Errorf("fmtNum(%v) = %q, want %q", c.v, got, c.want)
		}
	}
}

func TestWordy(t *testing.T) {
	for s, want := range map[string]bool{
		"b d^2 / 6": false, "sqrt(le d / b^2)": false, "1.63 lu + 3 d": false,
		"largest moment compressing this edge": true, "wet service": true, "": false,
	} {
		if wordy(s) != want {
			t.Errorf("wordy(%q) = %v", s, !want)
		}
	}
}
