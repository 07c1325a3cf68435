package framing

import "math"

// Sorting a plan's hundreds of thousands of joists by comparison costs
// tens of milliseconds; these sort them by radix instead, on keys made
// of the values compared, with ties left in index order: the same order
// as a comparison sort on the values then the index.

// floatKey maps f to a uint64 that orders as f does (cmp.Compare), for
// any f but NaN: -0 and 0 map alike, as they compare equal.
func floatKey(f float64) uint64 {
	if f == 0 {
		f = 0 // -0 too
	}
	b := math.Float64bits(f)
	if b>>63 != 0 {
		return ^b // negative: larger magnitude first
	}
	return b | 1<<63
}

// orderByKeys returns the indices 0..n-1 sorted by keys[0], then keys[1],
// ..., then index (each keys[j] has n entries): a least-significant-digit
// radix sort, 16 bits a pass, skipping the passes whose digit is the same
// for every index.
func orderByKeys(n int, keys ...[]uint64) []int {
	order := make([]int, n)
	for i := range order {
		order[i] = i
	}
	tmp := make([]int, n)
	var count [1 << 16]int
	for j := len(keys) - 1; j >= 0; j-- {
		key := keys[j]
		var or, and uint64 = 0, ^uint64(0)
		for _, k := range key {
			or |= k
			and &= k
		}
		for shift := uint(0); shift < 64; shift += 16 {
			if (or^and)>>shift&0xffff == 0 {
				continue // every key has the same digit here
			}
			clear(count[:])
			for _, i := range order {
				count[key[i]>>shift&0xffff]++
			}
			sum := 0
			for d := range count {
				count[d], sum = sum, sum+count[d]
			}
			for _, i := range order {
				d := key[i] >> shift & 0xffff
				tmp[count[d]] = i
				count[d]++
			}
			order, tmp = tmp, order
		}
	}
	return order
}
