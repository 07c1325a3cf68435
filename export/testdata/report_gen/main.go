// Command report_gen writes the report fixture, export/testdata/report_results.json
// and report_geometry.json: a small made-up plan (a floor bay and a roof bay
// between three walls) whose members are checked by package check, so the
// report tests see real traces, factors and blocking-row iterations. It
// stands in for the command's Results assembly until that exists; the
// mapping here is deliberately simple (marks by size, spans and spacing;
// takeoff by the DOMAIN rules) and is not the program's.
//
// Usage:
//
//	go run ./export/testdata/report_gen -o export/testdata
package main

import (
	"encoding/json"
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"

	"framecheck/check"
	"framecheck/export"
)

// bay is a run of parallel joists spanning in x between two walls.
type bay struct {
	zone        string
	use         string
	x0, x1      float64 // wall centre-lines, in
	y0, dy      float64 // first joist and spacing, in
	n           int
	size        string
	loads       check.AreaLoads
	live, total float64
	run         string
}

func main() {
	out := flag.String("o", "export/testdata", "output folder")
	flag.Parse()
	if err := run(*out); err != nil {
		fmt.Fprintln(os.Stderr, "report_gen:", err)
		os.Exit(1)
	}
}

func run(out string) error {
	bays := []bay{
		{zone: "FLOOR", use: "floor", x0: 0, x1: 168, y0: 8, dy: 16, n: 12, size: "2x10",
			loads: check.AreaLoads{DeadPsf: 12, LivePsf: 40}, live: 360, total: 240, run: "R1"},
		{zone: "ROOF", use: "roof", x0: 168, x1: 312, y0: 12, dy: 24, n: 8, size: "2x8",
			loads: check.AreaLoads{DeadPsf: 10, RoofLivePsf: 20, SnowPsf: 25, WindUpPsf: 62}, live: 240, total: 180, run: "R2"},
	}
	set := check.DefaultSettings()
	r := &export.Results{Schema: export.Schema, Plan: "loft-plan.dxf", DrawingUnits: "in"}
	markOf := map[string]string{}
	var markList []*export.Mark
	id := 0
	for _, b := range bays {
		var runMembers []int
		for i := 0; i < b.n; i++ {
			id++
			y := b.y0 + float64(i)*b.dy
			size := b.size
			if b.run == "R1" && i == 5 {
				size = "2x6" // drawn too small: fails
			}
			trib := b.dy
			if i == 0 || i == b.n-1 {
				trib = b.dy/2 + 4
			}
			length := b.x1 - b.x0 + 3.5
			m := check.Member{
				ID: fmt.Sprintf("M%d", id), Size: size, Species: "DF-L", Grade: "No.2",
				LengthIn:  length,
				Bearings:  []check.Bearing{{AtIn: 1.75, LengthIn: 3.5}, {AtIn: length - 1.75, LengthIn: 3.5}},
				SpacingIn: b.dy, TribIn: trib, Use: b.use, Loads: b.loads,
				LiveLimit: b.live, TotalLimit: b.total, Repetitive: true,
			}
			start := [2]float64{b.x0 - 1.75, y}
			end := [2]float64{b.x1 + 1.75, y}
			em := export.Member{ID: m.ID, Layer: "JOISTS", Handle: strconv.FormatInt(int64(0x40+id), 16),
				Start: start, End: end, StartIn: start, EndIn: end, LengthIn: length,
				BearingsAtIn: []float64{1.75, length - 1.75}, TribIn: trib, SpacingIn: b.dy,
				Zone: b.zone, BlockingRowsPerSpan: []int{}, BlockingAtIn: []float64{}, Messages: []string{}}
			em.Source = fmt.Sprintf("%s:%d (handle %s, layer JOISTS)", r.Plan, 800+14*id, strings.ToUpper(em.Handle))
			if b.run == "R2" && i == 3 {
				// Drawn short of the far wall: no second bearing.
				em.End[0] -= 30
				em.EndIn = em.End
				em.LengthIn -= 30
				em.Size, em.Species, em.Grade = size, "Douglas Fir-Larch", "No.2"
				em.Status = export.StatusError
				em.Messages = []string{"FRM201 end at (283.75, 84) reaches no support within 1.5 in"}
				em.Checks = []export.Check{}
				em.SpansIn = []float64{}
				em.BearingsAtIn = []float64{1.75}
				em.Mark = ""
				r.Members = append(r.Members, em)
				continue
			}
			res := check.CheckMember(m, set)
			fill(&em, &res)
			key := fmt.Sprintf("%s|%v|%g|%s|%g", em.Size, em.SpansIn, em.SpacingIn, em.Zone, math.Round(trib*2)/2)
			mk, ok := markOf[key]
			if !ok {
				mk = fmt.Sprintf("J%d", len(markList)+1)
				markOf[key] = mk
				markList = append(markList, &export.Mark{Mark: mk, Size: em.Size, Species: em.Species, Grade: em.Grade,
					Zone: em.Zone, SpacingIn: em.SpacingIn, SpansIn: em.SpansIn, Status: export.StatusPass,
					BlockingRowsPerSpan: em.BlockingRowsPerSpan})
			}
			em.Mark = mk
			r.Members = append(r.Members, em)
			runMembers = append(runMembers, len(r.Members)-1)
		}
		addRows(r, b, runMembers)
	}
	for i := range r.Members {
		m := &r.Members[i]
		r.Summary.Members++
		switch m.Status {
		case export.StatusPass:
			r.Summary.Pass++
		case export.StatusFail:
			r.Summary.Fail++
		default:
			r.Summary.Error++
		}
		for _, mk := range markList {
			if mk.Mark == m.Mark {
				mk.Count++
				mk.MaxRatio = math.Max(mk.MaxRatio, m.MaxRatio)
				if m.Status != export.StatusPass {
					mk.Status = m.Status
				}
			}
		}
	}
	for _, mk := range markList {
		r.Marks = append(r.Marks, *mk)
	}
	r.Takeoff = takeoff(r)
	r.Assumptions = assumptions(bays)
	geom := export.PlanGeometry{
		Supports: []export.Polyline{
			{Layer: "WALLS", Points: [][2]float64{{0, 0}, {0, 192}}},
			{Layer: "WALLS", Points: [][2]float64{{168, 0}, {168, 192}}},
			{Layer: "WALLS", Points: [][2]float64{{312, 0}, {312, 192}}},
		},
		Zones: []export.ZoneOutline{
			{Name: "FLOOR", Points: [][2]float64{{0, 0}, {168, 0}, {168, 192}, {0, 192}}},
			{Name: "ROOF", Points: [][2]float64{{168, 0}, {312, 0}, {312, 192}, {168, 192}}},
		},
	}
	if err := writeJSON(filepath.Join(out, "report_results.json"), r); err != nil {
		return err
	}
	return writeJSON(filepath.Join(out, "report_geometry.json"), geom)
}

