package export

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"

	"golang.org/x/net/html"
)

// reportWhen is the fixed date of the report tests.
var reportWhen = time.Date(2026, 3, 14, 9, 30, 0, 0, time.UTC)

// loadReportFixture reads testdata/report_results.json and
// report_geometry.json, written by testdata/report_gen from package check's
// results for a made-up plan (see the doc comment of report_gen).
func loadReportFixture(t testing.TB) (*Results, *PlanGeometry) {
	t.Helper()
	var r Results
	var g PlanGeometry
	for name, v := range map[string]any{"report_results.json": &r, "report_geometry.json": &g} {
		data, err := os.ReadFile(filepath.Join("testdata", name))
		if err != nil {
			t.Fatal(err)
		}
		if err := json.Unmarshal(data, v); err != nil {
			t.Fatalf("%s: %v", name, err)
		}
	}
	return &r, &g
}

// writeAndParse writes the report of r to a temporary folder and parses it.
func repWriteParse(t *testing.T, r *Results, g *PlanGeometry) (*html.Node, []byte) {
	t.Helper()
	dir := t.TempDir()
	path := filepath.Join(dir, "report.html")
	if err := WriteReport(path, r, g, reportWhen); err != nil {
		t.Fatal(err)
	}
	noTempReportFiles(t, dir)
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	doc, err := html.Parse(bytes.NewReader(data))
	if err != nil {
		t.Fatal(err)
	}
	return doc, data
}

func noTempReportFiles(t *testing.T, dir string) {
	t.Helper()
	m, _ := filepath.Glob(filepath.Join(dir, ".*.tmp-*"))
	if len(m) > 0 {
		t.Errorf("temporary files left behind: %v", m)
	}
}

