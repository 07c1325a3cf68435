package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"time"
)

// The outputs of a run are one set: results.json, schedule.xlsx,
// report.html, the annotated drawing (and the overlay), listed with their
// SHA-256 in the manifest framecheck-run.json. A run writes them complete
// into a staging folder inside OUTDIR, then swaps the set in: the
// previous set's files (manifest first) are moved aside into a folder of
// their own, the new files renamed in, the manifest last; on any failure
// the new files go back out and the previous ones back in. A reader that
// finds a manifest whose hashes match the files has one whole set, never
// a mix. A lock in OUTDIR keeps a second run from swapping at the same
// time; the staging folders that runs killed outright left behind are
// removed by the next run that takes the lock.

// Names of the run's files inside OUTDIR.
const (
	manifestName = "framecheck-run.json"
	lockName     = ".framecheck.lock"
	stagePrefix  = ".framecheck-partial-"
	asidePrefix  = ".framecheck-previous-"
)

// errLockHeld is the error of a run that finds OUTDIR locked.
var errLockHeld = errors.New("another framecheck run is writing into this folder")

// lockWait is how long a run waits for another run's lock on its output
// folder before it stops (a variable for the tests).
var lockWait = 5 * time.Second

// fsRename is the file-system seam of the swap: every rename that moves a
// file of the set in or out goes through it, so a test can make any one
// fail.
var fsRename = os.Rename

// A machineError is a failure of the machine, not of the input: a full
// disk, a permission refused, a lock held, a dangling link. Exit 3.
type machineError struct{ err error }

func (e *machineError) Error() string { return e.err.Error() }
func (e *machineError) Unwrap() error { return e.err }

func machine(err error) error {
	if err == nil {
		return nil
	}
	var m *machineError
	if errors.As(err, &m) {
		return err
	}
	return &machineError{err}
}

// outputSet is one run's hold on its output folder.
type outputSet struct {
	dir     string   // OUTDIR
	stage   string   // the staging folder inside it
	created bool     // the run created OUTDIR
	lock    *os.File // the held lock
	mu      sync.Mutex
	done    bool // swapped in or given up: nothing left to undo
}

// openOutputSet creates OUTDIR if needed, takes its lock (waiting up to
// lockWait), removes staging folders that earlier runs left behind, and
// makes a staging folder. held, when given, receives the set once the
// lock is taken and before the staging folder exists, so that a signal
// from then on finds the set to undo (interrupt) instead of leaving the
// lock and the staging folder behind.
func openOutputSet(dir string, held ...func(*outputSet)) (*outputSet, error) {
	if fi, err := os.Lstat(dir); err == nil && fi.Mode()&fs.ModeSymlink != 0 {
		if _, err := os.Stat(dir); err != nil {
			target, _ := os.Readlink(dir)
			return nil, machine(fmt.Errorf("output folder %s is a symbolic link to %s, which does not exist (a dangling link): remove it or choose another -o", dir, target))
		}
	}
	_, statErr := os.Stat(dir)
	s := &outputSet{dir: dir, created: errors.Is(statErr, fs.ErrNotExist)}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, machine(err)
	}
	lockPath := filepath.Join(dir, lockName)
	deadline := time.Now().Add(lockWait)
	for {
		f, err := tryLock(lockPath)
		if err == nil {
			s.lock = f
			break
		}
		if !errors.Is(err, errLockHeld) || !time.Now().Before(deadline) {
			if s.created {
				os.Remove(dir) // only if still empty
			}
			if errors.Is(err, errLockHeld) {
				err = fmt.Errorf("%s: %w (its lock %s is held); the run stopped and changed nothing: wait for the other run to end, or choose another -o", dir, err, lockPath)
			}
			return nil, machine(err)
		}
		time.Sleep(50 * time.Millisecond)
	}
	s.removeStale()
	for _, h := range held {
		h(s)
	}
	s.mu.Lock()
	if s.done { // interrupted (interrupt keeps mu: not reached then)
		s.mu.Unlock()
		return nil, machine(errors.New("interrupted"))
	}
	stage, err := os.MkdirTemp(dir, stagePrefix)
	if err == nil {
		s.stage = stage
	}
	s.mu.Unlock()
	if err != nil {
		s.abort()
		return nil, machine(err)
	}
	return s, nil
}

// removeStale removes the staging folders of earlier runs: with the lock
// held, no other run is using one. Folders of previous outputs that a
// failed swap could not put back are left alone (the run that failed
// said where they are).
func (s *outputSet) removeStale() {
	ents, err := os.ReadDir(s.dir)
	if err != nil {
		return
	}
	for _, e := range ents {
		if e.IsDir() && strings.HasPrefix(e.Name(), stagePrefix) {
			os.RemoveAll(filepath.Join(s.dir, e.Name()))
		}
	}
}

// path is where the output name is staged.
func (s *outputSet) path(name string) string { return filepath.Join(s.stage, name) }

// release removes the staging folder and lets the lock go; with
// removeDir, OUTDIR too when the run created it.
func (s *outputSet) release(removeDir bool) {
	if s.stage != "" {
		// A writer still running (an interrupt) may add a file while the
		// folder is emptied: try again.
		for range 3 {
			if os.RemoveAll(s.stage) == nil {
				break
			}
		}
	}
	if s.lock != nil {
		unlock(s.lock, filepath.Join(s.dir, lockName))
		s.lock = nil
	}
	if removeDir && s.created {
		os.Remove(s.dir) // only if empty: nothing of anyone else's is lost
	}
}

// abort gives the run up: staging folder removed, lock released, and an
// OUTDIR the run created removed.
func (s *outputSet) abort() {
	s.mu.Lock()
	defer s.mu.Unlock()
	s.done = true
	s.release(true)
}

