package check

import (
	"errors"
	"fmt"
	"strconv"
	"strings"
)

// Section is a rectangular sawn-lumber cross-section: its nominal size and
// its dressed (actual) dimensions, with the properties computed from them.
type Section struct {
	Name       string  // "2x10"
	NominalBIn float64 // nominal thickness, 2, 3 or 4
	NominalDIn float64 // nominal width (depth as a joist), 4 to 16
	BIn        float64 // dressed thickness b
	DIn        float64 // dressed width d
	AreaIn2    float64 // A = b d
	SIn3       float64 // Sxx = b d^2 / 6
	IIn4       float64 // Ixx = b d^3 / 12
	// Timber: a timber 5 in and thicker (NDS 2018 Supplement Table 4D):
	// beams and stringers when d > b + 2 (nominal), posts and timbers
	// otherwise.
	Timber bool
	// Actual: the dimensions are the member's own (glulam "5.125x12",
	// structural composite lumber "3.5x11.875"), not a nominal size; then
	// NominalBIn and NominalDIn hold them too.
	Actual bool
	// Plies is the number of plies of a built-up member (2 to 4), 0 for a
	// single piece. NominalBIn stays the ply's (the size factor is the
	// ply's); BIn, AreaIn2, SIn3 and IIn4 are the whole member's.
	Plies int
}

// MemberNominalBIn is the nominal thickness of the whole member: plies
// times the ply's.
func (s Section) MemberNominalBIn() float64 {
	if s.Plies > 1 {
		return float64(s.Plies) * s.NominalBIn
	}
	return s.NominalBIn
}

// dressedThicknessIn gives the dressed thickness of each nominal thickness,
// and dressedWidthIn the dressed width of each nominal width, for dry
// dimension lumber (NDS 2018 Supplement Table 1A, standard dressed sizes S4S,
// the dimensions Table 1B is computed from). Thicknesses and nominal widths
// of 6 in and less dress 1/2 in smaller, wider ones 3/4 in smaller. Checked
// against the dry dressed sizes of NDS 2018 Supplement Table 1A as coded in
// xcfem/xc python_modules/materials/awc_nds/dimensional_lumber.py
// (getDressedThickness, getDressedWidth): agrees.
var (
	dressedThicknessIn = map[int]float64{2: 1.5, 3: 2.5, 4: 3.5}
	dressedWidthIn     = map[int]float64{4: 3.5, 5: 4.5, 6: 5.5, 8: 7.25, 10: 9.25, 12: 11.25, 14: 13.25, 16: 15.25}
)

// NewSection returns the Section of nominal size bNom x dNom (2, 3 or 4 by
// 4, 5, 6, 8, 10, 12, 14 or 16), with A, S and I computed from the dressed
// dimensions as NDS 2018 Supplement Table 1B does.
func NewSection(bNom, dNom int) (Section, error) {
	b, okB := dressedThicknessIn[bNom]
	d, okD := dressedWidthIn[dNom]
	if !okB || !okD {
		return Section{}, fmt.Errorf("size %dx%d: want a nominal 2x, 3x or 4x from 4 to 16 in deep (4, 5, 6, 8, 10, 12, 14, 16)", bNom, dNom)
	}
	return Section{
		Name:       strconv.Itoa(bNom) + "x" + strconv.Itoa(dNom),
		NominalBIn: float64(bNom),
		NominalDIn: float64(dNom),
		BIn:        b,
		DIn:        d,
		AreaIn2:    b * d,
		SIn3:       b * d * d / 6,
		IIn4:       b * d * d * d / 12,
	}, nil
}

// ErrBuiltUp is the cause of ParseSize's error for a built-up member it
// cannot read: more than 4 plies, or plies thicker than 2x.
var ErrBuiltUp = errors.New("built-up member not checked")

// maxPlies bounds a built-up member: nailed or bolted members of 2 to 4
// plies of 2x lumber are common practice (no source); more is refused.
const maxPlies = 4

// ErrMetricSection is the cause of ParseSize's error for a metric sawn
// section such as 90x45 (mm), which is not NDS dimension lumber.
var ErrMetricSection = errors.New("metric sawn section, not NDS dimension lumber")

