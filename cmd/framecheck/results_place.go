package main

import (
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"

	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/framing"
)

// datumIn is the datum of positions along m (export.DatumText): the face
// of its first bearing toward the span, from Start, inches; Start itself
// when m has no bearing.
func datumIn(m *framing.Member) float64 {
	if len(m.Bearings) == 0 {
		return 0
	}
	b := m.Bearings[0]
	if len(m.Bearings) == 1 && m.LengthIn > 0 && b.AtIn > m.LengthIn/2 {
		return b.FaceIn(-1) // its only bearing is at the far end
	}
	return b.FaceIn(1)
}

// placeMember sets em's datum, its rows to add from the datum, and its
// location: the drawing's file relative to the current folder, the handle
// and layer, and the ends as plan coordinates in feet-inches.
func placeMember(em *export.Member, m *framing.Member, rel *relMemo) {
	em.DatumIn = datumIn(m)
	if len(em.BlockingAtIn) > 0 {
		em.BlockingFromFaceIn = make([]float64, len(em.BlockingAtIn))
		for i, v := range em.BlockingAtIn {
			em.BlockingFromFaceIn[i] = v - em.DatumIn
		}
	}
	em.Location = locationRel(rel.of(m.Pos.File), m.Pos, [2]float64{m.Start.X, m.Start.Y}, [2]float64{m.End.X, m.End.Y})
}

// rePlanPoint is a plan point as framing's findings print it, in drawing
// units to 0.01: "(256.00, 138.00)".
var rePlanPoint = regexp.MustCompile(`\((-?[0-9]+\.[0-9]{2}), (-?[0-9]+\.[0-9]{2})\)`)

// planPointsFtIn rewrites the plan points of a finding as feet-inches plan
// coordinates ("(21'-4\", 11'-6\")"), toInch being the drawing's inches
// per unit, so findings give locations as every other output does.
func planPointsFtIn(msg string, toInch float64) string {
	if !strings.Contains(msg, ".") {
		return msg
	}
	return rePlanPoint.ReplaceAllStringFunc(msg, func(s string) string {
		g := rePlanPoint.FindStringSubmatch(s)
		x, err1 := strconv.ParseFloat(g[1], 64)
		y, err2 := strconv.ParseFloat(g[2], 64)
		if err1 != nil || err2 != nil {
			return s
		}
		return "(" + export.FtIn(x*toInch) + ", " + export.FtIn(y*toInch) + ")"
	})
}

// locationText is "plan.dxf handle 43 (layer JOIST-FLOOR), 49'-9 3/4",
// 2'-0" to 61'-11 1/4", 2'-0"": the file relative to the current folder,
// the handle (or DXF line when the drawing has none), the layer, and the
// points (inches) in feet-inches plan coordinates.
func locationText(p dxfimport.Pos, a, b [2]float64) string {
	return locationRel(relToCwd(p.File), p, a, b)
}

// locationRel is locationText with p.File already named as relToCwd
// names it (rel).
func locationRel(rel string, p dxfimport.Pos, a, b [2]float64) string {
	s := rel
	switch {
	case p.Handle != "":
		s += " handle " + p.Handle
	case p.Line > 0:
		s += " line " + strconv.Itoa(p.Line)
	}
	if p.Layer != "" {
		s += " (layer " + p.Layer + ")"
	}
	s = strings.TrimSpace(s)
	// the points appended in one buffer: a plan has a location a member
	buf := make([]byte, 0, len(s)+64)
	buf = append(buf, s...)
	if s != "" {
		buf = append(buf, ", "...)
	}
	buf = export.AppendFtIn(buf, a[0])
	buf = append(buf, ", "...)
	buf = export.AppendFtIn(buf, a[1])
	buf = append(buf, " to "...)
	buf = export.AppendFtIn(buf, b[0])
	buf = append(buf, ", "...)
	buf = export.AppendFtIn(buf, b[1])
	return string(buf)
}

// relMemo is relToCwd remembering its last answer: the members of a plan
// all name one file, and finding the current folder costs system calls
// (at 100,000 members with an absolute plan path, 0.3 s of the mapping).
type relMemo struct {
	path, rel string
	set       bool
}

func (r *relMemo) of(path string) string {
	if !r.set || r.path != path {
		r.path, r.rel, r.set = path, relToCwd(path), true
	}
	return r.rel
}

// relToCwd names path relative to the current folder when it lies under
// it (or is already relative), else as it is.
func relToCwd(path string) string {
	if path == "" || !filepath.IsAbs(path) {
		return path
	}
	wd, err := os.Getwd()
	if err != nil {
		return path
	}
	if rel, err := filepath.Rel(wd, path); err == nil && !strings.HasPrefix(rel, "..") {
		return rel
	}
	return path
}
