package parse

import (
	"io"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"github.com/alecthomas/participle/v2/lexer"
)

// scanner is the grammar's lexer, written out by hand. It reads the tokens
// the rules below describe as regular expressions, tried in this order at
// each position, the first that matches winning:
//
//	Space  = \s+                                      (ASCII \t \n \f \r and space)
//	Lap    = Δ | ∇² | ∇^2
//	Number = ( \d+\.\d+ | \d+ | \.\d+ ) ( [eE] [-+]? \d+ )?
//	Ident  = [\p{L}_] [\p{L}\p{N}_]*
//	Punct  = ** | <= | >= | != | .. | one of -+*/^()=?:<>,
//
// A lexer compiled from those expressions built its Unicode classes at
// every start, most of a millisecond of a one-line run; this one costs
// nothing to build. TestScannerMatchesRules checks it token for token
// against the expressions.
type scanner struct{}

// The token kinds, numbered below lexer.EOF as participle expects.
const (
	tokSpace lexer.TokenType = lexer.EOF - 1 - iota
	tokLap
	tokNumber
	tokIdent
	tokPunct
)

var scanSymbols = map[string]lexer.TokenType{
	"EOF": lexer.EOF, "Space": tokSpace, "Lap": tokLap, "Number": tokNumber, "Ident": tokIdent, "Punct": tokPunct,
}

// Symbols implements lexer.Definition.
func (scanner) Symbols() map[string]lexer.TokenType { return scanSymbols }

// Lex implements lexer.Definition.
func (s scanner) Lex(filename string, r io.Reader) (lexer.Lexer, error) {
	var b strings.Builder
	if _, err := io.Copy(&b, r); err != nil {
		return nil, err
	}
	return s.LexString(filename, b.String())
}

// LexString implements lexer.StringDefinition.
func (scanner) LexString(filename, input string) (lexer.Lexer, error) {
	return &scanning{rest: input, pos: lexer.Position{Filename: filename, Line: 1, Column: 1}}, nil
}

// scanning is one pass over an input.
type scanning struct {
	rest string
	pos  lexer.Position
}

// Next implements lexer.Lexer.
func (s *scanning) Next() (lexer.Token, error) {
	if s.rest == "" {
		return lexer.EOFToken(s.pos), nil
	}
	kind, n := scanToken(s.rest)
	if n == 0 {
		sample := []rune(s.rest)
		if len(sample) > 16 {
			sample = append(sample[:16], []rune("...")...)
		}
		// The wording participle's own lexers use, which wrapParse knows.
		return lexer.Token{}, &lexer.Error{Msg: "lexer: invalid input text " + strconv.Quote(string(sample)), Pos: s.pos}
	}
	tok := lexer.Token{Type: kind, Value: s.rest[:n], Pos: s.pos}
	s.pos.Advance(tok.Value)
	s.rest = s.rest[n:]
	return tok, nil
}

// scanToken is the kind and byte length of the token at the start of in,
// or length 0 where no rule matches.
func scanToken(in string) (lexer.TokenType, int) {
	if n := scanSpace(in); n > 0 {
		return tokSpace, n
	}
	for _, lap := range [...]string{"Δ", "∇²", "∇^2"} {
		if strings.HasPrefix(in, lap) {
			return tokLap, len(lap)
		}
	}
	if n := scanNumber(in); n > 0 {
		return tokNumber, n
	}
	if n := scanIdent(in); n > 0 {
		return tokIdent, n
	}
	for _, p := range [...]string{"**", "<=", ">=", "!=", ".."} {
		if strings.HasPrefix(in, p) {
			return tokPunct, 2
		}
	}
	if strings.IndexByte("-+*/^()=?:<>,", in[0]) >= 0 {
		return tokPunct, 1
	}
	return 0, 0
}

func scanSpace(in string) int {
	n := 0
	for n < len(in) && strings.IndexByte("\t\n\f\r ", in[n]) >= 0 {
		n++
	}
	return n
}

func digits(in string) int {
	n := 0
	for n < len(in) && in[n] >= '0' && in[n] <= '9' {
		n++
	}
	return n
}

// scanNumber follows the alternatives in order: digits.digits, digits,
// .digits; then an exponent if one follows in full.
func scanNumber(in string) int {
	n := digits(in)
	switch {
	case n > 0 && n+1 < len(in) && in[n] == '.' && digits(in[n+1:]) > 0:
		n += 1 + digits(in[n+1:])
	case n > 0:
	case len(in) > 1 && in[0] == '.' && digits(in[1:]) > 0:
		n = 1 + digits(in[1:])
	default:
		return 0
	}
	if n < len(in) && (in[n] == 'e' || in[n] == 'E') {
		m := n + 1
		if m < len(in) && (in[m] == '-' || in[m] == '+') {
			m++
		}
		if d := digits(in[m:]); d > 0 {
			n = m + d
		}
	}
	return n
}

func scanIdent(in string) int {
	n := 0
	for n < len(in) {
		r, size := utf8.DecodeRuneInString(in[n:])
		// An invalid byte decodes as U+FFFD, which is neither, as in the expressions.
		if !(r == '_' || unicode.IsLetter(r) || n > 0 && unicode.IsNumber(r)) {
			break
		}
		n += size
	}
	return n
}

// Names are the identifiers in text, in order and with repeats, as the
// scanner reads them; a character no token takes is skipped.
func Names(text string) []string {
	var out []string
	for text != "" {
		kind, n := scanToken(text)
		if n == 0 {
			_, n = utf8.DecodeRuneInString(text)
		} else if kind == tokIdent {
			out = append(out, text[:n])
		}
		text = text[n:]
	}
	return out
}
