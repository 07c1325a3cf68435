package export

import (
	"framecheck/export/internal/fmtx"
	"strconv"
	"strings"

	"github.com/xuri/excelize/v2"
)

// membersColumns are the Members sheet's columns; the six ratio columns
// follow CheckKinds.
var membersColumns = []column{
	{"ID", 10}, {"Mark", 7}, {"Size", 7}, {"Species / grade", 24},
	{"Spans (ft-in)", 22}, {"Overhangs (ft-in)", 16}, {"Length (ft-in)", 12},
	{"Spacing (in)", 9}, {"Trib (in)", 9}, {"Zone", 10},
	{"Bending top", 9}, {"Bending bottom", 9}, {"Shear", 9},
	{"Defl. live", 9}, {"Defl. total", 9}, {"Bearing", 9},
	{"Governing", 16}, {"Combination", 22}, {"Max ratio", 9},
	{"Blocking rows / span", 11}, {BlockingAtHeader, 24}, {"Status", 8},
	{"Layer", 16}, {"Handle", 8}, {"Location (plan, ft-in)", 48}, {"Messages", 60},
}

// The datum in the sheets' headers (DatumText).
const (
	BlockingAtHeader = "Blocking to add (ft-in from face of first bearing)"
	PositionHeader   = "Position (ft-in from face of first bearing)"
)

// governingCheck returns the check that governs m: the largest ratio among
// checks of kind m.Governing, or among all checks when that is empty.
func governingCheck(m *Member) (Check, bool) {
	best, found := Check{}, false
	for _, c := range m.Checks {
		if m.Governing != "" && c.Kind != m.Governing {
			continue
		}
		if !found || c.Ratio > best.Ratio {
			best, found = c, true
		}
	}
	return best, found
}

func speciesGrade(species, grade string) string {
	return strings.TrimSpace(species + " " + grade)
}

// writeMembers writes the Members sheet's columns, header row, frozen
// pane and an autofilter over all the members' rows, which spliceSheets
// then adds (see xlsx_members.go); with stream set excelize's stream
// writer writes the rows too (the tests' reference).
func writeMembers(f *excelize.File, st *styles, r *Results, stream bool) error {
	s, err := newSheet(f, st, SheetMembers, membersColumns)
	if err != nil {
		return err
	}
	if !stream {
		// The rows end on HeaderRow + the number of members.
		s.row = HeaderRow + len(r.Members)
		return s.close()
	}
	for i := range r.Members {
		memberRow(&s.rowCells, &r.Members[i])
		if err := s.end(); err != nil {
			return err
		}
	}
	return s.close()
}

func writeMarks(f *excelize.File, st *styles, r *Results) error {
	s, err := newSheet(f, st, SheetMarks, []column{
		{"Mark", 7}, {"Size", 7}, {"Species / grade", 24}, {"Zone", 10},
		{"Spacing (in)", 9}, {"Spans (ft-in)", 30}, {"Count", 7},
		{"Blocking rows / span", 11}, {"Max ratio", 9}, {"Status", 8},
	})
	if err != nil {
		return err
	}
	for _, m := range r.Marks {
		s.begin(m.Status != "" && m.Status != StatusPass)
		s.text(m.Mark)
		s.text(m.Size)
		s.text(speciesGrade(m.Species, m.Grade))
		s.text(m.Zone)
		s.num(m.SpacingIn, cIn)
		s.text(SpansText(m.SpansIn, m.OverhangsIn))
		s.integer(m.Count)
		rowsPerSpan(&s.rowCells, m.BlockingRowsPerSpan)
		s.ratio(m.MaxRatio, true)
		s.text(m.Status)
		if err := s.end(); err != nil {
			return err
		}
	}
	return s.close()
}

func writeBlocking(f *excelize.File, st *styles, r *Results) error {
	s, err := newSheet(f, st, SheetBlocking, []column{
		{"Row", 7}, {"Run", 7}, {"Span", 6}, {PositionHeader, 14}, {"From face of first bearing (in)", 10},
		{"Pieces", 7}, {"Clear length of each piece (in)", 40}, {"Size", 7},
		{"Drawn or add", 9}, {"Members", 40},
	})
	if err != nil {
		return err
	}
	for _, b := range r.BlockingRows {
		s.begin(false)
		s.text(b.ID)
		s.text(b.Run)
		s.integer(b.SpanIndex + 1)
		s.text(FtIn(b.FromFaceIn))
		s.num(b.FromFaceIn, cIn)
		s.integer(b.Pieces)
		s.text(numList(b.ClearIn))
		s.text(b.Size)
		if b.Existing {
			s.text("drawn")
		} else {
			s.text("add")
		}
		s.text(strings.Join(b.Members, ", "))
		if err := s.end(); err != nil {
			return err
		}
	}
	return s.close()
}

