package export

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestReportPackageGoverning: the short package writes out one check per
// mark, the one with the largest ratio, and tabulates the others; the
// title page and the header carry the project and the tool version.
func TestReportPackageGoverning(t *testing.T) {
	r, g := loadReportFixture(t)
	r.ToolVersion = "v1.2.3-test"
	r.Project = ProjectInfo{Name: "Garage loft", Number: "2026-041", Designer: "A. Designer", Revision: "B", Date: "2026-12-04"}
	dir := t.TempDir()
	full, short := filepath.Join(dir, "full.html"), filepath.Join(dir, "short.html")
	if err := WriteReportWith(full, r, g, reportWhen, ReportOptions{}); err != nil {
		t.Fatal(err)
	}
	if err := WriteReportWith(short, r, g, reportWhen, ReportOptions{Package: PackageGoverning}); err != nil {
		t.Fatal(err)
	}
	if err := WriteReportWith(filepath.Join(dir, "x.html"), r, g, reportWhen, ReportOptions{Package: "all"}); err == nil {
		t.Error("package \"all\" accepted")
	}
	fb, _ := os.ReadFile(full)
	sb, _ := os.ReadFile(short)
	fs, ss := string(fb), string(sb)
	// the short package writes out every mark but those covered by
	// another's calculation (dropCovered), which it lists
	covered := 0
	if i := strings.Index(ss, `id="covered"`); i >= 0 {
		tbl, _, _ := strings.Cut(ss[i:], "</table>")
		covered = strings.Count(tbl, "<tr><td>")
	}
	full0 := strings.Count(fs, `<article class="calc"`)
	marks := strings.Count(ss, `<article class="calc"`)
	if full0 == 0 || marks+covered != full0 {
		t.Fatalf("calculations: %d full, %d short and %d covered", full0, marks, covered)
	}
	// one check written out per mark, the rest in "Other checks"
	if got := strings.Count(ss, `<div class="check `); got != marks {
		t.Errorf("short package writes out %d checks, want one per mark (%d)", got, marks)
	}
	if strings.Count(fs, `<div class="check `) <= marks || strings.Contains(fs, "Other checks (not governing)") {
		t.Error("the full package should write out every check")
	}
	if strings.Count(ss, "Other checks (not governing)") == 0 || !strings.Contains(ss, `class="pkg-governing"`) {
		t.Error("short package lacks its table of other checks or its print class")
	}
	// The check written out is the one with the largest ratio: no ratio in
	// a mark's table of other checks exceeds it.
	arts := strings.Split(ss, `<article class="calc"`)[1:]
	compared := 0
	for _, a := range arts {
		a = a[:strings.Index(a, "</article>")]
		i := strings.Index(a, `<span class="ratio">`)
		if i < 0 {
			continue
		}
		gov := a[i+len(`<span class="ratio">`):]
		gov = gov[:strings.Index(gov, "<")]
		o := strings.Index(a, `<table class="others">`)
		if o < 0 {
			continue
		}
		for _, row := range strings.Split(a[o:], "<tr>")[2:] {
			cells := strings.Split(row, `<td class="n">`)
			if len(cells) < 4 {
				continue
			}
			other := cells[3][:strings.Index(cells[3], "<")]
			compared++
			if parseF(other) > parseF(gov) {
				t.Errorf("a check with ratio %s is tabulated while %s is written out", other, gov)
			}
		}
	}
	if compared == 0 {
		t.Error("no tabulated check compared")
	}
	for _, want := range []string{"Garage loft", "project 2026-041", "designer A. Designer", "revision B", "framecheck v1.2.3-test",
		`id="title-page"`, "Page &#34; counter(page)"} {
		if !strings.Contains(ss, want) && !strings.Contains(ss, strings.ReplaceAll(want, "&#34;", `"`)) {
			t.Errorf("short package lacks %q", want)
		}
	}
	if !strings.Contains(ss, "@page plan{size:letter landscape") || !strings.Contains(ss, "page:plan") {
		t.Error("the plan is not on a landscape page of its own")
	}
}

func parseF(s string) float64 {
	v, _ := strconv.ParseFloat(strings.ReplaceAll(strings.TrimSpace(s), ",", ""), 64)
	return v
}

// TestMathHTML: the engine's names as NDS 2018 writes them (F′b with the
// prime before the subscript, Fc⊥, ℓu, Δ), √ and powers; text is escaped.
func TestMathHTML(t *testing.T) {
	for _, tc := range []struct{ in, want string }{
		{"Fb'", "F′<sub>b</sub>"},
		{"Fb*", "F<sub>b</sub>*"},
		{"fc_perp / Fc_perp'", "f<sub>c⊥</sub> / F′<sub>c⊥</sub>"},
		{"Fc_perp CM Ct Cb_beam", "F<sub>c⊥</sub> C<sub>M</sub> C<sub>t</sub> C<sub>b,beam</sub>"},
		{"fc_perp/Fc_perp_beam'", "f<sub>c⊥</sub>/F′<sub>c⊥,beam</sub>"},
		{"delta / delta_allow", "Δ / Δ<sub>allow</sub>"},
		{"sqrt(le d / b^2)", "√(ℓ<sub>e</sub> d / b²)"},
		{"1.20 Emin' / RB^2", "1.20 E′<sub>min</sub> / R<sub>B</sub>²"},
		{"w_Lr", "w<sub>Lr</sub>"},
		{"a < b", "a &lt; b"},
	} {
		if got := string(mathHTML(tc.in)); got != tc.want {
			t.Errorf("mathHTML(%q) = %q, want %q", tc.in, got, tc.want)
		}
	}
}
