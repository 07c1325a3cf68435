package export

import (
	"fmt"
	"math"
)

// The plan colours each member by its largest ratio on a continuous scale
// (ratioColour) and gives it the CSS class of its ratio band (bandClass), so
// a reader can restyle or filter by band. The bands and colours are our own
// choice (common practice, no source): blue for lightly used members, green
// to amber approaching the limit, red at 1.0, purple past it.
const (
	bandLow   = "band-lt50"   // ratio < 0.50
	bandMid   = "band-50-75"  // 0.50 <= ratio < 0.75
	bandHigh  = "band-75-90"  // 0.75 <= ratio < 0.90
	bandLimit = "band-90-100" // 0.90 <= ratio <= 1.00
	bandOver  = "band-over"   // ratio > 1.00, or status fail
	bandError = "band-error"  // status error, or no finite ratio
)

// bandClass returns the ratio band of a member or mark. A member that
// fails for another reason (RB > 50) is put in bandOver whatever its ratio.
func bandClass(ratio float64, status string) string {
	switch {
	case status == StatusError || !finite(ratio):
		return bandError
	case status == StatusFail || ratio > 1:
		return bandOver
	case ratio >= 0.90:
		return bandLimit
	case ratio >= 0.75:
		return bandHigh
	case ratio >= 0.50:
		return bandMid
	}
	return bandLow
}

// colourStop is one stop of the ratio colour scale.
type colourStop struct {
	Ratio   float64
	R, G, B uint8
}

// colourStops is the continuous scale from 0 to the largest ratio shown
// (1.5); between stops the colour is interpolated linearly in sRGB.
var colourStops = []colourStop{
	{0.00, 0x2b, 0x6c, 0xb0}, // blue
	{0.50, 0x1e, 0x9a, 0x6e}, // green
	{0.80, 0xd9, 0xa4, 0x1a}, // amber
	{1.00, 0xd7, 0x30, 0x1f}, // red
	{1.50, 0x6a, 0x1b, 0x9a}, // purple
}

// errorColour is the stroke of a member in error.
const errorColour = "#6b6b6b"

// ratioColour returns the scale's colour at ratio as #rrggbb; ratios beyond
// the ends take the end colours, a non-finite ratio the error colour.
func ratioColour(ratio float64) string {
	if !finite(ratio) {
		return errorColour
	}
	r, g, b := ratioRGB(ratio)
	return fmt.Sprintf("#%02x%02x%02x", r, g, b)
}

func ratioRGB(ratio float64) (uint8, uint8, uint8) {
	s := colourStops
	if ratio <= s[0].Ratio {
		return s[0].R, s[0].G, s[0].B
	}
	for i := 1; i < len(s); i++ {
		if ratio <= s[i].Ratio {
			t := (ratio - s[i-1].Ratio) / (s[i].Ratio - s[i-1].Ratio)
			mix := func(a, b uint8) uint8 { return uint8(math.Round(float64(a) + t*(float64(b)-float64(a)))) }
			return mix(s[i-1].R, s[i].R), mix(s[i-1].G, s[i].G), mix(s[i-1].B, s[i].B)
		}
	}
	l := s[len(s)-1]
	return l.R, l.G, l.B
}

// appendColour appends ratioColour(ratio) to b without allocating.
func appendColour(b []byte, ratio float64) []byte {
	if !finite(ratio) {
		return append(b, errorColour...)
	}
	const hex = "0123456789abcdef"
	r, g, bl := ratioRGB(ratio)
	return append(b, '#', hex[r>>4], hex[r&15], hex[g>>4], hex[g&15], hex[bl>>4], hex[bl&15])
}

// legendRow is one swatch of the legend: a band with its range and the
// colour at the band's middle.
type legendRow struct {
	Class, Label, Colour string
}

func legendRows() []legendRow {
	return []legendRow{
		{bandLow, "below 0.50", ratioColour(0.25)},
		{bandMid, "0.50 to 0.75", ratioColour(0.625)},
		{bandHigh, "0.75 to 0.90", ratioColour(0.825)},
		{bandLimit, "0.90 to 1.00", ratioColour(0.95)},
		{bandOver, "over 1.00 (fails)", ratioColour(1.25)},
		{bandError, "error (not checked)", errorColour},
	}
}
