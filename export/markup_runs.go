package export

import (
	"math"
	"regexp"
	"sort"
	"strconv"
	"strings"
)

// CheckWord is how the markup names a governing check kind: BENDING,
// BENDING (BOTTOM) for the bottom edge in compression, SHEAR, DEFL LIVE, DEFL TOTAL, DEFL LONG-TERM,
// BEARING; other kinds upper-cased.
func CheckWord(kind string) string {
	switch kind {
	case KindBendingTop:
		return "BENDING"
	case KindBendingBottom:
		return "BENDING (BOTTOM)"
	case KindShear:
		return "SHEAR"
	case KindDeflectionLive:
		return "DEFL LIVE"
	case KindDeflectionTotal:
		return "DEFL TOTAL"
	case "deflection-long-term":
		return "DEFL LONG-TERM"
	case KindBearing:
		return "BEARING"
	}
	return strings.ToUpper(strings.ReplaceAll(kind, "-", " "))
}

// RunLabel is the label of a group of members of one run and mark, from
// the worst of them: "J12 2x10@16 BENDING 1.62" (mark, or id when it has
// none; size@spacing in inches to 0.1; governing check; ratio to 0.01).
func RunLabel(worst *Member) string {
	name := worst.Mark
	if name == "" {
		name = worst.ID
	}
	s := name + " " + worst.Size
	if worst.SpacingIn > 0 {
		s += "@" + strconv.FormatFloat(math.Round(worst.SpacingIn*10)/10, 'f', -1, 64)
	}
	if worst.Governing != "" {
		s += " " + CheckWord(worst.Governing)
	}
	return s + " " + strconv.FormatFloat(worst.MaxRatio, 'f', 2, 64)
}

var (
	reNearest = regexp.MustCompile(`nearest support is ([0-9.]+) in away`)
	reLeadID  = regexp.MustCompile(`^[A-Z]+[0-9]+ `)
)

// ErrorReason shortens a member's first message to what the markup says
// beside it: "NO BEARING, 6\" SHORT" for an end that reaches no support
// (the gap to the nearest support in whole inches, rounded up), "NO LOAD
// ZONE", "CONFLICTING CALLOUTS", "CARRIES A BEAM"; otherwise the message
// up to its first ";" or " (", without a leading member id, upper-cased
// and cut to 40 characters.
func ErrorReason(msg string) string {
	low := strings.ToLower(msg)
	switch {
	case strings.Contains(low, "reaches no support"):
		if g := reNearest.FindStringSubmatch(msg); g != nil {
			if v, err := strconv.ParseFloat(g[1], 64); err == nil {
				return "NO BEARING, " + strconv.Itoa(int(math.Ceil(v-1e-9))) + `" SHORT`
			}
		}
		return "NO BEARING"
	case strings.Contains(low, "outside every zone") || strings.Contains(low, "no default zone"):
		return "NO LOAD ZONE"
	case strings.Contains(low, "conflicting callouts"):
		return "CONFLICTING CALLOUTS"
	case strings.Contains(low, "flush beam ends on"):
		return "CARRIES A BEAM"
	}
	s := reLeadID.ReplaceAllString(msg, "")
	for _, cut := range []string{";", " ("} {
		if i := strings.Index(s, cut); i > 0 {
			s = s[:i]
		}
	}
	s = strings.ToUpper(strings.TrimSpace(s))
	if len(s) > 40 {
		s = strings.TrimSpace(s[:39]) + "~"
	}
	if s == "" {
		s = "NOT CHECKED"
	}
	return s
}

