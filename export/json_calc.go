package export

import (
	"bufio"
	"encoding/json"
	"math"
	"strconv"
	"strings"
)

// Calculation is an entry of results.json's "calculations": the checks of
// the members checked alike, each with its trace, and the adjustment
// factors they used. Members name their entry in Member.Calculation, so a
// trace is written once however many members share it (on a plan of
// 100,000 joists about 8 KB a member would otherwise be repeated).
type Calculation struct {
	Checks  []CalcCheck `json:"checks"`
	Factors []TraceItem `json:"factors"`
}

// CalcCheck is a Check as a calculation writes it: with its trace, always
// a list.
type CalcCheck struct {
	Kind      string      `json:"kind"`
	Combo     string      `json:"combo"`
	Actual    float64     `json:"actual"`
	Allowable float64     `json:"allowable"`
	Unit      string      `json:"unit"`
	Ratio     float64     `json:"ratio"`
	Trace     []TraceItem `json:"trace"`
}

// calcTable numbers the distinct calculations in the order members meet
// them: C1, C2, ... A calculation is a member's checks slice and factors
// slice; members checked alike share both.
type calcTable struct {
	ids   map[calcKey]string
	order []*Member // first member of each calculation
}

func newCalcTable() *calcTable { return &calcTable{ids: map[calcKey]string{}} }

// calcKey names a calculation by its checks and factors slices.
type calcKey struct {
	checks  sliceKey[Check]
	factors sliceKey[TraceItem]
}

// id returns the id of m's calculation, numbering it when new; "" for a
// member without checks or factors (an error member).
func (t *calcTable) id(m *Member) string {
	if len(m.Checks) == 0 && len(m.Factors) == 0 {
		return ""
	}
	k := calcKey{keyOf(m.Checks), keyOf(m.Factors)}
	if id, ok := t.ids[k]; ok {
		return id
	}
	t.order = append(t.order, m)
	id := "C" + strconv.Itoa(len(t.order))
	t.ids[k] = id
	return id
}

// idOfChecks is id of a member holding only checks cs (a beam's or a
// post's), without making one when cs's calculation is numbered already.
func (t *calcTable) idOfChecks(cs []Check) string {
	if len(cs) == 0 {
		return ""
	}
	if id, ok := t.ids[calcKey{keyOf(cs), sliceKey[TraceItem]{}}]; ok {
		return id
	}
	return t.id(&Member{Checks: cs})
}

// sliceKey names a slice by its first element and length, without
// reflection (which would allocate for every member).
type sliceKey[T any] struct {
	p *T
	n int
}

func keyOf[T any](s []T) sliceKey[T] {
	if len(s) == 0 {
		return sliceKey[T]{}
	}
	return sliceKey[T]{&s[0], len(s)}
}

// calculation returns m's checks and factors as a Calculation; with
// round, every number rounded to SigDigits significant digits (copies:
// m's slices are left as they are).
func calculation(m *Member, round bool) Calculation {
	items := func(ts []TraceItem) []TraceItem {
		if !round || len(ts) == 0 {
			return orEmpty(ts)
		}
		out := make([]TraceItem, len(ts))
		for i, t := range ts {
			t.Value = round6(t.Value)
			out[i] = t
		}
		return out
	}
	c := Calculation{Checks: make([]CalcCheck, len(m.Checks)), Factors: items(m.Factors)}
	for i, ch := range m.Checks {
		cc := CalcCheck(ch)
		cc.Trace = items(ch.Trace)
		if round {
			cc.Actual, cc.Allowable, cc.Ratio = round6(cc.Actual), round6(cc.Allowable), round6(cc.Ratio)
		}
		c.Checks[i] = cc
	}
	return c
}

// jsonLayout is how encodeResults lays results.json out. layoutV3 is what
// WriteJSON writes (Schema); layoutV2 is kept for the test that compares
// the two schemas member by member.
type jsonLayout struct {
	schema string
	// refs: members without their checks (the calculation's) and with
	// their info lines as a reference into "info_lists"; numbers with the
	// digits they carry (json_num.go).
	refs bool
}

var (
	layoutV2 = jsonLayout{schema: "framecheck-results/2"}
	layoutV3 = jsonLayout{schema: Schema, refs: true}
)

// infoTable numbers the distinct info lists in the order members meet
// them: I1, I2, ... Members checked alike share one slice, found by its
// address; equal lists in different slices share an id too.
type infoTable struct {
	bySlice map[sliceKey[string]]string
	byText  map[string]string
	order   [][]string
}

func newInfoTable() *infoTable {
	return &infoTable{bySlice: map[sliceKey[string]]string{}, byText: map[string]string{}}
}

