package export

import (
	"encoding/json"
	"math"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"golang.org/x/net/html"
)

// repDrawn is a member as the page draws it: its path and its segment
// (SVG frame, inches, y down).
type repDrawn struct {
	path *html.Node
	seg  [4]float64
}

// repPage is what the page's script knows of the members.
type repPage struct {
	ids, handles []string
	groups       [][]any // [mark, size, spans, max, governing, status, ratios]
	group        []int   // member index -> group
	drawn        map[int]repDrawn
	paths        int
}

var repDataRe = regexp.MustCompile(`(?s)const FC = (.*?);\n`)

// repReadPage decodes the member data the way the page's script does
// (ids and handles left out where they follow the previous one), written
// out here again, and reads every member path's segments and data-m.
func repReadPage(t testing.TB, doc *html.Node, data []byte) repPage {
	t.Helper()
	mm := repDataRe.FindSubmatch(data)
	if mm == nil {
		t.Fatal("no member data in the page")
	}
	var fc struct {
		G [][]any `json:"g"`
		M [][]any `json:"m"`
	}
	if err := json.Unmarshal(mm[1], &fc); err != nil {
		t.Fatalf("member data is not JSON: %v", err)
	}
	p := repPage{groups: fc.G, drawn: map[int]repDrawn{}}
	digits := regexp.MustCompile(`[0-9]+$`)
	for i, e := range fc.M {
		p.group = append(p.group, int(e[0].(float64)))
		var id, h string
		if len(e) > 1 && e[1] != float64(0) {
			id = e[1].(string)
		} else {
			prev := p.ids[i-1]
			k := digits.FindStringIndex(prev)
			n, _ := strconv.Atoi(prev[k[0]:])
			id = prev[:k[0]] + strconv.Itoa(n+1)
		}
		if len(e) > 2 {
			h = e[2].(string)
		} else if prev := p.handles[i-1]; prev != "" {
			n, _ := strconv.ParseUint(prev, 16, 64)
			h = strings.ToUpper(strconv.FormatUint(n+1, 16))
		}
		p.ids, p.handles = append(p.ids, id), append(p.handles, h)
	}
	tok := regexp.MustCompile(`[a-zA-Z]|-?[0-9.]+`)
	repWalk(repByID(doc, "members"), func(n *html.Node) {
		if n.Type != html.ElementNode || n.Data != "path" {
			return
		}
		p.paths++
		var idx []int
		for _, r := range strings.Split(repAttr(n, "data-m"), ",") {
			lo, hi, _ := strings.Cut(r, "-")
			a, _ := strconv.Atoi(lo)
			b := a
			if hi != "" {
				b, _ = strconv.Atoi(hi)
			}
			for i := a; i <= b; i++ {
				idx = append(idx, i)
			}
		}
		ts := tok.FindAllString(repAttr(n, "d"), -1)
		num := func(k *int) float64 { v, _ := strconv.ParseFloat(ts[*k], 64); *k++; return v }
		var x, y float64
		var segs [][4]float64
		for k := 0; k < len(ts); {
			c := ts[k]
			k++
			switch c {
			case "M":
				x, y = num(&k), num(&k)
			case "m":
				x, y = x+num(&k), y+num(&k)
			case "h":
				sx := x
				x += num(&k)
				segs = append(segs, [4]float64{sx, y, x, y})
			case "v":
				sy := y
				y += num(&k)
				segs = append(segs, [4]float64{x, sy, x, y})
			case "l":
				sx, sy := x, y
				x, y = x+num(&k), y+num(&k)
				segs = append(segs, [4]float64{sx, sy, x, y})
			default:
				t.Fatalf("path command %q", c)
			}
		}
		if len(segs) != len(idx) {
			t.Fatalf("path with %d segments names %d members", len(segs), len(idx))
		}
		for k, i := range idx {
			if _, dup := p.drawn[i]; dup {
				t.Errorf("member %d drawn twice", i)
			}
			p.drawn[i] = repDrawn{n, segs[k]}
		}
	})
	return p
}

// repSameSegment reports whether seg joins a and b (drawing frame, inches)
// in either direction, to 0.01 in.
func repSameSegment(seg [4]float64, a, b [2]float64) bool {
	near := func(x, y float64, p [2]float64) bool {
		return math.Abs(x-p[0]) <= 0.0051 && math.Abs(y+p[1]) <= 0.0051
	}
	return near(seg[0], seg[1], a) && near(seg[2], seg[3], b) || near(seg[0], seg[1], b) && near(seg[2], seg[3], a)
}

// TestAppendHundredths: numbers of a path written exactly (hand-written
// expectations; common practice, no source).
func TestAppendHundredths(t *testing.T) {
	for _, c := range []struct {
		n    int64
		sep  bool
		want string
	}{{0, false, "0"}, {1600, true, " 16"}, {-12450, true, "-124.5"}, {5, false, "0.05"}, {-7, false, "-0.07"}, {12345, false, "123.45"}} {
		if got := string(appendHundredths(nil, c.n, c.sep)); got != c.want {
			t.Errorf("appendHundredths(%d) = %q, want %q", c.n, got, c.want)
		}
	}
	if got := string(appendRanges(nil, []int{0, 1, 2, 5, 7, 8})); got != "0-2,5,7-8" {
		t.Errorf("appendRanges = %q", got)
	}
}

// TestFollows: the sequence rules of the page's member data, written out
// by hand (common practice, no source).
func TestFollows(t *testing.T) {
	for _, c := range []struct {
		prev, id string
		want     bool
	}{{"M1", "M2", true}, {"M9", "M10", true}, {"M9", "M11", false}, {"M09", "M10", false}, {"R2-M3", "R2-M4", true},
		{"M1", "N2", false}, {"M", "M1", false}, {"M99999999999999", "M100000000000000", false}} {
		if got := followsID(c.prev, c.id); got != c.want {
			t.Errorf("followsID(%q, %q) = %v", c.prev, c.id, got)
		}
	}
	for _, c := range []struct {
		prev, h string
		want    bool
	}{{"2A", "2B", true}, {"2F", "30", true}, {"FF", "100", true}, {"2a", "2b", false}, {"", "", true}, {"", "1", false},
		{"1", "", false}, {"0A", "0B", false}, {"2A", "2C", false}} {
		if got := followsHandle(c.prev, c.h); got != c.want {
			t.Errorf("followsHandle(%q, %q) = %v", c.prev, c.h, got)
		}
	}
}
