package framing

import (
	"encoding/binary"
	"math"
	"testing"

	"framecheck/dxfimport"
)

// FuzzGroup builds drawings from arbitrary bytes (lines and polylines on
// every role's layer, texts with arbitrary strings) and checks that Group
// never panics and that every member keeps its invariants.
func FuzzGroup(f *testing.F) {
	f.Add([]byte("\x00\x01\x02\x03\x04\x05\x06\x07\x08\x09\x0a\x0b\x0c\x0d\x0e\x0f\x10\x11"))
	f.Add([]byte("\xff\xff\xff\xff\xff\xff\xff\x7f\x00\x00\x00\x00\x00\x00\xf8\x7f"))
	f.Fuzz(func(t *testing.T, data []byte) {
		layers := []string{"JOIST", "WALL", "BEAM-FLUSH", "BLOCKING", "LOAD-ZONE", "FRAMING-NOTE", "OTHER",
			"POST", "POINT-LOAD", "BEAM-DROP"}
		p := newPlan()
		num := func() float64 {
			if len(data) < 2 {
				return 0
			}
			v := float64(int16(binary.LittleEndian.Uint16(data)))
			data = data[2:]
			if v == math.MinInt16 { // one in 65536: a special value
				return math.Inf(1)
			}
			return v
		}
		for len(data) >= 3 {
			op, layer := data[0]%6, layers[int(data[1])%len(layers)]
			data = data[2:]
			switch op {
			case 0:
				p.line(layer, num(), num(), num(), num())
			case 1:
				p.poly(layer, num() > 0, Point{X: num(), Y: num()}, Point{X: num(), Y: num()}, Point{X: num(), Y: num()})
			case 2:
				n := min(len(data), 12)
				s := string(data[:n])
				data = data[n:]
				p.text(layer, s, num(), num(), 3)
			case 3:
				e := dxfimport.Entity{Kind: dxfimport.KindLWPolyline, Pos: p.pos(layer),
					Points: []Point{{X: num(), Y: num()}, {X: num(), Y: num()}}, Bulges: []float64{num(), 0}}
				p.d.Entities = append(p.d.Entities, e)
			case 4:
				p.circle(layer, num(), num(), math.Abs(num())/8)
			case 5:
				p.point(layer, num(), num())
			}
		}
		opt := loadPathOptions()
		pl := p.group(opt)
		for _, m := range pl.Members {
			if m.LengthIn <= 0 || math.IsNaN(m.TribIn) || m.TribIn < 0 || m.Run < 0 || m.Run >= len(pl.Runs) {
				t.Fatalf("member %+v", m)
			}
			for i := 1; i < len(m.Bearings); i++ {
				if m.Bearings[i].AtIn < m.Bearings[i-1].AtIn {
					t.Fatalf("%s bearings out of order: %+v", m.ID, m.Bearings)
				}
			}
			if !m.Error && len(m.Bearings) < 2 {
				t.Fatalf("%s usable with %d bearings", m.ID, len(m.Bearings))
			}
		}
		checkLoadPathIndices(t, pl)
		for r := range pl.Runs {
			pl.PlaceRows(r, []float64{10, 50})
		}
		AssignMarks(pl)
		BuildTakeoff(pl, nil)
	})
}

// checkLoadPathIndices checks that every index of the load path points
// into its slice.
func checkLoadPathIndices(t *testing.T, pl *Plan) {
	t.Helper()
	for _, m := range pl.Members {
		for _, b := range m.Bearings {
			if b.Support < -1 || b.Support >= len(pl.Supports) {
				t.Fatalf("%s bearing support %d of %d", m.ID, b.Support, len(pl.Supports))
			}
		}
	}
	for _, b := range pl.Beams {
		if b.LengthIn <= 0 || len(b.Lines) == 0 {
			t.Fatalf("beam %+v", b)
		}
		for _, s := range b.Supports {
			if s < 0 || s >= len(pl.Supports) {
				t.Fatalf("%s support %d", b.ID, s)
			}
		}
		for _, br := range b.Bearings {
			n := map[string]int{BeamOnPost: len(pl.Posts), BeamOnWall: len(pl.Supports), BeamOnBeam: len(pl.Beams)}[br.Kind]
			if br.Index < -1 || br.Index >= n {
				t.Fatalf("%s bearing %+v", b.ID, br)
			}
		}
		for _, c := range b.Carried {
			if c.Member < 0 || c.Member >= len(pl.Members) || c.Bearing < 0 || c.Bearing >= len(pl.Members[c.Member].Bearings) {
				t.Fatalf("%s carried %+v", b.ID, c)
			}
		}
		if len(b.Bearings) < 2 != b.Rigid {
			t.Fatalf("%s rigid %v with %d bearings", b.ID, b.Rigid, len(b.Bearings))
		}
	}
	for _, m := range pl.PointLoads {
		if m.Member >= len(pl.Members) || m.Beam >= len(pl.Beams) || m.Member >= 0 && m.Beam >= 0 ||
			m.Member < 0 && m.Beam < 0 && m.Err == "" {
			t.Fatalf("point load %+v", m)
		}
	}
}
