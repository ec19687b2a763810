package main

import (
	"strings"
	"unicode/utf8"
)

// latexLineWidth is how wide one line of a displayed formula may be, in the
// units of latexWidth (about an en space each): an article's text width
// less the left-hand side's column.
const latexLineWidth = 40

// breakLaTeX splits a formula into lines that fit latexLineWidth, breaking
// only at the top level (outside every brace, bracket and \left…\right
// pair), so that each line is well-formed LaTeX on its own: after a
// separator (",\quad", ";\quad", ",\ ", ";\ "); inside a part still too
// wide, before a + or −; inside one still too wide, after a comma (a list
// of numbers). A term wider than a line stays whole on its own line.
func breakLaTeX(s string) []string {
	pieces := []string{s}
	for _, cut := range []cutAt{separatorsAfter, signsBefore, commasAfter} {
		var next []string
		for _, p := range pieces {
			if latexWidth(p) > latexLineWidth {
				next = append(next, topLevelSplit(p, cut)...)
			} else {
				next = append(next, p)
			}
		}
		pieces = next
	}
	var opened []string
	for _, p := range pieces {
		if latexWidth(p) > latexLineWidth {
			opened = append(opened, openGroup(p)...)
		} else {
			opened = append(opened, p)
		}
	}
	pieces = opened
	var lines []string
	cur, width := "", 0.0
	for _, p := range pieces {
		w := latexWidth(p)
		if cur != "" && width+w > latexLineWidth {
			lines = append(lines, strings.TrimRight(cur, " "))
			cur, width = "", 0
		}
		if cur == "" {
			p = strings.TrimLeft(p, " ")
		}
		cur += p
		width += w
	}
	if strings.TrimSpace(cur) != "" || len(lines) == 0 {
		lines = append(lines, strings.TrimRight(cur, " "))
	}
	return lines
}

// cutAt reports, at a top-level position of s, how long a cut mark there
// is and whether the cut goes after it (true) or before it (false).
type cutAt func(s string) (length int, after bool)

func separatorsAfter(s string) (int, bool) {
	for _, sep := range []string{`,\quad `, `;\quad `, `,\ `, `;\ `} {
		if strings.HasPrefix(s, sep) {
			return len(sep), true
		}
	}
	return 0, false
}

func commasAfter(s string) (int, bool) {
	if strings.HasPrefix(s, ", ") {
		return 2, true
	}
	return 0, false
}

func signsBefore(s string) (int, bool) {
	if strings.HasPrefix(s, " + ") || strings.HasPrefix(s, " - ") {
		return 3, false
	}
	return 0, false
}

// topLevelSplit cuts s at the marks cut finds outside every group.
func topLevelSplit(s string, cut cutAt) []string {
	var out []string
	depth, start := 0, 0
	for i := 0; i < len(s); i++ {
		switch {
		case strings.HasPrefix(s[i:], `\left`) && !isLetterAt(s, i+5):
			depth++
			i += 5 // and its delimiter
			continue
		case strings.HasPrefix(s[i:], `\right`) && !isLetterAt(s, i+6):
			depth--
			i += 6
			continue
		case s[i] == '\\' && i+1 < len(s) && strings.ContainsRune("{}[]()", rune(s[i+1])):
			i++ // an escaped brace, \[ or \(
			continue
		case strings.ContainsRune("{[(", rune(s[i])):
			depth++
			continue
		case strings.ContainsRune("}])", rune(s[i])):
			depth--
			continue
		}
		if depth != 0 {
			continue
		}
		if n, after := cut(s[i:]); n > 0 {
			if after {
				out = append(out, s[start:i+n])
				start = i + n
			} else if i > start {
				out = append(out, s[start:i])
				start = i
			}
			i += n - 1
		}
	}
	return append(out, s[start:])
}

func isLetterAt(s string, i int) bool {
	return i < len(s) && (s[i] >= 'a' && s[i] <= 'z' || s[i] >= 'A' && s[i] <= 'Z')
}

// latexWidth estimates the printed width of a formula: a character is one
// unit, a command is the width of what it prints (\cos three, \theta one,
// spacing and delimiters' commands none), a fraction the wider of its
// parts, a sub- or superscript two thirds of its characters.
func latexWidth(s string) float64 {
	w, _ := widthUntil(s, 0, false)
	return w
}

