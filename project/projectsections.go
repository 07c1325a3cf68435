package project

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"framecheck/check"
)

// project reads the top-level tables in the order the reference file
// lists them.
func (ld *loader) project(root *table) {
	ld.info(ld.sub(root, "project"))
	ld.drawing(ld.sub(root, "drawing"))
	ld.layers(ld.sub(root, "layers"))
	ld.supports(root)
	ld.lumber(ld.sub(root, "lumber"))
	ld.supportMaterials()
	ld.design(ld.sub(root, "design"))
	loads := ld.sub(root, "loads")
	ld.zones(root)
	ld.loads(loads)
	ld.sizing(ld.sub(root, "sizing"))
	ld.posts(root)
	ld.pointLoads(root)
	ld.patternOwners()
}

func (ld *loader) drawing(t *table) {
	d := &ld.p.Drawing
	*d = DrawingSettings{SnapToleranceIn: 1.5, MaxWallThicknessIn: 12}
	if has(t, "units") {
		ld.enum(t, "units", &d.Units, UnitsValues)
	} else {
		ld.get(t, "units", "")
		ld.p.defaults = append(ld.p.defaults, "drawing.units: from the DXF header ($INSUNITS)")
	}
	ld.num(t, "snap_tolerance_in", "in", &d.SnapToleranceIn, toleranceRule)
	ld.num(t, "max_wall_thickness_in", "in", &d.MaxWallThicknessIn, thicknessRule)
	ld.num(t, "edge_distance_in", "in", &d.EdgeDistanceIn, edgeRule)
}

func (ld *loader) layers(t *table) {
	l := &ld.p.Layers
	// The S- patterns are the structural layers of the US National CAD
	// Standard (discipline S, major group JOIS joists, ANNO-NOTE and
	// ANNO-TEXT notes; see defaultSupports for walls and beams), as
	// recalled, not read from the standard: from memory, verify.
	*l = LayerRoles{
		Joists: []string{"JOIST*", "S-JOIS*"}, Blocking: []string{"BLOCKING*"},
		Zones: []string{"LOAD-ZONE*"}, Labels: []string{"FRAMING-NOTE*", "S-ANNO-NOTE*", "S-ANNO-TEXT*"},
		Bays:  []string{"FRAMING-BAY*"},
		Posts: []string{"POST*"}, PointLoads: []string{"POINT-LOAD*"},
	}
	ld.list(t, "joists", &l.Joists, nil)
	ld.list(t, "blocking", &l.Blocking, nil)
	ld.list(t, "zones", &l.Zones, nil)
	ld.list(t, "labels", &l.Labels, nil)
	ld.list(t, "bays", &l.Bays, nil)
	ld.quietList(t, "posts", &l.Posts, nil)
	ld.quietList(t, "point_loads", &l.PointLoads, nil)
}

func (ld *loader) supports(root *table) {
	elems, ok := ld.arrayTables(root, "support")
	if !ok {
		ld.p.Supports = defaultSupports()
		var s []string
		for _, sp := range ld.p.Supports {
			s = append(s, fmt.Sprintf("%s %s (bearing %s in)", FmtList(sp.Layers), sp.Kind, FmtNum(sp.BearingIn)))
		}
		ld.p.defaults = append(ld.p.defaults, "[[support]]: none given; "+strings.Join(s, "; "))
		return
	}
	for _, t := range elems {
		s := Support{Kind: "bearing-wall", Check: true}
		ld.required(t, "layers")
		ld.list(t, "layers", &s.Layers, nil)
		ld.enum(t, "kind", &s.Kind, SupportKinds)
		s.BearingIn = DefaultBearingIn[s.Kind]
		ld.num(t, "bearing_in", "in", &s.BearingIn, thicknessRule)
		ld.text(t, "species", &s.Species, nil)
		ld.text(t, "grade", &s.Grade, nil)
		ld.beamKeys(t, &s)
		ld.p.Supports = append(ld.p.Supports, s)
	}
}

// has reports whether t gives key, without marking it valid.
func has(t *table, key string) bool {
	_, ok := t.m[key]
	return ok
}

