package export

import (
	"encoding/json"
	"fmt"
	"os"
)

// ReadJSON reads a results.json that WriteJSON wrote and returns the
// Results as they were in memory: each member's checks with their traces
// and its factors, taken from its calculation, and its info lines, taken
// from "info_lists" (members of one calculation or one list share those
// slices). Numbers are those of the file: from schema 3 rounded as
// json_num.go says. Files of schema framecheck-results/2 (members carry
// their checks without traces and their info lines) and
// framecheck-results/1 (members carry their own traces) are read too.
// Top-level sections this function does not know of are read as Results
// declares them. Errors name the file and, for a member whose calculation
// or info list is missing or does not match its checks, the member.
func ReadJSON(path string) (*Results, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return ParseJSON(path, data)
}

// ParseJSON is ReadJSON on data read from the file named name.
func ParseJSON(name string, data []byte) (*Results, error) {
	var head struct {
		Schema string `json:"schema"`
	}
	if err := json.Unmarshal(data, &head); err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	switch head.Schema {
	case Schema:
		return parseV3(name, data)
	case "framecheck-results/1", "framecheck-results/2":
	default:
		return nil, fmt.Errorf("%s: schema %q: want %q, framecheck-results/2 or framecheck-results/1", name, head.Schema, Schema)
	}
	var f struct {
		Results
		Calculations map[string]Calculation `json:"calculations"`
	}
	if err := json.Unmarshal(data, &f); err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	r := &f.Results
	if r.Schema == "framecheck-results/1" {
		return r, nil
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

// fileMemberV3 is a member as schema 3 writes it: no checks, its info
// lines named in InfoList, its source as a DXF line when it can be
// derived, its location absent when it can be derived (json_share.go).
type fileMemberV3 struct {
	Member
	InfoList string  `json:"info_list"`
	Line     int     `json:"line"`
	Location *string `json:"location"`
}

// fileMarkV3 is a mark with the member fields its members share.
type fileMarkV3 struct {
	Mark
	Shared json.RawMessage `json:"shared"`
}

// fileUpliftV3 is the uplift section of schema 3: a bearing's mark and
// support are absent when they can be derived.
type fileUpliftV3 struct {
	ReportLb float64 `json:"report_lb"`
	Bearings []struct {
		UpliftBearing
		Mark    *string `json:"mark"`
		Support *string `json:"support"`
	} `json:"bearings"`
}

// parseV3 reads a schema 3 file: each member's fields its mark shares from
// the mark's "shared", its source and location from "source_file" and
// what the member holds, its checks and factors from its calculation, its
// info lines from "info_lists"; an uplift bearing's mark from its member
// and its support from its support's layer and handle. Members of one mark
// share the slices of its shared fields.
func parseV3(name string, data []byte) (*Results, error) {
	var f struct {
		Results
		SourceFile   string                 `json:"source_file"`
		Members      []json.RawMessage      `json:"members"`
		Marks        []fileMarkV3           `json:"marks"`
		Uplift       fileUpliftV3           `json:"uplift"`
		Calculations map[string]Calculation `json:"calculations"`
		InfoLists    map[string][]string    `json:"info_lists"`
		LoadPath     *fileLoadPathV3        `json:"load_path"`
	}
	if err := json.Unmarshal(data, &f); err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	r := &f.Results
	templates := map[string]*fileMemberV3{}
	r.Marks = make([]Mark, len(f.Marks))
	for i := range f.Marks {
		r.Marks[i] = f.Marks[i].Mark
		if len(f.Marks[i].Shared) == 0 {
			continue
		}
		if _, ok := templates[f.Marks[i].Mark.Mark]; ok {
			continue
		}
		t := &fileMemberV3{}
		if err := json.Unmarshal(f.Marks[i].Shared, t); err != nil {
			return nil, fmt.Errorf("%s: mark %s: shared: %w", name, f.Marks[i].Mark.Mark, err)
		}
		templates[f.Marks[i].Mark.Mark] = t
	}
	toInch, _ := UnitToInch(r.DrawingUnits)
	r.Members = make([]Member, len(f.Members))
	// the checks of each calculation, one slice shared by all that name it
	shared := make(map[string][]Check, len(f.Calculations))
	calcChecks := func(id string, c Calculation) []Check {
		cs, ok := shared[id]
		if !ok {
			cs = make([]Check, len(c.Checks))
			for j, cc := range c.Checks {
				cs[j] = Check(cc)
			}
			shared[id] = cs
		}
		return cs
	}
	marks := make(map[string]string, len(f.Members))
	for i, raw := range f.Members {
		var fm fileMemberV3
		if err := json.Unmarshal(raw, &fm); err != nil {
			return nil, fmt.Errorf("%s: members[%d]: %w", name, i, err)
		}
		if t, ok := templates[fm.Mark]; ok { // again, over what the mark shares
			fm = *t
			if err := json.Unmarshal(raw, &fm); err != nil {
				return nil, fmt.Errorf("%s: members[%d]: %w", name, i, err)
			}
		}
		m := &r.Members[i]
		*m = fm.Member
		marks[m.ID] = m.Mark
		if m.Source == "" && fm.Line > 0 && f.SourceFile != "" {
			m.Source = sourceText(f.SourceFile, fm.Line, m.Handle, m.Layer)
		}
		if fm.Location != nil {
			m.Location = *fm.Location
		} else if loc, ok := locationOf(f.SourceFile, m.Handle, fm.Line, m.Layer, m.Start, m.End, toInch); ok {
			m.Location = loc
		}
		if fm.InfoList != "" {
			info, ok := f.InfoLists[fm.InfoList]
			if !ok {
				return nil, fmt.Errorf("%s: member %s: info list %q not in \"info_lists\"", name, m.ID, fm.InfoList)
			}
			m.Info = info
		}
		if m.Calculation == "" {
			m.Checks = []Check{}
			continue
		}
		c, ok := f.Calculations[m.Calculation]
		if !ok {
			return nil, fmt.Errorf("%s: member %s: calculation %q not in \"calculations\"", name, m.ID, m.Calculation)
		}
		m.Checks = calcChecks(m.Calculation, c)
		m.Factors = c.Factors
	}
	if f.LoadPath != nil {
		lp, err := f.LoadPath.loadPath(name, func(id string) ([]Check, bool) {
			c, ok := f.Calculations[id]
			if !ok {
				return nil, false
			}
			return calcChecks(id, c), true
		})
		if err != nil {
			return nil, err
		}
		r.LoadPath = lp
	}
	r.Uplift = UpliftReport{ReportLb: f.Uplift.ReportLb}
	if f.Uplift.Bearings != nil {
		r.Uplift.Bearings = make([]UpliftBearing, len(f.Uplift.Bearings))
	}
	for i := range f.Uplift.Bearings {
		fb := &f.Uplift.Bearings[i]
		b := fb.UpliftBearing
		if fb.Mark != nil {
			b.Mark = *fb.Mark
		} else {
			b.Mark = marks[b.Member]
		}
		if fb.Support != nil {
			b.Support = *fb.Support
		} else {
			b.Support = upliftSupportText(b.SupportLayer, b.SupportHandle)
		}
		r.Uplift.Bearings[i] = b
	}
	f.Members = nil
	return r, nil
}
