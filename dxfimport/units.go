package dxfimport

import (
	"fmt"
	"strings"
)

// unitInfo is one drawing unit: its $INSUNITS code, the name used in
// Drawing.Units and Options.Units, and its length in inches.
type unitInfo struct {
	Code   int
	Name   string
	ToInch float64
}

// unitTable lists the drawing units the reader converts. Codes are those
// of the $INSUNITS header variable in the DXF Reference (Autodesk, "HEADER
// Section Group Codes"; ezdxf's units.py uses the same numbering). Factors
// are exact by the definition of the inch (1 in = 25.4 mm, international
// yard and pound agreement, 1959).
var unitTable = []unitInfo{
	{1, "in", 1},
	{2, "ft", 12},
	{4, "mm", 1 / 25.4},
	{5, "cm", 10 / 25.4},
	{6, "m", 1000 / 25.4},
}

// UnitsFromHeader reports whether the drawing's units were taken from its
// $INSUNITS (a code this reader knows), rather than given by the caller or
// assumed.
func (d *Drawing) UnitsFromHeader() bool {
	u, ok := unitByCode(d.InsUnits)
	return ok && u.Name == d.Units
}

func unitByName(name string) (unitInfo, bool) {
	n := strings.ToLower(strings.TrimSpace(name))
	for _, u := range unitTable {
		if u.Name == n {
			return u, true
		}
	}
	return unitInfo{}, false
}

func unitByCode(code int) (unitInfo, bool) {
	for _, u := range unitTable {
		if u.Code == code {
			return u, true
		}
	}
	return unitInfo{}, false
}

// checkUnits validates Options.Units.
func checkUnits(name string) error {
	if name == "" {
		return nil
	}
	if _, ok := unitByName(name); !ok {
		return fmt.Errorf("dxfimport: %w %q (want in, ft, mm, cm or m)", ErrUnits, name)
	}
	return nil
}

// fixUnits decides the drawing units once: Options.Units wins, then a
// known $INSUNITS; otherwise inches are assumed and an issue says so.
func (r *reader) fixUnits() {
	if r.unitsFixed {
		return
	}
	r.unitsFixed = true
	d := r.d
	pos := Pos{File: d.File, Line: r.insUnitsLine}
	if r.opt.Units != "" {
		u, _ := unitByName(r.opt.Units)
		d.Units, d.ToInch = u.Name, u.ToInch
		if h, ok := unitByCode(d.InsUnits); ok && h.Name != u.Name {
			d.Issues.Add(pos, "DXF109", SevInfo,
				"$INSUNITS says %s; read as %s as the caller asked", h.Name, u.Name)
		}
		return
	}
	if u, ok := unitByCode(d.InsUnits); ok {
		d.Units, d.ToInch = u.Name, u.ToInch
		return
	}
	d.ToInch = 1
	var why string
	switch {
	case !r.sawInsUnits:
		why = "the header has no $INSUNITS"
	case d.InsUnits == 0:
		why = "$INSUNITS is 0 (unitless)"
	default:
		why = fmt.Sprintf("$INSUNITS is %d, a unit this reader does not convert", d.InsUnits)
	}
	d.Issues.Add(pos, "DXF101", SevWarning,
		"%s: coordinates read as inches (a guess; Units left empty); give --units in|ft|mm|cm|m if that is wrong", why)
}
