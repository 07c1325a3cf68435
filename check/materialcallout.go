package check

import (
	"fmt"
	"regexp"
	"strconv"
	"strings"
	"unicode"
)

// MaterialCallout is a beam callout that names its material by a word
// after a size in actual inches: "3 1/2 x 11 7/8 LVL", "1 3/4 x 11 7/8
// LVL (2)", "(2) 1.75x11.875 LVL 2.0E". The word is a user material's
// name (structural composite lumber, as the materials file spells it);
// any words after it are its grade.
type MaterialCallout struct {
	Size     string // the section as ParseSize names it: "3.5x11.875", "(2) 1.75x11.875"
	Plies    int    // 0 or 1: one piece
	Material string // the material word as written
	Grade    string // the words after it, "" when none
}

var (
	leadPliesRE  = regexp.MustCompile(`^\(\s*(\d+)\s*\)\s*-?\s*`)
	trailPliesRE = regexp.MustCompile(`\s*\(\s*(\d+)\s*\)\s*$`)
)

// materialMarks are the typographic marks ParseMaterialCallout reads as
// plain ones (built once).
var materialMarks = strings.NewReplacer("×", "x", "”", `"`, "″", `"`, "\u00a0", " ")

// ParseMaterialCallout reads a callout of a size in actual inches followed
// by a material word. ok is false when text is not of that form (no
// material word, or a size that is not in actual inches, such as the
// sawn "(3) 2x12"); err reports a form that is meant so but cannot be
// read (a bad size, plies given twice).
func ParseMaterialCallout(text string) (c MaterialCallout, ok bool, err error) {
	s := strings.TrimSpace(materialMarks.Replace(text))
	plies := 0
	if m := leadPliesRE.FindStringSubmatch(s); m != nil {
		plies, _ = strconv.Atoi(m[1])
		s = s[len(m[0]):]
	}
	if m := trailPliesRE.FindStringSubmatch(s); m != nil {
		if plies > 0 {
			return c, true, fmt.Errorf("callout %q: plies given twice", text)
		}
		plies, _ = strconv.Atoi(m[1])
		s = s[:len(s)-len(m[0])]
	}
	// The size is everything before the first word that starts with a
	// letter and is not the "x" between the dimensions.
	fields := strings.Fields(s)
	k := -1
	for i, f := range fields {
		r := []rune(f)[0]
		if unicode.IsLetter(r) && !strings.EqualFold(f, "x") && !isDimWithX(f) {
			k = i
			break
		}
	}
	if k <= 0 {
		return c, false, nil
	}
	size := strings.Join(fields[:k], " ")
	if !strings.ContainsAny(size, "./") {
		return c, false, nil // a nominal size: sawn lumber, read elsewhere
	}
	if plies > 1 {
		size = "(" + strconv.Itoa(plies) + ") " + size
	}
	sec, err := ParseSize(size)
	if err != nil {
		return c, true, fmt.Errorf("callout %q: %w", text, err)
	}
	if !sec.Actual {
		return c, false, nil
	}
	return MaterialCallout{Size: sec.Name, Plies: sec.Plies, Material: fields[k], Grade: strings.Join(fields[k+1:], " ")}, true, nil
}

// isDimWithX reports a token such as "x11" or "X11-7/8": the x written
// against the depth.
func isDimWithX(f string) bool {
	if len(f) < 2 || (f[0] != 'x' && f[0] != 'X') {
		return false
	}
	return f[1] >= '0' && f[1] <= '9'
}

// BeamMaterial resolves the material name of a beam (a [[support]]
// material, or a callout's material word) to the species and grade
// Lookup takes: a structural composite lumber user material of m (grade
// as given, "" for its only grade), or a glulam stress class of NDS 2018
// Supplement Table 5A. Any other name is an error that names it and the
// materials known; never a default.
func (m *Materials) BeamMaterial(name, grade string) (species, gr string, err error) {
	if sp, ok := m.IsSCL(name); ok {
		return sp, grade, nil
	}
	if _, err := glulamValues(name); err == nil {
		return GlulamSpecies, name, nil
	}
	_, err = m.SCLMaterial(name)
	return "", "", fmt.Errorf("%v (glulam is named by its stress class, such as 24F-1.8E)", err)
}

