// Package dxfw writes small ASCII DXF files as group-code/value pairs, for
// framecheck's sample generators (samples/demogen, samples/bigplan). It
// knows only the entities the sample plans need: LINE, closed polylines
// and single-line TEXT.
//
// Two flavours, both in the DXF Reference's section layout:
//
//   - R2000 (AC1015), from New: HEADER, CLASSES, TABLES (VPORT, LTYPE,
//     LAYER, STYLE, VIEW, UCS, APPID, DIMSTYLE, BLOCK_RECORD), BLOCKS
//     (*Model_Space, *Paper_Space), ENTITIES, OBJECTS (root dictionary and
//     ACAD_GROUP); subclass markers, owner handles, $INSUNITS = 1 (inches);
//     closed outlines are LWPOLYLINEs.
//   - R12 (AC1009), from NewR12: HEADER, TABLES (VPORT, LTYPE, LAYER,
//     STYLE, VIEW, UCS, APPID, DIMSTYLE), BLOCKS ($MODEL_SPACE,
//     $PAPER_SPACE), ENTITIES; no subclass markers and no $INSUNITS (R12
//     has none: the reader must be told the units); closed outlines are
//     POLYLINE/VERTEX/SEQEND.
//
// Every object gets a handle (group 5, or 105 for R2000 DIMSTYLE records)
// from one counter; $HANDSEED in the header is the next unused handle, so
// the header is written last, in front of the body. Output is
// deterministic: the same calls give the same bytes.
package dxfw
