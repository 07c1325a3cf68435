package export

import (
	"bufio"
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strconv"
	"testing"

	"github.com/stretchr/testify/require"
)

// TestLoadPathJSONStreamed: the load path written item by item reads back
// as json.Marshal writes the whole section (the same keys and values,
// null for a nil list, [] for an empty one), rounded as schema 3 rounds
// it (encoding/json documentation; common practice, no source).
func TestLoadPathJSONStreamed(t *testing.T) {
	for _, lp := range []*LoadPath{
		{},
		{Posts: []PathPost{}},
		{
			Beams: []PathBeam{{ID: "B1", Mark: "B1", Kind: "flush-beam", Size: "6x14", MaxRatio: 0.35000000000000003,
				SpansIn: []float64{152.81250000000003}, Checks: []Check{{Kind: "bending-top", Combo: "D+L", Actual: 393.91234567, Allowable: 1331, Unit: "psi", Ratio: 0.296}}}},
			Posts: []PathPost{{ID: "P1", At: [2]float64{5328, -1.1102230246251565e-16}, Size: "6x6", HeightIn: 96,
				Loads: TypeLoads{DeadLb: 1234.5000000001, LiveLb: 4000}}},
			Connections: []Connection{{Kind: "hanger", Member: "M1", Bearing: 2, Carrier: "B1", DownLb: 96.00000000000001}},
			Foundation:  []FoundationLine{{Kind: "wall", ID: "W1", LengthIn: 240, Loads: TypeLoads{DeadLb: 10}}},
			Applied:     TypeLoads{DeadLb: 1.0000000000000002},
			Delivered:   TypeLoads{DeadLb: 1},
		},
	} {
		var buf bytes.Buffer
		w := bufio.NewWriter(&buf)
		require.NoError(t, writeLoadPathJSON(w, lp, roundedCopy))
		require.NoError(t, w.Flush())
		var got, want any
		require.NoError(t, json.Unmarshal(buf.Bytes(), &got), buf.String())
		whole, err := json.Marshal(roundedCopy(lp))
		require.NoError(t, err)
		require.NoError(t, json.Unmarshal(whole, &want))
		require.Equal(t, want, got)
	}
}

// TestBlockEncoderSameBytes: items asked for in order through blockEncoder
// come back as enc makes them, across several blocks and on any number of
// goroutines, errors included (common practice, no source).
func TestBlockEncoderSameBytes(t *testing.T) {
	n := 2*encodeBlock + 123
	enc := func(i int) ([]byte, error) {
		if i == encodeBlock+7 {
			return nil, fmt.Errorf("item %d", i)
		}
		return []byte(strconv.Itoa(i * 3)), nil
	}
	get := blockEncoder(n, enc)
	for i := 0; i < n; i++ {
		b, err := get(i)
		wb, werr := enc(i)
		if string(b) != string(wb) || (err == nil) != (werr == nil) {
			t.Fatalf("item %d: %q, %v; want %q, %v", i, b, err, wb, werr)
		}
	}
}

