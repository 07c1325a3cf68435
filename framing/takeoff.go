package framing

import (
	"math"
	"sort"
	"strconv"
	"strings"
)

// Takeoff rules (DOMAIN.md "Takeoff"): joists are ordered in even-foot
// lengths, at least 8 ft, and lengths over 24 ft are special-order or
// spliced (common practice, no source). Board feet = nominal thickness
// (in) x nominal depth (in) x length (ft) / 12.
const (
	minOrderFt     = 8
	specialOrderFt = 24
)

// JoistLine is one line of the joist takeoff.
type JoistLine struct {
	Size, Species, Grade string
	OrderLengthFt        int // member length rounded up to the next even foot, at least 8
	Count                int
	BoardFeet            float64
	SpecialOrder         bool // longer than 24 ft: special order or spliced
}

// BlockingLine is the blocking of one size.
type BlockingLine struct {
	Size          string
	Pieces        int
	TotalLengthIn float64 // sum of the pieces' clear lengths
	BoardFeet     float64
}

// HangerLine counts joist hangers of one joist size.
type HangerLine struct {
	Size  string
	Count int
}

// Takeoff is the material list of a plan.
type Takeoff struct {
	Joists   []JoistLine    // by size, species, grade, order length
	Blocking []BlockingLine // by size
	Hangers  []HangerLine   // by joist size
	// ExistingBlocking is the blocking drawn on joist layers
	// (Plan.DrawnBlocking), by size: in the drawing already, so not part
	// of Blocking (the rows to add); its board feet are in TotalBoardFeet.
	ExistingBlocking []BlockingLine
	// Totals
	JoistCount, BlockingPieces, HangerCount           int
	JoistBoardFeet, BlockingBoardFeet, TotalBoardFeet float64
	ExistingBlockingPieces                            int
	ExistingBlockingBoardFeet                         float64
}

// OrderLengthFt returns the order length of a member of lengthIn: rounded
// up to the next even foot, at least 8 ft.
func OrderLengthFt(lengthIn float64) int {
	ft := int(math.Ceil(lengthIn/12 - 1e-9))
	if ft%2 == 1 {
		ft++
	}
	return max(ft, minOrderFt)
}

// boardFeet returns nominal b x d x length(ft) / 12. A size given in
// actual inches ("1.75x11.875", "(2) 1.75x14": structural composite
// lumber, glulam) has no nominal size: its actual b x d is used, as such
// products are made to the size they are called. 0 for a size that is
// neither.
func boardFeet(size string, lengthFt float64) float64 {
	if b, d, err := NominalSize(size); err == nil {
		return float64(b*d) * lengthFt / 12
	}
	if b, d, ok := actualSize(size); ok {
		return b * d * lengthFt / 12
	}
	return 0
}

// actualSize reads a size written in actual inches, "1.75x11.875" or
// "(2) 1.75x14", as the total thickness and the depth.
func actualSize(size string) (bIn, dIn float64, ok bool) {
	plies, ply := splitPlies(size)
	parts := strings.Split(strings.ToLower(strings.TrimSpace(ply)), "x")
	if plies < 1 || len(parts) != 2 {
		return 0, 0, false
	}
	b, e1 := strconv.ParseFloat(strings.TrimSpace(parts[0]), 64)
	d, e2 := strconv.ParseFloat(strings.TrimSpace(parts[1]), 64)
	if e1 != nil || e2 != nil || !(b > 0 && d > 0) || math.IsInf(b, 0) || math.IsInf(d, 0) {
		return 0, 0, false
	}
	return float64(plies) * b, d, true
}

