package framing

// Bookkeeping that ties the support lines as read (grouper.sups) to
// Plan.Supports, so that each Bearing and Beam can name the entry of
// Plan.Supports it is made of (Bearing.Support, Beam.Supports).

// supportRefs is the state of that bookkeeping, part of loadPathState.
type supportRefs struct {
	supOut  []int          // per support line: its index in Plan.Supports, -1 before buildSupports
	pairs   [][2]int       // merged pairs handed out by pairRef, by id
	pairID  map[[2]int]int // pair -> id
	pairOut map[[2]int]int // pair -> index in Plan.Supports
	midPair map[int][2]int // line inside a group of three or more -> the group's pair
}

// pairRef returns a provisional Bearing.Support for a bearing on the
// merged pair key that a beam bears on: -2 - its id (resolveRef turns
// it into an index in Plan.Supports). Members' bearings name their pairs
// otherwise (findBearings).
func (g *grouper) pairRef(key [2]int) int {
	r := &g.lp.refs
	if r.pairID == nil {
		r.pairID = map[[2]int]int{}
	}
	id, ok := r.pairID[key]
	if !ok {
		id = len(r.pairs)
		r.pairID[key] = id
		r.pairs = append(r.pairs, key)
	}
	return -2 - id
}

// middle records that support line s lies inside the group whose outer
// lines are key.
func (s *loadPathState) middle(line int, key [2]int) {
	r := &s.refs
	if r.midPair == nil {
		r.midPair = map[int][2]int{}
	}
	if _, ok := r.midPair[line]; !ok {
		r.midPair[line] = key
	}
}

// supportOut records that Plan.Supports[idx] is support line a (b < 0)
// or the merged pair a, b.
func (g *grouper) supportOut(a, b, idx int) {
	r := &g.lp.refs
	if r.supOut == nil {
		r.supOut = make([]int, len(g.sups))
		for i := range r.supOut {
			r.supOut[i] = -1
		}
	}
	if b >= 0 {
		if r.pairOut == nil {
			r.pairOut = map[[2]int]int{}
		}
		r.pairOut[[2]int{a, b}] = idx
	}
	for _, s := range []int{a, b} {
		if s >= 0 && r.supOut[s] < 0 {
			r.supOut[s] = idx
		}
	}
}

// supportOf returns the index in Plan.Supports of support line s, or -1.
func (g *grouper) supportOf(s int) int {
	r := &g.lp.refs
	if s < 0 || s >= len(r.supOut) {
		return -1
	}
	if r.supOut[s] < 0 {
		if key, ok := r.midPair[s]; ok {
			if i, ok := r.pairOut[key]; ok {
				return i
			}
		}
	}
	return r.supOut[s]
}

// resolveRef turns a provisional Bearing.Support (a support line, or
// -2 - a pair id) into an index in Plan.Supports, -1 when none.
func (g *grouper) resolveRef(ref int) int {
	r := &g.lp.refs
	if ref >= 0 {
		return g.supportOf(ref)
	}
	id := -2 - ref
	if id < 0 || id >= len(r.pairs) {
		return -1
	}
	return g.pairSupport(r.pairs[id])
}

// pairSupport returns the index in Plan.Supports of the merged pair key.
func (g *grouper) pairSupport(key [2]int) int {
	if i, ok := g.lp.refs.pairOut[key]; ok {
		return i
	}
	return g.supportOf(key[0])
}
