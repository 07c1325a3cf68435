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

// bandIndex finds items of one direction group lying in a strip: across
// offset within bandIn of a value and along position within a range. The
// items are sorted by (group, band of c, a), so a query is three binary
// searches and a walk over the items it returns; a plan whose members line
// up bay after bay does not make the walk long, as the along range cuts it.
type bandIndex struct {
	bandIn float64
	keys   []bandKey
}

func newBandIndex(bandIn float64, keys []bandKey) *bandIndex {
	for i := range keys {
		keys[i].band = int64(math.Floor(keys[i].c / bandIn))
	}
	slices.SortFunc(keys, func(x, y bandKey) int {
		if c := cmp.Compare(x.grp, y.grp); c != 0 {
			return c
		}
		if c := cmp.Compare(x.band, y.band); c != 0 {
			return c
		}
		if c := cmp.Compare(x.a, y.a); c != 0 {
			return c
		}
		return cmp.Compare(x.id, y.id)
	})
	return &bandIndex{bandIn: bandIn, keys: keys}
}

// query calls fn for every item of group grp with |c - item.c| <= bandIn
// (and possibly some a little farther) and a0 <= item.a <= a1.
func (x *bandIndex) query(grp int32, c, a0, a1 float64, fn func(k *bandKey)) {
	if math.IsNaN(c) || math.IsNaN(a0) || math.IsNaN(a1) {
		return
	}
	b := int64(math.Floor(c / x.bandIn))
	for bb := b - 1; bb <= b+1; bb++ {
		i := sort.Search(len(x.keys), func(i int) bool {
			k := &x.keys[i]
			if k.grp != grp {
				return k.grp > grp
			}
			if k.band != bb {
				return k.band > bb
			}
			return k.a >= a0
		})
		for ; i < len(x.keys); i++ {
			k := &x.keys[i]
			if k.grp != grp || k.band != bb || k.a > a1 {
				break
			}
			fn(k)
		}
	}
}
