package framing

import (
	"cmp"
	"math"
	"slices"
	"sort"
)

// bandKey is one item of a bandIndex: a position (c across, a along) in
// the frame of direction group grp.
type bandKey struct {
	grp  int32
	band int64
	a    float64
	c    float64
	id   int32
}

// bandIndex finds the items near one of its own: in its direction group,
// across offset within about bandIn, along position within a range. The
// items are sorted by (group, band of c, a) and cut into runs of one
// group and band, so a look is a binary search in each of three short
// runs; a plan whose members line up bay after bay does not make the walk
// long, as the along range cuts it.
type bandIndex struct {
	bandIn float64
	keys   []bandKey
	runOf  []int32 // per sorted key: its run (keys of one group and band)
	runs   []int32 // first key of each run, then len(keys)
}

func newBandIndex(bandIn float64, keys []bandKey) *bandIndex {
	minBand := int64(math.MaxInt64)
	for i := range keys {
		keys[i].band = int64(math.Floor(keys[i].c / bandIn))
		minBand = min(minBand, keys[i].band)
	}
	sorted := true // as the duplicate search hands them over
	for i := 1; i < len(keys) && sorted; i++ {
		sorted = keys[i-1].grp < keys[i].grp || keys[i-1].grp == keys[i].grp && keys[i-1].band <= keys[i].band
	}
	if !sorted {
		keys = sortByBand(keys, minBand)
	}
	// then each run (one group and band) by a: runs are short
	byA := func(x, y bandKey) int {
		if c := cmp.Compare(x.a, y.a); c != 0 {
			return c
		}
		return cmp.Compare(x.id, y.id)
	}
	for i := 0; i < len(keys); {
		j := i + 1
		for j < len(keys) && keys[j].grp == keys[i].grp && keys[j].band == keys[i].band {
			j++
		}
		if j-i > 1 {
			slices.SortFunc(keys[i:j], byA)
		}
		i = j
	}
	x := &bandIndex{bandIn: bandIn, keys: keys, runOf: make([]int32, len(keys))}
	for i := range keys {
		if i == 0 || keys[i].grp != keys[i-1].grp || keys[i].band != keys[i-1].band {
			x.runs = append(x.runs, int32(i))
		}
		x.runOf[i] = int32(len(x.runs) - 1)
	}
	x.runs = append(x.runs, int32(len(keys)))
	return x
}

// nearRuns returns the runs next to sorted key pos's own (its band and
// the bands either side, in its group), -1 where there is none.
func (x *bandIndex) nearRuns(pos int) [3]int {
	r := int(x.runOf[pos])
	k := &x.keys[pos]
	out := [3]int{-1, r, -1}
	for i, rr := range [2]int{r - 1, r + 1} {
		if rr >= 0 && rr < len(x.runs)-1 {
			f := &x.keys[x.runs[rr]]
			if f.grp == k.grp && (f.band == k.band-1 || f.band == k.band+1) {
				out[2*i] = rr
			}
		}
	}
	return out
}

// from returns the first key of run r with a >= a0.
func (x *bandIndex) from(r int, a0 float64) int {
	lo, hi := int(x.runs[r]), int(x.runs[r+1])
	return lo + sort.Search(hi-lo, func(i int) bool { return x.keys[lo+i].a >= a0 })
}

// sortByBand orders keys by group, then band, with a least-significant-
// digit radix sort on (group, band - minBand) packed into 64 bits, 16 bits
// a pass, as many passes as the largest packed value needs: sorting a
// plan's hundreds of thousands of lines by comparison cost several times
// more. Coordinates are within 1e9 in (maxCoordIn), so band - minBand fits
// in 40 bits for any band of at least 0.01 in.
func sortByBand(keys []bandKey, minBand int64) []bandKey {
	if len(keys) < 2 {
		return keys
	}
	packed := func(k *bandKey) uint64 { return uint64(k.grp)<<40 | uint64(k.band-minBand)&(1<<40-1) }
	var top uint64
	for i := range keys {
		top = max(top, packed(&keys[i]))
	}
	tmp := make([]bandKey, len(keys))
	src, dst := keys, tmp
	var count [1 << 16]int
	for shift := uint(0); shift < 64 && top>>shift > 0; shift += 16 {
		clear(count[:])
		for i := range src {
			count[packed(&src[i])>>shift&0xffff]++
		}
		sum := 0
		for d := range count {
			count[d], sum = sum, sum+count[d]
		}
		for i := range src {
			d := packed(&src[i]) >> shift & 0xffff
			dst[count[d]] = src[i]
			count[d]++
		}
		src, dst = dst, src
	}
	return src
}
