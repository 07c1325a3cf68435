// Package synth draws synthetic framing plans of any size for framecheck's
// benchmarks and for samples/bigplan: N joists in many runs, with
// double-line walls, flush and dropped beams, a continuous bay with
// blocking drawn, cantilevers, load zones, size callouts, a few joists
// drawn short of their support (error members) and undersized storage bays
// (failing members), in R2000 or R12 flavour.
//
// # Layout
//
// The plan is a grid of units. A unit is four runs of joists side by side,
// all in one load zone, each run outlined by a closed polyline on a zone
// layer (to its edge joists' outer faces) with the zone's name inside. Units follow a fixed ten-unit pattern of
// zones (see unitZones); the zone decides what the runs are:
//
//	FLOOR      simple span between 2x6 walls (two lines 5.5 in apart),
//	           flush beam to wall, continuous over a 2x4 interior wall
//	           (with blocking drawn at mid-span), simple span again
//	STORAGE    flush beam to wall, called out 2x10 @ 16" at 125 psf live:
//	           every one of these joists fails bending (see Stats)
//	BALCONY    wall to wall and a 24 or 36 in cantilever past the wall
//	ROOF-EDGE  roof joists at 24 in on two dropped beams, high wind
//	           uplift: the longer spans need blocking rows
//	ROOF-FIELD the same with less uplift
//
// Spans cycle through 120 to 192 in (12 in steps; the continuous bay uses
// 120 to 144 in per span) and runs hold 9 to 29 joists, so there are many
// distinct members as well as many identical ones, as on a real
// development. Runs are 160 in apart and rows 640 in apart, more than
// framing's 120 in neighbour reach, so each run's edge joists are edges.
// Every fifth flush-beam run has one joist drawn 6 in short of the beam.
//
// With Options.Beams, every beam line (one per flush-beam and storage run,
// two per roof run: 33 beams to each 40 runs) stands on square 6x6 posts
// on layer POST-1, one under each end with its outer face at the beam's
// end and as few between, equally spaced, as keep the spans within 16 ft;
// ProjectBeams sizes the beams and posts, so each beam is checked as a
// member with the reactions of the joists it carries. Without it, the
// same beam lines have no supports of their own and stay rigid bearings.
//
// Everything is computed from the run index: the same Options give the
// same bytes. ProjectFor(o) is the project file that goes with a plan:
// Project, or ProjectBeams with Beams.
package synth