// id returns the id of the list info (not empty), numbering it when new.
func (t *infoTable) id(info []string) string {
	k := keyOf(info)
	if id, ok := t.bySlice[k]; ok {
		return id
	}
	text := strings.Join(info, "\x00")
	id, ok := t.byText[text]
	if !ok {
		t.order = append(t.order, info)
		id = "I" + strconv.Itoa(len(t.order))
		t.byText[text] = id
	}
	t.bySlice[k] = id
	return id
}

// write writes "info_lists" as a JSON object, one list per line.
func (t *infoTable) write(w *bufio.Writer, key func(string)) error {
	return writeIDObject(w, key, "info_lists", "I", len(t.order), func(i int, _ []byte) ([]byte, error) {
		return json.Marshal(t.order[i])
	})
}

// write writes "calculations" as a JSON object, one entry per line, in
// the order of their ids.
func (t *calcTable) write(w *bufio.Writer, key func(string), round bool) error {
	return writeIDObject(w, key, "calculations", "C", len(t.order), func(i int, b []byte) ([]byte, error) {
		c := calculation(t.order[i], round)
		if b, ok := appendCalculation(b, &c); ok {
			return b, nil
		}
		return json.Marshal(c) // which says which number
	})
}

// appendCalculation appends c as encoding/json writes it (keys in the
// struct's order, a nil list as null, strings and numbers as
// appendJSONString and appendJSONFloat write them:
// TestCalculationEncoderMatchesMarshal); ok is false, and b of no use,
// when a number is not finite, which encoding/json refuses.
func appendCalculation(b []byte, c *Calculation) (_ []byte, ok bool) {
	ok = true
	num := func(b []byte, v float64) []byte {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			ok = false
			return b
		}
		return appendJSONFloat(b, v)
	}
	items := func(b []byte, ts []TraceItem) []byte {
		if ts == nil {
			return append(b, "null"...)
		}
		b = append(b, '[')
		for i := range ts {
			t := &ts[i]
			if i > 0 {
				b = append(b, ',')
			}
			b = append(b, `{"name":`...)
			b = appendJSONString(b, t.Name)
			b = append(b, `,"value":`...)
			b = num(b, t.Value)
			b = append(b, `,"unit":`...)
			b = appendJSONString(b, t.Unit)
			if t.Source != "" {
				b = append(b, `,"source":`...)
				b = appendJSONString(b, t.Source)
			}
			if t.Formula != "" {
				b = append(b, `,"formula":`...)
				b = appendJSONString(b, t.Formula)
			}
			if t.Subst != "" {
				b = append(b, `,"subst":`...)
				b = appendJSONString(b, t.Subst)
			}
			b = append(b, '}')
		}
		return append(b, ']')
	}
	b = append(b, `{"checks":`...)
	if c.Checks == nil {
		b = append(b, "null"...)
	} else {
		b = append(b, '[')
		for i := range c.Checks {
			ch := &c.Checks[i]
			if i > 0 {
				b = append(b, ',')
			}
			b = append(b, `{"kind":`...)
			b = appendJSONString(b, ch.Kind)
			b = append(b, `,"combo":`...)
			b = appendJSONString(b, ch.Combo)
			b = append(b, `,"actual":`...)
			b = num(b, ch.Actual)
			b = append(b, `,"allowable":`...)
			b = num(b, ch.Allowable)
			b = append(b, `,"unit":`...)
			b = appendJSONString(b, ch.Unit)
			b = append(b, `,"ratio":`...)
			b = num(b, ch.Ratio)
			b = append(b, `,"trace":`...)
			b = items(b, ch.Trace)
			b = append(b, '}')
		}
		b = append(b, ']')
	}
	b = append(b, `,"factors":`...)
	b = items(b, c.Factors)
	return append(b, '}'), ok
}

// writeIDObject writes the top-level key name as a JSON object of n
// entries, one per line, with ids prefix+1, prefix+2, ... in order; enc
// gives the i-th (0-based) entry's JSON, appended to b (a buffer it may
// reuse) or of its own.
func writeIDObject(w *bufio.Writer, key func(string), name, prefix string, n int, enc func(i int, b []byte) ([]byte, error)) error {
	key(name)
	if n == 0 {
		w.WriteString("{}")
		return nil
	}
	w.WriteString("{\n")
	var buf []byte
	for i := 0; i < n; i++ {
		b, err := enc(i, buf[:0])
		if err != nil {
			return err
		}
		buf = b
		w.WriteString("  \"" + prefix + strconv.Itoa(i+1) + "\": ")
		w.Write(b)
		if i < n-1 {
			w.WriteByte(',')
		}
		w.WriteByte('\n')
	}
	w.WriteString(" }")
	return nil
}
