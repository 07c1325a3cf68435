package pipeline

import (
	"math"
	"testing"

	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/project"
)

// stripBeamPlan checks four joists at 16 in between two walls with a 4x10
// dropped beam parallel to them 16 in past the last, in zone FLOOR (D 10,
// L 40 psf, and zoneExtra's keys).
func stripBeamPlan(t *testing.T, zoneExtra string) *Outcome {
	t.Helper()
	d := &dxfimport.Drawing{File: "t.dxf", Units: "in", ToInch: 1}
	line := func(layer string, x0, y0, x1, y1 float64) {
		d.Entities = append(d.Entities, dxfimport.Entity{Kind: dxfimport.KindLine, Pos: dxfimport.Pos{File: "t.dxf", Layer: layer, Line: len(d.Entities) + 1},
			Points: []dxfimport.Point{{X: x0, Y: y0}, {X: x1, Y: y1}}})
	}
	line("WALL", -20, 0, 120, 0)
	line("WALL", -20, 144, 120, 144)
	for x := 16.0; x <= 64; x += 16 {
		line("JOIST", x, 0, x, 144)
	}
	line("BEAM-DROP", 80, -2, 80, 146)
	d.Entities = append(d.Entities, dxfimport.Entity{Kind: dxfimport.KindText, Pos: dxfimport.Pos{File: "t.dxf", Layer: "FRAMING-NOTE", Line: 99},
		Points: []dxfimport.Point{{X: 83, Y: 72}}, Text: "4x10", HeightIn: 3})
	p, err := project.ParseProject("p.toml", []byte(beamSupports+
		"[lumber]\nspecies = \"Douglas Fir-Larch\"\ngrade = \"No.2\"\nsize = \"2x10\"\n\n[[zone]]\nname = \"FLOOR\"\ndead_psf = 10\nlive_psf = 40\n"+zoneExtra))
	if err != nil {
		t.Fatal(err)
	}
	plan := framing.Group(d, FramingOptions(p))
	o, err := Run(Input{Plan: plan, PlanFile: "t.dxf", Project: p})
	if err != nil {
		t.Fatal(err)
	}
	return o
}

// TestBeamCarriesItsStrip: a dropped beam parallel to four joists, 16 in
// past the last one, bearing on the two walls the joists span between. The
// edge joist carries half the 16 in (8 in, FRM221) and the beam the other
// half over the joist's 144 in, in zone FLOOR (D 10, L 40 psf): 8/12 ft x
// 10 psf = 6.67 plf of D and 26.67 plf of L over 144 in, so 80 lb of D and
// 320 lb of L put on the beam, half at each wall by statics (its own
// weight besides). The load path's totals keep it: applied equals
// delivered, type by type (tributary-area statics, common practice, no
// source).
func TestBeamCarriesItsStrip(t *testing.T) {
	o := stripBeamPlan(t, "")
	if o.Path == nil || len(o.Path.Beams) != 1 {
		t.Fatalf("load path %+v, want one beam", o.Path)
	}
	bo := o.Path.Beams[0]
	in := bo.Input
	var dLb, lLb float64
	for _, pc := range in.LoadPieces {
		dLb += pc.Loads.DeadPsf * in.TribIn / 144 * (pc.ToIn - pc.FromIn)
		lLb += pc.Loads.LivePsf * in.TribIn / 144 * (pc.ToIn - pc.FromIn)
	}
	if math.Abs(dLb-80) > 1e-6 || math.Abs(lLb-320) > 1e-6 {
		t.Errorf("strip on the beam: D %.4f lb, L %.4f lb; want 80 and 320 (pieces %+v, trib %v)", dLb, lLb, in.LoadPieces, in.TribIn)
	}
	if bo.Res.Status == "" || len(bo.Res.Checks) == 0 {
		t.Errorf("beam not checked: %+v", bo.Res)
	}
	s := o.Path.Solved
	if math.Abs(s.Applied.LiveLb-s.Delivered.LiveLb) > 1e-6 || math.Abs(s.Applied.DeadLb-s.Delivered.DeadLb) > 1e-6 {
		t.Errorf("applied %+v, delivered %+v: want equal", s.Applied, s.Delivered)
	}
	// the live load reaching the walls: the joists' 4 x 40 psf x trib x 12
	// ft (tribs 8, 16, 16, 16 in) and the beam's 320 lb
	want := 40.0*(8+16+16+16)/12*12 + 320
	if math.Abs(s.Delivered.LiveLb-want) > 1e-6 {
		t.Errorf("live load delivered %.3f lb, want %.3f", s.Delivered.LiveLb, want)
	}
}

// TestBeamDeflectionLimitsFromZones: a beam is held to deflection limits
// no less strict than those of the zones it carries: the strip beam of
// TestBeamCarriesItsStrip in a FLOOR zone asking L/480 live and L/360
// total (a tile floor, say) is checked at L/480 and L/360, not at the
// default floor limits L/360 and L/240 (IBC 2018 Table 1604.3 gives the
// least; the zone's limits are the designer's).
func TestBeamDeflectionLimitsFromZones(t *testing.T) {
	o := stripBeamPlan(t, "live_deflection_limit = 480\ntotal_deflection_limit = 360\n")
	if o.Path == nil || len(o.Path.Beams) != 1 {
		t.Fatalf("load path %+v, want one beam", o.Path)
	}
	if in := o.Path.Beams[0].Input; in.LiveLimit != 480 || in.TotalLimit != 360 {
		t.Errorf("beam limits L/%v live, L/%v total; want L/480 and L/360 as its zone asks", in.LiveLimit, in.TotalLimit)
	}
}
