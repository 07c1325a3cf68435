package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"io/fs"
	"os"
	"regexp"
	"strconv"
	"strings"
	"unicode/utf8"

	"framecheck/project"
)

// cmdFlags is a subcommand's flag set with its usage text.
type cmdFlags struct {
	*flag.FlagSet
	synopsis string // "framecheck init [-o FILE] [--force]"
	about    string // what the command does, a few lines
}

// newFlags returns a flag set for a subcommand. Its usage and errors are
// printed by parse, not by the flag package.
func newFlags(name, synopsis, about string) *cmdFlags {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	fs.Usage = func() {}
	return &cmdFlags{FlagSet: fs, synopsis: synopsis, about: about}
}

// printUsage writes the command's synopsis, description and flags.
func (f *cmdFlags) printUsage(w io.Writer) {
	fmt.Fprintf(w, "usage: %s\n\n%s\n", f.synopsis, strings.TrimSpace(f.about))
	has := false
	f.VisitAll(func(*flag.Flag) { has = true })
	if has {
		fmt.Fprint(w, "\nflags:\n")
		f.SetOutput(w)
		f.PrintDefaults()
		f.SetOutput(io.Discard)
	}
}

// parse reads flags and positional arguments, which may be mixed ("check
// plan.dxf -p x.toml"); "--" ends the flags. It returns the positional
// arguments and -1, or an exit code when the command should stop: 0 after
// --help (usage on stdout), 2 after a usage error (message on stderr).
func (f *cmdFlags) parse(args []string, stdout, stderr io.Writer) ([]string, int) {
	var pos []string
	for {
		if err := f.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				f.printUsage(stdout)
				return nil, exitOK
			}
			return nil, f.usageError(stderr, "%s", flagErrorText(err))
		}
		rest := f.Args()
		if len(rest) == 0 {
			return pos, -1
		}
		if len(args) > len(rest) && args[len(args)-len(rest)-1] == "--" {
			return append(pos, rest...), -1
		}
		pos = append(pos, rest[0])
		args = rest[1:]
	}
}

// flagValueRE matches the flag package's message for a value its Set
// refused.
var flagValueRE = regexp.MustCompile(`^invalid value ("(?:[^"\\]|\\.)*") for flag -([\w-]+): ((?s).*)$`)

// flagErrorText words a flag error as the command line was typed:
// "--span 14: 14 in or 14 ft? write 14ft or 14in".
func flagErrorText(err error) string {
	m := flagValueRE.FindStringSubmatch(err.Error())
	if m == nil {
		return err.Error()
	}
	v, uerr := strconv.Unquote(m[1])
	if uerr != nil {
		return err.Error()
	}
	return "--" + m[2] + " " + v + ": " + m[3]
}

// usageError prints a usage mistake and the synopsis; it returns 2.
func (f *cmdFlags) usageError(stderr io.Writer, format string, args ...any) int {
	fmt.Fprintf(stderr, "framecheck: %s: %s\n", f.Name(), termText(fmt.Sprintf(format, args...)))
	fmt.Fprintf(stderr, "usage: %s\n", f.synopsis)
	fmt.Fprintf(stderr, "run 'framecheck %s --help' for details\n", f.Name())
	return exitUsage
}

// useColour reports whether output to w may be coloured: only when w is a
// terminal and NO_COLOR is unset or empty (https://no-color.org); on the
// Windows console, once its escape-sequence processing is on (enableVT).
func useColour(w io.Writer) bool {
	if os.Getenv("NO_COLOR") != "" {
		return false
	}
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0 && enableVT(f)
}

// ANSI colours for the terminal summary.
const (
	colourRed    = "\x1b[31m"
	colourGreen  = "\x1b[32m"
	colourYellow = "\x1b[33m"
	colourBold   = "\x1b[1m"
)

// paint wraps s in an ANSI colour when on is true.
func paint(on bool, colour, s string) string {
	if !on {
		return s
	}
	return colour + s + "\x1b[0m"
}

// runInit is `framecheck init`.
func runInit(args []string, stdout, stderr io.Writer) int {
	f := newFlags("init", "framecheck init [-o FILE] [--force]", `
Writes a commented starter project file with every key at its default.
Edit it to suit the plan, then pass it to check with -p.`)
	out := f.String("o", "framecheck.toml", "write the project file to `FILE` (\"-\" for standard output)")
	force := f.Bool("force", false, "overwrite FILE if it exists")
	pos, code := f.parse(args, stdout, stderr)
	if code >= 0 {
		return code
	}
	if len(pos) > 0 {
		return f.usageError(stderr, "unexpected argument %q", pos[0])
	}
	if *out == "-" {
		if _, err := io.WriteString(stdout, project.StarterProject); err != nil {
			fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
			return exitUsage
		}
		return exitOK
	}
	flags := os.O_WRONLY | os.O_CREATE | os.O_TRUNC
	if !*force {
		flags |= os.O_EXCL
	}
	file, err := os.OpenFile(*out, flags, 0o644)
	if errors.Is(err, fs.ErrExist) {
		fmt.Fprintf(stderr, "framecheck: %s already exists; use --force to overwrite it\n", termText(*out))
		return exitUsage
	}
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
		return exitUsage
	}
	_, err = io.WriteString(file, project.StarterProject)
	if cerr := file.Close(); err == nil {
		err = cerr
	}
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: writing %s: %s\n", termText(*out), termText(err.Error()))
		return exitUsage
	}
	fmt.Fprintf(stdout, "wrote %s\n", termText(*out))
	return exitOK
}

// writeTable writes rows as columns separated by two spaces, padded to the
// widest cell; right[i] right-aligns column i. Trailing spaces are
// trimmed.
func writeTable(w io.Writer, rows [][]string, right []bool) {
	var width []int
	for _, r := range rows {
		for i, c := range r {
			if i >= len(width) {
				width = append(width, 0)
			}
			// every column cut to cellWidth but the last, which a reader
			// needs whole (member's formulas with the numbers put in, a
			// layer's role): it ends the line, so it widens nothing
			cw := cellWidth
			if i == len(r)-1 {
				cw = lastCellWidth
			}
			c = termCell(c, cw)
			r[i] = c
			width[i] = max(width[i], utf8.RuneCountInString(c))
		}
	}
	for _, r := range rows {
		var b strings.Builder
		for i, c := range r {
			if i > 0 {
				b.WriteString("  ")
			}
			pad := strings.Repeat(" ", width[i]-utf8.RuneCountInString(c))
			if i < len(right) && right[i] {
				b.WriteString(pad + c)
			} else {
				b.WriteString(c + pad)
			}
		}
		fmt.Fprintln(w, strings.TrimRight(b.String(), " "))
	}
}
