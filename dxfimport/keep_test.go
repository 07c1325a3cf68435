package dxfimport

import (
	"bufio"
	"fmt"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
	"time"
)

func keepJoists(layer string) bool { return strings.HasPrefix(layer, "JOIST") }

func lineOn(layer string, h int) string {
	return dxf(0, "LINE", 5, fmt.Sprintf("%X", h), 8, layer, 10, 0, 20, 0, 11, 10, 21, 0)
}

// TestKeepCountsOtherLayers: entities on layers Keep refuses are counted
// by layer and kind, not kept, in model space and inside blocks (an
// entity on layer 0 takes the insert's layer).
func TestKeepCountsOtherLayers(t *testing.T) {
	s := section("BLOCKS",
		dxf(0, "BLOCK", 2, "B", 10, 0, 20, 0),
		lineOn("0", 0x20), lineOn("JOIST-B", 0x21), dxf(0, "CIRCLE", 8, "FURN", 10, 0, 20, 0, 40, 1),
		dxf(0, "ENDBLK"),
	) + section("ENTITIES",
		lineOn("JOIST", 0x30), lineOn("FURN", 0x31), lineOn("FURN", 0x32),
		dxf(0, "INSERT", 5, "40", 8, "FURN", 2, "B", 10, 100, 20, 0),
		dxf(0, "INSERT", 5, "41", 8, "JOIST-C", 2, "B", 10, 200, 20, 0),
	) + dxf(0, "EOF")
	d := read(t, s, Options{Keep: keepJoists})
	var kept []string
	for _, e := range d.Entities {
		kept = append(kept, e.Pos.Layer)
	}
	// hand count: JOIST; JOIST-B from each insert; the layer-0 line of the
	// insert on JOIST-C.
	if got := strings.Join(kept, ","); got != "JOIST,JOIST-B,JOIST-C,JOIST-B" {
		t.Errorf("kept %s", got)
	}
	want := map[string]map[Kind]int{"FURN": {KindLine: 3, KindCircle: 2}}
	if fmt.Sprint(d.Dropped) != fmt.Sprint(want) {
		t.Errorf("dropped %v, want %v", d.Dropped, want)
	}
	all := read(t, s, Options{})
	if len(all.Entities) != len(d.Entities)+5 || len(all.Dropped) != 0 {
		t.Errorf("without Keep: %d entities, dropped %v", len(all.Entities), all.Dropped)
	}
}

// TestKeepLimitAppliesToKept: MaxEntities counts the kept entities only;
// an insert past the limit that places nothing kept is a warning, one
// that would place kept entities an error.
func TestKeepLimitAppliesToKept(t *testing.T) {
	var noise strings.Builder
	for i := 0; i < 50; i++ {
		noise.WriteString(lineOn("FURN", 0x100+i))
	}
	s := section("ENTITIES", noise.String(), lineOn("JOIST", 0x30), lineOn("JOIST", 0x31)) + dxf(0, "EOF")
	d := read(t, s, Options{Keep: keepJoists, MaxEntities: 10})
	if len(d.Entities) != 2 || d.Issues.Err() != nil || d.Dropped["FURN"][KindLine] != 50 {
		t.Errorf("kept %d, issues %v, dropped %v", len(d.Entities), d.Issues, d.Dropped)
	}
	bomb := func(layer string) string {
		return section("BLOCKS", dxf(0, "BLOCK", 2, "A", 10, 0, 20, 0), lineOn(layer, 0x20), dxf(0, "ENDBLK")) +
			section("ENTITIES", dxf(0, "INSERT", 5, "40", 8, "0", 2, "A", 10, 0, 20, 0, 70, 100, 71, 100, 44, 1, 45, 1),
				lineOn("JOIST", 0x30)) + dxf(0, "EOF")
	}
	d = read(t, bomb("FURN"), Options{Keep: keepJoists, MaxEntities: 1000})
	if is := findIssue(d, "DXF105"); is == nil || is.Severity != SevWarning || len(d.Entities) != 1 {
		t.Errorf("a noise insert past the limit: %v, %d kept", d.Issues, len(d.Entities))
	}
	d = read(t, bomb("JOIST-X"), Options{Keep: keepJoists, MaxEntities: 1000})
	if is := findIssue(d, "DXF105"); is == nil || is.Severity != SevError {
		t.Errorf("a joist insert past the limit: %v", d.Issues)
	}
}

// TestNoiseMemoryBounded reads a drawing of one joist and n lines of
// furniture (n = 1,000,000, about 70 MB; 15,000,000 with
// FRAMECHECK_NOISE_GB=1, about 1 GB) and checks that the heap after the
// read holds the kept entities, not the noise: a kept line costs some
// 150 bytes, so 1 M kept lines would be over 140 MB. Skipped with -short.
func TestNoiseMemoryBounded(t *testing.T) {
	if testing.Short() {
		t.Skip("writes a large drawing")
	}
	n := 1_000_000
	if os.Getenv("FRAMECHECK_NOISE_GB") != "" {
		n = 15_000_000
	}
	p := filepath.Join(t.TempDir(), "noise.dxf")
	f, err := os.Create(p)
	if err != nil {
		t.Fatal(err)
	}
	w := bufio.NewWriterSize(f, 1<<20)
	w.WriteString(section("HEADER", dxf(9, "$INSUNITS", 70, 1)))
	w.WriteString(dxf(0, "SECTION", 2, "ENTITIES"))
	w.WriteString(lineOn("JOIST", 0x10))
	for i := 0; i < n; i++ {
		fmt.Fprintf(w, "  0\nLINE\n  5\n%X\n  8\nA-FURN\n 10\n%d\n 20\n%d\n 11\n%d.5\n 21\n%d.5\n", 0x100+i, i%1000, i/1000, i%1000, i/1000)
	}
	w.WriteString(dxf(0, "ENDSEC", 0, "EOF"))
	if err := w.Flush(); err != nil {
		t.Fatal(err)
	}
	f.Close()
	var before, after runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&before)
	// Peak heap during the read, sampled (ReadMemStats stops the world
	// briefly; no timing is asserted).
	done, peakc := make(chan bool), make(chan uint64)
	go func() {
		var m runtime.MemStats
		peak := uint64(0)
		for {
			runtime.ReadMemStats(&m)
			peak = max(peak, m.HeapInuse)
			select {
			case <-done:
				peakc <- peak
				return
			case <-time.After(20 * time.Millisecond):
			}
		}
	}()
	d, err := ReadFile(p, Options{Keep: keepJoists})
	done <- true
	peak := int64(<-peakc) - int64(before.HeapInuse)
	if err != nil {
		t.Fatal(err)
	}
	runtime.GC()
	runtime.ReadMemStats(&after)
	grew := int64(after.HeapAlloc) - int64(before.HeapAlloc)
	if len(d.Entities) != 1 || d.Dropped["A-FURN"][KindLine] != n {
		t.Fatalf("kept %d, dropped %v", len(d.Entities), d.Dropped)
	}
	// What stays is the kept entities; at the peak, the reader's buffers
	// and the garbage not yet collected: bounds of 1 MB and 64 MB (kept,
	// the noise lines alone would be over 140 MB).
	if grew > 1<<20 || peak > 64<<20 {
		t.Errorf("reading %d noise lines: heap grew %d KB, peak %d MB; want under 1 MB and 64 MB", n, grew>>10, peak>>20)
	}
	t.Logf("%d noise lines: heap grew %d KB, peak %d MB", n, grew>>10, peak>>20)
	runtime.KeepAlive(d)
}
