package framing

import (
	"math"
	"reflect"
	"testing"
)

func rect(x0, y0, x1, y1 float64) []Point {
	return []Point{{X: x0, Y: y0}, {X: x1, Y: y0}, {X: x1, Y: y1}, {X: x0, Y: y1}}
}

func TestZones(t *testing.T) {
	p := newPlan().walls(-10, 300, 0, 144, 288)
	p.joists(0, 144, 0, 16)    // inside ROOF
	p.joists(0, 288, 100)      // 144 in ROOF, 144 in CORRIDOR: envelope
	p.joists(144, 288, 0, 16)  // outside both: default zone
	p.joists(0, 144, 200, 216) // inside the nested BALCONY (innermost wins)
	p.poly("LOAD-ZONE", true, rect(-20, -20, 250, 144)...).text("LOAD-ZONE", "ROOF\nD=15 psf", 5, 5, 4)
	p.poly("LOAD-ZONE", true, rect(90, 144, 110, 300)...).text("LOAD-ZONE", "CORRIDOR", 95, 250, 4)
	p.poly("LOAD-ZONE", true, rect(190, -10, 240, 140)...).text("LOAD-ZONE", "BALCONY", 195, 5, 4)
	p.poly("LOAD-ZONE", true, rect(500, 500, 600, 600)...) // no name
	opt := DefaultOptions()
	pl := p.group(opt)
	cases := []struct {
		x, y float64
		want []string
	}{
		{0, 72, []string{"ROOF"}},
		{100, 144, []string{"CORRIDOR", "ROOF"}},
		{0, 216, []string{"FLOOR"}},
		{200, 72, []string{"BALCONY"}},
	}
	for _, c := range cases {
		if m := member(t, pl, c.x, c.y); !reflect.DeepEqual(m.Zones, c.want) {
			t.Errorf("member at (%g,%g) zones %v, want %v", c.x, c.y, m.Zones, c.want)
		}
	}
	// The member crossing from CORRIDOR into ROOF keeps both stretches,
	// end to end along it (each zone loads it where it acts).
	if m := member(t, pl, 100, 144); len(m.ZonePieces) != 2 || m.ZonePieces[0].FromIn != 0 ||
		math.Abs(m.ZonePieces[1].ToIn-m.LengthIn) > 1e-9 || m.ZonePieces[0].ToIn != m.ZonePieces[1].FromIn ||
		m.ZonePieces[0].Zone == m.ZonePieces[1].Zone {
		t.Errorf("member at (100,144): zone pieces %+v over %g in, want two zones end to end", m.ZonePieces, m.LengthIn)
	}
	if m := member(t, pl, 0, 72); m.ZonePieces != nil {
		t.Errorf("member in one zone: pieces %+v, want none", m.ZonePieces)
	}
	if cs := issueCodes(pl.Issues); cs[CodeZonePieces] != 1 || cs[CodeZoneName] != 1 {
		t.Errorf("issues %v", pl.Issues)
	}
	if len(pl.Zones) != 3 {
		t.Errorf("zones %d, want 3 named outlines", len(pl.Zones))
	}
	opt.DefaultZone = ""
	pl = p.group(opt)
	if m := member(t, pl, 0, 216); !m.Error || issueCodes(pl.Issues)[CodeNoZone] != 2 {
		t.Errorf("without a default zone the members outside every outline are errors: %v", pl.Issues)
	}
}