// required reports a key an array-table element must give.
func (ld *loader) required(t *table, key string) {
	if _, ok := t.m[key]; !ok {
		ld.errs = append(ld.errs, &ProjectError{File: ld.file, Line: lineOf(ld.lines, t.path),
			Key: displayKey(joinPath(t.path, key)), Msg: "missing: every " + t.show + " table needs it"})
	}
}

func (ld *loader) lumber(t *table) {
	lu := &ld.p.Lumber
	*lu = Lumber{Species: "Douglas Fir-Larch", Grade: "No.2", Size: "2x10"}
	ld.text(t, "species", &lu.Species, nil)
	ld.text(t, "grade", &lu.Grade, nil)
	ld.text(t, "size", &lu.Size, sizeCheck)
	ld.materialsFile(t)
	elems, _ := ld.arrayTables(t, "by_layer")
	for _, e := range elems {
		var o LumberOverride
		ld.required(e, "layers")
		ld.list(e, "layers", &o.Layers, nil)
		ld.text(e, "species", &o.Species, nil)
		ld.text(e, "grade", &o.Grade, nil)
		ld.text(e, "size", &o.Size, sizeCheck)
		if !has(e, "species") && !has(e, "grade") && !has(e, "size") {
			ld.errorf(e.path, "gives none of species, grade, size; an override needs at least one")
		}
		lu.ByLayer = append(lu.ByLayer, o)
	}
	ld.lookupLumber(t, t, t, lu.Species, lu.Grade, lu.Size)
	for i, o := range lu.ByLayer {
		e := elems[i]
		pick := func(own, def string) (string, *table) {
			if own != "" {
				return own, e
			}
			return def, t
		}
		sp, spT := pick(o.Species, lu.Species)
		gr, grT := pick(o.Grade, lu.Grade)
		sz, szT := pick(o.Size, lu.Size)
		if spT == t && grT == t && szT == t {
			continue // gives nothing of its own: reported above
		}
		ld.lookupLumber(spT, grT, szT, sp, gr, sz)
	}
}

// lookupLumber checks that the built-in design values (check.Materials)
// know the species and grade in the width of size, and reports a problem
// at the key that caused it; spT, grT and szT are the tables that gave
// each value.
func (ld *loader) lookupLumber(spT, grT, szT *table, species, grade, size string) {
	if species == "" || grade == "" || size == "" {
		return // an error is already reported
	}
	mats := check.BuiltinMaterials()
	if ld.p.Materials != nil {
		mats = ld.p.Materials
	}
	_, err := mats.Lookup(species, grade, size)
	if err == nil {
		return
	}
	t, key := spT, "species"
	switch msg := err.Error(); {
	case strings.HasPrefix(msg, "unknown species"):
	case strings.HasPrefix(msg, "unknown grade"):
		t, key = grT, "grade"
	default:
		t, key = szT, "size"
	}
	ld.errorf(joinPath(t.path, key), "%v", err)
}

func (ld *loader) design(t *table) {
	d := &ld.p.Design
	*d = Design{TopEdgeBraced: true, Temperature: "normal", Kcr: 1.5,
		Combinations: Combinations{Standard: StandardASCE716}, PatternLiveLoads: true, UpliftReportLb: defaultUpliftReportLb}
	ld.boolean(t, "top_edge_braced", &d.TopEdgeBraced)
	ld.boolean(t, "shear_at_d", &d.ShearAtD)
	ld.boolean(t, "wet_service", &d.WetService)
	ld.enum(t, "temperature", &d.Temperature, temperatureValues)
	ld.boolean(t, "incised", &d.Incised)
	if !has(t, "kcr") && d.WetService {
		ld.get(t, "kcr", "")
		d.Kcr = 2.0
		ld.p.defaults = append(ld.p.defaults, "design.kcr = 2 (wet service, NDS 2018 §3.5.2)")
	} else {
		ld.num(t, "kcr", "creep factor", &d.Kcr, kcrRule)
	}
	ld.boolean(t, "add_self_weight", &d.AddSelfWeight)
	ld.combinations(t, &d.Combinations)
	ld.boolean(t, "pattern_live_loads", &d.PatternLiveLoads)
	d.Seasoned = !d.WetService
	if has(t, "seasoned") {
		ld.boolean(t, "seasoned", &d.Seasoned)
	} else {
		ld.get(t, "seasoned", "")
		ld.defaulted(t, "seasoned", "%v (IBC 2018 Table 1604.3 note d: total deflection under %s)", d.Seasoned,
			map[bool]string{true: "L + 0.5D", false: "L + D"}[d.Seasoned])
	}
	ld.num(t, "uplift_report_lb", "lb", &d.UpliftReportLb, upliftRule)
	ld.boolean(t, "brace_at_inflection", &d.BraceAtInflection)
}

