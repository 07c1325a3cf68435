// Package project reads the project file (framecheck.toml): the
// designer's inputs for one plan. LoadProject and ParseProject check every
// key and report each mistake with its file, line and key (ProjectErrors);
// DefaultProject is the plan without a project file.
package project

import (
	"fmt"
	"strings"

	"framecheck/check"
	"framecheck/dxfimport"
)

// Project is the designer's input for one plan, read from a project file
// (framecheck.toml). The keys and their defaults are those of the project
// file reference (PROJECT-FILE.md); lengths are inches and area loads psf.
// Use LoadProject or ParseProject to build one, DefaultProject for a plan
// without a project file.
type Project struct {
	// File is the path the project was read from; "" for the built-in
	// defaults.
	File string

	Info     ProjectInfo     // [project]
	Drawing  DrawingSettings // [drawing]
	Layers   LayerRoles      // [layers]
	Supports []Support       // [[support]]
	Lumber   Lumber          // [lumber] and [[lumber.by_layer]]
	Design   Design          // [design]
	Loads    Loads           // [loads]
	Zones    []Zone          // [[zone]]
	Sizing   Sizing          // [sizing]
	// Posts are the [[post]] tables; PointLoads the [[point_load]]
	// tables (the load path, issue 17). Both are empty by default.
	Posts      []Post
	PointLoads []PointLoad

	// Materials is the built-in design values merged with the rows of
	// [lumber] materials_file, or nil when the project gives none.
	Materials *check.Materials

	// given holds the internal key paths ("zone[0].dead_psf") that the
	// file sets explicitly.
	given map[string]bool
	// defaults lists, in file order, each default that applied.
	defaults []string
	// sha256 and size are the project file's hash and length, for the
	// run's manifest ("" and 0 for the built-in defaults).
	sha256 string
	size   int64
}

// DrawingSettings is the [drawing] table.
type DrawingSettings struct {
	// Units is the unit of drawing coordinates: "in", "ft", "mm", "cm" or
	// "m"; "" takes the unit from the DXF header ($INSUNITS).
	Units              string
	SnapToleranceIn    float64 // a joist end this close to a support bears on it (> 0)
	MaxWallThicknessIn float64 // parallel support lines closer than this, both crossed: one wall (> 0)
	EdgeDistanceIn     float64 // added to the tributary width of a run's outermost joists (>= 0)
}

// LayerRoles is the [layers] table: case-insensitive glob patterns
// (dxfimport.MatchLayer), one list per role.
type LayerRoles struct {
	Joists   []string // joist lines
	Blocking []string // blocking rows already drawn
	Zones    []string // closed load-zone outlines with the zone name inside
	Labels   []string // size callouts and their span lines
	// Bays are closed outlines of joist bays shown by a span symbol: the
	// joists in them are not drawn (framing/bays.go lays them out).
	Bays []string
	// Posts are the layers of posts under beams: circles, small closed
	// outlines, block inserts (load path).
	Posts []string
	// PointLoads are the layers of point-load marks with their text.
	PointLoads []string
}

// Support is one [[support]] table: the layers of one kind of support.
type Support struct {
	Layers []string // layer patterns; a pattern belongs to one table only
	// Kind is "bearing-wall", "dropped-beam", "flush-beam" or "ledger".
	// Joist ends at a flush beam hang in hangers.
	Kind string
	// BearingIn is the bearing length on a single-line support; a
	// double-line wall uses its thickness instead.
	BearingIn float64
	// Species and Grade name the plate or beam the joists bear on; its
	// Fc_perp is checked beside the joist's (NDS 2018 3.10.2). Empty: the
	// joist's own.
	Species, Grade string
	// Size is the beam's size when no callout on the plan gives one:
	// "2x12" (with Plies for a built-up member), "4x12", or actual
	// dimensions of glulam or SCL "5.125x12"; "" when not given.
	Size string
	// Plies is the number of plies of a built-up sawn beam of Size; 0
	// when not given (one, or as a callout says).
	Plies int
	// Material names a user material (a glulam stress class, an SCL
	// product's published values); "" for the lumber of Species, Grade.
	Material string
	// Check: a support of this table whose own supports are found is a
	// member (a beam) checked with the loads it carries; false keeps it a
	// rigid bearing. Default true.
	Check bool
}

