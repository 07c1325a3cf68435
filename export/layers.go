package export

import (
	"strconv"
	"strings"
)

// Layers of our own that the annotated DXF and the overlay add. The names
// start with "FC-" so they never collide with a designer's layers; an
// existing layer of the same name is reused (with its own colour).
const (
	LayerFail     = "FC-FAIL"         // a LINE over every failing member
	LayerError    = "FC-ERROR"        // a LINE over every member in error, and its short reason
	LayerBlocking = "FC-BLOCKING-ADD" // a LINE across the run for every blocking row to add, one note per run
	LayerLabel    = "FC-LABEL"        // one TEXT per run and mark: mark, size@spacing, governing check, ratio
	LayerUplift   = "FC-UPLIFT"       // a TEXT "uplift N lb" at each bearing with flagged net uplift
	LayerID       = "FC-ID"           // member ids (M54), small, to switch off when not wanted
	LayerKey      = "FC-KEY"          // the key: each markup layer, its colour and meaning
	// LayerGenerated holds a LINE on every generated member (laid out in
	// a bay shown by a span symbol, not drawn on the plan).
	LayerGenerated = "FC-GENERATED"
)

// usesLayer reports whether the markup declares layer name: all of ours
// but LayerGenerated, which only a plan with generated members gets (so
// the files of plans without bays are as they were).
func (m *Markup) usesLayer(name string) bool {
	return name != LayerGenerated || len(m.Generated) > 0
}

// markupLayer is one of our layers: its name, the meaning the key gives
// it, the ACI colours it may take in order of preference, and for R2000+
// its lineweight in 1/100 mm.
type markupLayer struct {
	Name       string
	Meaning    string
	Prefer     []int
	LineWeight int
}

// markupLayers lists our layers in the key's order. Every colour prints
// on white paper: no ACI 2 (yellow), 7 (white/black, the drawing's own),
// nor the pale hues (ACI x1, x3, 50-60 yellows); each list keeps to one
// hue family so the key's meaning of a colour holds whichever is picked
// (common practice, no source).
var markupLayers = []markupLayer{
	{LayerFail, "member fails a check (see its run's label)", []int{1, 10, 12, 240, 242, 14}, 70},
	{LayerError, "member in error: not checked, reason beside it", []int{6, 210, 212, 200, 202, 214}, 70},
	{LayerBlocking, "blocking rows to add (not drawn on the plan)", []int{5, 150, 152, 160, 162, 170}, 35},
	{LayerLabel, "mark size@spacing, governing check and ratio, one per run", []int{32, 22, 34, 42, 24, 30}, 18},
	{LayerUplift, "net uplift at a bearing, ASD lb: connector demand", []int{94, 92, 96, 84, 112, 3}, 18},
	{LayerID, "member ids (switch this layer off to hide them)", []int{251, 252, 250, 253, 8, 9}, 13},
	{LayerGenerated, "joists laid out in a bay from its span symbol and callout (not drawn on the plan)", []int{4, 130, 132, 140, 142, 134}, 25},
	{LayerKey, "this key", []int{250, 251, 252, 7}, 18},
}

// aciNames names the colours our layers may take, for the key.
var aciNames = map[int]string{
	1: "red", 3: "green", 5: "blue", 6: "magenta", 7: "black", 8: "dark grey", 9: "grey",
	10: "red", 12: "dark red", 14: "deep red", 240: "crimson", 242: "dark crimson",
	22: "brown", 24: "dark brown", 30: "orange", 32: "dark orange", 34: "brown-orange", 42: "ochre",
	84: "dark green", 92: "dark green", 94: "deep green", 96: "forest green", 112: "teal green",
	150: "blue", 152: "dark blue", 160: "royal blue", 162: "dark royal blue", 170: "indigo",
	200: "purple", 202: "dark purple", 210: "violet", 212: "dark violet", 214: "deep violet",
	250: "charcoal", 251: "dark grey", 252: "grey", 253: "mid grey",
}

// colourName is "dark red (ACI 12)".
func colourName(aci int) string {
	n := aciNames[aci]
	if n == "" {
		return "ACI " + strconv.Itoa(aci)
	}
	return n + " (ACI " + strconv.Itoa(aci) + ")"
}

// chooseColours gives each of our layers the first colour of its
// preference list that the drawing does not use (used: ACI numbers of the
// drawing's layers, sign dropped) and no earlier layer of ours took; when
// every one is taken, the first not taken by ours. A layer of ours that
// the drawing already has keeps its place in used but is not avoided by
// itself: reannotating an annotated drawing gives the same colours.
func chooseColours(used map[int]bool) map[string]int {
	out := make(map[string]int, len(markupLayers))
	taken := map[int]bool{}
	for _, l := range markupLayers {
		pick := 0
		for _, c := range l.Prefer {
			if !used[c] && !taken[c] {
				pick = c
				break
			}
		}
		if pick == 0 {
			for _, c := range l.Prefer {
				if !taken[c] {
					pick = c
					break
				}
			}
		}
		if pick == 0 {
			pick = l.Prefer[0]
		}
		taken[pick] = true
		out[l.Name] = pick
	}
	return out
}

// isOurLayer reports whether name is one of our layers.
func isOurLayer(name string) bool {
	for _, l := range markupLayers {
		if strings.EqualFold(l.Name, name) {
			return true
		}
	}
	return false
}
