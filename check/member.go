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
}

// Bearing is one support of a member: the centre-line position along the
// member from its start, and the bearing length lb.
type Bearing struct {
	AtIn     float64 // centre-line, from the member start
	LengthIn float64 // bearing length lb along the member
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
	LiveLimit, TotalLimit          float64 // L/limit; 0 = not checked
	BottomBracedContinuous         bool    // ceiling fastened directly to the joists
	BlockingAtIn                   []float64
	Repetitive                     bool // Cr applies (NDS 2018 4.3.9 conditions met)
}

// Settings are the design switches of a run (the project file's [design]).
type Settings struct {
	TopEdgeBraced bool   // sheathing braces the top edge continuously
	ShearAtD      bool   // loads within d of the bearing face are left out of V
	WetService    bool   // CM from the Supplement's wet-service factors
	Incised       bool   // Ci
	PatternLive   bool   // live-type loads span by span on continuous and cantilevered members
	Temperature   string // normal | warm | hot (Ct)
	Kcr           float64
	Combos        []Combo    // nil = ASCE 7-16 2.4.1 defaults
	Materials     *Materials // nil = built-in tables

	// BraceAtInflection counts the inflection points next to an interior
	// support of a continuous member as braces of the bottom edge, for the
	// load cases that put that edge in compression over the support
	// (project file design.brace_at_inflection; common practice, no
	// source). See inflection.go.
	BraceAtInflection bool
}

// DefaultSettings returns the project-file defaults: top edge braced, no
// shear-at-d reduction, dry service, not incised, pattern live loads,
// normal temperature, Kcr = 1.5 (NDS 2018 3.5.2, seasoned lumber in dry
// service), ASCE 7-16 combinations, built-in design values.
func DefaultSettings() Settings {
	return Settings{TopEdgeBraced: true, PatternLive: true, Temperature: "normal", Kcr: 1.5}
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
	if !finite(m.TribIn) || m.TribIn <= 0 {
		return fmt.Errorf("tributary width %v in: want > 0", m.TribIn)
	}
	if !finite(m.SpacingIn) || m.SpacingIn < 0 {
		return fmt.Errorf("spacing %v in: want >= 0", m.SpacingIn)
	}
	for _, l := range []struct {
		name string
		v    float64
	}{{"dead", m.Loads.DeadPsf}, {"live", m.Loads.LivePsf}, {"roof live", m.Loads.RoofLivePsf},
		{"snow", m.Loads.SnowPsf}, {"wind down", m.Loads.WindDownPsf}, {"wind up", m.Loads.WindUpPsf}} {
		if !finite(l.v) || l.v < 0 {
			return fmt.Errorf("%s load %v psf: want a finite load >= 0 (wind up is a magnitude)", l.name, l.v)
		}
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
