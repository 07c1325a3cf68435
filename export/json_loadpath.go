package export

import (
	"bufio"
	"fmt"
	"strconv"
)

// The load path in results.json schema 3 (docs/RESULTS-SCHEMA.md "The load
// path"): what repeats is written once and referred to, as the members'
// checks are. A plan repeats its beams and posts run after run: 100,000
// joists with their beams have 4,338 beams with 175 distinct check lists,
// 16,475 posts with 287, and 133,039 connections with a few hundred
// distinct demands; written out in full that was 120 MB of 150.
//
//   - A beam's or post's checks, with their traces, are an entry of the
//     top-level "calculations" (its "calculation" names it; the entry's
//     "factors" is empty), shared by every beam or post whose checks are
//     the same list (the load path analyses beams alike once, and posts
//     alike once).
//   - A post's or connection's loads by type and its largest down and up
//     ASD loads with their combinations are an entry of the load path's
//     "demands" (its "demand" names it), shared by equal demands.
//   - Joints alike (one kind, carrier, bearing and demand) one after
//     another are one connection item naming their "members"
//     (OrderConnections puts them together).

// demand is what a post or connection shares through "demands".
type demand struct {
	Loads     TypeLoads `json:"loads"`
	DownLb    float64   `json:"down_lb"`
	DownCombo string    `json:"down_combo"`
	UpLb      float64   `json:"up_lb"`
	UpCombo   string    `json:"up_combo"`
}

func postDemand(p *PathPost) demand {
	return demand{p.Loads, p.DownLb, p.DownCombo, p.UpLb, p.UpCombo}
}

func connectionDemand(c *Connection) demand {
	return demand{c.Loads, c.DownLb, c.DownCombo, c.UpLb, c.UpCombo}
}

// demandTable numbers the distinct demands in the order they are met: D1,
// D2, ...
type demandTable struct {
	ids   map[demand]string
	order []demand
	// the demand asked last and its id: joints alike come one after
	// another (OrderConnections), and comparing is cheaper than hashing
	// ten numbers and four texts
	last   demand
	lastID string
}

func (t *demandTable) id(d demand) string {
	if t.lastID != "" && d == t.last { // a NaN is never equal: looked up, as the map does
		return t.lastID
	}
	id, ok := t.ids[d]
	if !ok {
		t.order = append(t.order, d)
		id = "D" + strconv.Itoa(len(t.order))
		t.ids[d] = id
	}
	t.last, t.lastID = d, id
	return id
}

// pathRefs are the references of a load path's items, found before
// anything is written: the beams' and posts' calculations (in calcs, the
// top-level table) and the demands.
type pathRefs struct {
	beamCalc, postCalc, postDemand, connDemand []string
	demands                                    demandTable
	// connRuns are the connections' groups: runs of joints one after
	// another with the same kind, carrier, bearing and demand, each
	// written once with its members (OrderConnections puts joints alike
	// together)
	connRuns [][2]int
}

// loadPathRefs numbers lp's calculations into calcs (after the members')
// and its demands.
func loadPathRefs(lp *LoadPath, calcs *calcTable) *pathRefs {
	pr := &pathRefs{beamCalc: make([]string, len(lp.Beams)), postCalc: make([]string, len(lp.Posts)),
		postDemand: make([]string, len(lp.Posts)), connDemand: make([]string, len(lp.Connections)),
		demands: demandTable{ids: map[demand]string{}}}
	for i := range lp.Beams {
		pr.beamCalc[i] = calcs.idOfChecks(lp.Beams[i].Checks)
	}
	for i := range lp.Posts {
		p := &lp.Posts[i]
		pr.postCalc[i] = calcs.idOfChecks(p.Checks)
		pr.postDemand[i] = pr.demands.id(postDemand(p))
	}
	for i := range lp.Connections {
		pr.connDemand[i] = pr.demands.id(connectionDemand(&lp.Connections[i]))
	}
	cs := lp.Connections
	for i := 0; i < len(cs); {
		j := i + 1
		for j < len(cs) && cs[j].Kind == cs[i].Kind && cs[j].Carrier == cs[i].Carrier && cs[j].Bearing == cs[i].Bearing &&
			pr.connDemand[j] == pr.connDemand[i] {
			j++
		}
		pr.connRuns = append(pr.connRuns, [2]int{i, j})
		i = j
	}
	return pr
}

// typeLoadsJSON returns l as an object of its loads (in w's buffer).
func typeLoadsJSON(w *jsonOut, l *TypeLoads) ([]byte, error) {
	w.item()
	w.loadFields(l)
	return w.done()
}

