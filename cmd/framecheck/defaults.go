package main

import (
	"fmt"
	"io"
	"strings"

	"framecheck/project"
)

// engineeringDefault reports whether a default taken (an entry of
// Project.DefaultsUsed) is an engineering value: a load, a deflection
// limit, a bearing length, a lumber size or grade, a design switch or
// factor. The others (drawing tolerances and units, layer patterns, the
// sizing candidates, the default zone's name) only steer the reading of
// the drawing. Engineering defaults are always printed on the terminal
// (issue 15 item 6), not only on the Notes sheet.
func engineeringDefault(entry string) bool {
	for _, p := range []string{"drawing.", "layers.", "sizing.", "loads."} {
		if strings.HasPrefix(entry, p) {
			return false
		}
	}
	return true
}

// groupDefaults joins the "LABEL: key = value" and "table.key = value"
// entries of one table into one line each ("[[zone]] FLOOR: snow_psf = 0,
// wind_up_psf = 0"), in order; other entries stay as they are.
func groupDefaults(entries []string) []string {
	var out []string
	last := ""
	for _, e := range entries {
		label, item := defaultLabel(e)
		if label != "" && label == last {
			out[len(out)-1] += ", " + item
			continue
		}
		last = label
		if label == "" {
			out = append(out, e)
			continue
		}
		out = append(out, label+": "+item)
	}
	return out
}

// defaultLabel splits a defaults entry into its table and "key = value":
// "[[zone]] FLOOR: snow_psf = 0" gives "[[zone]] FLOOR", "snow_psf = 0";
// "design.kcr = 1.5" gives "design", "kcr = 1.5". An entry of another
// shape gives "", "".
func defaultLabel(e string) (label, item string) {
	eq := strings.Index(e, " = ")
	if eq < 0 {
		return "", ""
	}
	head := e[:eq]
	if i := strings.LastIndex(head, ": "); i >= 0 && strings.HasPrefix(head, "[[") {
		return head[:i], e[i+2:]
	}
	if i := strings.LastIndex(head, "."); i > 0 && !strings.ContainsAny(head, " []") {
		return head[:i], e[i+1:]
	}
	return "", ""
}

// printDefaults writes the defaults the run took: every engineering value
// (grouped by table, one line each), and the other settings too when they
// are few; more are counted and left to the Notes sheet.
func printDefaults(w io.Writer, c *checkRun, proj *project.Project) {
	used := proj.DefaultsUsed()
	if len(used) == 0 {
		return
	}
	var eng, other []string
	for _, u := range used {
		if engineeringDefault(u) {
			eng = append(eng, u)
		} else {
			other = append(other, u)
		}
	}
	if c.projectPath == "" {
		fmt.Fprintf(w, "no project file: built-in defaults used (%d settings; see the Inputs sheet)\n", len(used))
		if f := c.unusedProjectFile(); f != "" {
			fmt.Fprintf(w, "%s was not read: pass it with -p %s\n", termText(f), termText(f))
		}
	} else {
		fmt.Fprintf(w, "%d settings left out of %s took their defaults:\n", len(used), termText(c.projectPath))
	}
	list := eng
	if len(other) <= maxDefaultsListed {
		list = used
	}
	if c.projectPath == "" && len(eng) > 0 {
		fmt.Fprintln(w, "engineering values among them:")
	}
	for _, l := range groupDefaults(list) {
		fmt.Fprintf(w, "  %s\n", termText(l))
	}
	if len(other) > maxDefaultsListed {
		fmt.Fprintf(w, "  and %d settings of the drawing, layers and sizing (listed in the Notes sheet)\n", len(other))
	}
}
