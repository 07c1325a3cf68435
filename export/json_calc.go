package export

import (
	"bufio"
	"encoding/json"
	"reflect"
	"strconv"
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
	ids   map[[2]cleanSlice]string
	order []*Member // first member of each calculation
}

func newCalcTable() *calcTable { return &calcTable{ids: map[[2]cleanSlice]string{}} }

// id returns the id of m's calculation, numbering it when new; "" for a
// member without checks or factors (an error member).
func (t *calcTable) id(m *Member) string {
	if len(m.Checks) == 0 && len(m.Factors) == 0 {
		return ""
	}
	k := [2]cleanSlice{sliceID(m.Checks), sliceID(m.Factors)}
	if id, ok := t.ids[k]; ok {
		return id
	}
	t.order = append(t.order, m)
	id := "C" + strconv.Itoa(len(t.order))
	t.ids[k] = id
	return id
}

// sliceID names a slice by its first element, length and type.
func sliceID[T any](s []T) cleanSlice {
	if len(s) == 0 {
		return cleanSlice{}
	}
	v := reflect.ValueOf(s)
	return cleanSlice{v.Pointer(), v.Len(), v.Type()}
}

// calculation returns m's checks and factors as a Calculation.
func calculation(m *Member) Calculation {
	c := Calculation{Checks: make([]CalcCheck, len(m.Checks)), Factors: orEmpty(m.Factors)}
	for i, ch := range m.Checks {
		c.Checks[i] = CalcCheck(ch)
		c.Checks[i].Trace = orEmpty(ch.Trace)
	}
	return c
}

// write writes "calculations" as a JSON object, one entry per line, in
// the order of their ids.
func (t *calcTable) write(w *bufio.Writer, key func(string)) error {
	key("calculations")
	if len(t.order) == 0 {
		w.WriteString("{}")
		return nil
	}
	w.WriteString("{\n")
	for i, m := range t.order {
		b, err := json.Marshal(calculation(m))
		if err != nil {
			return err
		}
		w.WriteString("  \"C" + strconv.Itoa(i+1) + "\": ")
		w.Write(b)
		if i < len(t.order)-1 {
			w.WriteByte(',')
		}
		w.WriteByte('\n')
	}
	w.WriteString(" }")
	return nil
}
