package check

// TraceItem is one step of a calculation as a report prints it, such as
// le = 113.0 in, "1.63 lu + 3 d", "1.63(56.0) + 3(7.25)", "NDS 2018 Table
// 3.3.3".
type TraceItem struct {
	Symbol  string  // le
	Value   float64 // 113.0
	Unit    string  // in
	Formula string  // 1.63 lu + 3 d
	Subst   Subst   // 1.63(56.0) + 3(7.25), printed by Subst.Text
	Ref     string  // NDS 2018 Table 3.3.3
}

// Check kinds.
const (
	KindBendingTop      = "bending-top"
	KindBendingBottom   = "bending-bottom"
	KindShear           = "shear"
	KindDeflectionLive  = "deflection-live"
	KindDeflectionTotal = "deflection-total"
	// KindDeflectionLongTerm is the NDS 2018 3.5.2 long-term deflection
	// (Kcr x dead-load deflection + live-type deflection), checked only
	// where the zone gives long_term_deflection_limit.
	KindDeflectionLongTerm = "deflection-long-term"
	KindBearing            = "bearing"
)

// CheckResult is one check at its governing load case.
type CheckResult struct {
	Kind      string  // one of the Kind constants
	Combo     string  // governing combination or service case, "D+L", "L (span 2)"
	Actual    float64 // fb, fv, deflection or fc_perp
	Allowable float64 // Fb', Fv', allowed deflection or Fc_perp'
	Unit      string  // psi or in
	Ratio     float64 // Actual / Allowable

	calc *calcRecord // numbers the trace is written from (see Trace)
}

// BlockingStep is one iteration of the blocking-row solver: rows per span
// (rows evenly spaced, no rows drawn) or the positions of the rows added
// so far (rows drawn: AtIn, along the member from its start), the bottom
// edge's governing unbraced length, CL and ratio.
type BlockingStep struct {
	RowsPerSpan int
	AtIn        []float64 // rows added at this step when rows are drawn; nil otherwise
	LuIn, CL    float64
	Ratio       float64
}

// Status values of a Result.
const (
	StatusPass  = "pass"
	StatusFail  = "fail"
	StatusError = "error"
)

// Result is the outcome of checking one member.
type Result struct {
	ID                   string
	Size, Species, Grade string // canonical names where known, else as given
	SpansIn              []float64
	OverhangsIn          [2]float64 // start, end
	Checks               []CheckResult
	Governing            string    // kind of the check with the largest ratio
	MaxRatio             float64   // its ratio
	RB                   float64   // largest slenderness ratio of an edge in compression
	BlockingRowsPerSpan  []int     // rows added, per span
	BlockingAtIn         []float64 // positions of the added rows along the member (only the rows to add)
	DrawnBlockingAtIn    []float64 // drawn rows the member relied on (existing, not in the takeoff)
	BlockingSteps        []BlockingStep
	// Values are the reference values used, with their source; nil when
	// none were found. Members checked alike share them (a pointer: the
	// plan holds a result per member, and the values are 160 bytes).
	Values   *DesignValues
	Factors  []TraceItem // CD per combination, CM, Ct, CF, Cfu, Ci, Cr, ...
	Status   string      // StatusPass, StatusFail or StatusError
	Messages []string    // why it failed or errored
	Info     []string    // NDS 4.4.1.2 rule, ...
	// Reactions are the ASD support reactions at each bearing, in bearing
	// order: the connector demand (down and up) at every joint.
	Reactions []Reaction
}

// Reaction is one bearing's largest downward and largest net uplift
// reaction over the strength load cases (ASCE 7-16 2.4.1 ASD combinations,
// live-type loads patterned as for the checks), with the case that gives
// each. Reactions are found by statics of the analysed member (check/beam);
// at an end that is part of its bearing the load on the piece past the
// centre-line is added to the reaction. A value of 0 (with an empty combo)
// means no case gives a reaction of that sign.
type Reaction struct {
	Bearing   int     // 0-based index into Member.Bearings
	AtIn      float64 // bearing centre-line, from the member start
	DownLb    float64 // largest reaction pressing the member onto the support, lb (>= 0)
	DownCombo string  // its case, as CheckResult.Combo names cases
	UpLb      float64 // largest net uplift, lb, as a positive magnitude (>= 0)
	UpCombo   string  // its case, e.g. "0.6D+0.6W(up)"
	// UpCD is the load duration factor of UpCombo (NDS 2018 2.3.2, Table
	// 2.3.2: 1.6 for wind): the CD at which a connector's allowable load
	// is compared with UpLb.
	UpCD float64
}

// RowsPerSpan returns the number of blocking rows the result added in the
// first span (the same in every span when no rows are drawn), or 0. With
// rows drawn the spans may differ: see BlockingRowsPerSpan and
// BlockingAtIn.
func (r *Result) RowsPerSpan() int {
	if len(r.BlockingRowsPerSpan) == 0 {
		return 0
	}
	return r.BlockingRowsPerSpan[0]
}