func TestWriteReportSections(t *testing.T) {
	r, g := loadReportFixture(t)
	doc, data := repWriteParse(t, r, g)
	for _, id := range []string{"summary", "plan", "schedule", "takeoff", "calculations", "assumptions", "cautions", "plan-svg", "members", "supports", "zones", "blocking", "worst", "errors", "totals"} {
		if repByID(doc, id) == nil {
			t.Errorf("no element with id %q", id)
		}
	}
	caut := repText(repByID(doc, "cautions"))
	for _, c := range Cautions {
		if !strings.Contains(caut, c) {
			t.Errorf("cautions section lacks %q", c)
		}
	}
	sum := repText(repByID(doc, "summary"))
	for _, want := range []string{"2026-03-14 09:30 UTC", r.Plan, "NDS 2018", "ASCE 7-16", "IBC 2018"} {
		if !strings.Contains(sum, want) {
			t.Errorf("summary lacks %q", want)
		}
	}
	// The counts of the summary cards are those of Results.Summary.
	var cards []string
	repWalk(repByID(doc, "summary"), func(n *html.Node) {
		if n.Type == html.ElementNode && n.Data == "div" && repHasClass(n, "card") {
			cards = append(cards, repText(repFirstTag(n, "b")))
		}
	})
	want := []string{strconv.Itoa(r.Summary.Members), strconv.Itoa(r.Summary.Pass), strconv.Itoa(r.Summary.Fail), strconv.Itoa(r.Summary.Error), strconv.Itoa(len(r.Marks))}
	if strings.Join(cards, " ") != strings.Join(want, " ") {
		t.Errorf("summary cards %v, want %v", cards, want)
	}
	// The worst member listed first is the failing member with the largest ratio.
	worst := repRows(repByID(doc, "worst"))
	if len(worst) < 2 {
		t.Fatalf("worst table has %d rows", len(worst))
	}
	best := ""
	maxR := -1.0
	for _, m := range r.Members {
		if m.Status == StatusFail && m.MaxRatio > maxR {
			best, maxR = m.ID, m.MaxRatio
		}
	}
	if best == "" {
		t.Fatal("fixture has no failing member")
	}
	if worst[1][0] != best {
		t.Errorf("worst member listed %q, want %q", worst[1][0], best)
	}
	// One line per mark, with the mark's member count (common practice,
	// no source: a schedule lists types of joist, not each copy).
	perMark := map[string]int{}
	for _, m := range r.Members {
		if m.Status != StatusError {
			perMark[m.Mark]++
		}
	}
	seen := map[string]bool{}
	for _, row := range worst[1:] {
		if seen[row[1]] {
			t.Errorf("mark %s listed twice among the worst", row[1])
		}
		seen[row[1]] = true
		if row[2] != strconv.Itoa(perMark[row[1]]) {
			t.Errorf("mark %s: %s members listed, want %d", row[1], row[2], perMark[row[1]])
		}
	}
	// Schedule: one row per mark; takeoff totals as in Results.
	if got := len(repRows(repByID(doc, "schedule"))); got != len(r.Marks)+1 {
		t.Errorf("schedule has %d rows, want %d marks + header", got, len(r.Marks))
	}
	tot := repRows(repByID(doc, "totals"))[1]
	if tot[0] != strconv.Itoa(r.Takeoff.Totals.JoistCount) || tot[2] != strconv.Itoa(r.Takeoff.Totals.BlockingPieces) {
		t.Errorf("totals row %v, want joists %d, blocking pieces %d", tot, r.Takeoff.Totals.JoistCount, r.Takeoff.Totals.BlockingPieces)
	}
	// Every link inside the page lands on an element.
	repWalk(doc, func(n *html.Node) {
		if href := repAttr(n, "href"); n.Type == html.ElementNode && strings.HasPrefix(href, "#") && repByID(doc, href[1:]) == nil {
			t.Errorf("link %q leads nowhere", href)
		}
	})
	if !bytes.Contains(data, []byte("@media print")) || !bytes.Contains(data, []byte("break-before:page")) {
		t.Error("no print CSS with page breaks")
	}
	for _, bad := range []string{"http://", "https://"} {
		for _, line := range strings.Split(string(data), "\n") {
			if strings.Contains(line, bad) && !strings.Contains(line, "http://www.w3.org/2000/svg") {
				t.Errorf("network address in the page: %.120s", line)
			}
		}
	}
}

// wantBand is the band of a ratio as the legend states it (our own bands,
// common practice, no source).
func repWantBand(ratio float64, status string) string {
	switch {
	case status == StatusError:
		return "band-error"
	case status == StatusFail || ratio > 1:
		return "band-over"
	case ratio >= 0.9:
		return "band-90-100"
	case ratio >= 0.75:
		return "band-75-90"
	case ratio >= 0.5:
		return "band-50-75"
	}
	return "band-lt50"
}