// commandWidth is the printed width of a command's name.
var commandWidth = map[string]float64{
	"left": 0, "right": 0, "big": 0, "bigl": 0, "bigr": 0, "Big": 0, "quad": 2, "qquad": 4,
	"text": 0, "operatorname": 0, "mathrm": 0, "mathit": 0, "cdot": 1, "dots": 2, "ldots": 2, "cdots": 2,
	"sin": 3.3, "cos": 3.3, "tan": 3.3, "sinh": 4.4, "cosh": 4.4, "tanh": 4.4, "ln": 2.2, "log": 3.3, "exp": 3.3, "arctan": 6.6,
	"infty": 1.2, "sum": 2, "sqrt": 1, "partial": 1, "Delta": 1, "ne": 1, "le": 1, "ge": 1,
}

// widthUntil measures from i to the end of the current group (a closing
// brace when inGroup), returning the width and the index after it.
func widthUntil(s string, i int, inGroup bool) (float64, int) {
	w := 0.0
	for i < len(s) {
		c := s[i]
		switch {
		case c == '}' && inGroup:
			return w, i + 1
		case c == '{':
			g, next := widthUntil(s, i+1, true)
			w, i = w+g, next
		case c == '^' || c == '_':
			i++
			if i < len(s) && s[i] == '{' {
				g, next := widthUntil(s, i+1, true)
				w, i = w+2*g/3, next
			} else if i < len(s) {
				w, i = w+0.7, i+1
			}
		case c == '\\':
			j := i + 1
			for j < len(s) && isLetterAt(s, j) {
				j++
			}
			name := s[i+1 : j]
			switch {
			case name == "frac" || name == "tfrac" || name == "dfrac":
				a, next := groupWidth(s, j)
				b, next2 := groupWidth(s, next)
				w, i = w+max(a, b), next2
				continue
			case name == "":
				if j < len(s) {
					j++ // \, \; \{ and the like
				}
				w += 0.3
			default:
				if cw, ok := commandWidth[name]; ok {
					w += cw
				} else {
					w++ // a Greek letter or a symbol
				}
			}
			i = j
		case c == ' ':
			i++
		case c == '+' || c == '-' || c == '=' || c == '<' || c == '>':
			w, i = w+2.2, i+1 // an operator and its spaces
		case c == '(' || c == ')' || c == '[' || c == ']' || c == '|':
			w, i = w+0.8, i+1
		default:
			_, size := utf8.DecodeRuneInString(s[i:])
			w, i = w+1, i+size
		}
	}
	return w, i
}

// groupWidth is the width of the braced group at i (or of one character).
func groupWidth(s string, i int) (float64, int) {
	for i < len(s) && s[i] == ' ' {
		i++
	}
	if i < len(s) && s[i] == '{' {
		return widthUntil(s, i+1, true)
	}
	if i < len(s) {
		return 1, i + 1
	}
	return 0, i
}

// openGroup breaks a term wider than a line inside its first top-level
// \left( … \right) group: the pair becomes \biggl( … \biggr), fixed-size
// delimiters that may stand on different lines, and the group's inside is
// cut before its top-level + and − signs; an inside with no sign to cut at
// is opened the same way, one group deeper (a series' general term: a
// coefficient's sum within the term's parentheses). A term with no such
// group, or none with a sign to cut at, comes back whole.
func openGroup(s string) []string {
	open := strings.Index(s, `\left(`)
	if open < 0 || !topLevelAt(s, open) {
		return []string{s}
	}
	depth := 0
	for i := open; i < len(s); i++ {
		switch {
		case strings.HasPrefix(s[i:], `\left`) && !isLetterAt(s, i+5):
			depth++
			i += 5
		case strings.HasPrefix(s[i:], `\right`) && !isLetterAt(s, i+6):
			depth--
			if depth == 0 {
				if s[i+6] != ')' {
					return []string{s}
				}
				inner := topLevelSplit(s[open+6:i], signsBefore)
				if len(inner) < 2 {
					inner = openGroup(s[open+6 : i])
				}
				if len(inner) < 2 {
					return []string{s}
				}
				inner[0] = s[:open] + `\biggl(` + inner[0]
				inner[len(inner)-1] += `\biggr)` + s[i+7:]
				return inner
			}
			i += 6
		}
	}
	return []string{s}
}

// topLevelAt reports whether position k of s lies outside every group.
func topLevelAt(s string, k int) bool {
	parts := topLevelSplit(s[:k]+" + ", signsBefore) // a cut is found at k only if k is at the top level
	return len(parts) > 1 && len(parts[len(parts)-1]) == 3
}
