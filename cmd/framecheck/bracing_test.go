package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"framecheck/export"
)

// TestBracingStated is issue 13 item 6 on the third-point plan: each
// calculation states the bracing relied on (bearings as braces of both
// edges, the sheathing, the drawn row, the row to add, the inflection-point
// rule), the run's assumptions list the bracing once, and the NDS 2018
// 4.4.1.2 rule appears only as the alternative rule, after the CL result.
// Expected wording is ours (common practice, no source).
func TestBracingStated(t *testing.T) {
	plan, toml := thirdPointFiles(t, true)
	out := filepath.Join(filepath.Dir(plan), "out")
	var stdout, stderr bytes.Buffer
	if code := run([]string{"check", plan, "-p", toml, "-o", out}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d\n%s\n%s", code, stdout.String(), stderr.String())
	}
	data, err := os.ReadFile(filepath.Join(out, resultsName))
	if err != nil {
		t.Fatal(err)
	}
	r, err := export.ParseJSON(resultsName, data) // members complete (what marks share filled in)
	if err != nil {
		t.Fatal(err)
	}
	// The summary states each bracing assumption once.
	notes := strings.Join(r.Assumptions.Notes, "\n")
	for _, want := range []string{"Bracing, bearings: every bearing, interior bearings included",
		"rim board or joist hangers", "Bracing, top edge: held continuously by the sheathing",
		"Bracing, bottom edge: no zone has a ceiling", "Bracing, drawn rows:", "Bracing, rows to add:",
		"Bracing, inflection points: not counted", "alternative rule of NDS 2018 4.4.1.2"} {
		if n := strings.Count(notes, want); n != 1 {
			t.Errorf("assumptions name %q %d times, want once", want, n)
		}
	}
	var raw struct {
		Calculations map[string]export.Calculation `json:"calculations"`
	}
	if err := json.Unmarshal(data, &raw); err != nil {
		t.Fatal(err)
	}
	for _, m := range r.Members {
		if len(m.DrawnBlockingAtIn) != 1 || m.DrawnBlockingAtIn[0] != 72 {
			t.Errorf("%s: drawn_blocking_at_in %v, want [72]", m.ID, m.DrawnBlockingAtIn)
		}
		var bracing []string
		for _, c := range raw.Calculations[m.Calculation].Checks {
			for _, it := range c.Trace {
				if it.Name == "bracing points" || (it.Name == "CL" && strings.Contains(it.Formula, "held continuously")) {
					bracing = append(bracing, c.Kind+": "+it.Formula)
				}
			}
		}
		all := strings.Join(bracing, "\n")
		for _, want := range []string{"bending-top: top edge held continuously by the sheathing",
			"bending-bottom: bearings at 0, 216 in, each bracing both edges (assumes blocking, a rim board or hangers there)",
			"drawn rows at 72 in (existing)", "rows to add at 144 in"} {
			if !strings.Contains(all, want) {
				t.Errorf("%s: bracing %q lacks %q", m.ID, all, want)
			}
		}
		for _, info := range m.Info {
			if strings.Contains(info, "4.4.1.2") && (!strings.Contains(info, "the alternative rule of NDS 2018 4.4.1.2 (nominal d/b = 5) would ask for") ||
				!strings.Contains(info, "not a requirement")) {
				t.Errorf("%s: %q", m.ID, info)
			}
		}
	}
	html, err := os.ReadFile(filepath.Join(out, "report.html"))
	if err != nil {
		t.Fatal(err)
	}
	h := string(html)
	if !strings.Contains(h, "<h4>Bracing relied on</h4>") {
		t.Error("report: no bracing list in the calculations")
	}
	// After the bottom edge's result line, not before any CL.
	i := strings.LastIndex(h, `data-kind="bending-bottom"`)
	j := strings.Index(h[max(i, 0):], `class="hint alt-rule"`) + max(i, 0)
	if i < 0 || j < i || strings.Contains(h[i:j], `data-kind="shear"`) || !strings.Contains(h[i:j], `class="result ok"`) {
		t.Errorf("report: the 4.4.1.2 comparison is not right after the bending result (at %d, bending-bottom at %d)", j, i)
	}
}
