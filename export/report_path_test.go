package export

import (
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"golang.org/x/net/html"
)

// repPathResults is a hand-built load path: beams of two marks with one
// failing and one passing with a message, posts of two distinct rows and
// one failing, and foundation lines alike in pairs.
func repPathResults() *LoadPath {
	chk := func(r float64) []Check {
		return []Check{{Kind: "bending-top", Combo: "D+L", Actual: 1400 * r, Allowable: 1400, Unit: "psi", Ratio: r}}
	}
	beam := func(id, mark string, ratio float64, status string) PathBeam {
		return PathBeam{ID: id, Mark: mark, Kind: "flush-beam", Size: "(3) 2x12", SpansIn: []float64{144}, Supports: []string{"P1", "wall W2"},
			Carries: []string{"J" + id}, Governing: "bending-top", MaxRatio: ratio, Status: status, Checks: chk(ratio)}
	}
	lp := &LoadPath{Beams: []PathBeam{
		beam("B1", "K1", 0.62, StatusPass),
		beam("B2", "K1", 0.64, StatusPass),
		beam("B3", "K1", 0.621, StatusPass),
		beam("B4", "K2", 0.95, StatusPass),
		beam("B5", "K2", 1.2, StatusFail),
		beam("B6", "K1", 0.63, StatusPass),
	}}
	lp.Beams[4].Messages = []string{"deflection over L/360"}
	lp.Beams[5].Messages = []string{"carries J9, whose bearing is short"}
	post := func(id string, d float64, checked bool, ratio float64, status string) PathPost {
		p := PathPost{ID: id, Loads: TypeLoads{DeadLb: d, LiveLb: 2 * d}, DownLb: 3 * d, Checked: checked, Status: status}
		if checked {
			p.Size = "4x4"
			p.Checks = []Check{{Kind: "compression", Ratio: ratio}}
		}
		return p
	}
	lp.Posts = []PathPost{
		post("P1", 400, true, 0.5, StatusPass),
		post("P2", 400, true, 0.5, StatusPass),
		post("P3", 400, true, 0.5, StatusPass),
		post("P4", 400, true, 0.5, StatusPass),
		post("P5", 900, false, 0, ""),
		post("P6", 900, false, 0, ""),
		post("P7", 400, true, 0.5, StatusFail), // alike but failing: its own row
	}
	lp.Posts[1].Loads.DeadLb = 400.2 // 400 lb as shown: alike
	wall := func(id string, plf float64) FoundationLine {
		return FoundationLine{Kind: "wall", ID: id, LengthIn: 120, Loads: TypeLoads{DeadLb: plf * 10}, PerFoot: TypeLoads{DeadLb: plf}}
	}
	lp.Foundation = []FoundationLine{
		wall("W1", 150), wall("W2", 150), wall("W3", 220),
		{Kind: "post", ID: "P1", Loads: TypeLoads{DeadLb: 150}},
		{Kind: "post", ID: "P3", Loads: TypeLoads{DeadLb: 150}},
	}
	return lp
}

// TestReportPathGrouped: the load path section's rows follow the marks
// and the distinct rows, not the number of items: passing beams share a
// row by mark with their count, ids and the checks of the beam of the
// largest ratio; a beam that fails, or passes with a message, has its own
// row with what it bears on, carries, its messages and its checks; posts
// and foundation lines alike but for their id share a row, a failing post
// has its own; every item is counted once (common practice, no source).
func TestReportPathGrouped(t *testing.T) {
	s := buildPath(&Results{LoadPath: repPathResults()})
	type beamWant struct {
		ids, mark, of, ratio, supports, carries, messages string
		count, checks                                     int
		bad                                               bool
	}
	want := []beamWant{
		{ids: "B1, B2, B3", mark: "K1", of: "B2", ratio: "0.64", count: 3, checks: 1},
		{ids: "B4", mark: "K2", ratio: "0.95", supports: "P1, wall W2", carries: "JB4", count: 1, checks: 1},
		{ids: "B5", mark: "K2", ratio: "1.20", supports: "P1, wall W2", carries: "JB5", messages: "deflection over L/360", count: 1, checks: 1, bad: true},
		{ids: "B6", mark: "K1", ratio: "0.63", supports: "P1, wall W2", carries: "JB6", messages: "carries J9, whose bearing is short", count: 1, checks: 1},
	}
	if len(s.Beams) != len(want) {
		t.Fatalf("%d beam rows, want %d: %+v", len(s.Beams), len(want), s.Beams)
	}
	for i, w := range want {
		b := s.Beams[i]
		got := beamWant{ids: b.IDs, mark: b.Mark, of: b.Of, ratio: b.Ratio, supports: b.Supports, carries: b.Carries,
			messages: b.Messages, count: b.Count, checks: len(b.Checks), bad: b.Bad}
		if got != w {
			t.Errorf("beam row %d = %+v, want %+v", i, got, w)
		}
	}
	if c := s.Beams[0].Checks[0]; c.Ratio != "0.64" {
		t.Errorf("mark K1 lists the checks at ratio %s, want those of B2 (0.64)", c.Ratio)
	}
	type postWant struct {
		ids, d, status string
		count          int
		bad            bool
	}
	pw := []postWant{{"P1, P2, P3, P4", "400", StatusPass, 4, false}, {"P5, P6", "900", "", 2, false}, {"P7", "400", StatusFail, 1, true}}
	if len(s.Posts) != len(pw) {
		t.Fatalf("%d post rows, want %d: %+v", len(s.Posts), len(pw), s.Posts)
	}
	for i, w := range pw {
		p := s.Posts[i]
		if got := (postWant{p.IDs, p.D, p.Status, p.Count, p.Bad}); got != w {
			t.Errorf("post row %d = %+v, want %+v", i, got, w)
		}
	}
	if s.Posts[1].Ratio != "not checked" || s.Posts[0].Size != "4x4" || s.Posts[0].L != "800" || s.Posts[0].Down != "1,200" {
		t.Errorf("post rows' cells: %+v", s.Posts)
	}
	type foundWant struct {
		kind, ids, d, unit string
		count              int
	}
	fw := []foundWant{{"wall", "W1, W2", "150", "plf", 2}, {"wall", "W3", "220", "plf", 1}, {"post", "P1, P3", "150", "lb", 2}}
	if len(s.Foundation) != len(fw) {
		t.Fatalf("%d foundation rows, want %d: %+v", len(s.Foundation), len(fw), s.Foundation)
	}
	for i, w := range fw {
		f := s.Foundation[i]
		if got := (foundWant{f.Kind, f.IDs, f.D, f.Unit, f.Count}); got != w {
			t.Errorf("foundation row %d = %+v, want %+v", i, got, w)
		}
	}
}