func (ld *loader) combinations(t *table, dst *Combinations) {
	v, path, ok := ld.get(t, "combinations", "")
	if !ok {
		ld.defaulted(t, "combinations", "%q", dst.Standard)
		return
	}
	switch x := v.(type) {
	case string:
		if strings.EqualFold(strings.ReplaceAll(x, " ", ""), strings.ReplaceAll(StandardASCE716, " ", "")) {
			*dst = Combinations{Standard: StandardASCE716}
			return
		}
		ld.errorf(path, "expected %q or a list such as [\"D\", \"D+L\", \"0.6D+0.6W\"], got %q", StandardASCE716, x)
	case []any:
		list, msg := stringList(v, nil)
		if msg != "" {
			ld.errorf(path, "%s", msg)
			return
		}
		if _, err := check.ParseCombos(list); err != nil {
			ld.errorf(path, "%v; loads are D, L, Lr, S and W, as in \"D+0.75L+0.75(Lr or S)\"", err)
			return
		}
		*dst = Combinations{List: list}
	default:
		ld.errorf(path, "expected %q or an array of strings, got %s", StandardASCE716, describe(v))
	}
}

func (ld *loader) zones(root *table) {
	elems, ok := ld.arrayTables(root, "zone")
	if !ok {
		z := defaultZone()
		ld.p.Zones = []Zone{z}
		ld.p.defaults = append(ld.p.defaults, fmt.Sprintf(
			"[[zone]]: none given; one zone %s: %s, D %s psf, L %s psf, ceiling %s, L/%s live, L/%s total",
			z.Name, z.Use, FmtNum(z.DeadPsf), FmtNum(z.LivePsf), z.Ceiling,
			FmtNum(z.LiveDeflectionLimit), FmtNum(z.TotalDeflectionLimit)))
		return
	}
	seen := map[string]string{}
	for i, t := range elems {
		z := Zone{Use: "floor", Ceiling: "non-plaster"}
		ld.entryName(t, "zone", "zone", i, seen, &z.Name)
		ld.enum(t, "use", &z.Use, UseValues)
		ld.allowZero(t, &z.AllowZero)
		// A roof zone that gives snow but leaves roof live out still gets
		// the ordinary roof live load; no other load has a default: a zone
		// without them is an error (zeroLoads) unless allow_zero is set.
		if sv, ok := t.m["snow_psf"]; ok && z.Use == "roof" && !z.AllowZero && (sv != int64(0) && sv != float64(0)) {
			z.RoofLivePsf = RoofLiveDefaultPsf
		}
		ld.num(t, "dead_psf", "psf", &z.DeadPsf, loadRule)
		ld.num(t, "live_psf", "psf", &z.LivePsf, loadRule)
		ld.num(t, "roof_live_psf", "psf", &z.RoofLivePsf, loadRule)
		ld.num(t, "snow_psf", "psf", &z.SnowPsf, loadRule)
		ld.num(t, "wind_down_psf", "psf", &z.WindDownPsf, loadRule)
		ld.num(t, "wind_up_psf", "psf", &z.WindUpPsf, loadRule)
		ld.enum(t, "ceiling", &z.Ceiling, CeilingValues)
		ld.boolean(t, "ceiling_braces_bottom", &z.CeilingBracesBottom)
		z.LiveDeflectionLimit, z.TotalDeflectionLimit = DeflectionLimits(z.Use, z.Ceiling)
		ld.limit(t, "live_deflection_limit", &z.LiveDeflectionLimit, z)
		ld.limit(t, "total_deflection_limit", &z.TotalDeflectionLimit, z)
		if has(t, "uplift_dead_psf") {
			z.HasUpliftDead = true
			ld.num(t, "uplift_dead_psf", "psf", &z.UpliftDeadPsf, loadRule)
		} else {
			ld.get(t, "uplift_dead_psf", "")
		}
		z.DeadOnSlope = true
		ld.pitch(t, &z.PitchRise12)
		if z.PitchRise12 > 0 && z.Use != "roof" {
			ld.errorf(joinPath(t.path, "pitch"), "a pitch is for a roof zone; this zone's use is %q", z.Use)
		}
		if has(t, "dead_on_slope") {
			ld.boolean(t, "dead_on_slope", &z.DeadOnSlope)
		} else {
			ld.get(t, "dead_on_slope", "")
		}
		if has(t, "long_term_deflection_limit") {
			ld.num(t, "long_term_deflection_limit", "the n of L/n", &z.LongTermDeflectionLimit, DeflectionLimit)
		} else {
			ld.get(t, "long_term_deflection_limit", "")
		}
		ld.zeroLoads(t, z)
		ld.p.Zones = append(ld.p.Zones, z)
	}
}

