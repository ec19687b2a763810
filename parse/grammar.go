package parse

import (
	"sync"

	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"
)

// The grammar, in EBNF:
//
//	statement = [ ident ":" ] choice [ "=" choice ] [ "," binding ] .
//	bindings  = binding { "," binding } .
//	binding   = ident "=" choice .
//	choice    = compare [ "?" choice ":" choice ] .
//	compare   = additive { ( "<=" | ">=" | "<" | ">" ) additive } .
//	additive  = product { ( "+" | "-" ) product } .
//	product   = unary { ( "*" | "/" ) unary } .
//	unary     = ( "-" | "+" ) unary | power .
//	power     = primary [ ( "^" | "**" ) unary ] .
//	primary   = number [ atom [ ( "^" | "**" ) unary ] ] | atom .
//	atom      = lap ident | sum | ident "(" choice { "," choice } ")" | ident | "(" choice ")" .
//	sum       = "sum" "(" ident "=" number ".." ( "inf" | number ) { "," ident "!=" number [ ".." number ] } "," choice ")" .
//
// A number directly followed by an atom multiplies it ("2r", "3(x+y)",
// "4sin(3theta)"); lap is Δ, ∇² or ∇^2.

type statement struct {
	Pos  lexer.Position
	Side *sideName `parser:"( @@ \":\" )?"`
	Left *choice   `parser:"@@"`
	Eq   *eqTail   `parser:"@@?"`
	// Also is a second clause of a condition, as in "u = const, flux = 2".
	Also *binding `parser:"( \",\" @@ )?"`
}

type sideName struct {
	Pos  lexer.Position
	Name string `parser:"@Ident"`
}

type eqTail struct {
	Pos   lexer.Position
	Right *choice `parser:"\"=\" @@"`
}

type bindings struct {
	List []*binding `parser:"@@ ( \",\" @@ )*"`
}

type binding struct {
	Pos   lexer.Position
	Name  string  `parser:"@Ident \"=\""`
	Value *choice `parser:"@@"`
}

type choice struct {
	Pos  lexer.Position
	Cond *compare `parser:"@@"`
	Then *choice  `parser:"( \"?\" @@"`
	Else *choice  `parser:"\":\" @@ )?"`
}

type compare struct {
	Pos  lexer.Position
	Left *additive  `parser:"@@"`
	Rest []*cmpTail `parser:"@@*"`
}

type cmpTail struct {
	Pos   lexer.Position
	Op    string    `parser:"@( \"<=\" | \">=\" | \"<\" | \">\" )"`
	Right *additive `parser:"@@"`
}

type additive struct {
	Pos  lexer.Position
	Left *product   `parser:"@@"`
	Rest []*addTail `parser:"@@*"`
}

type addTail struct {
	Pos   lexer.Position
	Op    string   `parser:"@( \"+\" | \"-\" )"`
	Right *product `parser:"@@"`
}

type product struct {
	Pos  lexer.Position
	Left *unary     `parser:"@@"`
	Rest []*mulTail `parser:"@@*"`
}

type mulTail struct {
	Pos   lexer.Position
	Op    string `parser:"@( \"*\" | \"/\" )"`
	Right *unary `parser:"@@"`
}

type unary struct {
	Pos   lexer.Position
	Sign  string `parser:"( @( \"-\" | \"+\" )"`
	Inner *unary `parser:"@@ )"`
	Power *power `parser:"| @@"`
}

type power struct {
	Pos  lexer.Position
	Base *primary `parser:"@@"`
	Exp  *unary   `parser:"( ( \"**\" | \"^\" ) @@ )?"`
}

type primary struct {
	Pos    lexer.Position
	Number *string `parser:"( @Number"`
	Times  *scaled `parser:"@@? )"`
	Atom   *atom   `parser:"| @@"`
}

// scaled is the atom a number multiplies without a sign, as in "2r^2".
type scaled struct {
	Pos  lexer.Position
	Atom *atom  `parser:"@@"`
	Exp  *unary `parser:"( ( \"**\" | \"^\" ) @@ )?"`
}

type atom struct {
	Pos   lexer.Position
	Lap   *string  `parser:"( @Lap"`
	LapOf string   `parser:"@Ident )"`
	Sum   *sumNode `parser:"| @@"`
	Call  *call    `parser:"| @@"`
	Name  *string  `parser:"| @Ident"`
	Group *choice  `parser:"| \"(\" @@ \")\""`
}

// sumNode is a series as psol prints it: sum(n=1..inf, n != 2, n != 4..9, TERM).
type sumNode struct {
	Pos   lexer.Position
	Index string     `parser:"\"sum\" \"(\" @Ident \"=\""`
	From  string     `parser:"@Number \"..\""`
	To    string     `parser:"( @\"inf\" | @Number )"`
	Skip  []*skipped `parser:"( \",\" @@ )*"`
	Body  *choice    `parser:"\",\" @@ \")\""`
}

type skipped struct {
	Pos   lexer.Position
	Index string `parser:"@Ident \"!=\""`
	Value string `parser:"@Number"`
	Upto  string `parser:"( \"..\" @Number )?"` // a run of skipped n, Value..Upto
}

type call struct {
	Pos  lexer.Position
	Name string    `parser:"@Ident \"(\""`
	Args []*choice `parser:"@@ ( \",\" @@ )* \")\""`
}

// The parsers are built once, on first use: a run that reads no input
// (psol version, --help) does not pay the few milliseconds of building them.
var (
	statementParser = sync.OnceValue(func() *participle.Parser[statement] {
		return participle.MustBuild[statement](
			participle.Lexer(scanner{}), participle.Elide("Space"), participle.UseLookahead(2))
	})
	bindingsParser = sync.OnceValue(func() *participle.Parser[bindings] {
		return participle.MustBuild[bindings](
			participle.Lexer(scanner{}), participle.Elide("Space"), participle.UseLookahead(2))
	})
)

// Grammar is the EBNF participle derives from the node types, for the golden test.
func Grammar() string { return statementParser().String() }
