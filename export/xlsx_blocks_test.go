package export

import (
	"bytes"
	"errors"
	"runtime"
	"strconv"
	"testing"
	"time"

	"github.com/xuri/excelize/v2"
)

// TestMemberBlocksStopsOnError: when the writer of the blocks fails,
// rowBlocks returns its error, the blocks before it went out in order,
// and no worker or feeder goroutine is left behind (blocks already built
// are drained), on one core or several. Common practice, no source.
func TestMemberBlocksStopsOnError(t *testing.T) {
	f := excelize.NewFile()
	defer f.Close()
	st, err := newStyles(f)
	if err != nil {
		t.Fatal(err)
	}
	members := bigResults(9*rowsPerBlock + 5).Members // ten blocks
	boom := errors.New("disk full")
	base := runtime.NumGoroutine()
	for _, procs := range []int{1, 2, 8} {
		for _, stopAt := range []int{0, 1, 5} {
			old := runtime.GOMAXPROCS(procs)
			var firstRows []int
			err := rowBlocks(st, len(members), len(membersColumns), func(s *rowCells, i int) { memberRow(s, &members[i]) }, func(b rowBlock) error {
				if len(firstRows) == stopAt {
					// Let the workers run ahead and fill every slot first.
					time.Sleep(100 * time.Millisecond)
					return boom
				}
				want := `<row r="` + strconv.Itoa(len(firstRows)*rowsPerBlock+HeaderRow+1) + `">`
				if !bytes.HasPrefix(b.raw, []byte(want)) {
					t.Errorf("block %d does not start with %s", len(firstRows), want)
				}
				firstRows = append(firstRows, len(b.raw))
				return nil
			})
			runtime.GOMAXPROCS(old)
			if err != boom {
				t.Fatalf("GOMAXPROCS %d, failing at block %d: error %v, want %v", procs, stopAt, err, boom)
			}
			if len(firstRows) != stopAt {
				t.Errorf("GOMAXPROCS %d: %d blocks written before the failure, want %d", procs, len(firstRows), stopAt)
			}
		}
	}
	deadline := time.Now().Add(5 * time.Second)
	for runtime.NumGoroutine() > base && time.Now().Before(deadline) {
		time.Sleep(10 * time.Millisecond)
	}
	if n := runtime.NumGoroutine(); n > base {
		buf := make([]byte, 1<<16)
		t.Fatalf("%d goroutines left after the failures, %d before:\n%s", n, base, buf[:runtime.Stack(buf, true)])
	}
}