// close ends a run whose set was swapped in.
func (s *outputSet) close() {
	s.mu.Lock()
	defer s.mu.Unlock()
	s.done = true
	s.release(false)
}

// interrupt is abort for a signal: it waits for a swap in progress to end
// (it is short) and reports whether the new set had been swapped in.
// The lock stays taken: the process is about to end.
func (s *outputSet) interrupt() (swapped bool) {
	s.mu.Lock() // never unlocked: nothing may change the folder after this
	if s.done {
		return true
	}
	s.done = true
	s.release(true)
	return false
}

// commit swaps the staged files (names, in order) and the manifest into
// OUTDIR; known are every output name a run may write, so that a
// previous set's files this run does not write go too. It returns the
// paths written. On failure the folder holds the previous set again, or
// the error says what state it is in.
func (s *outputSet) commit(names, known []string, manifest []byte) ([]string, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.done {
		return nil, machine(errors.New("interrupted"))
	}
	incoming := append(append([]string(nil), names...), manifestName)
	for _, n := range incoming {
		if st, err := os.Lstat(filepath.Join(s.dir, n)); err == nil && st.IsDir() {
			return nil, machine(fmt.Errorf("writing %s: a folder of that name is in the way", filepath.Join(s.dir, n)))
		}
	}
	if err := writeSynced(s.path(manifestName), manifest); err != nil {
		return nil, machine(fmt.Errorf("writing %s: %w", filepath.Join(s.dir, manifestName), err))
	}
	aside, err := os.MkdirTemp(s.dir, asidePrefix)
	if err != nil {
		return nil, machine(err)
	}
	// The previous manifest goes first, so that no reader takes what
	// follows for a complete set; then every previous output.
	var moved, placed []string
	fail := func(what string, err error) ([]string, error) {
		err = fmt.Errorf("%s: %w", what, err)
		if rerr := s.rollback(moved, placed, aside); rerr != nil {
			return nil, machine(fmt.Errorf("%v; %v", err, rerr))
		}
		return nil, machine(fmt.Errorf("%v; the previous outputs in %s are as they were", err, s.dir))
	}
	for _, n := range append([]string{manifestName}, known...) {
		p := filepath.Join(s.dir, n)
		st, err := os.Lstat(p)
		if errors.Is(err, fs.ErrNotExist) || err == nil && st.IsDir() {
			continue // nothing there, or a folder this run does not write
		}
		if err != nil {
			return fail("moving aside the previous "+p, err)
		}
		if err := fsRename(p, filepath.Join(aside, n)); err != nil {
			return fail("moving aside the previous "+p, err)
		}
		moved = append(moved, n)
	}
	for _, n := range incoming {
		dst := filepath.Join(s.dir, n)
		if err := fsRename(s.path(n), dst); err != nil {
			return fail("writing "+dst, err)
		}
		placed = append(placed, n)
	}
	s.done = true
	syncDir(s.dir)
	os.RemoveAll(aside)
	written := make([]string, len(incoming))
	for i, n := range incoming {
		written[i] = filepath.Join(s.dir, n)
	}
	return written, nil
}

// rollback takes the new files placed back out of OUTDIR (into the
// staging folder, to be removed) and puts the previous ones back, their
// manifest last and only when every other file is back. When that fails,
// the error says what the folder holds and where the previous files are;
// the folder then has no manifest, so no reader takes it for a set.
func (s *outputSet) rollback(moved, placed []string, aside string) error {
	var stuckNew, stuckOld []string
	for i := len(placed) - 1; i >= 0; i-- {
		n := placed[i]
		if err := fsRename(filepath.Join(s.dir, n), s.path(n)); err != nil {
			if os.Remove(filepath.Join(s.dir, n)) != nil {
				stuckNew = append(stuckNew, n)
			}
		}
	}
	manifest := false
	for _, n := range moved {
		if n == manifestName {
			manifest = true
			continue
		}
		if err := fsRename(filepath.Join(aside, n), filepath.Join(s.dir, n)); err != nil {
			stuckOld = append(stuckOld, n)
		}
	}
	if len(stuckNew) == 0 && len(stuckOld) == 0 {
		if manifest {
			if err := fsRename(filepath.Join(aside, manifestName), filepath.Join(s.dir, manifestName)); err != nil {
				return fmt.Errorf("the previous outputs in %s are back, but not their %s, which is in %s", s.dir, manifestName, aside)
			}
		}
		os.Remove(aside)
		return nil
	}
	if manifest {
		stuckOld = append(stuckOld, manifestName)
	}
	s.done = true // leave the folders as they are for the designer
	msg := fmt.Sprintf("the output folder %s could not be put back as it was: it now holds a mix", s.dir)
	if len(stuckNew) > 0 {
		msg += fmt.Sprintf("; new files of this run still in it: %s", strings.Join(stuckNew, ", "))
	}
	if len(stuckOld) > 0 {
		msg += fmt.Sprintf("; the previous %s are in %s", strings.Join(stuckOld, ", "), aside)
	} else {
		os.Remove(aside)
	}
	return errors.New(msg + fmt.Sprintf("; there is no %s in it, so no reader takes it for a complete set", manifestName))
}

// writeSynced writes data to path and syncs it.
func writeSynced(path string, data []byte) error {
	f, err := os.OpenFile(path, os.O_CREATE|os.O_WRONLY|os.O_TRUNC, 0o644)
	if err != nil {
		return err
	}
	if _, err := f.Write(data); err != nil {
		f.Close()
		return err
	}
	if err := f.Sync(); err != nil {
		f.Close()
		return err
	}
	return f.Close()
}

// syncDir makes the renames in dir durable where the platform allows.
func syncDir(dir string) {
	if d, err := os.Open(dir); err == nil {
		_ = d.Sync()
		d.Close()
	}
}
