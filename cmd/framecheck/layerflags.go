package main

import (
	"fmt"
	"strings"

	"framecheck/project"
)

// layerFlags are check's --joists and --supports: layer patterns given on
// the command line, so that a plan can be checked without a project file.
// They replace the project file's (or the built-in) [layers] joists and
// [[support]] tables.
type layerFlags struct {
	joists   string // "JST-*,FLR-JOIST"
	supports string // "WALL-BRG,flush-beam=S-BEAM-FL*"
}

// add registers the two flags on f.
func (lf *layerFlags) add(f *cmdFlags) {
	f.StringVar(&lf.joists, "joists", "", "joist layer patterns, comma-separated (replace [layers] joists)")
	f.StringVar(&lf.supports, "supports", "", "support layer patterns, comma-separated, each PATTERN (a bearing wall) or KIND=PATTERN, "+
		"KIND one of "+strings.Join(project.SupportKinds, ", ")+" (replace the [[support]] tables)")
}

// splitPatterns splits a comma-separated list of patterns, trimming
// spaces; empty items are dropped.
func splitPatterns(s string) []string {
	var out []string
	for _, p := range strings.Split(s, ",") {
		if p = strings.TrimSpace(p); p != "" {
			out = append(out, p)
		}
	}
	return out
}

// apply puts the flags' patterns into p. A layer name cannot hold "="
// (DXF layer names exclude it), so KIND=PATTERN is unambiguous. The
// errors are usage errors: a flag with no pattern, an unknown kind, or a
// pattern given to two roles.
func (lf *layerFlags) apply(p *project.Project) error {
	if lf.joists == "" && lf.supports == "" {
		return nil
	}
	drop := map[string]bool{}
	if lf.joists != "" {
		pats := splitPatterns(lf.joists)
		if len(pats) == 0 {
			return fmt.Errorf("--joists %q: want one or more layer patterns, comma-separated", lf.joists)
		}
		p.Layers.Joists = pats
		drop["layers.joists"] = true
	}
	if lf.supports != "" {
		sups, err := parseSupportsFlag(lf.supports)
		if err != nil {
			return err
		}
		p.Supports = sups
		drop["[[support]]"] = true
	}
	// the defaults list (summary, Notes sheet) no longer names what the
	// flags replaced
	var kept []string
	for _, d := range p.DefaultsUsed() {
		if drop["layers.joists"] && strings.HasPrefix(d, "layers.joists ") ||
			drop["[[support]]"] && strings.HasPrefix(d, "[[support]]") {
			continue
		}
		kept = append(kept, d)
	}
	p.SetDefaultsUsed(kept)
	return patternsOnce(p)
}

// parseSupportsFlag reads --supports: PATTERN or KIND=PATTERN items,
// comma-separated, into one support table per kind (in order of first
// mention), each with its kind's default bearing length.
func parseSupportsFlag(s string) ([]project.Support, error) {
	items := splitPatterns(s)
	if len(items) == 0 {
		return nil, fmt.Errorf("--supports %q: want one or more layer patterns, comma-separated", s)
	}
	var out []project.Support
	index := map[string]int{}
	for _, it := range items {
		kind, pat := "bearing-wall", it
		if k, v, ok := strings.Cut(it, "="); ok {
			kind, pat = "", strings.TrimSpace(v)
			for _, sk := range project.SupportKinds {
				if strings.EqualFold(strings.TrimSpace(k), sk) {
					kind = sk
				}
			}
			if kind == "" {
				return nil, fmt.Errorf("--supports %q: kind %q: want one of %s", it, strings.TrimSpace(k), strings.Join(project.SupportKinds, ", "))
			}
			if pat == "" {
				return nil, fmt.Errorf("--supports %q: no layer pattern after %s=", it, kind)
			}
		}
		i, ok := index[kind]
		if !ok {
			i = len(out)
			index[kind] = i
			out = append(out, project.Support{Kind: kind, BearingIn: project.DefaultBearingIn[kind], Check: true})
		}
		out[i].Layers = append(out[i].Layers, pat)
	}
	return out, nil
}

// patternsOnce refuses a layer pattern that two roles of p name (joists
// and a support, two supports, a support and labels, ...): a layer plays
// one part. Patterns compare case-insensitively.
func patternsOnce(p *project.Project) error {
	seen := map[string]string{}
	check := func(role string, pats []string) error {
		for _, pat := range pats {
			k := strings.ToUpper(pat)
			if prev, ok := seen[k]; ok && prev != role {
				return fmt.Errorf("layer pattern %q is given to %s and to %s: a layer plays one part", pat, prev, role)
			}
			seen[k] = role
		}
		return nil
	}
	l := p.Layers
	for _, r := range []struct {
		role string
		pats []string
	}{{"joists", l.Joists}, {"blocking", l.Blocking}, {"zones", l.Zones}, {"labels", l.Labels}, {"bays", l.Bays},
		{"posts", l.Posts}, {"point loads", l.PointLoads}} {
		if err := check(r.role, r.pats); err != nil {
			return err
		}
	}
	for i, s := range p.Supports {
		if err := check(fmt.Sprintf("support %d (%s)", i+1, s.Kind), s.Layers); err != nil {
			return err
		}
	}
	return nil
}
