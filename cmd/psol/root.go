package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"strings"

	"github.com/spf13/cobra"

	"psol/ansatz"
	"psol/domain"
	"psol/parse"
	"psol/series"
)

const version = "0.1.0"

// newRoot builds the command tree; each call is independent, for in-process
// tests. When the first argument names a command, only that command is
// built: its flags are all a run of it reads, and building every command's
// flag set cost a one-liner a tenth of its time in memory first touched.
// Anything else (help, a typo cobra suggests a name for) gets them all.
func newRoot(args []string) *cobra.Command {
	// psol's commands, each built by its own file (a local table: the demo
	// command runs psol, so a package-level one would be an init cycle).
	subcommands := []struct {
		name  string
		build func() *cobra.Command
	}{
		{"solve", newSolveCmd},
		{"particular", newParticularCmd},
		{"check", newCheckCmd},
		{"demo", newDemoCmd},
		{"version", newVersionCmd},
	}
	root := &cobra.Command{
		Use:   "psol",
		Short: "Solve Poisson's equation lap(u) = f on a disk, annulus, sector, rectangle or outside a circle",
		Long: `psol splits the solution of lap(u) = f into a particular solution of the
source and a harmonic part that corrects the boundary values, prints each
stage as an exact formula, and checks the result.`,
		SilenceErrors: true,
		SilenceUsage:  true,
	}
	for _, c := range subcommands {
		if len(args) > 0 && args[0] == c.name {
			root.AddCommand(c.build())
			return root
		}
	}
	for _, c := range subcommands {
		root.AddCommand(c.build())
	}
	return root
}

// run executes psol with args and returns the exit status: 0 success,
// 1 a well-formed problem with no solution as posed, 2 bad input.
func run(args []string, stdout, stderr io.Writer) (status int) {
	// A defect must not show the user a stack: say so, as one line, and fail.
	defer func() {
		if r := recover(); r != nil {
			fmt.Fprintf(stderr, "psol: internal error (please report it with the command line): %v\n", r)
			if os.Getenv("PSOL_STACK") != "" {
				debug.PrintStack()
			}
			status = 3
		}
	}()
	root := newRoot(args)
	root.SetArgs(protectNegatives(args))
	root.SetOut(stdout)
	root.SetErr(stderr)
	err := root.Execute()
	if err == nil {
		return 0
	}
	fmt.Fprintln(stderr, "psol: "+errorText(err))
	return exitStatus(err)
}

// errorText is the error as psol prints it: the library's message, plus the
// flag that supplies what it says is missing (the library names no flags).
func errorText(err error) string {
	msg := err.Error()
	var unbound series.ErrUnbound
	if errors.As(err, &unbound) {
		msg += fmt.Sprintf(" (give it with --let %s=...)", unbound.Name)
	}
	return msg
}

// protectNegatives keeps arguments such as "-k*lap(u) = q" from being read
// as flags: psol has no one-letter flags but -h, so a leading space (which
// the parser ignores) marks them as values. A value right after a flag that
// takes one ("--tol -1") is the flag's already, and stays as it is, so that
// the flag's own check can name the allowed range.
func protectNegatives(args []string) []string {
	out := make([]string, len(args))
	for i, a := range args {
		afterFlag := i > 0 && strings.HasPrefix(args[i-1], "--") && !strings.Contains(args[i-1], "=") && !boolFlags[strings.TrimPrefix(args[i-1], "--")]
		if len(a) > 1 && a[0] == '-' && a[1] != '-' && a != "-h" && !afterFlag {
			a = " " + a
		}
		out[i] = a
	}
	return out
}

// boolFlags are the flags that take no value.
var boolFlags = map[string]bool{"report": true, "steps": true, "help": true}

// usageError marks bad input found outside the parser (flags, missing sides).
type usageError struct {
	msg   string
	cause error // what the message wraps (%w), if anything
}

func (e *usageError) Error() string { return e.msg }
func (e *usageError) Unwrap() error { return e.cause }

func usagef(format string, args ...any) error {
	err := fmt.Errorf(format, args...)
	return &usageError{err.Error(), errors.Unwrap(err)}
}

func exitStatus(err error) int {
	var (
		unsolvable  *domain.Unsolvable
		unsupported *domain.Unsupported
		noRule      *ansatz.NoRule
		claimFailed *claimError
	)
	var internal *internalError
	if errors.As(err, &internal) {
		return 3
	}
	var output *outputError
	if errors.As(err, &output) {
		return 4
	}
	switch {
	case errors.As(err, &unsolvable), errors.As(err, &unsupported), errors.As(err, &noRule), errors.As(err, &claimFailed):
		return 1
	}
	var pe *parse.Error
	var ue *usageError
	var ms *domain.MissingSides
	if errors.As(err, &pe) || errors.As(err, &ue) || errors.As(err, &ms) {
		return 2
	}
	return 2 // cobra's own errors are about flags and arguments
}

// internalError is psol failing its own verification: a defect, exit 3.
type internalError struct{ msg string }

func (e *internalError) Error() string { return e.msg }

// claimError is a failed verification (for psol check).
type claimError struct{ msg string }

func (e *claimError) Error() string { return e.msg }