// fill copies a check result into an export member.
func fill(em *export.Member, res *check.Result) {
	em.Size, em.Species, em.Grade = res.Size, res.Species, res.Grade
	em.SpansIn = res.SpansIn
	em.OverhangsIn = res.OverhangsIn
	em.Governing, em.MaxRatio, em.Status = res.Governing, res.MaxRatio, res.Status
	em.Messages = append([]string{}, res.Messages...)
	em.BlockingRowsPerSpan = append([]int{}, res.BlockingRowsPerSpan...)
	em.BlockingAtIn = append([]float64{}, res.BlockingAtIn...)
	for _, c := range res.Checks {
		em.Checks = append(em.Checks, export.Check{Kind: c.Kind, Combo: c.Combo, Actual: c.Actual,
			Allowable: c.Allowable, Unit: c.Unit, Ratio: c.Ratio, Trace: trace(c.Trace())})
	}
	for _, s := range res.BlockingSteps {
		em.BlockingSteps = append(em.BlockingSteps, export.BlockingStep{RowsPerSpan: s.RowsPerSpan, LuIn: s.LuIn, CL: s.CL, Ratio: s.Ratio})
	}
	em.Factors = trace(res.Factors)
}

func trace(ts []check.TraceItem) []export.TraceItem {
	out := make([]export.TraceItem, len(ts))
	for i, t := range ts {
		out[i] = export.TraceItem{Name: t.Symbol, Value: t.Value, Unit: t.Unit, Source: t.Ref, Formula: t.Formula, Subst: t.Subst.Text()}
	}
	return out
}

// addRows draws one blocking row across the run at each distinct position
// its members need.
func addRows(r *export.Results, b bay, idx []int) {
	pos := map[float64]bool{}
	for _, i := range idx {
		for _, p := range r.Members[i].BlockingAtIn {
			pos[math.Round(p*16)/16] = true
		}
	}
	var ps []float64
	for p := range pos {
		ps = append(ps, p)
	}
	sort.Float64s(ps)
	for _, p := range ps {
		first, last := r.Members[idx[0]], r.Members[idx[len(idx)-1]]
		x := first.Start[0] + p
		row := export.BlockingRow{ID: fmt.Sprintf("B%d", len(r.BlockingRows)+1), Run: b.run, PositionIn: p - 1.75,
			Pieces: len(idx) - 1, Size: first.Size, Start: [2]float64{x, first.Start[1]}, End: [2]float64{x, last.Start[1]}}
		row.StartIn, row.EndIn = row.Start, row.End
		for k, i := range idx {
			row.Members = append(row.Members, r.Members[i].ID)
			if k > 0 {
				row.ClearIn = append(row.ClearIn, r.Members[i].Start[1]-r.Members[idx[k-1]].Start[1]-1.5)
			}
		}
		r.BlockingRows = append(r.BlockingRows, row)
	}
}