// pitch reads a roof slope: a number is the rise in 12 (6 for 6:12); a
// string "6:12", "6/12" or "30deg" (degrees) is read as written.
func (ld *loader) pitch(t *table, dst *float64) {
	v, path, ok := ld.get(t, "pitch", "")
	if !ok {
		return
	}
	rise, msg := ParsePitch(v)
	if msg != "" {
		ld.errorf(path, "%s", msg)
		return
	}
	*dst = rise
}

// ParsePitch reads a roof slope as a rise in 12: a number (6), a string
// "6:12" or "6/12", or an angle "26.57deg"; from 0 (flat) to 24 in 12. The
// message says what was expected when v is none of these.
func ParsePitch(v any) (float64, string) {
	const want = "expected a rise in 12 such as 6, \"6:12\" or an angle such as \"26.57deg\", from 0 (flat) to 24 in 12"
	var rise float64
	switch x := v.(type) {
	case int64:
		rise = float64(x)
	case float64:
		rise = x
	case string:
		s := strings.ToLower(strings.TrimSpace(x))
		switch {
		case strings.HasSuffix(s, "deg") || strings.HasSuffix(s, "°"):
			n, err := strconv.ParseFloat(strings.TrimSpace(strings.TrimSuffix(strings.TrimSuffix(s, "deg"), "°")), 64)
			if err != nil || n < 0 || n >= 90 {
				return 0, fmt.Sprintf("%s, got %q", want, x)
			}
			rise = 12 * math.Tan(n*math.Pi/180)
		default:
			var a, b float64
			if _, err := fmt.Sscanf(strings.NewReplacer(":", " ", "/", " ").Replace(s), "%g %g", &a, &b); err != nil || b != 12 {
				if n, err := strconv.ParseFloat(s, 64); err == nil {
					a, b = n, 12
				} else {
					return 0, fmt.Sprintf("%s, got %q", want, x)
				}
			}
			rise = a
		}
	default:
		return 0, fmt.Sprintf("%s, got %s", want, describe(v))
	}
	if !(rise >= 0 && rise <= 24) {
		return 0, fmt.Sprintf("%s, got %s", want, FmtNum(rise))
	}
	return rise, ""
}

// zeroLoads reports a zone that gives no dead load, or no load of its use
// (a floor: live_psf; a roof: roof_live_psf or snow_psf), left out or 0,
// unless it sets allow_zero = true: a zone with only a name would
// otherwise be checked at D = 0 and pass with a ratio near 0, which is
// never what the designer meant. The error is at the zone's line and
// names the zone and every key missing.
func (ld *loader) zeroLoads(t *table, z Zone) {
	if z.AllowZero {
		return
	}
	// state says how the file leaves key at zero: "left out", "= 0", or
	// "" when it gives a value that is not 0 or is already reported.
	state := func(key string) string {
		v, ok := t.m[key]
		switch {
		case !ok:
			return key + " left out"
		case v == int64(0) || v == float64(0):
			return key + " = 0"
		}
		return ""
	}
	var missing []string
	if s := state("dead_psf"); s != "" {
		missing = append(missing, s+" (no dead load)")
	}
	if z.Use == "roof" {
		if lr, s := state("roof_live_psf"), state("snow_psf"); lr != "" && s != "" && z.RoofLivePsf == 0 {
			missing = append(missing, lr+" and "+s+" (no roof live or snow load)")
		}
	} else if s := state("live_psf"); s != "" {
		missing = append(missing, s+" (no floor live load)")
	}
	if len(missing) == 0 {
		return
	}
	name := fmt.Sprintf("%q", z.Name)
	if z.Name == "" {
		name = strings.TrimSuffix(t.label, ": ")
	}
	ld.errs = append(ld.errs, &ProjectError{File: ld.file, Line: lineOf(ld.lines, t.path), Key: "[[zone]] " + name,
		Msg: fmt.Sprintf("%s: give the zone's loads in psf, or set allow_zero = true if a zero load is meant",
			strings.Join(missing, "; "))})
}

