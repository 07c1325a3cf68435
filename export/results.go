package export

import "strings"

// Schema is the value of results.json's "schema" key. Bump the number when
// a key is renamed or removed; adding keys keeps it. Version 3 (issue 18)
// leaves the checks out of the members (they are their calculation's),
// writes the members' info lines once in "info_lists" (a member names its
// list in "info_list"), writes what every member of a mark has alike once
// in the mark's "shared", a member's source as its DXF "line" and no
// location where they can be derived, an uplift bearing's mark and support
// only where they cannot (json_share.go), and every number with the
// digits it carries (json_num.go, json_round.go). Version 2 moved the traces and
// factors of the members' checks into "calculations", written once for all
// the members checked alike (a member names its entry in "calculation");
// version 1 repeated them in every member. docs/RESULTS-SCHEMA.md lists
// every key.
const Schema = "framecheck-results/3"

// Check kinds, the values of Check.Kind.
const (
	KindBendingTop      = "bending-top"
	KindBendingBottom   = "bending-bottom"
	KindShear           = "shear"
	KindDeflectionLive  = "deflection-live"
	KindDeflectionTotal = "deflection-total"
	KindBearing         = "bearing"
)

// CheckKinds lists the check kinds in the order the schedule shows them.
var CheckKinds = []string{
	KindBendingTop, KindBendingBottom, KindShear,
	KindDeflectionLive, KindDeflectionTotal, KindBearing,
}

// Member statuses, the values of Member.Status and Mark.Status.
const (
	StatusPass  = "pass"
	StatusFail  = "fail"
	StatusError = "error"
)

// Results is the whole of a run's results, as results.json holds them. JSON
// names are the contract of issue 5; keep them. In the file (WriteJSON,
// ReadJSON) the checks' traces and the factors are not in the members but
// in the top-level "calculations" (see Schema); in memory every member
// carries its own (often shared) slices.
type Results struct {
	Schema string `json:"schema"` // Schema; WriteJSON always writes Schema
	// ToolVersion is the framecheck version that wrote the results.
	ToolVersion string `json:"tool_version,omitempty"`
	// Project is the project file's [project] table.
	Project ProjectInfo `json:"project"`
	Plan    string      `json:"plan"` // input file name
	// InputSHA256 is the SHA-256 of the drawing's bytes as checked (hex);
	// the run's manifest carries the same.
	InputSHA256 string `json:"input_sha256,omitempty"`
	// Datum states how positions along members are measured (DatumText).
	Datum        string        `json:"datum,omitempty"`
	DrawingUnits string        `json:"drawing_units"` // in | ft | mm | cm | m
	Members      []Member      `json:"members"`
	Marks        []Mark        `json:"marks"`
	BlockingRows []BlockingRow `json:"blocking_rows"`
	Uplift       UpliftReport  `json:"uplift"` // bearings under net uplift (connector demand)
	// LoadPath holds the beams, posts, connections and foundation loads
	// when the plan has beams or posts; nil otherwise.
	LoadPath    *LoadPath   `json:"load_path,omitempty"`
	Takeoff     Takeoff     `json:"takeoff"`
	Summary     Summary     `json:"summary"`
	Assumptions Assumptions `json:"assumptions"`
}

// ProjectInfo is who and what the calculation is for (the project
// file's [project] table), printed on every output.
type ProjectInfo struct {
	Name     string `json:"name"`
	Number   string `json:"number"`
	Address  string `json:"address"`
	Designer string `json:"designer"`
	Checker  string `json:"checker"`
	Revision string `json:"revision"`
	Date     string `json:"date"`
}

