package main

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"framecheck/export"
)

// TestCheckSCLBeamAndPostAbove runs `framecheck check` on testdata/scl
// (written by ezdxf, see gen_scl.py): a beam called out "1 3/4 x 14 LVL
// (2)", LVL being a structural composite lumber row of the project's
// materials file, carries 16 joists and a post above drawn as a closed
// outline on the point-load layer with "P: 1200 D, 800 L" beside it. A
// second post outline with no text is an error naming its handle, and
// loads nothing. Read back from results.json "load_path":
//
//   - the beam is (2) 1.75x14 LVL 2.0E, top edge braced at the joists:
//     Fb' = 2600 (12/14)^0.136 = 2546.1 psi under D + L (the user's Fb
//     and exponent; NDS 2018 8.3.6, the lesser of CL = 1 and CV);
//   - live load reaching the posts (statics): joists 12 ft long on each
//     side, 16 in o.c. from y = 16 to 128 (tributary 6 x 16 + 2 x 8 = 112
//     in per side), 40 psf: 40 (112/12) (12/2) = 2240 lb per side, 4480
//     lb, plus the post above's 800 lb = 5280 lb; the post above at 56 in
//     along the 144 in beam sends 800 (88/144) = 488.9 lb of it to the
//     post at y = 0, the joists half each: 2240 + 488.9 = 2728.9 lb.
func TestCheckSCLBeamAndPostAbove(t *testing.T) {
	out := filepath.Join(t.TempDir(), "out")
	code, stdout, stderr := runCmd("check", "testdata/scl/scl.dxf", "-p", "testdata/scl/scl.toml", "-o", out)
	assert.Equal(t, exitFail, code, "the post outline with no text is an error finding")
	assert.Contains(t, stdout, "1 beams: 1 pass")
	assert.Regexp(t, `error FRM231: point-load mark at \(144\.00, 88\.00\) \(handle [0-9A-F]+\) has no text beside it`, stderr)
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	require.NoError(t, err)
	require.NotNil(t, r.LoadPath)
	require.Len(t, r.LoadPath.Beams, 1)
	b := r.LoadPath.Beams[0]
	assert.Equal(t, "(2) 1.75x14", b.Size)
	assert.Equal(t, "LVL", b.Species)
	assert.Equal(t, "2.0E", b.Grade)
	assert.Equal(t, "pass", b.Status)
	var top *export.Check
	for i := range b.Checks {
		if b.Checks[i].Kind == "bending-top" {
			top = &b.Checks[i]
		}
	}
	require.NotNil(t, top)
	// results.json writes the load path's checks to 6 significant digits
	assert.InEpsilon(t, 2600*math.Pow(12.0/14, 0.136), top.Allowable, 5e-6, "Fb CD CV, hand calculation")
	assert.Equal(t, "D+L", top.Combo)
	live := 0.0
	var p1 float64
	for _, po := range r.LoadPath.Posts {
		if po.Checked {
			assert.Equal(t, 96.0, po.HeightIn, "%s: the [[post]] height_in of scl.toml", po.ID)
		}
		live += po.Loads.LiveLb
		if po.At[1] == 0 {
			p1 = po.Loads.LiveLb
		}
	}
	assert.InDelta(t, 5280, live, 0.1, "statics: 4480 lb of joists and 800 lb of the post above")
	assert.InDelta(t, 2240+800*88.0/144, p1, 0.1, "statics: the post at y = 0")
	assert.InDelta(t, r.LoadPath.Applied.LiveLb, r.LoadPath.Delivered.LiveLb, 0.1)
}

