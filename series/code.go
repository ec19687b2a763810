package series

import (
	"fmt"
	"math/big"
	"strconv"
	"strings"
)

// Lang is a target language for generated code: how it spells powers,
// functions, constants and the pieces of a loop.
type Lang struct {
	Name  string
	Fn    map[string]string // cos, sin, log, pow, sqrt, atan2 → the language's name
	Pi    string
	Float func(s string) string // a decimal literal
}

// Langs are the languages psol writes code in.
var Langs = map[string]Lang{
	"go": {Name: "go", Fn: map[string]string{"cos": "math.Cos", "sin": "math.Sin", "log": "math.Log", "pow": "math.Pow", "sqrt": "math.Sqrt", "exp": "math.Exp", "atan": "math.Atan", "abs": "math.Abs"},
		Pi: "math.Pi", Float: func(s string) string { return s }},
	"c": {Name: "c", Fn: map[string]string{"cos": "cos", "sin": "sin", "log": "log", "pow": "pow", "sqrt": "sqrt", "exp": "exp", "atan": "atan", "abs": "fabs"},
		Pi: "3.141592653589793", Float: func(s string) string { return s }}, // M_PI is not in C99
	"python": {Name: "python", Fn: map[string]string{"cos": "math.cos", "sin": "math.sin", "log": "math.log", "pow": "math.pow", "sqrt": "math.sqrt", "exp": "math.exp", "atan": "math.atan", "abs": "abs"},
		Pi: "math.pi", Float: func(s string) string { return s }},
}

func (l Lang) lit(q *big.Rat) string {
	f, _ := q.Float64()
	s := strconv.FormatFloat(f, 'g', 17, 64)
	if !strings.ContainsAny(s, ".eE") {
		s += ".0"
	}
	return "(" + l.Float(s) + ")"
}

func (l Lang) pow(base string, e *big.Rat) string {
	if e.IsInt() && e.Num().Int64() >= 1 && e.Num().Int64() <= 4 {
		return strings.TrimSuffix(strings.Repeat(base+"*", int(e.Num().Int64())), "*")
	}
	if e.IsInt() && e.Num().Int64() <= -1 && e.Num().Int64() >= -4 {
		return "(1.0/(" + l.pow(base, new(big.Rat).Neg(e)) + "))"
	}
	return l.Fn["pow"] + "(" + base + ", " + l.lit(e) + ")"
}

func (l Lang) atom(s Symbol, index string) string {
	switch s.kind {
	case kindRoot:
		return l.lit(new(big.Rat).SetFrac64(mustInt(s.name), 1))
	case kindPi:
		return l.Pi
	case kindLog:
		if isDigits(s.name) {
			return l.Fn["log"] + "(" + l.lit(new(big.Rat).SetFrac64(mustInt(s.name), 1)) + ")"
		}
		if s.name == "pi" {
			return l.Fn["log"] + "(" + l.Pi + ")"
		}
		return l.Fn["log"] + "(" + s.name + ")"
	case kindSign:
		return l.Fn["cos"] + "(" + l.Pi + "*" + index + ")"
	case kindPowN:
		return l.Fn["pow"] + "(" + powBase(s.name).Code(l, index) + ", " + index + ")"
	case kindCosAtanN, kindSinAtanN:
		fn := l.Fn["cos"]
		if s.kind == kindSinAtanN {
			fn = l.Fn["sin"]
		}
		return fn + "(" + l.Fn["atan"] + "(" + atanBase(s.name).Code(l, index) + ")*" + index + ")"
	case kindAtan:
		return l.Fn["atan"] + "(" + atanBase(s.name).Code(l, index) + ")"
	case kindCosN, kindSinN:
		q, _ := new(big.Rat).SetString(s.name)
		fn := l.Fn["cos"]
		if s.kind == kindSinN {
			fn = l.Fn["sin"]
		}
		return fn + "(" + l.lit(q) + "*" + l.Pi + "*" + index + ")"
	}
	return s.name
}

func mustInt(s string) int64 { v, _ := strconv.ParseInt(s, 10, 64); return v }

func (l Lang) poly(p Poly, index string) string {
	if len(p.t) == 0 {
		return "0.0"
	}
	var parts []string
	for _, t := range p.t {
		f := []string{l.lit(t.c)}
		for _, fa := range t.m.f {
			f = append(f, l.pow(l.atom(fa.sym, index), fa.exp))
		}
		parts = append(parts, strings.Join(f, "*"))
	}
	return "(" + strings.Join(parts, " + ") + ")"
}

// Code is c as an expression; index names the series index variable.
func (c Coef) Code(l Lang, index string) string {
	if c.den.IsZero() {
		return l.poly(c.num, index)
	}
	return "(" + l.poly(c.num, index) + "/" + l.poly(c.den, index) + ")"
}

// Code is s as an expression in r and theta.
func (s Sum) Code(l Lang) string {
	if len(s.t) == 0 {
		return "0.0"
	}
	var parts []string
	for _, t := range s.t {
		f := []string{t.C.Code(l, Index)}
		if p := t.power(); p.Sign() != 0 {
			f = append(f, l.pow("r", p))
		}
		if t.L > 0 {
			f = append(f, l.pow(l.Fn["log"]+"(r)", big.NewRat(int64(t.L), 1)))
		}
		if t.K > 0 {
			f = append(f, l.pow("theta", big.NewRat(int64(t.K), 1)))
		}
		if t.M > 0 {
			fn := l.Fn["cos"]
			if t.Sin {
				fn = l.Fn["sin"]
			}
			f = append(f, fmt.Sprintf("%s(%d*theta)", fn, t.M))
		}
		parts = append(parts, strings.Join(f, "*"))
	}
	return strings.Join(parts, " + ")
}

// TermCode is the general term of a series at index n (a float variable named
// n), as an expression in r, theta and n, for a loop the caller writes.
func (s Series) TermCode(l Lang) string {
	nu := "(" + l.lit(s.Family.Slope) + "*n + " + l.lit(s.Family.Offset) + ")"
	var parts []string
	for _, t := range s.General {
		f := []string{t.C.Code(l, "n")}
		switch {
		case t.Scaled && s.Inverse:
			f = append(f, l.Fn["pow"]+"("+s.R.Code(l, "n")+"/r, "+nu+")")
		case t.Scaled:
			f = append(f, l.Fn["pow"]+"(r/"+s.R.Code(l, "n")+", "+nu+")")
		default:
			if t.P != nil && t.P.Sign() != 0 {
				f = append(f, l.pow("r", t.P))
			}
			if t.L > 0 {
				f = append(f, l.pow(l.Fn["log"]+"(r)", big.NewRat(int64(t.L), 1)))
			}
		}
		parts = append(parts, strings.Join(f, "*"))
	}
	fn := l.Fn["cos"]
	if s.Family.Sin {
		fn = l.Fn["sin"]
	}
	if len(parts) == 0 {
		return "0.0"
	}
	return "(" + strings.Join(parts, " + ") + ")*" + fn + "(" + nu + "*theta)"
}

// SpecialCode is the term of an exceptional n, for the same loop.
func (s Series) SpecialCode(l Lang, n int) string {
	sub := Series{Family: s.Family, R: s.R, Inverse: s.Inverse, General: s.Special[n]}
	return sub.TermCode(l)
}

// Skips lists the exceptional n in order.
func (s Series) Skips() []int { return s.specials() }
