package main

import (
	"crypto/sha256"
	"encoding/hex"
	"encoding/json"
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"syscall"
	"time"

	"framecheck/export"
)

// runTime is the time a run states in its report and manifest: now, or
// SOURCE_DATE_EPOCH (seconds since 1970, UTC) when it is set, so that two
// runs on the same input can give byte-identical files
// (https://reproducible-builds.org/specs/source-date-epoch/).
func runTime() (time.Time, error) {
	if s, ok := os.LookupEnv("SOURCE_DATE_EPOCH"); ok && s != "" {
		n, err := strconv.ParseInt(s, 10, 64)
		if err != nil || n < 0 {
			return time.Time{}, fmt.Errorf("SOURCE_DATE_EPOCH=%q: expected a whole number of seconds since 1970-01-01 UTC", s)
		}
		return time.Unix(n, 0).UTC(), nil
	}
	return time.Now(), nil
}

// sha256Hex is the SHA-256 of data in hexadecimal.
func sha256Hex(data []byte) string {
	h := sha256.Sum256(data)
	return hex.EncodeToString(h[:])
}

// fileSHA256 hashes a file and returns its hash and size.
func fileSHA256(path string) (string, int64, error) {
	f, err := os.Open(path)
	if err != nil {
		return "", 0, err
	}
	defer f.Close()
	h := sha256.New()
	n, err := io.Copy(h, f)
	if err != nil {
		return "", 0, err
	}
	return hex.EncodeToString(h.Sum(nil)), n, nil
}

// rehashFile hashes an output that export did not hash while writing it
// (a variable for the test that counts them).
var rehashFile = fileSHA256

// ManifestSchema is the "schema" of framecheck-run.json.
const ManifestSchema = "framecheck-run/1"

// runManifest is framecheck-run.json: which run wrote the set of files
// beside it and their hashes. It is written last, so a folder whose
// manifest lists files with matching hashes holds one complete set.
type runManifest struct {
	Schema  string         `json:"schema"`
	Tool    string         `json:"tool"`
	Version string         `json:"version"`
	Time    string         `json:"time"` // RFC 3339, UTC
	Input   manifestInput  `json:"input"`
	Project *manifestInput `json:"project"` // null without -p
	Files   []manifestFile `json:"files"`
}

// manifestInput names an input as the user gave it, with its hash.
type manifestInput struct {
	Path   string `json:"path"`
	SHA256 string `json:"sha256"`
	Bytes  int64  `json:"bytes"`
}

// manifestFile is one output of the set.
type manifestFile struct {
	Name   string `json:"name"`
	SHA256 string `json:"sha256"`
	Bytes  int64  `json:"bytes"`
}

// buildManifest hashes the staged outputs (at once: a large set has
// files of hundreds of MB) and returns the manifest's bytes.
func buildManifest(set *outputSet, names []string, in, proj *manifestInput, when time.Time) ([]byte, error) {
	m := runManifest{Schema: ManifestSchema, Tool: "framecheck", Version: toolVersion(),
		Time: when.UTC().Format(time.RFC3339), Input: *in, Project: proj, Files: make([]manifestFile, len(names))}
	errs := make([]error, len(names))
	var wg sync.WaitGroup
	for i, n := range names {
		wg.Add(1)
		go func() {
			defer wg.Done()
			// Hashed while export wrote it; a file written otherwise
			// (marks.json) is read again.
			sum, size, ok := export.WrittenSHA256(set.path(n))
			var err error
			if !ok {
				sum, size, err = rehashFile(set.path(n))
			}
			m.Files[i], errs[i] = manifestFile{Name: n, SHA256: sum, Bytes: size}, err
		}()
	}
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return nil, err
		}
	}
	b, err := json.MarshalIndent(m, "", "  ")
	return append(b, '\n'), err
}

// Exit codes of a run stopped by a signal: 128 + the signal number, as
// shells report them.
const (
	exitSIGINT  = 130
	exitSIGTERM = 143
)

// handleSignals makes SIGINT and SIGTERM stop the run cleanly: the
// staging folder (and an OUTDIR the run created) removed, one line saying
// that the previous outputs are untouched, exit 130 or 143. A swap in
// progress is let finish or roll back first. stop undoes the handling.
func (c *checkRun) handleSignals(stderr io.Writer) (stop func()) {
	ch := make(chan os.Signal, 1)
	signal.Notify(ch, os.Interrupt, syscall.SIGTERM)
	quit := make(chan struct{})
	go func() {
		var sig os.Signal
		select {
		case sig = <-ch:
		case <-quit:
			return
		}
		code, name := exitSIGINT, "SIGINT"
		if sig == syscall.SIGTERM {
			code, name = exitSIGTERM, "SIGTERM"
		}
		if set := c.set.Load(); set != nil && set.interrupt() {
			fmt.Fprintf(stderr, "framecheck: interrupted (%s) after the new outputs were in place in %s\n", name, termText(c.outDir))
		} else {
			fmt.Fprintf(stderr, "framecheck: interrupted (%s): nothing was written; the previous outputs in %s are untouched\n", name, termText(c.outDir))
		}
		os.Exit(code)
	}()
	return func() {
		signal.Stop(ch)
		close(quit)
	}
}

// outputName is how the outputs (results.json, the report, the
// spreadsheet, the manifest) and the findings name an input file: the
// path as the user gave it when it is relative, else relative to the
// working folder when the file is inside it, else its base name. Never
// an absolute path: two runs on the same input from the same folder
// write the same bytes, and the files say nothing of the machine's
// folders.
func outputName(p string) string {
	if !filepath.IsAbs(p) {
		return filepath.ToSlash(filepath.Clean(p))
	}
	if wd, err := os.Getwd(); err == nil {
		if r, err := filepath.Rel(wd, p); err == nil && r != ".." && !strings.HasPrefix(r, ".."+string(filepath.Separator)) {
			return filepath.ToSlash(r)
		}
	}
	return filepath.Base(p)
}