// ParseSize reads a nominal size such as "2x10", "2X10", "2 x 12" or
// "3x12" and returns its Section (NDS 2018 Supplement Table 1B). A
// built-up size "(2) 2x10" is an error wrapping ErrBuiltUp ("(1) 2x10" is
// 2x10); a metric section such as "90x45" or "45x190" (two numbers of 19
// or more: mm) is an error wrapping ErrMetricSection that says how to map
// it, never read as a nominal US size.
func ParseSize(s string) (Section, error) {
	if sec, ok := parseSizeFast(s); ok {
		return sec, nil
	}
	if strings.ContainsAny(s, "./") && !strings.Contains(s, "(") {
		return parseActual(s)
	}
	if rest, ok := strings.CutPrefix(strings.TrimSpace(s), "("); ok && strings.ContainsAny(s, "./") {
		return parseActualPlies(s, rest)
	}
	t := strings.ToLower(strings.Join(strings.Fields(s), ""))
	t = strings.ReplaceAll(t, "×", "x")
	if rest, ok := strings.CutPrefix(t, "("); ok {
		n, ply, ok := strings.Cut(rest, ")")
		plies, err := strconv.Atoi(n)
		if !ok || err != nil || plies < 1 {
			return Section{}, fmt.Errorf("size %q: want a nominal size such as 2x10, or (n) 2x10 for n plies", s)
		}
		sec, err := ParseSize(strings.TrimPrefix(ply, "-"))
		switch {
		case err != nil:
			return Section{}, err
		case plies > 1 && (plies > maxPlies || sec.NominalBIn != 2):
			return Section{}, fmt.Errorf("size %q: %w: built-up members of 2 to %d plies of 2x lumber are checked; %d plies of %s are not, "+
				"and are not checked as one ply either; check it by hand", s, ErrBuiltUp, maxPlies, plies, sec.Name)
		case plies > 1:
			return builtUp(sec, plies), nil
		}
		return sec, nil
	}
	parts := strings.Split(t, "x")
	if len(parts) != 2 {
		return Section{}, fmt.Errorf("size %q: want nominal thickness x depth, such as 2x10", s)
	}
	b, errB := strconv.Atoi(parts[0])
	d, errD := strconv.Atoi(parts[1])
	if bf, df, ok := metricPair(parts[0], parts[1]); ok {
		return Section{}, fmt.Errorf("size %q: %w: %g x %g mm is not read as a nominal US size; map it to a user material "+
			"with its own section and design values: write the nominal US size whose dressed section it matches (2x4 is "+
			"38 x 89 mm, 2x8 38 x 184 mm) and give its species' design values in a materials_file ([lumber])", s, ErrMetricSection, bf, df)
	}
	if errB != nil || errD != nil {
		return Section{}, fmt.Errorf("size %q: want nominal thickness x depth in whole inches, such as 2x10", s)
	}
	if b >= 5 && b <= 16 && d >= b && d <= 24 {
		return timberSection(b, d), nil
	}
	sec, err := NewSection(b, d)
	if err != nil {
		return Section{}, fmt.Errorf("size %q: %w", s, err)
	}
	return sec, nil
}

// parseActual reads a size in actual inches, with decimals or fractions:
// "5.125x12", "5 1/8 x 12", "5-1/8 x 12", "3 1/2 x 11 7/8" (glulam and
// structural composite lumber are sized so). Its name is written with
// decimals: "5.125x12".
func parseActual(s string) (Section, error) {
	t := strings.ReplaceAll(strings.ToLower(s), "×", "x")
	parts := strings.Split(t, "x")
	bad := fmt.Errorf("size %q: want actual inches such as 5.125x12 or 5 1/8 x 12, or a nominal size such as 2x10", s)
	if len(parts) != 2 {
		return Section{}, bad
	}
	b, okB := parseInches(parts[0])
	d, okD := parseInches(parts[1])
	if !okB || !okD || b < 0.75 || d < 2 || b > 24 || d > 96 {
		return Section{}, bad
	}
	name := strconv.FormatFloat(b, 'f', -1, 64) + "x" + strconv.FormatFloat(d, 'f', -1, 64)
	return Section{Name: name, NominalBIn: b, NominalDIn: d, BIn: b, DIn: d, AreaIn2: b * d, SIn3: b * d * d / 6,
		IIn4: b * d * d * d / 12, Actual: true}, nil
}

// maxActualPlyIn is the thickest ply of a built-up member sized in actual
// inches: structural composite lumber is built up of 1 3/4 in plies, or
// 3 1/2 in (common practice, no source).
const maxActualPlyIn = 3.5

