// Package beam analyses a prismatic member on two or more point supports,
// with an optional cantilever (overhang) at either end, under a uniform
// line load on each segment.
//
// It takes a Beam (length, support positions, EI) and one line load per
// segment, and returns a Response holding the exact piecewise solution:
// shear (linear), bending moment (quadratic) and deflection (quartic) in
// every segment, the reactions and the support moments. It knows nothing
// about wood, NDS or load combinations; package check builds on it.
//
// Method: the interior support moments come from the three-moment
// (Clapeyron) equation, a tridiagonal system solved directly; the moments
// over the end supports are the statically known cantilever moments.
// Each span's shear and moment then follow from statics, its deflection
// from integrating EI d2y/dx2 = -M with zero deflection at both supports,
// and each cantilever's deflection from continuity of slope over its
// support (so a tip deflection includes the back-span rotation).
//
// Units and signs (inches, pounds):
//   - x runs from 0 at the left end to LengthIn at the right end;
//   - line load w, lb/in: positive downward (gravity), negative upward
//     (uplift);
//   - reactions, lb: positive upward;
//   - moment, lb*in: positive sagging (top edge in compression, bottom edge
//     in tension);
//   - shear, lb: dM/dx, the sum of the upward forces to the left of the
//     section (+wL/2 at the left support of a simple span);
//   - deflection, in: positive downward; slope dy/dx in the same sense.
//
// The response is linear in the loads: to combine load cases, solve again
// with the combined loads (Solve is cheap and SolveInto allocates nothing
// for beams of up to eight segments).
package beam
