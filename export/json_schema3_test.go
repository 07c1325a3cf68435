package export

import (
	"bufio"
	"math"
	"math/rand"
	"os"
	"path/filepath"
	"reflect"
	"strconv"
	"strings"
	"testing"
)

// TestAppendSig6 writes values as the schema doc says: the shortest
// decimal of the value rounded to 6 significant digits. Expected strings
// written out by hand (rounding half away from zero in the sixth digit;
// common practice, no source).
func TestAppendSig6(t *testing.T) {
	cases := []struct {
		v    float64
		want string
	}{
		{2.2500000000000004, "2.25"},
		{0.21352406781313962, "0.213524"},
		{243.09715120525945, "243.097"},
		{120.00000000000003, "120"},
		{0.5000000000000001, "0.5"},
		{1138.5, "1138.5"},
		{1234567, "1234570"},
		{1600000, "1600000"},
		{-0.0379049612066413, "-0.037905"},
		{0.000123456789, "0.000123457"},
		{0.0000015, "0.0000015"},
		{9.9999996e-7, "0.000001"},
		{1e-7, "1e-7"},
		{0, "0"},
		{math.Copysign(0, -1), "0"},
		{-1.1102230246251565e-16, "-1.11022e-16"},
		{2e21, "2e+21"},
	}
	for _, c := range cases {
		if got := string(appendSig6(nil, c.v)); got != c.want {
			t.Errorf("appendSig6(%v) = %s, want %s", c.v, got, c.want)
		}
	}
	coords := []struct {
		v    float64
		want string
	}{
		{-2.25, "-2.25"}, {122.25000000000003, "122.25"}, {-1.1102230246251565e-16, "0"},
		{11168, "11168"}, {3048.0000004, "3048"}, {0.1234567, "0.123457"}, {-25400.0000015, "-25400.000002"},
	}
	for _, c := range coords {
		if got := string(appendPlanCoord(nil, c.v)); got != c.want {
			t.Errorf("appendPlanCoord(%v) = %s, want %s", c.v, got, c.want)
		}
	}
}

// TestAppendSig6MatchesRound: on random values of every magnitude,
// appendSig6 writes what encoding/json writes for the value rounded to 6
// significant digits, that text reads back as that rounded value, and the
// rounding moves the value by at most half a unit of the sixth digit.
// Common practice, no source.
func TestAppendSig6MatchesRound(t *testing.T) {
	r := rand.New(rand.NewSource(3))
	for i := 0; i < 200000; i++ {
		v := (r.Float64() - 0.5) * math.Pow(10, float64(r.Intn(40)-20))
		if i%7 == 0 {
			v = float64(r.Intn(2000)) / 16 // sixteenths of an inch, exact
		}
		got := appendSig6(nil, v)
		want := appendJSONFloat(nil, round6(v))
		if string(got) != string(want) {
			t.Fatalf("appendSig6(%v) = %s, encoding/json of the rounded value %s", v, got, want)
		}
		back, err := strconv.ParseFloat(string(got), 64)
		if err != nil || back != round6(v) {
			t.Fatalf("appendSig6(%v) = %s reads back as %v (%v)", v, got, back, err)
		}
		if v != 0 {
			unit := math.Pow(10, math.Floor(math.Log10(math.Abs(v)))-5)
			if math.Abs(back-v) > 0.5*unit*(1+1e-9) {
				t.Fatalf("appendSig6(%v) = %s: off by more than half a unit of the sixth digit", v, got)
			}
		}
		if math.Abs(v) >= 1e15 {
			continue // written as appendSig6 writes it
		}
		c := appendPlanCoord(nil, v)
		if back, err := strconv.ParseFloat(string(c), 64); err != nil || math.Abs(back-v) > 5e-7*(1+1e-9)+math.Abs(v)*1e-15 {
			t.Fatalf("appendPlanCoord(%v) = %s", v, c)
		}
	}
}

// BenchmarkAppendSig6 measures the number formatting of schema 3 (no
// allocation).
func BenchmarkAppendSig6(b *testing.B) {
	buf := make([]byte, 0, 64)
	vs := []float64{2.2500000000000004, 0.21352406781313962, 243.09715120525945, 122.25000000000003, 1600000}
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		buf = appendSig6(buf[:0], vs[i%len(vs)])
	}
}

