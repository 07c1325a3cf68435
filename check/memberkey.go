package check

import (
	"encoding/binary"
	"fmt"
	"math"
	"reflect"
	"unsafe"
)

// MemberKey is the check input less the ID, exactly: every field, floats
// by their bits, strings and slices with their lengths. It walks the
// struct's type (once, by reflection, into memberKeyEnc), so a field
// added to Member is part of the key without a change here.
func MemberKey(m Member) string {
	var buf [256]byte
	return string(AppendMemberKey(buf[:0], &m))
}

// AppendMemberKey appends MemberKey(*m) to b without copying m: a caller
// keying many members reuses one buffer and makes a string only of the
// keys it has not met (a map looked up with string(b) does not allocate).
func AppendMemberKey(b []byte, m *Member) []byte {
	return memberKeyEnc(b, unsafe.Pointer(m))
}

// AppendMemberKeyUnnamed is AppendMemberKey with every point load's Name
// written as "" (the name says which member put the load there, for
// messages; the analysis does not read it): the key of the member with its
// point loads' names cleared, without clearing them.
func AppendMemberKeyUnnamed(b []byte, m *Member) []byte {
	return memberKeyUnnamedEnc(b, unsafe.Pointer(m))
}

// keyEnc appends the key of the value of its type at p.
type keyEnc func(b []byte, p unsafe.Pointer) []byte

var (
	memberType          = reflect.TypeFor[Member]()
	memberKeyEnc        = compileKey(memberType, skipField(memberType, "ID"))
	memberKeyUnnamedEnc = compileKey(memberType, func(t reflect.Type, f reflect.StructField) bool {
		return (t == memberType && f.Name == "ID") || (t == reflect.TypeFor[PointLoad]() && f.Name == "Name")
	})
)

// skipField returns the rule that leaves out field name of struct type t,
// which must be a string field of t.
func skipField(t reflect.Type, name string) func(reflect.Type, reflect.StructField) bool {
	f, ok := t.FieldByName(name)
	if !ok || len(f.Index) != 1 || f.Type.Kind() != reflect.String {
		panic(fmt.Sprintf("%s has no string field %s", t, name))
	}
	return func(st reflect.Type, sf reflect.StructField) bool { return st == t && sf.Name == name }
}

// compileKey returns the encoder of type t: an unambiguous encoding of
// every field (strings and slices length-prefixed, floats by their bits,
// integers as varints), the fields skip names written as the empty string
// (skip is asked of string fields only).
func compileKey(t reflect.Type, skip func(reflect.Type, reflect.StructField) bool) keyEnc {
	switch t.Kind() {
	case reflect.String:
		return func(b []byte, p unsafe.Pointer) []byte {
			s := *(*string)(p)
			b = binary.AppendUvarint(b, uint64(len(s)))
			return append(b, s...)
		}
	case reflect.Float64:
		return func(b []byte, p unsafe.Pointer) []byte {
			return binary.LittleEndian.AppendUint64(b, math.Float64bits(*(*float64)(p)))
		}
	case reflect.Bool:
		return func(b []byte, p unsafe.Pointer) []byte {
			if *(*bool)(p) {
				return append(b, 1)
			}
			return append(b, 0)
		}
	case reflect.Float32, reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64,
		reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64, reflect.Uintptr:
		// rare in a check input: through reflect, as appendKey does
		return func(b []byte, p unsafe.Pointer) []byte { return appendKey(b, reflect.NewAt(t, p).Elem()) }
	case reflect.Struct:
		type field struct {
			off  uintptr
			enc  keyEnc
			skip bool
		}
		fs := make([]field, t.NumField())
		for i := range fs {
			f := t.Field(i)
			fs[i] = field{off: f.Offset, skip: f.Type.Kind() == reflect.String && skip(t, f)}
			if !fs[i].skip {
				fs[i].enc = compileKey(f.Type, skip)
			}
		}
		return func(b []byte, p unsafe.Pointer) []byte {
			for _, f := range fs {
				if f.skip {
					b = binary.AppendUvarint(b, 0) // as "" is written
					continue
				}
				b = f.enc(b, unsafe.Add(p, f.off))
			}
			return b
		}
	case reflect.Slice:
		elem := compileKey(t.Elem(), skip)
		size := t.Elem().Size()
		return func(b []byte, p unsafe.Pointer) []byte {
			h := (*sliceHeader)(p)
			b = binary.AppendUvarint(b, uint64(h.len))
			for i := 0; i < h.len; i++ {
				b = elem(b, unsafe.Add(h.data, uintptr(i)*size))
			}
			return b
		}
	case reflect.Array:
		elem := compileKey(t.Elem(), skip)
		size, n := t.Elem().Size(), t.Len()
		return func(b []byte, p unsafe.Pointer) []byte {
			b = binary.AppendUvarint(b, uint64(n))
			for i := 0; i < n; i++ {
				b = elem(b, unsafe.Add(p, uintptr(i)*size))
			}
			return b
		}
	}
	// Pointers, maps, interfaces: their printed form, as appendKey writes
	// it.
	return func(b []byte, p unsafe.Pointer) []byte { return appendKey(b, reflect.NewAt(t, p).Elem()) }
}

// sliceHeader is the layout of a slice value.
type sliceHeader struct {
	data     unsafe.Pointer
	len, cap int
}

// appendKey appends the encoding of v to b by reflection: the reference
// the compiled encoders follow (and what they call for kinds a check
// input seldom has).
func appendKey(b []byte, v reflect.Value) []byte {
	switch v.Kind() {
	case reflect.String:
		b = binary.AppendUvarint(b, uint64(v.Len()))
		return append(b, v.String()...)
	case reflect.Float32, reflect.Float64:
		return binary.LittleEndian.AppendUint64(b, math.Float64bits(v.Float()))
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64:
		return binary.AppendVarint(b, v.Int())
	case reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64, reflect.Uintptr:
		return binary.AppendUvarint(b, v.Uint())
	case reflect.Bool:
		if v.Bool() {
			return append(b, 1)
		}
		return append(b, 0)
	case reflect.Struct:
		for i := 0; i < v.NumField(); i++ {
			b = appendKey(b, v.Field(i))
		}
		return b
	case reflect.Slice, reflect.Array:
		b = binary.AppendUvarint(b, uint64(v.Len()))
		for i := 0; i < v.Len(); i++ {
			b = appendKey(b, v.Index(i))
		}
		return b
	}
	// Anything else (pointers, maps, interfaces): its printed form, as
	// the key was before, length-prefixed.
	s := fmt.Sprintf("%v", v)
	b = binary.AppendUvarint(b, uint64(len(s)))
	return append(b, s...)
}