// TestCheckSCLUnknownWord: with a materials file that names its SCL
// MYLVL, the callout's word LVL names no user material: the beam is an
// error naming the word and the materials known, never a default, and a
// CHK313 warning says the joists' bearing on it is not checked against it.
func TestCheckSCLUnknownWord(t *testing.T) {
	dir := t.TempDir()
	csv, err := os.ReadFile("testdata/scl/scl-materials.csv")
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(filepath.Join(dir, "scl-materials.csv"), []byte(strings.Replace(string(csv), "\nLVL,", "\nMYLVL,", 1)), 0o644))
	toml, err := os.ReadFile("testdata/scl/scl.toml")
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(filepath.Join(dir, "scl.toml"), toml, 0o644))
	out := filepath.Join(dir, "out")
	code, _, stderr := runCmd("check", "testdata/scl/scl.dxf", "-p", filepath.Join(dir, "scl.toml"), "-o", out)
	assert.Equal(t, exitFail, code)
	assert.Contains(t, stderr, `B1: its callout "1 3/4 x 14 LVL (2)": the word "LVL": material "LVL" names no user material; the structural composite lumber known is MYLVL`)
	// the joists resting on it: their bearing on it is not checked
	assert.Regexp(t, `warning CHK313: B1: its Fc_perp' is not known when the joists resting on it are checked \(it cannot be checked, CHK310 says why\): `+
		`the bearing of M\d+, M\d+, M\d+ and 13 more on it was checked against their own Fc_perp only`, stderr)
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	require.NoError(t, err)
	require.Len(t, r.LoadPath.Beams, 1)
	assert.Equal(t, "error", r.LoadPath.Beams[0].Status)
}

// TestMaterialsListsSCL: `framecheck materials` prints an SCL row with its
// actual depths and its size factor as the file gives them.
func TestMaterialsListsSCL(t *testing.T) {
	code, out, errs := runCmd("materials", "lvl", "-p", "testdata/scl/scl.toml")
	require.Equal(t, exitOK, code, errs)
	assert.Contains(t, out, "d 5.5-18 in")
	assert.Contains(t, out, "SCL (12/d)^0.136")
}

