package export

import (
	"encoding/json"
	"fmt"
	"os"
)

// ReadJSON reads a results.json that WriteJSON wrote and returns the
// Results as they were in memory: each member's checks with their traces
// and its factors, taken from its calculation (members of one calculation
// share those slices). Files of schema framecheck-results/1, whose members
// carry their own traces, are read as they are. Errors name the file and,
// for a member whose calculation is missing or does not match its checks,
// the member.
func ReadJSON(path string) (*Results, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return ParseJSON(path, data)
}

// ParseJSON is ReadJSON on data read from the file named name.
func ParseJSON(name string, data []byte) (*Results, error) {
	var f struct {
		Results
		Calculations map[string]Calculation `json:"calculations"`
	}
	if err := json.Unmarshal(data, &f); err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	r := &f.Results
	switch r.Schema {
	case "framecheck-results/1":
		return r, nil
	case Schema:
	default:
		return nil, fmt.Errorf("%s: schema %q: want %q or framecheck-results/1", name, r.Schema, Schema)
	}
	shared := make(map[string][]Check, len(f.Calculations))
	for i := range r.Members {
		m := &r.Members[i]
		if m.Calculation == "" {
			continue
		}
		c, ok := f.Calculations[m.Calculation]
		if !ok {
			return nil, fmt.Errorf("%s: member %s: calculation %q not in \"calculations\"", name, m.ID, m.Calculation)
		}
		if len(c.Checks) != len(m.Checks) {
			return nil, fmt.Errorf("%s: member %s: %d checks, calculation %s has %d", name, m.ID, len(m.Checks), m.Calculation, len(c.Checks))
		}
		cs, ok := shared[m.Calculation]
		if !ok {
			cs = make([]Check, len(c.Checks))
			for j, cc := range c.Checks {
				cs[j] = Check(cc)
			}
			shared[m.Calculation] = cs
		}
		for j := range m.Checks {
			if a, b := m.Checks[j], cs[j]; a.Kind != b.Kind || a.Combo != b.Combo || a.Ratio != b.Ratio {
				return nil, fmt.Errorf("%s: member %s: check %d (%s, %s) differs from calculation %s (%s, %s)",
					name, m.ID, j+1, a.Kind, a.Combo, m.Calculation, b.Kind, b.Combo)
			}
		}
		m.Checks = cs
		m.Factors = c.Factors
	}
	return r, nil
}
