package framing

import "framecheck/dxfimport"

// Support kinds, as the project file's [[support]] kind key spells them.
const (
	KindBearingWall = "bearing-wall"
	KindDroppedBeam = "dropped-beam"
	KindFlushBeam   = "flush-beam" // joist ends here hang in hangers
	KindLedger      = "ledger"
)

// SupportSpec is one [[support]] table: the layers of one kind of support
// and the bearing length a single-line support of that kind gives.
type SupportSpec struct {
	Layers    []string // case-insensitive globs
	Kind      string   // bearing-wall | dropped-beam | flush-beam | ledger
	BearingIn float64  // bearing length on a single-line support, in
	// Rigid keeps the supports of this table rigid bearings, never beams
	// (the project's check = false).
	Rigid bool
}

// LumberRule is one [[lumber.by_layer]] table: overrides for joists on
// matching layers. Empty fields leave the project default.
type LumberRule struct {
	Layers               []string
	Species, Grade, Size string
}

// Options are the framing inputs of the project file ([drawing], [layers],
// [[support]], [lumber], [loads]); DefaultOptions gives PROJECT-FILE.md's
// defaults.
type Options struct {
	SnapToleranceIn    float64 // a joist end this close to a support bears on it
	MaxWallThicknessIn float64 // parallel support lines closer than this, both met: one double-line wall
	EdgeDistanceIn     float64 // added to the tributary width of the outermost joists of a run
	AngleTolDeg        float64 // joists within this angle are parallel

	JoistLayers, BlockingLayers, ZoneLayers, LabelLayers []string
	// BayLayers hold closed outlines of bays whose joists are not drawn
	// (bays.go): the joists are laid out from the bay's size callout.
	BayLayers []string
	Supports  []SupportSpec
	// PostLayers hold posts (circles, small closed outlines, block
	// inserts); PointLoadLayers point-load marks and their texts (the
	// load path, posts.go).
	PostLayers, PointLoadLayers []string
	// PointLoadNames are the names of the project's [[point_load]]
	// tables, which a point-load text may name (ReadPointLoad).
	PointLoadNames []string

	Species, Grade, Size string // project default lumber
	ByLayer              []LumberRule
	// MaterialCallout reads the size and material of a joist callout in
	// actual inches, "1 3/4 x 11 7/8 LVL @ 16" (structural composite
	// lumber of the project's materials file). nil: such a callout is an
	// error on the joists under it.
	MaterialCallout MaterialCalloutFunc

	// DefaultZone is the zone of members outside every outline; "" makes
	// a member outside every outline an error.
	DefaultZone string
}

// DefaultOptions returns the defaults PROJECT-FILE.md lists.
func DefaultOptions() Options {
	return Options{
		SnapToleranceIn:    1.5,
		MaxWallThicknessIn: 12,
		EdgeDistanceIn:     0,
		AngleTolDeg:        1,
		JoistLayers:        []string{"JOIST*"},
		BlockingLayers:     []string{"BLOCKING*"},
		ZoneLayers:         []string{"LOAD-ZONE*"},
		LabelLayers:        []string{"FRAMING-NOTE*"},
		PostLayers:         []string{"POST*"},
		PointLoadLayers:    []string{"POINT-LOAD*"},
		BayLayers:          []string{"FRAMING-BAY*"},
		Supports: []SupportSpec{
			{Layers: []string{"WALL*"}, Kind: KindBearingWall, BearingIn: 3.5},
			{Layers: []string{"BEAM-FLUSH*"}, Kind: KindFlushBeam, BearingIn: 1.5},
		},
		Species:     "Douglas Fir-Larch",
		Grade:       "No.2",
		Size:        "2x10",
		DefaultZone: "FLOOR",
	}
}

// role is what framing does with a layer's entities.
type role int

const (
	roleNone role = iota
	roleJoist
	roleSupport
	roleBlocking
	roleZone
	roleLabel
	rolePost
	rolePointLoad
	roleBay
)

// layerRole returns the role of a layer and, for supports, the index of
// its SupportSpec. Joists win over supports, supports over the rest, when
// patterns overlap.
func (o *Options) layerRole(layer string) (role, int) {
	switch {
	case dxfimport.MatchLayer(o.JoistLayers, layer):
		return roleJoist, -1
	}
	for i, s := range o.Supports {
		if dxfimport.MatchLayer(s.Layers, layer) {
			return roleSupport, i
		}
	}
	switch {
	case dxfimport.MatchLayer(o.BlockingLayers, layer):
		return roleBlocking, -1
	case dxfimport.MatchLayer(o.ZoneLayers, layer):
		return roleZone, -1
	case dxfimport.MatchLayer(o.LabelLayers, layer):
		return roleLabel, -1
	case dxfimport.MatchLayer(o.PostLayers, layer):
		return rolePost, -1
	case dxfimport.MatchLayer(o.PointLoadLayers, layer):
		return rolePointLoad, -1
	case dxfimport.MatchLayer(o.BayLayers, layer):
		return roleBay, -1
	}
	return roleNone, -1
}

// lumberFor returns the by-layer lumber of a joist layer: each field from
// the first rule that matches and sets it, else the project default.
func (o *Options) lumberFor(layer string) (species, grade, size string) {
	species, grade, size = o.Species, o.Grade, o.Size
	var gotS, gotG, gotZ bool
	for _, r := range o.ByLayer {
		if !dxfimport.MatchLayer(r.Layers, layer) {
			continue
		}
		if r.Species != "" && !gotS {
			species, gotS = r.Species, true
		}
		if r.Grade != "" && !gotG {
			grade, gotG = r.Grade, true
		}
		if r.Size != "" && !gotZ {
			size, gotZ = r.Size, true
		}
	}
	return
}