// allowZero reads [[zone]] allow_zero. Left out it is false, a safe
// default that is not listed among the defaults taken.
func (ld *loader) allowZero(t *table, dst *bool) {
	v, path, ok := ld.get(t, "allow_zero", "")
	if !ok {
		return
	}
	b, isBool := v.(bool)
	if !isBool {
		ld.errorf(path, "expected true or false, got %s", describe(v))
		return
	}
	*dst = b
}

// limit reads a deflection limit whose default comes from use and ceiling.
func (ld *loader) limit(t *table, key string, dst *float64, z Zone) {
	if has(t, key) {
		ld.num(t, key, "the n of L/n", dst, DeflectionLimit)
		return
	}
	ld.get(t, key, "")
	why := z.Use
	if z.Use == "roof" {
		why = "roof, ceiling " + z.Ceiling
	}
	ld.defaulted(t, key, "%s (IBC 2018 Table 1604.3, %s)", FmtNum(*dst), why)
}

// loads reads [loads] after the zones, so default_zone can be checked.
func (ld *loader) loads(t *table) {
	l := &ld.p.Loads
	names := make([]string, 0, len(ld.p.Zones))
	for _, z := range ld.p.Zones {
		if z.Name != "" {
			names = append(names, fmt.Sprintf("%q", z.Name))
		}
	}
	v, ok := t.m["default_zone"]
	switch {
	case ok:
		ld.text(t, "default_zone", &l.DefaultZone, nil)
		if _, isStr := v.(string); isStr && l.DefaultZone != "" && ld.p.Zone(l.DefaultZone) == nil && len(names) > 0 {
			ld.errorf(joinPath(t.path, "default_zone"), "no zone is named %q; expected one of %s", l.DefaultZone, strings.Join(names, ", "))
		}
	case len(ld.p.Zones) == 1:
		ld.get(t, "default_zone", "")
		l.DefaultZone = ld.p.Zones[0].Name
		ld.defaulted(t, "default_zone", "%q (the only zone)", l.DefaultZone)
	case ld.p.Zone("FLOOR") != nil:
		ld.get(t, "default_zone", "")
		l.DefaultZone = ld.p.Zone("FLOOR").Name
		ld.defaulted(t, "default_zone", "%q", l.DefaultZone)
	case len(names) > 0:
		ld.get(t, "default_zone", "")
		ld.errs = append(ld.errs, &ProjectError{File: ld.file, Line: lineOf(ld.lines, t.path),
			Key: "loads.default_zone", Msg: "missing: with several zones and none named \"FLOOR\", name the zone of " +
				"members outside every outline; expected one of " + strings.Join(names, ", ")})
	}
}

func (ld *loader) sizing(t *table) {
	s := &ld.p.Sizing
	*s = Sizing{Candidates: []string{"2x6", "2x8", "2x10", "2x12", "2x14"}, BlockingPieceWeightBf: 2}
	ld.list(t, "candidates", &s.Candidates, sizeCheck)
	ld.num(t, "blocking_piece_weight_bf", "board feet", &s.BlockingPieceWeightBf, weightRule)
	s.BeamCandidates = []string{"(2) 2x10", "(3) 2x10", "(2) 2x12", "(3) 2x12", "4x12"}
	ld.quietList(t, "beam_candidates", &s.BeamCandidates, memberSizeCheck)
	s.SameDepth = "none" // as the project file's interface shows it (PROJECT-FILE.md)
	if has(t, "same_depth") {
		ld.enum(t, "same_depth", &s.SameDepth, sameDepthValues)
	} else {
		ld.get(t, "same_depth", "")
	}
}

