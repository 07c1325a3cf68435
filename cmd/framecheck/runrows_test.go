package main

import (
	"math"
	"os"
	"path/filepath"
	"testing"

	"framecheck/check"
	"framecheck/project"
)

// thirdPointPlan writes a roof of five 2x10 joists at 24 in on centre,
// spanning 216 in between walls at y = 0 and y = 216, with, when drawn is
// true, a blocking row drawn across the run at y = 72 (a third point).
func thirdPointPlan(t *testing.T, drawn bool) (*outcome, error) {
	t.Helper()
	plan, toml := thirdPointFiles(t, drawn)
	p, err := project.LoadProject(toml)
	if err != nil {
		t.Fatal(err)
	}
	return runPipeline(pipelineInput{planPath: plan, project: p})
}

// thirdPointFiles writes the plan of thirdPointPlan and its project file
// into a new folder and returns their paths.
func thirdPointFiles(t *testing.T, drawn bool) (plan, toml string) {
	t.Helper()
	dir := t.TempDir()
	var d dxfText
	d.header("AC1009", 1)
	d.section("ENTITIES")
	for _, y := range []float64{0, 216} {
		d.line("WALL", -12, y, 108, y)
	}
	for i := 0; i < 5; i++ {
		x := 24 * float64(i)
		d.line("JOIST", x, 0, x, 216)
	}
	if drawn {
		d.line("BLOCKING", 0, 72, 96, 72)
	}
	d.endsec()
	d.eof()
	plan = filepath.Join(dir, "roof.dxf")
	if err := os.WriteFile(plan, []byte(d.b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	// The loads of check's thirdPointRafter: D 8, Lr 20, W up 40 psf.
	toml = filepath.Join(dir, "roof.toml")
	err := os.WriteFile(toml, []byte(`
[lumber]
species = "Douglas Fir-Larch"
grade = "No.2"
size = "2x10"

[[zone]]
name = "ROOF"
use = "roof"
dead_psf = 8.0
roof_live_psf = 20.0
wind_up_psf = 40.0
ceiling = "none"
`), 0o644)
	if err != nil {
		t.Fatal(err)
	}
	return plan, toml
}

// TestDrawnThirdPointRow_FourPiecesToAdd is issue 13's takeoff error: a
// row drawn at a third point across a run of five joists (four bays), the
// interior joists still failing their bottom edge with it. One row is
// added, at the other third point (144 in; hand calculation in check's
// TestDrawnThirdPointRow_OneRowAdded: lu 144 in -> ratio 1.388, lu 72 in
// -> 0.803, NDS 2018 Table 3.3.3 and Eq. 3.3-6), so the takeoff has 4
// pieces to add, not the 8 of two rows evenly spaced.
func TestDrawnThirdPointRow_FourPiecesToAdd(t *testing.T) {
	o, err := thirdPointPlan(t, true)
	if err != nil {
		t.Fatal(err)
	}
	if len(o.Rows) != 1 || math.Abs(o.Rows[0].AtIn-144) > 1e-6 {
		t.Fatalf("rows to add %+v, want one at 144 in", o.Rows)
	}
	if o.Takeoff.BlockingPieces != 4 {
		t.Errorf("takeoff: %d blocking pieces, want 4 (one row, four bays)", o.Takeoff.BlockingPieces)
	}
	for k, r := range o.Results {
		if r.Status != check.StatusPass {
			t.Errorf("%s: %s %v", r.ID, r.Status, r.Messages)
		}
		if len(r.BlockingAtIn) != 1 || math.Abs(r.BlockingAtIn[0]-144) > 1e-6 {
			t.Errorf("%s: rows added %v, want [144] (the run's row)", r.ID, r.BlockingAtIn)
		}
		if len(r.DrawnBlockingAtIn) != 1 || math.Abs(r.DrawnBlockingAtIn[0]-72) > 1e-6 {
			t.Errorf("%s: drawn rows %v, want [72]", r.ID, r.DrawnBlockingAtIn)
		}
		// never on top of a drawn row: at least d = 9.25 in away
		for _, x := range r.BlockingAtIn {
			for _, y := range o.Plan.Members[k].ExistingBlockingAtIn {
				if math.Abs(x-y) <= 9.25 {
					t.Errorf("%s: row to add at %v on the drawn row at %v", r.ID, x, y)
				}
			}
		}
	}
	// Without the drawn row the rows are as before: two per span at the
	// third points (DOMAIN.md "Blocking rows"), 8 pieces.
	o, err = thirdPointPlan(t, false)
	if err != nil {
		t.Fatal(err)
	}
	if len(o.Rows) != 2 || o.Takeoff.BlockingPieces != 8 {
		t.Errorf("no drawn row: %d rows, %d pieces; want 2 rows, 8 pieces", len(o.Rows), o.Takeoff.BlockingPieces)
	}
	for _, r := range o.Results {
		if r.RowsPerSpan() != 2 || len(r.DrawnBlockingAtIn) != 0 {
			t.Errorf("%s: %d rows per span, drawn %v; want 2, none", r.ID, r.RowsPerSpan(), r.DrawnBlockingAtIn)
		}
	}
}
