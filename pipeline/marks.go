package pipeline

import "framecheck/framing"

// assignMarks names the marks of plan keeping the names known (from
// marks.json) by drawn keys. When known names none of this plan's
// members (another plan's folder, or a new design), the marks are named
// afresh from J1 and fresh is true.
func assignMarks(plan *framing.Plan, drawn []string, known map[string]string) (marks map[string]string, fresh bool) {
	if len(known) > 0 {
		reused := false
		for _, k := range drawn {
			if _, ok := known[k]; ok && k != "" {
				reused = true
				break
			}
		}
		if !reused {
			known, fresh = nil, true
		}
	}
	return framing.AssignMarksKept(plan, drawn, known), fresh
}
