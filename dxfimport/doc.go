// Package dxfimport reads ASCII DXF framing plans (R12 AC1009 to R2018
// AC1032) into a Drawing: header facts, the LAYER table, and the
// model-space entities in world coordinates, inches, with every INSERT and
// MINSERT expanded. It knows nothing about joists; package framing works
// from the Drawing.
//
// The reader is layered as ezdxf's loader is, but keeps positions
// throughout:
//
//   - TagReader streams group code / value pairs with their 1-based line
//     (bufio, LF or CRLF, padded codes), and refuses binary DXF, DWG and
//     empty input up front;
//   - pairs are grouped into sections and entities (group.go), reusing one
//     buffer, so reading allocates nothing per pair;
//   - typed entities are read from a group (entities.go), their OCS
//     applied (extrusion (0,0,-1) mirrored entities included);
//   - block definitions are expanded into model space (blocks.go): base
//     point, x/y scale, rotation, MINSERT rows and columns, nesting up to
//     Options.MaxInsertDepth, self-inserting blocks caught, entities on
//     layer "0" taking the INSERT's layer.
//
// Units are converted once, here: $INSUNITS (1 in, 2 ft, 4 mm, 5 cm, 6 m)
// or Options.Units. A missing or unitless header is read as inches and
// reported as issue DXF101 with Drawing.Units left empty, so the caller can
// ask for --units.
//
// Malformed input gives a *ParseError (file, line of the group code, code,
// handle) that wraps a sentinel (ErrBinary, ErrDWG, ErrEmpty,
// ErrTruncated, ErrBadCode, ErrBadNumber, ErrStructure, ErrLineTooLong).
// Everything else that is worth saying is a Drawing.Issues entry:
//
//	DXF101 warning  units unknown, read as inches
//	DXF102 info     what was skipped (unknown entity types, sections)
//	DXF103 warning  INSERT of an undefined block
//	DXF104 warning  block inserts itself, or nesting deeper than the limit
//	DXF105 error    more entities than Options.MaxEntities
//	DXF106 warning  unsupported code page, or text not valid UTF-8
//	DXF107 warning  no 0/EOF marker
//	DXF108 warning  circle, arc or text under a non-uniform scale
//	DXF109 info     Options.Units differs from $INSUNITS
//	DXF110 warning  extrusion not along Z: projected onto XY
//	DXF111 warning  POLYLINE without SEQEND
//	DXF112 error    coordinates overflow when converted to inches
//
// Text: $DWGCODEPAGE ANSI_1252 files before AC1021 are decoded from code
// page 1252, later files are UTF-8; \U+XXXX escapes are decoded; TEXT %%
// codes are resolved; MTEXT formatting is stripped with \P as a newline.
//
// Tested against ezdxf 0.18.1 (testdata/gen_fixtures.py writes the
// fixtures and ezdxf's own reading of them).
package dxfimport
