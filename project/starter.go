package project

// StarterProject is the commented project file `framecheck init` writes.
// Loaded back it gives exactly DefaultProject(); TestStarterRoundTrip
// keeps it so. Keys that are best left to their computed default (units,
// deflection limits) and the example override are commented out.
const StarterProject = `# framecheck project file: the designer's inputs for one framing plan.
#
# Lengths are inches unless a key says otherwise; area loads are psf.
# A key in inches (ending in _in) also takes a length with its unit as a
# string, as framers write it: "3 1/2\"", "1'-0\"", "89mm".
# Every plain key may be left out and then takes the value written here.
# A misspelled or unknown key is an error, never ignored.
# Check with: framecheck check PLAN.dxf -p framecheck.toml

[project]
# Printed on the report, the first rows of every sheet and results.json.
name = ""
number = ""
address = ""
designer = ""
checker = ""
revision = ""
date = ""                     # as you write it, e.g. "2026-12-04" or "4 Dec 2026"

[drawing]
# Unit of the drawing's coordinates: in | ft | mm | cm | m.
# Left out, it comes from the DXF header ($INSUNITS).
# units = "in"
snap_tolerance_in = 1.5       # a joist end within this distance of a support bears on it
max_wall_thickness_in = 12.0  # two parallel support lines closer than this, both crossed: one double-line wall
edge_distance_in = 0.0        # tributary width beyond the first and last joist of a run, where no wall or beam runs beside it and the load zone stops at it

[layers]
# Which drawing layers play which part. Patterns ignore case; * matches
# any run of characters and ? a single one. The S- patterns are the
# structural layer names of the US National CAD Standard.
joists = ["JOIST*", "S-JOIS*"]
blocking = ["BLOCKING*"]      # blocking rows already drawn; they brace the joists they cross
zones = ["LOAD-ZONE*"]        # closed outlines with the load zone's name written inside
labels = ["FRAMING-NOTE*", "S-ANNO-NOTE*", "S-ANNO-TEXT*"]  # size callouts such as "2x10 @ 16 o.c." and the span lines under them
bays = ["FRAMING-BAY*"]       # closed outlines of bays whose joists are not drawn, with a callout inside
posts = ["POST*"]             # posts under beams: circles, small closed outlines, block inserts
point_loads = ["POINT-LOAD*"] # point loads: a point, circle or block with a text such as "P: 1200 D, 800 L" (lb)

# One [[support]] table per kind of support. A layer pattern may belong
# to one table only. Without any [[support]] table, the two below apply.
[[support]]
layers = ["WALL*", "S-WALL*"]
kind = "bearing-wall"         # bearing-wall | dropped-beam | flush-beam | ledger
bearing_in = 3.5              # bearing on a single-line support; a double-line wall bears over its thickness
# species = "Spruce-Pine-Fir" # the plate the joists bear on, if not the joists' own species and grade:
# grade = "No.2"              # its Fc_perp is checked too, and the smaller governs

[[support]]
layers = ["BEAM-FLUSH*", "S-BEAM*"]
kind = "flush-beam"           # joists framing in here hang in hangers, counted in the takeoff
bearing_in = 1.5
# A support other than a bearing wall whose own supports are found on the
# plan (posts, bearing walls, another beam) is a beam carrying the joists'
# reactions. Its size comes from a callout near it, else from here:
# size = "2x12"               # or glulam / SCL b x d in inches: "5.125x12", "3.5x11.875"
# plies = 3                   # plies of a built-up sawn beam of that size
# material = ""               # glulam stress class, or an SCL row's name in materials_file
# check = true                # false: keep it a rigid bearing

[lumber]
# Species, grade and nominal size of every joist unless overridden below.
species = "Douglas Fir-Larch"
grade = "No.2"
size = "2x10"
# Your own design values (another species, MSR lumber, a product's published
# values) in a CSV or TOML file with the columns of the built-in tables:
# species,grade,min_width_in,max_width_in,fb_psi,ft_psi,fv_psi,fc_perp_psi,
# fc_psi,e_psi,emin_psi,size_factor,source. Relative to this file.
# Structural composite lumber (LVL, PSL, LSL): size_factor "SCL n" with n the
# exponent of the manufacturer's size factor (12/d)^n, widths the actual
# depths in inches; a beam callout ending in the row's species selects it.
# materials_file = "my-materials.csv"

# Overrides by joist layer: the first table whose patterns match wins and
# replaces any of species, grade and size it gives. For example:
# [[lumber.by_layer]]
# layers = ["JOIST-ROOF*"]
# size = "2x12"

[design]
top_edge_braced = true        # the sheathing holds the top edge along its length
shear_at_d = false            # true: load within d of a bearing face is left out of the design shear
wet_service = false           # true: wet service factors CM apply
temperature = "normal"        # normal (to 100 F) | warm (100 to 125 F) | hot (125 to 150 F)
incised = false               # true: incising factor Ci applies
kcr = 1.5                     # creep factor for long-term deflection (NDS 3.5.2); 2.0 for wet or unseasoned lumber
seasoned = true               # below 16% moisture at installation, dry service: IBC total deflection under L + 0.5D
add_self_weight = false       # true: add the joist's own weight to D (otherwise dead_psf includes it)
combinations = "ASCE 7-16"    # the ASD set of ASCE 7-16 2.4.1, or a list: ["D", "D+L", "D+0.75L+0.75S", "0.6D+0.6W"]
pattern_live_loads = true     # also load live-type loads span by span on continuous and cantilevered joists
uplift_report_lb = 50.0       # net uplift reactions (ASD, lb) from this size up are flagged for a connector; smaller ones are listed
brace_at_inflection = false   # true: count the inflection point over an interior support as a brace of the bottom edge

[loads]
default_zone = "FLOOR"        # zone of joists outside every drawn outline (with a single zone, that zone)

# One [[zone]] table per load zone. Without any, the FLOOR zone below
# applies. Wind loads are strength level; snow as ASCE 7-16 gives it.
[[zone]]
name = "FLOOR"
use = "floor"                 # floor | roof
dead_psf = 12.0               # D, self-weight included (left out or 0: an error, see allow_zero)
live_psf = 40.0               # L, floor live load (a floor zone must give it; a roof zone gets 0)
roof_live_psf = 0.0           # Lr (a roof zone must give Lr or S; given S only, it gets Lr 20)
snow_psf = 0.0                # S
wind_down_psf = 0.0           # wind pressure toward the joists
wind_up_psf = 0.0             # wind suction away from the joists (uplift)
ceiling = "non-plaster"       # plaster | non-plaster | none
ceiling_braces_bottom = false # true: a ceiling fastened to the joists braces their bottom edge
allow_zero = false            # true: the zone may leave out (or give 0 for) its dead load and its use's live-type load
# Deflection limits, the n of L/n; 0 = not checked. Left out, they follow
# IBC 2018 Table 1604.3 by use and ceiling: floor 360 live / 240 total;
# roof with plaster ceiling 360/240, other ceiling 240/180, none 180/120.
# live_deflection_limit = 360
# total_deflection_limit = 240
# long_term_deflection_limit = 0  # NDS 3.5.2 long-term deflection (Kcr D + live), L/n; 0 = reported, not checked
# uplift_dead_psf = 12.0      # dead load relied on against uplift in 0.6D + 0.6W; left out = dead_psf

[sizing]
# Used by "framecheck check --size": the sizes tried, smallest first.
candidates = ["2x6", "2x8", "2x10", "2x12", "2x14"]
blocking_piece_weight_bf = 2.0  # one blocking piece costs as much as this many board feet of joist
beam_candidates = ["(2) 2x10", "(3) 2x10", "(2) 2x12", "(3) 2x12", "4x12"]  # beam sizes tried, smallest first
same_depth = "none"           # run | zone | none: keep one joist depth per run or per zone, or none

# Posts on the posts layers: one [[post]] table per kind of post. Without
# a size and height (here or in a callout beside the post) a post's load
# is reported, not checked. For example:
# [[post]]
# layers = ["POST*"]
# size = "4x4"
# species = "Douglas Fir-Larch"
# grade = "No.2"
# height_in = 96.0
# ke = 1.0                    # buckling length coefficient (NDS Appendix G)

# Named point loads that a text on the point-load layers can name (lb;
# wind at strength level). For example:
# [[point_load]]
# name = "RTU-1"
# dead_lb = 450.0
# live_lb = 0.0
# roof_live_lb = 0.0
# snow_lb = 0.0
# wind_down_lb = 0.0
# wind_up_lb = 0.0
`