// patternOwners reports a layer pattern that belongs to two roles: two
// [[support]] tables, or a support table and a [layers] role, or two
// [layers] roles. Patterns compare case-insensitively.
func (ld *loader) patternOwners() {
	type owner struct{ role, path string }
	seen := map[string]owner{}
	add := func(role, path string, patterns []string) {
		for _, pat := range patterns {
			k := strings.ToUpper(pat)
			if prev, dup := seen[k]; dup {
				if prev.role == role {
					continue
				}
				at, other := owner{role, path}, prev
				if !ld.p.given[path] && ld.p.given[prev.path] {
					at, other = prev, at // report it where the file writes it
				}
				where := " (a default)"
				if ld.p.given[other.path] {
					where = fmt.Sprintf(" (line %d)", lineOf(ld.lines, other.path))
				}
				ld.errorf(at.path, "layer pattern %q is also in %s%s; a pattern belongs to one role", pat, other.role, where)
				continue
			}
			seen[k] = owner{role, path}
		}
	}
	add("layers.joists", "layers.joists", ld.p.Layers.Joists)
	add("layers.blocking", "layers.blocking", ld.p.Layers.Blocking)
	add("layers.zones", "layers.zones", ld.p.Layers.Zones)
	add("layers.labels", "layers.labels", ld.p.Layers.Labels)
	add("layers.posts", "layers.posts", ld.p.Layers.Posts)
	add("layers.point_loads", "layers.point_loads", ld.p.Layers.PointLoads)
	for i, s := range ld.p.Supports {
		path := fmt.Sprintf("support[%d].layers", i)
		add(fmt.Sprintf("[[support]] %d (%s)", i+1, s.Kind), path, s.Layers)
	}
}

// materialsFile reads [lumber] materials_file, a CSV (.csv) or TOML
// (.toml) file of design values with the columns of the built-in tables,
// found relative to the project file, and merges it over the built-in
// tables so later species and grade lookups see both.
func (ld *loader) materialsFile(t *table) {
	lu := &ld.p.Lumber
	ld.text(t, "materials_file", &lu.MaterialsFile, nil)
	if lu.MaterialsFile == "" {
		return
	}
	path := lu.MaterialsFile
	if !filepath.IsAbs(path) {
		path = filepath.Join(filepath.Dir(ld.file), path)
	}
	data, err := readLimited(path, maxProjectBytes)
	if errors.Is(err, errTooLarge) {
		err = fmt.Errorf("%s: %w (the limit is %d MiB)", path, err, maxProjectBytes>>20)
	}
	if err != nil {
		ld.errorf(joinPath(t.path, "materials_file"), "%v", err)
		return
	}
	f := bytes.NewReader(data)
	var user *check.Materials
	switch strings.ToLower(filepath.Ext(path)) {
	case ".csv":
		user, err = check.LoadMaterialsCSV(f, path)
	case ".toml":
		user, err = check.LoadMaterialsTOML(f, path)
	default:
		ld.errorf(joinPath(t.path, "materials_file"), "expected a .csv or .toml file, got %q", lu.MaterialsFile)
		return
	}
	if err != nil {
		ld.errorf(joinPath(t.path, "materials_file"), "%v", err)
		return
	}
	ld.p.Materials = check.BuiltinMaterials().Merge(user)
}

// entryName reads the required name of the i-th (0-based) [[table]]
// entry t into name, labels the entry's messages with it ("[[zone]] ROOF: ",
// or the entry's number when it has no name) and reports a name already
// used by an earlier entry (case-insensitive; seen maps upper-cased names
// to their key paths).
func (ld *loader) entryName(t *table, table, what string, i int, seen map[string]string, name *string) {
	ld.required(t, "name")
	ld.text(t, "name", name, nil)
	if *name == "" {
		t.label = fmt.Sprintf("[[%s]] %d: ", table, i+1)
		return
	}
	t.label = fmt.Sprintf("[[%s]] %s: ", table, *name)
	key := strings.ToUpper(*name)
	if prev, dup := seen[key]; dup {
		ld.errorf(t.path+".name", "%s %q is already defined (line %d); %s names must differ",
			what, *name, lineOf(ld.lines, prev), what)
	}
	seen[key] = t.path + ".name"
}