// schemaMembers returns members as a plan gives them: the fixture's, with
// float noise from unit conversion (2.2500000000000004), sharing their
// checks, factors and info lists by mark, plus members drawn at random
// with numbers at the edges of the formats.
func schemaMembers(t *testing.T) []Member {
	fx := loadFixture(t)
	info := []string{"bottom edge is not in compression under any combination", "CL per NDS 2018 3.3.3"}
	var ms []Member
	for i := 0; i < 300; i++ {
		m := fx.Members[i%len(fx.Members)]
		m.ID = "N" + strconv.Itoa(i)
		m.Start = [2]float64{float64(i) * 16.000000000000004, -2.2500000000000004}
		m.End = [2]float64{float64(i) * 16.000000000000004, 122.25000000000003}
		m.DatumIn = 5.000000000000001
		m.BearingsAtIn = []float64{2.2500000000000004, 122.25000000000003}
		m.SpansIn = []float64{120.00000000000003}
		m.MaxRatio = 0.21352406781313962 * float64(1+i%4)
		if i%3 == 0 {
			m.Info = info
		}
		if i%5 == 0 {
			m.Info = []string{"CL per NDS 2018 3.3.3"} // a list of its own, equal to the next one
		}
		m.ZonePieces = []ZonePiece{{Zone: "FLOOR", FromIn: 0, ToIn: 60.333333333333336}}
		if i%4 == 0 {
			m.PointLoads = []PointLoad{{Name: "P: 400 D, 300 L", AtIn: 100.75000000000001, FromFaceIn: 98.25000000000001,
				DeadLb: 400, LiveLb: 300.00000000000006, WindUpLb: 0.1}}
		}
		m.BlockingSteps = []BlockingStep{{RowsPerSpan: 1, LuIn: 59.99999999999999, CL: 0.9871234567, Ratio: 0.8765432198}}
		ms = append(ms, m)
	}
	return append(ms, rtMembers(600)...)
}

// TestSchema3SameValuesAsSchema2: the same results written as schema 2
// (members carrying their checks and info lines, numbers in full) and as
// schema 3 (references, numbers with the digits they carry) and read
// back with ReadJSON are the same member by member: every text, count
// and flag equal, every number equal to 6 significant digits (plan
// coordinates to 1e-6), every check, trace, factor and info line in
// place. Common practice, no source.
func TestSchema3SameValuesAsSchema2(t *testing.T) {
	dir := t.TempDir()
	r := loadFixture(t)
	r.Members = schemaMembers(t)
	r.Uplift = UpliftReport{ReportLb: 50, Bearings: []UpliftBearing{{Member: "N1", Mark: "J1", Bearing: 1,
		Support: "WALL handle 2F", AtIn: -0.7500000000000001, FromFaceIn: -0.875, Point: [2]float64{5328, -1.1102230246251565e-16},
		UpliftLb: 96.00000000000001, Combo: "0.6D+0.6W(up)", CD: 1.6, Flagged: true}}}
	v2 := filepath.Join(dir, "v2.json")
	err := writeAtomic(v2, func(w *bufio.Writer) error { return encodeResults(w, r, layoutV2) })
	if err != nil {
		t.Fatal(err)
	}
	v3 := filepath.Join(dir, "v3.json")
	if err := WriteJSON(v3, r); err != nil {
		t.Fatal(err)
	}
	a, err := ReadJSON(v2)
	if err != nil {
		t.Fatal(err)
	}
	b, err := ReadJSON(v3)
	if err != nil {
		t.Fatal(err)
	}
	if a.Schema != "framecheck-results/2" || b.Schema != Schema {
		t.Fatalf("schemas %q and %q", a.Schema, b.Schema)
	}
	s2, _ := os.Stat(v2)
	s3, _ := os.Stat(v3)
	t.Logf("schema 2: %d bytes, schema 3: %d bytes", s2.Size(), s3.Size())
	if s3.Size() >= s2.Size() {
		t.Errorf("schema 3 (%d bytes) not smaller than schema 2 (%d)", s3.Size(), s2.Size())
	}
	if len(a.Members) != len(b.Members) || len(a.Members) != len(r.Members) {
		t.Fatalf("%d and %d members, want %d", len(a.Members), len(b.Members), len(r.Members))
	}
	for i := range a.Members {
		sameValue(t, "members["+strconv.Itoa(i)+"]", reflect.ValueOf(a.Members[i]), reflect.ValueOf(b.Members[i]))
	}
	a.Members, b.Members = nil, nil
	a.Schema, b.Schema = "", ""
	sameValue(t, "results", reflect.ValueOf(*a), reflect.ValueOf(*b))
}