// runLabels groups the members not in error by run and mark (in order of
// first appearance) and places one RunLabel per group at the midpoint of
// the group's middle member (across the members), moved midway toward its
// nearest parallel neighbour of the run, along the members: between two
// joist lines, on neither. A member with no neighbour gets it half its
// spacing (at least 1.2 text heights) to the side. It also places each
// member's id at its midpoint, 1.1 id heights off its line, on the side
// away from a label. A label wider than 0.7 of its member gets a smaller
// height. side[i] is +1 when a label lies on member i's +n side, -1 on its
// -n side, 0 when none does.
func runLabels(r *Results, ends [][2][2]float64, h float64) (labels, ids []Label, side []float64) {
	type group struct{ idx []int }
	var order []string
	groups := map[string]*group{}
	for i := range r.Members {
		mb := &r.Members[i]
		if mb.Status == StatusError {
			continue
		}
		key := mb.Run + "\x00" + mb.Mark
		if mb.Run == "" && mb.Mark == "" {
			key = "\x00" + mb.ID
		}
		g := groups[key]
		if g == nil {
			g = &group{}
			groups[key] = g
			order = append(order, key)
		}
		g.idx = append(g.idx, i)
	}
	labelSide := make([]float64, len(r.Members)) // -1: a label is on the member's -n side, +1 on its +n side
	byRun := map[string][]int{}
	for i := range r.Members {
		if run := r.Members[i].Run; run != "" {
			byRun[run] = append(byRun[run], i)
		}
	}
	for _, key := range order {
		g := groups[key]
		a0, b0 := ends[g.idx[0]][0], ends[g.idx[0]][1]
		nv := normal(a0, b0)
		off := func(i int) float64 {
			a, b := ends[i][0], ends[i][1]
			return ((a[0]+b[0])/2)*nv[0] + ((a[1]+b[1])/2)*nv[1]
		}
		sort.SliceStable(g.idx, func(x, y int) bool { return off(g.idx[x]) < off(g.idx[y]) })
		worst := g.idx[0]
		for _, i := range g.idx {
			if r.Members[i].MaxRatio > r.Members[worst].MaxRatio {
				worst = i
			}
		}
		k := g.idx[len(g.idx)/2]
		a, b := ends[k][0], ends[k][1]
		mid := [2]float64{(a[0] + b[0]) / 2, (a[1] + b[1]) / 2}
		// The nearest neighbour of k in its run (its group when it has no
		// run), on the -n side if it has one there, else on the +n side.
		pool := g.idx
		if run := r.Members[k].Run; run != "" {
			pool = byRun[run]
		}
		var shift float64
		below, above := -1, -1
		for _, j := range pool {
			if j == k || !alongside(ends[j], ends[k]) {
				continue
			}
			d := off(j) - off(k)
			switch {
			case d < -1e-6 && (below < 0 || d > off(below)-off(k)):
				below = j
			case d > 1e-6 && (above < 0 || d < off(above)-off(k)):
				above = j
			}
		}
		switch {
		case below >= 0:
			shift = (off(below) - off(k)) / 2
			labelSide[below], labelSide[k] = 1, -1
		case above >= 0:
			shift = (off(above) - off(k)) / 2
			labelSide[above], labelSide[k] = -1, 1
		default:
			gap := r.Members[k].SpacingIn
			if gap <= 0 {
				gap = r.Members[k].TribIn
			}
			shift = -math.Max(gap/2, 1.2*h)
			labelSide[k] = -1
		}
		at := [2]float64{mid[0] + shift*nv[0], mid[1] + shift*nv[1]}
		text := RunLabel(&r.Members[worst])
		lb := Label{At: at, AngleDeg: readableAngle(a, b), Text: text}
		// No wider than 0.7 of the member, so the labels of bays side by
		// side stay apart (a character taken as 0.9 of the text height).
		if lenIn := math.Hypot(b[0]-a[0], b[1]-a[1]); lenIn > 0 {
			if fit := 0.7 * lenIn / (0.9 * float64(len(text))); fit < h {
				lb.HeightIn = fit
			}
		}
		labels = append(labels, lb)
	}
	hid := IDHeightFactor * h
	ids = make([]Label, 0, len(r.Members)) // one id a member: made once, not grown
	for i := range r.Members {
		a, b := ends[i][0], ends[i][1]
		nv := normal(a, b)
		side := 1.0
		if labelSide[i] > 0 {
			side = -1
		}
		d := side * 1.1 * hid
		mid := [2]float64{(a[0]+b[0])/2 + d*nv[0], (a[1]+b[1])/2 + d*nv[1]}
		ids = append(ids, Label{At: mid, AngleDeg: readableAngle(a, b), Text: r.Members[i].ID, HeightIn: hid})
	}
	return labels, ids, labelSide
}

