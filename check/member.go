package check

import (
	"errors"
	"fmt"
	"math"
	"sort"
)

// AreaLoads are the area loads on a member's tributary width, psf. Wind is
// at strength level; WindUpPsf is the magnitude of the suction (uplift),
// given as a positive number.
type AreaLoads struct {
	DeadPsf     float64 // D, including self-weight
	LivePsf     float64 // L, floor live
	RoofLivePsf float64 // Lr
	SnowPsf     float64 // S
	WindDownPsf float64 // W toward the member
	WindUpPsf   float64 // W away from the member
	// UpliftDeadPsf is the dead load relied on to resist uplift: the D of
	// every case in which the wind acts away from the member (0.6D + 0.6W
	// among them), when HasUpliftDead; otherwise DeadPsf is used (DOMAIN.md
	// "Loads", zone key uplift_dead_psf).
	UpliftDeadPsf float64
	HasUpliftDead bool
}

// upliftDead returns the dead load relied on against uplift, psf.
func (l AreaLoads) upliftDead() float64 {
	if l.HasUpliftDead {
		return l.UpliftDeadPsf
	}
	return l.DeadPsf
}

// LoadPiece is a stretch of a member with its own area loads: a member
// crossing load-zone edges is loaded zone by zone where each zone acts,
// never with an envelope (DOMAIN.md "Loads"). FromIn and ToIn are member
// positions, like Bearing.AtIn.
type LoadPiece struct {
	FromIn, ToIn float64
	Zone         string // for messages and traces
	Loads        AreaLoads
}

// PointLoad is a concentrated load on a member, lb per load type (wind at
// strength level; WindUpLb a magnitude), at AtIn along the member.
type PointLoad struct {
	AtIn                               float64
	DeadLb, LiveLb, RoofLiveLb, SnowLb float64
	WindDownLb, WindUpLb               float64
	UpliftDeadLb                       float64 // D relied on against uplift when HasUpliftDead
	HasUpliftDead                      bool
	Name                               string // for messages and traces
}

// Bearing is one support of a member: the centre-line position along the
// member from its start, and the bearing length lb.
type Bearing struct {
	AtIn     float64 // centre-line, from the member start
	LengthIn float64 // bearing length lb along the member
	// Hanger: the member hangs from the support's face (a hanger at a flush
	// beam or a face-mounted ledger) rather than resting on it, so NDS 2018
	// 3.4.3.1(a) (shear at d) does not apply there.
	Hanger bool
	// SupportSpecies and SupportGrade name the plate or beam the member
	// bears on; its Fc_perp is checked too and the smaller governs (NDS
	// 2018 3.10.2). Empty: the member's own species and grade.
	SupportSpecies, SupportGrade string
	// Beam is the beam the member bears on when its material and size are
	// known (a beam of the load path): its own Fc_perp' is checked too,
	// with its own factors, and the smaller governs (see SupportBeam).
	// Its zero value (Species "") is none.
	Beam SupportBeam
}

// SupportBeam is a beam a member bears on, of known material (issue 17,
// bearing at each support). The member's bearing stress fc_perp = R / (b
// lb) acts on the beam's face as on the member's (NDS 2018 3.10.2 applies
// to both members in contact), so the beam's Fc_perp' is checked as well
// as the member's and the smaller governs:
//
//	Fc_perp' = Fc_perp CM Ct Ci Cb   sawn lumber and timbers, NDS 2018 Table 4.3.1
//	Fc_perp' = Fc_perp CM Ct Cb      glulam, NDS 2018 Table 5.3.1 (from memory: verify)
//	Fc_perp' = Fc_perp CM Ct Cb      structural composite lumber, NDS 2018 Table 8.3.1 (from memory: verify)
//
// with the beam's own reference Fc_perp (Supplement Table 4A, 4B or 4D,
// the glulam stress class of Table 5A, or the materials file's row) and
// its own CM (Supplement table notes; wet-service glulam, timbers and SCL
// are refused), Ct (NDS 2018 Table 2.3.3) and Ci (Table 4.3.8, sawn only).
// Cb is that of NDS 2018 3.10.4 with lb, the bearing length measured
// parallel to the beam's grain, the member's width b (the member crossing
// the beam square): (b + 0.375) / b when the bearing's edge is 3 in or
// more from the beam's end, else 1.0.
//
// A member in a hanger (Bearing.Hanger) rests on the hanger's seat, not on
// the beam: its bearing is checked with its own Fc_perp' only, and the
// hanger's bearing on the beam is the connector's (its demand is reported
// with the load path's joints); the trace says so.
//
// It holds no name of the beam: members alike on beams alike are checked
// once (MemberKey), and the trace names the beam by its bearing's number
// and its material.
type SupportBeam struct {
	Species, Grade, Size string // the beam's material and size, as its own check takes them; Species "" for none
	// EndIn is the distance along the beam from the member's centre-line
	// to the beam's nearer end, for Cb. Values above 6 in are given as 6
	// (for any lb under 6 in the edge is then 3 in or more from the end,
	// which is all Cb asks), so that members alike but for their place on
	// the beam are checked once; 0 takes Cb = 1 (a member crossing the
	// beam askew, whose length along the beam's grain is not b).
	EndIn float64
}