func writeTakeoff(f *excelize.File, st *styles, r *Results) error {
	s, err := newSheet(f, st, SheetTakeoff, []column{
		{"Item", 16}, {"Size", 7}, {"Order length (ft-in)", 12}, {"Order length (ft)", 9},
		{"Count", 8}, {"Board feet", 10}, {"Note", 36},
	})
	if err != nil {
		return err
	}
	line := func(item string, l TakeoffLine) error {
		s.begin(false)
		s.text(item)
		s.text(l.Size)
		if l.OrderLengthFt > 0 {
			s.text(FtIn(l.OrderLengthFt * 12))
			s.num(l.OrderLengthFt, cInt)
		} else {
			s.text("")
			s.text("")
		}
		s.integer(l.Count)
		s.num(l.BoardFeet, cNum1)
		s.text(l.Note)
		return s.end()
	}
	for _, group := range []struct {
		item  string
		lines []TakeoffLine
	}{{"Joists", r.Takeoff.Joists}, {"Blocking", r.Takeoff.Blocking}, {"Hangers", r.Takeoff.Hangers}} {
		for _, l := range group.lines {
			if err := line(group.item, l); err != nil {
				return err
			}
		}
	}
	t := r.Takeoff.Totals
	totals := []TakeoffLine{
		{Size: "all", Count: t.JoistCount, BoardFeet: t.JoistBoardFeet},
		{Size: "all", Count: t.BlockingPieces, BoardFeet: t.BlockingBoardFeet},
		{Size: "all", Count: t.Hangers},
		{Size: "all", Count: t.JoistCount + t.BlockingPieces, BoardFeet: t.BoardFeet},
	}
	for i, item := range []string{"Total joists", "Total blocking", "Total hangers", "Total lumber"} {
		if err := line(item, totals[i]); err != nil {
			return err
		}
	}
	return s.close()
}

func writeInputs(f *excelize.File, st *styles, r *Results) error {
	s, err := newSheet(f, st, SheetInputs, []column{
		{"Group", 16}, {"Name", 30}, {"Value", 30}, {"Unit", 8}, {"Source", 44},
	})
	if err != nil {
		return err
	}
	// A value is a number when it reads as one (loads, design values,
	// numeric settings): stored as a number, so the sheet can compute
	// with it and shows no thousands separators of ours.
	row := func(group, name, value, unit, source string) error {
		s.begin(false)
		s.text(group)
		s.text(name)
		if v, err := strconv.ParseFloat(value, 64); err == nil && finite(v) {
			s.num(v, cGen)
		} else {
			s.text(value)
		}
		s.text(unit)
		s.text(source)
		return s.end()
	}
	a := &r.Assumptions
	var rows [][5]string
	rows = append(rows, [5]string{"plan", "file", r.Plan, "", ""}, [5]string{"plan", "drawing units", r.DrawingUnits, "", ""})
	for _, c := range a.CodeEditions {
		rows = append(rows, [5]string{"code", "edition", c, "", ""})
	}
	for _, sw := range a.Switches {
		rows = append(rows, [5]string{"setting", sw.Name, sw.Value, sw.Unit, sw.Source})
	}
	for _, c := range a.Combinations {
		rows = append(rows, [5]string{"combination", fmtx.Combo(c), "", "", "ASCE 7-16 2.4.1 or project file"})
	}
	for _, z := range a.Zones {
		g := "zone " + z.Name
		rows = append(rows,
			[5]string{g, "use / ceiling", z.Use + " / " + z.Ceiling, "", ""},
			[5]string{g, "dead", fnum(z.DeadPsf), "psf", ""},
			[5]string{g, "live", fnum(z.LivePsf), "psf", ""},
			[5]string{g, "roof live", fnum(z.RoofLivePsf), "psf", ""},
			[5]string{g, "snow", fnum(z.SnowPsf), "psf", ""},
			[5]string{g, "wind down", fnum(z.WindDownPsf), "psf", ""},
			[5]string{g, "wind up", fnum(z.WindUpPsf), "psf", ""},
			[5]string{g, "live deflection limit", "L/" + fnum(z.LiveDeflectionLimit), "", "IBC 2018 Table 1604.3 or project file"},
			[5]string{g, "total deflection limit", "L/" + fnum(z.TotalDeflectionLimit), "", "IBC 2018 Table 1604.3 or project file"},
		)
	}
	for _, d := range a.DesignValues {
		name := strings.TrimSpace(d.Name + " " + d.Size + " " + speciesGrade(d.Species, d.Grade))
		rows = append(rows, [5]string{"design value", name, fnum(d.Value), d.Unit, d.Source})
	}
	for _, rw := range rows {
		if err := row(rw[0], rw[1], rw[2], rw[3], rw[4]); err != nil {
			return err
		}
	}
	return s.close()
}

// fnum formats a number plainly; non-finite as "n/a".
func fnum(v float64) string {
	if !finite(v) {
		return "n/a"
	}
	return strconv.FormatFloat(v, 'f', -1, 64)
}

// layerNotes describe the annotated drawing's layers on the Notes sheet.
var layerNotes = func() []string {
	var out []string
	for _, l := range markupLayers {
		out = append(out, "Annotated drawing: layer "+l.Name+": "+l.Meaning+".")
	}
	return append(out, "Annotated drawing: our layers' colours differ from every layer colour of the drawing; the key (layer "+LayerKey+") right of the plan names each colour.")
}()

func writeNotes(f *excelize.File, st *styles, r *Results) error {
	s, err := newSheet(f, st, SheetNotes, []column{{"Kind", 12}, {"Note", 120}})
	if err != nil {
		return err
	}
	note := func(kind, text string) error {
		s.begin(false)
		s.text(kind)
		s.text(text)
		return s.end()
	}
	for _, c := range Cautions {
		if err := note("caution", c); err != nil {
			return err
		}
	}
	for _, n := range r.Assumptions.Notes {
		if err := note("assumption", n); err != nil {
			return err
		}
	}
	for _, n := range layerNotes {
		if err := note("drawing", n); err != nil {
			return err
		}
	}
	return s.close()
}
