package synth

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
