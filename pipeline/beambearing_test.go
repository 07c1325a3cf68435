package pipeline

import (
	"slices"
	"strings"
	"testing"

	"framecheck/check"
	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/project"
)

// beamPlan draws walls on x = 0 and 288, joists at y = 16..128 (16 in
// o.c.) from each wall to a beam on x = 144 (y 0..144) on beamLayer, two
// posts under the beam and callout beside it ("" for none), and runs the
// pipeline on it with the project file toml (materials added to its
// built-in ones when csv is not "").
func beamPlan(t *testing.T, beamLayer, callout, toml, csv string, size bool) *Outcome {
	t.Helper()
	d := &dxfimport.Drawing{File: "t.dxf", Units: "in", ToInch: 1}
	add := func(e dxfimport.Entity, layer string) {
		e.Pos = dxfimport.Pos{File: "t.dxf", Layer: layer, Line: len(d.Entities) + 1}
		d.Entities = append(d.Entities, e)
	}
	line := func(layer string, x0, y0, x1, y1 float64) {
		add(dxfimport.Entity{Kind: dxfimport.KindLine, Points: []dxfimport.Point{{X: x0, Y: y0}, {X: x1, Y: y1}}}, layer)
	}
	line("WALL", 0, -20, 0, 164)
	line("WALL", 288, -20, 288, 164)
	for y := 16.0; y <= 128; y += 16 {
		line("JOIST", 0, y, 144, y)
		line("JOIST", 144, y, 288, y)
	}
	line(beamLayer, 144, 0, 144, 144)
	for _, y := range []float64{0, 144} {
		add(dxfimport.Entity{Kind: dxfimport.KindCircle, Points: []dxfimport.Point{{X: 144, Y: y}}, RadiusIn: 2.75}, "POST")
	}
	if callout != "" {
		add(dxfimport.Entity{Kind: dxfimport.KindText, Points: []dxfimport.Point{{X: 147, Y: 100}}, Text: callout, HeightIn: 3}, "FRAMING-NOTE")
	}
	p, err := project.ParseProject("p.toml", []byte(toml+"\n[[post]]\nlayers = [\"POST*\"]\nsize = \"4x4\"\nheight_in = 96\n"))
	if err != nil {
		t.Fatal(err)
	}
	if csv != "" {
		u, err := check.LoadMaterialsCSV(strings.NewReader(csv), "m.csv")
		if err != nil {
			t.Fatal(err)
		}
		p.Materials = check.BuiltinMaterials().Merge(u)
	}
	plan := framing.Group(d, FramingOptions(p))
	o, err := Run(Input{Plan: plan, PlanFile: "t.dxf", Project: p, Size: size})
	if err != nil {
		t.Fatal(err)
	}
	return o
}

const beamSupports = "[[support]]\nlayers = [\"WALL*\"]\nkind = \"bearing-wall\"\n\n" +
	"[[support]]\nlayers = [\"BEAM-DROP*\"]\nkind = \"dropped-beam\"\n\n" +
	"[[support]]\nlayers = [\"BEAM-FLUSH*\"]\nkind = \"flush-beam\"\nbearing_in = 1.5\n"

