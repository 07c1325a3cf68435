// Package export writes what a designer hands on from a framecheck run: the
// results file other programs read (results.json), the member schedule with
// lumber takeoff (schedule.xlsx) and markup on the designer's own drawing
// (an annotated copy of the DXF, or the markup alone as an R12 overlay), and
// report.html, the plan coloured by utilisation with each mark's
// calculation written out.
//
// It takes plain structs (Results, Markup) that mirror the results.json
// contract; it knows nothing about how members were found or checked, so it
// imports neither framing nor check. The caller fills a Results from those
// packages and builds a Markup with MarkupFromResults.
//
// Writers:
//
//	WriteJSON(path, r)          results.json, schema "framecheck-results/3" (docs/RESULTS-SCHEMA.md);
//	                            one member, calculation, info list, mark, blocking row or uplift
//	                            bearing per line; checks, traces and factors once per calculation,
//	                            info lines once per list; numbers to 6 significant digits
//	                            (json_num.go); NaN/Inf written as 0 and reported as a
//	                            *NonFiniteError after the write
//	ReadJSON(path)              results.json back into Results, checks, traces and info in place
//	                            (schemas 3, 2 and 1)
//	WriteXLSX(path, r)          sheets Members, Marks, Blocking, Takeoff, Uplift, Inputs, Notes
//	                            (excelize writes the workbook; the Members rows are
//	                            written here and spliced in, see xlsx_members.go)
//	Annotate(in, out, markup)   copy of the drawing with our layers and markup added
//	WriteOverlay(path, markup, units)  the markup alone, R12
//	WriteReport(path, r, geometry, when) report.html: self-contained page with the plan
//	                            as SVG, schedule, takeoff and per-mark calculations
//
// Every writer writes atomically: a temporary file in the target folder,
// fsync, then rename, so a failed write leaves no partial file and leaves an
// earlier output untouched. No writer ever writes over the input drawing:
// Annotate refuses an output naming its input (ErrSameFile), and WriteJSON
// and WriteXLSX refuse a .dxf path.
//
// Annotated DXF layers (names of our own, also listed on the Notes sheet):
//
//	FC-FAIL          colour 1 (red), a LINE over every failing or erroring member
//	FC-BLOCKING-ADD  colour 4 (cyan), a LINE across the run for every blocking row to add
//	FC-LABEL         colour 2 (yellow), a TEXT "mark ratio" at each member's midpoint
//	FC-UPLIFT        colour 6 (magenta), a TEXT "uplift N lb" at each bearing whose net
//	                 uplift (ASD) is flagged (Results.Uplift)
//
// Independent checks: .ci/checks/export-dxf.sh reads the annotated R12 and
// R2000 plans and the overlay with ezdxf (audit, original entities kept,
// markup counts); .ci/checks/export-xlsx.sh reads schedule.xlsx with
// openpyxl. Both run export/internal/cifiles to write the files.
package export
