package main

import (
	"strings"
	"testing"

	"framecheck/export"
)

// calloutPlanText is the corpus's small plan (five joists at y = 16 ...
// 80, 12 ft simple span) with one label-layer span line and callout per
// group of joists: texts[i] on a line across the joists with y in
// [lo[i], hi[i]].
func calloutPlanText(texts []string, lo, hi []float64) string {
	var d dxfText
	d.header("AC1015", 1)
	d.section("ENTITIES")
	d.plan("WALL", "JOIST", 5, 0, 0)
	for i, s := range texts {
		x := 30 + 20*float64(i)
		d.line("FRAMING-NOTE", x, lo[i]-4, x, hi[i]+4)
		d.text("FRAMING-NOTE", x+2, (lo[i]+hi[i])/2, 4, s)
	}
	d.endsec()
	d.eof()
	return d.String()
}

// Callouts in the trade's spellings reach the check: species and grade
// from a callout override the project's (the design values used are
// Hem-Fir No.1's), a built-up member is an error saying built-up members
// are not checked (never one ply checked in its place), and a metric
// section is an error saying how to map it. The other members are
// checked; exit 1.
func TestCalloutsReachTheCheck(t *testing.T) {
	plan := calloutPlanText(
		[]string{`(2) 2x10 DF-L #2`, `2X10 HF No.1 @ 16" O.C. TYP.`, `140x45 @ 450`},
		[]float64{16, 48, 64}, []float64{32, 48, 80})
	r := runCorpus(t, "callouts.dxf", plan, "")
	wantCode(t, r, exitFail)
	if r.results == nil {
		t.Fatal("no results")
	}
	for _, m := range r.results.Members {
		msgs := strings.Join(m.Messages, " ")
		switch y := m.Start[1]; {
		case y <= 32:
			if m.Status != export.StatusError || m.Size != "(2) 2x10" || !strings.Contains(msgs, "built-up members are not checked yet") {
				t.Errorf("%s at y %g: %s %s %q, want an error: built-up not checked", m.ID, y, m.Status, m.Size, msgs)
			}
		case y == 48:
			if m.Status != export.StatusPass || m.Size != "2x10" || m.Species != "Hem-Fir" || m.Grade != "No.1" {
				t.Errorf("%s at y %g: %s %s %s %s, want a pass as 2x10 Hem-Fir No.1", m.ID, y, m.Status, m.Size, m.Species, m.Grade)
			}
		default:
			if m.Status != export.StatusError || m.Size != "" || !strings.Contains(msgs, "metric sawn section") ||
				!strings.Contains(msgs, "user material with its own section and design values") {
				t.Errorf("%s at y %g: %s %q %q, want an error: metric section", m.ID, y, m.Status, m.Size, msgs)
			}
		}
	}
	// Hem-Fir No.1, 2x10: Fb 975 psi, E 1,500,000 psi (NDS 2018
	// Supplement Table 4A, Hem-Fir, No.1).
	got := map[string]float64{}
	for _, v := range r.results.Assumptions.DesignValues {
		if v.Species == "Hem-Fir" && v.Grade == "No.1" {
			got[v.Name] = v.Value
		}
	}
	if got["Fb"] != 975 || got["E"] != 1500000 {
		t.Errorf("Hem-Fir No.1 design values %v, want Fb 975 and E 1500000 psi", got)
	}
}

// Metric and built-up sizes in the project file are refused, naming the
// key's line and saying why.
func TestProjectSizeMetricAndBuiltUpRefused(t *testing.T) {
	for _, c := range []struct{ size, want string }{
		{"90x45", "metric sawn section"},
		{"45x190", "user material with its own section and design values"},
		{"(2) 2x10", "built-up members are not checked yet"},
	} {
		_, err := ParseProject("p.toml", []byte("[lumber]\nsize = \""+c.size+"\"\n"))
		if err == nil || !strings.Contains(err.Error(), c.want) || !strings.Contains(err.Error(), "p.toml:2:") {
			t.Errorf("size %q: %v, want line 2 and %q", c.size, err, c.want)
		}
	}
}