// TestReportPathIDsShortened: a row of many items lists the first
// upliftMembersShown ids and "and N more", as the report's other member
// lists do, with the full count (common practice, no source).
func TestReportPathIDsShortened(t *testing.T) {
	lp := &LoadPath{}
	for i := 1; i <= 45; i++ {
		id := "P" + strconv.Itoa(i)
		lp.Posts = append(lp.Posts, PathPost{ID: id, Loads: TypeLoads{DeadLb: 500}})
		lp.Foundation = append(lp.Foundation, FoundationLine{Kind: "post", ID: id, Loads: TypeLoads{DeadLb: 500}})
		lp.Beams = append(lp.Beams, PathBeam{ID: "B" + strconv.Itoa(i), Mark: "B1", MaxRatio: 0.4, Status: StatusPass})
	}
	s := buildPath(&Results{LoadPath: lp})
	if len(s.Posts) != 1 || len(s.Foundation) != 1 || len(s.Beams) != 1 {
		t.Fatalf("%d post, %d foundation, %d beam rows, want 1 each", len(s.Posts), len(s.Foundation), len(s.Beams))
	}
	for _, c := range []struct {
		what, ids string
		count     int
	}{{"posts", s.Posts[0].IDs, s.Posts[0].Count}, {"foundation", s.Foundation[0].IDs, s.Foundation[0].Count}, {"beams", s.Beams[0].IDs, s.Beams[0].Count}} {
		if c.count != 45 || !strings.HasSuffix(c.ids, " and 15 more") || strings.Count(c.ids, ", ") != 29 {
			t.Errorf("%s: count %d, ids %q; want 45 and 30 ids then \"and 15 more\"", c.what, c.count, c.ids)
		}
	}
}

// repTopRows returns the cells of a table's own rows (not those of a
// table inside one of its cells) and the rows themselves.
func repTopRows(table *html.Node) ([][]string, []*html.Node) {
	var cells [][]string
	var rows []*html.Node
	var walk func(n *html.Node)
	walk = func(n *html.Node) {
		for c := n.FirstChild; c != nil; c = c.NextSibling {
			if c.Type != html.ElementNode {
				continue
			}
			switch c.Data {
			case "tbody", "thead":
				walk(c)
			case "tr":
				var row []string
				for td := c.FirstChild; td != nil; td = td.NextSibling {
					if td.Type == html.ElementNode && (td.Data == "td" || td.Data == "th") {
						row = append(row, repText(td))
					}
				}
				cells, rows = append(cells, row), append(rows, c)
			}
		}
	}
	walk(table)
	return cells, rows
}