func TestWriteReportMemberElements(t *testing.T) {
	r, g := loadReportFixture(t)
	doc, data := repWriteParse(t, r, g)
	page := repReadPage(t, doc, data)
	if len(page.ids) != len(r.Members) {
		t.Fatalf("%d members in the page's data, want %d", len(page.ids), len(r.Members))
	}
	runs := map[string]bool{}
	for _, m := range r.Members {
		runs[m.Run] = true
	}
	if page.paths > len(r.Members) || page.paths < len(runs) {
		t.Errorf("%d member paths for %d members in %d runs", page.paths, len(r.Members), len(runs))
	}
	hex := regexp.MustCompile(`^#[0-9a-f]{6}$`)
	status := map[string]string{StatusPass: "p", StatusFail: "f", StatusError: "e"}
	for i, m := range r.Members {
		if page.ids[i] != m.ID || page.handles[i] != m.Handle {
			t.Errorf("member %d: id %q handle %q in the page, want %q %q", i, page.ids[i], page.handles[i], m.ID, m.Handle)
		}
		if grp := page.groups[page.group[i]]; grp[5] != status[m.Status] {
			t.Errorf("%s: status %v in the page, want %s", m.ID, grp[5], m.Status)
		}
		d, ok := page.drawn[i]
		if !ok {
			t.Errorf("%s: drawn in no path", m.ID)
			continue
		}
		el := d.path.Parent // the group carries the class
		if b := repWantBand(m.MaxRatio, m.Status); !repHasClass(el, b) {
			t.Errorf("%s ratio %.3f %s: class %q, want %s", m.ID, m.MaxRatio, m.Status, repAttr(el, "class"), b)
		}
		if m.Status == StatusFail && !repHasClass(el, "fail") || m.Status == StatusError && !repHasClass(el, "err") {
			t.Errorf("%s %s: class %q lacks the heavy style", m.ID, m.Status, repAttr(el, "class"))
		}
		if want := string(appendColour(nil, m.MaxRatio)); m.Status != StatusError && repAttr(d.path, "stroke") != want || !hex.MatchString(repAttr(d.path, "stroke")) {
			t.Errorf("%s: stroke %q, want %s", m.ID, repAttr(d.path, "stroke"), want)
		}
		// Inches, y negated so north is up; coordinates to 0.01 in.
		a, b := m.StartIn, m.EndIn
		if a == ([2]float64{}) && b == ([2]float64{}) {
			f, _ := UnitToInch(r.DrawingUnits)
			a, b = [2]float64{m.Start[0] * f, m.Start[1] * f}, [2]float64{m.End[0] * f, m.End[1] * f}
		}
		if !repSameSegment(d.seg, a, b) {
			t.Errorf("%s: drawn %v, want %v-%v", m.ID, d.seg, a, b)
		}
	}
	// Failing and erroring members are labelled.
	labels := repText(repByID(doc, "labels"))
	for _, m := range r.Members {
		if m.Status == StatusError && !strings.Contains(labels, m.ID+" ERROR") {
			t.Errorf("no label %q", m.ID+" ERROR")
		}
		if m.Status == StatusFail && !strings.Contains(labels, m.Mark+" "+strconv.FormatFloat(m.MaxRatio, 'f', 2, 64)) {
			t.Errorf("no label for failing %s", m.ID)
		}
	}
	// One line per blocking row to add.
	var adds int
	repWalk(repByID(doc, "blocking"), func(n *html.Node) {
		if n.Type == html.ElementNode && repHasClass(n, "blk-add") {
			adds++
		}
	})
	want := 0
	for _, br := range r.BlockingRows {
		if !br.Existing {
			want++
		}
	}
	if adds != want || want == 0 {
		t.Errorf("%d blocking rows drawn, want %d (fixture must have some)", adds, want)
	}
}

// closeTo compares a printed number with the value it stands for: the
// report prints about four significant figures (at most three decimals), so
// it allows half a unit of the last place printed.
// repCloseToUnit is repCloseTo with the rounding of the formatting rules
// (fmtx): psi, lb and lb-in to the nearest 1, inches and section
// properties to 0.01, other values to 0.001.
func repCloseToUnit(text string, want float64, unit string) bool {
	got, err := strconv.ParseFloat(strings.ReplaceAll(text, ",", ""), 64)
	if err != nil {
		return false
	}
	tol := 5e-4 + 1e-9
	switch unit {
	case "psi", "lb", "lb-in":
		tol = 0.5 + 1e-9
	case "in", "in^2", "in^3", "in^4":
		tol = 0.005 + 1e-9
	}
	return math.Abs(got-want) <= tol
}

func repCloseTo(text string, want float64) bool {
	got, err := strconv.ParseFloat(strings.ReplaceAll(text, ",", ""), 64)
	if err != nil {
		return false
	}
	tol := math.Max(5e-4*math.Abs(want), 5e-4+1e-12)
	if math.Abs(want) >= 1000 {
		tol = 0.5 + 1e-9
	}
	return math.Abs(got-want) <= tol
}