// Lines is the project's title block as text lines for the outputs:
// "Garage loft, project 2026-041, 12 Orchard Lane" and "Designer A.
// Designer; checker B. Checker; revision B; 2026-12-04", leaving out what
// is empty; none when everything is.
func (p ProjectInfo) Lines() []string {
	join := func(parts ...string) string {
		var keep []string
		for _, s := range parts {
			if s != "" && s != "project " && s != "designer " && s != "checker " && s != "revision " {
				keep = append(keep, s)
			}
		}
		return strings.Join(keep, ", ")
	}
	var out []string
	if l := join(p.Name, "project "+p.Number, p.Address); l != "" {
		out = append(out, l)
	}
	if l := join("designer "+p.Designer, "checker "+p.Checker, "revision "+p.Revision, p.Date); l != "" {
		out = append(out, l)
	}
	return out
}

// ZonePiece is a stretch of a member in one load zone.
type ZonePiece struct {
	Zone   string  `json:"zone"`
	FromIn float64 `json:"from_in"`
	ToIn   float64 `json:"to_in"`
}

// PointLoad is a point load a member carries (a point-load mark on the
// plan): where along the member, from Start and from its datum, and its
// loads by type, lb (service level, before the combinations' factors),
// with the dead load relied on against uplift.
type PointLoad struct {
	Name       string  `json:"name,omitempty"` // the mark's text or the [[point_load]] it names
	AtIn       float64 `json:"at_in"`
	FromFaceIn float64 `json:"from_face_in"`
	// the loads as TypeLoads has them (not embedded: the JSON utilities
	// walk named fields)
	DeadLb       float64 `json:"dead_lb"`
	LiveLb       float64 `json:"live_lb"`
	RoofLiveLb   float64 `json:"roof_live_lb"`
	SnowLb       float64 `json:"snow_lb"`
	WindDownLb   float64 `json:"wind_down_lb"`
	WindUpLb     float64 `json:"wind_up_lb"`
	UpliftDeadLb float64 `json:"uplift_dead_lb"`
}

// Member is one joist with its geometry, checks and outcome.
type Member struct {
	ID     string `json:"id"`
	Mark   string `json:"mark"`
	Run    string `json:"run,omitempty"` // run of adjacent parallel joists, e.g. "R2"
	Layer  string `json:"layer"`
	Handle string `json:"handle"`
	// Source names the drawn line, e.g. "plan.dxf:4410 (handle 2F1, layer JOISTS)".
	Source string `json:"source,omitempty"`
	// Location is where the member is on the plan, in feet-inches plan
	// coordinates, with its handle and the drawing's file named relative
	// to the current folder: "plan.dxf handle 43 (layer JOIST-FLOOR),
	// 49'-9 3/4\", 2'-0\" to 61'-11 1/4\", 2'-0\"".
	Location string `json:"location,omitempty"`
	// DatumIn is the distance from Start to the face of the first
	// bearing (its side toward the span), inches: the datum of every
	// position along the member the outputs print (FromFace).
	DatumIn float64 `json:"datum_in"`
	// Generated marks a joist that is not drawn: laid out in a bay shown
	// by a span symbol and a size callout; Handle and Source are then the
	// bay's outline or span line.
	Generated bool `json:"generated,omitempty"`
	// Start and End are in drawing units, as drawn.
	Start [2]float64 `json:"start"`
	End   [2]float64 `json:"end"`
	// StartIn and EndIn are Start and End in inches (world), for the DXF
	// markup; not part of the JSON. Zero values mean "derive from Start/End".
	StartIn [2]float64 `json:"-"`
	EndIn   [2]float64 `json:"-"`

	LengthIn     float64    `json:"length_in"`
	BearingsAtIn []float64  `json:"bearings_at_in"` // along the member from Start
	SpansIn      []float64  `json:"spans_in"`       // centre-to-centre of bearings
	OverhangsIn  [2]float64 `json:"overhangs_in"`   // [at start, at end]
	TribIn       float64    `json:"trib_in"`        // tributary width
	SpacingIn    float64    `json:"spacing_in"`     // on-centre spacing reported (0 if unknown)

	Size    string `json:"size"` // nominal, e.g. "2x10"
	Species string `json:"species"`
	Grade   string `json:"grade"`
	Zone    string `json:"zone"`
	// ZonePieces, for a member crossing load-zone edges, say where each
	// zone loads it (along the member from Start); absent otherwise.
	ZonePieces []ZonePiece `json:"zone_pieces,omitempty"`
	// PointLoads are the point loads on the member (absent when none),
	// which every combination takes with the zone loads by load type.
	PointLoads []PointLoad `json:"point_loads,omitempty"`

	// Calculation names the entry of results.json's "calculations" that
	// holds this member's check traces and factors; WriteJSON sets it.
	Calculation string  `json:"calculation,omitempty"`
	Checks      []Check `json:"checks"`
	Governing   string  `json:"governing"` // Kind of the check with the largest ratio
	MaxRatio    float64 `json:"max_ratio"`

	BlockingRowsPerSpan []int     `json:"blocking_rows_per_span"`
	BlockingAtIn        []float64 `json:"blocking_at_in"` // rows to add, along the member from Start
	// BlockingFromFaceIn are the same rows from the datum (DatumIn).
	BlockingFromFaceIn []float64 `json:"blocking_from_face_in,omitempty"`
	// DrawnBlockingAtIn are the rows drawn on the plan that the member
	// relied on (existing: not in the takeoff), along it from Start.
	DrawnBlockingAtIn []float64 `json:"drawn_blocking_at_in,omitempty"`
	// BlockingSteps are the solver's iterations that led to the rows,
	// and Factors the adjustment factors used (CM, Ct, CF, Cr, ...): both
	// for the written-out calculation in the report.
	BlockingSteps []BlockingStep `json:"blocking_steps,omitempty"`
	// Info holds notes that are not findings: the NDS 2018 4.4.1.2
	// lateral-support rule beside the calculated CL. (Uplift at the
	// bearings is in Results.Uplift.)
	Info    []string    `json:"info,omitempty"`
	Factors []TraceItem `json:"factors,omitempty"`

	Status   string   `json:"status"` // pass | fail | error
	Messages []string `json:"messages"`
}