// typeLoads writes name: an object of l's loads.
func (w *jsonOut) typeLoads(name string, l *TypeLoads) {
	w.key(name)
	w.b = append(w.b, '{')
	w.first = true
	w.loadFields(l)
	w.b = append(w.b, '}')
	w.first = false
}

func (w *jsonOut) loadFields(l *TypeLoads) {
	w.num("dead_lb", l.DeadLb)
	w.num("live_lb", l.LiveLb)
	w.num("roof_live_lb", l.RoofLiveLb)
	w.num("snow_lb", l.SnowLb)
	w.num("wind_down_lb", l.WindDownLb)
	w.num("wind_up_lb", l.WindUpLb)
	w.num("uplift_dead_lb", l.UpliftDeadLb)
}

// boolean writes name: true or false.
func (w *jsonOut) boolean(name string, v bool) {
	w.key(name)
	w.b = strconv.AppendBool(w.b, v)
}

// item starts a new object in w's buffer (reused: the bytes returned
// before are overwritten).
func (w *jsonOut) item() {
	w.b = append(w.b[:0], '{')
	w.first, w.err = true, nil
}

func (w *jsonOut) done() ([]byte, error) {
	w.b = append(w.b, '}')
	return w.b, w.err
}

func beamJSON(w *jsonOut, b *PathBeam, calc string) ([]byte, error) {
	w.item()
	w.str("id", b.ID)
	w.str("mark", b.Mark)
	w.str("kind", b.Kind)
	w.str("layer", b.Layer)
	w.str("source", b.Source)
	w.num("length_in", b.LengthIn)
	w.floats("spans_in", b.SpansIn)
	w.str("size", b.Size)
	w.str("species", b.Species)
	w.str("grade", b.Grade)
	w.strs("supports", b.Supports)
	w.strs("carries", b.Carries)
	if calc != "" {
		w.str("calculation", calc)
	}
	w.str("governing", b.Governing)
	w.num("max_ratio", b.MaxRatio)
	w.str("status", b.Status)
	w.strs("messages", b.Messages)
	return w.done()
}

func postJSON(w *jsonOut, p *PathPost, calc, dem string) ([]byte, error) {
	w.item()
	w.str("id", p.ID)
	w.str("source", p.Source)
	w.coords("at", p.At[:])
	w.str("size", p.Size)
	w.str("species", p.Species)
	w.str("grade", p.Grade)
	w.num("height_in", p.HeightIn)
	w.boolean("checked", p.Checked)
	w.str("demand", dem)
	if calc != "" {
		w.str("calculation", calc)
	}
	w.str("status", p.Status)
	w.strs("messages", p.Messages)
	return w.done()
}

// connectionsJSON writes the joints cs (alike: one kind, carrier,
// bearing and demand) as one item naming their members.
func connectionsJSON(w *jsonOut, cs []Connection, dem string) ([]byte, error) {
	c := &cs[0]
	w.item()
	w.str("kind", c.Kind)
	w.key("members")
	w.b = append(w.b, '[')
	for i := range cs {
		if i > 0 {
			w.b = append(w.b, ',')
		}
		w.b = appendJSONString(w.b, cs[i].Member)
	}
	w.b = append(w.b, ']')
	w.key("bearing")
	w.b = strconv.AppendInt(w.b, int64(c.Bearing), 10)
	w.str("carrier", c.Carrier)
	w.str("demand", dem)
	return w.done()
}

func foundationJSON(w *jsonOut, f *FoundationLine) ([]byte, error) {
	w.item()
	w.str("kind", f.Kind)
	w.str("id", f.ID)
	w.str("source", f.Source)
	if f.LengthIn != 0 {
		w.num("length_in", f.LengthIn)
	}
	w.typeLoads("loads", &f.Loads)
	if f.LengthIn != 0 { // a wall line's; a post has no length to spread over
		w.typeLoads("per_foot_plf", &f.PerFoot)
	}
	return w.done()
}

func demandJSON(w *jsonOut, d *demand) ([]byte, error) {
	w.item()
	w.typeLoads("loads", &d.Loads)
	w.num("down_lb", d.DownLb)
	w.str("down_combo", d.DownCombo)
	w.num("up_lb", d.UpLb)
	w.str("up_combo", d.UpCombo)
	return w.done()
}

