package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"reflect"
	"testing"

	"framecheck/dxfimport"
	"framecheck/samples/bigplan/synth"
)

func TestRun(t *testing.T) {
	dir := t.TempDir()
	dxf, toml := filepath.Join(dir, "big.dxf"), filepath.Join(dir, "big.toml")
	var out, errOut bytes.Buffer
	if code := run([]string{"-joists", "500", "-r12", "-o", dxf, "-project", toml}, &out, &errOut); code != 0 {
		t.Fatalf("run = %d, stderr %q", code, errOut.String())
	}
	got, err := os.ReadFile(dxf)
	if err != nil {
		t.Fatal(err)
	}
	want, _ := synth.Build(synth.Options{Joists: 500, R12: true})
	if !bytes.Equal(got, want) {
		t.Error("written file differs from synth.Build")
	}
	if p, err := os.ReadFile(toml); err != nil || string(p) != synth.Project {
		t.Errorf("project file: %v", err)
	}
	// -beams: the posts drawn, and the project file that sizes them
	out.Reset()
	if code := run([]string{"-joists", "500", "-beams", "-o", dxf, "-project", toml}, &out, &errOut); code != 0 {
		t.Fatalf("run -beams = %d, stderr %q", code, errOut.String())
	}
	want, st := synth.Build(synth.Options{Joists: 500, Beams: true})
	if got, err := os.ReadFile(dxf); err != nil || !bytes.Equal(got, want) || st.Posts == 0 {
		t.Errorf("-beams: written file differs from synth.Build (%v), or no posts (%d)", err, st.Posts)
	}
	if p, err := os.ReadFile(toml); err != nil || string(p) != synth.ProjectBeams {
		t.Errorf("-beams: project file is not synth.ProjectBeams (%v)", err)
	}
	for _, args := range [][]string{{"-x"}, {"extra"}, {"-joists", "0"}} {
		errOut.Reset()
		if code := run(args, &out, &errOut); code != 2 {
			t.Errorf("run(%q) = %d, want 2", args, code)
		}
		if errOut.Len() == 0 {
			t.Errorf("run(%q): nothing on stderr", args)
		}
	}
}

// ezdxfCounts is one flavour in testdata/ezdxf_500.json, written by
// testdata/ezdxf_counts.py with ezdxf 0.18.1 (an independent DXF library).
type ezdxfCounts struct {
	AcadVer     string         `json:"acadver"`
	AuditErrors int            `json:"audit_errors"`
	AuditFixes  int            `json:"audit_fixes"`
	Layers      map[string]int `json:"layers"`
}

// TestAgainstEzdxf compares what ezdxf read from the 500-joist plans
// (audit clean, entities per layer) with the plans written now, read by
// package dxfimport: testdata/ezdxf_500.json for the plain plans,
// testdata/ezdxf_500_beams.json for those drawn with -beams (75 posts on
// POST-1 under 21 beam lines, by ezdxf's count).
func TestAgainstEzdxf(t *testing.T) {
	for file, beams := range map[string]bool{"ezdxf_500.json": false, "ezdxf_500_beams.json": true} {
		raw, err := os.ReadFile(filepath.Join("testdata", file))
		if err != nil {
			t.Fatal(err)
		}
		var ez map[string]ezdxfCounts
		if err := json.Unmarshal(raw, &ez); err != nil {
			t.Fatal(err)
		}
		for flavour, r12 := range map[string]bool{"R2000": false, "R12": true} {
			e, ok := ez[flavour]
			if !ok {
				t.Fatalf("testdata/%s has no %s", file, flavour)
			}
			if e.AuditErrors != 0 || e.AuditFixes != 0 {
				t.Errorf("%s %s: ezdxf audit %d errors, %d fixes", file, flavour, e.AuditErrors, e.AuditFixes)
			}
			data, st := synth.Build(synth.Options{Joists: 500, R12: r12, Beams: beams})
			d, err := dxfimport.Read(bytes.NewReader(data), "big.dxf", dxfimport.Options{Units: "in"})
			if err != nil {
				t.Fatal(err)
			}
			if d.Version != e.AcadVer {
				t.Errorf("%s %s: $ACADVER %q, ezdxf %q", file, flavour, d.Version, e.AcadVer)
			}
			got := map[string]int{}
			for _, en := range d.Entities {
				got[en.Pos.Layer]++
			}
			if !reflect.DeepEqual(got, e.Layers) {
				t.Errorf("%s %s: entities per layer\n ours  %v\n ezdxf %v", file, flavour, got, e.Layers)
			}
			if e.Layers["POST-1"] != st.Posts || beams != (st.Posts > 0) {
				t.Errorf("%s %s: ezdxf read %d posts, stats say %d", file, flavour, e.Layers["POST-1"], st.Posts)
			}
		}
	}
}