// SCLMaterial resolves name (a joist or beam callout's material word,
// matched as IsSCL matches it, case and punctuation aside) to a
// structural composite lumber user material of m, as the materials file
// spells it. Any other name is an error that names it and the structural
// composite lumber known; never a default.
func (m *Materials) SCLMaterial(name string) (string, error) {
	if sp, ok := m.IsSCL(name); ok {
		return sp, nil
	}
	return "", fmt.Errorf("material %q names no user material; the structural composite lumber known is %s", name, m.SCLKnown())
}

// SCLKnown lists the SCL user materials of m for messages, or says how to
// give one when there is none.
func (m *Materials) SCLKnown() string {
	if names := m.SCLNames(); len(names) > 0 {
		return strings.Join(names, ", ")
	}
	return "none: give structural composite lumber as rows of a [lumber] materials_file with size_factor \"SCL n\""
}

// ReadSCLCallout reads the size and material words of a joist callout in
// actual inches (framing.Options.MaterialCallout; the callout without
// its spacing and notes): "1 3/4 x 11 7/8 LVL", "(2) 1.75x9.5 LVL 2.0E",
// "1 3/4 x 14 LVL (2)". The words are read as a beam callout's are
// (ParseMaterialCallout: the size, plies "(n)" before or after it, the
// material word, the grade after it) and the word must name a structural
// composite lumber row of m (SCLMaterial, case and punctuation aside).
// size is as ParseSize names it ("1.75x11.875", "(2) 1.75x9.5"), species
// the material as the materials file spells it, grade the words after it
// ("" when none). A size alone, or a word naming no such material, is an
// error naming the materials known: a size in actual inches cannot say
// its material, and no default is taken.
func (m *Materials) ReadSCLCallout(head string) (size, species, grade string, err error) {
	mc, ok, err := ParseMaterialCallout(head)
	switch {
	case ok && err != nil:
		return "", "", "", err
	case !ok:
		example := "LVL"
		if names := m.SCLNames(); len(names) > 0 {
			example = names[0]
		}
		return "", "", "", fmt.Errorf("%q is a size in actual inches with no material after it, and a size in actual inches "+
			"cannot say its material: write the name of a structural composite lumber of the materials file after the size, "+
			"such as %s %s; the structural composite lumber known is %s", head, head, example, m.SCLKnown())
	}
	if sec, err := ParseSize(mc.Size); err != nil || !sec.Actual {
		// "7.0 x 14.0": whole inches both ways are named "7x14", which
		// reads back as a nominal size
		return "", "", "", fmt.Errorf("%q: the size in actual inches is whole inches both ways (%s), which framecheck "+
			"cannot tell from a nominal size; check these joists by hand", head, mc.Size)
	}
	sp, err := m.SCLMaterial(mc.Material)
	if err != nil {
		if glulamWordRE.MatchString(head) {
			err = fmt.Errorf("%v; glulam (named by its stress class, such as 5 1/8 x 12 GLB 24F-1.8E) is read on beam "+
				"callouts, not on joists", err)
		}
		return "", "", "", fmt.Errorf("the word %q: %v", mc.Material, err)
	}
	return mc.Size, sp, mc.Grade, nil
}

// glulamWordRE finds the words of a glulam callout: GLB, GLULAM or a
// stress class such as 24F-1.8E (NDS 2018 Supplement Table 5A's names).
var glulamWordRE = regexp.MustCompile(`(?i)\b(?:GLB|GLULAM)\b|\b\d{2}F-\d\.\dE\b`)
