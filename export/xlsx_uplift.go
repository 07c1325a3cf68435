package export

import (
	"strconv"
	"strings"

	"framecheck/export/internal/fmtx"
)

// upliftColumns are the Uplift sheet's columns: one row per support line.
var upliftColumns = []column{
	{"Support line", 26}, {"Support kind", 13}, {"Bearings with uplift", 9}, {"Flagged", 8},
	{"Largest uplift (lb)", 10}, {"Total uplift (lb)", 10},
	{"Required connector capacity per bearing, ASD (lb)", 15}, {"CD", 6}, {"Combination", 16},
	{"Members", 36}, {"Note", 70},
}

// upliftMembersShown is how many member ids a row of the Uplift sheet
// lists before "and N more".
const upliftMembersShown = 30

// upliftSheet is the Uplift sheet: the bearings under net uplift grouped
// by the support line they bear on, each line with the count of such
// bearings, how many are flagged, the largest and the total uplift, and
// the connector capacity each bearing needs: the largest uplift at ASD
// level, to be met by a connector's allowable load for the combination's
// load duration (CD = 1.6 for wind, NDS 2018 Table 2.3.2). No product is
// named: the tool states the demand, the designer picks the part. A line
// whose uplift is all below the report threshold is listed without a
// required capacity; with no uplift at all, one row says so. Its rows are
// spliced in (spliceSheets), as the Members sheet's are.
func upliftSheet(r *Results) splicedSheet {
	lines := UpliftLines(r.Uplift.Bearings)
	ss := splicedSheet{name: SheetUplift, cols: upliftColumns, rows: len(lines),
		row: func(s *rowCells, i int) { upliftSheetRow(s, &lines[i], r.Uplift.ReportLb) }}
	if len(lines) == 0 {
		ss.rows = 1
		ss.row = func(s *rowCells, _ int) {
			s.begin(false)
			s.text("none")
			for i := 1; i < len(upliftColumns)-1; i++ {
				s.text("")
			}
			s.text("No bearing has a net uplift reaction under any load combination.")
		}
	}
	return ss
}

// upliftSheetRow fills s with support line l's cells, in upliftColumns order.
func upliftSheetRow(s *rowCells, l *UpliftLine, reportLb float64) {
	s.begin(false)
	s.text(l.Support)
	s.text(l.Kind)
	s.integer(l.Count)
	s.integer(l.Flagged)
	s.num(l.MaxLb, cLb)
	s.num(l.TotalLb, cLb)
	if l.Flagged > 0 {
		s.num(DemandLb(l.MaxLb), cLb) // a demand: up to the next pound
	} else {
		s.text("")
	}
	s.num(l.CD, cRatio)
	s.text(fmtx.Combo(l.Combo))
	s.text(memberList(l.Members))
	s.text(upliftNote(*l, reportLb))
}

// upliftNote says what a support line's row asks of the designer.
func upliftNote(l UpliftLine, reportLb float64) string {
	if l.Flagged == 0 {
		return "Every uplift on this line is below design.uplift_report_lb (" + fnum(reportLb) +
			" lb): listed, not flagged."
	}
	note := "At each flagged bearing, a connector whose allowable load at ASD level for this load duration (CD = " +
		fnum(l.CD) + ", NDS 2018 Table 2.3.2) is at least the required capacity; the designer picks the part."
	if l.Flagged < l.Count {
		note += " " + strconv.Itoa(l.Count-l.Flagged) + " bearing(s) below " + fnum(reportLb) + " lb are listed, not flagged."
	}
	return note
}

// memberList joins member ids, the first upliftMembersShown of them.
func memberList(ids []string) string {
	if len(ids) <= upliftMembersShown {
		return strings.Join(ids, ", ")
	}
	return strings.Join(ids[:upliftMembersShown], ", ") + " and " + strconv.Itoa(len(ids)-upliftMembersShown) + " more"
}
