package framing

import (
	"bytes"
	"fmt"
	"runtime"
	"sync"
	"testing"
	"time"

	"framecheck/dxfimport"
	"framecheck/project"
	"framecheck/samples/bigplan/synth"
)

// synthPlan reads a samples/bigplan drawing of n joists (synth.Build,
// R2000, centre lines) and returns it with the framing options of its
// project file (synth.Project), mapped as the command maps them.
func synthPlan(tb testing.TB, n int) (*dxfimport.Drawing, Options) {
	tb.Helper()
	return readSynth(tb, synth.Options{Joists: n})
}

// synthPlanOutlines is synthPlan with every joist drawn as its outline.
func synthPlanOutlines(tb testing.TB, n int) (*dxfimport.Drawing, Options) {
	tb.Helper()
	return readSynth(tb, synth.Options{Joists: n, Outlines: true})
}

func readSynth(tb testing.TB, o synth.Options) (*dxfimport.Drawing, Options) {
	tb.Helper()
	data, _ := synth.Build(o)
	d, err := dxfimport.Read(bytes.NewReader(data), "bigplan.dxf", dxfimport.Options{Units: "in"})
	if err != nil {
		tb.Fatal(err)
	}
	p, err := project.ParseProject("bigplan.toml", []byte(synth.Project))
	if err != nil {
		tb.Fatal(err)
	}
	return d, projectOptions(p)
}

// projectOptions maps a project file onto Options the way the command
// does (pipeline.FramingOptions, which framing's tests cannot import: it
// imports framing), for tests that read one.
func projectOptions(p *project.Project) Options {
	o := DefaultOptions()
	o.SnapToleranceIn = p.Drawing.SnapToleranceIn
	o.MaxWallThicknessIn = p.Drawing.MaxWallThicknessIn
	o.EdgeDistanceIn = p.Drawing.EdgeDistanceIn
	o.JoistLayers = p.Layers.Joists
	o.BlockingLayers = p.Layers.Blocking
	o.ZoneLayers = p.Layers.Zones
	o.LabelLayers = p.Layers.Labels
	o.PostLayers = p.PostLayers()
	o.PointLoadLayers = p.Layers.PointLoads
	o.PointLoadNames = nil
	for _, l := range p.PointLoads {
		o.PointLoadNames = append(o.PointLoadNames, l.Name)
	}
	o.BayLayers = p.Layers.Bays
	o.Supports = nil
	for _, s := range p.Supports {
		o.Supports = append(o.Supports, SupportSpec{Layers: s.Layers, Kind: s.Kind, BearingIn: s.BearingIn, Rigid: !s.Check})
	}
	o.Species, o.Grade, o.Size = p.Lumber.Species, p.Lumber.Grade, p.Lumber.Size
	o.ByLayer = nil
	for _, r := range p.Lumber.ByLayer {
		o.ByLayer = append(o.ByLayer, LumberRule{Layers: r.Layers, Species: r.Species, Grade: r.Grade, Size: r.Size})
	}
	o.DefaultZone = p.Loads.DefaultZone
	if o.DefaultZone == "" && len(p.Zones) == 1 {
		o.DefaultZone = p.Zones[0].Name
	}
	return o
}

// synthSizes are the bigplan sizes the benchmarks group: time per joist
// should be flat from the first to the last (issue 18).
var synthSizes = []int{10_000, 100_000, 1_000_000}

// synthCache keeps the drawings read, so that each size is drawn and
// read once per test binary.
var synthCache sync.Map // int -> synthEntry

type synthEntry struct {
	d   *dxfimport.Drawing
	opt Options
}

func cachedSynthPlan(tb testing.TB, n int) (*dxfimport.Drawing, Options) {
	if e, ok := synthCache.Load(n); ok {
		return e.(synthEntry).d, e.(synthEntry).opt
	}
	d, opt := synthPlan(tb, n)
	synthCache.Store(n, synthEntry{d, opt})
	return d, opt
}

// BenchmarkGroupSynth groups bigplan drawings of 10k to 1M joists and
// reports the time per joist.
func BenchmarkGroupSynth(b *testing.B) {
	for _, n := range synthSizes {
		b.Run(fmt.Sprintf("joists=%d", n), func(b *testing.B) {
			d, opt := cachedSynthPlan(b, n)
			runtime.GC()
			b.ResetTimer()
			for b.Loop() {
				if pl := Group(d, opt); len(pl.Members) != n {
					b.Fatalf("members = %d, want %d", len(pl.Members), n)
				}
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(n), "ns/joist")
		})
	}
}

// BenchmarkGroupSteps groups a 100k-joist bigplan and reports each of
// Group's steps in ms per Group call (metrics named after the steps).
func BenchmarkGroupSteps(b *testing.B) {
	const n = 100_000
	d, opt := cachedSynthPlan(b, n)
	runtime.GC()
	b.ResetTimer()
	total := map[string]time.Duration{}
	for b.Loop() {
		g := newGrouper(opt, defaultWorkers(), defaultMinChunk)
		g.units, g.toInch = d.Units, d.ToInch
		t0 := time.Now()
		g.classify(d)
		total["classify"] += time.Since(t0)
		for _, s := range groupSteps {
			t0 = time.Now()
			s.run(g)
			total[s.name] += time.Since(t0)
		}
		if len(g.plan.Members) != n {
			b.Fatalf("members = %d, want %d", len(g.plan.Members), n)
		}
	}
	for name, t := range total {
		b.ReportMetric(float64(t.Microseconds())/1000/float64(b.N), name+"-ms")
	}
}
