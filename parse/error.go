package parse

import (
	"fmt"
	"strings"
	"unicode"
)

// Error is bad input: which input, its text, the byte offset where it goes
// wrong and why. Its message quotes the text with a caret under the column.
type Error struct {
	Label  string // "equation", "--bc", "--let", ...
	Input  string
	Offset int
	Msg    string
}

// Error quotes the input on one line, with control characters shown (a tab
// as →, a newline as ↵, others as ·) so that the caret's column, counted in
// display cells (a wide character takes two, a combining mark none), falls
// under the offending character on a terminal. The reported column counts
// characters from 1.
func (e *Error) Error() string {
	in, off := e.Input, e.Offset
	if lead := len(in) - len(strings.TrimLeft(in, " ")); off >= lead {
		in, off = in[lead:], off-lead // leading blanks are not the user's concern
	}
	off = max(0, min(off, len(in)))
	var shown strings.Builder
	col, cells := 1, 0
	for i, r := range in {
		vis := visible(r)
		if i < off {
			col++
			cells += width(vis)
		}
		shown.WriteRune(vis)
	}
	return fmt.Sprintf("%s 1:%d: %s\n    %s\n    %s^", e.Label, col, e.Msg, shown.String(), strings.Repeat(" ", cells))
}

// visible is how a character is shown in the quoted input.
func visible(r rune) rune {
	switch {
	case r == '\t':
		return '→'
	case r == '\n' || r == '\r':
		return '↵'
	case unicode.IsControl(r) || r == utf8RuneError:
		return '·'
	}
	return r
}

const utf8RuneError = '\uFFFD'

// width is a character's display cells: 0 for a combining mark, 2 for the
// East Asian wide and full-width ranges and emoji, 1 otherwise.
func width(r rune) int {
	switch {
	case unicode.Is(unicode.Mn, r) || unicode.Is(unicode.Me, r):
		return 0
	case r >= 0x1100 && r <= 0x115F, r >= 0x2E80 && r <= 0xA4CF, r >= 0xAC00 && r <= 0xD7A3,
		r >= 0xF900 && r <= 0xFAFF, r >= 0xFE30 && r <= 0xFE4F, r >= 0xFF00 && r <= 0xFF60,
		r >= 0xFFE0 && r <= 0xFFE6, r >= 0x1F300 && r <= 0x1F64F, r >= 0x1F900 && r <= 0x1F9FF,
		r >= 0x20000 && r <= 0x3FFFD:
		return 2
	}
	return 1
}
