// Command cifiles writes the export package's outputs for the independent
// cross-checks in .ci/checks/export-*.sh: annotated copies of the test
// plans, the overlay, results.json and schedule.xlsx from the fixture
// results, and expect.json saying what the checks should find.
//
// Usage:
//
//	go run ./export/internal/cifiles -testdata export/testdata -out DIR
package main

import (
	"encoding/json"
	"flag"
	"fmt"
	"io"
	"os"
	"path/filepath"

	"framecheck/export"
)

// plan is one input drawing and the inch factor of its units.
type plan struct {
	Input  string  `json:"input"`
	Output string  `json:"output"`
	ToInch float64 `json:"to_inch"`
}

// expect is written as expect.json for the checks.
type expect struct {
	Plans   []plan         `json:"plans"`
	Overlay string         `json:"overlay"`
	Layers  map[string]int `json:"layers"` // markup entities per layer of ours
	XLSX    string         `json:"xlsx"`
	JSON    string         `json:"json"`
	Members int            `json:"members"`
	Marks   int            `json:"marks"`
	Rows    int            `json:"blocking_rows"`
}

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("cifiles", flag.ContinueOnError)
	fs.SetOutput(stderr)
	td := fs.String("testdata", "export/testdata", "folder of the fixtures")
	out := fs.String("out", "", "folder to write into (must exist)")
	if err := fs.Parse(args); err != nil || *out == "" {
		fmt.Fprintln(stderr, "usage: cifiles -testdata DIR -out DIR")
		return 2
	}
	if err := write(*td, *out, stdout); err != nil {
		fmt.Fprintln(stderr, "cifiles:", err)
		return 1
	}
	return 0
}

func write(td, out string, stdout io.Writer) error {
	// expect.json names files absolutely, so the checks can run anywhere.
	td, err := filepath.Abs(td)
	if err != nil {
		return err
	}
	if out, err = filepath.Abs(out); err != nil {
		return err
	}
	data, err := os.ReadFile(filepath.Join(td, "results.json"))
	if err != nil {
		return err
	}
	var r export.Results
	if err := json.Unmarshal(data, &r); err != nil {
		return err
	}
	// The fixture is in inches; each plan gets the same markup placed in
	// its own units.
	m := export.MarkupFromResults(&r, 1)
	e := expect{
		Layers: map[string]int{
			export.LayerFail:     len(m.Highlights),
			export.LayerError:    len(m.Errors) + len(m.Reasons),
			export.LayerBlocking: len(m.BlockingAdds) + len(m.BlockingNotes),
			export.LayerLabel:    len(m.Labels),
			export.LayerUplift:   len(m.Uplifts),
			export.LayerID:       len(m.IDs),
			// the key: title, stamp, datum, a sample line and a text per layer
			export.LayerKey: m.KeyEntities(),
		},
		Overlay: filepath.Join(out, "overlay.dxf"),
		XLSX:    filepath.Join(out, "schedule.xlsx"),
		JSON:    filepath.Join(out, "results.json"),
		Members: len(r.Members), Marks: len(r.Marks), Rows: len(r.BlockingRows),
	}
	for _, p := range []plan{
		{Input: "plan_r12.dxf", ToInch: 1},
		{Input: "plan_r2000.dxf", ToInch: 12},
		{Input: "plan_min_r12.dxf", ToInch: 1},
	} {
		p.Input = filepath.Join(td, p.Input)
		p.Output = filepath.Join(out, "annotated_"+filepath.Base(p.Input))
		pm := m
		pm.ToInch = p.ToInch
		if err := export.Annotate(p.Input, p.Output, pm); err != nil {
			return err
		}
		e.Plans = append(e.Plans, p)
	}
	if err := export.WriteOverlay(e.Overlay, m, "in"); err != nil {
		return err
	}
	if err := export.WriteXLSX(e.XLSX, &r); err != nil {
		return err
	}
	if err := export.WriteJSON(e.JSON, &r); err != nil {
		return err
	}
	b, err := json.MarshalIndent(e, "", " ")
	if err != nil {
		return err
	}
	if err := os.WriteFile(filepath.Join(out, "expect.json"), b, 0o644); err != nil {
		return err
	}
	fmt.Fprintln(stdout, "wrote", out)
	return nil
}
