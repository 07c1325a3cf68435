package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/export"
	"framecheck/project"
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
// Hem-Fir No.1's), a built-up member is checked as one member of its
// plies (never one ply in its place), and a metric
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
			if m.Status == export.StatusError || m.Size != "(2) 2x10" || m.Species != "Douglas Fir-Larch" || m.Grade != "No.2" {
				t.Errorf("%s at y %g: %s %s %q, want it checked as (2) 2x10 DF-L No.2", m.ID, y, m.Status, m.Size, msgs)
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
		{"(5) 2x10", "built-up member not checked"},
		{"(2) 4x10", "built-up member not checked"},
	} {
		_, err := project.ParseProject("p.toml", []byte("[lumber]\nsize = \""+c.size+"\"\n"))
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
	// Read as inches, the joists 1.333 units apart also look like the two
	// edges of outlines; whatever the members come to, the run is doubtful.
	if want := "RUN DOUBTFUL: RUN401 the drawing units look wrong"; !strings.Contains(summary, want) || !strings.Contains(summary, " warnings;") {
		t.Errorf("summary line %q, want %q and a count of warnings", summary, want)
	}
	if !strings.Contains(r.stderr, "the joists' median span is 1'-2\"") {
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

// With --size, a built-up member keeps its plies: sizing never puts a
// single joist in its place. The doubled joists (callout "(2) 2x10 DF-L #2"
// over a 32 in bay) are checked as (2) 2x10; the single joists beside them
// are sized from the candidates.
func TestBuiltUpCalloutWithSizeKeepsPlies(t *testing.T) {
	plan := calloutPlanText([]string{`(2) 2x10 DF-L #2`}, []float64{16}, []float64{32})
	r := runCorpus(t, "builtup.dxf", plan, "", "--size")
	for _, m := range r.results.Members {
		builtUp := m.Start[1] <= 32
		msgs := strings.Join(m.Messages, " ")
		if builtUp && (m.Status == export.StatusError || m.Size != "(2) 2x10") {
			t.Errorf("%s: %s %s %q, want the built-up member checked as (2) 2x10", m.ID, m.Status, m.Size, msgs)
		}
		if !builtUp && (m.Status == export.StatusError || strings.HasPrefix(m.Size, "(")) {
			t.Errorf("%s: %s %s %q, want a single size", m.ID, m.Status, m.Size, msgs)
		}
	}
}

// testdata/callouts/callouts.dxf, written by ezdxf (gen_callouts.py), has
// one bay of three joists per callout, each spelt as drafters write them,
// as TEXT or as MTEXT with formatting codes and paragraph breaks. Bay i
// lies at x = 200 i to 200 i + 144. Each bay's joists take what their
// callout says, or are errors naming the callout's handle when it names a
// size but cannot be read; the rest of the plan is checked.
func TestCalloutsWrittenByEzdxf(t *testing.T) {
	data, err := os.ReadFile(filepath.Join("testdata", "callouts", "callouts.dxf"))
	if err != nil {
		t.Fatal(err)
	}
	const dfl = "Douglas Fir-Larch"
	bays := []struct {
		size, species, grade string // for a readable callout
		errWant              string // for one that cannot be read
	}{
		{size: "2x8", species: dfl, grade: "No.2"},              // 2X8 @ 16" O.C. TYP.
		{size: "2x10", species: dfl, grade: "No.2"},             // 2x10 DF-L #2 @ 16"
		{size: "(2) 2x10", species: dfl, grade: "No.2"},         // (2) 2x10 \P DF-L No.2
		{size: "2x12", species: "Hem-Fir", grade: "No.1"},       // {\f..;2x12 HF No.1}\P@ 1'-4" o/c U.N.O.
		{size: "2x10", species: "Southern Pine", grade: "No.2"}, // 2x10 SP #2 @ 16 OC CJ
		// SPF No.2 is graded with No.1 as one grade (NDS 2018 Supplement
		// Table 4A, Spruce-Pine-Fir "No.1/No.2")
		{size: "2x10", species: "Spruce-Pine-Fir", grade: "No.1/No.2"}, // 2x10 SPF #2 @16" RAFTERS
		{size: "2x10", species: dfl, grade: "No.2"},                    // 2x10 DFL No.2 @ 16 o.c.
		{errWant: `"2x10 @ banana"`},
		{errWant: "spacing 0\" (0 in) is outside 4-48 in"},
		{errWant: "metric sawn section"},
		{errWant: "spacing 200\" (200 in) is outside 4-48 in"},
	}
	r := runCorpus(t, "callouts.dxf", string(data), "")
	wantCode(t, r, exitFail)
	count := make([]int, len(bays))
	for _, m := range r.results.Members {
		i := int(m.Start[0] / 200)
		if i < 0 || i >= len(bays) {
			t.Fatalf("%s at x %g: no such bay", m.ID, m.Start[0])
		}
		count[i]++
		b, msgs := bays[i], strings.Join(m.Messages, " ")
		switch {
		case b.errWant != "":
			if m.Status != export.StatusError || m.Size != b.size || !strings.Contains(msgs, b.errWant) ||
				b.size == "" && !strings.Contains(msgs, "handle ") {
				t.Errorf("bay %d %s: %s %q %q, want an error saying %q", i, m.ID, m.Status, m.Size, msgs, b.errWant)
			}
		case m.Status == export.StatusError || m.Size != b.size || m.Species != b.species || m.Grade != b.grade:
			t.Errorf("bay %d %s: %s %s %s %s %q, want %s %s %s checked", i, m.ID, m.Status, m.Size, m.Species, m.Grade, msgs,
				b.size, b.species, b.grade)
		}
	}
	for i, n := range count {
		if n != 3 {
			t.Errorf("bay %d: %d members, want 3", i, n)
		}
	}
}