// supportBeamEndCapIn is the largest SupportBeam.EndIn that matters for
// Cb (NDS 2018 3.10.4): an edge at EndIn - b/2 >= 3 in for every b < 6 in.
const supportBeamEndCapIn = 6.0

// SupportBeamEndIn returns SupportBeam.EndIn for a member whose
// centre-line lies atIn along a beam lengthIn long: the distance to the
// nearer end, capped at 6 in, 0 when the member is askew (square false).
func SupportBeamEndIn(atIn, lengthIn float64, square bool) float64 {
	if !square {
		return 0
	}
	return math.Max(0, math.Min(supportBeamEndCapIn, math.Min(atIn, lengthIn-atIn)))
}

// Member is one joist to check. Positions run along the member from its
// start (0) to LengthIn.
type Member struct {
	ID, Size, Species, Grade string  // Size "2x10"; names in any common spelling
	LengthIn                 float64 // physical length
	Bearings                 []Bearing
	// OverhangStartIn and OverhangEndIn are the cantilever lengths past
	// the first and last bearing centre-lines that are analysed as
	// cantilevers; 0 means that end is part of its bearing (DOMAIN rule:
	// an end within lb/2 + snap tolerance of the bearing centre-line).
	OverhangStartIn, OverhangEndIn float64
	SpacingIn                      float64 // on-centre spacing, for Cr
	TribIn                         float64 // tributary width
	Use                            string  // "floor" or "roof"
	Loads                          AreaLoads
	// LoadPieces, when given, replace Loads: each piece loads its stretch
	// of the member with its own area loads on TribIn. Together they must
	// cover the member from 0 to LengthIn without gaps or overlaps.
	LoadPieces []LoadPiece
	// PointLoads are concentrated loads on the member.
	PointLoads []PointLoad
	// SelfWeightPlf is a dead line load along the whole member, lb/ft (a
	// beam's own weight); area loads need TribIn, this does not.
	SelfWeightPlf float64
	// TopBracedAtPoints: the top edge is braced only at the bearings and
	// at TopBracingAtIn (a beam's top edge held where joists bear on it or
	// hang from it), not continuously, whatever Settings.TopEdgeBraced.
	TopBracedAtPoints      bool
	TopBracingAtIn         []float64
	LiveLimit, TotalLimit  float64 // L/limit; 0 = not checked
	BottomBracedContinuous bool    // ceiling fastened directly to the joists
	BlockingAtIn           []float64
	Repetitive             bool // Cr applies (NDS 2018 4.3.9 conditions met)
	// PitchRise12 is the slope of a rafter drawn in plan, rise in 12 (0 =
	// flat). Positions, spans and loads are on the horizontal projection,
	// as the published rafter span tables take them (dead load on slope
	// already converted by the caller); wind, acting normal to the roof,
	// becomes w / cos^2 of the slope on the projection, the unbraced
	// lengths and the deflection limits use the sloped length, and the
	// deflection is taken perpendicular to the rafter.
	PitchRise12 float64
	// LongTermLimit is n of the NDS 2018 3.5.2 long-term deflection check
	// (Kcr x the dead-load deflection + the short-term live-type deflection
	// against L/n); 0 = reported, not checked.
	LongTermLimit float64
}