// Post is one [[post]] table: the size, lumber and height of the posts
// on its layers (checked as columns, NDS 2018 3.7).
type Post struct {
	Layers         []string
	Size           string // "4x4", "6x6"; "" when not given (a callout may give it)
	Species, Grade string // "" when not given
	HeightIn       float64
	// Ke is the buckling length coefficient (NDS 2018 Appendix G, Table
	// G1); default 1.0.
	Ke float64
}

// PointLoad is one [[point_load]] table: a named load that point-load
// text on the plan refers to, lb per load type (W strength level, as
// [[zone]] gives its wind pressures).
type PointLoad struct {
	Name                               string
	DeadLb, LiveLb, RoofLiveLb, SnowLb float64
	WindDownLb, WindUpLb               float64
}

// Lumber is the [lumber] table: the project default for every joist and
// the per-layer overrides.
type Lumber struct {
	Species string // e.g. "Douglas Fir-Larch"
	Grade   string // e.g. "No.2"
	Size    string // nominal, e.g. "2x10"
	// MaterialsFile is a CSV or TOML file of the user's own design values
	// (another species, MSR lumber, a product's published values), with
	// the columns of check's built-in tables; relative to the project file.
	MaterialsFile string
	// ByLayer holds the [[lumber.by_layer]] overrides, first match wins.
	ByLayer []LumberOverride
}

// LumberOverride is one [[lumber.by_layer]] table. Empty fields keep the
// project default.
type LumberOverride struct {
	Layers  []string
	Species string
	Grade   string
	Size    string
}

// Design is the [design] table.
type Design struct {
	TopEdgeBraced bool // sheathing holds the top edge continuously
	ShearAtD      bool // loads within d of the bearing face are left out of V
	WetService    bool // CM applies
	// Temperature is "normal" (up to 100 F), "warm" (100-125 F) or "hot"
	// (125-150 F): the Ct column of NDS 2018 Table 2.3.3.
	Temperature string
	Incised     bool // Ci applies
	// Kcr is the creep factor of NDS 2018 §3.5.2. Left out, it is 1.5, or
	// 2.0 when wet_service is true.
	Kcr float64
	// AddSelfWeight adds the joist's own weight to D. Left out (false), D
	// is taken to include it. (A key added beyond the reference file.)
	AddSelfWeight bool
	// Combinations is the set of load combinations to check.
	Combinations Combinations
	// PatternLiveLoads applies live-type loads span by span on continuous
	// and cantilevered members.
	PatternLiveLoads bool
	// Seasoned: lumber below 16 % moisture at installation in dry service,
	// so the IBC total deflection is taken under L + 0.5D (IBC 2018 Table
	// 1604.3 footnote d). Left out: true, unless wet_service.
	Seasoned bool
	// UpliftReportLb is the net uplift reaction (ASD, lb) from which a
	// bearing's uplift is flagged for a connector; smaller uplift is
	// listed, not flagged. Every net uplift is listed whatever its size.
	UpliftReportLb float64
	// BraceAtInflection counts the inflection points over interior
	// supports of continuous members as braces of the bottom edge
	// (design.brace_at_inflection, default false; issue 13).
	BraceAtInflection bool
}

// defaultUpliftReportLb is design.uplift_report_lb when left out: 50 lb,
// below which nailing that any joist gets at its bearing is commonly taken
// to hold the joist down (common practice, no source; the designer sets
// the key to what the fastening at hand is good for).
const defaultUpliftReportLb = 50.0