// refsLoadPath is a load path whose beams and posts share check lists and
// whose posts and connections repeat demands, as a plan's do; with an
// error beam and a post not checked (no checks), and texts JSON escapes.
// Every check has its trace, as the engine's do (a calculation writes an
// absent trace as []).
func refsLoadPath() *LoadPath {
	tr := []TraceItem{{Name: "M", Value: 65800.61234, Unit: "lb-in", Source: "statics"}, {Name: "fb/Fb'", Value: 0.29602512345}}
	beamChecks := []Check{{Kind: KindBendingTop, Combo: "D+L (live-type loads on span 1)", Actual: 393.8681234, Allowable: 1330.52, Unit: "psi", Ratio: 0.29602512345, Trace: tr},
		{Kind: KindShear, Combo: "D+L", Actual: 40.000000000000004, Allowable: 180, Unit: "psi", Ratio: 0.2222222222222, Trace: tr[1:]}}
	other := []Check{{Kind: KindBendingTop, Combo: "D+S", Actual: 1, Allowable: 2, Unit: "psi", Ratio: 0.5, Trace: tr[:1]}}
	postChecks := []Check{{Kind: "column", Combo: "D+L", Actual: 200.5, Allowable: 900.25, Unit: "psi", Ratio: 0.22271591224659817,
		Trace: []TraceItem{{Name: "CP", Value: 0.81234567891, Source: "NDS 2018 Eq. 3.7-1"}}}}
	dl := TypeLoads{DeadLb: 1234.5000000001, LiveLb: 4000, UpliftDeadLb: 740.7}
	lp := &LoadPath{Applied: TypeLoads{DeadLb: 1.0000000000000002}, Delivered: TypeLoads{DeadLb: 1}}
	for i := 0; i < 5; i++ {
		b := PathBeam{ID: fmt.Sprintf("B%d", i+1), Mark: "B1", Kind: "flush-beam", Layer: "BEAM <&> \"A\"", Source: "p.dxf:12 (handle 3A)",
			LengthIn: 464.00000000000006, SpansIn: []float64{152.83333333333334}, Size: "6x14", Species: "Douglas Fir-Larch", Grade: "No.1",
			Supports: []string{"P1", "wall W2"}, Carries: []string{"M1", "M2"}, Checks: beamChecks, Governing: KindBendingTop,
			MaxRatio: 0.29602512345, Status: StatusPass}
		switch i {
		case 3:
			b.Mark, b.Checks, b.MaxRatio = "B2", other, 0.5
		case 4:
			b.Mark, b.Checks, b.Status, b.Governing, b.MaxRatio, b.Messages, b.Carries = "", nil, StatusError, "", 0, []string{"no supports\tfound ☃"}, []string{}
		}
		lp.Beams = append(lp.Beams, b)
	}
	for i := 0; i < 4; i++ {
		p := PathPost{ID: fmt.Sprintf("P%d", i+1), Source: "p.dxf:40", At: [2]float64{5328.1234567, -1.1102230246251565e-16}, Size: "6x6",
			Species: "Douglas Fir-Larch", Grade: "No.1", HeightIn: 96, Checked: true, Loads: dl, DownLb: 5234.5, DownCombo: "D+L",
			Checks: postChecks, Status: StatusPass}
		if i == 3 {
			p.Checked, p.Checks, p.Status, p.Species, p.Grade, p.HeightIn = false, nil, "", "", "", 0
			p.Loads.SnowLb, p.UpLb, p.UpCombo = 12, 96.00000000000001, "0.6D+0.6W"
			p.Messages = []string{"no size or height"}
		}
		lp.Posts = append(lp.Posts, p)
	}
	for i := 0; i < 9; i++ {
		c := Connection{Kind: "hanger", Member: fmt.Sprintf("M%d", i+1), Bearing: i%2 + 1, Carrier: "B1",
			Loads: TypeLoads{DeadLb: 96.5, LiveLb: 320}, DownLb: 416.50000000000006, DownCombo: "D+L"}
		if i%3 == 2 {
			c.Loads.WindUpLb, c.UpLb, c.UpCombo = 300, 122.1, "0.6D+0.6W"
		}
		lp.Connections = append(lp.Connections, c)
	}
	lp.Connections = append(lp.Connections, Connection{Kind: "post base", Member: "P1", Bearing: 1, Carrier: "foundation", Loads: dl, DownLb: 5234.5, DownCombo: "D+L"})
	lp.Foundation = []FoundationLine{{Kind: "wall", ID: "W1", Source: "p.dxf:9", LengthIn: 240, Loads: TypeLoads{DeadLb: 10}, PerFoot: TypeLoads{DeadLb: 0.5}},
		{Kind: "post", ID: "P1", Source: "p.dxf:40", Loads: dl}}
	return lp
}

