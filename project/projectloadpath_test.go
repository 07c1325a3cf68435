package project

import (
	"reflect"
	"strings"
	"testing"
)

// TestLoadPathKeys reads the load-path keys of testdata/full.toml (the
// names of PROJECT-FILE.md "Keys added by the second round").
func TestLoadPathKeys(t *testing.T) {
	p, err := LoadProject("testdata/full.toml")
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(p.Layers.Posts, []string{"COL*"}) || !reflect.DeepEqual(p.Layers.PointLoads, []string{"PT-LOAD"}) {
		t.Errorf("layers %+v", p.Layers)
	}
	s := p.Supports[2]
	if s.Size != "2x12" || s.Plies != 3 || s.Material != "24F-1.8E" || s.Check {
		t.Errorf("flush-beam support %+v", s)
	}
	if !p.Supports[0].Check {
		t.Error("check left out: want true")
	}
	if want := []string{"(2) 2x12", "4x12", "6x12", "5.125x12"}; !reflect.DeepEqual(p.Sizing.BeamCandidates, want) {
		t.Errorf("beam candidates %q, want %q", p.Sizing.BeamCandidates, want)
	}
	wantPost := Post{Layers: []string{"COL-6*"}, Size: "6x6", Species: "Douglas Fir-Larch", Grade: "No.1", HeightIn: 96, Ke: 0.8}
	if len(p.Posts) != 1 || !reflect.DeepEqual(p.Posts[0], wantPost) {
		t.Errorf("posts %+v, want %+v", p.Posts, wantPost)
	}
	wantPL := PointLoad{Name: "RTU-1", DeadLb: 450, SnowLb: 120.5, WindDownLb: 80, WindUpLb: 300}
	if got := p.PointLoad("rtu-1"); got == nil || *got != wantPL {
		t.Errorf("point load %+v, want %+v", got, wantPL)
	}
	for layer, want := range map[string]string{"COL-2": RolePosts, "col-6a": RolePosts, "PT-LOAD": RolePointLoads, "PT-LOADS": ""} {
		if got := p.LayerRole(layer); got != want {
			t.Errorf("LayerRole(%q) = %q, want %q", layer, got, want)
		}
	}
	if p.PostFor("COL-6A") == nil || p.PostFor("COL-4") != nil {
		t.Error("PostFor: want the [[post]] table for COL-6A only")
	}

	def := DefaultProject()
	if !reflect.DeepEqual(def.Layers.Posts, []string{"POST*"}) || !reflect.DeepEqual(def.Layers.PointLoads, []string{"POINT-LOAD*"}) ||
		def.LayerRole("POST-1") != RolePosts || def.LayerRole("POINT-LOAD") != RolePointLoads {
		t.Errorf("default layers %+v", def.Layers)
	}
	if len(def.Posts) != 0 || len(def.PointLoads) != 0 {
		t.Errorf("defaults give posts %+v, point loads %+v", def.Posts, def.PointLoads)
	}
	for _, u := range def.DefaultsUsed() {
		if strings.Contains(u, "posts") || strings.Contains(u, "point_loads") || strings.Contains(u, "beam_candidates") {
			t.Errorf("load-path default listed: %q (a plan without them reads as before)", u)
		}
	}
}

// TestLoadPathKeyErrors: each wrong load-path key is an error naming the
// file, its line and key, and what is allowed.
func TestLoadPathKeyErrors(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"[[support]]\nlayers = [\"B*\"]\nkind = \"flush-beam\"\nsize = \"2x12\"\nplies = 5\n", "p.toml:5: support.plies: must be from 1 to 4"},
		{"[[support]]\nlayers = [\"B*\"]\nplies = 2.5\nsize = \"2x12\"\n", "p.toml:3: support.plies: expected a whole number"},
		{"[[support]]\nlayers = [\"B*\"]\nplies = 2\n", "p.toml:3: support.plies: plies without a size"},
		{"[[support]]\nlayers = [\"B*\"]\nsize = \"big\"\n", `p.toml:3: support.size: expected a size such as "2x12"`},
		{"[[support]]\nlayers = [\"B*\"]\ncheck = \"yes\"\n", "p.toml:3: support.check: expected true or false"},
		{"[[post]]\nsize = \"4x4\"\n", "p.toml:1: post.layers: missing"},
		{"[[post]]\nlayers = [\"P*\"]\nke = 5\n", "p.toml:3: post.ke: must be from 0.5 to 2.5"},
		{"[[post]]\nlayers = [\"P*\"]\nheight_in = -8\n", "p.toml:3: post.height_in: must be greater than 0"},
		{"[[post]]\nlayers = [\"P*\"]\nsize = \"4x4x4\"\n", "p.toml:3: post.size: expected a size"},
		{"[[post]]\nlayers = [\"P*\"]\nheigth_in = 96\n", "p.toml:3: post.heigth_in: unknown key"},
		{"[[point_load]]\nname = \"A\"\n", `p.toml:1: [[point_load]] "A": gives no load`},
		{"[[point_load]]\ndead_lb = 10\n", "p.toml:1: point_load.name: missing"},
		{"[[point_load]]\nname = \"A\"\nlive_lb = -1\n", "p.toml:3: point_load.live_lb: must be from 0"},
		{"[[point_load]]\nname = \"A\"\nlive_lb = 1\n[[point_load]]\nname = \"a\"\nlive_lb = 2\n", "p.toml:5: point_load.name: point load \"a\" is already defined (line 2)"},
		{"[sizing]\nbeam_candidates = [\"2x10\", \"(9) 2x10\"]\n", "p.toml:2: sizing.beam_candidates: entry 2: expected a size"},
		{"[layers]\nposts = [\"WALL*\"]\n", `layer pattern "WALL*" is also in`},
		{"[layers]\npoint_loads = \"P\"\n", "p.toml:2: layers.point_loads: expected an array of strings"},
	} {
		_, err := ParseProject("p.toml", []byte(c.in))
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%q:\nerror %v\nwant it to contain %q", c.in, err, c.want)
		}
	}
}

// TestMemberSizeCheck reads beam and post sizes in the forms the project
// file takes (common practice, no source).
func TestMemberSizeCheck(t *testing.T) {
	for in, want := range map[string]string{
		"2x12": "2x12", "(3) 2X12": "(3) 2x12", "4 x 12": "4x12", "6x6": "6x6", "8X8": "8x8",
		"5.125x12": "5.125x12", "3.5 x 11.875": "3.5x11.875",
		"2x": "", "(5) 2x12": "", "0.5x12": "", "90x45": "", "5 1/8 x 12": "5.125x12",
	} {
		got, rule := memberSizeCheck(in)
		if got != want || (want == "") != (rule != "") {
			t.Errorf("memberSizeCheck(%q) = %q, %q; want %q", in, got, rule, want)
		}
	}
}
