package export

import (
	"math"
	"strconv"
	"strings"

	"framecheck/export/internal/fmtx"

	"github.com/xuri/excelize/v2"
)

// The load path's sheets, written after Uplift when the plan has beams or
// posts (Results.LoadPath).
const (
	SheetBeams       = "Beams"
	SheetPosts       = "Posts"
	SheetConnections = "Connections"
	SheetFoundation  = "Foundation"
)

// LoadPathSheetNames lists the load path's sheets in order.
var LoadPathSheetNames = []string{SheetBeams, SheetPosts, SheetConnections, SheetFoundation}

var beamColumns = []column{
	{"ID", 8}, {"Mark", 7}, {"Kind", 12}, {"Size", 10}, {"Species / grade", 24}, {"Spans (ft-in)", 22},
	{"Bears on", 24}, {"Carries", 40}, {"Governing", 16}, {"Combination", 22}, {"Max ratio", 9},
	{"Status", 8}, {"Layer", 16}, {"Source", 40}, {"Messages", 60},
}

var postColumns = []column{
	{"Posts", 24}, {"Count", 7}, {"Size", 8}, {"Species / grade", 24}, {"Height (ft-in)", 12},
	{"D (lb)", 9}, {"L (lb)", 9}, {"Lr (lb)", 9}, {"S (lb)", 9}, {"W down (lb)", 9}, {"W up (lb)", 9},
	{"Largest down, ASD (lb)", 11}, {"Combination", 22}, {"Net uplift, ASD (lb)", 11}, {"Combination", 22},
	{"Column ratio", 9}, {"Status", 8}, {"Source", 40}, {"Messages", 60},
}

var connectionColumns = []column{
	{"Joint", 16}, {"Members", 40}, {"Count", 7}, {"Bearing", 7}, {"Carried by", 12},
	{"D (lb)", 9}, {"L (lb)", 9}, {"Lr (lb)", 9}, {"S (lb)", 9}, {"W down (lb)", 9}, {"W up (lb)", 9},
	{"Down, ASD (lb)", 10}, {"Combination", 22}, {"Up, ASD (lb)", 10}, {"Combination", 22},
}

var foundationColumns = []column{
	{"Kind", 8}, {"IDs", 24}, {"Count", 7}, {"Length (ft-in)", 12},
	{"D (lb)", 9}, {"L (lb)", 9}, {"Lr (lb)", 9}, {"S (lb)", 9}, {"W down (lb)", 9}, {"W up (lb)", 9},
	{"D (plf)", 9}, {"L (plf)", 9}, {"Lr (plf)", 9}, {"S (plf)", 9}, {"W down (plf)", 9}, {"W up (plf)", 9},
	{"Source", 40},
}

// loadPathSheets returns the Beams, Posts, Connections and Foundation
// sheets of lp, in workbook order, each with its columns, its number of
// rows and the function that fills a row's cells.
func loadPathSheets(lp *LoadPath) []splicedSheet {
	groups := connectionGroups(lp.Connections)
	posts := postGroups(lp.Posts)
	found := foundationGroups(lp.Foundation)
	return []splicedSheet{
		{name: SheetBeams, cols: beamColumns, rows: len(lp.Beams), row: func(s *rowCells, i int) { beamRow(s, &lp.Beams[i]) }},
		{name: SheetPosts, cols: postColumns, rows: len(posts), row: func(s *rowCells, i int) { postRow(s, lp.Posts, &posts[i]) }},
		{name: SheetConnections, cols: connectionColumns, rows: len(groups), row: func(s *rowCells, i int) { connectionRow(s, lp.Connections, &groups[i]) }},
		{name: SheetFoundation, cols: foundationColumns, rows: len(found), row: func(s *rowCells, i int) { foundationRow(s, lp.Foundation, &found[i]) }},
	}
}

