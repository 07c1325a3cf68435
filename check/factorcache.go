package check

import (
	"hash/maphash"
	"math"
	"sync"
)

// factorKey is what the factor list of a result depends on besides the
// combination cases: the adjustment factors, the size, the size-factor
// rule and the temperature class.
type factorKey struct {
	cm    WetServiceFactors
	ct    TemperatureFactors
	cf    SizeFactors
	ci    IncisingFactors
	cr    float64
	sec   string
	rule  string
	temp  string
	pitch float64
	scln  float64 // exponent of structural composite lumber's size factor
	cv    float64 // glulam's volume factor (it depends on the span)
}

type factorEntry struct {
	key    factorKey
	combos []comboCD
	items  []TraceItem
}

// factorLists caches factor lists by a hash of their key and cases; an
// entry is used only when key and cases are equal, so a hash collision
// costs a rebuild, never a wrong list. It stops growing at maxEntries.
type factorLists struct {
	mu      sync.RWMutex
	seed    maphash.Seed
	entries map[uint64]*factorEntry
}

const maxFactorEntries = 4096

var factorCache = &factorLists{seed: maphash.MakeSeed(), entries: map[uint64]*factorEntry{}}

func (c *factorLists) hash(key factorKey, combos []comboCD) uint64 {
	var h maphash.Hash
	h.SetSeed(c.seed)
	maphash.WriteComparable(&h, key)
	var b [8]byte
	for _, cc := range combos {
		h.WriteString(cc.name)
		bits := math.Float64bits(cc.cd)
		for i := range b {
			b[i] = byte(bits >> (8 * i))
		}
		h.Write(b[:])
	}
	return h.Sum64()
}

func (c *factorLists) lookup(key factorKey, combos []comboCD) ([]TraceItem, bool) {
	h := c.hash(key, combos)
	c.mu.RLock()
	e := c.entries[h]
	c.mu.RUnlock()
	if e == nil || e.key != key || len(e.combos) != len(combos) {
		return nil, false
	}
	for i := range combos {
		if e.combos[i] != combos[i] {
			return nil, false
		}
	}
	return e.items, true
}

func (c *factorLists) store(key factorKey, combos []comboCD, items []TraceItem) {
	h := c.hash(key, combos)
	c.mu.Lock()
	defer c.mu.Unlock()
	if len(c.entries) >= maxFactorEntries {
		return
	}
	c.entries[h] = &factorEntry{key: key, combos: append([]comboCD(nil), combos...), items: items}
}