// sameValue fails the test where a and b differ: numbers by more than
// the rounding of schema 3, anything else at all; nil and empty lists are
// the same.
func sameValue(t *testing.T, path string, a, b reflect.Value) {
	t.Helper()
	switch a.Kind() {
	case reflect.Float64:
		x, y := a.Float(), b.Float()
		tol := 5e-6*math.Abs(x) + 5e-7 // 6 significant digits, coordinates to 1e-6
		if math.Abs(x-y) > tol && !(math.IsInf(x, 0) && x == y) {
			t.Fatalf("%s: schema 2 %v, schema 3 %v", path, x, y)
		}
	case reflect.Struct:
		for i := 0; i < a.NumField(); i++ {
			if f := a.Type().Field(i); f.IsExported() && jsonName(f) != "-" {
				sameValue(t, path+"."+jsonName(f), a.Field(i), b.Field(i))
			}
		}
	case reflect.Slice, reflect.Array:
		if a.Len() != b.Len() {
			t.Fatalf("%s: %d items in schema 2, %d in schema 3", path, a.Len(), b.Len())
		}
		for i := 0; i < a.Len(); i++ {
			sameValue(t, path+"["+strconv.Itoa(i)+"]", a.Index(i), b.Index(i))
		}
	case reflect.Map:
		if a.Len() != b.Len() {
			t.Fatalf("%s: %d keys in schema 2, %d in schema 3", path, a.Len(), b.Len())
		}
		for _, k := range a.MapKeys() {
			sameValue(t, path+"["+k.String()+"]", a.MapIndex(k), b.MapIndex(k))
		}
	case reflect.Pointer:
		if a.IsNil() != b.IsNil() {
			t.Fatalf("%s: nil in one schema only", path)
		}
		if !a.IsNil() {
			sameValue(t, path, a.Elem(), b.Elem())
		}
	default:
		if !reflect.DeepEqual(a.Interface(), b.Interface()) {
			t.Fatalf("%s: schema 2 %#v, schema 3 %#v", path, a.Interface(), b.Interface())
		}
	}
}

// TestSchemaDocListsEveryField: docs/RESULTS-SCHEMA.md names (in
// backquotes) every key results.json can hold, found from the Go types,
// so the doc cannot fall behind the file. Member's checks, info and
// factors are not member keys in schema 3 (they are the calculation's and
// the info list's).
func TestSchemaDocListsEveryField(t *testing.T) {
	doc, err := os.ReadFile(filepath.Join("..", "docs", "RESULTS-SCHEMA.md"))
	if err != nil {
		t.Fatal(err)
	}
	text := string(doc)
	notInFile := map[string]bool{"Member.checks": true, "Member.info": true, "Member.factors": true}
	seen := map[reflect.Type]bool{}
	var walk func(tp reflect.Type)
	walk = func(tp reflect.Type) {
		for tp.Kind() == reflect.Slice || tp.Kind() == reflect.Array || tp.Kind() == reflect.Pointer || tp.Kind() == reflect.Map {
			tp = tp.Elem()
		}
		if tp.Kind() != reflect.Struct || seen[tp] {
			return
		}
		seen[tp] = true
		for _, f := range jsonFields(tp) {
			if notInFile[tp.Name()+"."+f.Name] {
				continue
			}
			if !strings.Contains(text, "`"+f.Name+"`") {
				t.Errorf("docs/RESULTS-SCHEMA.md does not name %s's key %q", tp.Name(), f.Name)
			}
			walk(tp.Field(f.Index).Type)
		}
	}
	walk(reflect.TypeOf(Results{}))
	walk(reflect.TypeOf(Calculation{}))
	for _, k := range []string{"calculations", "info_lists", "info_list", "calculation", "source_file", "line", "shared", "demands", "demand", "members", Schema} {
		if !strings.Contains(text, "`"+k+"`") && !strings.Contains(text, "`\""+k+"\"`") {
			t.Errorf("docs/RESULTS-SCHEMA.md does not name %q", k)
		}
	}
}

// TestAppendSixteenthsMatchesFormatting: the shortcut for whole numbers of
// sixteenths writes exactly what the float formatting writes (6
// significant digits; 6 decimal places), over every sixteenth of a range
// of lengths and coordinates. Common practice, no source.
func TestAppendSixteenthsMatchesFormatting(t *testing.T) {
	slowFixed := func(v float64) string {
		b := strconv.AppendFloat(nil, v, 'f', 6, 64)
		s := strings.TrimRight(string(b), "0")
		s = strings.TrimSuffix(s, ".")
		if s == "-0" {
			s = "0"
		}
		return s
	}
	check := func(v float64) {
		if got, want := string(appendSig6(nil, v)), string(appendJSONFloat(nil, round6(v))); got != want && v != 0 { // 0 and -0 are "0"
			t.Fatalf("appendSig6(%v) = %s, formatting gives %s", v, got, want)
		}
		if got, want := string(appendFixed(nil, v, 6)), slowFixed(v); got != want {
			t.Fatalf("appendFixed(%v, 6) = %s, formatting gives %s", v, got, want)
		}
	}
	for k := -200000; k <= 200000; k++ {
		check(float64(k) / 16)
	}
	for _, v := range []float64{1e6, 123456.0625, 999999.9375, 12345678.5, 1e9 - 1, -98765.4375, math.Copysign(0, -1)} {
		check(v)
	}
}
