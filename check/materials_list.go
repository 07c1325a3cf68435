package check

import "sort"

// MaterialRow is one line of a design-value table as the materials
// command prints it: the values and the nominal widths (in) they apply
// to. MaxWidthIn 0 means no upper limit.
type MaterialRow struct {
	DesignValues
	MinWidthIn, MaxWidthIn int
	// MinDepthIn, MaxDepthIn are the same range as given, in inches: the
	// actual depths of a structural composite lumber row (SizeFactorSCL).
	MinDepthIn, MaxDepthIn float64
}

// Rows returns the rows of m in table order. With species not empty (any
// spelling Lookup accepts) only that species' rows are returned, and an
// unknown species is an error that lists the valid ones.
func (m *Materials) Rows(species string) ([]MaterialRow, error) {
	want := ""
	if species != "" {
		sp, err := m.resolveSpecies(species)
		if err != nil {
			return nil, err
		}
		want = sp
	}
	var out []MaterialRow
	for _, r := range m.rows {
		if want != "" && r.Species != want {
			continue
		}
		out = append(out, MaterialRow{DesignValues: r.DesignValues, MinWidthIn: r.minWidth, MaxWidthIn: r.maxWidth,
			MinDepthIn: r.minDIn, MaxDepthIn: r.maxDIn})
	}
	return out, nil
}

// Species returns the species names m knows, sorted.
func (m *Materials) Species() []string {
	s := m.speciesNames()
	sort.Strings(s)
	return s
}
