package main

import (
	"fmt"
	"io"
	"regexp"
	"sort"
	"strconv"
	"strings"

	"framecheck/dxfimport"
	"framecheck/project"
)

// layerRow is one line of the `framecheck layers` table.
type layerRow struct {
	Name    string
	Counts  map[dxfimport.Kind]int // entities on the layer by type
	Role    string                 // as Project.LayerRole gives it; "" for none
	Off     bool                   // switched off in the LAYER table
	Frozen  bool                   // frozen in the LAYER table
	InTable bool                   // defined in the LAYER table (else only used by entities)
}

// kindOrder is the column order of entity types in the table.
var kindOrder = []dxfimport.Kind{
	dxfimport.KindLine, dxfimport.KindLWPolyline, dxfimport.KindPolyline, dxfimport.KindText,
	dxfimport.KindMText, dxfimport.KindPoint, dxfimport.KindCircle, dxfimport.KindArc,
}

// layerRows lists every layer of the drawing, from the LAYER table and
// from the entities, sorted by name (case-insensitive), with its entity
// counts and the role the project gives it.
func layerRows(d *dxfimport.Drawing, p *project.Project) []layerRow {
	rows := map[string]*layerRow{}
	get := func(name string) *layerRow {
		r, ok := rows[name]
		if !ok {
			r = &layerRow{Name: name, Counts: map[dxfimport.Kind]int{}, Role: p.LayerRole(name)}
			rows[name] = r
		}
		return r
	}
	for _, l := range d.Layers {
		r := get(l.Name)
		r.Off, r.Frozen, r.InTable = !l.On, l.Frozen, true
	}
	for _, e := range d.Entities {
		get(e.Pos.Layer).Counts[e.Kind]++
	}
	for layer, counts := range d.Dropped { // layers with no role: counted, not kept
		r := get(layer)
		for k, n := range counts {
			r.Counts[k] += n
		}
	}
	out := make([]layerRow, 0, len(rows))
	for _, r := range rows {
		out = append(out, *r)
	}
	sort.Slice(out, func(i, j int) bool {
		a, b := strings.ToUpper(out[i].Name), strings.ToUpper(out[j].Name)
		if a != b {
			return a < b
		}
		return out[i].Name < out[j].Name
	})
	return out
}

// unusedPatterns lists the project's layer patterns that match no layer
// of the drawing, as "layers.blocking: \"BLOCKING*\"".
func unusedPatterns(rows []layerRow, p *project.Project) []string {
	type role struct {
		key      string
		patterns []string
	}
	roles := []role{{"layers.joists", p.Layers.Joists}, {"layers.blocking", p.Layers.Blocking},
		{"layers.zones", p.Layers.Zones}, {"layers.labels", p.Layers.Labels},
		{"layers.bays", p.Layers.Bays}}
	for i, s := range p.Supports {
		roles = append(roles, role{fmt.Sprintf("[[support]] %d (%s)", i+1, s.Kind), s.Layers})
	}
	var out []string
	for _, r := range roles {
		for _, pat := range r.patterns {
			used := false
			for _, row := range rows {
				used = used || dxfimport.MatchLayer([]string{pat}, row.Name)
			}
			if !used {
				out = append(out, fmt.Sprintf("%s: %q", r.key, pat))
			}
		}
	}
	return out
}

// runLayers is `framecheck layers`.
func runLayers(args []string, stdout, stderr io.Writer) int {
	f := newFlags("layers", "framecheck layers PLAN.dxf [-p PROJECT.toml] [--units U]", `
Lists every layer of the plan with its entity counts by type and the role
the project file gives it (joists, blocking, zones, labels, bays, posts,
point_loads, or a support kind), or none: the quick way to map a new drawing to a project file.
Without -p the built-in layer patterns apply.`)
	projectPath := f.String("p", "", "project file `PROJECT.toml` (default: the built-in defaults)")
	units := f.String("units", "", "unit of the drawing, `U`: in, ft, mm, cm or m (default: the project file, then $INSUNITS)")
	pos, code := f.parse(args, stdout, stderr)
	if code >= 0 {
		return code
	}
	if len(pos) != 1 {
		return f.usageError(stderr, "want one PLAN.dxf, got %d arguments", len(pos))
	}
	if *units != "" && !project.Contains(project.UnitsValues, *units) {
		return f.usageError(stderr, "--units %q: want one of %s", *units, strings.Join(project.UnitsValues, ", "))
	}
	p := project.DefaultProject()
	if *projectPath != "" {
		var err error
		if p, err = project.LoadProject(*projectPath); err != nil {
			fmt.Fprintf(stderr, "framecheck: %s\n", prefixLines(termText(err.Error())))
			return exitUsage
		}
	}
	opt := dxfimport.Options{Units: p.Drawing.Units, Keep: keepLayer(p)}
	if *units != "" {
		opt.Units = *units
	}
	d, err := dxfimport.ReadFile(pos[0], opt)
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	source := ""
	switch {
	case *units != "":
		source = "--units"
	case p.Drawing.Units != "":
		source = "drawing.units"
	}
	printLayers(stdout, d, p, source)
	// Error findings (entities left out, the entity limit reached) do not
	// hide the layers that were read: they are listed, the findings are
	// among the notes, and the exit status is 1, as check gives for a
	// plan read only in part.
	if n := errorFindings(d.Issues); n > 0 {
		fmt.Fprintf(stderr, "framecheck: %s: %d error finding(s) in the notes: part of the drawing was not read, so the counts may be short\n", termText(pos[0]), n)
		return exitFail
	}
	return exitOK
}

