package framing

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"
)

// A Callout is what a size callout on a framing plan says about the
// joists under it: `(2) 2x10 DF-L #2 @ 16" o.c. TYP.`, or, for structural
// composite lumber of the materials file, `1 3/4 x 11 7/8 LVL @ 16" o.c.`.
type Callout struct {
	Size      string  // nominal size of one ply, "2x10"; actual inches for a Material callout, "1.75x11.875"
	Plies     int     // 1, or n of a built-up member written "(n) 2x10"
	SpacingIn float64 // on-centre spacing, 0 when the callout gives none
	Species   string  // canonical species name, "" when not given
	Grade     string  // canonical grade name, "" when not given
	// Material: the size is in actual inches and the callout names its
	// material by a word after it (structural composite lumber of the
	// materials file, read through Options.MaterialCallout): Species is
	// that material as the materials file spells it, Grade the words
	// after the word ("" when none).
	Material bool

	// head is the size and material words of a size in actual inches as
	// written ("(2) 1 3/4 x 11 7/8 LVL 2.0E"), before they are read with
	// the materials (resolveMaterial); "" otherwise.
	head string
}

// Designation is the member size as the project writes it: "2x10", or
// "(2) 2x10" for a built-up member of two plies (the form of [sizing]
// beam_candidates).
func (c Callout) Designation() string {
	if c.Plies > 1 {
		return "(" + strconv.Itoa(c.Plies) + ") " + c.Size
	}
	return c.Size
}

// String writes the callout back in one canonical spelling, which
// ReadCallout reads to the same Callout.
func (c Callout) String() string {
	s := c.Designation()
	if c.Species != "" {
		s += " " + c.Species
	}
	if c.Grade != "" {
		s += " " + c.Grade
	}
	if c.SpacingIn > 0 {
		s += ` @ ` + strconv.FormatFloat(c.SpacingIn, 'f', -1, 64) + `" o.c.`
	}
	return s
}

// ErrBadCallout is the cause of every ParseCallout and ReadCallout error.
var ErrBadCallout = errors.New("size callout not read")

// A CalloutError is a label text that could not be read as a size
// callout, and why. It wraps ErrBadCallout.
type CalloutError struct {
	Text   string // the text on one line, as drawn
	Reason string // what could not be read
}

func (e *CalloutError) Error() string {
	return fmt.Sprintf("%v: %q: %s", ErrBadCallout, e.Text, e.Reason)
}

func (e *CalloutError) Unwrap() error { return ErrBadCallout }

// Callout spacing bounds, in: joists closer than 4 in on centre leave
// under 2.5 in between 2x members, and sawn joists are not laid out wider
// than 48 in (common practice, no source). A spacing outside them is a
// misread callout (a bare "2" meant as feet, a metric spacing), not a
// layout.
const (
	minCalloutSpacingIn = 4
	maxCalloutSpacingIn = 48
)

// maxPlies is the most plies a built-up member is read with: more than
// five 2x plies side by side is not a built-up joist (common practice, no
// source).
const maxPlies = 5

// ParseCallout reads a size callout and returns its member size
// (Callout.Designation: "2x10", or "(2) 2x10" for a built-up member) and
// its spacing in inches (0 when it gives only a size). See ReadCallout for
// the forms it reads.
func ParseCallout(s string) (size string, spacingIn float64, err error) {
	c, err := ReadCallout(s)
	if err != nil {
		return "", 0, err
	}
	return c.Designation(), c.SpacingIn, nil
}