// TestCheckSCLBeamSofterThanJoists: the joists' bearing on the LVL beam
// is checked against the beam's own Fc_perp' as well as theirs, the
// smaller governing (NDS 2018 3.10.2), and the trace says which governs.
// Hand calculation for the interior joist from (144, 32) to (288, 32), 16
// in o.c., 144 in span, under the default FLOOR zone's 12 psf dead and 40
// psf live (PROJECT-FILE.md):
//
//   - R = (12 + 40)(16/12)(144/12)/2 = 416 lb under D + L (statics);
//     lb = 3.5 in, the [[support]] default bearing_in (PROJECT-FILE.md);
//     fc_perp = R / (b lb) = 416 / (1.5 (3.5)) = 79.238 psi (NDS 2018
//     3.10.2);
//   - the joist's own Fc_perp' = 625 (CM Ct Ci Cb = 1, Cb = 1 at its end)
//     = 625 psi (NDS 2018 Supplement Table 4A, DF-L No.2; Table 4.3.1;
//     3.10.4);
//   - the beam's, with the LVL row's Fc_perp lowered to 400 psi (the
//     materials file, test input): Fc_perp CM Ct Cb = 400 (1)(1)(1.25) =
//     500 psi, Cb = (1.5 + 0.375)/1.5 = 1.25 with lb the joist's width
//     along the beam's grain, the joists being 16 in or more from the
//     beam's ends (NDS 2018 3.10.4, Table 8.3.1 from memory: verify);
//   - the beam governs: ratio 79.238 / 500 = 0.15848, and no CHK313
//     (the bearing is checked).
//
// With the row's 750 psi (the fixture as written) the beam's Fc_perp' is
// 750 (1.25) = 937.5 psi and the joists' own 625 psi governs.
func TestCheckSCLBeamSofterThanJoists(t *testing.T) {
	dir := t.TempDir()
	csv, err := os.ReadFile("testdata/scl/scl-materials.csv")
	require.NoError(t, err)
	soft := strings.Replace(string(csv), ",285,750,", ",285,400,", 1)
	require.NotEqual(t, string(csv), soft, "the fixture's LVL row has Fv 285 and Fc_perp 750")
	require.NoError(t, os.WriteFile(filepath.Join(dir, "scl-materials.csv"), []byte(soft), 0o644))
	toml, err := os.ReadFile("testdata/scl/scl.toml")
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(filepath.Join(dir, "scl.toml"), toml, 0o644))

	// the joist drawn from (x0, y) to (x0 + 144, y)
	bearing := func(out string, x0, y float64) (export.Check, map[string]export.TraceItem) {
		t.Helper()
		r, err := export.ReadJSON(filepath.Join(out, resultsName))
		require.NoError(t, err)
		for _, m := range r.Members {
			if m.Start != [2]float64{x0, y} || m.End != [2]float64{x0 + 144, y} {
				continue
			}
			for _, c := range m.Checks {
				if c.Kind == "bearing" {
					tr := map[string]export.TraceItem{}
					for _, ti := range c.Trace {
						tr[ti.Name] = ti
					}
					return c, tr
				}
			}
		}
		t.Fatalf("%s: no bearing check of the joist from (%g, %g)", out, x0, y)
		return export.Check{}, nil
	}
	const R = (12 + 40) * 16.0 / 12 * 144 / 12 / 2 // statics, lb
	fc := R / (1.5 * 3.5)                          // NDS 2018 3.10.2

	out := filepath.Join(dir, "out")
	_, _, stderr := runCmd("check", "testdata/scl/scl.dxf", "-p", filepath.Join(dir, "scl.toml"), "-o", out)
	assert.NotContains(t, stderr, "CHK313", "the bearing on the beam is checked")
	c, tr := bearing(out, 144, 32) // an interior joist of the right bay: bearing 1 on the beam, bearing 2 on the wall
	// results.json writes checks to 6 significant digits
	assert.InEpsilon(t, fc, c.Actual, 5e-6, "fc_perp = R / (b lb)")
	assert.InEpsilon(t, 400*(1.5+0.375)/1.5, c.Allowable, 5e-6, "the beam's Fc_perp' = 400 Cb, Cb = 1.25 (NDS 2018 3.10.4)")
	assert.InEpsilon(t, fc/500, c.Ratio, 5e-6, "fc_perp / the beam's Fc_perp'")
	assert.InEpsilon(t, 625, tr["Fc_perp'"].Value, 5e-6, "the joist's own, NDS 2018 Supplement Table 4A")
	assert.InEpsilon(t, 1.25, tr["Cb_beam"].Value, 5e-6, "NDS 2018 3.10.4")
	assert.Contains(t, tr["Fc_perp_beam'"].Formula, "of the beam under bearing 1 (LVL 2.0E): it governs")
	assert.Contains(t, tr, "fc_perp/Fc_perp_beam'")

	out2 := filepath.Join(dir, "out2")
	_, _, stderr = runCmd("check", "testdata/scl/scl.dxf", "-p", "testdata/scl/scl.toml", "-o", out2)
	assert.NotContains(t, stderr, "CHK313")
	// both ends give 79.238 / 625: the first, on the beam, is reported
	c, tr = bearing(out2, 144, 32)
	assert.InEpsilon(t, 625, c.Allowable, 5e-6, "the joist's own Fc_perp' governs (NDS 2018 Supplement Table 4A)")
	assert.InEpsilon(t, 750*1.25, tr["Fc_perp_beam'"].Value, 5e-6, "the beam's: 750 (1.25), the materials file and NDS 2018 3.10.4")
	assert.Contains(t, tr["Fc_perp_beam'"].Formula, "the member's governs")
}