// Settings are the design switches of a run (the project file's [design]).
type Settings struct {
	TopEdgeBraced bool   // sheathing braces the top edge continuously
	ShearAtD      bool   // loads within d of the bearing face are left out of V
	WetService    bool   // CM from the Supplement's wet-service factors
	Incised       bool   // Ci
	PatternLive   bool   // live-type loads span by span on continuous and cantilevered members
	Temperature   string // normal | warm | hot (Ct)
	// Seasoned: lumber below 16 % moisture content at installation, used in
	// dry service, so the IBC total deflection is taken under L + 0.5D (IBC
	// 2018 Table 1604.3 footnote d); ignored under WetService.
	Seasoned  bool
	Kcr       float64
	Combos    []Combo    // nil = ASCE 7-16 2.4.1 defaults
	Materials *Materials // nil = built-in tables

	// BraceAtInflection counts the inflection points next to an interior
	// support of a continuous member as braces of the bottom edge, for the
	// load cases that put that edge in compression over the support
	// (project file design.brace_at_inflection; common practice, no
	// source). See inflection.go.
	BraceAtInflection bool
}

// DefaultSettings returns the project-file defaults: top edge braced, no
// shear-at-d reduction, dry service, seasoned lumber, not incised, pattern
// live loads, normal temperature, Kcr = 1.5 (NDS 2018 3.5.2, seasoned lumber in dry
// service), ASCE 7-16 combinations, built-in design values.
func DefaultSettings() Settings {
	return Settings{TopEdgeBraced: true, PatternLive: true, Temperature: "normal", Kcr: 1.5, Seasoned: true}
}

// maxBearings bounds the bearings of one member, so that its segments fit
// the live-load pattern masks (uint32).
const maxBearings = 30

// minBlockingLuIn is the unbraced length below which the blocking solver
// stops adding rows (DOMAIN rule: lu would fall below 24 in).
const minBlockingLuIn = 24.0

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// validate reports the first problem with m's geometry and loads.
func (m *Member) validate() error {
	if !finite(m.LengthIn) || m.LengthIn <= 0 {
		return fmt.Errorf("length %v in: want a finite length > 0", m.LengthIn)
	}
	if len(m.Bearings) < 2 {
		return fmt.Errorf("%d bearing(s): want at least 2", len(m.Bearings))
	}
	if len(m.Bearings) > maxBearings {
		return fmt.Errorf("%d bearings: at most %d are supported", len(m.Bearings), maxBearings)
	}
	if !sort.SliceIsSorted(m.Bearings, func(i, j int) bool { return m.Bearings[i].AtIn < m.Bearings[j].AtIn }) {
		return fmt.Errorf("bearings not sorted along the member")
	}
	const tol = 0.01
	for i, b := range m.Bearings {
		if !finite(b.AtIn) || b.AtIn < -tol || b.AtIn > m.LengthIn+tol {
			return fmt.Errorf("bearing %d at %v in: want a position within the member (0 to %g in)", i+1, b.AtIn, m.LengthIn)
		}
		if !finite(b.LengthIn) || b.LengthIn <= 0 {
			return fmt.Errorf("bearing %d: length %v in: want a bearing length > 0", i+1, b.LengthIn)
		}
		if i > 0 && b.AtIn-m.Bearings[i-1].AtIn <= tol {
			return fmt.Errorf("span %d between bearings %d and %d is %g in: want a span > 0", i, i, i+1, b.AtIn-m.Bearings[i-1].AtIn)
		}
	}
	first, last := m.Bearings[0].AtIn, m.Bearings[len(m.Bearings)-1].AtIn
	if !finite(m.OverhangStartIn) || m.OverhangStartIn < 0 || m.OverhangStartIn > first+tol {
		return fmt.Errorf("start overhang %v in: want 0 to %g in (the member ends there)", m.OverhangStartIn, first)
	}
	if !finite(m.OverhangEndIn) || m.OverhangEndIn < 0 || last+m.OverhangEndIn > m.LengthIn+tol {
		return fmt.Errorf("end overhang %v in: want 0 to %g in (the member ends there)", m.OverhangEndIn, m.LengthIn-last)
	}
	if !finite(m.TribIn) || m.TribIn < 0 || (m.TribIn == 0 && len(m.PointLoads) == 0 && m.SelfWeightPlf == 0) {
		return fmt.Errorf("tributary width %v in: want > 0 (0 only for a member loaded by point loads or its own weight)", m.TribIn)
	}
	if !finite(m.SelfWeightPlf) || m.SelfWeightPlf < 0 {
		return fmt.Errorf("self-weight %v plf: want a finite load >= 0", m.SelfWeightPlf)
	}
	for _, x := range m.TopBracingAtIn {
		if !finite(x) {
			return fmt.Errorf("top-edge brace at %v in: want a finite position", x)
		}
	}
	if !finite(m.SpacingIn) || m.SpacingIn < 0 {
		return fmt.Errorf("spacing %v in: want >= 0", m.SpacingIn)
	}
	if err := m.Loads.validate(""); err != nil {
		return err
	}
	if err := m.validatePieces(); err != nil {
		return err
	}
	for i, p := range m.PointLoads {
		if !finite(p.AtIn) || p.AtIn < -tol || p.AtIn > m.LengthIn+tol {
			return fmt.Errorf("point load %d at %v in: want a position within the member (0 to %g in)", i+1, p.AtIn, m.LengthIn)
		}
		for _, v := range [...]float64{p.DeadLb, p.LiveLb, p.RoofLiveLb, p.SnowLb, p.WindDownLb, p.WindUpLb, p.UpliftDeadLb} {
			if !finite(v) || v < 0 {
				return fmt.Errorf("point load %d: load %v lb: want finite loads >= 0 (wind up is a magnitude)", i+1, v)
			}
		}
	}
	if !finite(m.PitchRise12) || m.PitchRise12 < 0 || m.PitchRise12 > 24 {
		return fmt.Errorf("pitch %v in 12: want 0 (flat) to 24", m.PitchRise12)
	}
	if !finite(m.LongTermLimit) || m.LongTermLimit < 0 {
		return fmt.Errorf("long-term deflection limit L/%v: want a finite value >= 0 (0 = not checked)", m.LongTermLimit)
	}
	if m.Use != "floor" && m.Use != "roof" {
		return fmt.Errorf("use %q: want floor or roof", m.Use)
	}
	if !finite(m.LiveLimit) || m.LiveLimit < 0 || !finite(m.TotalLimit) || m.TotalLimit < 0 {
		return fmt.Errorf("deflection limits L/%v, L/%v: want finite values >= 0 (0 = not checked)", m.LiveLimit, m.TotalLimit)
	}
	for _, x := range m.BlockingAtIn {
		if !finite(x) {
			return fmt.Errorf("blocking row at %v in: want a finite position", x)
		}
	}
	return nil
}

