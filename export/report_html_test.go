package export

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"golang.org/x/net/html"
)

func repWalk(n *html.Node, f func(*html.Node)) {
	if n == nil {
		return
	}
	f(n)
	for c := n.FirstChild; c != nil; c = c.NextSibling {
		repWalk(c, f)
	}
}

func repAttr(n *html.Node, key string) string {
	if n == nil {
		return ""
	}
	for _, a := range n.Attr {
		if a.Key == key {
			return a.Val
		}
	}
	return ""
}

func repHasClass(n *html.Node, class string) bool {
	for _, c := range strings.Fields(repAttr(n, "class")) {
		if c == class {
			return true
		}
	}
	return false
}

func repByID(doc *html.Node, id string) *html.Node {
	var found *html.Node
	repWalk(doc, func(n *html.Node) {
		if found == nil && n.Type == html.ElementNode && repAttr(n, "id") == id {
			found = n
		}
	})
	return found
}

func repFirstTag(n *html.Node, tag string) *html.Node {
	var found *html.Node
	repWalk(n, func(e *html.Node) {
		if found == nil && e != n && e.Type == html.ElementNode && e.Data == tag {
			found = e
		}
	})
	return found
}

func repFirstClass(n *html.Node, class string) *html.Node {
	var found *html.Node
	repWalk(n, func(e *html.Node) {
		if found == nil && e.Type == html.ElementNode && repHasClass(e, class) {
			found = e
		}
	})
	return found
}

func repText(n *html.Node) string {
	var b strings.Builder
	repWalk(n, func(e *html.Node) {
		if e.Type == html.TextNode {
			b.WriteString(e.Data)
		}
	})
	return strings.TrimSpace(b.String())
}

// rows returns the cell texts of each <tr> under n (a table, or a node
// holding one).
func repRows(n *html.Node) [][]string {
	var out [][]string
	repWalk(n, func(e *html.Node) {
		if e.Type != html.ElementNode || e.Data != "tr" {
			return
		}
		var cells []string
		for c := e.FirstChild; c != nil; c = c.NextSibling {
			if c.Type == html.ElementNode && (c.Data == "td" || c.Data == "th") {
				cells = append(cells, repText(c))
			}
		}
		out = append(out, cells)
	})
	return out
}

// repNonFinite finds NaN or Inf printed as numbers: "NaN", "Inf", "+Inf",
// "-Inf", "Infinity" as whole words.
var repNonFinite = regexp.MustCompile(`\b(NaN|Inf|Infinity)\b`)

func TestWriteReportNonFinite(t *testing.T) {
	r, g := loadReportFixture(t)
	m := &r.Members[0]
	m.MaxRatio = math.NaN()
	m.StartIn[0] = math.Inf(1)
	m.TribIn = math.NaN()
	m.Checks[0].Actual = math.Inf(-1)
	m.Checks[0].Trace[0].Value = math.NaN()
	r.Members[1].Checks[0].Ratio = math.NaN()
	r.Marks[0].MaxRatio = math.Inf(1)
	r.BlockingRows[0].StartIn[1] = math.NaN()
	r.Takeoff.Totals.BoardFeet = math.NaN()
	r.Assumptions.Zones[0].DeadPsf = math.Inf(1)
	g.Zones[0].Points[0][0] = math.NaN()
	doc, data := repWriteParse(t, r, g)
	if loc := repNonFinite.FindIndex(data); loc != nil {
		t.Errorf("non-finite number in the page: %q", data[max(0, loc[0]-60):min(len(data), loc[1]+20)])
	}
	// The member is still there, without a ratio, drawn nowhere.
	page := repReadPage(t, doc, data)
	if _, drawn := page.drawn[0]; drawn || page.ids[0] != m.ID || page.groups[page.group[0]][3] != nil {
		t.Errorf("member with NaN ratio and Inf coordinate: drawn %v, id %q, ratio %v", drawn, page.ids[0], page.groups[page.group[0]][3])
	}
}

func TestWriteReportEscapes(t *testing.T) {
	r, g := loadReportFixture(t)
	r.Plan = `plan<b id="inj1">x</b>.dxf`
	r.Members[0].Handle = `</script><b id="inj2">x</b>`
	r.Members[5].Source = `</td><b id="inj6">x</b>`
	r.Members[0].ID = `M"1<i id="inj3">`
	r.Assumptions.Notes = append(r.Assumptions.Notes, `<script id="inj4">alert(1)</script>`)
	g.Zones[0].Name = `Z<b id="inj5">`
	doc, data := repWriteParse(t, r, g)
	for i := 1; i <= 6; i++ {
		if repByID(doc, fmt.Sprintf("inj%d", i)) != nil {
			t.Errorf("injected element inj%d made it into the page", i)
		}
	}
	if page := repReadPage(t, doc, data); page.ids[0] != `M"1<i id="inj3">` || page.handles[0] != r.Members[0].Handle {
		t.Errorf("member with markup in its id and handle: %q %q in the page's data", page.ids[0], page.handles[0])
	}
	// The member data stays one script; its text holds the handle escaped.
	var scripts []string
	repWalk(doc, func(n *html.Node) {
		if n.Type == html.ElementNode && n.Data == "script" {
			scripts = append(scripts, repText(n))
		}
	})
	if len(scripts) != 1 || !strings.Contains(scripts[0], `\u003c/script\u003e`) {
		t.Errorf("%d scripts; member data not escaped: %.200q", len(scripts), data)
	}
}

