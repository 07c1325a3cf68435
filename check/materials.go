package check

import (
	_ "embed"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
	"sync"
)

// Size-factor rules a material row can carry in its size_factor column.
const (
	// SizeFactor4A applies the size factors CF of the NDS 2018 Supplement
	// Table 4A header (Douglas Fir-Larch, Hem-Fir, Spruce-Pine-Fir, ...).
	SizeFactor4A = "4A"
	// SizeFactor4B marks Southern Pine values of NDS 2018 Supplement Table
	// 4B, which already include the size effect up to 12 in wide.
	SizeFactor4B = "4B"
	// SizeFactorNone takes CF = 1.0 (MSR lumber, a product's own values).
	SizeFactorNone = "none"
)

// DesignValues are the reference design values of one species, grade and
// width class, in psi, and the table they came from.
type DesignValues struct {
	Species, Grade string  // canonical names
	FbPsi          float64 // Fb, bending
	FtPsi          float64 // Ft, tension parallel to grain
	FvPsi          float64 // Fv, shear parallel to grain
	FcPerpPsi      float64 // Fc_perp, compression perpendicular to grain
	FcPsi          float64 // Fc, compression parallel to grain
	EPsi           float64 // E, modulus of elasticity
	EminPsi        float64 // Emin, for stability calculations
	SizeFactor     string  // SizeFactor4A, SizeFactor4B, SizeFactorNone or SizeFactorGlulam
	// FbNegPsi is the bending value when the compression zone is stressed
	// in tension (glulam Fbx-: negative moment); 0 = FbPsi.
	FbNegPsi float64
	// VolumeFactorX is x of the glulam volume factor CV (NDS 2018 5.3.6);
	// 0 = no volume factor.
	VolumeFactorX float64
	// SCLExponent is n of the size factor (12/d)^n of a structural
	// composite lumber row (SizeFactorSCL), as its manufacturer gives it;
	// 0 = none.
	SCLExponent float64
	Source      string // "NDS 2018 Supplement Table 4A", or the user's file:line
	Note        string // a substitution the lookup made (Stud wider than 6 in, ...)
}

// materialRow is one line of a design-value table.
type materialRow struct {
	DesignValues
	minWidth, maxWidth int // nominal width range; maxWidth 0 = no limit
	// minDIn, maxDIn: the same range as given, in inches: the actual
	// depths of an SCL row; maxDIn 0 = no limit.
	minDIn, maxDIn float64
}

// Materials is a set of design-value tables searched by species, grade and
// size. Rows loaded later take precedence over the built-in ones (Merge).
type Materials struct {
	rows  []materialRow
	mu    sync.RWMutex
	cache map[lookupKey]lookupVal // Lookup results by the names as given
}

type lookupKey struct {
	species, grade string
	width          float64
	thick          float64 // timbers and glulam are told by their thickness too
	actual         bool
}

type lookupVal struct {
	dv  DesignValues
	err error
}

// table4aCSV holds the reference design values of NDS 2018 Supplement Table
// 4A for Douglas Fir-Larch, Hem-Fir and Spruce-Pine-Fir dimension lumber
// (checked against two stored tabulations of the Supplement table; see the
// file's header and docs/VERIFIED.md).
//
//go:embed nds2018_table4a.csv
var table4aCSV string

// table4bCSV holds the reference design values of NDS 2018 Supplement Table
// 4B for Southern Pine dimension lumber by width (checked against the
// post-2013 SFPA values in metric, converted to psi; see the file's header
// and docs/VERIFIED.md). A new edition of the Supplement means new CSV
// files and new spot checks in materials_test.go.
//
//go:embed nds2018_table4b.csv
var table4bCSV string

var builtin = func() *Materials {
	m := &Materials{}
	for _, src := range []struct{ name, text string }{
		{"nds2018_table4a.csv", table4aCSV}, {"nds2018_table4b.csv", table4bCSV},
	} {
		u, err := LoadMaterialsCSV(strings.NewReader(src.text), src.name)
		if err != nil {
			panic("check: built-in table " + err.Error()) // a bad embedded file is a build defect
		}
		m.rows = append(m.rows, u.rows...)
	}
	return m
}()