// DatumText is results.json's "datum": how positions along a member are
// measured in every output.
const DatumText = "positions along a member are measured from the face of its first bearing (the side toward the span): *from_face_in in inches, feet-inches to 1/16 in elsewhere; datum_in is that face's distance from the member's drawn start"

// FromFace re-measures a position along m from its Start (inches) from
// the datum, the face of its first bearing.
func (m *Member) FromFace(atIn float64) float64 { return atIn - m.DatumIn }

// fromFaceList re-measures positions along m from the datum.
func (m *Member) fromFaceList(atIn []float64) []float64 {
	out := make([]float64, len(atIn))
	for i, v := range atIn {
		out[i] = m.FromFace(v)
	}
	return out
}

// Check is one design check of a member under one load combination.
type Check struct {
	Kind      string  `json:"kind"`  // one of CheckKinds
	Combo     string  `json:"combo"` // e.g. "D+L"
	Actual    float64 `json:"actual"`
	Allowable float64 `json:"allowable"`
	Unit      string  `json:"unit"` // psi, in, lbf ...
	Ratio     float64 `json:"ratio"`
	// Trace is every intermediate value; in results.json it is written in
	// the member's calculation, not beside the check.
	Trace []TraceItem `json:"trace,omitempty"`
}

// TraceItem is one intermediate value of a check (CD, CL, RB, M, ...).
type TraceItem struct {
	Name   string  `json:"name"`
	Value  float64 `json:"value"`
	Unit   string  `json:"unit"`
	Source string  `json:"source,omitempty"` // clause, table or equation
	// Formula and Subst let a report write the step out:
	// "le = 1.63 lu + 3 d = 1.63(56.0) + 3(7.25) = 113.0 in".
	Formula string `json:"formula,omitempty"` // e.g. "1.63 lu + 3 d"
	Subst   string `json:"subst,omitempty"`   // e.g. "1.63(56.0) + 3(7.25)"
}

