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
