package main

import (
	"fmt"
	"io"
	"strconv"

	"framecheck/check"
	"framecheck/project"
)

func runMaterials(args []string, stdout, stderr io.Writer) int {
	f := newFlags("materials", "framecheck materials [SPECIES] [-p PROJECT.toml]", `
Prints the reference design values in use (Fb, Ft, Fv, Fc_perp, Fc, E, Emin
by grade and nominal width) with the table each row comes from: the NDS 2018
Supplement Tables 4A and 4B, and the project file's materials_file if given.
SPECIES may be any common spelling ("DF-L", "Douglas Fir-Larch", "SPF").`)
	projectPath := f.String("p", "", "project file whose [lumber] materials_file adds design values")
	pos, code := f.parse(args, stdout, stderr)
	if code >= 0 {
		return code
	}
	if len(pos) > 1 {
		return f.usageError(stderr, "want at most one species, got %d arguments", len(pos))
	}
	mats := check.BuiltinMaterials()
	if *projectPath != "" {
		p, err := project.LoadProject(*projectPath)
		if err != nil {
			fmt.Fprintf(stderr, "framecheck: %s\n", termText(err.Error()))
			return exitUsage
		}
		if p.Materials != nil {
			mats = p.Materials
		}
	}
	species := ""
	if len(pos) == 1 {
		species = pos[0]
	}
	rows, err := mats.Rows(species)
	if err != nil {
		fmt.Fprintf(stderr, "framecheck: materials: %s\n", termText(err.Error()))
		return exitUsage
	}
	table := [][]string{{"species", "grade", "widths", "Fb", "Ft", "Fv", "Fc_perp", "Fc", "E", "Emin", "CF rule", "source"}}
	num := func(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }
	for _, r := range rows {
		widths, rule := "all", r.SizeFactor
		switch {
		case r.SizeFactor == check.SizeFactorSCL && r.MaxDepthIn > 0:
			widths = fmt.Sprintf("d %s-%s in", num(r.MinDepthIn), num(r.MaxDepthIn))
		case r.SizeFactor == check.SizeFactorSCL:
			widths = fmt.Sprintf("d %s in and up", num(r.MinDepthIn))
		case r.MaxWidthIn > 0:
			widths = fmt.Sprintf("%d-%d in", r.MinWidthIn, r.MaxWidthIn)
		case r.MinWidthIn > 2:
			widths = fmt.Sprintf("%d in and up", r.MinWidthIn)
		}
		table = append(table, []string{r.Species, r.Grade, widths, num(r.FbPsi), num(r.FtPsi), num(r.FvPsi),
			num(r.FcPerpPsi), num(r.FcPsi), num(r.EPsi), num(r.EminPsi), rule, r.Source})
		if r.SizeFactor == check.SizeFactorSCL {
			table[len(table)-1][10] = "SCL (12/d)^" + num(r.SCLExponent)
		}
	}
	fmt.Fprintln(stdout, "Reference design values, psi (before adjustment factors):")
	writeTable(stdout, table, []bool{false, false, false, true, true, true, true, true, true, true})
	fmt.Fprintln(stdout, "\nCF rule 4A: size factors of NDS 2018 Supplement Table 4A applied; 4B: already in the")
	fmt.Fprintln(stdout, "Table 4B values up to 12 in wide; none: CF = 1.0. Check these values against the edition")
	fmt.Fprintln(stdout, "your jurisdiction has adopted.")
	for _, r := range rows {
		if r.SizeFactor == check.SizeFactorSCL {
			fmt.Fprintln(stdout, "SCL: structural composite lumber, the user's values from its manufacturer: actual depths d")
			fmt.Fprintln(stdout, "(in), Fb at 12 in depth times CV = (12/d)^n (NDS 2018 8.3.6); no CF, Ci or Cr.")
			break
		}
	}
	return exitOK
}