// BuiltinMaterials returns the built-in tables: NDS 2018 Supplement Tables
// 4A (Douglas Fir-Larch, Hem-Fir, Spruce-Pine-Fir) and 4B (Southern Pine).
func BuiltinMaterials() *Materials { return builtin }

// Merge returns a set holding the rows of m and then those of other; rows of
// other take precedence where both define a species and grade.
func (m *Materials) Merge(other *Materials) *Materials {
	out := &Materials{}
	if other != nil {
		out.rows = append(out.rows, other.rows...)
	}
	if m != nil {
		out.rows = append(out.rows, m.rows...)
	}
	return out
}

// materialColumns are the columns of a design-value CSV file, in order.
var materialColumns = []string{"species", "grade", "min_width_in", "max_width_in", "fb_psi", "ft_psi",
	"fv_psi", "fc_perp_psi", "fc_psi", "e_psi", "emin_psi", "size_factor", "source"}

// LoadMaterialsCSV reads user design values from CSV with the columns of the
// built-in tables: species, grade, min_width_in, max_width_in (nominal,
// 0 = no limit), fb_psi, ft_psi, fv_psi, fc_perp_psi, fc_psi, e_psi,
// emin_psi, size_factor (4A, 4B, none, or "SCL n" for structural
// composite lumber, see SizeFactorSCL) and source. The header line is
// required; lines starting with # are comments. name is used in errors,
// which read "name:line: column: problem". The result holds only the
// file's rows: use BuiltinMaterials().Merge(user) to search both.
func LoadMaterialsCSV(r io.Reader, name string) (*Materials, error) {
	cr := csv.NewReader(r)
	cr.Comment = '#'
	cr.FieldsPerRecord = -1
	cr.TrimLeadingSpace = true
	m := &Materials{}
	var lines []int
	header := true
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		line, _ := cr.FieldPos(0)
		if err != nil {
			return nil, fmt.Errorf("%s: %w", name, err)
		}
		if header {
			if len(rec) != len(materialColumns) {
				return nil, fmt.Errorf("%s:%d: header: want the %d columns %s", name, line, len(materialColumns), strings.Join(materialColumns, ","))
			}
			for i, c := range materialColumns {
				if strings.TrimSpace(strings.ToLower(rec[i])) != c {
					return nil, fmt.Errorf("%s:%d: header column %d: want %q, got %q", name, line, i+1, c, rec[i])
				}
			}
			header = false
			continue
		}
		row, err := parseMaterialRow(rec)
		if err != nil {
			return nil, fmt.Errorf("%s:%d: %w", name, line, err)
		}
		if row.Source == "" {
			row.Source = fmt.Sprintf("%s:%d", name, line)
		}
		m.rows = append(m.rows, row)
		lines = append(lines, line)
	}
	if header {
		return nil, fmt.Errorf("%s: no header line (want %s)", name, strings.Join(materialColumns, ","))
	}
	if err := checkSCLRows(m.rows, lines, name); err != nil {
		return nil, err
	}
	return m, nil
}

// parseMaterialRow checks and converts one CSV record.
func parseMaterialRow(rec []string) (materialRow, error) {
	if len(rec) != len(materialColumns) {
		return materialRow{}, fmt.Errorf("want %d fields, got %d", len(materialColumns), len(rec))
	}
	var row materialRow
	row.Species = strings.TrimSpace(rec[0])
	row.Grade = strings.TrimSpace(rec[1])
	if row.Species == "" || row.Grade == "" {
		return row, errors.New("species and grade must not be empty")
	}
	nums := make([]float64, 9)
	for i := range nums {
		col := materialColumns[2+i]
		v, err := strconv.ParseFloat(strings.TrimSpace(rec[2+i]), 64)
		if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
			return row, fmt.Errorf("column %s: want a number, got %q", col, rec[2+i])
		}
		if v < 0 || (i >= 2 && v == 0) {
			return row, fmt.Errorf("column %s: want a positive number, got %q", col, rec[2+i])
		}
		nums[i] = v
	}
	row.minWidth, row.maxWidth = int(nums[0]), int(nums[1])
	row.minDIn, row.maxDIn = nums[0], nums[1]
	if row.maxDIn > 0 && row.maxDIn < row.minDIn {
		return row, fmt.Errorf("column max_width_in: %s is less than min_width_in %s (0 = no limit)", rec[3], rec[2])
	}
	row.FbPsi, row.FtPsi, row.FvPsi, row.FcPerpPsi = nums[2], nums[3], nums[4], nums[5]
	row.FcPsi, row.EPsi, row.EminPsi = nums[6], nums[7], nums[8]
	if n, ok, err := parseSCLSizeFactor(rec[11]); ok {
		if err != nil {
			return row, err
		}
		row.SizeFactor, row.SCLExponent = SizeFactorSCL, n
		row.Source = strings.TrimSpace(rec[12])
		return row, nil
	}
	switch sf := strings.TrimSpace(rec[11]); strings.ToLower(sf) {
	case "4a":
		row.SizeFactor = SizeFactor4A
	case "4b":
		row.SizeFactor = SizeFactor4B
	case "none", "":
		row.SizeFactor = SizeFactorNone
	default:
		return row, fmt.Errorf("column size_factor: want 4A, 4B, none or SCL n (structural composite lumber, n the exponent "+
			"of the manufacturer's size factor (12/d)^n), got %q", sf)
	}
	row.Source = strings.TrimSpace(rec[12])
	return row, nil
}