// ReadCallout reads a size callout as the trade writes it, case-insensitive:
//
//	2x10 @ 16" o.c.     2X8 @ 16" O.C. TYP.     2x10 DF-L #2 @ 16"
//	(2) 2x10            2x12 16 OC              2x10 @ 1'-4" o/c
//	2x8 at 19.2 in. oc  2x10 HF No.1 @ 16 U.N.O.  2x6 SPF #2 @ 24" O.C. CJ
//
// It gives the nominal size (2 to 4 in thick, 2 to 16 in deep, no
// thinner than thick), the plies of a built-up member ("(2)", "2-",
// "DBL", "TRIPLE"), the spacing after "@" or "at", or before "o.c." (in
// inches, feet-inches or mm, 4 to 48 in), and the species and grade when
// given (DF-L, DFL, HF, SPF, SP or SYP and their full names; #2, No.2,
// No.1 & Btr, SS, Stud, ...). Trailing notes (TYP., U.N.O., FJ, CJ, RJ,
// JOISTS, RAFTERS, "SEE ...") are left out. Anything else after the size
// is an error naming it: a text that names a size is read whole or not at
// all. Metric sawn sections (90x45, 45x190) are refused with a message
// saying how to map them.
//
// A text of several lines (an MTEXT with paragraph breaks) is read line by
// line: one line gives the size; the others may add the spacing, species
// or grade, or be headings and notes. Lines giving different values are
// an error.
//
// A size in actual inches ("1 3/4 x 11 7/8 LVL @ 16", structural composite
// lumber) is named by a material of the project's materials file, which
// ReadCallout does not know: it refuses such a callout. The grouper reads
// it with Options.MaterialCallout (see MaterialCalloutFunc).
func ReadCallout(s string) (Callout, error) {
	c, err := readCallout(s)
	if err == nil && c.head != "" {
		return Callout{}, &CalloutError{flatText(s), actualSizeRefused}
	}
	return c, err
}

// ReadCalloutWith reads a callout as ReadCallout does, and also one whose
// size is in actual inches, its material named by a word after the size
// (structural composite lumber of the project's materials file):
//
//	1 3/4 x 11 7/8 LVL @ 16" o.c.    1-3/4x9-1/2 LVL @ 19.2 O.C.
//	(2) 1.75x9.5 LVL 2.0E 16 OC      1 3/4 x 14 LVL (2) @ 24" TYP.
//
// The size and the words after it, up to the spacing or the notes, are
// read by read (Options.MaterialCallout: plies "(n)" before or after the
// size, as on beam callouts; the material word; its grade after it), the
// spacing and notes as on any callout. The Callout is then a Material
// one: Size in actual inches ("1.75x11.875"), Species the material,
// Grade its grade ("" when not given). A size in actual inches with no
// word after it, a word naming no material, plies written "2-" or "DBL",
// or a sawn species or grade with it is an error; with read nil every
// size in actual inches is.
func ReadCalloutWith(s string, read MaterialCalloutFunc) (Callout, error) {
	c, err := readCallout(s)
	if err != nil {
		return c, err
	}
	return resolveMaterial(c, s, read)
}

// readCallout reads a callout as ReadCallout does, leaving a size in
// actual inches unread: its size and material words are in head, Size is
// "".
func readCallout(s string) (Callout, error) {
	t := normalizeCallout(s)
	lines := strings.Split(t, "\n")
	var c Callout
	var sizeLine string
	var firstErr error
	for _, l := range lines {
		l = strings.TrimSpace(l)
		if l == "" {
			continue
		}
		lc, hasSize, err := readCalloutLine(l)
		if err != nil {
			// A heading or general note ("BLOCKING @ MIDSPAN") above or
			// under the callout line is left out; a line that names a
			// size, or starts as a spacing does ("@ 2'-0\"", "16 OC"), and
			// cannot be read is an error.
			if hasSize || spacingLineRE.MatchString(skipNotes(l)) {
				if firstErr == nil {
					firstErr = err
				}
			}
			continue
		}
		if hasSize {
			if sizeLine != "" && (lc.Size != c.Size || lc.Plies != c.Plies || lc.head != c.head) {
				return Callout{}, &CalloutError{flatText(s), fmt.Sprintf("lines %q and %q give different sizes", sizeLine, l)}
			}
			sizeLine = l
			c.Size, c.Plies, c.head = lc.Size, lc.Plies, lc.head
		}
		if err := c.merge(lc); err != nil {
			return Callout{}, &CalloutError{flatText(s), err.Error()}
		}
	}
	if firstErr != nil {
		return Callout{}, &CalloutError{flatText(s), firstErr.Error()}
	}
	if sizeLine == "" {
		return Callout{}, &CalloutError{flatText(s), "names no size (want a form like 2x10 @ 16\" o.c.)"}
	}
	return c, nil
}

