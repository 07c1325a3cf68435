// Package beam analyses a prismatic member on two or more point supports,
// with an optional cantilever (overhang) at either end, under a uniform
// line load on each segment (Solve), or under any set of partial uniform
// loads and point loads (SolveLoads: loads where they act, such as a joist
// crossing load-zone edges, or joist reactions on a beam).
//
// It takes a Beam (length, support positions, EI) and one line load per
// segment (Beam.Segments: the left overhang if any, each span between
// adjacent supports, the right overhang if any), and returns a Response
// holding the exact piecewise solution: shear (linear), bending moment
// (quadratic) and deflection (quartic) in every segment, the reactions
// and the support moments. Queries give the moment, shear each side of a
// point, slope and deflection at any x, the exact moment extremes and
// largest deflection over a range, and the points where the moment
// changes sign (which bound the stretches where each edge of the member
// is in compression). It knows nothing about wood, NDS or load
// combinations; package check builds on it.
//
// Method: the interior support moments come from the three-moment
// (Clapeyron) equation for uniform loads, a tridiagonal system solved
// directly (Thomas algorithm); the moments over the end supports are the
// statically known cantilever moments -w a^2/2. Each span's shear and
// moment then follow from statics; its deflection from integrating
// EI d2y/dx2 = -M with zero deflection at both supports; each
// cantilever's deflection from continuity of slope over its support, so a
// tip deflection includes the rotation of the back span. Supports are
// rigid points; shear deformation is neglected (Euler-Bernoulli beam).
//
// Units and signs (inches, pounds):
//   - x runs from 0 at the left end to LengthIn at the right end; queries
//     clamp x to the beam;
//   - line load w, lb/in: positive downward (gravity), negative upward
//     (uplift);
//   - reactions, lb: positive upward (a negative reaction holds the
//     member down);
//   - moment, lb*in: positive sagging (top edge in compression, bottom
//     edge in tension), negative hogging (bottom edge in compression);
//   - shear, lb: dM/dx, the sum of the upward forces to the left of the
//     section (+wL/2 at the left support of a simple span);
//   - deflection, in: positive downward; slope dy/dx in the same sense.
//
// Bad input (NaN or infinite values, fewer than two supports, supports
// unsorted, coincident or off the beam, EI <= 0, the wrong number of
// loads) is an error wrapping ErrBadBeam or ErrBadLoad, never a panic.
//
// The response is linear in the loads: to combine load cases, solve again
// with the combined loads. Solve makes one allocation sized to the beam;
// SolveInto reuses a Response and allocates nothing once it has held a
// beam with as many segments. Measured with BenchmarkSolveInto on this
// project's 2-core AMD EPYC machine (go test -bench, machine shared with
// other builds, so figures vary by about 2x): about 55-70 ns for a simple
// span, 100-120 ns for two spans with a cantilever, 140-160 ns for four
// spans; Solve adds its one allocation (about 130-400 ns under load).
// BenchmarkQueries (MomentExtremes, MaxDeflection and MomentSignChanges
// over the whole beam) took about 120 ns, 550 ns and 800 ns for the same
// three beams; MaxDeflection's root finding is most of it.
package beam
