package main

import (
	"strings"

	"github.com/spf13/pflag"
)

// repeatable is a flag that may be given many times, each value kept whole
// (commas and all, unlike a list flag). pflag's own string-array flag does
// the same but formats its default through a CSV writer with a 4 KB buffer
// as it is defined; with nine such flags that was 40 KB of memory a
// one-liner touched first, and so paid for, before reading any argument.
type repeatable struct{ values *[]string }

func (r repeatable) Set(v string) error { *r.values = append(*r.values, v); return nil }

// Type names the value in help as pflag's own array flag does.
func (r repeatable) Type() string { return "stringArray" }

// String is empty with no values, so that help prints no default.
func (r repeatable) String() string {
	if len(*r.values) == 0 {
		return ""
	}
	return "[" + strings.Join(*r.values, ",") + "]"
}

// repeatableVar defines a repeatable flag that appends to *p.
func repeatableVar(f *pflag.FlagSet, p *[]string, name, usage string) {
	f.Var(repeatable{p}, name, usage)
}
