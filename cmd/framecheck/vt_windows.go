//go:build windows

package main

import (
	"os"
	"syscall"
)

var procSetConsoleMode = syscall.NewLazyDLL("kernel32.dll").NewProc("SetConsoleMode")

// enableVT turns on the console's processing of ANSI escape sequences
// (ENABLE_VIRTUAL_TERMINAL_PROCESSING, 0x0004, Windows 10 and later) for
// f and reports whether the console now shows colours rather than the
// codes as text; false on an older console, which then gets no colour.
func enableVT(f *os.File) bool {
	h := syscall.Handle(f.Fd())
	var mode uint32
	if err := syscall.GetConsoleMode(h, &mode); err != nil {
		return false
	}
	const vtProcessing = 0x0004
	if mode&vtProcessing != 0 {
		return true
	}
	ok, _, _ := procSetConsoleMode.Call(uintptr(h), uintptr(mode|vtProcessing))
	return ok != 0
}
