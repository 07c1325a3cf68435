// Package export writes what a designer hands on from a framecheck run: the
// results file other programs read (results.json), the member schedule with
// lumber takeoff (schedule.xlsx) and markup on the designer's own drawing
// (an annotated copy of the DXF, or the markup alone as an R12 overlay).
//
// It takes plain structs (Results, Markup) that mirror the results.json
// contract; it knows nothing about how members were found or checked, so it
// imports neither framing nor check. The caller fills a Results from those
// packages and builds a Markup with MarkupFromResults.
//
// Every writer writes atomically: a temporary file in the target folder,
// fsync, then rename, so a failed write leaves no partial file and leaves an
// earlier output untouched. No writer ever writes over the input drawing.
//
// Annotated DXF layers (names of our own, documented here and in the Notes
// sheet):
//
//	FC-FAIL          colour 1 (red), a LINE over every failing or erroring member
//	FC-BLOCKING-ADD  colour 4 (cyan), a LINE across the run for every blocking row to add
//	FC-LABEL         colour 2 (yellow), a TEXT "mark ratio" at each member's midpoint
//
// A report.html writer is planned for a later issue (report.go).
package export
