package parse

import (
	"fmt"
	"strings"
	"unicode/utf8"
)

// Error is bad input: which input, its text, the byte offset where it goes
// wrong and why. Its message quotes the text with a caret under the column.
type Error struct {
	Label  string // "equation", "--bc", "--let", ...
	Input  string
	Offset int
	Msg    string
}

func (e *Error) Error() string {
	in, off := e.Input, e.Offset
	if lead := len(in) - len(strings.TrimLeft(in, " ")); off >= lead {
		in, off = in[lead:], off-lead // leading blanks are not the user's concern
	}
	off = max(0, min(off, len(in)))
	col := utf8.RuneCountInString(in[:off]) + 1
	return fmt.Sprintf("%s 1:%d: %s\n    %s\n    %s^", e.Label, col, e.Msg, in, strings.Repeat(" ", col-1))
}
