package project

import (
	"strings"
	"time"
)

// ProjectInfo is the [project] table: who and what the calculation is
// for, printed on the report, every sheet and results.json. Every key may
// be left out (empty).
type ProjectInfo struct {
	Name, Number, Address, Designer, Checker, Revision string
	// Date is as the designer writes it; a TOML date (2026-12-04) is kept
	// in that form.
	Date string
}

// projectInfoKeys are the [project] keys in the order the file lists them.
var projectInfoKeys = []string{"name", "number", "address", "designer", "checker", "revision", "date"}

// info reads [project]: free text, empty allowed; a date may be a TOML
// date or a string.
func (ld *loader) info(t *table) {
	pi := &ld.p.Info
	dst := []*string{&pi.Name, &pi.Number, &pi.Address, &pi.Designer, &pi.Checker, &pi.Revision, &pi.Date}
	for i, key := range projectInfoKeys {
		v, path, ok := ld.get(t, key, "")
		if !ok {
			continue
		}
		switch x := v.(type) {
		case string:
			*dst[i] = strings.TrimSpace(x)
		case time.Time:
			if key != "date" {
				ld.errorf(path, "expected a string, got %s", describe(v))
				continue
			}
			*dst[i] = x.Format("2006-01-02")
		default:
			ld.errorf(path, "expected a string, got %s", describe(v))
		}
	}
}