// validate reports the first problem with area loads l; where names the
// load piece, "" for the member's own loads.
func (l AreaLoads) validate(where string) error {
	for _, v := range [...]struct {
		name string
		v    float64
	}{{"dead", l.DeadPsf}, {"live", l.LivePsf}, {"roof live", l.RoofLivePsf},
		{"snow", l.SnowPsf}, {"wind down", l.WindDownPsf}, {"wind up", l.WindUpPsf}, {"uplift dead", l.UpliftDeadPsf}} {
		if !finite(v.v) || v.v < 0 {
			return fmt.Errorf("%s%s load %v psf: want a finite load >= 0 (wind up is a magnitude)", where, v.name, v.v)
		}
	}
	return nil
}

// validatePieces reports a problem with m.LoadPieces: they must run from
// the member's start to its end in order, each longer than 0, without gaps
// or overlaps (within 0.01 in).
func (m *Member) validatePieces() error {
	const tol = 0.01
	at := 0.0
	for i, p := range m.LoadPieces {
		where := fmt.Sprintf("load piece %d (%s): ", i+1, p.Zone)
		if !finite(p.FromIn) || !finite(p.ToIn) || p.ToIn-p.FromIn <= 0 {
			return fmt.Errorf("%sfrom %v to %v in: want a stretch of the member longer than 0", where, p.FromIn, p.ToIn)
		}
		if math.Abs(p.FromIn-at) > tol {
			return fmt.Errorf("%sstarts at %g in: want %g in (pieces must follow one another from the member start)", where, p.FromIn, at)
		}
		if err := p.Loads.validate(where); err != nil {
			return err
		}
		at = p.ToIn
	}
	if len(m.LoadPieces) > 0 && math.Abs(at-m.LengthIn) > tol {
		return fmt.Errorf("load pieces end at %g in: want the member end, %g in", at, m.LengthIn)
	}
	return nil
}

// validate reports the first problem with s.
func (s *Settings) validate() error {
	if _, err := TemperatureFactor(s.Temperature, s.WetService); err != nil {
		return err
	}
	if !finite(s.Kcr) || s.Kcr < 0 {
		return fmt.Errorf("kcr %v: want a finite value >= 0 (0 = 1.5 dry, 2.0 wet)", s.Kcr)
	}
	return nil
}

var errNoCandidates = errors.New("no candidate sizes to try")
