package export

import (
	"html/template"
	"regexp"
	"strings"
)

// The calculation is printed as an engineer writes it: NDS symbols with
// their subscripts (F′b, Fc⊥, CD, ℓu), Δ for a deflection, √ and
// powers as ², ³, ⁴. The engine's plain names (Fb', Fc_perp, delta_allow,
// sqrt, ^2) stay in results.json; the report translates them here.

// symbolHTML maps the engine's symbol names to their written form, as
// base and subscript (NDS 2018 notation, Section 3 and Table 4.3.1).
var symbolHTML = map[string][2]string{
	"delta": {"Δ", ""}, "delta_allow": {"Δ", "allow"},
	"fb": {"f", "b"}, "fv": {"f", "v"}, "fc_perp": {"f", "c⊥"},
	"Fb": {"F", "b"}, "Fv": {"F", "v"}, "Fc_perp": {"F", "c⊥"}, "FbE": {"F", "bE"},
	"Emin": {"E", "min"}, "CD": {"C", "D"}, "CM": {"C", "M"}, "Ct": {"C", "t"}, "CF": {"C", "F"},
	"Ci": {"C", "i"}, "Cr": {"C", "r"}, "CL": {"C", "L"}, "Cfu": {"C", "fu"}, "Cb": {"C", "b"},
	"Kcr": {"K", "cr"}, "RB": {"R", "B"}, "lu": {"ℓ", "u"}, "le": {"ℓ", "e"}, "lb": {"ℓ", "b"},
	"Lc": {"L", "c"},
	// the beam a member bears on (check.SupportBeam)
	"Cb_beam": {"C", "b,beam"}, "Fc_perp_beam": {"F", "c⊥,beam"},
}

// reIdent is a symbol: letters, digits and underscores starting with a
// letter, with an optional prime or star after it.
var reIdent = regexp.MustCompile(`[A-Za-z][A-Za-z0-9_]*['*]?`)

// powers are the exponents written as superscript characters.
var powers = strings.NewReplacer("^2", "²", "^3", "³", "^4", "⁴", "sqrt(", "√(")

// mathHTML writes s (a symbol name or a formula) with the symbols in their
// written form, subscripts as <sub>; a prime goes before the subscript
// (F′b, as NDS 2018 writes adjusted values). Any other name with an
// underscore gets what follows it as a subscript (w_D: wD).
func mathHTML(s string) template.HTML {
	s = powers.Replace(s)
	var b strings.Builder
	last := 0
	for _, loc := range reIdent.FindAllStringIndex(s, -1) {
		b.WriteString(template.HTMLEscapeString(s[last:loc[0]]))
		last = loc[1]
		tok := s[loc[0]:loc[1]]
		mark := ""
		switch {
		case strings.HasSuffix(tok, "'"):
			tok, mark = tok[:len(tok)-1], "′"
		case strings.HasSuffix(tok, "*"):
			tok, mark = tok[:len(tok)-1], "*"
		}
		base, sub := tok, ""
		if m, ok := symbolHTML[tok]; ok {
			base, sub = m[0], m[1]
		} else if i := strings.Index(tok, "_"); i > 0 && i < len(tok)-1 {
			base, sub = tok[:i], strings.ReplaceAll(tok[i+1:], "_", " ")
		}
		b.WriteString(template.HTMLEscapeString(base))
		if mark == "′" {
			b.WriteString(mark)
		}
		if sub != "" {
			b.WriteString("<sub>" + template.HTMLEscapeString(sub) + "</sub>")
		}
		if mark == "*" {
			b.WriteString(mark)
		}
	}
	b.WriteString(template.HTMLEscapeString(s[last:]))
	return template.HTML(b.String())
}

// numHTML writes a substitution or a unit: only √ and the powers change.
func numHTML(s string) template.HTML {
	return template.HTML(template.HTMLEscapeString(powers.Replace(s)))
}

// reTags strips tags, for the plain text of mathHTML (tests, titles).
var reTags = regexp.MustCompile(`<[^>]+>`)

// mathText is the text mathHTML shows, without its tags.
func mathText(s string) string { return reTags.ReplaceAllString(string(mathHTML(s)), "") }
