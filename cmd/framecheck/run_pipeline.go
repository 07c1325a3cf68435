package main

import (
	"bytes"
	"slices"
	"sync"

	"framecheck/dxfimport"
	"framecheck/export"
	"framecheck/framing"
	"framecheck/pipeline"
	"framecheck/project"
)

// outcome is one check run's findings (pipeline.Outcome) with the
// drawing they came from.
type outcome struct {
	*pipeline.Outcome
	drawing *dxfimport.Drawing
	// layers are the drawing's layers with their entity counts, taken
	// before its entities are dropped, when a message may need them (no
	// joists found, joist ends reaching no support); nil otherwise
	layers []layerRow
	// path is the load path still to follow (pipelineInput.pathLater);
	// nil when followed before runPipeline returned
	path *pendingPath
	// finite is what exportResults found of its members' and uplift
	// report's numbers, for export.SanitizeNoted
	finite export.FiniteNote
	// unitsFlag is --units as given ("" when not), which overrides the
	// project file and the drawing's $INSUNITS
	unitsFlag string
}

// pendingPath is a load path to follow (pipeline.Start), once: in the
// background from startPath, or by the first to wait for it.
type pendingPath struct {
	once sync.Once
	run  func()
}

func (p *pendingPath) follow() {
	p.once.Do(func() {
		p.run()
		p.run = nil // and with it what the path read: the members' check inputs may go
	})
}

// startPath follows the load path in the background, when one is left to
// follow. Until waitPath returns, o.Path and o.Issues must not be read and
// nothing in o or its plan changed.
func (o *outcome) startPath() {
	if o.path != nil {
		go o.path.follow()
	}
}

// waitPath returns once the load path is followed (at once when it was,
// or there is none to follow): o.Path and o.Issues then hold it.
func (o *outcome) waitPath() {
	if o.path != nil {
		o.path.follow()
	}
}

// pipelineInput is what runs the pipeline: the plan file, its project,
// the units override and whether to pick sizes.
type pipelineInput struct {
	planPath string
	planData []byte // the drawing's bytes; nil: read planPath
	project  *project.Project
	units    string // --units, overrides the project file and $INSUNITS
	size     bool   // --size
	// marks are the names of an earlier run's marks by their defining
	// keys (OUTDIR's marks.json); nil: named afresh
	marks map[string]string
	// pathLater leaves the load path to be followed when the caller asks
	// (outcome.startPath, waitPath), so that the members can be mapped
	// for the outputs meanwhile; otherwise it is followed before
	// runPipeline returns
	pathLater bool
	// parsed, when set, is called once the drawing is read, before it is
	// grouped into members: planData is not read after it
	parsed func()
}

// runPipeline reads the plan, groups it into members and hands them to
// the pipeline (pipeline.Run), which checks every member, decides
// blocking rows per run, names marks, counts the takeoff and follows the
// load path. A returned error means the input is unusable (exit 2).
func runPipeline(in pipelineInput) (*outcome, error) {
	p := in.project
	if _, err := pipeline.Settings(p); err != nil {
		return nil, err // before the drawing is read, as a bad project file should be
	}
	units := p.Drawing.Units
	if in.units != "" {
		units = in.units
	}
	resume := pauseGC()
	opt := dxfimport.Options{Units: units, Keep: keepLayer(p)}
	var d *dxfimport.Drawing
	var err error
	if in.planData != nil {
		d, err = dxfimport.Read(bytes.NewReader(in.planData), in.planPath, opt)
	} else {
		d, err = dxfimport.ReadFile(in.planPath, opt)
	}
	in.planData = nil
	if in.parsed != nil {
		in.parsed()
	}
	if err != nil {
		resume()
		return nil, err
	}
	plan := framing.Group(d, pipeline.FramingOptions(p))
	// With a load path, the collector's pause ends once the entities are
	// dropped (below): the collection it brings frees them, and the
	// collector is paused again for the load path (pathGC).
	hasPath := pipeline.HasLoadPath(plan)
	if !hasPath {
		resume()
	}
	var issues dxfimport.IssueList
	// a doubt about the units comes first: it explains the findings after it
	if msg := unitsDoubt(plan, d, in.units, p.Drawing.Units); msg != "" {
		issues.Add(dxfimport.Pos{File: in.planPath}, CodeUnitsDoubt, dxfimport.SevWarning, "%s", msg)
	}
	issues = append(issues, d.Issues...)
	issues = append(issues, plan.Issues...)
	// The entities are grouped: only a message about the layers reads
	// them again, so their counts are kept for it and the entities go
	// before the checks (at 1,000,000 joists they held 226 MB through
	// the run's busiest part).
	var layers []layerRow
	if len(plan.Members) == 0 || slices.ContainsFunc(plan.Issues, func(is dxfimport.Issue) bool { return is.Code == framing.CodeNoSupport }) {
		layers = layerRows(d, p)
	}
	d.Entities = nil
	if hasPath {
		resume()
	}
	spanWarnings(plan, &issues)
	pin := pipeline.Input{Plan: plan, PlanFile: d.File, Project: p, Issues: issues, Size: in.size, Marks: in.marks}
	if in.pathLater {
		po, path, err := pipeline.Start(pin)
		if err != nil {
			return nil, err
		}
		return &outcome{Outcome: po, drawing: d, layers: layers, path: &pendingPath{run: path}, unitsFlag: in.units}, nil
	}
	po, err := pipeline.Run(pin)
	if err != nil {
		return nil, err
	}
	return &outcome{Outcome: po, drawing: d, layers: layers, unitsFlag: in.units}, nil
}

// releaseForWriters drops what the writers do not read once the results
// are mapped for export (exportResults) and the findings are in o.Issues:
// the members as grouped and their check results and sizing (the
// drawing's entities went once grouped; the annotated copy reads the
// drawing's bytes, the report the plan's supports and zones). The live heap then follows the outputs
// rather than holding the plan twice (issue 18). The load path as solved
// goes too, once mapped (exportResults): the writers read its export.
func (o *outcome) releaseForWriters() {
	if o.Plan != nil {
		o.Plan.Members = nil
		o.Plan.Beams, o.Plan.Posts, o.Plan.PointLoads = nil, nil, nil
	}
	o.Results, o.Sizing, o.Path = nil, nil, nil
}
