package synth

import (
	"fmt"
	"strings"
)

// Project is the project file (framecheck.toml) for every synthetic plan:
// the layer roles, supports, lumber and the five zones the units use.
const Project = `# Project file for a synthetic framing plan written by samples/bigplan.
# The plan is a grid of units of four runs; each unit lies in one zone.
# Loads are psf; wind is strength level (ASCE 7-16). The figures are made
# up for benchmarking, not a design for a real site.

[drawing]
units = "in"                  # R12 files have no $INSUNITS; R2000 files say 1 (inches)
snap_tolerance_in = 1.5
max_wall_thickness_in = 12.0  # 2x6 (5.5 in) and 2x4 (3.5 in) walls are double lines
edge_distance_in = 0.0

[layers]
joists = ["JOIST*"]
blocking = ["BLOCKING*"]
zones = ["LOAD-ZONE*"]
labels = ["FRAMING-NOTE*"]

[[support]]
layers = ["WALL*"]
kind = "bearing-wall"
bearing_in = 3.5

[[support]]
layers = ["BEAM-FLUSH*"]
kind = "flush-beam"
bearing_in = 1.5

[[support]]
layers = ["BEAM-DROPPED*"]
kind = "dropped-beam"
bearing_in = 1.75

[lumber]
species = "Douglas Fir-Larch"
grade = "No.2"
size = "2x12"

[[lumber.by_layer]]
layers = ["JOIST-ROOF*"]
size = "2x10"

[design]
top_edge_braced = true
shear_at_d = false
wet_service = false
temperature = "normal"
incised = false
kcr = 1.5
combinations = "ASCE 7-16"
pattern_live_loads = true

[loads]
default_zone = "FLOOR"

[[zone]]
name = "FLOOR"
use = "floor"
dead_psf = 12.0
live_psf = 40.0
ceiling = "none"
ceiling_braces_bottom = false

[[zone]]
name = "STORAGE"              # undersized on purpose: every joist here fails
use = "floor"
dead_psf = 12.0
live_psf = 125.0
ceiling = "none"
ceiling_braces_bottom = false

[[zone]]
name = "BALCONY"
use = "floor"
dead_psf = 12.0
live_psf = 60.0
ceiling = "none"
ceiling_braces_bottom = false

[[zone]]
name = "ROOF-FIELD"
use = "roof"
dead_psf = 8.0
roof_live_psf = 20.0
snow_psf = 25.0
wind_down_psf = 16.0
wind_up_psf = 40.0
ceiling = "none"
ceiling_braces_bottom = false

[[zone]]
name = "ROOF-EDGE"            # net uplift 0.6D+0.6W = 40.2 psf: longer spans need blocking rows
use = "roof"
dead_psf = 8.0
roof_live_psf = 20.0
snow_psf = 25.0
wind_down_psf = 16.0
wind_up_psf = 75.0
ceiling = "none"
ceiling_braces_bottom = false

[sizing]
candidates = ["2x6", "2x8", "2x10", "2x12", "2x14"]
blocking_piece_weight_bf = 2.0
`

// ProjectBeams is Project with what makes the beams of a plan drawn with
// Options.Beams members: the posts layer, each beam layer's size and
// lumber, and the posts' size, lumber and height. Everything else is
// Project's, so a plan checked with each compares like for like.
var ProjectBeams = insertAfter(Project,
	"labels = [\"FRAMING-NOTE*\"]\n", `posts = ["POST*"]            # POST-1: the posts under the beams (Options.Beams)
`,
	"kind = \"flush-beam\"\nbearing_in = 1.5\n", `size = "6x14"                 # a timber (Table 4D beams and stringers) on posts at up to 16 ft;
species = "Douglas Fir-Larch" # some STORAGE beams fail, as their joists do
grade = "No.1"
`,
	"kind = \"dropped-beam\"\nbearing_in = 1.75\n", `size = "2x12"                 # (3) 2x12 built up: roof beams on posts at up to 16 ft
plies = 3
species = "Douglas Fir-Larch"
grade = "No.2"

[[post]]
layers = ["POST*"]
size = "6x6"
species = "Douglas Fir-Larch"
grade = "No.1"
height_in = 96.0              # 8 ft from the footing to the beam
ke = 1.0
`)

// ProjectFor returns the project file for the plan o describes:
// ProjectBeams with Options.Beams, else Project.
func ProjectFor(o Options) string {
	if o.Beams {
		return ProjectBeams
	}
	return Project
}

// insertAfter inserts into s, after each anchor (which must occur once),
// the text that follows it in pairs.
func insertAfter(s string, pairs ...string) string {
	for i := 0; i+1 < len(pairs); i += 2 {
		anchor, text := pairs[i], pairs[i+1]
		if strings.Count(s, anchor) != 1 {
			panic(fmt.Sprintf("synth: project anchor %q found %d times, want once", anchor, strings.Count(s, anchor)))
		}
		k := strings.Index(s, anchor) + len(anchor)
		s = s[:k] + text + s[k:]
	}
	return s
}