// takeoff counts joists by size and order length (next even foot, 8 ft
// minimum) and blocking pieces by size (DOMAIN.md "Takeoff").
func takeoff(r *export.Results) export.Takeoff {
	var t export.Takeoff
	type key struct {
		size string
		ft   float64
	}
	joists := map[key]int{}
	for _, m := range r.Members {
		ft := math.Max(8, 2*math.Ceil(m.LengthIn/24))
		joists[key{m.Size, ft}]++
	}
	var keys []key
	for k := range joists {
		keys = append(keys, k)
	}
	sort.Slice(keys, func(i, j int) bool {
		if keys[i].size != keys[j].size {
			return keys[i].size < keys[j].size
		}
		return keys[i].ft < keys[j].ft
	})
	for _, k := range keys {
		b, d := nominal(k.size)
		bf := b * d * k.ft / 12 * float64(joists[k])
		t.Joists = append(t.Joists, export.TakeoffLine{Size: k.size, OrderLengthFt: k.ft, Count: joists[k], BoardFeet: bf})
		t.Totals.JoistCount += joists[k]
		t.Totals.JoistBoardFeet += bf
	}
	blk := map[string][2]float64{}
	for _, row := range r.BlockingRows {
		v := blk[row.Size]
		v[0] += float64(row.Pieces)
		for _, c := range row.ClearIn {
			b, d := nominal(row.Size)
			v[1] += b * d * c / 144
		}
		blk[row.Size] = v
	}
	for size, v := range blk {
		t.Blocking = append(t.Blocking, export.TakeoffLine{Size: size, Count: int(v[0]), BoardFeet: math.Round(v[1]*100) / 100})
		t.Totals.BlockingPieces += int(v[0])
		t.Totals.BlockingBoardFeet += math.Round(v[1]*100) / 100
	}
	t.Hangers = []export.TakeoffLine{}
	t.Totals.BoardFeet = t.Totals.JoistBoardFeet + t.Totals.BlockingBoardFeet
	return t
}

func nominal(size string) (float64, float64) {
	var b, d float64
	fmt.Sscanf(size, "%gx%g", &b, &d)
	return b, d
}

func assumptions(bays []bay) export.Assumptions {
	a := export.Assumptions{
		CodeEditions: []string{"NDS 2018 (ASD) with 2018 Supplement", "ASCE 7-16 section 2.4.1", "IBC 2018 Table 1604.3"},
		Combinations: []string{"D", "D+L", "D+(Lr or S)", "D+0.75L+0.75(Lr or S)", "D+0.6W", "D+0.75L+0.75(0.6W)+0.75(Lr or S)", "0.6D+0.6W"},
		Switches: []export.Setting{
			{Name: "design.top_edge_braced", Value: "true", Source: "default"},
			{Name: "design.kcr", Value: "1.5", Source: "default"},
			{Name: "geometry.snap_tolerance", Value: "1.5", Unit: "in", Source: "default"},
		},
		Notes: []string{
			"Top edge braced continuously by the sheathing; bottom edge braced at bearings and blocking rows only.",
			"Self-weight is included in the dead load of each zone.",
		},
	}
	for _, b := range bays {
		a.Zones = append(a.Zones, export.Zone{Name: b.zone, Use: b.use, DeadPsf: b.loads.DeadPsf, LivePsf: b.loads.LivePsf,
			RoofLivePsf: b.loads.RoofLivePsf, SnowPsf: b.loads.SnowPsf, WindDownPsf: b.loads.WindDownPsf,
			WindUpPsf: b.loads.WindUpPsf, Ceiling: "none", LiveDeflectionLimit: b.live, TotalDeflectionLimit: b.total})
	}
	for _, size := range []string{"2x6", "2x8", "2x10"} {
		dv, err := check.BuiltinMaterials().Lookup("DF-L", "No.2", size)
		if err != nil {
			panic(err)
		}
		for _, v := range []struct {
			name string
			v    float64
		}{{"Fb", dv.FbPsi}, {"Fv", dv.FvPsi}, {"Fc_perp", dv.FcPerpPsi}, {"E", dv.EPsi}, {"Emin", dv.EminPsi}} {
			a.DesignValues = append(a.DesignValues, export.DesignValue{Species: dv.Species, Grade: dv.Grade, Size: size,
				Name: v.name, Value: v.v, Unit: "psi", Source: dv.Source})
		}
	}
	return a
}

func writeJSON(path string, v any) error {
	data, err := json.MarshalIndent(v, "", " ")
	if err != nil {
		return err
	}
	return os.WriteFile(path, append(data, '\n'), 0o644)
}
