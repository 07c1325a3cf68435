package export

import (
	"bytes"
	"hash/crc32"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"
)

// crc32Combine against the CRC-32 of the two pieces joined (hash/crc32,
// the reference): lengths across the powers of two the method walks.
func TestCRC32Combine(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	for _, n := range [][2]int{{0, 0}, {0, 5}, {5, 0}, {1, 1}, {3, 64}, {1000, 4097}, {70000, 131073}, {17, 1 << 20}} {
		a, b := make([]byte, n[0]), make([]byte, n[1])
		for i := range a {
			a[i] = byte(rng.Uint32())
		}
		for i := range b {
			b[i] = byte(rng.Uint32())
		}
		want := crc32.ChecksumIEEE(append(append([]byte(nil), a...), b...))
		if got := crc32Combine(crc32.ChecksumIEEE(a), crc32.ChecksumIEEE(b), uint64(len(b))); got != want {
			t.Errorf("%d+%d bytes: combined %08x, joined %08x", n[0], n[1], got, want)
		}
	}
}

// A schedule written with its Members rows prepared ahead is the one
// written at once, byte for byte, whatever the number of blocks; rows
// prepared for other members are not used.
func TestWriteXLSXWithPreparedRows(t *testing.T) {
	dir := t.TempDir()
	for _, n := range []int{0, 1, rowsPerBlock + 3, 3*rowsPerBlock + 1} {
		r := bigResults(n)
		r.LoadPath = bigLoadPath(20, 40, 60, 5)
		plain, with := filepath.Join(dir, "plain.xlsx"), filepath.Join(dir, "with.xlsx")
		if err := WriteXLSX(plain, r); err != nil {
			t.Fatal(err)
		}
		if err := WriteXLSXWith(with, r, PrepareXLSX(r)); err != nil {
			t.Fatal(err)
		}
		a, _ := os.ReadFile(plain)
		b, _ := os.ReadFile(with)
		if !bytes.Equal(a, b) {
			t.Fatalf("%d members: prepared rows give another file (%d bytes, %d at once)", n, len(b), len(a))
		}
		if n == 0 {
			continue
		}
		// rows prepared for a copy of the members: built afresh
		other := *r
		other.Members = append([]Member(nil), r.Members...)
		prep := PrepareXLSX(&other)
		r.Members[0].Status = StatusFail
		if err := WriteXLSX(plain, r); err != nil {
			t.Fatal(err)
		}
		if err := WriteXLSXWith(with, r, prep); err != nil {
			t.Fatal(err)
		}
		a, _ = os.ReadFile(plain)
		b, _ = os.ReadFile(with)
		if !bytes.Equal(a, b) {
			t.Fatalf("%d members: rows prepared for other members were used", n)
		}
	}
}