// writeLoadPathV3 writes lp as schema 3 lays it out, each beam, post,
// connection, foundation line and demand on its own line, with the
// references pr found.
func writeLoadPathV3(w *bufio.Writer, lp *LoadPath, pr *pathRefs) error {
	out := &jsonOut{round: true}
	w.WriteString("{\n")
	list := func(name string, n int, isNil bool, enc func(i int) ([]byte, error)) error {
		return writeLoadPathList(w, name, n, isNil, enc)
	}
	if err := list("beams", len(lp.Beams), lp.Beams == nil, func(i int) ([]byte, error) {
		return beamJSON(out, &lp.Beams[i], pr.beamCalc[i])
	}); err != nil {
		return err
	}
	if err := list("posts", len(lp.Posts), lp.Posts == nil, func(i int) ([]byte, error) {
		return postJSON(out, &lp.Posts[i], pr.postCalc[i], pr.postDemand[i])
	}); err != nil {
		return err
	}
	if err := list("connections", len(pr.connRuns), lp.Connections == nil, func(i int) ([]byte, error) {
		r := pr.connRuns[i]
		return connectionsJSON(out, lp.Connections[r[0]:r[1]], pr.connDemand[r[0]])
	}); err != nil {
		return err
	}
	if err := list("foundation", len(lp.Foundation), lp.Foundation == nil, func(i int) ([]byte, error) {
		return foundationJSON(out, &lp.Foundation[i])
	}); err != nil {
		return err
	}
	// "demands": an object of one demand a line, D1, D2, ... in order
	w.WriteString("  \"demands\": ")
	if len(pr.demands.order) == 0 {
		w.WriteString("{}")
	} else {
		w.WriteString("{\n")
		for i := range pr.demands.order {
			b, err := demandJSON(out, &pr.demands.order[i])
			if err != nil {
				return fmt.Errorf("demands: D%d: %w", i+1, err)
			}
			w.WriteString("   \"D" + strconv.Itoa(i+1) + "\": ")
			w.Write(b)
			if i < len(pr.demands.order)-1 {
				w.WriteByte(',')
			}
			w.WriteByte('\n')
		}
		w.WriteString("  }")
	}
	w.WriteString(",\n")
	return writeLoadPathTotals(w, lp, func(l *TypeLoads) ([]byte, error) { return typeLoadsJSON(out, l) })
}

// writeLoadPathTotals writes the load path's "applied" and "delivered"
// loads, each encoded by enc, and closes the section.
func writeLoadPathTotals(w *bufio.Writer, lp *LoadPath, enc func(*TypeLoads) ([]byte, error)) error {
	for _, t := range []struct {
		name string
		v    *TypeLoads
	}{{"applied", &lp.Applied}, {"delivered", &lp.Delivered}} {
		b, err := enc(t.v)
		if err != nil {
			return fmt.Errorf("%s: %w", t.name, err)
		}
		w.WriteString("  \"" + t.name + "\": ")
		w.Write(b)
		if t.name == "applied" {
			w.WriteString(",\n")
		}
	}
	w.WriteString("\n }")
	return nil
}

// writeLoadPathList writes the load path's list name of n items, each
// encoded by enc on its own line (null when isNil), and the comma after.
func writeLoadPathList(w *bufio.Writer, name string, n int, isNil bool, enc func(i int) ([]byte, error)) error {
	w.WriteString("  \"" + name + "\": ")
	if isNil {
		w.WriteString("null")
	} else if err := writeJSONItems(w, name, n, "   ", "  ", enc); err != nil {
		return err
	}
	w.WriteString(",\n")
	return nil
}

// fileLoadPathV3 is the load path as schema 3 writes it: beams and posts
// naming their calculation, posts and connections their demand. A file
// written before the references (the same schema) holds each item's
// checks and loads in full, read as they are.
type fileLoadPathV3 struct {
	Beams []struct {
		PathBeam
		Calculation string `json:"calculation"`
	} `json:"beams"`
	Posts []struct {
		PathPost
		Calculation string `json:"calculation"`
		Demand      string `json:"demand"`
	} `json:"posts"`
	Connections []struct {
		Connection
		Demand string `json:"demand"`
		// Members: the joints alike the item stands for (kind, bearing,
		// carrier and demand theirs); absent in an item of one joint
		// ("member"), as written before
		Members []string `json:"members"`
	} `json:"connections"`
	Foundation []FoundationLine  `json:"foundation"`
	Demands    map[string]demand `json:"demands"`
	Applied    TypeLoads         `json:"applied"`
	Delivered  TypeLoads         `json:"delivered"`
}