// merge adds the spacing, species and grade of o to c; two different
// values of one are an error.
func (c *Callout) merge(o Callout) error {
	for _, f := range []struct {
		name     string
		dst      *string
		src      string
		dstF     *float64
		srcF     float64
		isNumber bool
	}{
		{name: "species", dst: &c.Species, src: o.Species},
		{name: "grade", dst: &c.Grade, src: o.Grade},
		{name: "spacing", dstF: &c.SpacingIn, srcF: o.SpacingIn, isNumber: true},
	} {
		switch {
		case f.isNumber && f.srcF != 0:
			if *f.dstF != 0 && *f.dstF != f.srcF {
				return fmt.Errorf("two spacings, %g and %g in", *f.dstF, f.srcF)
			}
			*f.dstF = f.srcF
		case !f.isNumber && f.src != "":
			if *f.dst != "" && *f.dst != f.src {
				return fmt.Errorf("two %ss, %s and %s", f.name, *f.dst, f.src)
			}
			*f.dst = f.src
		}
	}
	return nil
}

// normalizeCallout folds the typographic marks CAD
// programs write (curly and prime quotes, the multiplication sign,
// no-break spaces) to plain ASCII; line breaks are kept.
func normalizeCallout(s string) string {
	s = calloutMarks.Replace(s)
	return strings.ReplaceAll(s, "''", `"`)
}

// calloutMarks are the typographic marks normalizeCallout writes plainly
// (built once: building it took longer than replacing with it).
var calloutMarks = strings.NewReplacer("”", `"`, "“", `"`, "″", `"`, "′", "'", "’", "'", "‘", "'", "×", "x",
	"\u00a0", " ", "\r\n", "\n", "\r", "\n", "\t", " ")

// flatText is s on one line with single spaces, for messages.
func flatText(s string) string { return strings.Join(strings.Fields(s), " ") }

var (
	// plies of a built-up member before the size: "(2) 2x10", "(2)-2x10",
	// "2-2x10", "DBL 2x10", "TRIPLE 2x12"
	pliesRE       = regexp.MustCompile(`(?i)^(?:\(\s*(\d+)\s*\)\s*-?\s*|(\d+)\s*-\s*|(DBL|DOUBLE|DOUBLED|TRPL|TPL|TRIPLE|TRIPLED)\.?\s+)`)
	sizeRE        = regexp.MustCompile(`(?i)^(\d+(?:\.\d+)?)\s*X\s*(\d+(?:\.\d+)?)`)
	spacingLineRE = regexp.MustCompile(`(?i)^(?:@|AT\b|\d|\.\d)`)
	anySizeRE     = regexp.MustCompile(`(?i)\d\s*X\s*\d`)
	sepRE         = regexp.MustCompile(`(?i)^[\s,;:]+`)
	atRE          = regexp.MustCompile(`(?i)^(?:@|AT\b)\s*`)
	ocRE          = regexp.MustCompile(`(?i)^\s*(?:O\s*/\s*C|O\.?\s*C)\.?`)
	ftInRE        = regexp.MustCompile(`(?i)^(\d+(?:\.\d+)?|\.\d+)\s*(?:'|FT\b\.?|FEET\b|FOOT\b)\s*-?\s*(?:(\d+(?:\.\d+)?)?(?:\s*(\d+)\s*/\s*(\d+))?\s*(?:"|''|IN\b\.?)?)?`)
	inRE          = regexp.MustCompile(`(?i)^(\d+(?:\.\d+)?|\.\d+)(?:\s+(\d+)\s*/\s*(\d+))?\s*("|''|IN\b\.?|INCH(?:ES)?\b|MM\b|CM\b)?`)
	noteWordsRE   = regexp.MustCompile(`(?i)^(?:SEE\b.*$|REF\b.*$|TYP(?:ICAL)?\b\.?|U\.?\s*N\.?\s*O\b\.?|U\.?\s*O\.?\s*N\b\.?|UNLESS\s+(?:OTHERWISE\s+)?NOTED\b|SIM(?:ILAR)?\b\.?|` +
		`[FCR]\.?\s?J\b\.?|JOISTS?\b|RAFTERS?\b|FLOOR\b|CEILING\b|ROOF\b|DECK\b|FRAMING\b|EQ\b\.?|ABOVE\b|BELOW\b|` +
		`KD(?:-?19)?\b|S-?DRY\b|S4S\b|NEW\b|\(\s*E\s*\)|\(\s*N\s*\))`)
)

