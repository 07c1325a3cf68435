package export

import (
	"bufio"
	"cmp"
	"math"
	"slices"
	"strconv"
)

// UpliftReport is results.json's "uplift" section: every bearing that a
// net uplift reaction pulls off its support under some load combination,
// with the ASD reaction and the combination that gives it. The tool states
// the demand; the designer picks the connector. Bearings from ReportLb up
// are flagged; smaller uplift is listed, not flagged.
type UpliftReport struct {
	// ReportLb is design.uplift_report_lb: uplift at or above it is
	// flagged.
	ReportLb float64         `json:"report_lb"`
	Bearings []UpliftBearing `json:"bearings"` // in member order, then along each member
}

// UpliftBearing is one bearing under net uplift.
type UpliftBearing struct {
	Member  string `json:"member"`  // member id, e.g. "M12"
	Mark    string `json:"mark"`    // its mark, "" when it has none
	Bearing int    `json:"bearing"` // 1-based, along the member from its Start
	// Support names the support line the bearing is on, as its layer and
	// handle ("WALL-EXT handle 2F1"), or its layer and DXF line when the
	// drawing has no handles; "" when not known. A double-line wall is
	// named by its first line.
	Support       string `json:"support"`
	SupportLayer  string `json:"support_layer"`
	SupportHandle string `json:"support_handle"`
	SupportKind   string `json:"support_kind"` // bearing-wall, dropped-beam, flush-beam, ledger
	// AtIn is the bearing centre-line along the member from its Start, as
	// Member.BearingsAtIn; Point is that point in drawing units.
	AtIn float64 `json:"at_in"`
	// FromFaceIn is AtIn from the member's datum (Member.DatumIn).
	FromFaceIn float64    `json:"from_face_in"`
	Point      [2]float64 `json:"point"`
	// PointIn is Point in inches (world), for the DXF markup; not part of
	// the JSON. Zero means "derive from Point".
	PointIn [2]float64 `json:"-"`
	// UpliftLb is the largest net uplift reaction, ASD (ASCE 7-16 2.4.1
	// combinations), lb: the load a connector must resist at this bearing.
	UpliftLb float64 `json:"uplift_lb"`
	Combo    string  `json:"combo"` // the combination that gives it, e.g. "0.6D+0.6W(up)"
	// CD is that combination's load duration factor (NDS 2018 Table
	// 2.3.2; 1.6 with wind): a connector's allowable load at this CD must
	// be at least UpliftLb.
	CD      float64 `json:"cd"`
	Flagged bool    `json:"flagged"` // UpliftLb >= ReportLb
}

// UpliftLine is the uplift on one support line: what the Uplift sheet and
// the report show.
type UpliftLine struct {
	Support string // UpliftBearing.Support, or "(support not known)"
	Kind    string
	Count   int // bearings with net uplift
	Flagged int // of which flagged
	MaxLb   float64
	TotalLb float64
	// Combo and CD are those of the largest uplift.
	Combo   string
	CD      float64
	Members []string // ids, in the order met
}

// unknownSupport names the group of bearings whose support line is not
// known.
const unknownSupport = "(support not known)"

// UpliftLines groups the bearings by support line, in the order each line
// is first met, and sums each group.
func UpliftLines(bs []UpliftBearing) []UpliftLine {
	var out []UpliftLine
	at := map[string]int{}
	for _, b := range bs {
		key := b.Support
		if key == "" {
			key = unknownSupport
		}
		i, ok := at[key]
		if !ok {
			i = len(out)
			at[key] = i
			out = append(out, UpliftLine{Support: key, Kind: b.SupportKind})
		}
		l := &out[i]
		l.Count++
		if b.Flagged {
			l.Flagged++
		}
		l.TotalLb += b.UpliftLb
		if b.UpliftLb > l.MaxLb || l.Combo == "" {
			l.MaxLb, l.Combo, l.CD = b.UpliftLb, b.Combo, b.CD
		}
		if n := len(l.Members); n == 0 || l.Members[n-1] != b.Member {
			l.Members = append(l.Members, b.Member)
		}
	}
	return out
}

