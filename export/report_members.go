package export

import (
	"html/template"
	"math"
	"strconv"
)

// memberData returns the details the panel shows, as a JavaScript object
// literal (valid JSON):
//
//	{"kinds": [check kinds], "text": [strings],
//	 "g": [[mark, size, spans, max ratio, governing, status, [ratio per kind]], ...],
//	 "m": [[group, id, handle], ...]}
//
// Members alike (same mark, size, spans, ratios and status) share one
// entry of g; mark, size and spans are indexes into text, governing an
// index into kinds or -1, status "p", "f" or "e", and the ratios follow
// kinds, null where a check is absent or not finite. A member's entry of m
// leaves out its id when it is the previous member's id with the number
// one up (M7 after M6) and its handle when it is the previous handle plus
// one in hexadecimal (2B after 2A; "" after ""); an id left out while the
// handle is given is written 0. On a plan of 100,000 joists most members
// are [group], about 6 bytes.
func memberData(r *Results) template.JS {
	js := make([]byte, 0, 256+len(r.Members)*8)
	js = append(js, `{"kinds":[`...)
	kindIdx := make(map[string]int, len(CheckKinds))
	for i, k := range CheckKinds {
		kindIdx[k] = i
		if i > 0 {
			js = append(js, ',')
		}
		js = appendJSString(js, k)
	}
	var texts []string
	textIdx := map[string]int{}
	intern := func(s string) int {
		if i, ok := textIdx[s]; ok {
			return i
		}
		textIdx[s] = len(texts)
		texts = append(texts, s)
		return len(texts) - 1
	}
	var groups []byte
	groupIdx := map[string]int{}
	var entry []byte
	body := make([]byte, 0, len(r.Members)*8)
	ratios := make([]float64, len(CheckKinds))
	prevID, prevHandle := "", ""
	gi := -1
	for i := range r.Members {
		m := &r.Members[i]
		if i > 0 && sameGroup(&r.Members[i-1], m) {
			// the entry is the previous member's (a run's members
			// mostly are): not built again
			writeMemberRef(&body, i, gi, m, prevID, prevHandle)
			prevID, prevHandle = m.ID, m.Handle
			continue
		}
		entry = append(entry[:0], '[')
		entry = strconv.AppendInt(entry, int64(intern(m.Mark)), 10)
		entry = append(entry, ',')
		entry = strconv.AppendInt(entry, int64(intern(m.Size+" "+m.Species+" "+m.Grade)), 10)
		entry = append(entry, ',')
		entry = strconv.AppendInt(entry, int64(intern(spansKey(m.SpansIn, m.OverhangsIn))), 10)
		entry = append(entry, ',')
		entry = appendJSRatio(entry, m.MaxRatio, m.Status != StatusError)
		entry = append(entry, ',')
		g, ok := kindIdx[m.Governing]
		if !ok {
			g = -1
		}
		entry = strconv.AppendInt(entry, int64(g), 10)
		switch m.Status {
		case StatusPass:
			entry = append(entry, `,"p",[`...)
		case StatusFail:
			entry = append(entry, `,"f",[`...)
		default:
			entry = append(entry, `,"e",[`...)
		}
		for k := range ratios {
			ratios[k] = -1
		}
		for _, c := range m.Checks {
			if k, ok := kindIdx[c.Kind]; ok && finite(c.Ratio) && c.Ratio > ratios[k] {
				ratios[k] = c.Ratio
			}
		}
		for k, v := range ratios {
			if k > 0 {
				entry = append(entry, ',')
			}
			entry = appendJSRatio(entry, v, v >= 0)
		}
		entry = append(entry, "]]"...)
		var found bool
		gi, found = groupIdx[string(entry)]
		if !found {
			gi = len(groupIdx)
			groupIdx[string(entry)] = gi
			if gi > 0 {
				groups = append(groups, ",\n"...)
			}
			groups = append(groups, entry...)
		}
		writeMemberRef(&body, i, gi, m, prevID, prevHandle)
		prevID, prevHandle = m.ID, m.Handle
	}
	js = append(js, `],"text":[`...)
	for i, t := range texts {
		if i > 0 {
			js = append(js, ',')
		}
		js = appendJSString(js, t)
	}
	js = append(js, "],\n\"g\":[\n"...)
	js = append(js, groups...)
	js = append(js, "],\n\"m\":[\n"...)
	js = append(js, body...)
	js = append(js, "]}"...)
	return template.JS(js)
}

