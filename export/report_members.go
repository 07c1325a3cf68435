package export

import (
	"html/template"
	"strconv"
)

// memberData returns the details the hover panel shows, as a JavaScript
// object literal (valid JSON):
//
//	{"kinds": [check kinds], "text": [strings],
//	 "m": [[id, mark, size, spans, max ratio, governing, status, handle, [ratio per kind]], ...]}
//
// mark, size and spans are indexes into text (they repeat across
// members), governing an index into kinds or -1, status "p", "f" or "e",
// and the ratios follow kinds, null where a check is absent or not finite.
// Keeping each member to about 80 bytes keeps a 100,000-member page small.
func memberData(r *Results) template.JS {
	js := make([]byte, 0, 256+len(r.Members)*80)
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
	body := make([]byte, 0, len(r.Members)*80)
	ratios := make([]float64, len(CheckKinds))
	for i := range r.Members {
		m := &r.Members[i]
		if i > 0 {
			body = append(body, ",\n"...)
		}
		body = append(body, '[')
		body = appendJSString(body, m.ID)
		body = append(body, ',')
		body = strconv.AppendInt(body, int64(intern(m.Mark)), 10)
		body = append(body, ',')
		body = strconv.AppendInt(body, int64(intern(m.Size+" "+m.Species+" "+m.Grade)), 10)
		body = append(body, ',')
		body = strconv.AppendInt(body, int64(intern(spansKey(m.SpansIn, m.OverhangsIn))), 10)
		body = append(body, ',')
		body = appendJSRatio(body, m.MaxRatio, m.Status != StatusError)
		body = append(body, ',')
		g, ok := kindIdx[m.Governing]
		if !ok {
			g = -1
		}
		body = strconv.AppendInt(body, int64(g), 10)
		switch m.Status {
		case StatusPass:
			body = append(body, `,"p",`...)
		case StatusFail:
			body = append(body, `,"f",`...)
		default:
			body = append(body, `,"e",`...)
		}
		body = appendJSString(body, m.Handle)
		body = append(body, ",["...)
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
				body = append(body, ',')
			}
			body = appendJSRatio(body, v, v >= 0)
		}
		body = append(body, "]]"...)
	}
	js = append(js, `],"text":[`...)
	for i, t := range texts {
		if i > 0 {
			js = append(js, ',')
		}
		js = appendJSString(js, t)
	}
	js = append(js, "],\n\"m\":[\n"...)
	js = append(js, body...)
	js = append(js, "]}"...)
	return template.JS(js)
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
