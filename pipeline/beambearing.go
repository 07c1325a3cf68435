package pipeline

import (
	"fmt"
	"math"
	"strings"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/project"
)

// squareSin is the sine of the angle between a joist and the beam it
// rests on above which the joist is taken to cross the beam square: 1
// degree off square at most, the angle tolerance of framing's "parallel"
// (DOMAIN.md, members from a plan).
var squareSin = math.Cos(math.Pi / 180)

// beamBearings gives each joist bearing on a beam of the load path the
// beam's material (check.Bearing.Beam) before the joists are checked
// (issue 17, bearing at each support): the joist's bearing is then checked
// against the beam's own Fc_perp' as well as its own, the smaller
// governing (NDS 2018 3.10.2; check.SupportBeam says how each is
// adjusted). The beam's material is known here: it comes from its callout
// or its [[support]] table (beamInput, ins), not from the load path's solution.
// On such a bearing the beam's material replaces [[support]] species and
// grade, which for a sawn beam are its material already and which a
// glulam or SCL beam's own check does not use.
//
// A joist in a hanger (flush beam, ledger) rests on the hanger's seat:
// its bearing is checked with its own Fc_perp, and the hanger's bearing on
// the beam is the connector's (its demand is reported at the joint); the
// bearing is marked with the beam only so that its trace says so.
//
// Where a beam of the load path carries joists resting on it but its
// Fc_perp' is not known when they are checked (the beam cannot be
// checked, its material is refused, or --size may give it a size of
// another Fc_perp), warning CHK313 names the beam and the joists, whose
// bearing was checked against their own Fc_perp only. The warnings are
// kept in o and reported with the load path's findings (softBeamBearings).
func beamBearings(p *project.Project, plan *framing.Plan, ins []beamIn, inputs []check.Member, usable []bool, s check.Settings, sizing bool, o *Outcome) {
	// why Fc_perp' is not known, by lumber and size: a plan's beams are
	// of few (beamFcPerpUnknown reads no more of the beam)
	unknown := map[[3]string]string{}
	for i := range plan.Beams {
		b := &plan.Beams[i]
		if b.Rigid || len(b.Carried) == 0 {
			continue // a rigid bearing is no beam of the load path
		}
		cm, reason := &ins[i].cm, ins[i].msg
		if reason != "" {
			reason = "it cannot be checked, " + CodeBeamNotChecked + " says why"
		} else {
			k := [3]string{cm.Species, cm.Grade, cm.Size}
			var ok bool
			if reason, ok = unknown[k]; !ok {
				reason = beamFcPerpUnknown(p, *cm, s, sizing)
				unknown[k] = reason
			}
		}
		var ids []string // joists resting on it whose bearing is not checked against it
		for _, c := range b.Carried {
			if c.Member < 0 || c.Member >= len(inputs) || !usable[c.Member] || c.Bearing < 0 || c.Bearing >= len(inputs[c.Member].Bearings) {
				continue
			}
			br := &inputs[c.Member].Bearings[c.Bearing]
			if reason != "" {
				if !br.Hanger {
					ids = append(ids, inputs[c.Member].ID)
				}
				continue
			}
			br.Beam = check.SupportBeam{Species: cm.Species, Grade: cm.Grade, Size: cm.Size}
			if !br.Hanger {
				br.Beam.EndIn = check.SupportBeamEndIn(c.AtIn, b.LengthIn, crossesSquare(&plan.Members[c.Member], b))
				br.SupportSpecies, br.SupportGrade = "", ""
			}
		}
		if len(ids) == 0 {
			continue
		}
		named := strings.Join(ids, ", ")
		if len(ids) > 3 {
			named = fmt.Sprintf("%s and %d more", strings.Join(ids[:3], ", "), len(ids)-3)
		}
		o.softBearings.Add(b.Lines[0], CodeSoftBeamBearing, dxfimport.SevWarning,
			"%s: its Fc_perp' is not known when the joists resting on it are checked (%s): the bearing of %s on it was "+
				"checked against their own Fc_perp only; check their bearing on %s by hand (NDS 2018 3.10.2)",
			b.ID, reason, named, b.ID)
	}
}

// beamFcPerpUnknown says why the Fc_perp' of beam cm (its check input) is
// not known before the joists are checked, "" when it is: its material is
// refused (check.SupportBeamValues), or --size picks its size from [sizing]
// beam_candidates and they do not all have the drawn size's Fc_perp'.
func beamFcPerpUnknown(p *project.Project, cm check.Member, s check.Settings, sizing bool) string {
	v, err := check.SupportBeamValues(cm.Species, cm.Grade, cm.Size, s)
	if err != nil {
		return err.Error()
	}
	if !beamSized(p, cm, sizing) {
		return ""
	}
	for _, c := range p.Sizing.BeamCandidates {
		cv, err := check.SupportBeamValues(cm.Species, cm.Grade, c, s)
		if err != nil {
			continue // a candidate whose values are not known is never picked
		}
		if cv != v {
			return fmt.Sprintf("--size picks its size from [sizing] beam_candidates, and %s has Fc_perp CM Ct Ci %s psi "+
				"where %s has %s psi", c, project.FmtNum(cv.AdjNoCbPsi()), cm.Size, project.FmtNum(v.AdjNoCbPsi()))
		}
	}
	return ""
}

// beamSized reports whether --size picks beam cm's size from [sizing]
// beam_candidates: glulam and structural composite lumber keep their
// sizes, the candidates being sawn sizes.
func beamSized(p *project.Project, cm check.Member, sizing bool) bool {
	mats := p.Materials
	if mats == nil {
		mats = check.BuiltinMaterials()
	}
	_, scl := mats.IsSCL(cm.Species)
	return sizing && len(p.Sizing.BeamCandidates) > 0 && !strings.EqualFold(cm.Species, check.GlulamSpecies) && !scl
}

// crossesSquare reports whether joist m crosses beam b square (within 1
// degree), so that its length along the beam's grain is its width.
func crossesSquare(m *framing.Member, b *framing.Beam) bool {
	ux, uy := m.End.X-m.Start.X, m.End.Y-m.Start.Y
	vx, vy := b.End.X-b.Start.X, b.End.Y-b.Start.Y
	lu, lv := math.Hypot(ux, uy), math.Hypot(vx, vy)
	if lu == 0 || lv == 0 {
		return false
	}
	return math.Abs(ux*vy-uy*vx)/(lu*lv) >= squareSin
}

// softBeamBearings reports the CHK313 warnings beamBearings found, with
// the load path's findings.
func softBeamBearings(o *Outcome) {
	o.Issues = append(o.Issues, o.softBearings...)
}
