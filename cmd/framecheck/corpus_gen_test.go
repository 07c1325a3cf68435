package main

import (
	"fmt"
	"strconv"
	"strings"
)

// This file generates the drawings of the bad-input corpus
// (testdata/bad/*.dxf). The committed files are the generators' output:
// TestBadCorpusFilesUpToDate compares them and `go test -run
// TestBadCorpusFilesUpToDate -update-bad` rewrites them. Drawings too large
// to commit (200,000 entities) are generated into t.TempDir() by the test
// that uses them.

// dxfText builds an ASCII DXF file pair by pair.
type dxfText struct {
	b      strings.Builder
	handle int
}

// pair writes one group code / value pair, the code right-aligned in three
// columns as AutoCAD writes it.
func (d *dxfText) pair(code int, value string) {
	fmt.Fprintf(&d.b, "%3d\n%s\n", code, value)
}

func (d *dxfText) num(code int, f float64) {
	d.pair(code, strconv.FormatFloat(f, 'g', -1, 64))
}

// header writes a HEADER section with the version and $INSUNITS
// (1 = inches, DXF reference, HEADER variables).
func (d *dxfText) header(acadver string, insunits int) {
	d.pair(0, "SECTION")
	d.pair(2, "HEADER")
	d.pair(9, "$ACADVER")
	d.pair(1, acadver)
	d.pair(9, "$INSUNITS")
	d.pair(70, strconv.Itoa(insunits))
	d.pair(0, "ENDSEC")
}

func (d *dxfText) section(name string) {
	d.pair(0, "SECTION")
	d.pair(2, name)
}

func (d *dxfText) endsec() { d.pair(0, "ENDSEC") }

func (d *dxfText) eof() { d.pair(0, "EOF") }

// line writes a LINE with the next handle.
func (d *dxfText) line(layer string, x1, y1, x2, y2 float64) {
	d.lineRaw(layer, dxfNum(x1), dxfNum(y1), dxfNum(x2), dxfNum(y2))
}

// lineRaw writes a LINE whose coordinates are given as text, so that a
// case can put any spelling of a number in the file.
func (d *dxfText) lineRaw(layer, x1, y1, x2, y2 string) {
	d.handle++
	d.pair(0, "LINE")
	d.pair(5, fmt.Sprintf("%X", 0x100+d.handle))
	d.pair(8, layer)
	d.pair(10, x1)
	d.pair(20, y1)
	d.pair(11, x2)
	d.pair(21, y2)
}

// insert writes an INSERT of block name at (x, y).
func (d *dxfText) insert(layer, name string, x, y float64) {
	d.handle++
	d.pair(0, "INSERT")
	d.pair(5, fmt.Sprintf("%X", 0x100+d.handle))
	d.pair(8, layer)
	d.pair(2, name)
	d.num(10, x)
	d.num(20, y)
}

// block opens a block definition with its base point at the origin.
func (d *dxfText) block(name string) {
	d.pair(0, "BLOCK")
	d.pair(8, "0")
	d.pair(2, name)
	d.pair(70, "0")
	d.num(10, 0)
	d.num(20, 0)
	d.num(30, 0)
}

func (d *dxfText) endblk() { d.pair(0, "ENDBLK") }

// text writes a TEXT (no handle) of height h at (x, y).
func (d *dxfText) text(layer string, x, y, h float64, s string) {
	d.handle++
	d.pair(0, "TEXT")
	d.pair(5, fmt.Sprintf("%X", 0x100+d.handle))
	d.pair(8, layer)
	d.num(10, x)
	d.num(20, y)
	d.num(40, h)
	d.pair(1, s)
}

// outline writes a closed LWPOLYLINE through pts.
func (d *dxfText) outline(layer string, pts ...[2]float64) {
	d.pair(0, "LWPOLYLINE")
	d.pair(8, layer)
	d.pair(90, strconv.Itoa(len(pts)))
	d.pair(70, "1")
	for _, p := range pts {
		d.num(10, p[0])
		d.num(20, p[1])
	}
}

