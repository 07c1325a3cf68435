package main

import (
	"strings"
	"testing"
)

// A length typed as every output prints it gives the same joist as in
// inches; a bare number is refused naming both readings, exit 2.
func TestMemberSpanTradeForms(t *testing.T) {
	var first string
	for _, span := range []string{`14'-6"`, `14' 6"`, "174in", `174"`, "14.5ft", "4419.6mm"} {
		code, out, errs := runCmd("member", "--size", "2x10", "--span", span, "--spacing", `16"`, "--bearing", `3 1/2"`)
		if code != exitOK || errs != "" {
			t.Fatalf("--span %s: exit %d, %s", span, code, errs)
		}
		// 14'-6" = 174 in = 14.5 ft; 4419.6 mm / 25.4 = 174 in
		if !strings.Contains(out, "spans 174 in (14.5 ft)") {
			t.Errorf("--span %s: %s", span, out)
		}
		if first == "" {
			first = out
		} else if out != first {
			t.Errorf("--span %s gives another result than %s", span, `14'-6"`)
		}
	}
	code, _, errs := runCmd("member", "--size", "2x10", "--span", "14")
	if code != exitUsage || !strings.Contains(errs, "--span 14: 14 in or 14 ft? write 14ft or 14in") {
		t.Errorf("bare span: exit %d, %q", code, errs)
	}
}