// writeSplicedSheets writes sheets (the Uplift sheet, the Beams, Posts,
// Connections and Foundation sheets of loadPathSheets; none without a
// load path): each sheet's columns, title and header rows, frozen pane and
// an autofilter over all its rows. With stream set excelize's stream
// writer writes the rows too, cell by cell (the reference the tests hold
// the spliced rows to); otherwise spliceSheets adds them to the sheets'
// parts.
func writeSplicedSheets(f *excelize.File, st *styles, sheets []splicedSheet, stream bool) error {
	for _, ss := range sheets {
		s, err := newSheet(f, st, ss.name, ss.cols)
		if err != nil {
			return err
		}
		if stream {
			for i := 0; i < ss.rows; i++ {
				ss.row(&s.rowCells, i)
				if err := s.end(); err != nil {
					return err
				}
			}
		} else {
			s.row = HeaderRow + ss.rows
		}
		if err := s.close(); err != nil {
			return err
		}
	}
	return nil
}

// beamRow fills s with beam b's cells, in beamColumns order.
func beamRow(s *rowCells, b *PathBeam) {
	s.begin(b.Status != StatusPass)
	s.text(b.ID)
	s.text(b.Mark)
	s.text(b.Kind)
	s.text(b.Size)
	s.text(speciesGrade(b.Species, b.Grade))
	s.text(ftInList(b.SpansIn))
	s.text(strings.Join(b.Supports, ", "))
	s.text(memberList(b.Carries))
	c, _ := governingOf(b.Checks, b.Governing)
	s.text(b.Governing)
	s.text(fmtx.Combo(c.Combo))
	s.num(b.MaxRatio, cRatio)
	s.text(b.Status)
	s.text(b.Layer)
	s.text(b.Source)
	s.text(strings.Join(b.Messages, "; "))
}

// postMaxPerRow is the most posts one row of the Posts sheet names.
const postMaxPerRow = 100

// postRowKey is what a row of the Posts sheet shows but the posts' IDs
// and sources: posts with the same key share a row.
type postRowKey struct {
	size, lumber, height string
	loads                [6]float64
	down, up             float64
	downCombo, upCombo   string
	checked              bool
	ratio                float64
	status, messages     string
}

// postRatio is the largest ratio of p's checks.
func postRatio(p *PathPost) float64 {
	ratio := 0.0
	for _, c := range p.Checks {
		ratio = math.Max(ratio, c.Ratio)
	}
	return ratio
}

// postGroups groups the posts whose rows would read the same but for the
// post (size, lumber, height, loads and demands as the sheet rounds them,
// ratio to the sheet's 0.00, status and messages): posts alike along beam
// lines share a row naming them all, up to postMaxPerRow a row, in the
// order of their first post. A post that fails or is in error, or holds a
// value that is not finite, has a row of its own. Every post keeps its own
// line, with its loads, in the Foundation sheet and results.json.
func postGroups(ps []PathPost) []rowGroup {
	return groupRows(len(ps), postMaxPerRow, func(i int) (postRowKey, bool) {
		p := &ps[i]
		if p.Status == StatusFail || p.Status == StatusError {
			return postRowKey{}, false
		}
		l := p.Loads
		k := postRowKey{size: p.Size, lumber: speciesGrade(p.Species, p.Grade), checked: p.Checked,
			loads: roundedLoads(l),
			down:  DemandLb(p.DownLb), downCombo: p.DownCombo, up: DemandLb(p.UpLb), upCombo: p.UpCombo,
			ratio: math.Round(postRatio(p) * 100), status: p.Status, messages: strings.Join(p.Messages, "; ")}
		if p.HeightIn > 0 {
			k.height = FtIn(p.HeightIn)
		}
		return k, true
	})
}

// postRow fills s with the cells of the posts of g, in postColumns order:
// the first post's values (the others' read the same), the source of a
// post alone.
func postRow(s *rowCells, ps []PathPost, g *rowGroup) {
	p := &ps[g.items[0]]
	s.begin(p.Status == StatusFail || p.Status == StatusError)
	s.text(g.names(func(j int) string { return ps[j].ID }))
	s.integer(len(g.items))
	s.text(p.Size)
	s.text(speciesGrade(p.Species, p.Grade))
	if p.HeightIn > 0 {
		s.text(FtIn(p.HeightIn))
	} else {
		s.text("")
	}
	typeCells(s, p.Loads)
	s.num(DemandLb(p.DownLb), cLb)
	s.text(fmtx.Combo(p.DownCombo))
	s.num(DemandLb(p.UpLb), cLb)
	s.text(fmtx.Combo(p.UpCombo))
	if p.Checked {
		s.num(postRatio(p), cRatio)
	} else {
		s.text("not checked")
	}
	s.text(p.Status)
	if len(g.items) == 1 {
		s.text(p.Source)
	} else {
		s.text("")
	}
	s.text(strings.Join(p.Messages, "; "))
}

