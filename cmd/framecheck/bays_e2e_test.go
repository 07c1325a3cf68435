package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/xuri/excelize/v2"

	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/project"
)

// TestBaysOutputs runs `framecheck check` on the plan of bays_test.go
// drawn as a span line with arrowheads: results.json marks the 9 laid-out
// joists generated (and the drawn ones of the reference not), the
// schedule's Members sheet says so in each one's Messages, and the
// annotated DXF, read back by our reader, has one LINE per generated
// joist on FC-GENERATED; `framecheck layers` names the bay layer's role.
func TestBaysOutputs(t *testing.T) {
	dir := t.TempDir()
	proj := filepath.Join(dir, "conv.toml")
	if err := os.WriteFile(proj, []byte(convProject), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, form := range []string{"ref", "arrows", "outline"} {
		plan := filepath.Join(dir, form+".dxf")
		if err := os.WriteFile(plan, baysDXF(form, "", 0, false), 0o644); err != nil {
			t.Fatal(err)
		}
		out := filepath.Join(dir, "out-"+form)
		var stdout, stderr bytes.Buffer
		if code := run([]string{"check", plan, "-p", proj, "-o", out}, &stdout, &stderr); code != 0 {
			t.Fatalf("%s: exit %d\n%s\n%s", form, code, stdout.String(), stderr.String())
		}
		res, err := export.ReadJSON(filepath.Join(out, "results.json"))
		if err != nil {
			t.Fatal(err)
		}
		raw, err := os.ReadFile(filepath.Join(out, "results.json"))
		if err != nil {
			t.Fatal(err)
		}
		gen := form != "ref"
		wantJSON := 0
		if gen {
			wantJSON = 9
		}
		n := 0
		for i := range res.Members {
			if res.Members[i].Generated {
				n++
			}
		}
		// Written in the members, or once in their mark's "shared".
		if n != wantJSON || (wantJSON > 0) != bytes.Contains(raw, []byte(`"generated":true`)) {
			t.Errorf("%s: results.json has %d \"generated\":true, want %d", form, n, wantJSON)
		}
		if len(res.Members) != 9 {
			t.Fatalf("%s: %d members in results.json", form, len(res.Members))
		}
		noted := false
		for _, n := range res.Assumptions.Notes {
			noted = noted || strings.HasPrefix(n, "9 joists are not drawn but laid out in bays")
		}
		if noted != gen {
			t.Errorf("%s: layout assumption stated %v, want %v", form, noted, gen)
		}
		for _, m := range res.Members {
			if m.Generated != gen || m.Status != export.StatusPass {
				t.Errorf("%s %s: generated %v status %s, want %v pass", form, m.ID, m.Generated, m.Status, gen)
			}
		}
		f, err := excelize.OpenFile(filepath.Join(out, "schedule.xlsx"))
		if err != nil {
			t.Fatal(err)
		}
		rows, err := f.GetRows("Members")
		f.Close()
		if err != nil {
			t.Fatal(err)
		}
		notes := 0
		for _, r := range rows[1:] {
			if len(r) > 0 && strings.HasPrefix(r[len(r)-1], "generated: not drawn") {
				notes++
			}
		}
		if notes != wantJSON {
			t.Errorf("%s: %d Members rows with the generated note, want %d", form, notes, wantJSON)
		}
		// our writer's plans have no TABLES section: the markup is then
		// written alone, as the overlay
		marked := filepath.Join(out, form+"-checked.dxf")
		if _, err := os.Stat(marked); err != nil {
			marked = filepath.Join(out, form+"-overlay.dxf")
		}
		d, err := dxfimport.ReadFile(marked, dxfimport.Options{})
		if err != nil {
			t.Fatal(err)
		}
		lines := 0
		for _, e := range d.Entities {
			if e.Pos.Layer == export.LayerGenerated && e.Kind == dxfimport.KindLine {
				lines++
			}
		}
		if lines != wantJSON {
			t.Errorf("%s: %d LINEs on %s in the annotated DXF, want %d", form, lines, export.LayerGenerated, wantJSON)
		}
		if form == "outline" {
			code, so, se := runCmd("layers", plan, "-p", proj)
			role := ""
			for _, l := range strings.Split(so, "\n") {
				if f := strings.Fields(l); len(f) > 0 && f[0] == "FRAMING-BAY" {
					role = f[len(f)-1]
				}
			}
			if code != 0 || role != project.RoleBays {
				t.Errorf("layers: exit %d, no FRAMING-BAY with role %s:\n%s%s", code, project.RoleBays, so, se)
			}
		}
	}
}
