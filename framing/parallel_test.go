package framing

import (
	"bytes"
	"fmt"
	"math/rand/v2"
	"reflect"
	"testing"

	"framecheck/dxfimport"
	"framecheck/project"
	"framecheck/samples"
)

// TestGroupWorkersSame groups the same drawings on one goroutine and on
// several, each given as few as one member, and wants the very same
// plan: every member, issue, support, run and beam, in the same order,
// bit for bit. The drawings: the demo plan, the two fixtures, a 20,000-
// joist bigplan drawn with centre lines and a smaller one with outlines,
// the benchmark's grid, and random messy plans (duplicates, ends short of
// their supports, flush beams framing into joists, crossing zones,
// conflicting callouts, lone joists, two directions).
func TestGroupWorkersSame(t *testing.T) {
	type tc struct {
		name string
		d    *dxfimport.Drawing
		opt  Options
	}
	var cases []tc
	dp, err := project.ParseProject("framecheck.toml", samples.DemoProject)
	if err != nil {
		t.Fatal(err)
	}
	d, err := dxfimport.Read(bytes.NewReader(samples.DemoPlan), "plan.dxf", dxfimport.Options{Units: dp.Drawing.Units})
	if err != nil {
		t.Fatal(err)
	}
	cases = append(cases, tc{"demo", d, projectOptions(dp)})
	d, err = dxfimport.ReadFile("testdata/plan_ft.dxf", dxfimport.Options{})
	if err != nil {
		t.Fatal(err)
	}
	opt := DefaultOptions()
	opt.ByLayer = []LumberRule{{Layers: []string{"JOIST-CANT*"}, Size: "2x8"}}
	cases = append(cases, tc{"plan_ft", d, opt})
	d, err = dxfimport.ReadFile("testdata/loadpath.dxf", dxfimport.Options{})
	if err != nil {
		t.Fatal(err)
	}
	cases = append(cases, tc{"loadpath", d, loadPathOptions()})
	n := 20_000
	if testing.Short() {
		n = 3_000
	}
	d, opt = synthPlan(t, n)
	cases = append(cases, tc{fmt.Sprintf("bigplan %d", n), d, opt})
	d, opt = synthPlanOutlines(t, n/4)
	cases = append(cases, tc{fmt.Sprintf("bigplan %d outlines", n/4), d, opt})
	cases = append(cases, tc{"grid 5000", genPlan(5000), DefaultOptions()})
	for seed := uint64(1); seed <= 6; seed++ {
		cases = append(cases, tc{fmt.Sprintf("messy %d", seed), messyPlan(seed, 400), loadPathOptions()})
	}
	for _, c := range cases {
		one := groupWith(c.d, c.opt, 1, defaultMinChunk)
		if len(one.Members) == 0 {
			t.Fatalf("%s: no members", c.name)
		}
		for _, w := range []int{2, 3, 7} {
			got := groupWith(c.d, c.opt, w, 1)
			if !reflect.DeepEqual(one, got) {
				t.Errorf("%s, %d goroutines: plan differs from one goroutine's at %s",
					c.name, w, firstDiff(reflect.ValueOf(one), reflect.ValueOf(got), "Plan"))
			}
		}
		if got := Group(c.d, c.opt); !reflect.DeepEqual(one, got) { // as the command calls it
			t.Errorf("%s, Group: plan differs from one goroutine's at %s",
				c.name, firstDiff(reflect.ValueOf(one), reflect.ValueOf(got), "Plan"))
		}
	}
}

// firstDiff returns the path of the first difference between a and b
// (values of one type), "" when they are deeply equal.
func firstDiff(a, b reflect.Value, path string) string {
	switch a.Kind() {
	case reflect.Pointer, reflect.Interface:
		if a.IsNil() || b.IsNil() {
			if a.IsNil() != b.IsNil() {
				return path + " (nil)"
			}
			return ""
		}
		return firstDiff(a.Elem(), b.Elem(), path)
	case reflect.Struct:
		for i := 0; i < a.NumField(); i++ {
			if d := firstDiff(a.Field(i), b.Field(i), path+"."+a.Type().Field(i).Name); d != "" {
				return d
			}
		}
		return ""
	case reflect.Slice, reflect.Array:
		if a.Kind() == reflect.Slice && a.IsNil() != b.IsNil() {
			return fmt.Sprintf("%s (nil %v, %v)", path, a.IsNil(), b.IsNil())
		}
		for i := 0; i < min(a.Len(), b.Len()); i++ {
			if d := firstDiff(a.Index(i), b.Index(i), fmt.Sprintf("%s[%d]", path, i)); d != "" {
				return d
			}
		}
		if a.Len() != b.Len() {
			return fmt.Sprintf("%s (len %d, %d)", path, a.Len(), b.Len())
		}
		return ""
	case reflect.Map:
		if a.Len() != b.Len() {
			return fmt.Sprintf("%s (len %d, %d)", path, a.Len(), b.Len())
		}
		for _, k := range a.MapKeys() {
			bv := b.MapIndex(k)
			if !bv.IsValid() {
				return fmt.Sprintf("%s[%v] (missing)", path, k)
			}
			if d := firstDiff(a.MapIndex(k), bv, fmt.Sprintf("%s[%v]", path, k)); d != "" {
				return d
			}
		}
		return ""
	case reflect.Float32, reflect.Float64:
		if x, y := a.Float(), b.Float(); x != y && !(x != x && y != y) {
			return fmt.Sprintf("%s (%v, %v)", path, x, y)
		}
		return ""
	default:
		if fmt.Sprint(a) != fmt.Sprint(b) {
			return fmt.Sprintf("%s (%v, %v)", path, a, b)
		}
		return ""
	}
}

