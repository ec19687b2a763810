package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// shownTerms is how many leading terms of a long numeric sum the text
// output shows; --format json keeps every term.
const shownTerms = 8

// manyTerms is the count of terms from which a numeric sum is shortened.
const manyTerms = 40

// omittedSize is the largest coefficient among the terms to be left out,
// and whether every one is a plain number times a function of theta (a
// term of another kind, a quadrature's name or a bracketed coefficient,
// is never left out).
func omittedSize(terms []string) (float64, bool) {
	largest := 0.0
	for _, t := range terms {
		v, ok := plainCoefficient(t)
		if !ok {
			return 0, false
		}
		largest = math.Max(largest, math.Abs(v))
	}
	return largest, true
}

// plainCoefficient is a term's leading number, where it starts with one.
func plainCoefficient(term string) (float64, bool) {
	lead := strings.TrimSpace(strings.TrimLeft(term, "+- "))
	num, _, _ := strings.Cut(lead, "*")
	v, err := strconv.ParseFloat(num, 64)
	return v, err == nil
}

// numericRun splits the terms after the first shown into the run of plain
// numeric terms to leave out and the trailing terms of other kinds to keep
// (a quadrature's name after its series); ok is false where terms of other
// kinds are mixed into the run.
func numericRun(terms []string) (omit, keep []string, ok bool) {
	end := len(terms)
	for end > 0 {
		if _, plain := plainCoefficient(terms[end-1]); plain {
			break
		}
		end--
	}
	omit, keep = terms[:end], terms[end:]
	_, ok = omittedSize(omit)
	return omit, keep, ok && len(omit) > 0
}

// longSum is the length past which a numeric (≈) stage is shortened.
const longSum = 600

// shortenNumeric shortens each long numeric sum in a stage's text (parts
// separated by "; ", each "head ≈ sum" or "head = sum"): its first terms,
// then how many follow and the largest coefficient among them. A quadrature
// trace can have hundreds of Fourier terms that no reader copies by hand;
// exact texts are left whole, since they are what a user typesets.
func shortenNumeric(text string) string {
	if len(text) <= longSum || !strings.Contains(text, "≈") {
		return text
	}
	parts := splitTop(text, "; ")
	for i, p := range parts {
		parts[i] = shortenPart(p)
	}
	return strings.Join(parts, "; ")
}

func shortenPart(p string) string {
	if len(p) <= longSum {
		return p
	}
	head, terms, omit, keep, ok := longNumericSum(p)
	if !ok {
		return p
	}
	largest, _ := omittedSize(omit)
	rest := fmt.Sprintf(" + … (%d more terms", len(omit))
	if largest > 0 {
		rest += fmt.Sprintf(", each coefficient at most %.1e in size", largest)
	}
	return head + strings.Join(terms[:shownTerms], "") + rest + "; --format json lists them all)" + strings.Join(keep, "")
}

// longNumericSum reads "head ≈ sum" with many terms: the head (through the
// "≈ "), the sum's terms, the plain numeric run after the first shownTerms
// to leave out and the trailing terms of other kinds to keep; ok is false
// where the part is not such a sum.
func longNumericSum(p string) (head string, terms, omit, keep []string, ok bool) {
	at := strings.Index(p, "≈ ")
	if at < 0 {
		return "", nil, nil, nil, false
	}
	head, terms = p[:at+len("≈ ")], splitTerms(p[at+len("≈ "):])
	if len(terms) < manyTerms {
		return "", nil, nil, nil, false
	}
	omit, keep, ok = numericRun(terms[shownTerms:])
	return head, terms, omit, keep, ok
}

// splitTop splits s at sep where no bracket is open.
func splitTop(s, sep string) []string {
	var out []string
	depth, start := 0, 0
	for i := 0; i < len(s); i++ {
		depth += bracketDepth(s, i)
		if depth == 0 && strings.HasPrefix(s[i:], sep) {
			out = append(out, s[start:i])
			start = i + len(sep)
			i += len(sep) - 1
		}
	}
	return append(out, s[start:])
}

// splitTerms splits a sum into its top-level terms, each keeping the sign
// before it (" + t" or " - t"; the first as written).
func splitTerms(s string) []string { return splitSigned(s, bracketDepth) }

// bracketDepth is how a plain-text character changes the nesting.
func bracketDepth(s string, i int) int {
	switch s[i] {
	case '(', '[', '{':
		return 1
	case ')', ']', '}':
		return -1
	}
	return 0
}

// splitSigned splits s at its " + " and " - " where depth, summed over the
// characters so far, is zero.
func splitSigned(s string, depth func(s string, i int) int) []string {
	var out []string
	level, start := 0, 0
	for i := 0; i < len(s); i++ {
		level += depth(s, i)
		if level == 0 && i > start && (strings.HasPrefix(s[i:], " + ") || strings.HasPrefix(s[i:], " - ")) {
			out = append(out, s[start:i])
			start = i
			i += 2
		}
	}
	return append(out, s[start:])
}

// shortenNumericLaTeX is shortenNumeric for a stage's LaTeX: where the
// text is a long numeric sum (one part, "head ≈ sum"), the LaTeX keeps its
// first terms and \dotsb, and the note for the where paragraph says what
// follows.
func shortenNumericLaTeX(text, tex, symbol string) (string, string) {
	if len(text) <= longSum || !strings.Contains(text, "≈") || len(splitTop(text, "; ")) != 1 {
		return tex, ""
	}
	_, terms, omit, keep, ok := longNumericSum(text)
	texTerms := splitTermsLaTeX(tex)
	if !ok || len(texTerms) != len(terms) {
		return tex, ""
	}
	largest, _ := omittedSize(omit)
	note := fmt.Sprintf(`the sum for $%s$ continues with %d more terms`, symbol, len(omit))
	if largest > 0 {
		note += fmt.Sprintf(", each coefficient at most $%s$ in size", latexNumber(largest))
	}
	note += ` (\texttt{--format json} lists them all)`
	kept := texTerms[len(texTerms)-len(keep):]
	return strings.Join(texTerms[:shownTerms], "") + ` + \dotsb` + strings.Join(kept, ""), note
}

// splitTermsLaTeX splits LaTeX at its top-level " + " and " - " (outside
// braces and \left…\right pairs), each term keeping its sign.
func splitTermsLaTeX(s string) []string {
	return splitSigned(s, func(s string, i int) int {
		switch {
		case s[i] == '{' || strings.HasPrefix(s[i:], `\left`):
			return 1
		case s[i] == '}' || strings.HasPrefix(s[i:], `\right`):
			return -1
		}
		return 0
	})
}
