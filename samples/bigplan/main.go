// Bigplan writes a synthetic framing plan of any number of joists, for
// measuring framecheck on large drawings.
//
// Usage:
//
//	go run ./samples/bigplan -joists 100000 -o big.dxf [-r12] [-outlines] [-beams] [-project big.toml]
//
// The flags:
//
//	-joists N        number of joists (default 100000)
//	-o FILE          DXF file to write (default big.dxf)
//	-r12             write AC1009 (R12, POLYLINE zone outlines) instead of AC1015 (R2000)
//	-outlines        draw each joist as a rectangle of four lines 1.5 in wide, not its centre line
//	-beams           draw posts under every beam line, so each beam is checked as a member
//	                 (the project file then gives the beams' and posts' sizes)
//	-project FILE    also write the project file that goes with the plan
//
// The plan is a grid of units of four joist runs each, one load zone per
// unit: simple spans between double-line walls, flush-beam bays, a bay
// continuous over an interior wall with blocking drawn, cantilevers, roof
// bays with wind uplift that need blocking rows, undersized storage bays
// that fail, and a few joists drawn short of their beam (error members).
// With -beams, square 6x6 posts on layer POST-1 stand under both ends of
// every beam line and between, at most 16 ft apart, and the project file
// sizes the beams ((3) 2x12) and the posts (6x6, 8 ft): the same joists on
// beams that are members, where without -beams the beams stay rigid
// bearings. The layout is described in package samples/bigplan/synth. The
// output is deterministic. Then:
//
//	framecheck check big.dxf -p big.toml -o big-out
package main

import (
	"bufio"
	"flag"
	"fmt"
	"io"
	"os"

	"framecheck/samples/bigplan/synth"
)

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// run is main without the process: exit code 0 on success, 2 on a usage
// or write error.
func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("bigplan", flag.ContinueOnError)
	fs.SetOutput(stderr)
	n := fs.Int("joists", 100000, "number of joists")
	out := fs.String("o", "big.dxf", "DXF file to write")
	r12 := fs.Bool("r12", false, "write R12 (AC1009) instead of R2000 (AC1015)")
	project := fs.String("project", "", "also write the project file (TOML) here")
	outlines := fs.Bool("outlines", false, "draw each joist as a rectangle of four lines 1.5 in wide")
	beams := fs.Bool("beams", false, "draw posts under every beam, so the beams are checked as members")
	if err := fs.Parse(args); err != nil {
		return 2
	}
	if fs.NArg() != 0 {
		fmt.Fprintf(stderr, "bigplan: unexpected argument %q\n", fs.Arg(0))
		return 2
	}
	if *n < 1 || *n > 10_000_000 {
		fmt.Fprintf(stderr, "bigplan: -joists %d: want 1 to 10000000\n", *n)
		return 2
	}
	o := synth.Options{Joists: *n, R12: *r12, Outlines: *outlines, Beams: *beams}
	st, err := writeFile(*out, o)
	if err != nil {
		fmt.Fprintf(stderr, "bigplan: %v\n", err)
		return 2
	}
	fmt.Fprintf(stdout, "wrote %s: %d joists in %d runs, %d units (%d short of a beam, %d failing by design in storage bays)\n",
		*out, st.Joists, st.Runs, st.Units, st.ShortJoists, st.StorageInterior)
	if *beams {
		fmt.Fprintf(stdout, "%d beams on %d posts\n", st.Beams, st.Posts)
	}
	if *project != "" {
		if err := os.WriteFile(*project, []byte(synth.ProjectFor(o)), 0o644); err != nil {
			fmt.Fprintf(stderr, "bigplan: %v\n", err)
			return 2
		}
		fmt.Fprintf(stdout, "wrote %s\n", *project)
	}
	return 0
}

func writeFile(path string, o synth.Options) (synth.Stats, error) {
	f, err := os.Create(path)
	if err != nil {
		return synth.Stats{}, err
	}
	bw := bufio.NewWriterSize(f, 1<<20)
	st, err := synth.Write(bw, o)
	if err == nil {
		err = bw.Flush()
	}
	if cerr := f.Close(); err == nil {
		err = cerr
	}
	return st, err
}
