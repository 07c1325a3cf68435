// Package pipeline checks a grouped framing plan: it builds each member's
// check input from the project file (zones loading the lengths they act
// on, point loads, self-weight, pitch), checks identical members once on
// every core, picks sizes when asked, decides the blocking rows of each run
// (drawn rows first), names the marks, counts the takeoff and follows the
// load path: joists' reactions by load type onto the beams that carry them,
// beams and posts checked, the demand at every joint and the loads reaching
// walls and posts.
//
// It knows framing, check, loadpath and project; it reads no drawing and
// writes no output format (cmd/framecheck does both). Findings are
// dxfimport.IssueList entries, as the packages before it make them.
package pipeline
