package check

import (
	"encoding/binary"
	"fmt"
	"math"
	"reflect"
)

// MemberKey is the check input less the ID, exactly: every field, floats
// by their bits, strings and slices with their lengths. It walks the
// struct by reflection, so a field added to Member is part of the
// key without a change here.
func MemberKey(m Member) string {
	var buf [256]byte
	return string(AppendMemberKey(buf[:0], &m))
}

// AppendMemberKey appends MemberKey(*m) to b without copying m: a caller
// keying many members reuses one buffer and makes a string only of the
// keys it has not met (a map looked up with string(b) does not allocate).
func AppendMemberKey(b []byte, m *Member) []byte {
	v := reflect.ValueOf(m).Elem()
	for i := 0; i < v.NumField(); i++ {
		if i == memberIDField {
			b = binary.AppendUvarint(b, 0) // the ID, as "" is written
			continue
		}
		b = appendKey(b, v.Field(i))
	}
	return b
}

// memberIDField is the index of Member.ID, left out of the key.
var memberIDField = func() int {
	f, ok := reflect.TypeOf(Member{}).FieldByName("ID")
	if !ok || len(f.Index) != 1 || f.Type.Kind() != reflect.String {
		panic("check.Member has no string field ID")
	}
	return f.Index[0]
}()

// appendKey appends an unambiguous encoding of v to b.
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
