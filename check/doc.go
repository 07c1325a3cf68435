// Package check is the NDS 2018 ASD engine for one sawn-lumber joist.
//
// It takes a Member (size, species and grade, bearings along it,
// overhangs, tributary width, area loads by type, service conditions and
// the bracing of each edge) and Settings, and returns a Result: every check
// (bending of each edge, shear, live and total deflection, bearing) with
// its governing load combination, ratio and a step-by-step trace, the
// blocking rows the bottom edge needs, and the factors and design values
// used. It knows nothing about drawings; package check/beam does the
// structural analysis under it.
//
// Design basis: ANSI/AWC NDS 2018 (ASD) and its Supplement, ASCE 7-16 2.4.1
// ASD load combinations, IBC 2018 Table 1604.3 deflection limits.
package check