// alongside reports whether the lines p and q are parallel (within 1
// degree, DOMAIN.md) and overlap along their length.
func alongside(p, q [2][2]float64) bool {
	ux, uy := q[1][0]-q[0][0], q[1][1]-q[0][1]
	lq := math.Hypot(ux, uy)
	vx, vy := p[1][0]-p[0][0], p[1][1]-p[0][1]
	lp := math.Hypot(vx, vy)
	if lq == 0 || lp == 0 || math.Abs(ux*vy-uy*vx) > math.Sin(math.Pi/180)*lq*lp {
		return false
	}
	t0 := ((p[0][0]-q[0][0])*ux + (p[0][1]-q[0][1])*uy) / lq
	t1 := ((p[1][0]-q[0][0])*ux + (p[1][1]-q[0][1])*uy) / lq
	return math.Max(t0, t1) > 0 && math.Min(t0, t1) < lq
}

// errorReasons places beside each member in error "M14 ERROR: " and its
// ErrorReason, along the member at its midpoint, 0.7 text height off its
// line.
func errorReasons(r *Results, ends [][2][2]float64, h float64) []Label {
	var out []Label
	for i := range r.Members {
		mb := &r.Members[i]
		if mb.Status != StatusError {
			continue
		}
		reason := "NOT CHECKED"
		if len(mb.Messages) > 0 {
			reason = ErrorReason(mb.Messages[0])
		}
		a, b := ends[i][0], ends[i][1]
		nv := normal(a, b)
		at := [2]float64{(a[0]+b[0])/2 - 0.7*h*nv[0], (a[1]+b[1])/2 - 0.7*h*nv[1]}
		out = append(out, Label{At: at, AngleDeg: readableAngle(a, b), Text: mb.ID + " ERROR: " + reason})
	}
	return out
}

// BlockingNote is the note of a run's rows to add. rowsAt holds, per span,
// the positions of the rows to add (inches along the span, as
// BlockingRow.PositionIn) and spansIn the run's spans.
// Rows evenly spaced in every span, the same number in each, read "ADD
// BLOCKING 2 ROWS @ 1/3 PTS" (1 row: "@ MIDSPAN"; several spans: "EACH
// SPAN" added); otherwise the positions are listed, span by span: "ADD
// BLOCKING 2 ROWS AT 4'-6\", 9'-0\"" (the markup lists them from the
// datum, the face of the first bearing). Evenly means within 1/2 in of span
// x k/(n+1) (common practice, no source).
func BlockingNote(rowsAt [][]float64, spansIn []float64) string {
	return blockingNote(rowsAt, spansIn, nil)
}