// messyPlan draws a random plan of about bays x 12 joists on
// loadPathOptions' layers: bays of joists in two directions between
// single and double-line walls and flush beams, with joists drawn twice,
// drawn short, nudged off square, crossed by blocking and by flush beams
// ending on them, callouts (some conflicting) on span lines and beside
// joists, overlapping zones with names, posts and point loads.
func messyPlan(seed uint64, bays int) *dxfimport.Drawing {
	r := rand.New(rand.NewPCG(seed, 0x5eed))
	p := newPlan()
	sizes := []string{`2x10 @ 16" o.c.`, `2x12 @ 16" o.c.`, `2x8 @ 12" o.c.`, `2x10 DF-L No.1`, `2X1O @ 16`}
	cols := 20
	for b := 0; b < bays; b++ {
		x0, y0 := float64(b%cols)*260, float64(b/cols)*220
		span := 120 + 12*float64(r.IntN(6))
		across := r.IntN(4) == 0                      // joists along x
		pt := func(a, c float64) (float64, float64) { // along, across -> x, y
			if across {
				return x0 + a, y0 + c
			}
			return x0 + c, y0 + a
		}
		ln := func(layer string, a0, c0, a1, c1 float64) {
			x1, y1 := pt(a0, c0)
			x2, y2 := pt(a1, c1)
			p.line(layer, x1, y1, x2, y2)
		}
		count := 8 + r.IntN(8)
		width := float64(count) * 16
		// supports at along 0 and span: single line, double-line wall or flush beam
		for _, a := range []float64{0, span} {
			switch r.IntN(4) {
			case 0:
				ln("WALL", a-2.75, -8, a-2.75, width+8)
				ln("WALL", a+2.75, -8, a+2.75, width+8)
			case 1:
				ln("BEAM-FLUSH", a, -8, a, width+8)
			case 2:
				ln("BEAM-DROP", a, -8, a, width+8)
			default:
				ln("WALL", a, -8, a, width+8)
			}
		}
		for i := 0; i < count; i++ {
			c := 8 + float64(i)*16 + r.Float64()*0.2
			a0, a1 := 0.0, span
			if r.IntN(15) == 0 {
				a0 += 6 // short of its support
			}
			if r.IntN(10) == 0 {
				a1 += 24 + float64(r.IntN(3))*12 // cantilever
			}
			skew := 0.0
			if r.IntN(12) == 0 {
				skew = 1 // a little off square
			}
			ln("JOIST", a0, c, a1, c+skew)
			if r.IntN(20) == 0 {
				ln("JOIST", a0, c+0.01, a1, c+skew) // drawn twice
			}
		}
		if r.IntN(30) == 0 { // a joist alone, no neighbour within reach
			ln("JOIST", 0, width+130, span, width+130)
		}
		if r.IntN(30) == 0 { // a callout far from every joist
			x, y := pt(span/2, width+200)
			p.text("FRAMING-NOTE", sizes[0], x, y, 4)
		}
		if r.IntN(3) == 0 {
			ln("BLOCKING", span/2, 0, span/2, width)
		}
		if r.IntN(8) == 0 { // a header framing into the joists between
			ln("BEAM-FLUSH", span/3, 8+16*2, span/3, 8+16*4)
		}
		switch r.IntN(4) {
		case 0, 1: // on a span line
			ln("FRAMING-NOTE", span*0.4, 0, span*0.4, width)
			x, y := pt(span*0.4+3, width/2)
			p.text("FRAMING-NOTE", sizes[r.IntN(len(sizes))], x, y, 4)
			if r.IntN(5) == 0 { // a second, maybe conflicting
				x, y = pt(span*0.4-3, width/2)
				p.text("FRAMING-NOTE", sizes[r.IntN(len(sizes))], x, y, 4)
			}
		case 2: // beside a joist
			x, y := pt(span/2, 8+16*float64(r.IntN(count))+2)
			p.text("FRAMING-NOTE", sizes[r.IntN(len(sizes))], x, y, 4)
		}
		if r.IntN(6) == 0 {
			x, y := pt(span/2, 8+16*float64(r.IntN(count)))
			p.point("POINT-LOAD", x, y)
			p.text("POINT-LOAD", "RTU-1", x+3, y+3, 4)
		}
		if r.IntN(10) == 0 {
			x, y := pt(0, width+30)
			p.circle("POST", x, y, 2.75)
		}
	}
	// zones: overlapping rectangles over random groups of bays, named
	names := []string{"FLOOR", "DECK", "STORAGE"}
	rows := (bays + cols - 1) / cols
	for z := 0; z < bays/6+1; z++ {
		x0, y0 := float64(r.IntN(cols))*260-40, float64(r.IntN(rows))*220-30
		w, h := 260*float64(1+r.IntN(4))-50*r.Float64(), 220*float64(1+r.IntN(2))-90*r.Float64()
		p.poly("LOAD-ZONE", true, Point{X: x0, Y: y0}, Point{X: x0 + w, Y: y0}, Point{X: x0 + w, Y: y0 + h}, Point{X: x0, Y: y0 + h})
		if r.IntN(8) != 0 {
			p.text("LOAD-ZONE", names[r.IntN(len(names))], x0+10, y0+10, 6)
		}
	}
	return &p.d
}
