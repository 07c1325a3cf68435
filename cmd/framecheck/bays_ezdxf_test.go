package main

import (
	"path/filepath"
	"testing"
)

// TestBaysEzdxfFixtures reads the plans ezdxf wrote
// (testdata/bays/gen_bays.py: the layout of bays_test.go, drawn by an
// independent writer, turned and scaled by ezdxf's own transform) and
// compares each bay form with the drawing of every joist, as
// TestBaysMatchCentreLines does for our own writer; pwidth draws the
// arrowheads as polyline segments with a width, which our writer does not.
func TestBaysEzdxfFixtures(t *testing.T) {
	dir := filepath.Join("testdata", "bays")
	for _, tr := range []string{"plan", "turned"} {
		proj := filepath.Join(t.TempDir(), "conv.toml")
		ref := convRunFile(t, filepath.Join(dir, tr+"_ref.dxf"), proj)
		checkBayRef(t, tr+"_ref", ref)
		for _, form := range []string{"outline", "arrows", "halfarrows", "solid", "pwidth"} {
			label := tr + "_" + form
			got := convRunFile(t, filepath.Join(dir, label+".dxf"), proj)
			noErrors(t, label, got)
			if len(got.Plan.Members) != 9 {
				t.Fatalf("%s: %d members, want 9 (issues %v)", label, len(got.Plan.Members), got.Plan.Issues)
			}
			sameBayMembers(t, label, ref, got, 0, true)
		}
	}
}

// TestBaysEzdxfBadInput: the bad-input plans as ezdxf wrote them give
// the findings TestBaysBadInput asks of our own writer's.
func TestBaysEzdxfBadInput(t *testing.T) {
	dir := filepath.Join("testdata", "bays")
	proj := filepath.Join(t.TempDir(), "conv.toml")
	ref := convRunFile(t, filepath.Join(dir, "plan_ref.dxf"), proj)
	got := map[string]*outcome{}
	for _, bad := range []string{"noside", "spacing", "drawn"} {
		got[bad] = convRunFile(t, filepath.Join(dir, "bad_"+bad+".dxf"), proj)
	}
	checkBadBays(t, "ezdxf", ref, got)
}