// Lookup returns the reference design values for species and grade in the
// width class of size. Names may be spelled in any common way ("DF-L",
// "Douglas Fir-Larch", "No. 2", "#2"). An unknown name is an error that
// lists the valid ones and suggests the closest. Stud grade wider than 6 in
// takes the No.3 values (NDS 2018 Supplement Table 4A footnote on Stud).
func (m *Materials) Lookup(species, grade, size string) (DesignValues, error) {
	sec, err := ParseSize(size)
	if err != nil {
		return DesignValues{}, err
	}
	k := lookupKey{species, grade, sec.NominalDIn, sec.NominalBIn, sec.Actual}
	m.mu.RLock()
	v, ok := m.cache[k]
	m.mu.RUnlock()
	if ok {
		return v.dv, v.err
	}
	dv, err := m.lookup(species, grade, sec)
	m.mu.Lock()
	if m.cache == nil {
		m.cache = map[lookupKey]lookupVal{}
	}
	if len(m.cache) < 4096 {
		m.cache[k] = lookupVal{dv, err}
	}
	m.mu.Unlock()
	return dv, err
}

func (m *Materials) lookup(species, grade string, sec Section) (DesignValues, error) {
	if k := nameKey(species); k == "glulam" || k == "glb" || k == "gluedlaminatedtimber" {
		return glulamValues(grade)
	}
	if sp, ok := m.IsSCL(species); ok {
		return m.sclLookup(sp, grade, sec)
	}
	if sec.Timber {
		return timberValues(species, grade, sec)
	}
	var err error
	sp, err := m.resolveSpecies(species)
	if err != nil {
		return DesignValues{}, err
	}
	gr, err := m.resolveGrade(sp, grade)
	if err != nil {
		return DesignValues{}, err
	}
	w := int(sec.NominalDIn)
	note := ""
	if gradeKey(gr) == "stud" && w > 6 {
		if _, err := m.resolveGrade(sp, "No.3"); err == nil {
			gr, note = "No.3", "Stud grade wider than 6 in takes No.3 values and size factors (NDS 2018 Supplement Table 4A footnote)"
		}
	}
	for _, r := range m.rows {
		if r.Species == sp && r.Grade == gr && w >= r.minWidth && (r.maxWidth == 0 || w <= r.maxWidth) {
			dv := r.DesignValues
			dv.Note = note
			return dv, nil
		}
	}
	return DesignValues{}, fmt.Errorf("%s %s: no design values for a nominal width of %d in", sp, gr, w)
}

// speciesAliases maps name keys (see nameKey) to canonical species names.
var speciesAliases = map[string]string{
	"dfl": "Douglas Fir-Larch", "df": "Douglas Fir-Larch", "douglasfir": "Douglas Fir-Larch",
	"dougfir": "Douglas Fir-Larch", "douglasfirlarch": "Douglas Fir-Larch", "dougfirlarch": "Douglas Fir-Larch",
	"hf": "Hem-Fir", "hemfir": "Hem-Fir",
	"spf": "Spruce-Pine-Fir", "sprucepinefir": "Spruce-Pine-Fir",
	"sp": "Southern Pine", "syp": "Southern Pine", "southernpine": "Southern Pine", "southernyellowpine": "Southern Pine",
}

