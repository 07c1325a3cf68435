// Package framing groups the lines of an imported framing plan into joist
// members ready for design: bearings, spans, overhangs, tributary widths,
// load zones, size callouts, runs, blocking rows, marks and the lumber
// takeoff. It takes a *dxfimport.Drawing (world inches) and the project
// file's layer map and returns a *Plan; it knows nothing about NDS
// (package check does the design).
//
// # Roles by layer
//
// Options maps layer globs to roles: joists, supports (each with a kind and
// a single-line bearing length), drawn blocking, load-zone outlines and
// labels. A layer matching several roles takes the first of joist, support,
// blocking, zone, label. Entities on other layers, and entities of a kind a
// role does not use, are counted in Plan.Ignored.
//
// # Members
//
// A joist is a LINE, a 2-vertex polyline or a polyline whose vertices lie
// on one line (within 0.1 in) going one way. Bent polylines, polylines with
// arcs and zero-length lines are skipped with a warning; a joist drawn twice
// (on one line, within 0.5 in across, both ends within the snap tolerance)
// is kept once, naming both handles.
//
// # Members drawn as outlines (outlines.go, outlinecheck.go)
//
// A member may also be drawn as its outline: a closed rectangular
// polyline (LWPOLYLINE or POLYLINE, 4 corners square within 2 degrees),
// a rectangle of 4 LINEs, or two parallel lines with or without end caps.
// Joist lines of one direction group are the sides of one outline when
// they lie 0.75 to 5.75 in apart across (a lumber thickness, 0.75-5.5 in,
// plus 0.25 in), overlap along by at least half the shorter, and the
// shorter is at least 3 in and 4 times the gap long; sides chain, so
// outlines drawn touching are one bundle. A bundle 0.5 to 6.25 in wide is
// one member on its centre line, from the farthest start to the farthest
// end of its sides; its end caps (short lines whose ends meet two of its
// corners within the snap tolerance, going across it) belong to it. So
// two joist lines 1.5 in apart are one member, not two plies.
// Member.DrawnThicknessIn is the bundle's width; when it differs from the
// size's dressed b (NDS 2018 Supplement Table 1B) by more than 0.25 in,
// a warning names both. Interior lines leaving plies of at least 0.75 in
// each side make a built-up member (Member.Plies = lines + 1, b = plies x
// the size's b): one member, in error for now, as check has no built-up
// section; the takeoff counts every ply.
//
// An outline that is not a rectangle is an error (FRM216) naming its
// handles: a closed polyline of other than 4 square corners; a bundle
// whose sides are not parallel (width at its ends differing by more than
// 0.25 in); a thin closed figure of joist lines meeting end to end
// (within the snap tolerance) that holds a short line which is neither a
// side nor a cap (a tapered or pointed outline). Such an outline is an
// error member on the centre line of the strip it fills, so its
// neighbours keep their tributary widths; one wider than a built-up
// member is only reported.
//
// # Blocking drawn on a joist layer (joistblocking.go)
//
// A joist line no longer than 30 in that is more than 45 degrees to two
// longer parallel joist members, each end within the snap tolerance (plus
// half the member's drawn thickness) of one of them, is drawn blocking,
// not a member: it is a drawn blocking line from centre line to centre
// line (so it braces the members it joins at its position, and pieces in
// line across a run are a drawn row, staggered ones brace each member at
// their own positions), and Plan.DrawnBlocking lists it for the takeoff
// (Takeoff.ExistingBlocking, clear length = centre to centre less b).
//
// # Bays shown by a span symbol (bays.go, bays_geom.go, bays_layout.go)
//
// A closed outline on a bay layer, or a span line with a size callout on
// the label layer running from support to support, stands for joists at
// the callout's spacing that are not drawn. They are laid out (from the
// bay's left or bottom edge, one every spacing, a last one on the far
// edge) and appended to the joist lines before members are made, so every
// rule below applies to them; Member.Generated marks them and Member.Pos
// is the bay's outline or span line. A bay with joists drawn in it is not
// laid out (its callout applies to them). bays.go states every rule.
//
// Joists are clustered by direction (mod 180 degrees, chained within
// AngleTolDeg). Each group has a direction u at an angle in (-90, 90]
// degrees, and every member is oriented along it: Start is the end with the
// smaller coordinate along u (the left or lower end; for vertical joists the
// bottom). Members are sorted by midpoint y, then x (each rounded to
// 0.001 in) and named M1..Mn in that order, so IDs are reproducible.
//
// # Bearings
//
// A support line is a bearing of a joist when the joist crosses it, or an
// end stops within SnapToleranceIn of it; lines within 10 degrees of the
// joist's direction, and lines shorter than a tenth of the joist and
// than MaxWallThicknessIn + SnapToleranceIn (ticks, a wall's end), are
// not bearings. Parallel support lines of
// the same kind met by the joist within MaxWallThicknessIn of the first of
// them (a double-line wall, the plies of a beam, plates and sheathing:
// any number) are one bearing at the middle of the group whose length is
// the group's width; lines less than 0.25 in apart along the joist are one
// line drawn twice. Where an end stops inside the group (a joist drawn
// into the wall), the lines just past the end belong to it too, and the
// bearing length stops at the end. Bearing.AtIn may be a little below 0
// or above LengthIn when an end stops short of its support. Arcs and
// circles on support layers (door swings, a curved wall) and arc segments
// of support, blocking and label polylines are not read: one finding
// (FRM213) counts them and names the first three.
// A member with fewer than two bearings is an error member, with a message
// naming the unsupported end and the nearest other support. A flush beam
// that ends on a joist more than MaxWallThicknessIn + SnapToleranceIn from
// both its ends (a header hung from a trimmer) is carried by the joist,
// not a bearing of it; the joist is an error member, as its point load is
// outside the checks' scope.
//
// Overhangs follow DOMAIN.md: an end more than lb/2 + SnapToleranceIn past
// the outermost bearing centre, measured square to the support (so a joist
// skewed to its wall may run (lb/2 + snap) / sin(angle) along itself), is a
// cantilever of that length; otherwise it
// is part of the bearing (overhang 0), and an end so bearing on a flush
// beam hangs in a hanger.
//
// # Tributary widths, runs
//
// For each direction group the members are sorted by their offset across
// the group (along the normal n with n.X > 0, or n.Y > 0 for horizontal
// joists) and each looks for the nearest parallel joist on either side whose
// extent along u overlaps its own by more than the snap tolerance and by at
// least half the shorter of the two (so lapped joists are not neighbours),
// no farther than 120 in and no nearer than 0.5 in. Each side takes half that
// gap. A side with no neighbouring joist (an edge joist's outer side)
// takes EdgeDistanceIn, or more where the drawing shows more load there:
// half the gap to a support line running parallel beside it within 48 in,
// overlapping half its length (a wall or beam the sheathing also bears on:
// FRM221, info); failing that, when the innermost load zone holding its
// midpoint reaches on past it (by more than 1.5 in, measured square to it),
// the whole strip to the zone's edge, up to 48 in (sheathing cantilevered
// past the joist: FRM222, a warning; a zone reaching farther is a warning
// that the strip's load reaches no member drawn, and the side keeps
// EdgeDistanceIn). SpacingIn is the mean of the two gaps (the trib width),
// the one gap of an edge joist, 0 for a lone one.
//
// Neighbours that are both usable and bear on the same support lines (same
// number and kinds, each bearing centre on the other's support line) form a
// Run, ordered across by increasing offset (left to right for vertical
// joists, bottom to top for horizontal ones). Runs are named R1.. in order
// of their first member.
//
// # Zones and callouts
//
// A zone outline is a closed polyline on a zone layer, named by the text
// inside it (the smallest outline holding the text's insertion point).
// A member is cut where it crosses zone edges; each piece takes the
// innermost zone holding it (DefaultZone outside all), and every zone
// holding more than MaxWallThicknessIn of the member counts. Several
// zones: each loads the member where it acts (Member.ZonePieces), with a
// message naming the zones and lengths.
//
// A label text that reads as a size callout (ReadCallout: size, plies,
// spacing, species and grade as the trade writes them) applies to the
// joists crossed by the nearest label-layer line within max(12 in, 3 text
// heights); without one, to the run of the joist within 24 in of the text.
// Lumber is callout > first matching by_layer rule > project default, for
// size, species and grade each; a built-up callout "(2) 2x10" gives the
// size "(2) 2x10". A callout whose size is in actual inches names its
// material by a word after it, structural composite lumber of the
// project's materials file ("1 3/4 x 11 7/8 LVL @ 16", ReadCalloutWith,
// Options.MaterialCallout): its joists take that material, the size in
// actual inches and the callout's grade (else the layer's grade when the
// layer names the same material, else none: the material's only grade).
// A text that names a size but cannot be read (nonsense
// spacing, no such lumber, a metric section) makes the members under it
// errors with no size: the project default is never assumed for them.
// Conflicting callouts (different sizes, species, grades, or two different
// spacings; a callout without a value agrees with one that has it) make
// the member an error; a callout spacing more than 1 in from the measured one (gaps
// of 4 in or less, between the plies of a doubled joist, left out) is a
// warning. Drawn blocking lines crossing or touching a joist are its
// bracing points, one per position (blocking drawn piece by piece touches
// each joist from both sides).
//
// # Issue codes
//
//	FRM201 warning  joist polyline bent or with arcs: skipped
//	FRM202 warning  zero-length joist: skipped
//	FRM203 warning  joist drawn twice: kept once
//	FRM204 error    an end reaches no support
//	FRM205 error    member outside every zone and no default zone
//	FRM206 warning  member crosses zone edges: loaded zone by zone
//	FRM207 warning  zone outline without a name, with two, or a name outside every outline
//	FRM208 error    callout naming a size that cannot be read: its members are errors
//	FRM208 warning  label text that tries to be a callout, names no size (or reaches no joist)
//	       info     label texts with no size in them (room names, notes), counted once
//	FRM209 error    conflicting callouts on one joist
//	FRM210 warning  callout spacing differs from the measured spacing by more than 1 in
//	FRM211 warning  callout that reaches no joist
//	FRM212 warning  joist with no parallel neighbour
//	FRM213 info     arcs and circles on support layers, and arc segments of polylines
//	                (then a warning): skipped, one finding with a count and three handles
//	FRM214 warning  entity with a coordinate that is not finite or beyond 1e9 in: skipped
//	                (an error on a joist layer: that joist is not checked)
//	FRM215 error    a flush beam ends on the joist away from its ends (header on a trimmer): point load
//	FRM216 error    joist outline that is not a rectangle: not checked
//	FRM217 warning  an outline's drawn thickness differs from its size's b by more than 0.25 in
//	FRM218 error    outlines drawn side by side: a built-up member, not checked yet
//	FRM219 error    bay outline or span symbol that cannot be laid out (no callout, no
//	                spacing, no support on one side): nothing generated in it (bays.go);
//	                a warning for joist positions at a bay's edges that reach no support
//	FRM220 info     bay whose joists are drawn: its callout applies to them, none generated
//	FRM221 info     edge joist beside a parallel support line within 48 in: half the gap to it
//	                is its tributary width on that side (when more than the edge distance)
//	FRM222 warning  edge joist with no joist or support line beside it, whose load zone reaches
//	                on past it: within 48 in it carries the whole strip to the zone's edge;
//	                farther, that strip's load reaches no member drawn (the joist keeps the
//	                edge distance)
//	FRM223 info     a beam checked as a member runs beside edge joists: it carries its half of
//	                the strip between them (Beam.Strips) with the joists' zone loads
//	       warning  the joists have no zone: the strip is not put on the beam
//	FRM224 warning  a beam checked as a member carries joists on one side only and its load
//	                zone reaches on past it on the other: that strip is not in its check
//	FRM225 warning  a beam checked as a member runs parallel between two neighbouring joists:
//	                the floor over it is on their tributary widths, not in its check
//	FRM230 warning  entity on a posts layer that is no post (a large circle or outline, open lines): skipped
//	FRM231 error    point-load mark with no text beside it, or a text that cannot be read
//	FRM232 error    point-load mark on no joist or beam
//	FRM233 error    point-load text with no mark near it (or beside a mark with a nearer text): not applied
//	FRM234 warning  beam with fewer than two supports of its own found: stays a rigid bearing
//	FRM235 error    beams that bear on each other in a cycle
//	FRM236 warning  closed outline on a point-load layer larger than a post (12 in across): not read as a point load
//
// # The load path as drawn (posts.go, pointloads.go, pointloadoutlines.go, beams.go)
//
// Posts (Plan.Posts, P1..) are circles up to 24 in across, closed
// outlines up to 12 in across (a closed polyline, or lines meeting end to
// end, diagonals allowed) and block inserts on posts layers; a size text
// beside a post (on a posts layer, else a label text naming a size,
// within max(12 in, 3 text heights)) is Post.Text. Point-load marks
// (Plan.PointLoads) are POINTs, CIRCLEs, block inserts and small closed
// outlines (a post drawn above, from the floor above: a closed polyline or
// lines meeting end to end, up to 12 in across, marking its centre;
// pointloadoutlines.go) on point-load layers; other lines there (leaders)
// are not read. Each takes the nearest text within max(12 in, 4 text heights),
// read by ReadPointLoad, and sits on the nearest joist or beam whose centre
// line passes within half its drawn width plus the snap tolerance.
//
// Beams (Plan.Beams, B1..) are the support lines of kinds other than
// bearing-wall (unless SupportSpec.Rigid): parallel lines of one kind,
// within MaxWallThicknessIn across and overlapping along, are one beam on
// their centre line (its outline's end caps belong to it); n + 1 lines
// are n plies. A label text naming a size with no spacing, or a glulam or
// SCL callout, whose nearest beam is within its reach and nearer than any
// joist or label line, is the beam's Callout (and not a joist callout).
// A beam bears on posts under its centre line (within half its width plus
// the snap tolerance), on bearing walls it crosses or ends on (in line with
// it too), and on a beam its end lands on, inside that beam; with fewer
// than two of these it stays a rigid bearing (Beam.Rigid). Joist bearings
// on its lines are Beam.Carried (Bearing.Support names the entry of
// Plan.Supports a joist bears on). Beams bearing on each other in a cycle
// are an error; the loads themselves are for the caller.
//
// # Speed
//
// Support and joist searches go through uniform grids over the segments,
// neighbours through one order of the joists by direction group and
// offset across, duplicates through a band index; the joists are ordered
// by radix sorts on their keys (sortkeys.go), not by comparison, so
// Group grows about linearly with the plan.
//
// The work done for each member on its own (its supports and bearings,
// neighbours and tributary widths, zones, the joists under each callout,
// the member grid's cells, outline sides) runs on GOMAXPROCS goroutines,
// each over one contiguous range of members (parallel.go). Each writes
// only its own members and lists; what several members share (merged
// double lines, union-find sets, runs, issues) is done after, in member
// order. The plan is the same to the last bit on any number of cores:
// TestGroupWorkersSame groups the demo plan, the fixtures, bigplans and
// random messy plans on one goroutine and on several, with ranges as
// small as one member, and compares whole plans.
//
// BenchmarkGroupSynth groups samples/bigplan drawings of 10,000, 100,000
// and 1,000,000 joists (ns/joist should be flat); BenchmarkGroupSteps
// times each step at 100,000. Group's wall time on the 2-core build
// machine, GOGC=300 as the command sets it, a collection before each
// call, best of 3 to 25 calls, load average under 2 (4 December 2026;
// "before" is the single-goroutine code this replaced):
//
//	joists      before          after, 2 cores   after, 1 core
//	10,000      2.57 µs/joist   1.75 µs/joist
//	100,000     3.71 µs/joist   1.99 µs/joist    2.85 µs/joist
//	1,000,000   5.57 µs/joist   2.20 µs/joist
//
// While other jobs hold a core the two-core figures come near the
// one-core ones.
//
// Outlines are found through one sort of the joist lines by direction
// group and band across (a radix sort) and short walks along each band;
// on samples/bigplan's 100,000 joists drawn as 4-line rectangles
// (400,000 lines), grouping took 0.76 CPU-s against 0.47 CPU-s for the
// same plan drawn as centre lines (BenchmarkStageFramingOutlines in
// cmd/framecheck; 4 December 2026, load average 8).
package framing
