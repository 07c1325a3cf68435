package main

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"framecheck/export"
)

// twoZoneRoof writes a roof of seven 2x8 joists at 16 in spanning 192 in
// between walls at x = 0 and x = 192, with an edge-zone outline over the
// first 170 in of every joist and a field-zone outline over the rest.
func twoZoneRoof(t *testing.T, dir string) (dxf, toml string) {
	var d dxfText
	d.header("AC1015", 1)
	d.section("ENTITIES")
	d.line("WALL", 0, 0, 0, 128)
	d.line("WALL", 192, 0, 192, 128)
	for i := 1; i <= 7; i++ {
		y := float64(i) * 16
		d.line("JOIST", 0, y, 192, y)
	}
	d.outline("LOAD-ZONE", [2]float64{-10, -5}, [2]float64{170, -5}, [2]float64{170, 133}, [2]float64{-10, 133})
	d.text("LOAD-ZONE", 80, 60, 4, "EDGE")
	d.outline("LOAD-ZONE", [2]float64{170, -5}, [2]float64{202, -5}, [2]float64{202, 133}, [2]float64{170, 133})
	d.text("LOAD-ZONE", 180, 60, 4, "FIELD")
	d.endsec()
	d.eof()
	dxf = filepath.Join(dir, "roof.dxf")
	require.NoError(t, os.WriteFile(dxf, []byte(d.String()), 0o644))
	toml = filepath.Join(dir, "roof.toml")
	require.NoError(t, os.WriteFile(toml, []byte(`
[lumber]
size = "2x8"
[loads]
default_zone = "EDGE"
[[zone]]
name = "EDGE"
use = "roof"
dead_psf = 8
roof_live_psf = 20
wind_up_psf = 60
[[zone]]
name = "FIELD"
use = "roof"
dead_psf = 25
roof_live_psf = 20
wind_up_psf = 50
`), 0o644))
	return dxf, toml
}

// TestTwoZoneRoof_LoadsWhereTheyAct runs `check` on a drawn plan whose
// joists cross from an edge zone (D 8, W up 60 psf, first 170 in) into a
// field zone (D 25, W up 50 psf, last 22 in). Each zone loads a joist where
// it acts; the net uplift of 0.6D + 0.6W on an interior joist (trib 16 in):
//
//	w_A = (36 - 4.8) 16/144 = 3.4667 lb/in, w_B = (30 - 15) 16/144 = 1.6667 lb/in
//	R_1 = [w_A 170 (192 - 85) + w_B 22 (11)] / 192 = 330.5 lb
//	M = R_1^2 / (2 w_A) = 15,755 lb-in; fb = M / S = 15,755 / 13.14 = 1,199 psi
//
// (statics written out; S = 1.5 (7.25)^2 / 6 = 13.14 in^3, NDS 2018
// Supplement Table 1B). The old envelope (D 25 with W up 60 over the whole
// joist) gave w = 2.333 lb/in, M = 10,752 lb-in, fb = 818 psi: 32 % low.
func TestTwoZoneRoof_LoadsWhereTheyAct(t *testing.T) {
	dir := t.TempDir()
	dxf, toml := twoZoneRoof(t, dir)
	out := filepath.Join(dir, "out")
	var stdout, stderr bytes.Buffer
	code := run([]string{"check", dxf, "-p", toml, "-o", out}, &stdout, &stderr)
	require.NotEqual(t, exitUsage, code, "stderr:\n%s", stderr.String())
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	require.NoError(t, err)
	wA := (0.6*60 - 0.6*8) * 16 / 144
	wB := (0.6*50 - 0.6*25) * 16 / 144
	r1 := (wA*170*(192-85) + wB*22*(192-181)) / 192
	fb := r1 * r1 / (2 * wA) / (1.5 * 7.25 * 7.25 / 6)
	interior := 0
	for i := range r.Members {
		m := &r.Members[i]
		if m.TribIn != 16 {
			continue
		}
		interior++
		c := checkOf(t, m, "bending-bottom")
		assert.InDelta(t, fb, c.Actual, fb*5e-6, "%s bottom-edge fb (statics in the test comment; results.json holds 6 significant digits)", m.ID)
		assert.Contains(t, c.Combo, "0.6D+0.6W(up)")
		msgs := strings.Join(m.Messages, " ")
		assert.Contains(t, msgs, "EDGE from 0.0 to 170.0 in", "%s: FRM206 names the zones and their lengths", m.ID)
		assert.Contains(t, msgs, "FIELD from 170.0 to 192.0 in", "%s: FRM206 names the zones and their lengths", m.ID)
	}
	assert.Equal(t, 5, interior, "five interior joists")
}

