package export

import (
	"math"
	"reflect"
	"strconv"
	"strings"
)

// numRule is how results.json (schema 3) writes a number: see json_num.go
// and docs/RESULTS-SCHEMA.md "Numbers".
type numRule int

const (
	ruleNum   numRule = iota // 6 significant digits, no finer than 1e-6 (appendNum)
	ruleSig                  // 6 significant digits (calculations: checks, traces, factors)
	ruleCoord                // plan coordinates: 6 decimal places of the drawing unit
	ruleFixed                // quantities summed for ordering (board feet): 6 decimal places
)

// sigTypes are the types written as the calculations are (ruleSig): their
// traces hold small coefficients that the 1e-6 floor would lose.
var sigTypes = map[reflect.Type]bool{
	reflect.TypeOf(Check{}): true, reflect.TypeOf(CalcCheck{}): true, reflect.TypeOf(TraceItem{}): true,
}

// coordKeys are the JSON names of plan coordinates ([x, y] in drawing
// units) outside the members.
var coordKeys = map[string]bool{"start": true, "end": true, "point": true, "at": true}

// roundRule returns the rule for the field named name (JSON) of type t,
// inside a value written with rule in.
func roundRule(in numRule, name string, t reflect.Type) numRule {
	switch {
	case in == ruleSig || sigTypes[t]:
		return ruleSig
	case coordKeys[name] && t.Kind() == reflect.Array:
		return ruleCoord
	case strings.HasSuffix(name, "board_feet"):
		return ruleFixed
	}
	return ruleNum
}

// roundFloat returns v as rule r writes it, read back.
func roundFloat(v float64, r numRule) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	switch r {
	case ruleSig:
		return round6(v)
	case ruleCoord:
		return roundPlanCoord(v)
	case ruleFixed:
		if math.Abs(v) >= 1e15 {
			return round6(v)
		}
		var tmp [40]byte
		f, err := strconv.ParseFloat(string(appendFixed(tmp[:0], v, LenDecimals)), 64)
		if err != nil {
			return v
		}
		return f
	}
	return roundNum(v)
}

// roundedCopy returns a copy of v (a struct, slice, ...) with every float
// that reaches the JSON rounded as results.json writes it (schema 3), so
// that encoding/json writes the copy with the digits the numbers carry.
// Slices are copied only when they hold a float; v itself is not modified.
func roundedCopy(v any) any {
	rv := reflect.ValueOf(v)
	out, _ := roundValue(rv, ruleNum)
	return out.Interface()
}

// roundValue returns v with its floats rounded under rule r, and whether
// anything was copied.
func roundValue(v reflect.Value, r numRule) (reflect.Value, bool) {
	switch v.Kind() {
	case reflect.Float64, reflect.Float32:
		f := v.Float()
		g := roundFloat(f, r)
		if g == f && !(f == 0 && math.Signbit(f)) {
			return v, false
		}
		nv := reflect.New(v.Type()).Elem()
		nv.SetFloat(g + 0) // -0 written as 0
		return nv, true
	case reflect.Pointer:
		if v.IsNil() {
			return v, false
		}
		e, changed := roundValue(v.Elem(), r)
		if !changed {
			return v, false
		}
		p := reflect.New(v.Type().Elem())
		p.Elem().Set(e)
		return p, true
	case reflect.Struct:
		var cp reflect.Value
		t := v.Type()
		for _, fi := range jsonFields(t) {
			sf := t.Field(fi.Index)
			nv, changed := roundValue(v.Field(fi.Index), roundRule(r, fi.Name, sf.Type))
			if changed {
				if !cp.IsValid() {
					cp = reflect.New(t).Elem()
					cp.Set(v)
				}
				cp.Field(fi.Index).Set(nv)
			}
		}
		if cp.IsValid() {
			return cp, true
		}
	case reflect.Slice, reflect.Array:
		er := r
		if sigTypes[v.Type().Elem()] {
			er = ruleSig
		}
		if cp, ok := mapElems(v, func(i int) (reflect.Value, bool) { return roundValue(v.Index(i), er) }); ok {
			return cp, true
		}
	}
	return v, false
}

// mapElems returns the slice or array v with each element i for which f
// says it changed replaced by f's value, copying v only when one did; v
// itself and false when none did.
func mapElems(v reflect.Value, f func(i int) (reflect.Value, bool)) (reflect.Value, bool) {
	var cp reflect.Value
	for i := 0; i < v.Len(); i++ {
		nv, changed := f(i)
		if !changed {
			continue
		}
		if !cp.IsValid() {
			if v.Kind() == reflect.Slice {
				cp = reflect.MakeSlice(v.Type(), v.Len(), v.Len())
				reflect.Copy(cp, v)
			} else {
				cp = reflect.New(v.Type()).Elem()
				cp.Set(v)
			}
		}
		cp.Index(i).Set(nv)
	}
	if cp.IsValid() {
		return cp, true
	}
	return v, false
}