// BlockingStep is one iteration of the blocking-row solver for a member:
// the rows per span tried, the bottom edge's unbraced length and CL, and
// the bending ratio that resulted.
type BlockingStep struct {
	RowsPerSpan int `json:"rows_per_span"`
	// AtIn are the rows added so far when rows are drawn (placed one at
	// a time rather than n per span), along the member from Start.
	AtIn  []float64 `json:"added_at_in,omitempty"`
	LuIn  float64   `json:"lu_in"`
	CL    float64   `json:"cl"`
	Ratio float64   `json:"ratio"`
}

// Mark is one line of the framing schedule: members identical for design.
type Mark struct {
	Mark                string     `json:"mark"`
	Size                string     `json:"size"`
	Species             string     `json:"species"`
	Grade               string     `json:"grade"`
	Zone                string     `json:"zone"`
	SpacingIn           float64    `json:"spacing_in"`
	SpansIn             []float64  `json:"spans_in"`
	OverhangsIn         [2]float64 `json:"overhangs_in"` // cantilevers [at start, at end], as members'
	Count               int        `json:"count"`
	BlockingRowsPerSpan []int      `json:"blocking_rows_per_span"`
	MaxRatio            float64    `json:"max_ratio"`
	Status              string     `json:"status"`
}

// BlockingRow is one line of blocking across a run of adjacent parallel
// joists at one position along the span.
type BlockingRow struct {
	ID         string  `json:"id"`          // e.g. "B1"
	Run        string  `json:"run"`         // run id, e.g. "R2"
	SpanIndex  int     `json:"span_index"`  // 0-based span of the run's members
	PositionIn float64 `json:"position_in"` // along the span from its first bearing's centre-line
	// FromFaceIn is the row's position along its members from the face
	// of their first bearing (the datum, Member.DatumIn).
	FromFaceIn float64   `json:"from_face_in"`
	Pieces     int       `json:"pieces"`   // joist-to-joist bays crossed
	ClearIn    []float64 `json:"clear_in"` // clear length of each piece
	Size       string    `json:"size"`     // blocking size = joist size
	Existing   bool      `json:"existing"` // already drawn on a blocking layer
	Members    []string  `json:"members"`  // ids of the members it crosses
	// Start and End of the row's line across the run, drawing units.
	Start [2]float64 `json:"start"`
	End   [2]float64 `json:"end"`
	// StartIn and EndIn in inches for the DXF markup; zero = derive.
	StartIn [2]float64 `json:"-"`
	EndIn   [2]float64 `json:"-"`
}

// Takeoff is the lumber and hardware list.
type Takeoff struct {
	Joists   []TakeoffLine `json:"joists"`
	Blocking []TakeoffLine `json:"blocking"`
	Hangers  []TakeoffLine `json:"hangers"`
	Totals   TakeoffTotals `json:"totals"`
}

// TakeoffLine is one line of the takeoff: a size (and for joists an order
// length) with its count and board feet.
type TakeoffLine struct {
	Size          string  `json:"size"`
	OrderLengthFt float64 `json:"order_length_ft"` // joists only; 0 otherwise
	Count         int     `json:"count"`           // pieces or hangers
	BoardFeet     float64 `json:"board_feet"`      // 0 for hangers
	Note          string  `json:"note,omitempty"`  // e.g. "special order or spliced length"
}

// TakeoffTotals sums the takeoff.
type TakeoffTotals struct {
	JoistCount        int     `json:"joist_count"`
	JoistBoardFeet    float64 `json:"joist_board_feet"`
	BlockingPieces    int     `json:"blocking_pieces"`
	BlockingBoardFeet float64 `json:"blocking_board_feet"`
	Hangers           int     `json:"hangers"`
	BoardFeet         float64 `json:"board_feet"`
}