// BuildTakeoff counts every member (error members included: the lumber is
// in the drawing), the blocking pieces of rows and the hangers.
func BuildTakeoff(p *Plan, rows []BlockingRow) Takeoff {
	var t Takeoff
	type jk struct {
		size, species, grade string
		ft                   int
	}
	// each line with the board feet of one of its pieces, found once
	type line struct {
		*JoistLine
		pieceBF float64
	}
	joists := map[jk]line{}
	hangers := map[string]int{}
	for k := range p.Members {
		m := &p.Members[k]
		// a built-up member is its plies, ordered as single pieces
		n, ply := splitPlies(m.Size)
		pieces := max(1, n, m.Plies)
		key := jk{ply, m.Species, m.Grade, OrderLengthFt(m.SlopedLengthIn())}
		l, ok := joists[key]
		if !ok {
			l = line{&JoistLine{Size: ply, Species: m.Species, Grade: m.Grade, OrderLengthFt: key.ft,
				SpecialOrder: key.ft > specialOrderFt}, boardFeet(ply, float64(key.ft))}
			joists[key] = l
		}
		l.Count += pieces
		l.BoardFeet += float64(pieces) * l.pieceBF
		for _, h := range []bool{m.HangersStart, m.HangersEnd} {
			if h {
				hangers[m.Size]++
			}
		}
	}
	for _, l := range joists {
		t.Joists = append(t.Joists, *l.JoistLine)
	}
	sort.Slice(t.Joists, func(i, j int) bool {
		a, b := t.Joists[i], t.Joists[j]
		if a.Size != b.Size {
			return sizeLess(a.Size, b.Size)
		}
		if a.Species != b.Species {
			return a.Species < b.Species
		}
		if a.Grade != b.Grade {
			return a.Grade < b.Grade
		}
		return a.OrderLengthFt < b.OrderLengthFt
	})
	// Totals in the sorted order: summing in map order would change the
	// last digits of the board feet from one run to the next.
	for _, l := range t.Joists {
		t.JoistCount += l.Count
		t.JoistBoardFeet += l.BoardFeet
	}
	blocks := map[string]*BlockingLine{}
	for _, r := range rows {
		l := blocks[r.Size]
		if l == nil {
			l = &BlockingLine{Size: r.Size}
			blocks[r.Size] = l
		}
		for _, c := range r.ClearIn {
			l.Pieces++
			l.TotalLengthIn += c
			l.BoardFeet += boardFeet(r.Size, c/12)
		}
	}
	for _, l := range blocks {
		t.Blocking = append(t.Blocking, *l)
	}
	sort.Slice(t.Blocking, func(i, j int) bool { return sizeLess(t.Blocking[i].Size, t.Blocking[j].Size) })
	for _, l := range t.Blocking {
		t.BlockingPieces += l.Pieces
		t.BlockingBoardFeet += l.BoardFeet
	}
	for s, n := range hangers {
		t.Hangers = append(t.Hangers, HangerLine{Size: s, Count: n})
		t.HangerCount += n
	}
	sort.Slice(t.Hangers, func(i, j int) bool { return sizeLess(t.Hangers[i].Size, t.Hangers[j].Size) })
	t.ExistingBlocking = existingBlocking(p)
	for _, l := range t.ExistingBlocking {
		t.ExistingBlockingPieces += l.Pieces
		t.ExistingBlockingBoardFeet += l.BoardFeet
	}
	t.TotalBoardFeet = t.JoistBoardFeet + t.BlockingBoardFeet + t.ExistingBlockingBoardFeet
	t.tidy()
	return t
}

// tidy rounds every board-foot and length sum to 1e-9: a sum of pieces
// carries binary rounding (519.999999999999 for 520 board feet) that the
// spreadsheet would show, where results.json writes 520.
func (t *Takeoff) tidy() {
	r := func(v *float64) { *v = math.Round(*v*1e9) / 1e9 }
	for i := range t.Joists {
		r(&t.Joists[i].BoardFeet)
	}
	for _, ls := range [][]BlockingLine{t.Blocking, t.ExistingBlocking} {
		for i := range ls {
			r(&ls[i].BoardFeet)
			r(&ls[i].TotalLengthIn)
		}
	}
	for _, v := range []*float64{&t.JoistBoardFeet, &t.BlockingBoardFeet, &t.ExistingBlockingBoardFeet, &t.TotalBoardFeet} {
		r(v)
	}
}

// existingBlocking counts the blocking pieces drawn on joist layers by
// the size of the first member each joins; a piece's length is the clear
// space between the two members' faces (centre to centre less the
// dressed thickness, NDS 2018 Supplement Table 1B).
func existingBlocking(p *Plan) []BlockingLine {
	blocks := map[string]*BlockingLine{}
	for _, d := range p.DrawnBlocking {
		size := ""
		for _, k := range d.Members {
			if k >= 0 && k < len(p.Members) {
				size = p.Members[k].Size
				break
			}
		}
		l := blocks[size]
		if l == nil {
			l = &BlockingLine{Size: size}
			blocks[size] = l
		}
		clear := dist(d.From, d.To)
		if bIn, _, err := DressedSize(size); err == nil {
			clear = math.Max(0, clear-bIn)
		}
		l.Pieces++
		l.TotalLengthIn += clear
		l.BoardFeet += boardFeet(size, clear/12)
	}
	var out []BlockingLine
	for _, l := range blocks {
		out = append(out, *l)
	}
	sort.Slice(out, func(i, j int) bool { return sizeLess(out[i].Size, out[j].Size) })
	return out
}

// sizeLess orders nominal sizes by thickness, then depth ("2x8" before
// "2x10"); unparsable sizes sort after, by text.
func sizeLess(a, b string) bool {
	ab, ad, ea := NominalSize(a)
	bb, bd, eb := NominalSize(b)
	switch {
	case ea != nil || eb != nil:
		if (ea == nil) != (eb == nil) {
			return ea == nil
		}
		return a < b
	case ab != bb:
		return ab < bb
	}
	return ad < bd
}
