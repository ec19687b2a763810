package parse

import (
	"strings"
	"sync"
	"testing"

	"github.com/alecthomas/participle/v2/lexer"
)

// ruleLexer is the token rules as regular expressions, participle's own
// lexer compiled from them: the reference the hand-written scanner must
// match token for token (kinds, text, positions and refusals).
var ruleLexer = sync.OnceValue(func() *lexer.StatefulDefinition {
	return lexer.MustSimple([]lexer.SimpleRule{
		{Name: "Space", Pattern: `\s+`},
		{Name: "Lap", Pattern: `Δ|∇²|∇\^2`},
		{Name: "Number", Pattern: `(\d+\.\d+|\d+|\.\d+)([eE][-+]?\d+)?`},
		{Name: "Ident", Pattern: `[\p{L}_][\p{L}\p{N}_]*`},
		{Name: "Punct", Pattern: `\*\*|<=|>=|!=|\.\.|[-+*/^()=?:<>,]`},
	})
})

// checkScanner lexes in both ways and fails at the first difference.
func checkScanner(t *testing.T, in string) {
	t.Helper()
	ref := ruleLexer()
	names := lexer.SymbolsByRune(ref)
	want, _ := ref.LexString("", in)
	got, _ := scanner{}.LexString("", in)
	for i := 0; ; i++ {
		w, werr := want.Next()
		g, gerr := got.Next()
		if (werr == nil) != (gerr == nil) || werr != nil && werr.Error() != gerr.Error() {
			t.Fatalf("%q token %d: error %v, want %v", in, i, gerr, werr)
		}
		if werr != nil {
			return
		}
		if g.Value != w.Value || g.Pos != w.Pos || scanSymbols[names[w.Type]] != g.Type {
			t.Fatalf("%q token %d: %#v, want %s %#v", in, i, g, names[w.Type], w)
		}
		if w.EOF() {
			return
		}
	}
}

// The scanner reads what the expressions read, on inputs chosen to probe
// each rule's edges (FuzzParse runs the same check on arbitrary input).
func TestScannerMatchesRules(t *testing.T) {
	for _, in := range []string{
		"lap(u) = 6r*sin(theta)", "Δu = 1", "∇²u", "∇^2 u", "∇u", "∇^x", "Δx2", "x²y", "αβ_1 = 2",
		"1.5", "1.", ".5", "1.e5", "2e5", "2e", "2e+", "2E-3x", "1..5", "3.14.15", "..", ".",
		"a**b", "a*-b", "a<=b>=c!=d", "a!b", "x ? 1 : 0", "\t\n\f\r x", "x\vy", "u\u00a0v",
		"x\xffy", "\xe2\x88", "€", "_", "_9", "9_", "١٢", "x١", "sum(n=1..inf, 1/n^2)", "",
		"line1\nline2 + é", "ŝ", "θ<π",
	} {
		checkScanner(t, in)
	}
}

func BenchmarkScan(b *testing.B) {
	in := "lap(u) = -Q/T*delta(x - 0.3, y) - N/T + 4sin(3theta)*exp(-r^2/2e-3)"
	b.ReportAllocs()
	for b.Loop() {
		l, _ := scanner{}.LexString("", in)
		for {
			tok, err := l.Next()
			if err != nil || tok.EOF() {
				break
			}
		}
	}
}

func TestNames(t *testing.T) {
	for _, c := range []struct {
		in   string
		want string
	}{
		{"lap(u) = -q/k*exp(-2e5*r)", "lap u q k exp r"},
		{"a@b ∇²c_1 x²", "a b c_1 x²"},
		{"", ""},
	} {
		if got := strings.Join(Names(c.in), " "); got != c.want {
			t.Errorf("Names(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}