// speciesForms maps the spellings of species on plans to canonical names
// (the names of NDS 2018 Supplement Tables 4A and 4B); longer forms first.
var speciesForms = []struct {
	re    *regexp.Regexp
	canon string
}{
	{regexp.MustCompile(`(?i)^DOUG(?:LAS)?[\s-]*FIR[\s-]*LARCH\b`), "Douglas Fir-Larch"},
	{regexp.MustCompile(`(?i)^DOUG(?:LAS)?[\s-]*FIR\b`), "Douglas Fir-Larch"},
	{regexp.MustCompile(`(?i)^D\.?\s?F\.?\s?-?\s?L\b\.?`), "Douglas Fir-Larch"},
	{regexp.MustCompile(`(?i)^D\.?\s?F\b\.?`), "Douglas Fir-Larch"},
	{regexp.MustCompile(`(?i)^HEM[\s-]*FIR\b`), "Hem-Fir"},
	{regexp.MustCompile(`(?i)^H\.?\s?-?\s?F\b\.?`), "Hem-Fir"},
	{regexp.MustCompile(`(?i)^SPRUCE[\s-]*PINE[\s-]*FIR\b`), "Spruce-Pine-Fir"},
	{regexp.MustCompile(`(?i)^S\.?\s?-?\s?P\.?\s?-?\s?F\b\.?`), "Spruce-Pine-Fir"},
	{regexp.MustCompile(`(?i)^SOUTHERN[\s-]*(?:YELLOW[\s-]*)?PINE\b`), "Southern Pine"},
	{regexp.MustCompile(`(?i)^S\.?\s?Y\.?\s?P\b\.?`), "Southern Pine"},
	{regexp.MustCompile(`(?i)^S\.?\s?P\b\.?`), "Southern Pine"},
}

// gradeForms maps the spellings of visual grades to canonical names
// (NDS 2018 Supplement Tables 4A and 4B); longer forms first.
var gradeForms = []struct {
	re    *regexp.Regexp
	canon string
}{
	{regexp.MustCompile(`(?i)^(?:NO\.?\s*|#\s*)1\s*/\s*(?:NO\.?\s*|#\s*)?2\b`), "No.1/No.2"},
	{regexp.MustCompile(`(?i)^(?:NO\.?\s*|#\s*)1\s*(?:&|AND)\s*(?:BTR|BETTER)\b\.?`), "No.1 & Btr"},
	{regexp.MustCompile(`(?i)^(?:NO\.?\s*|#\s*|NUMBER\s*)1\b`), "No.1"},
	{regexp.MustCompile(`(?i)^(?:NO\.?\s*|#\s*|NUMBER\s*)2\b`), "No.2"},
	{regexp.MustCompile(`(?i)^(?:NO\.?\s*|#\s*|NUMBER\s*)3\b`), "No.3"},
	{regexp.MustCompile(`(?i)^(?:SELECT\s+STRUCTURAL|SEL\.?\s*STR\.?|S\.?\s?S)\b\.?`), "Select Structural"},
	{regexp.MustCompile(`(?i)^STUD\b`), "Stud"},
}