// keepLayer is the reader's Options.Keep for a project: the entities of
// layers that have a role are kept, the others only counted.
func keepLayer(p *project.Project) func(string) bool {
	return func(layer string) bool { return p.LayerRole(layer) != "" }
}

// droppedCount is the number of entities read on layers with no role.
func droppedCount(d *dxfimport.Drawing) int {
	n := 0
	for _, c := range d.Dropped {
		for _, k := range c {
			n += k
		}
	}
	return n
}

// prefixLines puts "framecheck: " before every line after the first.
func prefixLines(s string) string {
	return strings.ReplaceAll(s, "\n", "\nframecheck: ")
}

// printLayers writes the drawing summary, the layer table and the notes.
// unitsSource names where the unit came from when not from the header:
// "--units" or "drawing.units".
func printLayers(w io.Writer, d *dxfimport.Drawing, p *project.Project, unitsSource string) {
	rows := layerRows(d, p)
	fmt.Fprintf(w, "%s: %s, %s, %d entities on %d layers\n", termText(d.File), termText(versionName(d.Version)),
		termText(unitsNote(d, unitsSource)), len(d.Entities)+droppedCount(d), len(rows))
	source := "built-in defaults"
	if p.File != "" {
		source = p.File
	}
	fmt.Fprintf(w, "roles from %s\n\n", termText(source))

	var kinds []dxfimport.Kind
	for _, k := range kindOrder {
		for _, r := range rows {
			if r.Counts[k] > 0 {
				kinds = append(kinds, k)
				break
			}
		}
	}
	head := []string{"LAYER"}
	right := []bool{false}
	for _, k := range kinds {
		head = append(head, k.String())
		right = append(right, true)
	}
	head = append(head, "ROLE")
	right = append(right, false)
	table := [][]string{head}
	for _, r := range rows {
		line := []string{r.Name}
		for _, k := range kinds {
			n := "-"
			if r.Counts[k] > 0 {
				n = strconv.Itoa(r.Counts[k])
			}
			line = append(line, n)
		}
		role := r.Role
		if role == "" {
			role = "-"
		}
		line = append(line, strings.Replace(role, project.RolePrefixSupport, "support: ", 1))
		table = append(table, line)
	}
	writeTable(w, table, right)

	var notes []string
	for _, r := range rows {
		switch {
		case r.Frozen:
			notes = append(notes, fmt.Sprintf("layer %s is frozen; its entities are read all the same", r.Name))
		case r.Off:
			notes = append(notes, fmt.Sprintf("layer %s is off; its entities are read all the same", r.Name))
		}
	}
	joists := false
	for _, r := range rows {
		joists = joists || r.Role == project.RoleJoists && len(r.Counts) > 0
	}
	if !joists {
		note := fmt.Sprintf("no entities on a joist layer: layers.joists is %s", project.FmtList(p.Layers.Joists))
		if like := joistLikeLayers(rows); len(like) > 0 {
			note += fmt.Sprintf("; the joists may be on %s: name that layer in [layers] joists of the project file ('framecheck init' writes one)",
				strings.Join(like, ", "))
		}
		notes = append(notes, note)
	}
	for _, u := range unusedPatterns(rows, p) {
		notes = append(notes, "pattern matches no layer: "+u)
	}
	for _, is := range d.Issues {
		notes = append(notes, is.Error())
	}
	if len(notes) > 0 {
		fmt.Fprintln(w, "\nnotes:")
		for _, n := range notes {
			fmt.Fprintln(w, "  "+termText(n))
		}
	}
}

// joistLikeRE matches layer names drafters give joists and rafters
// ("S-JOIS", "FLR-JST", "JOISTS 2ND", "RAFTERS"): common practice, no
// source.
var joistLikeRE = regexp.MustCompile(`(?i)jois|jst|raft|rftr`)

// joistLikeLayers names the layers without a role whose name looks like a
// joist layer and that hold lines or polylines.
func joistLikeLayers(rows []layerRow) []string {
	var out []string
	for _, r := range rows {
		lines := r.Counts[dxfimport.KindLine] + r.Counts[dxfimport.KindLWPolyline] + r.Counts[dxfimport.KindPolyline]
		if r.Role == "" && lines > 0 && joistLikeRE.MatchString(r.Name) {
			out = append(out, r.Name)
		}
	}
	return out
}

// versionName names a $ACADVER value.
func versionName(v string) string {
	names := map[string]string{"AC1009": "R12", "AC1012": "R13", "AC1014": "R14", "AC1015": "R2000",
		"AC1018": "R2004", "AC1021": "R2007", "AC1024": "R2010", "AC1027": "R2013", "AC1032": "R2018"}
	switch n, ok := names[v]; {
	case ok:
		return "DXF " + n + " (" + v + ")"
	case v == "":
		return "DXF version not given"
	default:
		return "DXF " + v
	}
}

// unitsNote says which unit the coordinates were read in and why.
func unitsNote(d *dxfimport.Drawing, source string) string {
	switch {
	case source != "":
		return "units " + d.Units + " (" + source + ")"
	case d.Units == "":
		return "units unknown, read as inches (give --units or drawing.units)"
	default:
		return fmt.Sprintf("units %s ($INSUNITS %d)", d.Units, d.InsUnits)
	}
}