// loadPath returns the load path f describes with every reference
// followed; checks of one calculation share one slice. calc gives a
// calculation's checks.
func (f *fileLoadPathV3) loadPath(name string, calc func(id string) ([]Check, bool)) (*LoadPath, error) {
	lp := &LoadPath{Foundation: f.Foundation, Applied: f.Applied, Delivered: f.Delivered}
	checks := func(what, id, ref string) ([]Check, error) {
		cs, ok := calc(ref)
		if !ok {
			return nil, fmt.Errorf("%s: load path %s %s: calculation %q not in \"calculations\"", name, what, id, ref)
		}
		return cs, nil
	}
	dem := func(what, id, ref string) (demand, error) {
		d, ok := f.Demands[ref]
		if !ok {
			return d, fmt.Errorf("%s: load path %s %s: demand %q not in \"demands\"", name, what, id, ref)
		}
		return d, nil
	}
	if f.Beams != nil {
		lp.Beams = make([]PathBeam, len(f.Beams))
	}
	for i := range f.Beams {
		b := f.Beams[i].PathBeam
		if ref := f.Beams[i].Calculation; ref != "" {
			cs, err := checks("beam", b.ID, ref)
			if err != nil {
				return nil, err
			}
			b.Checks = cs
		}
		lp.Beams[i] = b
	}
	if f.Posts != nil {
		lp.Posts = make([]PathPost, len(f.Posts))
	}
	for i := range f.Posts {
		p := f.Posts[i].PathPost
		if ref := f.Posts[i].Calculation; ref != "" {
			cs, err := checks("post", p.ID, ref)
			if err != nil {
				return nil, err
			}
			p.Checks = cs
		}
		if ref := f.Posts[i].Demand; ref != "" {
			d, err := dem("post", p.ID, ref)
			if err != nil {
				return nil, err
			}
			p.Loads, p.DownLb, p.DownCombo, p.UpLb, p.UpCombo = d.Loads, d.DownLb, d.DownCombo, d.UpLb, d.UpCombo
		}
		lp.Posts[i] = p
	}
	if f.Connections != nil {
		n := 0
		for i := range f.Connections {
			n += max(1, len(f.Connections[i].Members))
		}
		lp.Connections = make([]Connection, 0, n)
	}
	for i := range f.Connections {
		fc := &f.Connections[i]
		c := fc.Connection
		if ref := fc.Demand; ref != "" {
			who := c.Member
			if len(fc.Members) > 0 {
				who = fc.Members[0]
			}
			d, err := dem("connection of", who, ref)
			if err != nil {
				return nil, err
			}
			c.Loads, c.DownLb, c.DownCombo, c.UpLb, c.UpCombo = d.Loads, d.DownLb, d.DownCombo, d.UpLb, d.UpCombo
		}
		if len(fc.Members) == 0 {
			lp.Connections = append(lp.Connections, c)
			continue
		}
		for _, m := range fc.Members {
			c.Member = m
			lp.Connections = append(lp.Connections, c)
		}
	}
	return lp, nil
}

// OrderConnections puts the joints alike (one kind, carrier, bearing and
// demand, exactly) one after another, in the order of the first of each,
// keeping their order among themselves: the hangers of a run of joists on
// one beam side by side, as results.json writes them (one item naming
// their members) and reads them back.
func OrderConnections(cs []Connection) {
	type key struct {
		kind, carrier string
		bearing       int
		d             demand
	}
	group := make([]int, len(cs))
	first := make(map[key]int)
	var sizes []int
	// joints alike mostly follow one another (the joists of a run on one
	// beam): one alike to the one before goes where that one went without
	// its key being hashed (a NaN is never alike: looked up, as the map does)
	var last key
	for i := range cs {
		k := key{cs[i].Kind, cs[i].Carrier, cs[i].Bearing, connectionDemand(&cs[i])}
		if i > 0 && k == last {
			group[i] = group[i-1]
			sizes[group[i]]++
			continue
		}
		g, ok := first[k]
		if !ok {
			g = len(sizes)
			first[k] = g
			sizes = append(sizes, 0)
		}
		group[i] = g
		sizes[g]++
		last = k
	}
	// each group's place, then each joint's place in it, in order
	at := make([]int, len(sizes))
	for g := 1; g < len(sizes); g++ {
		at[g] = at[g-1] + sizes[g-1]
	}
	dest := group // reused: group[i] is not read once dest[i] is set
	for i := range cs {
		g := group[i]
		dest[i] = at[g]
		at[g]++
	}
	// Moved in place, cycle by cycle (a copy of every joint was a hundred
	// thousand more at once): the joint at i goes to dest[i], the one
	// there to its own place, until the cycle comes back to i.
	for i := range cs {
		for dest[i] != i {
			j := dest[i]
			cs[i], cs[j] = cs[j], cs[i]
			dest[i], dest[j] = dest[j], j
		}
	}
}
