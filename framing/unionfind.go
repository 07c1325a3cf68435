package framing

// disjointSets groups indexes 0..n-1 (union-find with path halving). The
// root of a set is its smallest index, so sets can be numbered in the
// order of their first member.
type disjointSets []int32

func newDisjointSets(n int) disjointSets {
	s := make(disjointSets, n)
	for i := range s {
		s[i] = int32(i)
	}
	return s
}

// find returns the root (smallest index) of i's set.
func (s disjointSets) find(i int) int {
	for int(s[i]) != i {
		s[i] = s[s[i]]
		i = int(s[i])
	}
	return i
}

// union joins the sets of a and b; it reports whether they were apart.
func (s disjointSets) union(a, b int) bool {
	a, b = s.find(a), s.find(b)
	if a == b {
		return false
	}
	s[max(a, b)] = int32(min(a, b))
	return true
}