// TestLoadPathV3References: results.json writes each list of checks of the
// load path once, as a calculation its beams and posts name, and each
// demand once, as an entry of "demands" its posts and connections name;
// ReadJSON follows the references back to the load path as written
// (rounded as schema 3 rounds it), and still reads a file of the same
// schema holding every item in full, as written before the references
// (common practice, no source).
func TestLoadPathV3References(t *testing.T) {
	lp := refsLoadPath()
	// joints alike side by side, in the order of the first of each
	OrderConnections(lp.Connections)
	var order []string
	for _, c := range lp.Connections {
		order = append(order, c.Member)
	}
	// bearing 1 down only (M1, M5, M7), bearing 2 down only (M2, M4,
	// M8), bearing 1 with uplift (M3, M9), bearing 2 with uplift (M6),
	// the post's base
	require.Equal(t, []string{"M1", "M5", "M7", "M2", "M4", "M8", "M3", "M9", "M6", "P1"}, order)
	r := &Results{Plan: "p.dxf", DrawingUnits: "in", Members: rtMembers(3), LoadPath: lp}
	var buf bytes.Buffer
	w := bufio.NewWriter(&buf)
	require.NoError(t, encodeResults(w, r, layoutV3))
	require.NoError(t, w.Flush())
	want := roundedCopy(*lp).(LoadPath)

	got, err := ParseJSON("results.json", buf.Bytes())
	require.NoError(t, err, buf.String())
	require.NotNil(t, got.LoadPath)
	require.Equal(t, want, *got.LoadPath)
	// one slice per calculation, as the members' checks
	require.Same(t, &got.LoadPath.Beams[0].Checks[0], &got.LoadPath.Beams[2].Checks[0])

	var file struct {
		Calculations map[string]Calculation `json:"calculations"`
		LoadPath     struct {
			Beams       []map[string]any  `json:"beams"`
			Posts       []map[string]any  `json:"posts"`
			Connections []map[string]any  `json:"connections"`
			Demands     map[string]demand `json:"demands"`
		} `json:"load_path"`
	}
	require.NoError(t, json.Unmarshal(buf.Bytes(), &file))
	f := file.LoadPath
	calcs := map[string]bool{}
	for _, b := range f.Beams {
		require.NotContains(t, b, "checks")
		if c, ok := b["calculation"].(string); ok {
			calcs[c] = true
		}
	}
	for _, p := range f.Posts {
		require.NotContains(t, p, "checks")
		require.NotContains(t, p, "loads")
		require.Contains(t, p, "demand")
		if c, ok := p["calculation"].(string); ok {
			calcs[c] = true
		}
	}
	for _, c := range f.Connections {
		require.Equal(t, []string{"bearing", "carrier", "demand", "kind", "members"}, sortedKeys(c))
	}
	require.Len(t, f.Connections, 5) // one item for each group of joints alike
	// three distinct lists of checks (two of beams, one of posts) and
	// three distinct demands (a post's, equal to its base's; a hanger's
	// down only and one with uplift), whatever the counts
	require.Len(t, calcs, 3)
	require.Len(t, f.Demands, 4) // and the post not checked, with its snow
	require.Equal(t, f.Posts[0]["demand"], f.Connections[len(f.Connections)-1]["demand"])
	for c := range calcs {
		require.Contains(t, file.Calculations, c)
	}
	// the members' own and the load path's three
	var alone bytes.Buffer
	aw := bufio.NewWriter(&alone)
	require.NoError(t, encodeResults(aw, &Results{Plan: r.Plan, DrawingUnits: r.DrawingUnits, Members: r.Members}, layoutV3))
	require.NoError(t, aw.Flush())
	var own struct {
		Calculations map[string]Calculation `json:"calculations"`
	}
	require.NoError(t, json.Unmarshal(alone.Bytes(), &own))
	require.Len(t, file.Calculations, len(own.Calculations)+3)

	// the same schema with the load path in full, a joint an item (the
	// earlier writer)
	var whole map[string]json.RawMessage
	require.NoError(t, json.Unmarshal(buf.Bytes(), &whole))
	full, err := json.Marshal(want)
	require.NoError(t, err)
	whole["load_path"] = full
	old, err := json.Marshal(whole)
	require.NoError(t, err)
	back, err := ParseJSON("old.json", old)
	require.NoError(t, err)
	require.Equal(t, want, *back.LoadPath)

	// a reference to nothing is an error naming it
	bad := bytes.Replace(buf.Bytes(), []byte(`"demand":"D1"`), []byte(`"demand":"D99"`), 1)
	_, err = ParseJSON("bad.json", bad)
	require.ErrorContains(t, err, `post P1: demand "D99" not in "demands"`)
}

func sortedKeys(m map[string]any) []string {
	out := make([]string, 0, len(m))
	for k := range m {
		out = append(out, k)
	}
	slices.Sort(out)
	return out
}

// TestOrderConnectionsAsStableGroups: OrderConnections, moving the joints
// in place, leaves them as a stable grouping by kind, carrier, bearing and
// demand would (the groups in the order of their first joint, the joints
// of a group in their order), on random joints with many groups, one
// group, none, and a NaN load that matches no other joint (common
// practice, no source).
func TestOrderConnectionsAsStableGroups(t *testing.T) {
	rng := rand.New(rand.NewPCG(12, 9))
	for trial := range 60 {
		n := rng.IntN(400)
		kinds := 1 + rng.IntN(4)
		cs := make([]Connection, n)
		for i := range cs {
			cs[i] = Connection{Kind: []string{"hanger", "post cap", "wall", "bearing"}[rng.IntN(kinds)],
				Member: fmt.Sprintf("M%d", i), Bearing: 1 + rng.IntN(2), Carrier: fmt.Sprintf("B%d", rng.IntN(3)),
				Loads: TypeLoads{DeadLb: float64(rng.IntN(3))}, DownLb: 1, DownCombo: "D"}
			if rng.IntN(50) == 0 {
				cs[i].Loads.LiveLb = math.NaN()
			}
		}
		// the reference: groups by first appearance, members in order
		type key struct {
			kind, carrier string
			bearing       int
			d             demand
		}
		var groups [][]Connection
		idx := map[key]int{}
		for _, c := range cs {
			k := key{c.Kind, c.Carrier, c.Bearing, connectionDemand(&c)}
			g, ok := idx[k]
			if !ok {
				g = len(groups)
				idx[k] = g
				groups = append(groups, nil)
			}
			groups[g] = append(groups[g], c)
		}
		var want []string
		for _, g := range groups {
			for _, c := range g {
				want = append(want, c.Member)
			}
		}
		OrderConnections(cs)
		var got []string
		for _, c := range cs {
			got = append(got, c.Member)
		}
		if !slices.Equal(got, want) {
			t.Fatalf("trial %d (%d joints): %v, want %v", trial, n, got, want)
		}
	}
}
