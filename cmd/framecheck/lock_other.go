//go:build !unix

package main

import (
	"errors"
	"io/fs"
	"os"
)

// tryLock takes the run lock of an output folder by creating path
// exclusively. Unlike the flock of unix systems, a run killed outright
// leaves the file behind; the message of errLockHeld says to remove it
// then.
func tryLock(path string) (*os.File, error) {
	f, err := os.OpenFile(path, os.O_CREATE|os.O_EXCL|os.O_RDWR, 0o644)
	if errors.Is(err, fs.ErrExist) {
		return nil, errLockHeld
	}
	return f, err
}

// unlock closes and removes the lock file.
func unlock(f *os.File, path string) {
	f.Close()
	os.Remove(path)
}
