package export

import (
	"fmt"
	"math"
	"os"
	"strings"
)

// keyItem is one entity of the key: a sample line in a layer's colour, or
// a left-aligned text.
type keyItem struct {
	Line   bool
	A, B   [2]float64 // the line, inches
	Colour int        // explicit ACI colour of a sample line
	At     [2]float64 // a text's left end, middle (inches)
	Text   string
}

// KeyTitle heads the key.
const KeyTitle = "FRAMECHECK MARKUP KEY"

// KeyDatum states the datum of the positions the markup gives.
const KeyDatum = "POSITIONS ALONG A MEMBER FROM THE FACE OF ITS FIRST BEARING"

// key lays out the key to the right of the plan's extents (PlanLo/PlanHi,
// else the markup's bounds): 4 text heights clear of the plan, its title
// level with the plan's top, then the datum, then one line per markup
// layer: a sample line 3 text heights long in the layer's colour and
// "FC-FAIL  red (ACI 1): member fails a check", 1.8 text heights apart
// (common practice, no source).
func (m *Markup) key(colours map[string]int) []keyItem {
	if m.NoKey {
		return nil
	}
	hi := m.PlanHi
	if m.PlanLo == ([2]float64{}) && hi == ([2]float64{}) {
		_, hi = m.bounds()
	}
	h := m.textHeight()
	x := hi[0] + 4*h
	y := hi[1]
	items := []keyItem{{At: [2]float64{x, y}, Text: KeyTitle}}
	if m.Stamp != "" {
		y -= 1.8 * h
		items = append(items, keyItem{At: [2]float64{x, y}, Text: m.Stamp})
	}
	y -= 1.8 * h
	items = append(items, keyItem{At: [2]float64{x, y}, Text: KeyDatum})
	for _, l := range markupLayers {
		if l.Name == LayerKey || !m.usesLayer(l.Name) {
			continue
		}
		y -= 1.8 * h
		c := colours[l.Name]
		items = append(items,
			keyItem{Line: true, A: [2]float64{x, y}, B: [2]float64{x + 3*h, y}, Colour: c},
			keyItem{At: [2]float64{x + 4*h, y}, Text: l.Name + "  " + colourName(c) + ": " + l.Meaning})
	}
	return items
}

// keyCount is the number of entities key writes.
func (m *Markup) keyCount() int {
	if m.NoKey {
		return 0
	}
	n := 2
	for _, l := range markupLayers {
		if l.Name != LayerKey && m.usesLayer(l.Name) {
			n += 2
		}
	}
	if m.Stamp != "" {
		n++
	}
	return n
}

// KeyEntities is the number of entities the key puts on LayerKey.
func (m *Markup) KeyEntities() int { return m.keyCount() }

// MarkupStamp is the key's line naming the project and the tool:
// "GARAGE LOFT 2026-041 REV B, FRAMECHECK V1.2.3".
func MarkupStamp(r *Results) string {
	v := r.ToolVersion
	if v == "" {
		v = "version not stamped"
	}
	var parts []string
	for _, s := range []string{r.Project.Name, r.Project.Number} {
		if s != "" {
			parts = append(parts, s)
		}
	}
	if r.Project.Revision != "" {
		parts = append(parts, "REV "+r.Project.Revision)
	}
	s := "FRAMECHECK " + v
	if len(parts) > 0 {
		s = strings.Join(parts, " ") + ", " + s
	}
	return strings.ToUpper(s)
}

// usedSet is the set of ACI colours in cs, sign dropped (a negative colour
// is a layer switched off), 0 and 256 (BYBLOCK, BYLAYER) left out.
func usedSet(cs []int) map[int]bool {
	out := map[int]bool{}
	for _, c := range cs {
		c = int(math.Abs(float64(c)))
		if c > 0 && c < 256 {
			out[c] = true
		}
	}
	return out
}

// DrawingLayerColours returns the ACI colour of every layer in the LAYER
// table of the DXF at path (negative for a layer switched off), leaving
// out our own layers: what the overlay's colours should avoid
// (Markup.UsedACI).
func DrawingLayerColours(path string) ([]int, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, fmt.Errorf("export: %w", err)
	}
	defer f.Close()
	facts, err := scanDXF(f, path)
	if err != nil {
		return nil, fmt.Errorf("export: %w", err)
	}
	return facts.LayerColours, nil
}
