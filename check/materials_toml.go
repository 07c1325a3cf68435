package check

import (
	"errors"
	"fmt"
	"io"
	"strconv"

	"github.com/BurntSushi/toml"
)

// LoadMaterialsTOML reads user design values from TOML: one [[material]]
// table per row, with the keys of the CSV columns (species, grade,
// min_width_in, max_width_in, fb_psi, ft_psi, fv_psi, fc_perp_psi, fc_psi,
// e_psi, emin_psi, size_factor, source). Widths may be left out (no
// limit); size_factor defaults to "none". Errors name the file, the line
// where TOML gives one, and the key.
func LoadMaterialsTOML(r io.Reader, name string) (*Materials, error) {
	var doc struct {
		Material []map[string]any `toml:"material"`
	}
	md, err := toml.NewDecoder(r).Decode(&doc)
	if err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, fmt.Errorf("%s:%d: %s", name, pe.Position.Line, pe.Message)
		}
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	if und := md.Undecoded(); len(und) > 0 {
		return nil, fmt.Errorf("%s: unknown key %q (want [[material]] tables)", name, und[0].String())
	}
	m := &Materials{}
	for i, t := range doc.Material {
		rec := make([]string, len(materialColumns))
		rec[2], rec[3], rec[11] = "0", "0", "none"
		known := map[string]int{}
		for j, c := range materialColumns {
			known[c] = j
		}
		for k, v := range t {
			j, ok := known[k]
			if !ok {
				return nil, fmt.Errorf("%s: material %d: unknown key %q; valid: %v", name, i+1, k, materialColumns)
			}
			switch x := v.(type) {
			case string:
				rec[j] = x
			case int64:
				rec[j] = strconv.FormatInt(x, 10)
			case float64:
				rec[j] = strconv.FormatFloat(x, 'g', -1, 64)
			default:
				return nil, fmt.Errorf("%s: material %d: key %s: want a number or a string, got %T", name, i+1, k, v)
			}
		}
		row, err := parseMaterialRow(rec)
		if err != nil {
			return nil, fmt.Errorf("%s: material %d: %w", name, i+1, err)
		}
		if row.Source == "" {
			row.Source = fmt.Sprintf("%s, material %d", name, i+1)
		}
		m.rows = append(m.rows, row)
	}
	return m, nil
}
