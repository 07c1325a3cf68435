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
//	DXF102 info     what was skipped (unknown entity types, sections other than the routine CLASSES, OBJECTS and THUMBNAILIMAGE)
//	DXF103 warning  INSERT of an undefined block
//	DXF104 warning  block inserts itself, or nesting deeper than the limit
//	DXF105 error    more entities than Options.MaxEntities (a warning when the insert left out places nothing on a layer Options.Keep keeps)
//	DXF106 warning  unsupported code page, or text not valid UTF-8
//	DXF108 warning  circle, arc or text under a non-uniform scale
//	DXF109 info     Options.Units differs from $INSUNITS
//	DXF110 warning  extrusion not along Z: projected onto XY
//	DXF111 warning  POLYLINE without SEQEND
//	DXF112 error    coordinates overflow when converted to inches
//	DXF113 error    LINE without both coordinates of both ends: left out
//
// Text: $DWGCODEPAGE ANSI_1252 files before AC1021 are decoded from code
// page 1252, later files are UTF-8; \U+XXXX escapes are decoded; TEXT %%
// codes are resolved; MTEXT formatting is stripped with \P as a newline.
//
// No input makes the reader panic or hang: block expansion is bounded by
// Options.MaxEntities, HardMaxEntities and a budget of block copies
// (empty or self-inserting MINSERT grids included); FuzzRead checks that
// every error is a *ParseError with a line and that LINE/LWPOLYLINE read
// back identically after writing.
//
// Tested against ezdxf 0.18.1 (testdata/gen_fixtures.py writes the
// fixtures and ezdxf's own reading of them).
//
// # Speed and memory
//
// BenchmarkRead reads a generated 52 MB R2000-style plan (LINEs with
// handles and subclass markers, closed LWPOLYLINEs, TEXT, INSERTs of a
// 4-line block; 485,751 entities after expansion) from memory through the
// streaming reader (bufio, 64 KiB buffer, no copy of the whole file). On
// the 2-core AMD EPYC build machine, shared with other jobs (load average
// 10-14), go1.26, 2026-12-02:
//
//	BenchmarkRead       75-155 MB/s wall (mostly 124-155),
//	                    120-154 MB per CPU-second
//	                    207 MB and 225k allocations per read
//	                    alloc/entity 1.92: everything allocated during a read
//	                    is 1.92 times the entities' own size (structs,
//	                    points, strings), which bounds the peak heap
//	BenchmarkTagReader  160-318 MB/s wall, 288-313 MB per CPU-second
//	                    (Tag with a string value per pair)
//
// Wall-clock figures follow the machine's load; MB per CPU-second, which
// counts the garbage collector's threads too, is the steadier figure. Run
// with
// go test -run '^$' -bench . -benchtime 8x ./dxfimport
package dxfimport
