// Package check is the NDS 2018 ASD engine for one sawn-lumber joist.
//
// It takes a Member (size, species and grade, bearings along it,
// overhangs, tributary width, area loads by type, service conditions and
// the bracing of each edge) and Settings, and returns a Result: every check
// (bending of each edge, shear, live and total deflection, bearing) with
// its governing load case, ratio and a step-by-step trace, the blocking
// rows the bottom edge needs, and the factors and design values used. It
// knows nothing about drawings; package check/beam does the structural
// analysis under it.
//
//	r := check.CheckMember(m, check.DefaultSettings())     // solves blocking rows
//	r := check.CheckWithRows(m, s, 2)                       // with the run's rows
//	sz := check.Size(m, s, []string{"2x8", "2x10"}, 2.0)    // candidate sizes
//
// Bad input (unknown names, zero or negative spans, NaN or negative loads)
// gives a Result with Status "error" and a message; it never panics.
//
// # Design basis
//
// ANSI/AWC NDS 2018 (ASD) and its Supplement, ASCE 7-16 2.4.1 ASD load
// combinations, IBC 2018 Table 1604.3 deflection limits. Design values are
// the built-in tables nds2018_table4a.csv (Supplement Table 4A: Douglas
// Fir-Larch, Hem-Fir, Spruce-Pine-Fir) and nds2018_table4b.csv (Table 4B:
// Southern Pine), checked against stored tabulations of the Supplement
// (docs/VERIFIED.md); users add rows with LoadMaterialsCSV or LoadMaterialsTOML
// (same columns). A new edition means new tables and new spot checks.
//
// # Method and assumptions
//
//   - The analysis model runs from the tip of the start overhang to the tip
//     of the end overhang, with a pin at each bearing centre-line. An end
//     that is part of its bearing (overhang 0) carries no cantilever; its
//     load goes into the reaction (Member.LengthIn still sets the distance
//     from the member end used for Cb).
//   - Loads: w = psf x tributary width / 144 lb/in, uniform on the whole
//     member. Combinations are data (Settings.Combos; default ASCE 7-16
//     2.4.1 combinations 1 to 7). "(A or B)" gives one case per
//     alternative; a combination with W is evaluated with the wind toward
//     the member and away from it (Loads.WindUpPsf, a magnitude). Cases
//     whose variable loads are all zero are skipped. CD is that of the
//     shortest-duration non-zero load (NDS 2.3.2).
//   - Pattern loading (Settings.PatternLive): on members of more than one
//     segment (spans and cantilevers), L, Lr, S and W are applied to every
//     non-empty subset of segments (up to five segments; beyond that, each
//     segment, adjacent pairs, alternate segments and each adjacent pair
//     with every second segment beyond it, the worst arrangement for a
//     support) and the worst case kept. D is never patterned. W is
//     patterned too (DOMAIN.md counts it among the live-type loads): ASCE 7
//     prescribes no partial wind loading for joists, but roof pressures
//     differ from zone to zone along a member, so loading the spans one by
//     one is the conservative envelope. On a
//     single span, cases another case dominates (same-sign load at least as
//     large with CD no larger) are dropped, which changes no result.
//   - Bending: each edge is checked over the stretches between its bracing
//     points (bearings, drawn and added blocking rows; a free cantilever
//     tip is not a bracing point) where the edge is in compression, each
//     stretch with its own lu, le (NDS Table 3.3.3: cantilever row for a
//     stretch reaching a free end, simple-span row for a single-span
//     member, the general row for spans of continuous members), RB, FbE
//     and CL (Eq. 3.3-6), against the largest moment of that sign in the
//     stretch. The inflection point is taken as a brace of the bottom edge
//     only under Settings.BraceAtInflection (inflection.go); moments
//     below 0.1% of the member's largest do not count as compression. The top edge
//     is held continuously when Settings.TopEdgeBraced; the bottom edge
//     when Member.BottomBracedContinuous. RB > 50 fails (NDS 3.3.3.7).
//     Cfu = 1 (strong-axis bending), CV does not apply to sawn lumber.
//   - Loads where they act: Member.LoadPieces give each stretch of the
//     member its own area loads (a member crossing load-zone edges), and
//     Member.PointLoads concentrated loads by load type; each combination
//     takes each stretch's own loads (never an envelope: in 0.6D + 0.6W a
//     stretch's dead load resists only its own uplift, and a zone may rely
//     on less dead load against uplift, AreaLoads.UpliftDeadPsf). Such
//     members are solved exactly with beam.SolveLoads.
//   - Shear: V at bearing centre-lines; with Settings.ShearAtD the loads
//     within lb/2 + d of the centre-line are left out only where NDS
//     3.4.3.1(a) holds: not at a bearing with net uplift in the case, not
//     where the member hangs (Bearing.Hanger). fv = 1.5 V / A.
//   - Deflection (service loads): live = each of L, Lr, S at 1.0 and W at
//     0.42 (IBC Table 1604.3 note f), patterned like the strength cases;
//     total (IBC Table 1604.3) = D + each downward live-type case, or
//     0.5 D + it for seasoned lumber in dry service (note d,
//     Settings.Seasoned); long-term (NDS 3.5.2) = Kcr D + each downward
//     live-type case (Kcr 1.5 dry, 2.0 wet when Settings.Kcr is 0), a
//     check of its own only with Member.LongTermLimit, otherwise reported
//     in Result.Info. Spans: largest deflection between their bearings
//     against span/limit; cantilevers: tip deflection (back-span rotation
//     included) against 2 x overhang/limit (note h).
//   - Sloped rafters (Member.PitchRise12): positions and gravity loads on
//     the horizontal projection; wind normal to the roof / cos^2; lu and
//     the deflection limits on the sloped length; deflection perpendicular
//     to the rafter (projection's / cos^2).
//   - Bearing: largest downward reaction of any case over b lb, against
//     Fc_perp CM Ct Ci Cb (no CD), and against the support's own Fc_perp
//     where the bearing names its species and grade (the smaller governs).
//     Each bearing's largest downward and
//     largest net uplift reaction, with its case, is in Result.Reactions
//     (the connector demand at ASD level).
//   - Posts (CheckPost): solid sawn columns, NDS 3.7.1 (CP, le/d <= 50),
//     and the end-grain bearing of the member above (3.10.1).
//   - Blocking rows (DOMAIN rule): when the bottom edge fails with the
//     bracing present, n = 1, 2, ... rows evenly spaced in every span (not
//     in cantilevers), the same n in each span, until it passes or the row
//     spacing would fall below 24 in. With rows drawn in a span
//     (Member.BlockingAtIn) they are kept and rows are added one at a time
//     where the edge still fails (drawn.go); Result.BlockingAtIn holds only
//     the rows to add, Result.DrawnBlockingAtIn the drawn ones. Rows cannot
//     help, and none are tried, when the edge fails with CL = 1.
//   - The bending traces state the bracing relied on (bracing.go).
//   - Cr = 1.15 needs Member.Repetitive and a spacing of at most 24 in.
//   - NDS 4.4.1.2 (lateral support by nominal d/b) is stated in
//     Result.Info as "the alternative rule of NDS 2018 4.4.1.2 would ask
//     for ...", after the calculated CL, never as a requirement.
//
// # Speed
//
// A check records the governing numbers of each of its checks and writes
// the trace (CheckResult.Trace: items, formulas, numbers put in) only when
// asked; the writers ask once per distinct result. On 2 December 2026, go
// test -bench CheckMember -cpu 1 on this machine (AMD EPYC, 2 cores shared
// with other jobs, load average about 1; cpu-ns/op is the process's CPU
// time):
//
//	BenchmarkCheckMember            6.6-8.8 us, 114,000-151,000 checks/s
//	BenchmarkCheckMemberTraced      15.6-19.2 us, 52,000-64,000 checks/s
//	BenchmarkCheckMemberFloor       4.9-5.1 us, 195,000-201,000 checks/s
//	BenchmarkCheckMemberContinuous  36-42 us, 24,000-28,000 checks/s
//
// CheckMember is a roof joist under net uplift: analysis, every check and
// the blocking solver's four bottom-edge evaluations, so the target of
// 100,000 complete member checks per second on one core is met. Traced
// adds writing all 43 trace items with their text (about 90 numbers
// formatted), which is most of its cost; Floor is a simple-span floor
// joist that needs no rows; Continuous a three-span joist with a
// cantilever under 15 live-load patterns. Before the traces were written
// on demand (commit 0fcca29) CheckMember measured 10.3-14.5 us, 69,000 to
// 97,000 per second.
package check
