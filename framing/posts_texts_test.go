package framing

import (
	"fmt"
	"math/rand"
	"testing"

	"framecheck/dxfimport"
)

// assignPostTextsByScan is the rule assignPostTexts follows, by looking at
// every post for every text (as it was written before its grid): each post
// without a text takes the nearest text that has it as its nearest post
// within reach.
func assignPostTextsByScan(posts []Post, texts []textItem, accept func(textItem) bool) {
	best := map[int]int{}
	bestD := map[int]float64{}
	for ti, t := range texts {
		if !accept(t) {
			continue
		}
		pk, pd := -1, postTextReachIn(t)
		for k := range posts {
			if posts[k].Text != "" {
				continue
			}
			if d := dist(posts[k].At, t.p); d <= pd {
				pk, pd = k, d
			}
		}
		if pk < 0 {
			continue
		}
		if d, ok := bestD[pk]; !ok || pd < d {
			best[pk], bestD[pk] = ti, pd
		}
	}
	for k, ti := range best {
		posts[k].Text = texts[ti].text
		posts[k].TextPos = texts[ti].pos
	}
}

// TestAssignPostTextsAsByScan: the grid gives every post the text the scan
// of every post gives it, on random plans with posts on a coarse lattice
// (ties at equal distances included), some posts already named, texts of
// several heights and some refused (common practice, no source).
func TestAssignPostTextsAsByScan(t *testing.T) {
	r := rand.New(rand.NewSource(3))
	for round := 0; round < 200; round++ {
		n, m := 1+r.Intn(60), r.Intn(80)
		var posts []Post
		for k := 0; k < n; k++ {
			p := Post{At: Point{X: float64(r.Intn(20) * 6), Y: float64(r.Intn(20) * 6)}}
			if r.Intn(5) == 0 {
				p.Text = "given"
			}
			posts = append(posts, p)
		}
		var texts []textItem
		for i := 0; i < m; i++ {
			texts = append(texts, textItem{p: Point{X: float64(r.Intn(130)) - 5, Y: float64(r.Intn(130)) - 5},
				text: fmt.Sprintf("T%d", i), heightIn: float64(r.Intn(3)) * 4, pos: dxfimport.Pos{Handle: fmt.Sprintf("%X", i)}})
		}
		accept := func(t textItem) bool { return t.text[len(t.text)-1] != '7' }
		a, b := append([]Post(nil), posts...), append([]Post(nil), posts...)
		assignPostTexts(a, texts, accept)
		assignPostTextsByScan(b, texts, accept)
		for k := range a {
			if a[k].Text != b[k].Text || a[k].TextPos != b[k].TextPos {
				t.Fatalf("round %d post %d at %v: %q, by scan %q", round, k, a[k].At, a[k].Text, b[k].Text)
			}
		}
	}
}

// BenchmarkAssignPostTexts: 20,000 posts on beam lines, each labelled,
// as a plan with its posts called out (issue 18: no quadratic step).
func BenchmarkAssignPostTexts(b *testing.B) {
	var posts []Post
	var texts []textItem
	for k := 0; k < 20000; k++ {
		at := Point{X: float64(k%200) * 120, Y: float64(k/200) * 160}
		posts = append(posts, Post{At: at})
		texts = append(texts, textItem{p: Point{X: at.X + 8, Y: at.Y + 6}, text: "6x6", heightIn: 4})
	}
	all := func(textItem) bool { return true }
	b.ReportAllocs()
	for b.Loop() {
		ps := append([]Post(nil), posts...)
		assignPostTexts(ps, texts, all)
	}
}

// TestPointGridNearestAsScan: the grid's nearest point within a reach is
// the scan's (every point looked at, the last of points as near kept), for
// random points on a lattice, some left out, and reaches up to the cell
// (common practice, no source).
func TestPointGridNearestAsScan(t *testing.T) {
	r := rand.New(rand.NewSource(5))
	for round := 0; round < 300; round++ {
		n := r.Intn(50)
		pts := make([]Point, n)
		take := make([]bool, n)
		for i := range pts {
			pts[i] = Point{X: float64(r.Intn(30)*4 - 40), Y: float64(r.Intn(30)*4 - 40)}
			take[i] = r.Intn(4) != 0
		}
		cell := 12 + float64(r.Intn(3))*6
		g := newPointGrid(cell, n, func(i int) (Point, bool) { return pts[i], take[i] })
		for q := 0; q < 20; q++ {
			p := Point{X: float64(r.Intn(140) - 50), Y: float64(r.Intn(140) - 50)}
			reach := 12 + float64(r.Intn(int(cell)-11))
			want, wd := -1, reach
			for i := range pts {
				if d := dist(pts[i], p); take[i] && d <= wd {
					want, wd = i, d
				}
			}
			if got, gd := g.nearest(p, reach); got != want || gd != wd {
				t.Fatalf("round %d, %v within %g: point %d at %g, by scan %d at %g", round, p, reach, got, gd, want, wd)
			}
		}
	}
}