// blockingNote is BlockingNote listing, when the rows are not evenly
// spaced, the positions listAt (same shape as rowsAt; nil: rowsAt).
//
// Positions from the datum (listAt given) say so, and name the span each
// is in after it: "ADD BLOCKING 2 ROWS AT 8'-9 1/4\" (SPAN 1); 14'-9 1/4\"
// (SPAN 2) FROM 1ST BEARING FACE", so that a position past the first span
// is not read as one into its own.
func blockingNote(rowsAt [][]float64, spansIn []float64, listAt [][]float64) string {
	datum := listAt != nil
	if listAt == nil {
		listAt = rowsAt
	}
	total, n := 0, -1
	even := true
	for s, at := range rowsAt {
		total += len(at)
		if len(at) == 0 {
			continue
		}
		if n >= 0 && len(at) != n {
			even = false
		}
		n = len(at)
		if s >= len(spansIn) {
			even = false
			continue
		}
		sorted := append([]float64(nil), at...)
		sort.Float64s(sorted)
		for j, p := range sorted {
			if math.Abs(p-spansIn[s]*float64(j+1)/float64(len(at)+1)) > 0.5 {
				even = false
			}
		}
	}
	spansWithRows := 0
	for _, at := range rowsAt {
		if len(at) > 0 {
			spansWithRows++
		}
	}
	rows := func(k int) string {
		if k == 1 {
			return "1 ROW"
		}
		return strconv.Itoa(k) + " ROWS"
	}
	if even && n > 0 && (spansWithRows == len(spansIn) || len(spansIn) <= 1) {
		s := "ADD BLOCKING " + rows(n) + " @ "
		if n == 1 {
			s += "MIDSPAN"
		} else {
			s += "1/" + strconv.Itoa(n+1) + " PTS"
		}
		if len(spansIn) > 1 {
			s += " EACH SPAN"
		}
		return s
	}
	var parts []string
	for s, at := range listAt {
		if len(at) == 0 {
			continue
		}
		sorted := append([]float64(nil), at...)
		sort.Float64s(sorted)
		ps := make([]string, len(sorted))
		for j, p := range sorted {
			ps[j] = FtIn(p)
		}
		p := strings.Join(ps, ", ")
		switch {
		case len(listAt) > 1 && datum:
			p += " (SPAN " + strconv.Itoa(s+1) + ")"
		case len(listAt) > 1:
			p = "SPAN " + strconv.Itoa(s+1) + " " + p
		}
		parts = append(parts, p)
	}
	note := "ADD BLOCKING " + rows(total) + " AT " + strings.Join(parts, "; ")
	if datum {
		note += " FROM 1ST BEARING FACE"
	}
	return note
}

// blockingNotes places one BlockingNote per run with rows to add, centred
// on the run's first row to add, along it, 0.8 text height to its side.
func blockingNotes(r *Results, toInch, h float64) []Label {
	type run struct {
		first  int
		rowsAt [][]float64 // along each span from its first bearing's centre-line
		faceAt [][]float64 // the same rows from the datum (FromFaceIn)
	}
	var order []string
	runs := map[string]*run{}
	byID := map[string]*Member{}
	for i := range r.Members {
		byID[r.Members[i].ID] = &r.Members[i]
	}
	spansOf := map[string][]float64{}
	for i := range r.BlockingRows {
		br := &r.BlockingRows[i]
		if br.Existing {
			continue
		}
		ru := runs[br.Run]
		if ru == nil {
			ru = &run{first: i}
			runs[br.Run] = ru
			order = append(order, br.Run)
		}
		for len(ru.rowsAt) <= br.SpanIndex {
			ru.rowsAt = append(ru.rowsAt, nil)
			ru.faceAt = append(ru.faceAt, nil)
		}
		ru.rowsAt[br.SpanIndex] = append(ru.rowsAt[br.SpanIndex], br.PositionIn)
		ru.faceAt[br.SpanIndex] = append(ru.faceAt[br.SpanIndex], br.FromFaceIn)
		if _, ok := spansOf[br.Run]; !ok {
			for _, id := range br.Members {
				if mb := byID[id]; mb != nil && len(mb.SpansIn) > 0 {
					spansOf[br.Run] = mb.SpansIn
					break
				}
			}
		}
	}
	var out []Label
	for _, id := range order {
		ru := runs[id]
		spans := spansOf[id]
		for len(ru.rowsAt) < len(spans) {
			ru.rowsAt = append(ru.rowsAt, nil)
			ru.faceAt = append(ru.faceAt, nil)
		}
		br := &r.BlockingRows[ru.first]
		a, b := inches(br.Start, br.End, br.StartIn, br.EndIn, toInch)
		nv := normal(a, b)
		at := [2]float64{(a[0]+b[0])/2 + 0.8*h*nv[0], (a[1]+b[1])/2 + 0.8*h*nv[1]}
		out = append(out, Label{At: at, AngleDeg: readableAngle(a, b), Text: blockingNote(ru.rowsAt, spans, ru.faceAt)})
	}
	return out
}
