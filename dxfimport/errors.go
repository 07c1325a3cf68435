package dxfimport

import (
	"errors"
	"fmt"
	"strconv"
)

// Sentinel causes wrapped by ParseError.Err; test them with errors.Is.
var (
	// ErrBinary: the input is a binary DXF, which the reader does not support.
	ErrBinary = errors.New("binary DXF is not supported: save the drawing as ASCII DXF")
	// ErrDWG: the input is a DWG file rather than a DXF.
	ErrDWG = errors.New("this is a DWG file, not a DXF: export the drawing as ASCII DXF")
	// ErrEmpty: the input holds nothing but white space.
	ErrEmpty = errors.New("empty file: expected DXF group code / value pairs")
	// ErrTruncated: the input ends in the middle of a pair or a section.
	ErrTruncated = errors.New("truncated file")
	// ErrBadCode: a group-code line is not an integer in the DXF range.
	ErrBadCode = errors.New("bad group code")
	// ErrBadNumber: a value that its group code says is numeric is not a number.
	ErrBadNumber = errors.New("bad number")
	// ErrStructure: pairs are in an order DXF does not allow (e.g. a SECTION
	// without a name, an ENDSEC outside a section).
	ErrStructure = errors.New("bad DXF structure")
	// ErrLineTooLong: a line is longer than MaxLineBytes.
	ErrLineTooLong = errors.New("line too long")
	// ErrUnits: Options.Units names a unit the reader does not know.
	ErrUnits = errors.New("unknown drawing units")
)

// MaxLineBytes is the longest line the tag reader accepts. DXF splits long
// strings into 250-character chunks, so a longer line means the input is
// not DXF.
const MaxLineBytes = 1 << 20

// A ParseError reports malformed DXF input. Line numbers are 1-based and
// refer to the group-code line of the offending pair.
type ParseError struct {
	File   string // input name, if any
	Line   int    // line of the group code, >= 1
	Code   int    // DXF group code, or -1 if the code itself is bad or not relevant
	Handle string // entity handle (code 5), if known
	Err    error  // wraps one of ErrBinary, ErrDWG, ErrEmpty, ErrTruncated, ...
}

// Error formats e as "plan.dxf:1234: code 20: bad number: ..." (with
// " (handle 2F)" after the line when the handle is known).
func (e *ParseError) Error() string {
	s := e.File
	if s == "" {
		s = "<input>"
	}
	s += ":" + strconv.Itoa(e.Line)
	if e.Handle != "" {
		s += " (handle " + e.Handle + ")"
	}
	if e.Code >= -5 && e.Code != -1 {
		s += fmt.Sprintf(": code %d", e.Code)
	}
	return s + ": " + e.Err.Error()
}

// Unwrap returns the cause, so errors.Is(err, ErrBadNumber) works.
func (e *ParseError) Unwrap() error { return e.Err }

// wrapf builds an error that wraps the sentinel with more detail.
func wrapf(sentinel error, format string, args ...any) error {
	return fmt.Errorf("%w: %s", sentinel, fmt.Sprintf(format, args...))
}
