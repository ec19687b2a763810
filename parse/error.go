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
	off := e.Offset
	if off < 0 {
		off = 0
	}
	if off > len(e.Input) {
		off = len(e.Input)
	}
	col := utf8.RuneCountInString(e.Input[:off]) + 1
	return fmt.Sprintf("%s 1:%d: %s\n    %s\n    %s^", e.Label, col, e.Msg, e.Input, strings.Repeat(" ", col-1))
}
