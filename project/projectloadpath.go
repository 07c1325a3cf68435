package project

import (
	"regexp"
	"strconv"
	"strings"

	"framecheck/check"
)

// The project-file keys of the load path (issue 17): the beam keys of
// [[support]], [[post]], [[point_load]] and [sizing] beam_candidates.

// Ranges of the load-path keys (see between for the idea of the upper
// bounds: far above anything a wood-framed floor or roof has, so a slip
// of the keyboard is an error, not a number).
var (
	pliesRule     = between(1, 4, true)     // built-up members of 1 to 4 plies (check: 2 to 4 plies of 2x)
	postHeightIn  = between(0, 600, false)  // in: a post up to 50 ft
	pointLoadRule = between(0, 1e6, true)   // lb
	keRule        = between(0.5, 2.5, true) // NDS 2018 Appendix G Table G1: least recommended Ke 0.65 (xcfem/xc buckling_base.py @ 054858db); largest 2.4 from memory: verify
)

// beamKeys reads the keys of a [[support]] table that make its supports
// beams: size, plies, material, check.
func (ld *loader) beamKeys(t *table, s *Support) {
	ld.text(t, "size", &s.Size, memberSizeCheck)
	if has(t, "plies") {
		ld.integer(t, "plies", "plies", &s.Plies, pliesRule)
	} else {
		ld.get(t, "plies", "")
	}
	ld.text(t, "material", &s.Material, nil)
	ld.quietBool(t, "check", &s.Check)
	if s.Plies > 1 && s.Size == "" && has(t, "plies") {
		ld.errorf(joinPath(t.path, "plies"), "plies without a size; give size (the size of one ply, such as \"2x12\")")
	}
}

// supportMaterials checks each [[support]] material once the materials
// file is read: it must name a structural composite lumber row of
// [lumber] materials_file (any case) or a glulam stress class, and with a
// size given, that size must be one the material has values for (actual
// inches, within its depth range). Never a default: an unknown name is an
// error at the key, naming the materials known.
func (ld *loader) supportMaterials() {
	mats := check.BuiltinMaterials()
	if ld.p.Materials != nil {
		mats = ld.p.Materials
	}
	for i, s := range ld.p.Supports {
		if s.Material == "" {
			continue
		}
		path := "support[" + strconv.Itoa(i) + "]"
		sp, gr, err := mats.BeamMaterial(s.Material, s.Grade)
		if err != nil {
			ld.errorf(joinPath(path, "material"), "%v", err)
			continue
		}
		if s.Size == "" {
			continue
		}
		size := s.Size
		if s.Plies > 1 {
			size = "(" + strconv.Itoa(s.Plies) + ") " + s.Size
		}
		if _, err := mats.Lookup(sp, gr, size); err != nil {
			key := "size"
			if strings.Contains(err.Error(), "grade") {
				key = "grade"
			}
			ld.errorf(joinPath(path, key), "material %s: %v", s.Material, err)
		}
	}
}

// posts reads the [[post]] tables.
func (ld *loader) posts(root *table) {
	elems, _ := ld.arrayTables(root, "post")
	for _, t := range elems {
		p := Post{Ke: 1}
		ld.required(t, "layers")
		ld.list(t, "layers", &p.Layers, nil)
		ld.text(t, "size", &p.Size, memberSizeCheck)
		ld.text(t, "species", &p.Species, nil)
		ld.text(t, "grade", &p.Grade, nil)
		ld.optNum(t, "height_in", "in", &p.HeightIn, postHeightIn)
		ld.num(t, "ke", "buckling length coefficient", &p.Ke, keRule)
		ld.p.Posts = append(ld.p.Posts, p)
	}
}