// TestBeamBearings: the pipeline gives each joist resting on a beam of the
// load path the beam's material (its callout) before the joists are
// checked, with the distance to the beam's end capped for Cb (check
// SupportBeam); joists in hangers on a flush beam are marked for the
// trace only; CHK313 is left only where the beam's Fc_perp' is not known.
func TestBeamBearings(t *testing.T) {
	o := beamPlan(t, "BEAM-DROP", "5 1/8 x 12 GLB 20F-1.5E", beamSupports+"[lumber]\nspecies = \"Douglas Fir-Larch\"\ngrade = \"No.2\"\nsize = \"2x10\"\n", "", false)
	onBeam := 0
	for k, m := range o.Plan.Members {
		for j, b := range m.Bearings {
			if b.Kind != framing.KindDroppedBeam {
				continue
			}
			onBeam++
			got := o.Inputs[k].Bearings[j].Beam
			want := check.SupportBeam{Species: check.GlulamSpecies, Grade: "20F-1.5E", Size: "5.125x12", EndIn: 6}
			if got != want {
				t.Errorf("%s bearing %d: beam %+v, want %+v", m.ID, j+1, got, want)
			}
		}
	}
	if onBeam != 16 {
		t.Fatalf("%d joist bearings on the beam, want 16", onBeam)
	}
	for _, is := range o.Issues {
		if is.Code == CodeSoftBeamBearing {
			t.Errorf("CHK313 where the bearing is checked: %s", is.Msg)
		}
	}
	// Glulam 20F-1.5E, Fc_perp 425 psi (NDS 2018 Supplement Table 5A,
	// from memory: verify), Cb = (1.5 + 0.375)/1.5 = 1.25 (NDS 2018
	// 3.10.4): 531.25 psi, under the joists' 625 (Table 4A): it governs.
	for k, r := range o.Results {
		for _, c := range r.Checks {
			if c.Kind == check.KindBearing && c.Allowable != 425*1.25 {
				t.Errorf("%s: bearing allowable %g, want 425 (1.25) = 531.25 psi", o.Plan.Members[k].ID, c.Allowable)
			}
		}
	}

	// A flush beam: the joists hang in hangers; their bearing is their own.
	o = beamPlan(t, "BEAM-FLUSH", "5 1/8 x 12 GLB 20F-1.5E", beamSupports+"[lumber]\nsize = \"2x10\"\n", "", false)
	for k, r := range o.Results {
		for _, c := range r.Checks {
			if c.Kind == check.KindBearing && c.Allowable != 625 {
				t.Errorf("%s in a hanger: bearing allowable %g, want the joist's own 625 psi (NDS 2018 Supplement Table 4A)", o.Plan.Members[k].ID, c.Allowable)
			}
		}
	}
	hung := 0
	for k := range o.Inputs {
		for _, b := range o.Inputs[k].Bearings {
			if b.Hanger && b.Beam.Species == check.GlulamSpecies {
				hung++
			}
		}
	}
	if hung != 16 {
		t.Errorf("%d hanger bearings marked with the beam, want 16", hung)
	}

	// --size: a sawn beam whose candidates have another Fc_perp than its
	// drawn size (a materials file of two width classes, test input:
	// common practice, no source): its Fc_perp' is not known when the
	// joists are checked, so CHK313 says their bearing is their own.
	csv := "species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,fc_psi,e_psi,emin_psi,size_factor,source\n" +
		"TESTWOOD,No.2,2,10,900,575,180,500,1350,1600000,580000,none,test input\n" +
		"TESTWOOD,No.2,12,0,900,575,180,400,1350,1600000,580000,none,test input\n"
	toml := beamSupports + "[lumber]\nsize = \"2x10\"\n\n[sizing]\nbeam_candidates = [\"(2) 2x10\", \"(2) 2x12\"]\n"
	toml = strings.Replace(toml, "kind = \"dropped-beam\"\n", "kind = \"dropped-beam\"\nspecies = \"TESTWOOD\"\ngrade = \"No.2\"\n", 1)
	o = beamPlan(t, "BEAM-DROP", "(3) 2x10", toml, csv, true)
	found := false
	for _, is := range o.Issues {
		if is.Code == CodeSoftBeamBearing {
			found = true
			if !strings.Contains(is.Msg, "--size picks its size from [sizing] beam_candidates, and (2) 2x12 has Fc_perp CM Ct Ci 400 psi where (3) 2x10 has 500 psi") {
				t.Errorf("CHK313: %s", is.Msg)
			}
		}
	}
	if !found {
		t.Error("no CHK313 for a beam whose Fc_perp' depends on the size --size picks")
	}
	// Without --size the same beam is known: (3) 2x10 TESTWOOD, 500 psi.
	o = beamPlan(t, "BEAM-DROP", "(3) 2x10", toml, csv, false)
	for _, is := range o.Issues {
		if is.Code == CodeSoftBeamBearing {
			t.Errorf("CHK313 without --size: %s", is.Msg)
		}
	}
	if b := o.Inputs[0].Bearings; b[len(b)-1].Beam.Species != "TESTWOOD" && b[0].Beam.Species != "TESTWOOD" {
		t.Errorf("M1's bearings %+v: none on the TESTWOOD beam", b)
	}
}

// TestGirderBracedByBeam: a beam framing into a girder holds the girder's
// top edge where it lands, as a joist in a hanger does (NDS 2018 3.3.3.4:
// lu between points of lateral support): the girder 216 in long, a beam
// landing on it 96 in from its start, braces it at 96 in (an audit found
// the girder's lu the whole 216 in).
func TestGirderBracedByBeam(t *testing.T) {
	p, err := project.ParseProject("p.toml", []byte(beamSupports+"[lumber]\nspecies = \"Douglas Fir-Larch\"\ngrade = \"No.2\"\nsize = \"2x10\"\n"))
	if err != nil {
		t.Fatal(err)
	}
	plan := &framing.Plan{Beams: []framing.Beam{
		{ID: "B1", Kind: framing.KindFlushBeam, Layer: "BEAM-FLUSH", Size: "(3) 2x12", Start: framing.Point{X: 96, Y: 0}, End: framing.Point{X: 96, Y: 144},
			LengthIn: 144, Bearings: []framing.BeamBearing{{AtIn: 144, LengthIn: 1.5, Kind: framing.BeamOnBeam, Index: 1}}},
		{ID: "B2", Kind: framing.KindDroppedBeam, Layer: "BEAM-DROP", Size: "(3) 2x12", Start: framing.Point{X: 0, Y: 144}, End: framing.Point{X: 216, Y: 144},
			LengthIn: 216, CarriedBeams: []int{0}, Bearings: []framing.BeamBearing{{AtIn: 0, LengthIn: 3.5, Kind: framing.BeamOnPost}, {AtIn: 216, LengthIn: 3.5, Kind: framing.BeamOnPost}}},
	}}
	cm, _, msg := beamInput(p, plan, &plan.Beams[1])
	if msg != "" {
		t.Fatal(msg)
	}
	if !cm.TopBracedAtPoints || !slices.Contains(cm.TopBracingAtIn, 96) {
		t.Errorf("girder top edge braced at %v (at points %v), want 96 in", cm.TopBracingAtIn, cm.TopBracedAtPoints)
	}
}
