package main

import (
	"math"
	"testing"
)

// TestFoundationAddsUpToDelivered: the demo's foundation lines (wall
// lines, posts, and the one line for the supports the load path does not
// follow: its floor's flush beam and the roof's dropped beams are kept
// rigid) add up, load type by load type, to what the load path delivers:
// nothing reaching the bottom of the path is left off the list (statics).
func TestFoundationAddsUpToDelivered(t *testing.T) {
	_, _, _, r := runDemoTo(t, t.TempDir())
	lp := r.LoadPath
	if lp == nil {
		t.Fatal("no load path")
	}
	var d, l, lr, s, wd, wu float64
	rigid := 0
	for _, f := range lp.Foundation {
		d += f.Loads.DeadLb
		l += f.Loads.LiveLb
		lr += f.Loads.RoofLiveLb
		s += f.Loads.SnowLb
		wd += f.Loads.WindDownLb
		wu += f.Loads.WindUpLb
		if f.Kind == "rigid" {
			rigid++
		}
	}
	want := lp.Delivered
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"D", d, want.DeadLb}, {"L", l, want.LiveLb}, {"Lr", lr, want.RoofLiveLb}, {"S", s, want.SnowLb},
		{"W down", wd, want.WindDownLb}, {"W up", wu, want.WindUpLb}} {
		// results.json writes 6 significant digits: the sum of rounded
		// lines differs from the rounded total by that much
		if math.Abs(c.got-c.want) > 1e-4*math.Max(1, c.want) {
			t.Errorf("%s: foundation lines add up to %.3f lb, delivered %.3f lb", c.name, c.got, c.want)
		}
	}
	if rigid != 1 {
		t.Errorf("%d rigid-support lines, want 1 (the demo keeps beams rigid)", rigid)
	}
}
