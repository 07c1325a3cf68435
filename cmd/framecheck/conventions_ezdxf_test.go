package main

import (
	"math"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/dxfimport"
)

// TestConventionsEzdxfFixtures reads the plans ezdxf wrote
// (testdata/conventions/gen_conventions.py: the layout of
// conventions_test.go, drawn by an independent writer, turned and scaled
// by ezdxf's own transform) and compares each convention with the
// centre-line drawing of the same plan, as TestConventionsMatchCentreLines
// does for our own writer.
func TestConventionsEzdxfFixtures(t *testing.T) {
	dir := filepath.Join("testdata", "conventions")
	for _, tr := range []string{"plan", "turned"} {
		proj := filepath.Join(t.TempDir(), "conv.toml")
		ref := convRunFile(t, filepath.Join(dir, tr+"_ref.dxf"), proj)
		if len(ref.Plan.Members) != 9 || ref.Plan.Issues.Err() != nil {
			t.Fatalf("%s_ref: %d members, issues %v", tr, len(ref.Plan.Members), ref.Plan.Issues)
		}
		for _, v := range []string{"lines4", "lwpoly", "poly2d", "pair", "many", "joistblk", "all"} {
			got := convRunFile(t, filepath.Join(dir, tr+"_"+v+".dxf"), proj)
			sameOutcome(t, tr+"_"+v, ref, got)
			if strings.Contains("joistblk all", v) && got.Takeoff.ExistingBlockingPieces != 16 {
				t.Errorf("%s_%s: existing blocking %d pieces, want 16", tr, v, got.Takeoff.ExistingBlockingPieces)
			}
		}
	}
}

// TestConventionsEzdxfNotRectangle: a tapered outline of 4 LINEs and a
// pointed 5-vertex polyline (gen_conventions.py "notrect") are each one
// error naming their handles; the other seven joists are checked as in
// the centre-line drawing.
func TestConventionsEzdxfNotRectangle(t *testing.T) {
	dir := filepath.Join("testdata", "conventions")
	for _, tr := range []string{"plan", "turned"} {
		proj := filepath.Join(t.TempDir(), "conv.toml")
		ref := convRunFile(t, filepath.Join(dir, tr+"_ref.dxf"), proj)
		got := convRunFile(t, filepath.Join(dir, tr+"_notrect.dxf"), proj)
		d, err := dxfimport.ReadFile(filepath.Join(dir, tr+"_notrect.dxf"), dxfimport.Options{})
		if err != nil {
			t.Fatal(err)
		}
		// the handles ezdxf gave the bad joists' entities: the tapered
		// lines are the 4 LINEs drawn after joists 0 and 16 (8 lines), the
		// polyline the only LWPOLYLINE
		var joistLines []string
		var polyHandle string
		for _, e := range d.Entities {
			if e.Pos.Layer == "JOIST" && e.Kind == dxfimport.KindLine {
				joistLines = append(joistLines, e.Pos.Handle)
			}
			if e.Kind == dxfimport.KindLWPolyline {
				polyHandle = e.Pos.Handle
			}
		}
		var msgs []string
		for _, is := range got.Plan.Issues {
			if is.Code == "FRM216" {
				msgs = append(msgs, is.Error())
			}
		}
		all := strings.Join(msgs, "\n")
		named := 0
		for _, h := range joistLines[8:12] {
			if strings.Contains(all, "handle "+h) {
				named++
			}
		}
		if len(msgs) != 2 || named < 2 || !strings.Contains(all, "handle "+polyHandle) {
			t.Errorf("%s: FRM216 %q, want the tapered lines' sides %v and the polyline %s named", tr, msgs, joistLines[8:12], polyHandle)
		}
		// both are error members on their centre lines (so that they stay
		// their neighbours' neighbours); the others match the reference
		byMid := func(o *outcome, k int) dxfimport.Point {
			m := o.Plan.Members[k]
			return dxfimport.Point{X: (m.Start.X + m.End.X) / 2, Y: (m.Start.Y + m.End.Y) / 2}
		}
		if len(got.Plan.Members) != 9 {
			t.Fatalf("%s: %d members, want 9", tr, len(got.Plan.Members))
		}
		var good int
		for k := range ref.Plan.Members {
			for j := range got.Plan.Members {
				if dist2(byMid(ref, k), byMid(got, j)) > 0.5 {
					continue
				}
				if got.Plan.Members[j].Error {
					continue
				}
				good++
				r, g := ref.Results[k], got.Results[j]
				// the tapered member's centre line is the middle of its
				// mean width, about 1 in off the joist's: its neighbours'
				// tribs move by half that, and their ratios with them
				sameTrib := math.Abs(ref.Plan.Members[k].TribIn-got.Plan.Members[j].TribIn) <= 0.25
				if r.Status != g.Status || r.Governing != g.Governing || (sameTrib && math.Abs(r.MaxRatio-g.MaxRatio) > 0.005*r.MaxRatio) {
					t.Errorf("%s %s: %s %s %.4f, reference %s %s %.4f", tr, g.ID, g.Status, g.Governing, g.MaxRatio, r.Status, r.Governing, r.MaxRatio)
				}
			}
		}
		if good != 7 {
			t.Errorf("%s: %d good members matched the reference, want 7", tr, good)
		}
	}
}
