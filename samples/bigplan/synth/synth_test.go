package synth

import (
	"bytes"
	"reflect"
	"testing"

	"framecheck/dxfimport"
	"framecheck/framing"
)

func TestBuildIsDeterministic(t *testing.T) {
	for _, r12 := range []bool{false, true} {
		a, sa := Build(Options{Joists: 3000, R12: r12})
		b, sb := Build(Options{Joists: 3000, R12: r12})
		if !bytes.Equal(a, b) || !reflect.DeepEqual(sa, sb) {
			t.Errorf("r12 %v: two builds differ", r12)
		}
		if !bytes.HasSuffix(a, []byte("  0\nEOF\n")) {
			t.Errorf("r12 %v: no EOF tag at the end", r12)
		}
	}
}

// TestJoistCountAndFlavours reads the plans back with package dxfimport:
// exactly N lines on the joist layers, the version asked for, and the
// same entities per layer in both flavours (an R12 POLYLINE is one
// entity, as an LWPOLYLINE is).
func TestJoistCountAndFlavours(t *testing.T) {
	for _, n := range []int{1, 7, 100, 1000, 4321} {
		counts := map[bool]map[string]int{}
		for _, r12 := range []bool{false, true} {
			data, st := Build(Options{Joists: n, R12: r12})
			d, err := dxfimport.Read(bytes.NewReader(data), "big.dxf", dxfimport.Options{Units: "in"})
			if err != nil {
				t.Fatalf("n %d r12 %v: %v", n, r12, err)
			}
			if err := d.Issues.Err(); err != nil {
				t.Errorf("n %d r12 %v: %v", n, r12, err)
			}
			want := map[bool]string{false: "AC1015", true: "AC1009"}[r12]
			if d.Version != want {
				t.Errorf("n %d r12 %v: $ACADVER %q, want %q", n, r12, d.Version, want)
			}
			c := map[string]int{}
			for _, e := range d.Entities {
				c[e.Pos.Layer]++
			}
			if got := c[lyJoistFloor] + c[lyJoistRoof]; got != n || st.Joists != n {
				t.Errorf("n %d r12 %v: %d joist entities, stats %d", n, r12, got, st.Joists)
			}
			counts[r12] = c
		}
		if !reflect.DeepEqual(counts[false], counts[true]) {
			t.Errorf("n %d: entities per layer differ:\n R2000 %v\n R12   %v", n, counts[false], counts[true])
		}
	}
}

// TestLayoutCovers checks the mix a large plan is meant to have: every
// run kind and zone present, joists drawn short, runs of 9 to 29.
func TestLayoutCovers(t *testing.T) {
	_, st := Build(Options{Joists: 10000})
	for _, k := range kindNames {
		if st.Kinds[k] == 0 {
			t.Errorf("no %s runs", k)
		}
	}
	if st.ShortJoists == 0 || st.StorageInterior == 0 || st.RoofEdgeRuns == 0 {
		t.Errorf("stats %+v: want short joists, storage bays and roof-edge runs", st)
	}
	if avg := float64(st.Joists) / float64(st.Runs); avg < 9 || avg > 29 {
		t.Errorf("%.1f joists per run, want 9 to 29", avg)
	}
}

// TestOutlinesSamePlan: the plan drawn as outlines groups into the same
// members (centre lines, spans, tribs) as the plan drawn as centre lines.
func TestOutlinesSamePlan(t *testing.T) {
	read := func(o Options) *framing.Plan {
		data, _ := Build(o)
		d, err := dxfimport.Read(bytes.NewReader(data), "big.dxf", dxfimport.Options{Units: "in"})
		if err != nil {
			t.Fatal(err)
		}
		return framing.Group(d, projectOptions())
	}
	a, b := read(Options{Joists: 2000}), read(Options{Joists: 2000, Outlines: true})
	if len(a.Members) != len(b.Members) || len(a.Members) < 2000 {
		t.Fatalf("members %d and %d", len(a.Members), len(b.Members))
	}
	for k := range a.Members {
		ma, mb := &a.Members[k], &b.Members[k]
		sa, sb := ma.Spans(), mb.Spans()
		if ma.Start != mb.Start || ma.End != mb.End || len(sa) != len(sb) || ma.TribIn != mb.TribIn || ma.Error != mb.Error {
			t.Fatalf("%s: %v-%v spans %v trib %g error %v; outlines %v-%v spans %v trib %g error %v",
				ma.ID, ma.Start, ma.End, sa, ma.TribIn, ma.Error, mb.Start, mb.End, sb, mb.TribIn, mb.Error)
		}
		if mb.DrawnThicknessIn != 1.5 {
			t.Fatalf("%s drawn %g in thick", mb.ID, mb.DrawnThicknessIn)
		}
	}
}

// projectOptions are the framing options of Project's [layers] and
// [[support]] tables.
func projectOptions() framing.Options {
	o := framing.DefaultOptions()
	o.Supports = []framing.SupportSpec{
		{Layers: []string{"WALL*"}, Kind: framing.KindBearingWall, BearingIn: 3.5},
		{Layers: []string{"BEAM-FLUSH*"}, Kind: framing.KindFlushBeam, BearingIn: 1.5},
		{Layers: []string{"BEAM-DROPPED*"}, Kind: framing.KindDroppedBeam, BearingIn: 1.75},
	}
	return o
}