// writeMemberRef appends member i's item to body: its group gi, then
// its id and handle unless each follows the previous member's.
func writeMemberRef(body *[]byte, i, gi int, m *Member, prevID, prevHandle string) {
	b := *body
	if i > 0 {
		b = append(b, ",\n"...)
	}
	b = append(b, '[')
	b = strconv.AppendInt(b, int64(gi), 10)
	idNext := i > 0 && followsID(prevID, m.ID)
	handleNext := i > 0 && followsHandle(prevHandle, m.Handle)
	switch {
	case !handleNext:
		b = append(b, ',')
		if idNext {
			b = append(b, '0')
		} else {
			b = appendJSString(b, m.ID)
		}
		b = append(b, ',')
		b = appendJSString(b, m.Handle)
	case !idNext:
		b = append(b, ',')
		b = appendJSString(b, m.ID)
	}
	*body = append(b, ']')
}

// sameGroup reports whether members a and b have every field a group
// entry of memberData is made of alike (mark, size, species, grade, spans
// and overhangs, ratio, governing check, status, each check's kind and
// ratio), so that b's entry is a's. Numbers are compared bit for bit.
func sameGroup(a, b *Member) bool {
	if a.Mark != b.Mark || a.Size != b.Size || a.Species != b.Species || a.Grade != b.Grade ||
		a.Status != b.Status || a.Governing != b.Governing || a.OverhangsIn != b.OverhangsIn ||
		math.Float64bits(a.MaxRatio) != math.Float64bits(b.MaxRatio) ||
		len(a.SpansIn) != len(b.SpansIn) || len(a.Checks) != len(b.Checks) {
		return false
	}
	for i := range a.SpansIn {
		if math.Float64bits(a.SpansIn[i]) != math.Float64bits(b.SpansIn[i]) {
			return false
		}
	}
	for i := range a.Checks {
		if a.Checks[i].Kind != b.Checks[i].Kind || math.Float64bits(a.Checks[i].Ratio) != math.Float64bits(b.Checks[i].Ratio) {
			return false
		}
	}
	return true
}

// followsID reports whether id is prev with its trailing decimal number
// one up ("M7" after "M6"), both written without leading zeros and under
// 2^53 (the page's script counts them exactly), without allocating.
func followsID(prev, id string) bool {
	pp, pn, ok1 := splitNumber(prev, 10)
	ip, in, ok2 := splitNumber(id, 10)
	return ok1 && ok2 && pp == ip && in == pn+1
}

// followsHandle reports whether h is the DXF handle after prev: prev plus
// one in upper-case hexadecimal, both under 2^52; "" follows "" (a
// drawing without handles).
func followsHandle(prev, h string) bool {
	if prev == "" || h == "" {
		return prev == "" && h == ""
	}
	pp, pn, ok1 := splitNumber(prev, 16)
	hp, hn, ok2 := splitNumber(h, 16)
	return ok1 && ok2 && pp == "" && hp == "" && hn == pn+1
}

// splitNumber splits s into a prefix and its trailing number in base 10
// or 16 (upper-case digits), written without leading zeros and at most 13
// digits long.
func splitNumber(s string, base uint64) (string, uint64, bool) {
	k := len(s)
	digit := func(c byte) (uint64, bool) {
		switch {
		case c >= '0' && c <= '9':
			return uint64(c - '0'), true
		case base == 16 && c >= 'A' && c <= 'F':
			return uint64(c-'A') + 10, true
		}
		return 0, false
	}
	for k > 0 {
		if _, ok := digit(s[k-1]); !ok {
			break
		}
		k--
	}
	ds := s[k:]
	if base == 16 {
		k, ds = 0, s // a handle is all digits
		for i := 0; i < len(s); i++ {
			if _, ok := digit(s[i]); !ok {
				return "", 0, false
			}
		}
	}
	if ds == "" || len(ds) > 13 || (len(ds) > 1 && ds[0] == '0') {
		return "", 0, false
	}
	var n uint64
	for i := 0; i < len(ds); i++ {
		d, _ := digit(ds[i])
		n = n*base + d
	}
	return s[:k], n, true
}

// spansKey prints spans with any cantilever as 14'-0" + 2'-0" cantilever
// for the panel.
func spansKey(spans []float64, overhangs [2]float64) string {
	return SpansText(spans, overhangs)
}

// appendJSRatio appends a ratio to three decimals, or null.
func appendJSRatio(b []byte, v float64, ok bool) []byte {
	if !ok || !finite(v) {
		return append(b, "null"...)
	}
	return strconv.AppendFloat(b, v, 'f', 3, 64)
}