// minsert writes an INSERT of name with rows x cols copies spaced dx, dy
// (a MINSERT in R12 terms: DXF reference, INSERT group codes 70, 71, 44,
// 45).
func (d *dxfText) minsert(name string, cols, rows int, dx, dy float64) {
	d.insert("0", name, 0, 0)
	d.pair(70, strconv.Itoa(cols))
	d.pair(71, strconv.Itoa(rows))
	d.num(44, dx)
	d.num(45, dy)
}

func (d *dxfText) String() string { return d.b.String() }

func dxfNum(f float64) string { return strconv.FormatFloat(f, 'g', -1, 64) }

// Geometry of the small plan every case starts from: two bearing walls
// 144 in apart (a 12 ft simple span) and joists at 16 in on centre. With
// the built-in defaults (2x10 DF-L No.2, D 12 + L 40 psf) every joist
// passes (hand check in TestBadCorpus "good plan").
const (
	spanIn    = 144.0
	spacingIn = 16.0
)

// plan writes the walls and n joists, offset by (dx, dy), on the given
// layers.
func (d *dxfText) plan(wallLayer, joistLayer string, n int, dx, dy float64) {
	top := float64(n+1) * spacingIn
	d.line(wallLayer, dx, dy, dx, dy+top)
	d.line(wallLayer, dx+spanIn, dy, dx+spanIn, dy+top)
	for i := 1; i <= n; i++ {
		y := dy + float64(i)*spacingIn
		d.line(joistLayer, dx, y, dx+spanIn, y)
	}
}

// smallPlan is the good plan: R2000, inches, five joists.
func smallPlan() string {
	var d dxfText
	d.header("AC1015", 1)
	d.section("ENTITIES")
	d.plan("WALL", "JOIST", 5, 0, 0)
	d.endsec()
	d.eof()
	return d.String()
}

// smallPlanR12 is the good plan as an R12 file, which the annotated copy
// can be made from without a TABLES section.
func smallPlanR12() string {
	var d dxfText
	d.header("AC1009", 1)
	d.section("ENTITIES")
	d.plan("WALL", "JOIST", 5, 0, 0)
	d.endsec()
	d.eof()
	return d.String()
}

