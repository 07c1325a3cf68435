package main

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestBuildIsDeterministic(t *testing.T) {
	a, b := buildDXF(), buildDXF()
	if !bytes.Equal(a, b) {
		t.Fatal("two builds differ")
	}
	if !bytes.HasSuffix(a, []byte("  0\nEOF\n")) {
		t.Errorf("file does not end with the EOF tag")
	}
}

func TestRun(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "new")
	var out, errOut bytes.Buffer
	if code := run([]string{"-o", dir}, &out, &errOut); code != 0 {
		t.Fatalf("run = %d, stderr %q", code, errOut.String())
	}
	got, err := os.ReadFile(filepath.Join(dir, planFileName))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, buildDXF()) {
		t.Error("written file differs from buildDXF")
	}
	for _, args := range [][]string{{"-x"}, {"extra"}} {
		errOut.Reset()
		if code := run(args, &out, &errOut); code != 2 {
			t.Errorf("run(%q) = %d, want 2", args, code)
		}
		if errOut.Len() == 0 {
			t.Errorf("run(%q): nothing on stderr", args)
		}
	}
}

// distToSeg is the distance from (px, py) to the segment s.
func distToSeg(px, py float64, s seg) float64 {
	dx, dy := s.X2-s.X1, s.Y2-s.Y1
	u := ((px-s.X1)*dx + (py-s.Y1)*dy) / (dx*dx + dy*dy)
	u = math.Max(0, math.Min(1, u))
	return math.Hypot(px-(s.X1+u*dx), py-(s.Y1+u*dy))
}

// TestJoistEndsReachSupports checks the drawing as designed: every joist
// end lies within the 1.5 in snap tolerance (PROJECT-FILE.md default) of a
// support line, except the one drawn 6 in short of the flush beam and the
// cantilever tips, which lie CantileverIn past the 5.5 in wall's
// centre-line (2.75 in from its outer face line).
func TestJoistEndsReachSupports(t *testing.T) {
	const snapIn = 1.5
	for _, p := range []plan{floorPlan(), roofPlan()} {
		var supports []seg
		for _, s := range p.Lines {
			if strings.HasPrefix(s.Layer, "WALL") || strings.HasPrefix(s.Layer, "BEAM") {
				supports = append(supports, s)
			}
		}
		for _, r := range p.Runs {
			for i := 0; i < r.Count; i++ {
				x1, y1, x2, y2 := r.joist(i)
				for end, pt := range [][2]float64{{x1, y1}, {x2, y2}} {
					near := math.Inf(1)
					for _, s := range supports {
						near = math.Min(near, distToSeg(pt[0], pt[1], s))
					}
					if end == 0 && r.CantileverIn > 0 {
						if math.Abs(near+2.75-r.CantileverIn) > 1e-9 {
							t.Errorf("%s joist %d: tip %.2f in past the wall face, want %.2f", r.Name, i, near, r.CantileverIn-2.75)
						}
						continue
					}
					if end == 1 && r.ShortIn[i] > 0 {
						if math.Abs(near-6) > 1e-9 {
							t.Errorf("%s joist %d: short end %.2f in from a support, want 6", r.Name, i, near)
						}
						continue
					}
					if near > snapIn {
						t.Errorf("%s joist %d end %d: %.2f in from the nearest support", r.Name, i, end, near)
					}
				}
			}
		}
	}
}