// readCalloutLine reads one normalised line. hasSize reports whether the
// line names a size (then an error means the callout cannot be read).
func readCalloutLine(l string) (c Callout, hasSize bool, err error) {
	hasSize = anySizeRE.MatchString(l)
	bad := func(format string, args ...any) (Callout, bool, error) {
		return Callout{}, hasSize, fmt.Errorf(format, args...)
	}
	// headings and notes before the size: "FLOOR JOISTS:", "TYP."
	l = skipNotes(l)
	c.Plies = 1
	if hasSize {
		l0, pliesForm := l, ""
		if m := pliesRE.FindStringSubmatch(l); m != nil {
			rest, n := l[len(m[0]):], 0
			switch {
			case m[1] != "":
				n, _ = strconv.Atoi(m[1])
			case m[2] != "":
				if sizeRE.MatchString(rest) { // "2-2x10", not "1-3/4x11-7/8"
					n, _ = strconv.Atoi(m[2])
				}
			case strings.EqualFold(m[3], "DBL") || strings.HasPrefix(strings.ToUpper(m[3]), "DOUBLE"):
				n = 2
			default:
				n = 3
			}
			if m[1] != "" && (n < 1 || n > maxPlies) {
				return bad("%s plies: want 1 to %d", m[1], maxPlies)
			}
			if m[2] != "" && n != 0 && n > maxPlies { // "10-2x10"
				return bad("%s plies: want 1 to %d", m[2], maxPlies)
			}
			if n > 0 {
				c.Plies, l, pliesForm = n, rest, strings.TrimSpace(m[0])
			}
		}
		if a := actualSizeRE.FindString(l); a != "" {
			// structural composite lumber: the size and the material
			// words up to the spacing or notes are read with the
			// materials (resolveMaterial), as a beam callout's are
			if pliesForm != "" && !strings.HasPrefix(pliesForm, "(") {
				return bad("plies %q: write the plies of a size in actual inches as (2) before or after the size, "+
					"such as (2) 1 3/4 x 11 7/8 LVL", pliesForm)
			}
			from := len(l0) - len(l) + len(a)
			end := actualHeadEnd(l0, from)
			c.Plies, c.head, l = 1, flatText(l0[:end]), l0[end:]
		} else {
			m := sizeRE.FindStringSubmatch(l)
			if m == nil {
				return bad("the size must come first (want a form like 2x10 @ 16\" o.c.)")
			}
			size, err := calloutSize(m[1], m[2])
			if err != nil {
				return bad("%v", err)
			}
			c.Size = size
			l = l[len(m[0]):]
			if l != "" && isWordByte(l[0]) {
				return bad("%q runs into the size", firstWord(l))
			}
		}
	}
	for {
		if m := sepRE.FindString(l); m != "" {
			l = l[len(m):]
		}
		if l == "" {
			return c, hasSize, nil
		}
		if m := atRE.FindString(l); m != "" {
			rest := l[len(m):]
			sp, n, err := calloutSpacing(rest)
			if err != nil {
				return bad("%v", err)
			}
			if c.SpacingIn != 0 {
				return bad("two spacings")
			}
			c.SpacingIn = sp
			l = rest[n:]
			if m := ocRE.FindString(l); m != "" {
				l = l[len(m):]
			}
			continue
		}
		if sp, n, err := calloutSpacing(l); n > 0 {
			if m := ocRE.FindString(l[n:]); m != "" && wordEnds(l[n+len(m):]) {
				switch {
				case err != nil:
					return bad("%v", err)
				case c.SpacingIn != 0:
					return bad("two spacings")
				}
				c.SpacingIn = sp
				l = l[n+len(m):]
				continue
			}
		}
		if m := ocRE.FindString(l); m != "" && wordEnds(l[len(m):]) && c.SpacingIn != 0 {
			l = l[len(m):] // "@ 16 in o.c." read already
			continue
		}
		if canon, n := matchForm(l, speciesForms); n > 0 {
			if c.Species != "" && c.Species != canon {
				return bad("two species")
			}
			c.Species, l = canon, l[n:]
			continue
		}
		if canon, n := matchForm(l, gradeForms); n > 0 {
			if c.Grade != "" && c.Grade != canon {
				return bad("two grades")
			}
			c.Grade, l = canon, l[n:]
			continue
		}
		if m := noteWordsRE.FindString(l); m != "" && wordEnds(l[len(m):]) {
			l = l[len(m):]
			continue
		}
		if strings.HasPrefix(l, "@") {
			return bad("no spacing after @")
		}
		return bad("%q not understood (want a spacing, species, grade or a note such as TYP.)", firstWord(l))
	}
}

// skipNotes drops the headings and notes at the start of a line.
func skipNotes(l string) string {
	for {
		if m := sepRE.FindString(l); m != "" {
			l = l[len(m):]
		}
		m := noteWordsRE.FindString(l)
		if u := strings.ToUpper(m); m == "" || strings.HasPrefix(u, "SEE") || strings.HasPrefix(u, "REF") || !wordEnds(l[len(m):]) {
			return l
		}
		l = l[len(m):]
	}
}

// matchForm returns the canonical name of the first form matching at the
// start of l and the length matched, when the match ends a word.
func matchForm(l string, forms []struct {
	re    *regexp.Regexp
	canon string
}) (string, int) {
	for _, f := range forms {
		if m := f.re.FindString(l); m != "" && wordEnds(l[len(m):]) {
			return f.canon, len(m)
		}
	}
	return "", 0
}