// badFiles are the generated files of testdata/bad, by name.
var badFiles = map[string]func() string{
	"good.dxf":     smallPlan,
	"good-r12.dxf": smallPlanR12,
	// Nothing at all.
	"empty.dxf": func() string { return "" },
	// What AutoCAD writes at the start of a DWG (R2018: "AC1032"), then
	// binary data, saved under a .dxf name by mistake.
	"dwg-renamed.dxf": func() string {
		return "AC1032\x00\x00\x00\x00\x00\x07\x1d\x00\x00\x00\x02\x01\x00\x00\xff\xfe\x81\x3c\x00\x00"
	},
	// The binary DXF sentinel (DXF reference, "Binary DXF Files"), then data.
	"binary.dxf": func() string {
		return "AutoCAD Binary DXF\r\n\x1a\x00\x00\x00SECTION\x00\x02HEADER\x00"
	},
	// The good plan cut in the middle of its third joist, after a group
	// code and before its value.
	"truncated-mid-entity.dxf": func() string {
		s := smallPlan()
		i := strings.Index(s, " 20\n48\n")
		return s[:i+len(" 20\n")]
	},
	// A value line lost in the middle of the ENTITIES section: every pair
	// after it is out of step, and the reader meets a value where it wants
	// a group code.
	"odd-lines.dxf": func() string {
		s := smallPlan()
		i := strings.Index(s, " 11\n144\n 21\n32\n")
		return s[:i] + " 11\n 21\n32\n" + s[i+len(" 11\n144\n 21\n32\n"):]
	},
	// Sections no DXF version has, and an OBJECTS section full of things
	// the reader does not need: skipped, the plan is checked.
	"unknown-sections.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("FRAMECHECK_NOT_A_SECTION")
		d.pair(0, "WIDGET")
		d.pair(1, "anything at all")
		d.pair(90, "12")
		d.endsec()
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 5, 0, 0)
		d.endsec()
		d.section("OBJECTS")
		d.pair(0, "DICTIONARY")
		d.pair(5, "C")
		d.pair(3, "ACAD_GROUP")
		d.pair(350, "D")
		d.endsec()
		d.section("ACDSDATA")
		d.pair(0, "ACDSSCHEMA")
		d.pair(90, "0")
		d.endsec()
		d.eof()
		return d.String()
	},
	// Layer names in French, German, Japanese and with an emoji, UTF-8 as
	// R2007 and later files are; the joist and wall patterns still match
	// (JOIST*, WALL*). Three plans side by side, 200 in apart.
	"non-ascii-layers.dxf": func() string {
		var d dxfText
		d.header("AC1032", 1)
		d.section("ENTITIES")
		d.plan("WALL-MUR-ÉTAGE", "JOIST-SOLIVE-ÉTAGE", 3, 0, 0)
		d.plan("WALL-Süd", "JOIST-梁-二階", 3, 200, 0)
		d.plan("WALL-🏠", "JOIST-🪵", 3, 400, 0)
		d.endsec()
		d.eof()
		return d.String()
	},
	// An R12 file in code page 1252 (the usual $DWGCODEPAGE of older
	// Western files): "É" and "ü" are single bytes 0xC9 and 0xFC there.
	"non-ascii-layers-r12.dxf": func() string {
		var d dxfText
		d.pair(0, "SECTION")
		d.pair(2, "HEADER")
		d.pair(9, "$ACADVER")
		d.pair(1, "AC1009")
		d.pair(9, "$DWGCODEPAGE")
		d.pair(3, "ANSI_1252")
		d.pair(9, "$INSUNITS")
		d.pair(70, "1")
		d.endsec()
		d.section("ENTITIES")
		d.plan("WALL-MUR-\xc9TAGE", "JOIST-SOLIVE-\xc9TAGE", 3, 0, 0)
		d.plan("WALL-S\xfcD", "JOIST-S\xfcD", 3, 200, 0)
		d.endsec()
		d.eof()
		return d.String()
	},
	// A good plan, and far away a second one drawn at 1e300 in: there a
	// 144 in span is below the resolution of a float64 (the spacing of
	// doubles near 1e300 is about 1e284), so those joists have no length.
	// Also one line reaching 1e300 from the origin.
	"coords-1e300.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 3, 0, 0)
		d.plan("WALL", "JOIST", 2, 1e300, 1e300)
		d.line("JOIST", 0, 200, 1e300, 200)
		d.line("JOIST", -1e300, 220, 1e300, 220)
		d.endsec()
		d.eof()
		return d.String()
	},
	// NaN, Inf and a number too large for a float64 as coordinates.
	"nan.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 3, 0, 0)
		d.lineRaw("JOIST", "0", "NaN", "144", "80")
		d.endsec()
		d.eof()
		return d.String()
	},
	"inf.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 3, 0, 0)
		d.lineRaw("JOIST", "0", "80", "+Inf", "80")
		d.endsec()
		d.eof()
		return d.String()
	},
	"overflow.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 3, 0, 0)
		d.lineRaw("JOIST", "0", "80", "1e999", "80")
		d.endsec()
		d.eof()
		return d.String()
	},
	// Walls and a beam, no line on a joist layer.
	"no-joists.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 0, 0, 0)
		d.line("BEAM-FLUSH", 0, 50, 144, 50)
		d.line("FURNITURE", 10, 10, 40, 10)
		d.endsec()
		d.eof()
		return d.String()
	},
	// Joists and nothing to bear on.
	"no-supports.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("ENTITIES")
		for i := 1; i <= 4; i++ {
			d.line("JOIST", 0, float64(i)*spacingIn, spanIn, float64(i)*spacingIn)
		}
		d.endsec()
		d.eof()
		return d.String()
	},
	// One wall at the left ends; the right ends stop in mid-air.
	"one-end-unsupported.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("ENTITIES")
		d.line("WALL", 0, 0, 0, 80)
		for i := 1; i <= 4; i++ {
			d.line("JOIST", 0, float64(i)*spacingIn, spanIn, float64(i)*spacingIn)
		}
		d.endsec()
		d.eof()
		return d.String()
	},
	// The whole plan inside block L12, inserted by L11, ... by L1, which
	// model space inserts once: 12 levels, within the reader's limit of
	// 16 (dxfimport.DefaultMaxInsertDepth). Each level moves it 10 in.
	"nested-blocks.dxf": func() string { return nested(12) },
	// The same 24 levels deep: past the limit, the geometry is left out
	// with a warning, and then there are no joists.
	"nested-too-deep.dxf": func() string { return nested(24) },
	// Block SELF inserts itself beside its joists; PING and PONG insert
	// each other. Model space inserts both once.
	"self-insert.dxf": func() string {
		var d dxfText
		d.header("AC1015", 1)
		d.section("BLOCKS")
		d.block("SELF")
		d.plan("WALL", "JOIST", 3, 0, 0)
		d.insert("0", "SELF", 0, 100)
		d.endblk()
		d.block("PING")
		d.insert("0", "PONG", 0, 100)
		d.endblk()
		d.block("PONG")
		d.insert("0", "PING", 0, 100)
		d.endblk()
		d.endsec()
		d.section("ENTITIES")
		d.insert("0", "SELF", 0, 0)
		d.insert("0", "PING", 500, 0)
		d.endsec()
		d.eof()
		return d.String()
	},
}

