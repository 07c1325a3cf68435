package framing

import (
	"math/rand/v2"
	"slices"
	"testing"
)

// TestZoneIndexCandidates: the grid finds, in increasing order, every
// zone whose bounding box the member's segment reaches, and only zones
// whose box overlaps the member's box, for random rectangles and segments
// (horizontal, vertical, diagonal, some outside every zone). Zones it
// leaves out cannot hold or cross the member, so zone assignment is the
// same as with a scan of every zone (common practice, no source).
func TestZoneIndexCandidates(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	var zs []zoneGeom
	for i := 0; i < 300; i++ {
		lo := Point{X: rng.Float64() * 20000, Y: rng.Float64() * 20000}
		hi := Point{X: lo.X + 50 + rng.Float64()*2000, Y: lo.Y + 50 + rng.Float64()*800}
		zs = append(zs, zoneGeom{lo: lo, hi: hi})
	}
	idx := newZoneIndex(zs)
	for n := 0; n < 3000; n++ {
		a := Point{X: rng.Float64()*24000 - 2000, Y: rng.Float64()*24000 - 2000}
		b := a
		switch n % 3 {
		case 0:
			b.X += rng.Float64() * 400
		case 1:
			b.Y += rng.Float64() * 400
		default:
			b = Point{X: a.X + rng.Float64()*3000, Y: a.Y + rng.Float64()*3000}
		}
		got := idx.candidates(zs, a, b)
		if !slices.IsSorted(got) {
			t.Fatalf("candidates %v not in increasing order", got)
		}
		for i := range zs {
			z := &zs[i]
			boxes := max(a.X, b.X) >= z.lo.X && min(a.X, b.X) <= z.hi.X && max(a.Y, b.Y) >= z.lo.Y && min(a.Y, b.Y) <= z.hi.Y
			in := slices.Contains(got, i)
			if in && !boxes {
				t.Errorf("segment %v-%v: zone %d listed, boxes apart", a, b, i)
			}
			if !in && segmentMeetsBox(a, b, z.lo, z.hi) {
				t.Errorf("segment %v-%v: zone %d (%v-%v) reached but not listed", a, b, i, z.lo, z.hi)
			}
		}
	}
}

// segmentMeetsBox reports whether segment ab has a point in the box
// lo..hi (Liang-Barsky clipping).
func segmentMeetsBox(a, b, lo, hi Point) bool {
	t0, t1 := 0.0, 1.0
	d := Point{X: b.X - a.X, Y: b.Y - a.Y}
	for _, c := range [][2]float64{{-d.X, a.X - lo.X}, {d.X, hi.X - a.X}, {-d.Y, a.Y - lo.Y}, {d.Y, hi.Y - a.Y}} {
		p, q := c[0], c[1]
		if p == 0 {
			if q < 0 {
				return false
			}
			continue
		}
		r := q / p
		if p < 0 {
			t0 = max(t0, r)
		} else {
			t1 = min(t1, r)
		}
	}
	return t0 <= t1
}