// Combinations is the value of design.combinations: either a named
// standard set or an explicit list.
type Combinations struct {
	// Standard is "ASCE 7-16" for the ASD combinations of ASCE 7-16
	// §2.4.1, or "" when List is given.
	Standard string
	// List holds the explicit combinations as written, such as
	// "D+0.75L+0.75(Lr or S)", in file order; check.ParseCombos reads them.
	List []string
}

// StandardASCE716 names the ASD load combinations of ASCE 7-16 §2.4.1.
const StandardASCE716 = "ASCE 7-16"

// Combos returns the combinations to check: check.DefaultCombos for the
// standard set, else the parsed list (the loader has already checked it).
func (c Combinations) Combos() ([]check.Combo, error) {
	if c.Standard != "" {
		return check.DefaultCombos(), nil
	}
	return check.ParseCombos(c.List)
}

// Loads is the [loads] table.
type Loads struct {
	// DefaultZone is the zone of members outside every drawn outline.
	DefaultZone string
}

// Zone is one [[zone]] table: area loads in psf and the deflection limits
// of the members in it.
type Zone struct {
	Name        string
	Use         string  // "floor" or "roof"
	DeadPsf     float64 // D, including self-weight
	LivePsf     float64 // L, floor live
	RoofLivePsf float64 // Lr
	SnowPsf     float64 // S
	WindDownPsf float64 // W toward the member, strength level
	WindUpPsf   float64 // W away from the member (uplift), strength level
	// Ceiling is "plaster", "non-plaster" or "none".
	Ceiling             string
	CeilingBracesBottom bool // a ceiling fastened to the joists braces the bottom edge
	// LiveDeflectionLimit is the n of L/n for live-type loads; 0 means not
	// checked.
	LiveDeflectionLimit float64
	// TotalDeflectionLimit is the n of L/n for the total deflection; 0
	// means not checked.
	TotalDeflectionLimit float64
	// UpliftDeadPsf is the dead load relied on against uplift (the D of
	// 0.6D + 0.6W); left out, the zone's dead_psf (HasUpliftDead false).
	UpliftDeadPsf float64
	HasUpliftDead bool
	// LongTermDeflectionLimit is the n of L/n for the NDS 2018 3.5.2
	// long-term deflection; 0 (the default) means reported, not checked.
	LongTermDeflectionLimit float64
	// PitchRise12 is the roof slope, rise in 12 (0 flat): members drawn in
	// plan are rafters on the horizontal projection.
	PitchRise12 float64
	// DeadOnSlope: dead_psf is per sloped area (the trade's usual way) and
	// is converted to the horizontal projection (x 1/cos); false: it is
	// per horizontal area already. Default true.
	DeadOnSlope bool
	// AllowZero (allow_zero) lets the zone leave out, or give as 0, its
	// dead load and its use's live-type load; otherwise that is an error.
	AllowZero bool
}

// Sizing is the [sizing] table, used by `framecheck check --size`.
type Sizing struct {
	Candidates []string // nominal sizes to try, smallest first
	// BlockingPieceWeightBf is the cost of one blocking piece expressed in
	// board feet of joist.
	BlockingPieceWeightBf float64
	// BeamCandidates are the beam sizes `--size` tries for beams,
	// smallest first: "(2) 2x10", "4x12".
	BeamCandidates []string
	// SameDepth is what keeps one joist depth when --size picks sizes:
	// "run" (every joist of a run of adjacent parallel joists takes the
	// deepest size any of them needs), "zone" (the same over each load
	// zone) or "none" (each joist its own lightest size).
	SameDepth string
}

// Allowed values of the project file's enumerated keys.
var (
	UnitsValues       = []string{"in", "ft", "mm", "cm", "m"}
	SupportKinds      = []string{"bearing-wall", "dropped-beam", "flush-beam", "ledger"}
	temperatureValues = []string{"normal", "warm", "hot"}
	UseValues         = []string{"floor", "roof"}
	CeilingValues     = []string{"plaster", "non-plaster", "none"}
	sameDepthValues   = []string{"run", "zone", "none"}
)