// pointLoads reads the [[point_load]] tables: a name each, names unique
// (case-insensitive), and at least one load that is not 0, since a named
// load of nothing would pass every check it is meant to test.
func (ld *loader) pointLoads(root *table) {
	elems, _ := ld.arrayTables(root, "point_load")
	seen := map[string]string{}
	for i, t := range elems {
		var pl PointLoad
		ld.entryName(t, "point_load", "point load", i, seen, &pl.Name)
		ld.optNum(t, "dead_lb", "lb", &pl.DeadLb, pointLoadRule)
		ld.optNum(t, "live_lb", "lb", &pl.LiveLb, pointLoadRule)
		ld.optNum(t, "roof_live_lb", "lb", &pl.RoofLiveLb, pointLoadRule)
		ld.optNum(t, "snow_lb", "lb", &pl.SnowLb, pointLoadRule)
		ld.optNum(t, "wind_down_lb", "lb", &pl.WindDownLb, pointLoadRule)
		ld.optNum(t, "wind_up_lb", "lb", &pl.WindUpLb, pointLoadRule)
		if pl.DeadLb == 0 && pl.LiveLb == 0 && pl.RoofLiveLb == 0 && pl.SnowLb == 0 && pl.WindDownLb == 0 && pl.WindUpLb == 0 {
			name := strconv.Quote(pl.Name)
			if pl.Name == "" {
				name = strings.TrimSuffix(t.label, ": ")
			}
			ld.errs = append(ld.errs, &ProjectError{File: ld.file, Line: lineOf(ld.lines, t.path),
				Key: "[[point_load]] " + name, Msg: "gives no load: give at least one of dead_lb, live_lb, " +
					"roof_live_lb, snow_lb, wind_down_lb, wind_up_lb (lb)"})
		}
		ld.p.PointLoads = append(ld.p.PointLoads, pl)
	}
}

// optNum reads a number that is 0 when left out, without listing that
// as a default taken (a load or a height not given is none, not a value
// assumed for the designer).
func (ld *loader) optNum(t *table, key, unit string, dst *float64, rule func(float64) string) {
	if has(t, key) {
		ld.num(t, key, unit, dst, rule)
		return
	}
	ld.get(t, key, "")
}

// quietBool reads a boolean whose default is not listed among the
// defaults taken.
func (ld *loader) quietBool(t *table, key string, dst *bool) {
	v, path, ok := ld.get(t, key, "")
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

// quietList is list for a key whose default is not listed among the
// defaults taken: the layer patterns and beam sizes of the load path,
// which a plan without posts, point loads or beams never uses, so that
// the summary of such a plan is as it was before they existed.
func (ld *loader) quietList(t *table, key string, dst *[]string, canon canonizer) {
	if has(t, key) {
		ld.list(t, key, dst, canon)
		return
	}
	ld.get(t, key, "")
}

// integer reads a whole number checked by rule.
func (ld *loader) integer(t *table, key, unit string, dst *int, rule func(float64) string) {
	v, path, ok := ld.get(t, key, "")
	if !ok {
		return
	}
	n, isInt := v.(int64)
	if !isInt {
		ld.errorf(path, "expected a whole number (%s, %s), got %s", unit, rule(-1), describe(v))
		return
	}
	if msg := rule(float64(n)); msg != "" {
		ld.errorf(path, "%s (%s), got %d", msg, unit, n)
		return
	}
	*dst = int(n)
}

// memberSizeRE reads a beam or post size as b x d: whole nominal inches
// ("6x12") or the actual dimensions of glulam and SCL ("5.125x12",
// "3 1/2 x 11 7/8" is not read here: the project file writes decimals).
var memberSizeRE = regexp.MustCompile(`^(\d+(?:\.\d+)?)\s*[xX×]\s*(\d+(?:\.\d+)?)$`)

// memberSizeCheck reads the size of a beam or post: what check.ParseSize
// reads ("2x12", "(3) 2x12", "4x12", in canonical form), a sawn timber of
// whole nominal inches ("6x6", "6x12"), or the actual b x d of glulam or
// SCL in inches ("5.125x12", "3.5x11.875"), each dimension from 1 to 48
// in (common practice, no source: no wood beam or post is outside that).
func memberSizeCheck(s string) (string, string) {
	const want = `a size such as "2x12", "(3) 2x12", "6x12", or glulam or SCL b x d in inches such as "5.125x12"`
	if sec, err := check.ParseSize(s); err == nil {
		return sec.Name, ""
	}
	m := memberSizeRE.FindStringSubmatch(strings.TrimSpace(s))
	if m == nil {
		return "", want
	}
	b, _ := strconv.ParseFloat(m[1], 64)
	d, _ := strconv.ParseFloat(m[2], 64)
	if b < 1 || b > 48 || d < 1 || d > 48 {
		return "", want + " (each dimension 1 to 48 in)"
	}
	return m[1] + "x" + m[2], ""
}
