package export

import (
	"archive/zip"
	"bytes"
	"os"
	"path/filepath"
	"testing"
)

// TestXLSXByteIdentical: the same results give the same schedule.xlsx
// byte for byte (issue 15 item 7), its parts in a fixed order with
// [Content_Types].xml first and the zip's zero time on every part.
func TestXLSXByteIdentical(t *testing.T) {
	r := loadFixture(t)
	dir := t.TempDir()
	var files [][]byte
	for i := 0; i < 4; i++ { // excelize's part order varied from run to run
		p := filepath.Join(dir, "s.xlsx")
		if err := WriteXLSX(p, r); err != nil {
			t.Fatal(err)
		}
		b, err := os.ReadFile(p)
		if err != nil {
			t.Fatal(err)
		}
		files = append(files, b)
	}
	for i := 1; i < len(files); i++ {
		if !bytes.Equal(files[0], files[i]) {
			t.Fatalf("write %d differs from the first", i+1)
		}
	}
	zr, err := zip.NewReader(bytes.NewReader(files[0]), int64(len(files[0])))
	if err != nil {
		t.Fatal(err)
	}
	if zr.File[0].Name != "[Content_Types].xml" {
		t.Errorf("first part %s", zr.File[0].Name)
	}
	for i, f := range zr.File {
		if f.ModifiedDate != 0 || f.ModifiedTime != 0 {
			t.Errorf("%s: time %d %d", f.Name, f.ModifiedDate, f.ModifiedTime)
		}
		if i > 1 && zr.File[i-1].Name > f.Name {
			t.Errorf("%s after %s", f.Name, zr.File[i-1].Name)
		}
	}
}
