package project

import (
	"errors"
	"fmt"
	"sort"
	"strconv"
	"strings"

	"framecheck/check"
)

// A ProjectError is one problem in a project file. Line is 1-based; 0 when
// the problem belongs to no single line.
type ProjectError struct {
	File string // project file name as given
	Line int    // line of the key, or of the syntax error
	Key  string // dotted key as the file writes it ("zone.dead_psf"); "" for syntax errors
	Msg  string // what is wrong and what is allowed
}

// Error formats e as "framecheck.toml:12: zone.dead_psf: must be 0 or
// more (psf), got -5".
func (e *ProjectError) Error() string {
	var b strings.Builder
	b.WriteString(e.File)
	if e.Line > 0 {
		fmt.Fprintf(&b, ":%d", e.Line)
	}
	b.WriteString(": ")
	if e.Key != "" {
		b.WriteString(e.Key + ": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}

// ProjectErrors is every problem found in one project file, sorted by
// line. Error prints one per line.
type ProjectErrors []*ProjectError

// Error joins the problems, one per line.
func (l ProjectErrors) Error() string {
	s := make([]string, len(l))
	for i, e := range l {
		s[i] = e.Error()
	}
	return strings.Join(s, "\n")
}

func (l ProjectErrors) sort() {
	sort.SliceStable(l, func(i, j int) bool { return l[i].Line < l[j].Line })
}

// knownKey is a key valid in some table, as looked up (name) and as
// suggested to the user (show: "kcr", "[design]", "[[zone]]").
type knownKey struct{ name, show string }

// schema lists the tables of the project file and their keys, for the
// advice on an unknown key that belongs in another table. The loader's
// getters decide what is valid; TestSchemaMatchesLoader keeps the two
// lists the same.
var schema = []struct {
	show string
	keys []string
}{
	{"the top level", []string{"project", "drawing", "layers", "support", "lumber", "design", "loads", "zone", "sizing",
		"post", "point_load"}},
	{"[project]", projectInfoKeys},
	{"[drawing]", []string{"units", "snap_tolerance_in", "max_wall_thickness_in", "edge_distance_in"}},
	{"[layers]", []string{"joists", "blocking", "zones", "labels", "bays", "posts", "point_loads"}},
	{"[[support]]", []string{"layers", "kind", "bearing_in", "species", "grade", "size", "plies", "material", "check"}},
	{"[lumber]", []string{"species", "grade", "size", "materials_file", "by_layer"}},
	{"[[lumber.by_layer]]", []string{"layers", "species", "grade", "size"}},
	{"[design]", []string{"top_edge_braced", "shear_at_d", "wet_service", "temperature", "incised", "kcr",
		"add_self_weight", "combinations", "pattern_live_loads", "seasoned", "uplift_report_lb",
		"brace_at_inflection"}},
	{"[loads]", []string{"default_zone"}},
	{"[[zone]]", []string{"name", "use", "allow_zero", "dead_psf", "live_psf", "roof_live_psf", "snow_psf", "wind_down_psf",
		"wind_up_psf", "ceiling", "ceiling_braces_bottom", "live_deflection_limit", "total_deflection_limit",
		"uplift_dead_psf", "pitch", "dead_on_slope", "long_term_deflection_limit"}},
	{"[sizing]", []string{"candidates", "blocking_piece_weight_bf", "beam_candidates", "same_depth"}},
	{"[[post]]", []string{"layers", "size", "species", "grade", "height_in", "ke"}},
	{"[[point_load]]", []string{"name", "dead_lb", "live_lb", "roof_live_lb", "snow_lb", "wind_down_lb", "wind_up_lb"}},
}

// keyHome maps each key name to the first table of schema that has it.
var keyHome = func() map[string]string {
	m := map[string]string{}
	for _, t := range schema {
		for _, k := range t.keys {
			if _, ok := m[k]; !ok {
				m[k] = t.show
			}
		}
	}
	return m
}()

// tomlType names the TOML type of a decoded value for messages.
func tomlType(v any) string {
	switch v.(type) {
	case string:
		return "string"
	case int64:
		return "integer"
	case float64:
		return "float"
	case bool:
		return "boolean"
	case map[string]any:
		return "table"
	case []map[string]any, []any:
		return "array"
	default:
		return "date/time"
	}
}

// describe formats a decoded value for a message: `string "abc"`,
// `integer 3`, `array`.
func describe(v any) string {
	switch x := v.(type) {
	case string:
		return fmt.Sprintf("string %q", x)
	case int64, float64, bool:
		return fmt.Sprintf("%s %v", tomlType(v), x)
	default:
		return tomlType(v)
	}
}

// FmtNum formats a number for messages and the defaults list.
func FmtNum(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// FmtList formats a string list as TOML.
func FmtList(l []string) string {
	s := make([]string, len(l))
	for i, x := range l {
		s[i] = strconv.Quote(x)
	}
	return "[" + strings.Join(s, ", ") + "]"
}

// Range checks for numeric keys: each returns "" when x is allowed, else
// the allowed range.
//
// between returns a rule for a value from lo to hi: the upper bounds keep
// out values no joist plan has (a typing slip such as 1e300 psf), which
// would otherwise give nonsense rather than an error (common practice, no
// source: each bound is far above anything a wood joist floor or roof
// carries, or a drawing tolerance needs).
func between(lo, hi float64, loIncluded bool) func(float64) string {
	return func(x float64) string {
		okLo := x > lo || (loIncluded && x == lo)
		if okLo && x <= hi {
			return ""
		}
		if loIncluded {
			return fmt.Sprintf("must be from %s to %s", FmtNum(lo), FmtNum(hi))
		}
		return fmt.Sprintf("must be greater than %s and at most %s", FmtNum(lo), FmtNum(hi))
	}
}

// Upper bounds of project-file numbers (see between).
var (
	loadRule      = between(0, 1000, true) // psf
	toleranceRule = between(0, 24, false)  // in: snap tolerance
	thicknessRule = between(0, 48, false)  // in: wall thickness, bearing length
	edgeRule      = between(0, 48, true)   // in
	kcrRule       = between(1, 3, true)    // NDS 2018 3.5.2 uses 1.5 and 2.0
	weightRule    = between(0, 100, true)  // board feet per blocking piece
	upliftRule    = between(0, 1e5, true)  // lb: net uplift reported without a flag
)

// DeflectionLimit is the rule for a deflection limit n of L/n: the message
// when x is neither 0 (not checked) nor from 1 to 10000, else "".
func DeflectionLimit(x float64) string {
	if x == 0 || x >= 1 && x <= 10000 {
		return ""
	}
	return "must be 0 (not checked) or from 1 to 10000"
}

// sizeCheck reads a nominal size as check.ParseSize does ("2x10",
// "2 X 10") and returns its canonical name.
func sizeCheck(s string) (string, string) {
	sec, err := check.ParseSize(s)
	switch {
	case errors.Is(err, check.ErrMetricSection), errors.Is(err, check.ErrBuiltUp):
		return "", `a nominal size such as "2x10" (` + err.Error() + ")"
	case err != nil:
		return "", `a nominal size such as "2x10" (2x, 3x or 4x; depth 4 to 16)`
	}
	return sec.Name, ""
}

// Contains reports whether s is one of list.
func Contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}