// SortUplift orders bearings by member (in the order of members), then
// along the member; members not in order go last, by id.
func SortUplift(bs []UpliftBearing, members []Member) {
	rank := make(map[string]int, len(members))
	for i := range members {
		rank[members[i].ID] = i
	}
	key := func(id string) int {
		if r, ok := rank[id]; ok {
			return r
		}
		return math.MaxInt
	}
	slices.SortStableFunc(bs, func(a, b UpliftBearing) int {
		return cmp.Or(cmp.Compare(key(a.Member), key(b.Member)), cmp.Compare(a.Member, b.Member), cmp.Compare(a.Bearing, b.Bearing))
	})
}

// upliftFinite reports whether every number of u that reaches the JSON is
// finite: Sanitize's fast path, as membersFinite is for the members.
func upliftFinite(u *UpliftReport) bool {
	ok := func(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
	if !ok(u.ReportLb) {
		return false
	}
	for i := range u.Bearings {
		b := &u.Bearings[i]
		if !ok(b.AtIn) || !ok(b.FromFaceIn) || !ok(b.Point[0]) || !ok(b.Point[1]) || !ok(b.UpliftLb) || !ok(b.CD) {
			return false
		}
	}
	return true
}

// writeUpliftJSON writes the "uplift" value: report_lb, then the bearings one
// per line. With marks nil (schema 2), each field by field exactly as
// encoding/json writes an UpliftBearing (TestUpliftEncoderMatchesMarshal
// holds it to that). With marks (member id to mark, schema 3), numbers
// with the digits they carry, and a bearing's "mark" left out when it is
// its member's, its "support" when upliftSupportText gives it back from
// support_layer and support_handle.
func writeUpliftJSON(w *bufio.Writer, u *UpliftReport, marks map[string]string) error {
	var o jsonOut
	o.round = marks != nil
	o.b = append(o.b, '{')
	o.first = true
	o.num("report_lb", u.ReportLb)
	o.key("bearings")
	if o.err != nil {
		return o.err
	}
	w.Write(o.b)
	if len(u.Bearings) == 0 {
		w.WriteString("[]}")
		return nil
	}
	w.WriteString("[\n")
	var buf []byte
	for i := range u.Bearings {
		b, err := encodeUpliftBearing(buf[:0], &u.Bearings[i], marks)
		if err != nil {
			return err
		}
		buf = b
		w.WriteString("  ")
		w.Write(b)
		if i < len(u.Bearings)-1 {
			w.WriteByte(',')
		}
		w.WriteByte('\n')
	}
	w.WriteString(" ]}")
	return nil
}

// encodeUpliftBearing appends b's JSON to dst; marks as writeUpliftJSON.
func encodeUpliftBearing(dst []byte, b *UpliftBearing, marks map[string]string) ([]byte, error) {
	var o jsonOut
	o.round = marks != nil
	o.b = append(dst, '{')
	o.first = true
	o.str("member", b.Member)
	if mk, ok := marks[b.Member]; marks == nil || !ok || mk != b.Mark {
		o.str("mark", b.Mark)
	}
	o.key("bearing")
	o.b = strconv.AppendInt(o.b, int64(b.Bearing), 10)
	if marks == nil || b.SupportHandle == "" || upliftSupportText(b.SupportLayer, b.SupportHandle) != b.Support {
		o.str("support", b.Support)
	}
	o.str("support_layer", b.SupportLayer)
	o.str("support_handle", b.SupportHandle)
	o.str("support_kind", b.SupportKind)
	o.num("at_in", b.AtIn)
	o.num("from_face_in", b.FromFaceIn)
	o.coords("point", b.Point[:])
	o.num("uplift_lb", b.UpliftLb)
	o.str("combo", b.Combo)
	o.num("cd", b.CD)
	o.key("flagged")
	o.b = strconv.AppendBool(o.b, b.Flagged)
	o.b = append(o.b, '}')
	return o.b, o.err
}