// wordEnds reports whether rest may follow a matched word: nothing, or
// anything but a letter or digit.
func wordEnds(rest string) bool { return rest == "" || !isWordByte(rest[0]) }

func isWordByte(b byte) bool {
	return b >= 'A' && b <= 'Z' || b >= 'a' && b <= 'z' || b >= '0' && b <= '9'
}

// firstWord is the start of l up to the next space.
func firstWord(l string) string {
	if i := strings.IndexAny(l, " \t"); i > 0 {
		return l[:i]
	}
	return l
}

// actualSizeRE matches a size written in actual inches with a fraction or
// a decimal in either dimension, "1 3/4 x 9 1/2", "1-3/4x11-7/8",
// "1.75x9.5", "10x2.1": structural composite lumber or glulam, never a
// nominal sawn size (whole inches both ways).
var actualSizeRE = regexp.MustCompile(`^(?:\d+(?:[ -]\d+/\d+|\.\d+)\s*[xX×]|\d+\s*[xX×]\s*\d+(?:[ -]\d+/\d+|\.\d+))`)

// actualSizeRefused is why a callout with a size in actual inches is not
// read without the project's materials (ReadCallout, or a grouper whose
// Options have no MaterialCallout).
const actualSizeRefused = "a size in actual inches is structural composite lumber or glulam, named by a material of the " +
	"project's materials file (\"1 3/4 x 11 7/8 LVL @ 16 o.c.\"), and is read only with the project's materials"

// actualHeadEnd returns where the size and material words of a callout
// in actual inches end in line l, looking from byte from on (after the
// size's x): at "@" or "AT", at a spacing followed by o.c. ("16 OC"), or
// at a note word (TYP., U.N.O., JOISTS, SEE ...). What follows is read as
// the spacing and notes of any callout. The words before it are the
// material's name and grade: a grade such as 2.0E is not a spacing.
func actualHeadEnd(l string, from int) int {
	for i := from; i < len(l); i++ {
		if l[i] == '@' {
			return i
		}
		if l[i] == ' ' || (l[i-1] != ' ' && l[i-1] != ',' && l[i-1] != ';') {
			continue // only at the start of a word
		}
		r := l[i:]
		if atRE.MatchString(r) {
			return i
		}
		if _, n, _ := calloutSpacing(r); n > 0 {
			if m := ocRE.FindString(r[n:]); m != "" && wordEnds(r[n+len(m):]) {
				return i
			}
		}
		if m := noteWordsRE.FindString(r); m != "" && wordEnds(r[len(m):]) {
			return i
		}
	}
	return len(l)
}

// A MaterialCalloutFunc reads the size and material words of a joist
// callout in actual inches ("1 3/4 x 11 7/8 LVL", "(2) 1.75x9.5 LVL 2.0E",
// "1 3/4 x 14 LVL (2)": the callout without its spacing and notes) with
// the project's materials, as a beam callout's are read: size as the
// check names it ("1.75x11.875", "(2) 1.75x9.5"), the material as the
// materials file spells it, and its grade ("" when the callout gives
// none). err says why it cannot: no material word (a bare size in actual
// inches cannot say its material), a word naming no material of the
// file (naming the materials known), a bad size.
type MaterialCalloutFunc func(head string) (size, species, grade string, err error)

// resolveMaterial reads the size in actual inches of callout c (read by
// readCallout from text s) with read: c becomes a Material callout. Any
// failure is a CalloutError naming the text, never a default.
func resolveMaterial(c Callout, s string, read MaterialCalloutFunc) (Callout, error) {
	if c.head == "" {
		return c, nil
	}
	bad := func(reason string) (Callout, error) { return Callout{}, &CalloutError{flatText(s), reason} }
	if read == nil {
		return bad(actualSizeRefused)
	}
	if c.Species != "" || c.Grade != "" {
		return bad(fmt.Sprintf("%q is a size in actual inches, of the material named after it, and takes no sawn species "+
			"or grade (%s)", c.head, strings.TrimSpace(c.Species+" "+c.Grade)))
	}
	size, species, grade, err := read(c.head)
	if err != nil {
		return bad(err.Error())
	}
	n, ply := splitPlies(size)
	if n < 1 || ply == "" {
		return bad(fmt.Sprintf("size %q not read", size))
	}
	c.Size, c.Plies, c.Species, c.Grade, c.Material, c.head = ply, n, species, grade, true, ""
	return c, nil
}

