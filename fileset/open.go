package fileset

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
)

// NotRegularError is OpenRegular's answer to a path that is not a regular
// file.
type NotRegularError struct {
	Path string
	Mode fs.FileMode
}

func (e *NotRegularError) Error() string {
	return fmt.Sprintf("%s is %s, not a regular file", e.Path, e.Kind())
}

// Kind names what the file is: "a named pipe (FIFO)", "a directory", ….
func (e *NotRegularError) Kind() string {
	switch m := e.Mode; {
	case m&fs.ModeNamedPipe != 0:
		return "a named pipe (FIFO)"
	case m.IsDir():
		return "a directory"
	case m&fs.ModeDevice != 0:
		return "a device"
	case m&fs.ModeSocket != 0:
		return "a socket"
	}
	return "a special file"
}

// OpenRegular opens path for reading when it is a regular file (or a
// symbolic link to one), the only kind of input file there is: a named
// pipe would block its reader until some other program writes to it, a
// device may never end. Anything else is a *NotRegularError, returned
// without blocking: the path is checked before it is opened, and opened
// without waiting for a writer (O_NONBLOCK where the system has it) and
// checked again, in case it was replaced in between. Other failures are
// those of os.Open. Job files are opened with it too.
func OpenRegular(path string) (*os.File, error) {
	st, err := os.Stat(path)
	if err != nil {
		return nil, err
	}
	if !st.Mode().IsRegular() {
		return nil, &NotRegularError{Path: path, Mode: st.Mode()}
	}
	f, err := os.OpenFile(path, os.O_RDONLY|openNonBlock, 0)
	if err != nil {
		return nil, err
	}
	if st, err = f.Stat(); err != nil || !st.Mode().IsRegular() {
		f.Close()
		if err != nil {
			return nil, err
		}
		return nil, &NotRegularError{Path: path, Mode: st.Mode()}
	}
	return f, nil
}

// ErrText is the message of a failure to read or write a named file, for a
// line that names the file itself: the path a *fs.PathError repeats is
// dropped, and a *NotRegularError says what the path is ("it is a
// directory, not a regular file").
func ErrText(err error) string {
	var nr *NotRegularError
	if errors.As(err, &nr) {
		return "it is " + nr.Kind() + ", not a regular file"
	}
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err.Error()
	}
	return err.Error()
}

// NotRegularHint is the hint for a path that is not a regular file, ""
// for any other failure.
func NotRegularHint(err error) string {
	var nr *NotRegularError
	if errors.As(err, &nr) {
		return "give the path of a file; a pipe or device is not read, so that it cannot stall the run"
	}
	return ""
}