// moreBadFiles are further generated cases, kept apart for length.
var moreBadFiles = map[string]func() string{
	// The good plan with its last "0/EOF" pair cut off.
	"no-eof.dxf": func() string {
		s := smallPlanR12()
		return s[:strings.LastIndex(s, "  0\nEOF\n")]
	},
	// A zero-length joist, and a joist drawn twice on top of another.
	"zero-and-duplicate.dxf": func() string {
		var d dxfText
		d.header("AC1009", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 5, 0, 0)
		d.line("JOIST", 50, 40, 50, 40)
		d.line("JOIST", 0, 32, 144, 32)
		d.endsec()
		d.eof()
		return d.String()
	},
	// A joist LINE whose end point (codes 11 and 21) was lost: DXF would
	// default it to the origin; the reader leaves the line out with an
	// error, and the five whole joists are checked.
	"line-missing-end.dxf": func() string {
		var d dxfText
		d.header("AC1009", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 5, 0, 0)
		d.handle++
		d.pair(0, "LINE")
		d.pair(5, fmt.Sprintf("%X", 0x100+d.handle))
		d.pair(8, "JOIST")
		d.num(10, 0)
		d.num(20, 104)
		d.endsec()
		d.eof()
		return d.String()
	},
	// Callouts on span lines across the joists: two name a size but
	// cannot be read (nonsense spacing; no such lumber), so the joists
	// under them (y = 16, 32 and 48) are errors, not checked at the
	// project size; the third is read in the trade's spelling, and its two
	// joists are checked. A fourth, spacing out of range, reaches no joist.
	"bad-callouts.dxf": func() string {
		var d dxfText
		d.header("AC1009", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 5, 0, 0)
		d.line("FRAMING-NOTE", 40, 8, 40, 40)
		d.text("FRAMING-NOTE", 42, 24, 4, "2x10 @ banana")
		d.line("FRAMING-NOTE", 100, 40, 100, 56)
		d.text("FRAMING-NOTE", 102, 50, 4, "2x99 @ 16")
		d.line("FRAMING-NOTE", 120, 56, 120, 88)
		d.text("FRAMING-NOTE", 122, 72, 4, `2X10 DF-L #2 @ 16" O.C. TYP.`)
		d.text("FRAMING-NOTE", 400, 400, 4, "2x12 @ 96")
		d.endsec()
		d.eof()
		return d.String()
	},
	// A load-zone outline over the upper three joists named ATTIC, which
	// the project file (built-in defaults: FLOOR only) does not define.
	"unknown-zone.dxf": func() string {
		var d dxfText
		d.header("AC1009", 1)
		d.section("ENTITIES")
		d.plan("WALL", "JOIST", 5, 0, 0)
		d.outline("LOAD-ZONE", [2]float64{-10, 40}, [2]float64{200, 40}, [2]float64{200, 200}, [2]float64{-10, 200})
		d.text("LOAD-ZONE", 100, 100, 6, "ATTIC")
		d.endsec()
		d.eof()
		return d.String()
	},
	// 700 bytes that expand to 10^10 lines: block B is block A (one line)
	// in a 1000 x 1000 array, and model space inserts B 100 x 100 times.
	// The reader counts before it expands and leaves the insert out.
	// Joists drawn as outlines that are not rectangles beside the five
	// good joists: at y = 96 a tapered outline of 4 LINEs (1.5 in wide at
	// the wall at x = 0, 5 in at x = 144), at y = 112 a closed 5-vertex
	// LWPOLYLINE with a pointed end, then a good 4-LINE rectangle at
	// y = 128. The walls run past all of them.
	"outline-not-rectangle.dxf": func() string {
		var d dxfText
		d.header("AC1009", 1)
		d.section("ENTITIES")
		d.line("WALL", 0, 0, 0, 144)
		d.line("WALL", spanIn, 0, spanIn, 144)
		for i := 1; i <= 5; i++ {
			d.line("JOIST", 0, float64(i)*spacingIn, spanIn, float64(i)*spacingIn)
		}
		d.line("JOIST", 0, 95.25, spanIn, 93.5)
		d.line("JOIST", spanIn, 93.5, spanIn, 98.5)
		d.line("JOIST", spanIn, 98.5, 0, 96.75)
		d.line("JOIST", 0, 96.75, 0, 95.25)
		d.handle++
		d.pair(0, "LWPOLYLINE")
		d.pair(5, fmt.Sprintf("%X", 0x100+d.handle))
		d.pair(8, "JOIST")
		d.pair(90, "5")
		d.pair(70, "1")
		for _, p := range [][2]float64{{0, 111.25}, {138, 111.25}, {spanIn, 112}, {138, 112.75}, {0, 112.75}} {
			d.num(10, p[0])
			d.num(20, p[1])
		}
		d.line("JOIST", 0, 127.25, spanIn, 127.25)
		d.line("JOIST", spanIn, 127.25, spanIn, 128.75)
		d.line("JOIST", spanIn, 128.75, 0, 128.75)
		d.line("JOIST", 0, 128.75, 0, 127.25)
		d.endsec()
		d.eof()
		return d.String()
	},
	"minsert-bomb.dxf": func() string {
		var d dxfText
		d.header("AC1009", 1)
		d.section("BLOCKS")
		d.block("A")
		d.line("A-FURN", 0, 0, 1, 1)
		d.endblk()
		d.block("B")
		d.minsert("A", 1000, 1000, 2, 2)
		d.endblk()
		d.endsec()
		d.section("ENTITIES")
		d.minsert("B", 100, 100, 3000, 3000)
		d.plan("WALL", "JOIST", 5, 0, 0)
		d.endsec()
		d.eof()
		return d.String()
	},
}

