// Framecheck checks the wood floor and roof joists of a DXF framing plan
// under NDS 2018 (ASD), ASCE 7-16 load combinations and IBC 2018
// deflection limits, works out the blocking rows the joists need, and
// writes a results JSON, an XLSX schedule with a lumber takeoff and an
// annotated copy of the plan.
//
// It assists a qualified designer; it does not replace engineering
// judgement or a licensed professional's review. Check its design values
// and code editions against those your jurisdiction has adopted.
//
// Usage:
//
//	framecheck <command> [arguments]
//
// `framecheck --version` prints the version. Every command takes --help. Flags may come before or after the file
// arguments; "--" ends the flags. Errors go to standard error, prefixed
// "framecheck: ". Colour is used only when standard output is a terminal
// and the NO_COLOR environment variable is unset.
//
// Exit status: 0 when every member passes (or the command succeeded), 1
// when any member fails or is in error, part of the drawing was not read,
// or the run itself is doubtful (RUN4xx findings, such as spans that
// point at wrong drawing units), 2 for unusable input (a bad project file
// or drawing) or a usage error, 3 when the machine failed
// the run (a full disk, a permission refused, the output folder locked by
// another run: the previous outputs are kept), 130 or 143 after SIGINT or
// SIGTERM (nothing written, the previous outputs untouched).
//
// # check
//
//	framecheck check PLAN.dxf [-p PROJECT.toml] [-o OUTDIR] [--units U] [--size] [--overlay]
//
// Reads the plan, finds the joists and their supports, checks every joist,
// decides the blocking rows each run needs, and writes results.json,
// schedule.xlsx, report.html and an annotated copy of the drawing
// (PLAN-checked.dxf) into OUTDIR as one set that replaces the previous
// one whole, with the manifest framecheck-run.json (tool version, time,
// the inputs' and every output's SHA-256) written last, then
// prints a summary table: members, pass or fail, blocking rows, takeoff
// totals, and the project-file defaults that applied. Its first line
// counts the members by status and the warnings, and says when the run is
// doubtful ("RUN DOUBTFUL: RUN401 the drawing units look wrong").
//
//	-p PROJECT.toml  project file (see "framecheck init"); without it, the
//	                 built-in defaults, which suit a plan drawn on JOIST*
//	                 and WALL* layers
//	-o OUTDIR        output folder; default: PLAN-framecheck beside the plan
//	--units U        unit of the drawing: in, ft, mm, cm or m; overrides
//	                 the project file and the DXF header ($INSUNITS)
//	--size           pick the most economical passing size (joist board feet
//	                 plus blocking) from the project file's [sizing]
//	                 candidates instead of checking the sizes given
//	--overlay        also write the markup alone as an R12 overlay DXF
//
// # demo
//
//	framecheck demo [-o OUTDIR]
//
// Writes the demo plan and project file built into the program into OUTDIR
// (default ./framecheck-demo) and runs check on them, so the whole job can
// be seen from any folder with no files at hand.
//
// # layers
//
//	framecheck layers PLAN.dxf [-p PROJECT.toml] [--units U]
//
// Lists every layer of the plan with its entity counts by type and the
// role the project file gives it (joists, blocking, zones, labels, posts,
// point_loads, or a support kind), or none, then notes: layers off or frozen, patterns that
// match no layer, what the reader skipped. The quick way to map a new
// drawing to a project file. Without -p the built-in patterns apply.
// Entities the reader had to leave out are among the notes as error
// findings, with exit status 1.
//
// # member
//
//	framecheck member --size 2x10 --span 14ft [flags]
//
// Lengths (L) carry their unit as the trade writes them: 14'-6", 14' 6",
// 14ft, 168in, 3 1/2", 4.2m, 350mm. A bare number is refused, naming both
// readings: "--span 14: 14 in or 14 ft? write 14ft or 14in".
//
// Checks one joist described by flags and prints the calculation trace:
// reference design values and their table, adjustment factors, and for
// each check its governing load combination, the formulas with the numbers
// put in, the NDS, ASCE 7 or IBC reference, and the ratio. Exit status 0
// when the joist passes, 1 when it fails.
//
//	--size S            nominal size, e.g. 2x10 (required)
//	--span L            span, centre to centre of bearings (required);
//	                    repeat the flag or give a comma list (12ft,10ft)
//	                    for a continuous joist
//	--species NAME      species group (default Douglas Fir-Larch)
//	--grade G           grade (default No.2)
//	--overhang L        cantilever past the last bearing's centre-line
//	--bearing L         bearing length at each support (default 3.5in)
//	--spacing L         on-centre spacing, taken as the tributary width
//	                    (default 16in)
//	--dead PSF          D, self-weight included (default 12)
//	--live PSF          L (default 40 for a floor, 0 for a roof)
//	--roof-live PSF     Lr (default 0 for a floor, 20 for a roof)
//	--snow, --wind-down, --wind-up PSF
//	                    S, and wind toward or away from the joist at
//	                    strength level (default 0)
//	--use floor|roof    member use (default floor)
//	--ceiling C         plaster, non-plaster or none (default non-plaster)
//	--live-limit N, --total-limit N
//	                    deflection limits L/N, 0 = not checked (default
//	                    from use and ceiling, IBC 2018 Table 1604.3)
//	--bottom-braced     a ceiling fastened to the joist braces its bottom
//	                    edge
//	--blocking N        blocking rows in each span (default: as many as the
//	                    bottom edge needs)
//	--repetitive=false  no repetitive member factor Cr
//	-p PROJECT.toml     take the [design] switches from a project file
//
// Lengths are inches unless they carry a unit: 14ft, 14'6", 3.5in, 4.2m,
// 350mm.
//
// # materials
//
//	framecheck materials [SPECIES] [-p PROJECT.toml]
//
// Prints the reference design values in use (Fb, Ft, Fv, Fc_perp, Fc, E,
// Emin by grade and nominal width) with the table each row comes from:
// NDS 2018 Supplement Tables 4A and 4B, plus the rows of the project
// file's [lumber] materials_file when -p is given.
//
// # init
//
//	framecheck init [-o FILE] [--force]
//
// Writes a commented starter project file with every key at its default.
//
//	-o FILE   where to write it (default framecheck.toml; "-" for
//	          standard output)
//	--force   overwrite FILE if it exists
//
// # Example
//
//	$ framecheck demo                       # the built-in plan, into ./framecheck-demo
//	$ framecheck layers plan.dxf            # which layers hold what
//	$ framecheck init                       # a starter project file to edit
//	wrote framecheck.toml
//	$ framecheck check plan.dxf -p framecheck.toml
//	$ framecheck member --size 2x10 --span 14ft --dead 10 --live 40
package main