// Summary counts members by status.
type Summary struct {
	Members int `json:"members"`
	Pass    int `json:"pass"`
	Fail    int `json:"fail"`
	Error   int `json:"error"`
}

// Assumptions records the basis of the run: code editions, combinations,
// switches, zones, the design values used and any notes.
type Assumptions struct {
	CodeEditions []string      `json:"code_editions"` // e.g. "NDS 2018 (ASD)"
	Combinations []string      `json:"combinations"`  // e.g. "D+0.75L+0.75(Lr or S)"
	Switches     []Setting     `json:"switches"`      // project settings, in file order
	Zones        []Zone        `json:"zones"`
	DesignValues []DesignValue `json:"design_values"`
	Notes        []string      `json:"notes"` // assumptions in words
}

// Setting is one project setting as used (after defaults).
type Setting struct {
	Name   string `json:"name"` // project-file key, e.g. "design.kcr"
	Value  string `json:"value"`
	Unit   string `json:"unit,omitempty"`
	Source string `json:"source,omitempty"` // "project file line 12", "default"
}

// Zone is one load zone with its area loads.
type Zone struct {
	Name                 string  `json:"name"`
	Use                  string  `json:"use"` // floor | roof
	DeadPsf              float64 `json:"dead_psf"`
	LivePsf              float64 `json:"live_psf"`
	RoofLivePsf          float64 `json:"roof_live_psf"`
	SnowPsf              float64 `json:"snow_psf"`
	WindDownPsf          float64 `json:"wind_down_psf"`
	WindUpPsf            float64 `json:"wind_up_psf"`
	Ceiling              string  `json:"ceiling"`
	LiveDeflectionLimit  float64 `json:"live_deflection_limit"`  // L/n; 0 = not checked
	TotalDeflectionLimit float64 `json:"total_deflection_limit"` // L/n; 0 = not checked
	// LongTermDeflectionLimit is the n of the NDS 2018 3.5.2 long-term
	// check; 0 = reported, not checked.
	LongTermDeflectionLimit float64 `json:"long_term_deflection_limit"`
	// UpliftDeadPsf is the dead load relied on against uplift, when the
	// project gives one other than dead_psf.
	UpliftDeadPsf *float64 `json:"uplift_dead_psf,omitempty"`
	// PitchRise12 is the roof slope, rise in 12 (0 flat); DeadOnSlope says
	// dead_psf is per sloped area (converted to the plan by 1/cos).
	PitchRise12 float64 `json:"pitch,omitempty"`
	DeadOnSlope bool    `json:"dead_on_slope,omitempty"`
}

// DesignValue is one reference design value or factor used, with its source.
type DesignValue struct {
	Species string  `json:"species"`
	Grade   string  `json:"grade"`
	Size    string  `json:"size"`
	Name    string  `json:"name"` // NDS symbol: Fb, Fv, Fc_perp, E, Emin, CF ...
	Value   float64 `json:"value"`
	Unit    string  `json:"unit"`   // psi, or "" for a factor
	Source  string  `json:"source"` // e.g. "NDS 2018 Supplement Table 4A"
}

// Cautions are shown on the Notes sheet (and in the report): the tool
// assists a qualified designer; see DOMAIN.md "Cautions".
var Cautions = []string{
	"framecheck assists a qualified designer; it does not replace engineering judgement or a licensed professional's review.",
	"Design values and code editions must be checked against those the local jurisdiction has adopted.",
	"Results for members outside the stated scope (notched or tapered members, I-joists, wet service without the wet_service switch) are not valid.",
	"Structural composite lumber (LVL, PSL, LSL) is checked only from the values the user enters for it (materials_file: the manufacturer's Fb, Fv, Fc_perp, E, Emin and size-factor exponent); framecheck builds in no product, and those values must be checked against the manufacturer's current literature.",
}
