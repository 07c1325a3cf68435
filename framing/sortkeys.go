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

// intKey maps v to a uint64 that orders as v does.
func intKey(v int64) uint64 { return uint64(v) ^ 1<<63 }

// radixBits is the digit of orderByKeys' passes: 2,048 counters stay in
// the fastest cache, where 65,536 would not once a plan has a million
// joists.
const radixBits = 11

// orderByKeys returns the indices 0..n-1 sorted by keys[0], then keys[1],
// ..., then index (each keys[j] has n entries): a least-significant-digit
// radix sort, radixBits a pass, key by key from the last. Each key is
// read once in the current order and then moved with its index, and only
// the digits of its range (largest less smallest) are sorted on.
func orderByKeys(n int, keys ...[]uint64) []int {
	type item struct {
		k uint64
		i int
	}
	cur, tmp := make([]item, n), make([]item, n)
	for x := range cur {
		cur[x].i = x
	}
	var count [1 << radixBits]int
	for j := len(keys) - 1; j >= 0; j-- {
		key := keys[j]
		lo, hi := ^uint64(0), uint64(0)
		for x := range cur {
			k := key[cur[x].i]
			cur[x].k = k
			lo, hi = min(lo, k), max(hi, k)
		}
		if n == 0 || lo == hi {
			continue // all equal: the order stands
		}
		for x := range cur {
			cur[x].k -= lo
		}
		for shift := uint(0); shift < 64 && (hi-lo)>>shift > 0; shift += radixBits {
			clear(count[:])
			for x := range cur {
				count[cur[x].k>>shift&(1<<radixBits-1)]++
			}
			sum := 0
			for d := range count {
				count[d], sum = sum, sum+count[d]
			}
			for x := range cur {
				d := cur[x].k >> shift & (1<<radixBits - 1)
				tmp[count[d]] = cur[x]
				count[d]++
			}
			cur, tmp = tmp, cur
		}
	}
	order := make([]int, n)
	for x := range cur {
		order[x] = cur[x].i
	}
	return order
}
