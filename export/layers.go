package export

// Layers of our own that the annotated DXF and the overlay add, with their
// ACI colour numbers. The names start with "FC-" so they never collide with
// a designer's layers; an existing layer of the same name is reused.
const (
	LayerFail     = "FC-FAIL"         // a LINE over every failing or erroring member
	LayerBlocking = "FC-BLOCKING-ADD" // a LINE across the run for every blocking row to add
	LayerLabel    = "FC-LABEL"        // a TEXT "mark ratio" at each member's midpoint
	LayerUplift   = "FC-UPLIFT"       // a TEXT "uplift N lb" at each bearing with flagged net uplift
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

// markupLayers lists our layers with colour (ACI) and, for R2000+,
// lineweight in 1/100 mm.
var markupLayers = []struct {
	Name       string
	Color      int
	LineWeight int
}{
	{LayerFail, 1, 70},
	{LayerBlocking, 4, 35},
	{LayerLabel, 2, 18},
	{LayerUplift, 6, 18},
	{LayerGenerated, 3, 25},
}