// TestSlopedRoof_TakeoffAndLoads: the same roof at 8 in 12 (cos = 12 /
// sqrt(12^2 + 8^2) = 0.8321): each 192 in plan joist is 230.8 in along
// the slope, so it is ordered at 20 ft, not 16 ft (DOMAIN.md "Takeoff",
// next even foot); the dead load of 8 psf on slope is 9.615 psf on plan
// (x 1/cos), so D + Lr on an interior joist (trib 16 in) gives, on the edge
// zone, w = (9.615 + 20) 16/144 = 3.2906 lb/in (statics written out).
func TestSlopedRoof_TakeoffAndLoads(t *testing.T) {
	dir := t.TempDir()
	dxf, toml := twoZoneRoof(t, dir)
	data, err := os.ReadFile(toml)
	require.NoError(t, err)
	one := strings.Replace(string(data), "wind_up_psf = 60\n", "wind_up_psf = 60\npitch = 8\n", 1)
	one = strings.Replace(one, "wind_up_psf = 50\n", "wind_up_psf = 50\npitch = \"8:12\"\n", 1)
	require.NoError(t, os.WriteFile(toml, []byte(one), 0o644))
	out := filepath.Join(dir, "out")
	var stdout, stderr bytes.Buffer
	code := run([]string{"check", dxf, "-p", toml, "-o", out}, &stdout, &stderr)
	require.NotEqual(t, exitUsage, code, "stderr:\n%s", stderr.String())
	r, err := export.ReadJSON(filepath.Join(out, resultsName))
	require.NoError(t, err)
	require.NotEmpty(t, r.Takeoff.Joists)
	for _, l := range r.Takeoff.Joists {
		assert.Equal(t, 20.0, float64(l.OrderLengthFt), "230.8 in along the slope is ordered at 20 ft")
	}
	cos := 12 / math.Hypot(12, 8)
	g1, g2 := (8/cos+20)*16/144, (25/cos+20)*16/144
	rg := (g1*170*(192-85) + g2*22*(192-181)) / 192
	fb := rg * rg / (2 * g1) / (1.5 * 7.25 * 7.25 / 6)
	for i := range r.Members {
		if m := &r.Members[i]; m.TribIn == 16 {
			c := checkOf(t, m, "bending-top")
			assert.InDelta(t, fb, c.Actual, fb*5e-6, "%s top-edge fb under D+Lr (statics in the test comment; results.json holds 6 significant digits)", m.ID)
		}
	}
	// Different pitches across one member are an error on it.
	bad := strings.Replace(one, "pitch = \"8:12\"", "pitch = 4", 1)
	require.NoError(t, os.WriteFile(toml, []byte(bad), 0o644))
	stdout.Reset()
	stderr.Reset()
	code = run([]string{"check", dxf, "-p", toml, "-o", filepath.Join(dir, "out2")}, &stdout, &stderr)
	assert.Equal(t, exitFail, code)
	r2, err := export.ReadJSON(filepath.Join(dir, "out2", resultsName))
	require.NoError(t, err)
	for _, m := range r2.Members {
		assert.Equal(t, "error", m.Status, "%s crosses zones of different pitch", m.ID)
	}
}