func TestWriteReportRefusesAndRepeats(t *testing.T) {
	r, g := loadReportFixture(t)
	dir := t.TempDir()
	if err := WriteReport(filepath.Join(dir, "plan.dxf"), r, g, reportWhen); err == nil {
		t.Error("report written to a .dxf path")
	}
	if err := WriteReport(filepath.Join(dir, "r.html"), nil, g, reportWhen); err == nil {
		t.Error("nil results: no error")
	}
	if err := WriteReport(filepath.Join(dir, "missing", "r.html"), r, g, reportWhen); err == nil || !strings.Contains(err.Error(), "r.html") {
		t.Errorf("missing folder: error %v, want one naming the path", err)
	}
	// Same input and time, same bytes; nil geometry is allowed.
	a, b := filepath.Join(dir, "a.html"), filepath.Join(dir, "b.html")
	for _, p := range []string{a, b} {
		if err := WriteReport(p, r, nil, reportWhen); err != nil {
			t.Fatal(err)
		}
	}
	da, _ := os.ReadFile(a)
	db, _ := os.ReadFile(b)
	if !bytes.Equal(da, db) {
		t.Error("two writes of the same report differ")
	}
	noTempReportFiles(t, dir)
}

func TestRatioColour(t *testing.T) {
	// Our own scale (common practice, no source): the stops exactly, the
	// middle of a stretch interpolated, the ends held.
	for _, c := range []struct {
		ratio float64
		want  string
	}{
		{-1, "#2b6cb0"}, {0, "#2b6cb0"}, {0.5, "#1e9a6e"}, {1, "#d7301f"}, {1.5, "#6a1b9a"}, {9, "#6a1b9a"},
		{0.9, "#d86a1d"}, // halfway from #d9a41a to #d7301f: d8, 6a, 1c.5 -> 1d (round half away)
		{math.NaN(), errorColour},
	} {
		if got := ratioColour(c.ratio); got != c.want {
			t.Errorf("ratioColour(%v) = %s, want %s", c.ratio, got, c.want)
		}
		if got := string(appendColour(nil, c.ratio)); got != c.want {
			t.Errorf("appendColour(%v) = %s, want %s", c.ratio, got, c.want)
		}
	}
	for r := -0.2; r < 2; r += 0.01 {
		if got := bandClass(r, StatusPass); got != repWantBand(r, StatusPass) {
			t.Errorf("bandClass(%.2f) = %s, want %s", r, got, repWantBand(r, StatusPass))
		}
	}
}

// repBigResults is a plan of n joists at 16 in in rows of 50, copies of
// the fixture's members (traces included) in turn: the copies of its member
// in error stay in error, the others get ratios cycling from 0 to 1.29,
// failing above 1.0.
func repBigResults(tb testing.TB, n int) (*Results, *PlanGeometry) {
	r, g := loadReportFixture(tb)
	proto := r.Members
	big := *r
	big.Members = make([]Member, n)
	for i := range big.Members {
		m := proto[i%len(proto)]
		x := float64(i%50) * 16
		y := float64(i/50) * 200
		m.ID = fmt.Sprintf("M%d", i+1)
		m.StartIn, m.EndIn = [2]float64{x, y}, [2]float64{x, y + 168}
		if m.Status != StatusError {
			m.MaxRatio = float64(i%130) / 100
			m.Status = StatusPass
			if m.MaxRatio > 1 {
				m.Status = StatusFail
			}
		}
		big.Members[i] = m
	}
	big.Summary = Summary{Members: n}
	return &big, g
}

func TestWriteReportLarge(t *testing.T) {
	if testing.Short() {
		t.Skip("-short: builds the report of a 5,000-member plan")
	}
	r, g := repBigResults(t, 5000)
	doc, data := repWriteParse(t, r, g)
	page := repReadPage(t, doc, data)
	if len(page.drawn) != 5000 {
		t.Errorf("%d members drawn, want 5000", len(page.drawn))
	}
	// Drawn by runs and bands, not one element per member; ids and
	// handles in sequence are not written.
	if page.paths >= 5000/4 {
		t.Errorf("%d member paths for 5000 members", page.paths)
	}
	for i, m := range r.Members {
		if page.ids[i] != m.ID || page.handles[i] != m.Handle {
			t.Fatalf("member %d: %q %q in the page, want %q %q", i, page.ids[i], page.handles[i], m.ID, m.Handle)
		}
	}
	if n := len(data); n > 5000*150 {
		t.Errorf("page of %d bytes for 5000 members", n)
	}
}

func BenchmarkWriteReport(b *testing.B) {
	r, g := repBigResults(b, 100_000)
	path := filepath.Join(b.TempDir(), "report.html")
	b.ResetTimer()
	for b.Loop() {
		if err := WriteReport(path, r, g, reportWhen); err != nil {
			b.Fatal(err)
		}
	}
	fi, err := os.Stat(path)
	if err == nil {
		b.ReportMetric(float64(fi.Size())/1e6, "MB")
	}
}
