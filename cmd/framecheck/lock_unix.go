//go:build unix

package main

import (
	"errors"
	"os"
	"syscall"
)

// tryLock takes the run lock of an output folder: an advisory flock on
// path, which the system releases when the process ends however it ends,
// so a killed run leaves no stale lock. It returns errLockHeld when
// another process holds it. The file is unlinked on unlock, so a waiter
// may have locked a file no longer at path: it checks that the file it
// locked is the one at path, and tries again otherwise.
func tryLock(path string) (*os.File, error) {
	for range 10 {
		f, err := os.OpenFile(path, os.O_CREATE|os.O_RDWR, 0o644)
		if err != nil {
			return nil, err
		}
		if err := syscall.Flock(int(f.Fd()), syscall.LOCK_EX|syscall.LOCK_NB); err != nil {
			f.Close()
			if errors.Is(err, syscall.EWOULDBLOCK) {
				return nil, errLockHeld
			}
			return nil, err
		}
		held, err1 := f.Stat()
		now, err2 := os.Stat(path)
		if err1 == nil && err2 == nil && os.SameFile(held, now) {
			return f, nil
		}
		f.Close() // unlinked by the run that held it: lock the new one
	}
	return nil, errLockHeld
}

// unlock removes the lock file and releases the lock, in that order.
func unlock(f *os.File, path string) {
	os.Remove(path)
	f.Close()
}