// TestReportPathTables: the written report (parsed back with an HTML
// parser) has one row per group in the path-beams, path-posts and
// path-foundation tables, each with its count and ids, the failing beam
// and post marked bad, the mark's checks captioned with its beam, and the
// sentence naming the sheets with every item (common practice, no source).
func TestReportPathTables(t *testing.T) {
	r, g := loadReportFixture(t)
	r.LoadPath = repPathResults()
	doc, _ := repWriteParse(t, r, g)
	sec := repByID(doc, "loadpath")
	if sec == nil {
		t.Fatal("no load path section")
	}
	if txt := repText(sec); !strings.Contains(txt, "Every beam, post and foundation line is in the Beams, Posts and Foundation sheets and results.json") {
		t.Errorf("load path section lacks the sentence naming the sheets: %q", txt)
	}
	// the balance of loads put on and delivered names every load type,
	// the wind's both ways too
	if txt := repText(sec); !strings.Contains(txt, "; W toward ") || !strings.Contains(txt, "; W away ") {
		t.Errorf("load path balance lacks the wind: %q", txt)
	}
	cases := []struct {
		id       string
		head     []string
		rows     [][]string // the cells checked: ids, count
		idCol    int
		countCol int
		bad      []bool
	}{
		{"path-beams", []string{"beams", "mark", "count"}, [][]string{{"B1, B2, B3", "3"}, {"B4", "1"}, {"B5", "1"}, {"B6", "1"}}, 0, 2,
			[]bool{false, false, true, false}},
		{"path-posts", []string{"posts", "count"}, [][]string{{"P1, P2, P3, P4", "4"}, {"P5, P6", "2"}, {"P7", "1"}}, 0, 1,
			[]bool{false, false, true}},
		{"path-foundation", []string{"kind", "ids", "count"}, [][]string{{"W1, W2", "2"}, {"W3", "1"}, {"P1, P3", "2"}}, 1, 2,
			[]bool{false, false, false}},
	}
	for _, c := range cases {
		table := repByID(doc, c.id)
		if table == nil {
			t.Errorf("no #%s", c.id)
			continue
		}
		cells, rows := repTopRows(table)
		if len(cells) == 0 || strings.Join(cells[0][:len(c.head)], "|") != strings.Join(c.head, "|") {
			t.Errorf("#%s header %v, want it to start %v", c.id, cells, c.head)
			continue
		}
		// An item's row has every column; a beam's checks and messages
		// are rows of two cells under it.
		var got [][]string
		var bad []bool
		for i, row := range cells[1:] {
			if len(row) == len(cells[0]) {
				got = append(got, []string{row[c.idCol], row[c.countCol]})
				bad = append(bad, repHasClass(rows[i+1], "bad"))
			}
		}
		if len(got) != len(c.rows) {
			t.Errorf("#%s: %d rows %v, want %d", c.id, len(got), got, len(c.rows))
			continue
		}
		for i := range got {
			if got[i][0] != c.rows[i][0] || got[i][1] != c.rows[i][1] || bad[i] != c.bad[i] {
				t.Errorf("#%s row %d: ids %q count %q bad %v, want %q %q %v", c.id, i, got[i][0], got[i][1], bad[i], c.rows[i][0], c.rows[i][1], c.bad[i])
			}
		}
	}
	beams := repByID(doc, "path-beams")
	var subs, captions int
	repWalk(beams, func(n *html.Node) {
		if n.Type == html.ElementNode && n.Data == "table" && repHasClass(n, "sub") {
			subs++
		}
		if n.Type == html.ElementNode && n.Data == "caption" {
			captions++
			if got := repText(n); !strings.Contains(got, "B2") {
				t.Errorf("caption %q, want the mark's beam of largest ratio, B2", got)
			}
		}
	})
	if subs != 4 || captions != 1 {
		t.Errorf("%d checks tables, %d captions; want 4 (one per row) and 1 (the mark of 3 beams)", subs, captions)
	}
	if txt := repText(beams); !strings.Contains(txt, "deflection over L/360") || !strings.Contains(txt, "carries J9, whose bearing is short") {
		t.Errorf("beams' messages not listed: %q", txt)
	}
}

// BenchmarkWriteReportLoadPath writes the report of a 100,000-member plan
// with a load path of the size samples/bigplan -joists 100000 -beams gives
// (4,338 beams of 30 marks, 16,475 posts, 116,564 connections, 23,323
// foundation lines): "distinct" with every post and foundation line's
// loads its own (the most rows), "alike" with 400 distinct loads.
func BenchmarkWriteReportLoadPath(b *testing.B) {
	for _, alike := range []int{0, 400} {
		name := "distinct"
		if alike > 0 {
			name = "alike"
		}
		b.Run(name, func(b *testing.B) {
			r, g := repBigResults(b, 100_000)
			r.LoadPath = bigLoadPath(4338, 16475, 116564, 23323)
			if alike > 0 {
				lp := r.LoadPath
				for i := range lp.Posts {
					lp.Posts[i].Loads, lp.Posts[i].DownLb = lp.Posts[i%alike].Loads, lp.Posts[i%alike].DownLb
				}
				for i := range lp.Foundation {
					lp.Foundation[i].Loads, lp.Foundation[i].PerFoot = lp.Foundation[i%alike].Loads, lp.Foundation[i%alike].PerFoot
				}
			}
			path := filepath.Join(b.TempDir(), "report.html")
			b.ReportAllocs()
			for b.Loop() {
				if err := WriteReport(path, r, g, reportWhen); err != nil {
					b.Fatal(err)
				}
			}
			if fi, err := os.Stat(path); err == nil {
				b.ReportMetric(float64(fi.Size())/1e6, "MB")
			}
		})
	}
}
