package export

import (
	"encoding/json"
	"github.com/xuri/excelize/v2"
	"os"
	"path/filepath"
	"testing"
)

// loadFixture reads testdata/results.json (illustrative numbers, not design
// results; see testdata/README.md).
func loadFixture(t testing.TB) *Results {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("testdata", "results.json"))
	if err != nil {
		t.Fatal(err)
	}
	var r Results
	if err := json.Unmarshal(data, &r); err != nil {
		t.Fatal(err)
	}
	return &r
}

// noTempFiles fails when dir holds a leftover temporary file of writeAtomic.
func noTempFiles(t *testing.T, dir string) {
	t.Helper()
	matches, err := filepath.Glob(filepath.Join(dir, ".*.tmp-*"))
	if err != nil {
		t.Fatal(err)
	}
	if len(matches) > 0 {
		t.Errorf("temporary files left behind: %v", matches)
	}
}

// tableRowsOf is f.GetRows(sheet) from the header row on: the title rows
// (SheetTitle) left out, so that rows[0] is the header.
func tableRowsOf(f *excelize.File, sheet string) ([][]string, error) {
	rows, err := f.GetRows(sheet)
	if err != nil || len(rows) < TitleRows {
		return rows, err
	}
	return rows[TitleRows:], nil
}

// filledMembers returns the members of a results.json (decoded into top
// as generic JSON) as a reader without export's Go types sees them after
// following docs/RESULTS-SCHEMA.md: each member's keys with those its
// mark shares added, its source from "source_file" and "line", and each
// uplift bearing's mark and support filled in. It is the Go twin of the
// README's Python reader.
func filledMembers(t *testing.T, top map[string]any) []map[string]any {
	t.Helper()
	shared := map[string]map[string]any{}
	for _, mk := range top["marks"].([]any) {
		mk := mk.(map[string]any)
		if sh, ok := mk["shared"].(map[string]any); ok {
			if _, seen := shared[mk["mark"].(string)]; !seen {
				shared[mk["mark"].(string)] = sh
			}
		}
	}
	file, _ := top["source_file"].(string)
	var out []map[string]any
	marks := map[string]any{}
	for _, m := range top["members"].([]any) {
		mm := map[string]any{}
		for k, v := range shared[m.(map[string]any)["mark"].(string)] {
			mm[k] = v
		}
		for k, v := range m.(map[string]any) {
			mm[k] = v
		}
		if line, ok := mm["line"].(float64); ok && file != "" {
			if _, has := mm["source"]; !has {
				handle, _ := mm["handle"].(string)
				layer, _ := mm["layer"].(string)
				mm["source"] = sourceText(file, int(line), handle, layer)
			}
		}
		marks[mm["id"].(string)] = mm["mark"]
		out = append(out, mm)
	}
	if up, ok := top["uplift"].(map[string]any); ok {
		for _, b := range up["bearings"].([]any) {
			b := b.(map[string]any)
			if _, ok := b["mark"]; !ok {
				b["mark"] = marks[b["member"].(string)]
			}
			if _, ok := b["support"]; !ok {
				b["support"] = b["support_layer"].(string) + " handle " + b["support_handle"].(string)
			}
		}
	}
	return out
}