// DefaultBearingIn is the bearing length a [[support]] table gets when it
// leaves bearing_in out, by kind: the 3.5 in of a 2x4 plate or a two-ply
// beam for walls and dropped beams, the 1.5 in seat of a face-mount hanger
// for flush beams and ledgers. Common practice, no source.
var DefaultBearingIn = map[string]float64{
	"bearing-wall": 3.5,
	"dropped-beam": 3.5,
	"flush-beam":   1.5,
	"ledger":       1.5,
}

// defaultSupports are the support tables of a file without [[support]].
// S-WALL and S-BEAM are the structural wall and beam layers of the US
// National CAD Standard, as recalled, not read from the standard (from
// memory, verify). A beam on S-BEAM is taken as flush (joists in
// hangers, 1.5 in seat): the shorter bearing of the two beam kinds, so a
// dropped beam drawn there is checked on the safe side.
func defaultSupports() []Support {
	return []Support{
		{Layers: []string{"WALL*", "S-WALL*"}, Kind: "bearing-wall", BearingIn: 3.5, Check: true},
		{Layers: []string{"BEAM-FLUSH*", "S-BEAM*"}, Kind: "flush-beam", BearingIn: 1.5, Check: true},
	}
}

// defaultZone is the zone of a file without [[zone]].
func defaultZone() Zone {
	return Zone{
		Name: "FLOOR", Use: "floor", DeadPsf: 12, LivePsf: 40,
		Ceiling: "non-plaster", LiveDeflectionLimit: 360, TotalDeflectionLimit: 240, DeadOnSlope: true,
	}
}

// RoofLiveDefaultPsf is roof_live_psf for a roof zone that gives snow_psf
// but leaves roof_live_psf out, and for `framecheck member --use roof`:
// ordinary flat, pitched and curved roofs, ASCE 7-16 Table 4.3-1 (from
// memory: verify against ASCE 7-16 Table 4.3-1). A floor zone gets 0.
const RoofLiveDefaultPsf = 20.0

// FloorLiveDefaultPsf is the floor live load of `framecheck member` and
// of the built-in FLOOR zone, as the project file reference shows. A
// [[zone]] that leaves live_psf out is an error (unless allow_zero).
const FloorLiveDefaultPsf = 40.0

// DeflectionLimits returns the n of L/n for live-type loads and for the
// total load by use and ceiling (IBC 2018 Table 1604.3, as
// check.DeflectionLimits gives them). The loader has checked both names.
func DeflectionLimits(use, ceiling string) (live, total float64) {
	live, total, err := check.DeflectionLimits(use, ceiling)
	if err != nil {
		panic("framecheck: deflection limits of a checked zone: " + err.Error())
	}
	return live, total
}

// DefaultProject returns the project used for a plan without a project
// file: every key at its default, the two default support tables and the
// FLOOR zone.
func DefaultProject() *Project {
	p, err := ParseProject("", nil)
	if err != nil {
		panic("framecheck: built-in defaults do not load: " + err.Error())
	}
	return p
}

// DefaultsUsed lists, in file order, each default that applied, as
// "section.key = value (why)", for the run summary.
func (p *Project) DefaultsUsed() []string {
	return append([]string(nil), p.defaults...)
}

// SetDefaultsUsed replaces the defaults list, for command-line flags that
// override what a default gave.
func (p *Project) SetDefaultsUsed(l []string) { p.defaults = l }

// FileSHA256 is the SHA-256, in hexadecimal, of the project file read by
// LoadProject or ParseProject ("" for DefaultProject).
func (p *Project) FileSHA256() string { return p.sha256 }

// FileSize is the length in bytes of the project file read by LoadProject
// or ParseProject (0 for DefaultProject).
func (p *Project) FileSize() int64 { return p.size }

// Given reports whether the project file set the key explicitly. Key is a
// dotted path; elements of array tables carry a 0-based index, as in
// "zone[1].dead_psf" or "lumber.by_layer[0].size".
func (p *Project) Given(key string) bool { return p.given[key] }

