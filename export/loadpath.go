package export

// LoadPath is what the load path found below the joists: the beams checked
// with the loads they carry, the posts, every connection's demand and the
// loads reaching the foundation (results.json "load_path"; the Beams,
// Posts, Connections and Foundation sheets; the report's load path
// section). Absent when the plan has no beams or posts.
type LoadPath struct {
	Beams       []PathBeam       `json:"beams"`
	Posts       []PathPost       `json:"posts"`
	Connections []Connection     `json:"connections"`
	Foundation  []FoundationLine `json:"foundation"`
	// Applied and Delivered are the loads put on the members of the path
	// and those reaching walls, posts and rigid supports, by load type:
	// equal when nothing is lost.
	Applied   TypeLoads `json:"applied"`
	Delivered TypeLoads `json:"delivered"`
}

// TypeLoads are loads by type, lb: D, L, Lr, S, W toward and W away (a
// magnitude), and the dead load relied on against uplift.
type TypeLoads struct {
	DeadLb       float64 `json:"dead_lb"`
	LiveLb       float64 `json:"live_lb"`
	RoofLiveLb   float64 `json:"roof_live_lb"`
	SnowLb       float64 `json:"snow_lb"`
	WindDownLb   float64 `json:"wind_down_lb"`
	WindUpLb     float64 `json:"wind_up_lb"`
	UpliftDeadLb float64 `json:"uplift_dead_lb"`
}

// PathBeam is a beam, header, girder or ledger checked as a member.
type PathBeam struct {
	ID     string `json:"id"`
	Mark   string `json:"mark"` // B1, B2, ... for beams alike
	Kind   string `json:"kind"` // flush-beam, dropped-beam, ledger
	Layer  string `json:"layer"`
	Source string `json:"source"`
	// Start and End are in drawing units; StartIn and EndIn in inches, for
	// the markup.
	Start, End     [2]float64 `json:"-"`
	StartIn, EndIn [2]float64 `json:"-"`
	LengthIn       float64    `json:"length_in"`
	SpansIn        []float64  `json:"spans_in"`
	Size           string     `json:"size"`
	Species        string     `json:"species"`
	Grade          string     `json:"grade"`
	// Supports names what carries each bearing ("P1", "wall W2", "B3"),
	// Carries the joists whose reactions it takes, then the beams bearing
	// on it.
	Supports  []string `json:"supports"`
	Carries   []string `json:"carries"`
	Checks    []Check  `json:"checks"`
	Governing string   `json:"governing"`
	MaxRatio  float64  `json:"max_ratio"`
	Status    string   `json:"status"`
	Messages  []string `json:"messages"`
}

// PathPost is a post under a beam.
type PathPost struct {
	ID       string     `json:"id"`
	Source   string     `json:"source"`
	At       [2]float64 `json:"at"` // drawing units
	AtIn     [2]float64 `json:"-"`
	Size     string     `json:"size"`
	Species  string     `json:"species"`
	Grade    string     `json:"grade"`
	HeightIn float64    `json:"height_in"`
	// Checked: with a size and height it is checked as a column (NDS 2018
	// 3.7); otherwise its load is only reported.
	Checked   bool      `json:"checked"`
	Loads     TypeLoads `json:"loads"`
	DownLb    float64   `json:"down_lb"` // largest downward ASD load and its combination
	DownCombo string    `json:"down_combo"`
	UpLb      float64   `json:"up_lb"` // largest net uplift (tension at the base)
	UpCombo   string    `json:"up_combo"`
	Checks    []Check   `json:"checks"`
	Status    string    `json:"status"` // pass | fail | error, "" when not checked
	Messages  []string  `json:"messages"`
}

// Connection is the demand at one joint: a member's bearing on what
// carries it (a hanger, a joist on a beam, a post cap, a beam on a wall, a
// post's base), ASD, with the combinations that give it. No connector is
// named: the designer picks the part.
type Connection struct {
	Kind      string    `json:"kind"`
	Member    string    `json:"member"`
	Bearing   int       `json:"bearing"` // 1-based
	Carrier   string    `json:"carrier"`
	Loads     TypeLoads `json:"loads"`
	DownLb    float64   `json:"down_lb"`
	DownCombo string    `json:"down_combo"`
	UpLb      float64   `json:"up_lb"`
	UpCombo   string    `json:"up_combo"`
}

// FoundationLine is what reaches the foundation at one wall line or post:
// the loads by type (a wall's also per foot of its length).
type FoundationLine struct {
	Kind     string    `json:"kind"` // wall | post | rigid
	ID       string    `json:"id"`
	Source   string    `json:"source"`
	LengthIn float64   `json:"length_in,omitempty"` // walls
	Loads    TypeLoads `json:"loads"`
	PerFoot  TypeLoads `json:"per_foot_plf"` // walls: Loads / length in ft
}