// calloutSize checks a nominal size: dimension lumber 2-4 in thick and
// 2-16 in deep (NDS 2018 Supplement Table 1B's range; the check package
// decides which of these it has design values for). Two numbers of 19 or
// more are a metric section in mm.
func calloutSize(bs, ds string) (string, error) {
	b, errB := strconv.ParseFloat(bs, 64)
	d, errD := strconv.ParseFloat(ds, 64)
	if errB != nil || errD != nil {
		return "", fmt.Errorf("size %sx%s not read", bs, ds)
	}
	if b >= 19 && d >= 19 {
		return "", MetricSectionError(bs, ds)
	}
	if b != math.Trunc(b) || d != math.Trunc(d) {
		return "", fmt.Errorf("size %sx%s is not a nominal sawn lumber size (whole inches, such as 2x10)", bs, ds)
	}
	if b < 2 || b > 4 || d < 2 || d > 16 || d < b {
		return "", fmt.Errorf("nominal size %sx%s is not dimension lumber (2-4 x 2-16 in)", bs, ds)
	}
	return fmt.Sprintf("%dx%d", int(b), int(d)), nil
}

// MetricSectionError is the error for a metric sawn section such as 90x45
// (mm): it is not NDS dimension lumber and is not read as a nominal US
// size; the message says how to map it.
func MetricSectionError(b, d string) error {
	return fmt.Errorf("%sx%s reads as a metric sawn section (%s x %s mm), which is not NDS dimension lumber "+
		"and is not read as a nominal US size: map it to a user material with its own section and design values: "+
		"write the nominal US size whose dressed section it matches (2x4 is 38 x 89 mm, 2x8 38 x 184 mm) and give "+
		"its species' design values in a materials_file ([lumber])", b, d, b, d)
}

// calloutSpacing reads a spacing at the start of s: inches (16, 16",
// 16 in, 19.2, 13 1/2"), feet-inches (1'-4", 1' 4", 2', 1.5 ft) or
// metric (400 mm, 40 cm); it returns inches and the length read.
func calloutSpacing(s string) (float64, int, error) {
	if m := ftInRE.FindStringSubmatch(s); m != nil {
		ft, _ := strconv.ParseFloat(m[1], 64)
		in := 0.0
		if m[2] != "" {
			in, _ = strconv.ParseFloat(m[2], 64)
		}
		if m[3] != "" {
			in += fraction(m[3], m[4])
		}
		return checkSpacing(ft*12+in, strings.TrimSpace(m[0]), len(m[0]))
	}
	if m := inRE.FindStringSubmatch(s); m != nil {
		v, _ := strconv.ParseFloat(m[1], 64)
		if m[2] != "" {
			v += fraction(m[2], m[3])
		}
		switch strings.ToUpper(m[4]) {
		case "MM":
			v /= 25.4 // 1 in = 25.4 mm exactly
		case "CM":
			v /= 2.54
		}
		return checkSpacing(v, strings.TrimSpace(m[0]), len(m[0]))
	}
	return 0, 0, fmt.Errorf("no spacing read at %q (want a form like @ 16\" o.c. or @ 1'-4\")", firstWord(s))
}

func fraction(n, d string) float64 {
	a, _ := strconv.ParseFloat(n, 64)
	b, _ := strconv.ParseFloat(d, 64)
	if b == 0 {
		return math.NaN()
	}
	return a / b
}

func checkSpacing(in float64, text string, n int) (float64, int, error) {
	if !(in >= minCalloutSpacingIn && in <= maxCalloutSpacingIn) {
		if _, err := strconv.ParseFloat(text, 64); err != nil {
			text += " (" + strconv.FormatFloat(in, 'g', 4, 64) + " in)"
		} else {
			text += " in"
		}
		return 0, n, fmt.Errorf("spacing %s is outside %d-%d in", text, minCalloutSpacingIn, maxCalloutSpacingIn)
	}
	return in, n, nil
}