// feetPlanText is a plan drawn in feet (two walls 14 ft apart, five
// joists 16 in = 1.333 ft apart) saved with $INSUNITS 0 (unitless), as
// CAD exports often are: read as inches, its spans are 14 in.
func feetPlanText() string {
	const spanFt, spacingFt = 14.0, 16.0 / 12
	var d dxfText
	d.header("AC1009", 0)
	d.section("ENTITIES")
	d.line("WALL", 0, 0, 0, 6*spacingFt)
	d.line("WALL", spanFt, 0, spanFt, 6*spacingFt)
	for i := 1; i <= 5; i++ {
		y := float64(i) * spacingFt
		d.line("JOIST", 0, y, spanFt, y)
	}
	d.endsec()
	d.eof()
	return d.String()
}

// A drawing in feet with no units: RUN401 first on stderr, a span warning
// on every member, and exit status 1 even though every member "passes";
// the summary's first line counts the warnings and says the run is
// doubtful. Read with --units ft, the same plan is clean (exit 0).
func TestFeetDrawingWithoutUnitsIsDoubtful(t *testing.T) {
	r := runCorpus(t, "feet.dxf", feetPlanText(), "")
	wantCode(t, r, exitFail)
	first, _, _ := strings.Cut(r.stderr, "\n")
	if !strings.Contains(first, CodeUnitsDoubt) || !strings.Contains(first, `units "in" (a guess`) {
		t.Errorf("first finding %q, want RUN401 saying the units were a guess", first)
	}
	summary := ""
	for _, l := range strings.Split(r.stdout, "\n") {
		if strings.HasPrefix(l, "framecheck feet.dxf:") {
			summary = l
			break
		}
	}
	// 5 members, each with a span of 14 in (< 24 in): 5 FRM290, 1 RUN401,
	// and DXF101 ($INSUNITS 0 read as inches)
	if want := "5 members: 5 pass, 0 fail, 0 error, 7 warnings; RUN DOUBTFUL: RUN401 the drawing units look wrong"; !strings.Contains(summary, want) {
		t.Errorf("summary line %q, want %q", summary, want)
	}
	if !strings.Contains(r.stderr, "every member passes, but the joists' median span is 1'-2\"") {
		t.Errorf("stderr does not say why the exit status is 1:\n%s", r.stderr)
	}
	for _, m := range r.results.Members {
		if !strings.Contains(strings.Join(m.Messages, " "), "design span 1 is 1'-2\", under 2'-0\"") {
			t.Errorf("%s: no span warning in %q", m.ID, m.Messages)
		}
	}

	r = runCorpus(t, "feet.dxf", feetPlanText(), "", "--units", "ft")
	wantCode(t, r, exitOK)
	if strings.Contains(r.stderr, CodeUnitsDoubt) || strings.Contains(r.stderr, CodeSpanDoubt) {
		t.Errorf("read in feet, still doubted:\n%s", r.stderr)
	}
	if !strings.Contains(r.stdout, "5 members: 5 pass, 0 fail, 0 error, 0 warnings\n") {
		t.Errorf("summary:\n%s", r.stdout)
	}
}

// With --size too, a built-up member stays an error: sizing never puts a
// single joist in its place.
func TestBuiltUpCalloutWithSizeStaysError(t *testing.T) {
	plan := calloutPlanText([]string{`(2) 2x10 DF-L #2`}, []float64{16}, []float64{32})
	r := runCorpus(t, "builtup.dxf", plan, "", "--size")
	wantCode(t, r, exitFail)
	for _, m := range r.results.Members {
		builtUp := m.Start[1] <= 32
		msgs := strings.Join(m.Messages, " ")
		if builtUp && (m.Status != export.StatusError || m.Size != "(2) 2x10" || !strings.Contains(msgs, "built-up members are not checked yet")) {
			t.Errorf("%s: %s %s %q, want the built-up member in error", m.ID, m.Status, m.Size, msgs)
		}
		if !builtUp && m.Status == export.StatusError {
			t.Errorf("%s: %s %q", m.ID, m.Status, msgs)
		}
	}
}
