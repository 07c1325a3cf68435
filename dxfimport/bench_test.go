package dxfimport

import (
	"bytes"
	"fmt"
	"io"
	"runtime"
	"strconv"
	"sync"
	"testing"
	"unsafe"
)

// genPlan writes a synthetic R2000-style framing plan of about size bytes:
// joist LINEs, wall LWPOLYLINEs, labels and block inserts, with handles
// and subclass markers as CAD programs write them.
func genPlan(size int) []byte {
	var b bytes.Buffer
	b.Grow(size + 1<<20)
	p := func(code int, v string) {
		b.WriteString(strconv.Itoa(code))
		b.WriteByte('\n')
		b.WriteString(v)
		b.WriteByte('\n')
	}
	f := func(code int, x float64) { p(code, strconv.FormatFloat(x, 'f', 6, 64)) }
	p(0, "SECTION")
	p(2, "HEADER")
	p(9, "$ACADVER")
	p(1, "AC1015")
	p(9, "$INSUNITS")
	p(70, "1")
	p(0, "ENDSEC")
	p(0, "SECTION")
	p(2, "TABLES")
	p(0, "TABLE")
	p(2, "LAYER")
	for _, l := range []string{"0", "JOIST", "WALL", "TEXT", "BLOCKING"} {
		p(0, "LAYER")
		p(2, l)
		p(70, "0")
		p(62, "7")
	}
	p(0, "ENDTAB")
	p(0, "ENDSEC")
	p(0, "SECTION")
	p(2, "BLOCKS")
	p(0, "BLOCK")
	p(8, "0")
	p(2, "BAY")
	p(70, "0")
	f(10, 0)
	f(20, 0)
	for i := 0; i < 4; i++ {
		p(0, "LINE")
		p(8, "0")
		f(10, float64(16*i))
		f(20, 0)
		f(11, float64(16*i))
		f(21, 144)
	}
	p(0, "ENDBLK")
	p(0, "ENDSEC")
	p(0, "SECTION")
	p(2, "ENTITIES")
	h := 0x100
	for i := 0; b.Len() < size; i++ {
		x, y := float64(i%500)*16.0+0.125, float64(i/500)*150.0+0.0625
		switch i % 10 {
		case 0:
			p(0, "LWPOLYLINE")
			p(5, strconv.FormatInt(int64(h), 16))
			p(100, "AcDbEntity")
			p(8, "WALL")
			p(100, "AcDbPolyline")
			p(90, "4")
			p(70, "1")
			for _, d := range [][2]float64{{0, 0}, {16, 0}, {16, 3.5}, {0, 3.5}} {
				f(10, x+d[0])
				f(20, y+d[1])
			}
		case 5:
			p(0, "TEXT")
			p(5, strconv.FormatInt(int64(h), 16))
			p(100, "AcDbEntity")
			p(8, "TEXT")
			p(100, "AcDbText")
			f(10, x)
			f(20, y+72)
			f(30, 0)
			f(40, 4)
			p(1, fmt.Sprintf("2x10 @ 16 o.c. J%d", i))
			f(50, 90)
		case 9:
			p(0, "INSERT")
			p(5, strconv.FormatInt(int64(h), 16))
			p(100, "AcDbEntity")
			p(8, "JOIST")
			p(100, "AcDbBlockReference")
			p(2, "BAY")
			f(10, x)
			f(20, y)
			f(50, 0)
		default:
			p(0, "LINE")
			p(5, strconv.FormatInt(int64(h), 16))
			p(100, "AcDbEntity")
			p(8, "JOIST")
			p(100, "AcDbLine")
			f(10, x)
			f(20, y)
			f(30, 0)
			f(11, x)
			f(21, y+144)
			f(31, 0)
		}
		h++
	}
	p(0, "ENDSEC")
	p(0, "EOF")
	return b.Bytes()
}

var (
	planOnce sync.Once
	plan50MB []byte
)

func plan50() []byte {
	planOnce.Do(func() { plan50MB = genPlan(50 << 20) })
	return plan50MB
}

// entityBytes is the memory the parsed entities themselves hold: the
// Entity structs, their point and bulge arrays, and their own strings
// (layer names are shared and not counted).
func entityBytes(d *Drawing) int {
	n := len(d.Entities) * int(unsafe.Sizeof(Entity{}))
	for _, e := range d.Entities {
		n += cap(e.Points)*int(unsafe.Sizeof(Point{})) + cap(e.Bulges)*8 + len(e.Text) + len(e.Pos.Handle)
	}
	return n
}

// BenchmarkRead reads the generated ~50 MB plan. Besides MB/s and
// allocations it reports alloc/entity: bytes allocated during one Read
// divided by the entities' own size. The peak heap of a Read is at most
// what it allocates, so this ratio bounds peak memory from above.
func BenchmarkRead(b *testing.B) {
	data := plan50()
	b.SetBytes(int64(len(data)))
	var ms0, ms1 runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&ms0)
	d, err := Read(bytes.NewReader(data), "plan.dxf", Options{})
	runtime.ReadMemStats(&ms1)
	if err != nil {
		b.Fatal(err)
	}
	eb := entityBytes(d)
	ratio := float64(ms1.TotalAlloc-ms0.TotalAlloc) / float64(eb)
	ents := len(d.Entities)
	d = nil
	b.ReportAllocs()
	b.ResetTimer()
	cpu0 := cpuSeconds()
	for b.Loop() {
		if _, err := Read(bytes.NewReader(data), "plan.dxf", Options{}); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(data))*float64(b.N)/1e6/(cpuSeconds()-cpu0), "MB/cpu-s")
	b.ReportMetric(ratio, "alloc/entity")
	b.ReportMetric(float64(ents), "entities")
}

// BenchmarkTagReader measures the tag layer alone (Next, with its string
// copy of each value).
func BenchmarkTagReader(b *testing.B) {
	data := plan50()
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	cpu0 := cpuSeconds()
	for b.Loop() {
		tr := NewTagReader(bytes.NewReader(data), "plan.dxf")
		for {
			if _, err := tr.Next(); err == io.EOF {
				break
			} else if err != nil {
				b.Fatal(err)
			}
		}
	}
	b.ReportMetric(float64(len(data))*float64(b.N)/1e6/(cpuSeconds()-cpu0), "MB/cpu-s")
}
