package export

import (
	"io"
	"regexp"
	"strconv"
	"testing"

	"github.com/xuri/excelize/v2"
)

// Every sheet of the schedule gives its used range in its dimension
// element (ECMA-376 Part 1, 18.3.1.35): a reader that trusts it, such as
// openpyxl's read-only mode, reads every row (the CI's Calc check holds
// LibreOffice's reading to that one). The range is the last row and the
// widest row's cells, every row's cells running from column A.
func TestScheduleDimensions(t *testing.T) {
	rowRE := regexp.MustCompile(`(?s)<row r="(\d+)"[^>]*>(.*?)</row>`)
	cellRE := regexp.MustCompile(`<c[ >/]`)
	dimRE := regexp.MustCompile(`<dimension ref="([^"]*)"`)
	big := bigResults(rowsPerBlock + 5)
	big.LoadPath = bigLoadPath(30, 40, 50, 20)
	for name, r := range map[string]*Results{"fixture": loadFixture(t), "big": big} {
		zr, parts := openSchedule(t, r)
		for sheet, part := range parts {
			f, err := zr.Open(part)
			if err != nil {
				t.Fatal(err)
			}
			data, _ := io.ReadAll(f)
			f.Close()
			lastRow, widest := 0, 0
			for _, m := range rowRE.FindAllSubmatch(data, -1) {
				n, _ := strconv.Atoi(string(m[1]))
				lastRow = max(lastRow, n)
				widest = max(widest, len(cellRE.FindAll(m[2], -1)))
			}
			want, _ := excelize.CoordinatesToCellName(widest, lastRow)
			got := dimRE.FindSubmatch(data)
			if got == nil || string(got[1]) != "A1:"+want {
				t.Errorf("%s: sheet %s: dimension %q, its cells run to %s", name, sheet, got, want)
			}
		}
		zr.Close()
	}
}
