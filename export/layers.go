package export

// Layers of our own that the annotated DXF and the overlay add, with their
// ACI colour numbers. The names start with "FC-" so they never collide with
// a designer's layers; an existing layer of the same name is reused.
const (
	LayerFail     = "FC-FAIL"         // a LINE over every failing or erroring member
	LayerBlocking = "FC-BLOCKING-ADD" // a LINE across the run for every blocking row to add
	LayerLabel    = "FC-LABEL"        // a TEXT "mark ratio" at each member's midpoint
	LayerUplift   = "FC-UPLIFT"       // a TEXT "uplift N lb" at each bearing with flagged net uplift
)

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
}
