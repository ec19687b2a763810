package main

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"sync"
)

// outputError is a failure to write psol's output (a file, or stdout to a
// full disk): not bad input, and not the problem's fault. Exit status 4.
type outputError struct{ err error }

func (e *outputError) Error() string { return e.err.Error() }
func (e *outputError) Unwrap() error { return e.err }

// stagedFiles are the output files of one run. Each is written to a
// temporary file beside its target as the run goes; only when the whole run
// has succeeded does commit put them in place, together. A run that fails
// (or is interrupted) leaves every existing file as it was and no temporary
// file behind.
type stagedFiles struct {
	staged []stagedFile
	// Written lists what commit put in place, for the report on stderr.
	Written []string
}

type stagedFile struct {
	target string // where the content goes (a symlink's target resolved)
	path   string // as the user gave it
	tmp    string
}

// temporaries are the temporary files of the process, removed on an
// interrupt (see removeTemporaries).
var temporaries = struct {
	sync.Mutex
	names map[string]bool
}{names: map[string]bool{}}

func track(name string, on bool) {
	temporaries.Lock()
	defer temporaries.Unlock()
	if on {
		temporaries.names[name] = true
	} else {
		delete(temporaries.names, name)
	}
}

// removeTemporaries deletes every temporary file still staged: the
// interrupt handler's job.
func removeTemporaries() {
	temporaries.Lock()
	defer temporaries.Unlock()
	for name := range temporaries.names {
		os.Remove(name)
	}
}

// stage writes fill's content for path to a temporary file.
func (s *stagedFiles) stage(path string, fill func(io.Writer) error) error {
	target := path
	if resolved, err := filepath.EvalSymlinks(path); err == nil {
		target = resolved // replace what a link points at, and keep the link
	}
	tmp, err := os.CreateTemp(filepath.Dir(target), "."+filepath.Base(target)+".tmp*")
	if err != nil {
		return &outputError{fmt.Errorf("cannot write %s: %w", path, errors.Unwrap(err))}
	}
	track(tmp.Name(), true)
	s.staged = append(s.staged, stagedFile{target: target, path: path, tmp: tmp.Name()})
	bw := bufio.NewWriter(tmp)
	err = fill(bw)
	if err == nil {
		err = bw.Flush()
	}
	if cerr := tmp.Close(); err == nil && cerr != nil {
		err = &outputError{fmt.Errorf("cannot write %s: %w", path, cerr)}
	}
	return err
}

// commit puts every staged file in place: a regular file (or a new one) is
// replaced by a rename, keeping an existing file's mode (a new one gets the
// umask's); anything else (a device, a pipe) is written through.
func (s *stagedFiles) commit() error {
	for _, f := range s.staged {
		size := int64(-1)
		if st, err := os.Stat(f.tmp); err == nil {
			size = st.Size()
		}
		info, err := os.Stat(f.target)
		switch {
		case err == nil && !info.Mode().IsRegular():
			err = copyInto(f.tmp, f.target)
			os.Remove(f.tmp)
		case err == nil:
			if err = os.Chmod(f.tmp, info.Mode().Perm()); err == nil {
				err = os.Rename(f.tmp, f.target)
			}
		case errors.Is(err, fs.ErrNotExist):
			if err = os.Chmod(f.tmp, os.FileMode(0o666&^umask())); err == nil {
				err = os.Rename(f.tmp, f.target)
			}
		}
		track(f.tmp, false)
		if err != nil {
			s.abort()
			return &outputError{fmt.Errorf("cannot write %s: %w", f.target, unwrapPath(err))}
		}
		s.Written = append(s.Written, fmt.Sprintf("wrote %s (%s)", f.path, byteSize(size)))
	}
	s.staged = nil
	return nil
}

// abort removes the temporary files of a run that failed.
func (s *stagedFiles) abort() {
	for _, f := range s.staged {
		os.Remove(f.tmp)
		track(f.tmp, false)
	}
	s.staged = nil
}

func copyInto(from, to string) error {
	src, err := os.Open(from)
	if err != nil {
		return err
	}
	defer src.Close()
	dst, err := os.OpenFile(to, os.O_WRONLY|os.O_TRUNC, 0)
	if err != nil {
		return err
	}
	if _, err := io.Copy(dst, src); err != nil {
		dst.Close()
		return err
	}
	return dst.Close()
}

// unwrapPath drops an *fs.PathError's path (a temporary name the user never
// gave), keeping its reason.
func unwrapPath(err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	var le *os.LinkError
	if errors.As(err, &le) {
		return le.Err
	}
	return err
}

// byteSize is a file size for people: 812 bytes, 14.2 kB, 3.1 MB.
func byteSize(n int64) string {
	switch {
	case n < 0:
		return "size unknown"
	case n < 1000:
		return fmt.Sprintf("%d bytes", n)
	case n < 1000000:
		return fmt.Sprintf("%.1f kB", float64(n)/1e3)
	}
	return fmt.Sprintf("%.1f MB", float64(n)/1e6)
}
