package main

import "runtime/debug"

// version is the tool's version, stamped at build time with
// -ldflags "-X main.version=v1.2.3" (tools/dist does); empty in a plain
// `go build`, when toolVersion falls back on the build information.
var version string

// toolVersion is the version stamped in every output and printed by
// `framecheck --version`: the stamped version, else the module version
// of an installed build (go install framecheck@v1.2.3), else "devel" with
// the VCS revision (12 characters, "+dirty" when the tree had changes),
// else "devel".
func toolVersion() string {
	if version != "" {
		return version
	}
	bi, ok := debug.ReadBuildInfo()
	if !ok {
		return "devel"
	}
	if v := bi.Main.Version; v != "" && v != "(devel)" {
		return v
	}
	rev, dirty := "", false
	for _, s := range bi.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			dirty = s.Value == "true"
		}
	}
	if rev == "" {
		return "devel"
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	if dirty {
		rev += "+dirty"
	}
	return "devel-" + rev
}