// SupportOf returns the [[support]] table whose layer patterns match
// layer, or nil.
func (p *Project) SupportOf(layer string) *Support {
	for i := range p.Supports {
		if dxfimport.MatchLayer(p.Supports[i].Layers, layer) {
			return &p.Supports[i]
		}
	}
	return nil
}

// Zone returns the zone of that name (case-insensitive), or nil.
func (p *Project) Zone(name string) *Zone {
	for i := range p.Zones {
		if strings.EqualFold(p.Zones[i].Name, name) {
			return &p.Zones[i]
		}
	}
	return nil
}

// Layer roles returned by LayerRole.
const (
	RoleJoists   = "joists"
	RoleBlocking = "blocking"
	RoleZones    = "zones"
	RoleLabels   = "labels"
	RoleBays     = "bays"
	RolePosts    = "posts"
	// RolePointLoads is the role of point-load marks and their text.
	RolePointLoads = "point_loads"
	// Support layers report "support:" followed by the kind.
	RolePrefixSupport = "support:"
)

// LayerRole returns the role the project gives a layer: "joists",
// "blocking", "zones", "labels", "bays", "posts" (layers.posts or the
// layers of a [[post]] table), "point_loads", "support:<kind>", or "" for
// none. Roles are tried in that order, supports last.
func (p *Project) LayerRole(layer string) string {
	roles := []struct {
		name     string
		patterns []string
	}{
		{RoleJoists, p.Layers.Joists},
		{RoleBlocking, p.Layers.Blocking},
		{RoleZones, p.Layers.Zones},
		{RoleLabels, p.Layers.Labels},
		{RoleBays, p.Layers.Bays},
		{RolePosts, p.PostLayers()},
		{RolePointLoads, p.Layers.PointLoads},
	}
	for _, r := range roles {
		if dxfimport.MatchLayer(r.patterns, layer) {
			return r.name
		}
	}
	for _, s := range p.Supports {
		if dxfimport.MatchLayer(s.Layers, layer) {
			return RolePrefixSupport + s.Kind
		}
	}
	return ""
}

// PostLayers returns the layer patterns of posts: layers.posts and the
// layers of every [[post]] table.
func (p *Project) PostLayers() []string {
	out := append([]string(nil), p.Layers.Posts...)
	for _, t := range p.Posts {
		out = append(out, t.Layers...)
	}
	return out
}

// PostFor returns the first [[post]] table whose patterns match layer,
// or nil.
func (p *Project) PostFor(layer string) *Post {
	for i := range p.Posts {
		if dxfimport.MatchLayer(p.Posts[i].Layers, layer) {
			return &p.Posts[i]
		}
	}
	return nil
}

// PointLoad returns the [[point_load]] of that name (case-insensitive),
// or nil.
func (p *Project) PointLoad(name string) *PointLoad {
	for i := range p.PointLoads {
		if strings.EqualFold(p.PointLoads[i].Name, name) {
			return &p.PointLoads[i]
		}
	}
	return nil
}

// LumberFor returns the species, grade and size of a joist on that layer:
// the first [[lumber.by_layer]] override whose patterns match, with the
// fields it leaves empty taken from [lumber].
func (p *Project) LumberFor(layer string) (species, grade, size string) {
	species, grade, size = p.Lumber.Species, p.Lumber.Grade, p.Lumber.Size
	for _, o := range p.Lumber.ByLayer {
		if !dxfimport.MatchLayer(o.Layers, layer) {
			continue
		}
		if o.Species != "" {
			species = o.Species
		}
		if o.Grade != "" {
			grade = o.Grade
		}
		if o.Size != "" {
			size = o.Size
		}
		break
	}
	return species, grade, size
}

// String formats a combination list as the project file would write it.
func (c Combinations) String() string {
	if c.Standard != "" {
		return fmt.Sprintf("%q", c.Standard)
	}
	return FmtList(c.List)
}
