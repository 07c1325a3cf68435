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
	m.ID = ""
	var buf [256]byte
	return string(appendKey(buf[:0], reflect.ValueOf(m)))
}

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