// parseActualPlies reads a built-up member of plies sized in actual
// inches, "(2) 1.75x11.875" or "(2) 1 3/4 x 11 7/8" (rest is s after its
// "("): 2 to 4 plies, each at most 3 1/2 in thick. Which materials may be
// built up so is the engine's to say (structural composite lumber).
func parseActualPlies(s, rest string) (Section, error) {
	n, ply, ok := strings.Cut(rest, ")")
	plies, err := strconv.Atoi(strings.TrimSpace(n))
	if !ok || err != nil || plies < 1 {
		return Section{}, fmt.Errorf("size %q: want (n) b x d for n plies, such as (2) 1.75x11.875", s)
	}
	sec, err := parseActual(strings.TrimPrefix(strings.TrimSpace(ply), "-"))
	switch {
	case err != nil:
		return Section{}, err
	case plies > 1 && (plies > maxPlies || sec.BIn > maxActualPlyIn):
		return Section{}, fmt.Errorf("size %q: %w: built-up members of 2 to %d plies, each at most %g in thick, are checked; "+
			"%d plies of %s are not; check it by hand", s, ErrBuiltUp, maxPlies, maxActualPlyIn, plies, sec.Name)
	case plies > 1:
		return builtUp(sec, plies), nil
	}
	return sec, nil
}

// parseInches reads "5.125", "5 1/8", "5-1/8", "7/8" or "12".
func parseInches(s string) (float64, bool) {
	s = strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(s), "\""))
	whole, frac := s, ""
	if i := strings.IndexAny(s, " -"); i > 0 && strings.Contains(s[i:], "/") {
		whole, frac = strings.TrimSpace(s[:i]), strings.TrimSpace(s[i+1:])
	} else if strings.Contains(s, "/") {
		whole, frac = "0", s
	}
	w, err := strconv.ParseFloat(whole, 64)
	if err != nil || w < 0 {
		return 0, false
	}
	if frac != "" {
		n, dn, ok := strings.Cut(frac, "/")
		a, e1 := strconv.Atoi(n)
		c, e2 := strconv.Atoi(dn)
		if !ok || e1 != nil || e2 != nil || c <= 0 || a < 0 || a >= c {
			return 0, false
		}
		w += float64(a) / float64(c)
	}
	return w, true
}

// timberSection returns the section of a timber 5 in and thicker, nominal
// b x d: dressed 1/2 in smaller each way (NDS 2018 Supplement Table 1A,
// timbers, dry or green S4S; from memory: verify). Timber is true.
func timberSection(b, d int) Section {
	bi, di := float64(b)-0.5, float64(d)-0.5
	return Section{Name: strconv.Itoa(b) + "x" + strconv.Itoa(d), NominalBIn: float64(b), NominalDIn: float64(d),
		BIn: bi, DIn: di, AreaIn2: bi * di, SIn3: bi * di * di / 6, IIn4: bi * di * di * di / 12, Timber: true}
}

// builtUp returns the section of n plies of ply fastened side by side,
// acting as one member of width n b (common practice, no source: the NDS
// gives no rule of its own for built-up beams; its built-up column rules
// are NDS 2018 15.3). The ply's nominal size stays for the size factor.
func builtUp(ply Section, n int) Section {
	k := float64(n)
	s := ply
	s.Name = "(" + strconv.Itoa(n) + ") " + ply.Name
	s.Plies = n
	s.BIn, s.AreaIn2, s.SIn3, s.IIn4 = k*ply.BIn, k*ply.AreaIn2, k*ply.SIn3, k*ply.IIn4
	return s
}

// metricPair reports whether b x d reads as a metric sawn section in mm:
// both numbers 19 or more (19 mm is the thinnest metric sawn thickness in
// use, and no nominal US dimension is over 16; common practice, no
// source).
func metricPair(b, d string) (float64, float64, bool) {
	bf, errB := strconv.ParseFloat(b, 64)
	df, errD := strconv.ParseFloat(d, 64)
	return bf, df, errB == nil && errD == nil && bf >= 19 && df >= 19 && bf < 1e6 && df < 1e6
}

// parseSizeFast reads the plain spellings "2x10" and "2X10" without
// allocating; anything else goes the long way.
func parseSizeFast(s string) (Section, bool) {
	if len(s) < 3 || len(s) > 4 || s[0] < '2' || s[0] > '4' || (s[1] != 'x' && s[1] != 'X') {
		return Section{}, false
	}
	d := 0
	for i := 2; i < len(s); i++ {
		if s[i] < '0' || s[i] > '9' {
			return Section{}, false
		}
		d = 10*d + int(s[i]-'0')
	}
	sec, err := NewSection(int(s[0]-'0'), d)
	return sec, err == nil
}

// BoardFeetPerFt is the board measure of one foot of the nominal section:
// nominal b x nominal d / 12.
func (s Section) BoardFeetPerFt() float64 { return s.NominalBIn * s.NominalDIn / 12 }