// gradeAliases maps name keys to canonical grade names.
var gradeAliases = map[string]string{
	"ss": "Select Structural", "selstr": "Select Structural", "selectstructural": "Select Structural",
	"no1andbtr": "No.1 & Btr", "no1andbetter": "No.1 & Btr", "1andbtr": "No.1 & Btr", "1andbetter": "No.1 & Btr",
	"no1": "No.1", "1": "No.1", "number1": "No.1",
	"no2": "No.2", "2": "No.2", "number2": "No.2",
	"no3": "No.3", "3": "No.3", "number3": "No.3",
	"stud":   "Stud",
	"no1no2": "No.1/No.2", "no1orno2": "No.1/No.2", "1and2": "No.1/No.2",
}

// nameKey folds a species or grade name for comparison: lower case, "&"
// read as "and", "#" as "no", and punctuation and spaces dropped.
func nameKey(s string) string {
	s = strings.ToLower(s)
	s = strings.ReplaceAll(s, "&", "and")
	s = strings.ReplaceAll(s, "#", "no")
	var b strings.Builder
	for _, r := range s {
		if (r >= 'a' && r <= 'z') || (r >= '0' && r <= '9') {
			b.WriteRune(r)
		}
	}
	k := b.String()
	k = strings.ReplaceAll(k, "number", "no")
	return k
}

func gradeKey(s string) string {
	k := nameKey(s)
	if c, ok := gradeAliases[k]; ok {
		return nameKey(c)
	}
	return k
}

// speciesNames lists the canonical species in the set, in table order.
func (m *Materials) speciesNames() []string {
	var out []string
	seen := map[string]bool{}
	for _, r := range m.rows {
		if !seen[r.Species] {
			seen[r.Species] = true
			out = append(out, r.Species)
		}
	}
	return out
}

// gradeNames lists the canonical grades of one species, in table order.
func (m *Materials) gradeNames(species string) []string {
	var out []string
	seen := map[string]bool{}
	for _, r := range m.rows {
		if r.Species == species && !seen[r.Grade] {
			seen[r.Grade] = true
			out = append(out, r.Grade)
		}
	}
	return out
}

func (m *Materials) resolveSpecies(name string) (string, error) {
	names := m.speciesNames()
	k := nameKey(name)
	for _, n := range names {
		if nameKey(n) == k {
			return n, nil
		}
	}
	if c, ok := speciesAliases[k]; ok {
		for _, n := range names {
			if n == c {
				return n, nil
			}
		}
	}
	return "", unknownName("species", name, names)
}

func (m *Materials) resolveGrade(species, name string) (string, error) {
	names := m.gradeNames(species)
	k := gradeKey(name)
	for _, n := range names {
		if gradeKey(n) == k {
			return n, nil
		}
	}
	// "No.1" and "No.2" of a species graded as one combined "No.1/No.2".
	if k == "no1" || k == "no2" {
		for _, n := range names {
			if gradeKey(n) == "no1no2" {
				return n, nil
			}
		}
	}
	return "", unknownName("grade of "+species, name, names)
}

// unknownName builds the error for a name not in valid, suggesting the
// closest valid name by edit distance of the folded names.
func unknownName(what, got string, valid []string) error {
	best, bestD := "", math.MaxInt
	for _, v := range valid {
		if d := EditDistance(nameKey(got), nameKey(v)); d < bestD {
			best, bestD = v, d
		}
	}
	sorted := append([]string(nil), valid...)
	sort.Strings(sorted)
	msg := fmt.Sprintf("unknown %s %q; valid: %s", what, got, strings.Join(sorted, ", "))
	if best != "" {
		msg += fmt.Sprintf(" (did you mean %q?)", best)
	}
	return errors.New(msg)
}

// EditDistance is the Levenshtein distance between a and b, in bytes
// (used for "did you mean" suggestions here and in the project file).
func EditDistance(a, b string) int {
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			c := 1
			if a[i-1] == b[j-1] {
				c = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+c)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}
