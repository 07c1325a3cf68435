package check

// DefaultCandidates are the sizes Size tries when given none (the
// project file's [sizing] default).
var DefaultCandidates = []string{"2x6", "2x8", "2x10", "2x12", "2x14"}

// Alternative is one candidate size as Size judged it.
type Alternative struct {
	Size           string
	RowsPerSpan    int     // blocking rows the size needs in each span
	MaxRatio       float64 // largest check ratio with those rows
	BoardFeetPerFt float64 // nominal b d / 12
	Cost           float64 // board feet of the joist plus blocking pieces x their weight in board feet
	Pass           bool
}

// SizingResult is the chosen size's full result and every candidate.
type SizingResult struct {
	Chosen       Result
	Alternatives []Alternative
}

// Size checks m at each candidate size (nil = DefaultCandidates), each
// with the blocking rows it needs, and chooses the most economical one
// that passes. Cost is counted in board feet: the joist's own (nominal
// b d / 12 x length in ft) plus one blocking piece per row per span, each
// weighted as blockingPieceWeightBf board feet (the project file's
// blocking_piece_weight_bf), so a deeper joist and more blocking can be
// compared; ties go to the lighter joist. When none passes, the chosen
// result is the candidate with the smallest largest ratio (status fail).
func Size(m Member, s Settings, candidates []string, blockingPieceWeightBf float64) SizingResult {
	if candidates == nil {
		candidates = DefaultCandidates
	}
	var out SizingResult
	best, bestFail := -1, -1
	var results []Result
	for _, c := range candidates {
		mc := m
		mc.Size = c
		r := CheckMember(mc, s)
		results = append(results, r)
		a := Alternative{Size: r.Size, RowsPerSpan: r.RowsPerSpan(), MaxRatio: r.MaxRatio, Pass: r.Status == StatusPass}
		if sec, err := ParseSize(c); err == nil && r.Status != StatusError {
			a.BoardFeetPerFt = sec.BoardFeetPerFt()
			// the rows to add (with rows drawn, spans may differ in rows)
			a.Cost = a.BoardFeetPerFt*m.LengthIn/12 + float64(len(r.BlockingAtIn))*blockingPieceWeightBf
		}
		out.Alternatives = append(out.Alternatives, a)
		i := len(out.Alternatives) - 1
		switch {
		case a.Pass:
			if best < 0 || a.Cost < out.Alternatives[best].Cost ||
				(a.Cost == out.Alternatives[best].Cost && a.BoardFeetPerFt < out.Alternatives[best].BoardFeetPerFt) {
				best = i
			}
		case r.Status == StatusFail:
			if bestFail < 0 || a.MaxRatio < out.Alternatives[bestFail].MaxRatio {
				bestFail = i
			}
		}
	}
	switch {
	case best >= 0:
		out.Chosen = results[best]
	case bestFail >= 0:
		out.Chosen = results[bestFail]
		out.Chosen.Messages = append(out.Chosen.Messages, "no candidate size passes; this is the closest")
	case len(results) > 0:
		out.Chosen = results[0]
	default:
		out.Chosen = errorResult(m, nil, errNoCandidates)
	}
	return out
}