// connMembersPerRow is the most joints one row of the Connections sheet
// names (a cell holds at most 32,767 characters).
const connMembersPerRow = 100

// rowGroup is a row of the Connections, Posts or Foundation sheet: the
// items alike it names (indexes into the joints, posts or foundation
// lines), in the order of the first.
type rowGroup struct{ items []int }

// groupRows groups the items 0 to n-1 whose keys are equal, at most most
// a row, in the order of their first item; an item whose key is not ok
// has a row of its own.
func groupRows[K comparable](n, most int, key func(i int) (K, bool)) []rowGroup {
	var groups []rowGroup
	open := make(map[K]int)
	// items alike mostly follow one another (the joints of a run on one
	// beam): an item whose key is the one before's goes where that one
	// went without looking its key up
	var last K
	lastG := -1
	for i := 0; i < n; i++ {
		k, ok := key(i)
		if !ok {
			groups = append(groups, rowGroup{items: []int{i}})
			lastG = -1
			continue
		}
		g, found := lastG, lastG >= 0 && k == last
		if !found {
			g, found = open[k]
		}
		if found && len(groups[g].items) < most {
			groups[g].items = append(groups[g].items, i)
		} else {
			g = len(groups)
			open[k] = g
			groups = append(groups, rowGroup{items: []int{i}})
		}
		last, lastG = k, g
	}
	return groups
}

// names returns the names of g's items (name gives the i-th), separated
// by commas, as the rows name them.
func (g *rowGroup) names(name func(i int) string) string {
	var b strings.Builder
	for k, j := range g.items {
		if k > 0 {
			b.WriteString(", ")
		}
		b.WriteString(name(j))
	}
	return b.String()
}

// connRowKey is what a row of the Connections sheet shows but the
// members: joints with the same key share a row.
type connRowKey struct {
	kind, carrier      string
	bearing            int
	loads              [6]float64
	down, up           float64
	downCombo, upCombo string
}

func connKey(c *Connection) connRowKey {
	l := c.Loads
	return connRowKey{kind: c.Kind, carrier: c.Carrier, bearing: c.Bearing,
		loads: roundedLoads(l),
		down:  DemandLb(c.DownLb), downCombo: c.DownCombo, up: DemandLb(c.UpLb), upCombo: c.UpCombo}
}

// connectionGroups groups the joints whose rows would read the same but
// for the member (same kind, bearing, carrier, loads and demands as the
// sheet rounds them): the joists of a run hung from one beam share a row
// naming them all, up to connMembersPerRow a row. Rows are in the order of
// their first joint; a joint with a value that is not finite has a row of
// its own.
func connectionGroups(cs []Connection) []rowGroup {
	// the rounding of each distinct demand, worked out once (joints
	// passing the same loads are most of a plan's)
	type raw struct {
		loads    TypeLoads
		down, up float64
	}
	rounded := make(map[raw]connRowKey)
	var lastRaw raw
	var lastKey connRowKey
	return groupRows(len(cs), connMembersPerRow, func(i int) (connRowKey, bool) {
		c := &cs[i]
		r := raw{c.Loads, c.DownLb, c.UpLb}
		k := lastKey
		if i == 0 || r != lastRaw {
			var ok bool
			if k, ok = rounded[r]; !ok {
				k = connKey(c)
				rounded[r] = k
			}
			lastRaw, lastKey = r, k
		}
		k.kind, k.carrier, k.bearing, k.downCombo, k.upCombo = c.Kind, c.Carrier, c.Bearing, c.DownCombo, c.UpCombo
		return k, true // a NaN in the key never matches: a row of its own
	})
}