// TestCheckSCLJoistCallout runs `framecheck check` on testdata/scl, whose
// bay of five joists between single-line walls on x = 400 and 592 is
// called out '1 3/4 x 11 7/8 LVL @ 16" O.C.' on a label line across them
// (LVL being the structural composite lumber row of scl-materials.csv:
// Fb 2600 psi, Fv 285 psi, Fc_perp 750 psi, E 2,000,000 psi, size factor
// "SCL 0.136", the manufacturer's values as entered in the test's
// materials file, common practice, no source). The interior joist at y =
// 48 is checked as that LVL by its actual size, against a hand
// calculation:
//
//   - span 192 in centre to centre of the 3.5 in bearings on the wall
//     lines, tributary 16 in; the default FLOOR zone D 12 psf, L 40 psf
//     (the project's defaults): w = 52 (16/12) / 12 = 5.7778 lb/in, wL =
//     40 (16/12) / 12 = 4.4444 lb/in;
//   - M = w L^2 / 8 = 26624 lb-in, V = R = w L / 2 = 554.67 lb (statics,
//     simple span under uniform load);
//   - actual section, not dressed from a nominal size: S = b d^2 / 6 =
//     1.75 (11.875)^2 / 6 = 41.130 in^3, A = b d = 20.781 in^2, I = b
//     d^3 / 12 = 244.21 in^4;
//   - Fb' = Fb CD CM Ct CL CV = 2600 (1.0) (12/11.875)^0.136 = 2603.7 psi:
//     CD = 1.0 under D + L (NDS 2018 Table 2.3.2), CM = Ct = 1, CV =
//     (12/d)^n from the materials row, above 1.0 so applied with CL = 1
//     (top edge braced by sheathing) (NDS 2018 8.3.6 and Table 8.3.1,
//     from memory: verify); no CF, no Ci and Cr = 1.0, where a sawn
//     joist at 16 in o.c. would take Cr = 1.15 (NDS 2018 Table 4.3.1);
//   - fv = 1.5 V / A = 40.04 psi against Fv' = Fv CD = 285 psi (NDS 2018
//     Eq. 3.4-2, Table 8.3.1);
//   - live deflection 5 wL L^4 / (384 E I) = 0.1610 in against L/360 =
//     0.5333 in (IBC 2018 Table 1604.3).
//
// The takeoff counts the five LVL joists by their actual size: 1.75 x
// 11.875 x 16 ft / 12 = 27.708 board feet each, 138.54 in all (board
// feet, b d L / 12 with L the 16 ft order length). The second bay's
// callout "1 3/4 x 9 1/2 @ 16" gives no material: its three joists are
// errors naming the text's handle and the materials known, never a
// default size or material. Under --size the LVL joists keep their size.
func TestCheckSCLJoistCallout(t *testing.T) {
	out := filepath.Join(t.TempDir(), "out")
	code, _, stderr := runCmd("check", "testdata/scl/scl.dxf", "-p", "testdata/scl/scl.toml", "-o", out)
	assert.Equal(t, exitFail, code)
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	require.NoError(t, err)
	at := func(x, y float64) *export.Member {
		for i := range r.Members {
			if m := &r.Members[i]; m.Start == [2]float64{x, y} {
				return m
			}
		}
		t.Fatalf("no member drawn from (%g, %g)", x, y)
		return nil
	}
	for _, y := range []float64{16, 32, 48, 64, 80} {
		m := at(400, y)
		assert.Equal(t, "1.75x11.875", m.Size, "y = %g", y)
		assert.Equal(t, "LVL", m.Species, "y = %g", y)
		assert.Equal(t, "2.0E", m.Grade, "y = %g: the material's only grade", y)
		assert.Equal(t, 16.0, m.SpacingIn, "y = %g", y)
		assert.Equal(t, "pass", m.Status, "y = %g: %v", y, m.Messages)
	}
	m := at(400, 48)
	require.Equal(t, 16.0, m.TribIn)
	require.Equal(t, []float64{192}, m.SpansIn)
	const (
		b, d, l        = 1.75, 11.875, 192.0
		w, wL          = 52 * 16.0 / 12 / 12, 40 * 16.0 / 12 / 12
		e              = 2_000_000.0
		fb, fv, fcPerp = 2600.0, 285.0, 750.0
	)
	s, a, i := b*d*d/6, b*d, b*d*d*d/12
	mom, v := w*l*l/8, w*l/2
	bend := checkOf(t, m, "bending-top")
	assert.Equal(t, "D+L", bend.Combo)
	assert.InEpsilon(t, mom/s, bend.Actual, 5e-6, "fb = M / S with the actual section, hand calculation")
	assert.InDelta(t, 647.32, bend.Actual, 0.01, "fb, hand calculation above")
	assert.InEpsilon(t, fb*math.Pow(12/d, 0.136), bend.Allowable, 5e-6, "Fb' = Fb CD CV, CL = Cr = 1, no CF: hand calculation")
	assert.InDelta(t, 2603.7, bend.Allowable, 0.05, "Fb', hand calculation above")
	shear := checkOf(t, m, "shear")
	assert.InEpsilon(t, 1.5*v/a, shear.Actual, 5e-6, "fv = 1.5 V / A, NDS 2018 Eq. 3.4-2")
	assert.InEpsilon(t, fv, shear.Allowable, 5e-6, "Fv' = Fv CD, CD = 1.0 under D + L")
	bear := checkOf(t, m, "bearing")
	assert.InEpsilon(t, v/(b*3.5), bear.Actual, 5e-6, "fc_perp = R / (b lb), NDS 2018 3.10.2")
	assert.InEpsilon(t, fcPerp, bear.Allowable, 5e-6, "Fc_perp' = Fc_perp, Cb = 1 at a member end")
	defl := checkOf(t, m, "deflection-live")
	assert.InEpsilon(t, 5*wL*math.Pow(l, 4)/(384*e*i), defl.Actual, 5e-6, "5 wL L^4 / (384 E I), hand calculation")
	assert.InEpsilon(t, l/360, defl.Allowable, 5e-6, "IBC 2018 Table 1604.3")
	require.NotEmpty(t, m.Factors)
	for _, f := range m.Factors {
		assert.NotContains(t, []string{"CF", "Ci", "Cfu"}, f.Name, "sawn lumber factors are not taken for SCL")
		if f.Name == "Cr" {
			assert.Equal(t, 1.0, f.Value, "the repetitive member factor of SCL is not taken")
		}
	}

	var lvl *export.TakeoffLine
	for k := range r.Takeoff.Joists {
		if strings.HasPrefix(r.Takeoff.Joists[k].Size, "1.75x11.875 ") {
			lvl = &r.Takeoff.Joists[k]
		}
	}
	require.NotNil(t, lvl, "takeoff %+v", r.Takeoff.Joists)
	assert.Equal(t, "1.75x11.875 LVL 2.0E", lvl.Size)
	assert.Equal(t, 5, lvl.Count)
	assert.Equal(t, 16.0, lvl.OrderLengthFt)
	assert.InDelta(t, 5*b*d*16/12, lvl.BoardFeet, 1e-5, "board feet from the actual size, b d L / 12")

	assert.Regexp(t, `\(handle [0-9A-F]+, layer FRAMING-NOTE\): error FRM208: size callout not read: "1 3/4 x 9 1/2 @ 16": `+
		`"1 3/4 x 9 1/2" is a size in actual inches with no material after it.*the structural composite lumber known is LVL; `+
		`the 3 joist\(s\) under it are in error`, stderr)
	for _, y := range []float64{16, 32, 48} {
		m := at(700, y)
		assert.Equal(t, "error", m.Status, "y = %g", y)
		assert.Empty(t, m.Size, "y = %g: no size assumed", y)
		assert.Regexp(t, `the size callout "1 3/4 x 9 1/2 @ 16" \(.*handle [0-9A-F]+.*\) cannot be read`, strings.Join(m.Messages, " "))
	}

	// --size picks among the [sizing] candidates, sawn sizes: the LVL
	// joists keep the size called out, checked as above, never a sawn
	// size of LVL
	out2 := filepath.Join(t.TempDir(), "out")
	runCmd("check", "testdata/scl/scl.dxf", "-p", "testdata/scl/scl.toml", "-o", out2, "--size")
	r, err = export.ReadJSON(filepath.Join(out2, resultsName))
	require.NoError(t, err)
	m = at(400, 48)
	assert.Equal(t, "1.75x11.875", m.Size)
	assert.Equal(t, "pass", m.Status, "%v", m.Messages)
	assert.InDelta(t, 2603.7, checkOf(t, m, "bending-top").Allowable, 0.05, "Fb', hand calculation above")
}
