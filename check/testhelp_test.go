package check

import (
	"math"
	"testing"
)

// near reports whether got is within tol (absolute) or relTol (relative)
// of want.
func near(got, want, tol, relTol float64) bool {
	d := math.Abs(got - want)
	return d <= tol || d <= relTol*math.Abs(want)
}

func expectNear(t *testing.T, what string, got, want, tol, relTol float64, source string) {
	t.Helper()
	if !near(got, want, tol, relTol) {
		t.Errorf("%s = %.6g, want %.6g (tol %g abs / %g rel; source: %s)", what, got, want, tol, relTol, source)
	}
}