// connectionRow fills s with the cells of the joints of g, in
// connectionColumns order.
func connectionRow(s *rowCells, cs []Connection, g *rowGroup) {
	c := &cs[g.items[0]]
	s.begin(false)
	s.text(c.Kind)
	s.text(g.names(func(j int) string { return cs[j].Member }))
	s.integer(len(g.items))
	s.integer(c.Bearing)
	s.text(c.Carrier)
	typeCells(s, c.Loads)
	s.num(DemandLb(c.DownLb), cLb) // demands: up to the next pound
	s.text(fmtx.Combo(c.DownCombo))
	s.num(DemandLb(c.UpLb), cLb)
	s.text(fmtx.Combo(c.UpCombo))
}

// foundationRow fills s with the cells of the foundation lines of g (a
// wall line, or posts alike), in foundationColumns order; the source of
// a line alone.
func foundationRow(s *rowCells, fs []FoundationLine, g *rowGroup) {
	fl := &fs[g.items[0]]
	s.begin(false)
	s.text(fl.Kind)
	s.text(g.names(func(j int) string { return fs[j].ID }))
	s.integer(len(g.items))
	if fl.LengthIn > 0 {
		s.text(FtIn(fl.LengthIn))
	} else {
		s.text("")
	}
	typeCells(s, fl.Loads)
	if fl.Kind == "wall" {
		typeCells(s, fl.PerFoot)
	} else {
		for i := 0; i < 6; i++ {
			s.text("")
		}
	}
	if len(g.items) == 1 {
		s.text(fl.Source)
	} else {
		s.text("")
	}
}

// foundationGroups groups the posts whose loads read the same as the
// sheet rounds them: posts alike along beam lines share a row naming
// them all, up to postMaxPerRow a row, in the order of their first. A
// wall line (with its length and loads per foot) has a row of its own.
func foundationGroups(fs []FoundationLine) []rowGroup {
	return groupRows(len(fs), postMaxPerRow, func(i int) ([6]float64, bool) {
		return roundedLoads(fs[i].Loads), fs[i].Kind == "post"
	})
}

// roundedLoads are l's D, L, Lr, S, W down and W up as the sheets show
// them, to the pound.
func roundedLoads(l TypeLoads) [6]float64 {
	return [6]float64{math.Round(l.DeadLb), math.Round(l.LiveLb), math.Round(l.RoofLiveLb), math.Round(l.SnowLb),
		math.Round(l.WindDownLb), math.Round(l.WindUpLb)}
}

// typeCells writes D, L, Lr, S, W down, W up.
func typeCells(s *rowCells, l TypeLoads) {
	for _, v := range [...]float64{l.DeadLb, l.LiveLb, l.RoofLiveLb, l.SnowLb, l.WindDownLb, l.WindUpLb} {
		s.num(math.Round(v), cLb)
	}
}

// governingOf returns the check of kind gov with the largest ratio.
func governingOf(cs []Check, gov string) (Check, bool) {
	best, found := Check{}, false
	for _, c := range cs {
		if gov != "" && c.Kind != gov {
			continue
		}
		if !found || c.Ratio > best.Ratio {
			best, found = c, true
		}
	}
	return best, found
}

// LoadPathSummary is the one-line count of the load path's members for the
// report and the terminal: "3 beams: 2 pass, 1 fail, 0 error; 2 posts
// checked: 1 pass, 0 fail, 1 error", and how many posts were not checked
// (no size or height given) when some were not.
func LoadPathSummary(lp *LoadPath) string {
	count := func(status string, c *[3]int) {
		switch status {
		case StatusPass:
			c[0]++
		case StatusFail:
			c[1]++
		default:
			c[2]++
		}
	}
	var beams, posts [3]int
	for _, b := range lp.Beams {
		count(b.Status, &beams)
	}
	unchecked := 0
	for _, p := range lp.Posts {
		if p.Checked {
			count(p.Status, &posts)
		} else {
			unchecked++
		}
	}
	counts := func(c [3]int) string {
		return strconv.Itoa(c[0]) + " pass, " + strconv.Itoa(c[1]) + " fail, " + strconv.Itoa(c[2]) + " error"
	}
	s := strconv.Itoa(len(lp.Beams)) + " beams: " + counts(beams) + "; " +
		strconv.Itoa(len(lp.Posts)-unchecked) + " posts checked: " + counts(posts)
	if unchecked > 0 {
		s += "; " + strconv.Itoa(unchecked) + " posts not checked (no size or height given)"
	}
	return s
}
