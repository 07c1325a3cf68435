package framing

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"testing"
)

// FuzzParseCallout: ParseCallout never panics; it either wraps
// ErrBadCallout or returns dimension lumber (2-4 x 2-16 nominal, depth no
// less than thickness) and a spacing of 0 or in (0, 48] in; and what it
// returns, written back as a callout, reads back the same.
func FuzzParseCallout(f *testing.F) {
	for _, s := range []string{`2x10 @ 16" o.c.`, "2X12@12", "2x8 at 19.2 in. oc", "2 x 6", "4x16 joists @ 24in",
		"3×14 rafters at .5 inches o c", "2x10 @ 16″ o.c.", "2x10\u00a0@\u00a016”", "2x1", "16x2", "2x10 @ 0", "2x10 @ 1e3",
		"", "@", "2x10 @ 16.0000000000000000001"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		size, spacingIn, err := ParseCallout(s)
		if err != nil {
			if !errors.Is(err, ErrBadCallout) {
				t.Fatalf("%q: error %v does not wrap ErrBadCallout", s, err)
			}
			if size != "" || spacingIn != 0 {
				t.Fatalf("%q: error with results %q %v", s, size, spacingIn)
			}
			return
		}
		var b, d int
		if n, _ := fmt.Sscanf(size, "%dx%d", &b, &d); n != 2 || fmt.Sprintf("%dx%d", b, d) != size {
			t.Fatalf("%q: size %q is not in the form BxD", s, size)
		}
		if b < 2 || b > 4 || d < 2 || d > 16 || d < b {
			t.Fatalf("%q: size %q is not dimension lumber", s, size)
		}
		if math.IsNaN(spacingIn) || spacingIn < 0 || spacingIn > 48 {
			t.Fatalf("%q: spacing %v in", s, spacingIn)
		}
		back := size
		if spacingIn > 0 {
			back += ` @ ` + strconv.FormatFloat(spacingIn, 'f', -1, 64) + `" o.c.`
		}
		size2, spacing2, err := ParseCallout(back)
		if err != nil || size2 != size || spacing2 != spacingIn {
			t.Fatalf("%q -> %q %v -> %q: %q %v %v", s, size, spacingIn, back, size2, spacing2, err)
		}
	})
}