func init() {
	for k, v := range moreBadFiles {
		badFiles[k] = v
	}
}

// nested puts the small plan inside a chain of depth blocks.
func nested(depth int) string {
	var d dxfText
	d.header("AC1015", 1)
	d.section("BLOCKS")
	for i := 1; i <= depth; i++ {
		d.block(fmt.Sprintf("L%d", i))
		if i < depth {
			d.insert("0", fmt.Sprintf("L%d", i+1), 10, 0)
		} else {
			d.plan("WALL", "JOIST", 5, 0, 0)
		}
		d.endblk()
	}
	d.endsec()
	d.section("ENTITIES")
	d.insert("0", "L1", 0, 0)
	d.endsec()
	d.eof()
	return d.String()
}

// ignoredLayersPlan is the good plan followed by n lines on layers no
// role matches (furniture, dimensions, hatch boundaries), as a large
// architectural background drawing has. Too large to commit at n =
// 200,000 (about 14 MB): tests generate it.
func ignoredLayersPlan(n int) string {
	var d dxfText
	d.b.Grow(70 * n)
	d.header("AC1015", 1)
	d.section("ENTITIES")
	layers := []string{"A-FURN", "A-ANNO-DIMS", "A-HATCH", "E-LITE"}
	for i := 0; i < n; i++ {
		x := float64(i%1000) * 3
		y := 1000 + float64(i/1000)*3
		d.line(layers[i%len(layers)], x, y, x+2, y+1)
	}
	d.plan("WALL", "JOIST", 5, 0, 0)
	d.endsec()
	d.eof()
	return d.String()
}
