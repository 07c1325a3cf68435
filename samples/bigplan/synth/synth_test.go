package synth

import (
	"bytes"
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"

	"framecheck/dxfimport"
	"framecheck/framing"
	"framecheck/project"
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

// TestBeamsPlan: with Options.Beams the plan groups into the same joists
// as without, and every beam line bears on the posts drawn under it: one
// post under each end, its outer face at the beam's end (a 6x6 is 5.5 in,
// NDS 2018 Supplement Table 1B, so its centre 2.75 in in), spans between
// posts no longer than 16 ft, each post under one beam. Without Beams no
// post is drawn and every beam stays a rigid bearing.
func TestBeamsPlan(t *testing.T) {
	read := func(o Options) (*framing.Plan, Stats) {
		data, st := Build(o)
		d, err := dxfimport.Read(bytes.NewReader(data), "big.dxf", dxfimport.Options{Units: "in"})
		if err != nil {
			t.Fatal(err)
		}
		if err := d.Issues.Err(); err != nil {
			t.Fatal(err)
		}
		return framing.Group(d, projectOptions()), st
	}
	for _, r12 := range []bool{false, true} {
		rigid, rst := read(Options{Joists: 3000, R12: r12})
		beams, bst := read(Options{Joists: 3000, R12: r12, Beams: true})
		if len(rigid.Members) != len(beams.Members) || len(rigid.Members) != 3000 {
			t.Fatalf("r12 %v: members %d and %d, want 3000", r12, len(rigid.Members), len(beams.Members))
		}
		for k := range rigid.Members {
			a, b := &rigid.Members[k], &beams.Members[k]
			if a.Start != b.Start || a.End != b.End || fmt.Sprint(a.Spans()) != fmt.Sprint(b.Spans()) || a.TribIn != b.TribIn || a.Error != b.Error {
				t.Fatalf("r12 %v: %s differs with Beams", r12, a.ID)
			}
		}
		if rst.Beams != 0 || rst.Posts != 0 || len(rigid.Posts) != 0 {
			t.Errorf("r12 %v: without Beams, stats %d beams %d posts, %d posts read", r12, rst.Beams, rst.Posts, len(rigid.Posts))
		}
		if len(rigid.Beams) != bst.Beams || len(beams.Beams) != bst.Beams || len(beams.Posts) != bst.Posts || bst.Posts < 2*bst.Beams {
			t.Fatalf("r12 %v: beams %d/%d, posts %d, stats %d beams %d posts", r12, len(rigid.Beams), len(beams.Beams),
				len(beams.Posts), bst.Beams, bst.Posts)
		}
		under := make([]int, len(beams.Posts))
		for i := range beams.Beams {
			b, r := &beams.Beams[i], &rigid.Beams[i]
			if !r.Rigid || len(r.Bearings) != 0 {
				t.Errorf("r12 %v: without Beams %s is not a rigid bearing", r12, r.ID)
			}
			if b.Rigid || len(b.Bearings) < 2 || len(b.Carried) == 0 || len(b.Carried) != len(r.Carried) {
				t.Fatalf("r12 %v: %s rigid %v, %d bearings, carries %d (%d without posts)", r12, b.ID, b.Rigid,
					len(b.Bearings), len(b.Carried), len(r.Carried))
			}
			const tol = 1e-6
			brs := b.Bearings
			if math.Abs(brs[0].AtIn-2.75) > tol || math.Abs(brs[len(brs)-1].AtIn-(b.LengthIn-2.75)) > tol {
				t.Errorf("r12 %v: %s end posts at %g and %g in of %g", r12, b.ID, brs[0].AtIn, brs[len(brs)-1].AtIn, b.LengthIn)
			}
			for j, br := range brs {
				if br.Kind != framing.BeamOnPost || br.LengthIn != 5.5 {
					t.Errorf("r12 %v: %s bears on %s %d, %g in long; want posts 5.5 in", r12, b.ID, br.Kind, br.Index, br.LengthIn)
					continue
				}
				under[br.Index]++
				if j > 0 && br.AtIn-brs[j-1].AtIn > 192+tol {
					t.Errorf("r12 %v: %s spans %g in between posts, over 16 ft", r12, b.ID, br.AtIn-brs[j-1].AtIn)
				}
			}
		}
		for i, n := range under {
			if n != 1 {
				t.Errorf("r12 %v: %s under %d beams, want 1", r12, beams.Posts[i].ID, n)
			}
		}
	}
}

// TestProjectBeams: ProjectBeams is a project file framecheck reads
// without error, with Project's settings and the beams' and posts' sizes
// added; ProjectFor picks it only with Beams.
func TestProjectBeams(t *testing.T) {
	if ProjectFor(Options{}) != Project || ProjectFor(Options{Beams: true}) != ProjectBeams {
		t.Error("ProjectFor picks the wrong file")
	}
	for name, text := range map[string]string{"Project": Project, "ProjectBeams": ProjectBeams} {
		if _, err := project.ParseProject(name+".toml", []byte(text)); err != nil {
			t.Fatalf("%s: %v", name, err)
		}
	}
	p, _ := project.ParseProject("beams.toml", []byte(ProjectBeams))
	flush, dropped := p.SupportOf("BEAM-FLUSH"), p.SupportOf("BEAM-DROPPED")
	if flush == nil || flush.Size != "6x14" || dropped == nil || dropped.Size != "2x12" || dropped.Plies != 3 {
		t.Errorf("beam sizes: flush %+v, dropped %+v", flush, dropped)
	}
	if len(p.Posts) != 1 || p.Posts[0].Size != "6x6" || p.Posts[0].HeightIn != 96 || p.PostFor(lyPost) == nil {
		t.Errorf("posts: %+v", p.Posts)
	}
	if !strings.HasPrefix(ProjectBeams, Project[:strings.Index(Project, "[layers]")]) {
		t.Error("ProjectBeams does not start as Project does")
	}
}