import (
	"fmt"
	"io"
	"log"
	"os"
	"strings"

	"framecheck/check"
)

func main() {
	log.SetFlags(0)
	log.SetPrefix("framecheck: ")
	tuneGC()
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// Exit codes.
const (
	exitOK    = 0 // every member passes, or the command did its job
	exitFail  = 1 // a member fails or is in error, or the run is doubtful
	exitUsage = 2 // unusable input or usage
	// exitMachine: the machine failed the run (disk full, permission
	// refused, the output folder locked by another run); the previous
	// outputs are kept.
	exitMachine = 3
)

// command is one subcommand of framecheck.
type command struct {
	name    string
	summary string
	run     func(args []string, stdout, stderr io.Writer) int
}

// commands lists the subcommands that are available, in the order the
// usage message shows them.
var commands = []command{
	{"layers", "list a plan's layers, entity counts and roles", runLayers},
	{"member", "check one joist given by flags and print the calculation", runMember},
	{"materials", "print the design values in use and their sources", runMaterials},
	{"init", "write a commented starter project file", runInit},
}

// run is the whole program: it dispatches args to a subcommand and
// returns the exit code.
func run(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		usage(stderr)
		return exitUsage
	}
	name := args[0]
	switch name {
	case "-h", "-help", "--help", "help":
		if len(args) > 1 && name == "help" {
			if c := lookup(args[1]); c != nil {
				return c.run([]string{"--help"}, stdout, stderr)
			}
			return unknownCommand(args[1], stderr)
		}
		usage(stdout)
		return exitOK
	case "--version", "-version", "version":
		fmt.Fprintln(stdout, "framecheck", toolVersion())
		return exitOK
	}
	if c := lookup(name); c != nil {
		return c.run(args[1:], stdout, stderr)
	}
	return unknownCommand(name, stderr)
}

func lookup(name string) *command {
	for i := range commands {
		if commands[i].name == name {
			return &commands[i]
		}
	}
	return nil
}

func unknownCommand(name string, stderr io.Writer) int {
	msg := fmt.Sprintf("framecheck: unknown command %q", name)
	best, bestD := "", 3
	for _, c := range commands {
		if d := check.EditDistance(strings.ToLower(name), c.name); d < bestD {
			best, bestD = c.name, d
		}
	}
	if best != "" {
		msg += fmt.Sprintf("; did you mean %q?", best)
	}
	fmt.Fprintln(stderr, termText(msg))
	fmt.Fprintln(stderr, "run 'framecheck help' for the list of commands")
	return exitUsage
}

// usage prints the list of commands.
func usage(w io.Writer) {
	fmt.Fprintln(w, "framecheck checks the wood joists of a DXF framing plan (NDS 2018 ASD,")
	fmt.Fprintln(w, "ASCE 7-16 combinations, IBC 2018 deflection limits).")
	fmt.Fprintln(w)
	fmt.Fprintln(w, "usage: framecheck <command> [arguments]")
	fmt.Fprintln(w)
	fmt.Fprintln(w, "commands:")
	for _, c := range commands {
		fmt.Fprintf(w, "  %-10s %s\n", c.name, c.summary)
	}
	fmt.Fprintln(w)
	fmt.Fprintln(w, "Run 'framecheck <command> --help' for a command's flags.")
	fmt.Fprintln(w, "Exit status: 0 all pass, 1 a member fails or is in error or the run is doubtful, 2 bad input or usage,")
	fmt.Fprintln(w, "3 the machine failed (disk full, permission, output folder locked).")
}
