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

// TestDesignValuesOfTheLoadPath: the design values used list the load
// path's materials too (the demo's glulam girder with its Fbx-, its 4x10
// header, its 6x6 No.1 posts), never a value the material does not have
// as 0.
func TestDesignValuesOfTheLoadPath(t *testing.T) {
	_, _, _, r := runDemoTo(t, t.TempDir())
	has := map[string]float64{}
	for _, d := range r.Assumptions.DesignValues {
		has[d.Species+" "+d.Grade+" "+d.Size+" "+d.Name] = d.Value
		if d.Value == 0 {
			t.Errorf("%s %s %s: %s = 0 listed", d.Species, d.Grade, d.Size, d.Name)
		}
	}
	// NDS 2018 Supplement Table 5A (from memory: verify), Table 4D
	// (docs/VERIFIED.md) and Table 4A values
	for k, want := range map[string]float64{
		"Glulam 24F-1.8E 5.125x12 Fb": 2400, "Glulam 24F-1.8E 5.125x12 Fb-": 1450,
		"Douglas Fir-Larch No.1 6x6 Fc": 1000, "Douglas Fir-Larch No.2 4x10 Fb": 900,
	} {
		if got, ok := has[k]; !ok || got != want {
			t.Errorf("%s: %v (listed %v), want %v", k, got, ok, want)
		}
	}
}

// TestPostWeightToFoundation: each demo post (6x6, 5.5 x 5.5 in, 108 in
// high) takes its own weight down: 30.25/144 ft2 x 9 ft x 35 lb/ft3 =
// 66.17 lb more dead load at its base than at its cap (statics; the
// density as for beams, from memory: verify against NDS 2018 Supplement
// Table 1B).
func TestPostWeightToFoundation(t *testing.T) {
	_, _, _, r := runDemoTo(t, t.TempDir())
	want := 5.5 * 5.5 / 144 * 108 / 12 * 35
	for _, post := range []string{"P1", "P2"} {
		var cap, base float64
		for _, c := range r.LoadPath.Connections {
			switch {
			case c.Kind == "post cap" && c.Carrier == post:
				cap += c.Loads.DeadLb
			case c.Kind == "post base" && c.Member == post:
				base = c.Loads.DeadLb
			}
		}
		if cap == 0 || math.Abs(base-cap-want) > 0.05 {
			t.Errorf("%s: dead load %.2f lb at the base, %.2f lb at the cap; want %.2f lb more at the base", post, base, cap, want)
		}
	}
}

// TestHeaderBearsOnJackStud: the demo's header B1 over the door, in line
// with the wall, bears on a jack stud at each end: lb = 1.5 in (one 2x;
// common practice, no source), so its largest reaction, 444 lb, presses
// fc_perp = 444 / (3.5 x 1.5) = 84.6 psi (NDS 2018 3.10.2), not the 36
// psi a 3.5 in bearing would give.
func TestHeaderBearsOnJackStud(t *testing.T) {
	_, _, _, r := runDemoTo(t, t.TempDir())
	for _, b := range r.LoadPath.Beams {
		if b.ID != "B1" {
			continue
		}
		for _, c := range b.Checks {
			if c.Kind != "bearing" {
				continue
			}
			lb, R := -1.0, 0.0
			for _, it := range c.Trace {
				switch it.Name {
				case "lb":
					lb = it.Value
				case "R":
					R = it.Value
				}
			}
			if lb != 1.5 || math.Abs(c.Actual-R/(3.5*1.5)) > 1e-3*c.Actual {
				t.Errorf("B1 bearing: lb %v, fc_perp %v with R %v; want lb 1.5 and R / (3.5 x 1.5)", lb, c.Actual, R)
			}
			return
		}
	}
	t.Fatal("no bearing check of B1")
}
