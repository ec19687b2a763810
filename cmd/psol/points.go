package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"psol/domain"
	"psol/parse"
	"psol/series"
)

// point is one --at evaluation.
type point struct {
	R     float64 `json:"r"`
	Theta float64 `json:"theta"`
	X     float64 `json:"x"`
	Y     float64 `json:"y"`
	U     float64 `json:"u"`
	Error float64 `json:"error"`           // truncation estimate; 0 for closed forms
	Terms int     `json:"terms,omitempty"` // series terms summed
	Input string  `json:"input"`
	// Regular marks a point source's position: U is the regular part
	// u − (Q/2π)·ln|z − z₀| there, u itself being infinite.
	Regular  bool   `json:"regular_part,omitempty"`
	strength string // the source's strength Q there, as printed
	inXY     bool   // given as x and y: evaluated in them
}

// readPoint reads "r=…,theta=…" or "x=…,y=…".
func readPoint(text string, env series.Env) (point, error) {
	if !strings.ContainsAny(text, "=") {
		// "0.2,0.1" alone: which system is meant is a guess psol does not make.
		return point{}, &parse.Error{Label: "--at", Input: text, Msg: `name the coordinates: "x=…,y=…" or "r=…,theta=…"`}
	}
	vals, ok := plainPoint(text)
	if !ok {
		var err error
		if vals, err = boundPoint(text, env); err != nil {
			return point{}, err
		}
	}
	return pointFrom(text, vals)
}

// plainPoint reads the common form with plain decimal numbers,
// "x=0.25,y=-1e-3", without the grammar (ten thousand --at points would
// otherwise spend most of their time in it). A decimal reads to the same
// float64 either way: both round the exact value correctly.
func plainPoint(text string) (map[string]float64, bool) {
	vals := map[string]float64{}
	for _, part := range strings.Split(text, ",") {
		name, num, ok := strings.Cut(part, "=")
		if !ok {
			return nil, false
		}
		name, num = strings.TrimSpace(name), strings.TrimSpace(num)
		switch name {
		case "r", "theta", "x", "y":
		case "θ":
			name = "theta"
		default:
			return nil, false
		}
		if !plainDecimal(num) {
			return nil, false
		}
		v, err := strconv.ParseFloat(num, 64)
		if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
			return nil, false // pi/4, 2e999 and the rest: the grammar says what they are
		}
		if _, dup := vals[name]; dup {
			return nil, false
		}
		vals[name] = v
	}
	return vals, true
}

// boundPoint reads a point's bindings with the grammar: expressions,
// parameters, and the positioned errors.
func boundPoint(text string, env series.Env) (map[string]float64, error) {
	bs, err := parse.Bindings("--at", text, env)
	if err != nil {
		return nil, err
	}
	vals := map[string]float64{}
	for _, b := range bs {
		v, err := b.Value.Float(env)
		if err != nil {
			return nil, usagef("--at %s: %w", text, err)
		}
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, &parse.Error{Label: "--at", Input: text, Msg: fmt.Sprintf("%s is beyond float64's range", b.Name)}
		}
		name := b.Name
		if name == "θ" {
			name = "theta"
		}
		vals[name] = v
	}
	return vals, nil
}

// pointFrom checks the coordinates given and fills both systems.
func pointFrom(text string, vals map[string]float64) (point, error) {
	p := point{Input: text}
	_, hasR := vals["r"]
	_, hasT := vals["theta"]
	_, hasX := vals["x"]
	_, hasY := vals["y"]
	switch {
	case len(vals) == 2 && hasR && hasT:
		p.R, p.Theta = vals["r"], vals["theta"]
		p.X, p.Y = p.R*math.Cos(p.Theta), p.R*math.Sin(p.Theta)
	case len(vals) == 2 && hasX && hasY:
		p.X, p.Y, p.inXY = vals["x"], vals["y"], true
		p.R, p.Theta = math.Hypot(p.X, p.Y), math.Atan2(p.Y, p.X)
		if p.Theta < 0 {
			p.Theta += 2 * math.Pi
		}
	default:
		return point{}, &parse.Error{Label: "--at", Input: text, Offset: len(text), Msg: "give r and theta, or x and y"}
	}
	if p.R < 0 {
		return point{}, &parse.Error{Label: "--at", Input: text, Msg: "r must not be negative"}
	}
	return p, nil
}

// evaluate fills u at each point, summing series to the solution's tolerance.
func evaluate(sol *domain.Solution, pts []point) error {
	env := sol.Options.Env
	if len(pts) == 0 {
		return nil
	}
	ev, err := sol.Evaluator(sol.Options.Terms)
	if err != nil {
		return usagef("--at: %w", err)
	}
	var insideXY func(x, y float64) bool // built once, on the second point in x and y: a holed region's test builds its holes
	for i := range pts {
		var in bool
		if pts[i].inXY && insideXY != nil {
			in = insideXY(pts[i].X, pts[i].Y)
		} else if pts[i].inXY {
			// The first point asks the region itself, which reports what it
			// cannot decide (a parameter without a value) as an error.
			if in, err = domain.ContainsXY(sol.Domain, pts[i].X, pts[i].Y, env); err == nil {
				insideXY = domain.InsideXY(sol.Domain, env)
			}
		} else {
			in, err = sol.Domain.Contains(pts[i].R, pts[i].Theta, env)
		}
		if err != nil {
			return usagef("--at: %w", err)
		}
		if !in {
			return &parse.Error{Label: "--at", Input: pts[i].Input, Msg: "the point lies outside " + sol.Domain.Describe()}
		}
		if reg, est, k, ok := ev.AtSource(pts[i].X, pts[i].Y); ok {
			pts[i].U, pts[i].Error, pts[i].Regular = reg, est, true
			pts[i].strength = sol.Points.Sources[k].Q.Text()
		} else if pts[i].inXY {
			pts[i].U, pts[i].Error, pts[i].Terms = ev.AtXY(pts[i].X, pts[i].Y)
		} else {
			pts[i].U, pts[i].Error, pts[i].Terms = ev.At(pts[i].R, pts[i].Theta)
		}
		pts[i].Error += sol.DataError                                  // the maximum principle bounds the data's error inside
		if e := pts[i].Error; e > 0.5*math.Abs(pts[i].U) && e > 1e-6 { // an estimate the size of the value: no answer
			return &domain.Unsolvable{Reason: fmt.Sprintf("at %s psol finds u = %.6g but cannot vouch for it: the error estimate %.2g is not small against it (a source or data singular, or too rough, for the numeric parts); psol prints no value it cannot stand behind", pts[i].Input, pts[i].U, e)}
		}
		if math.IsNaN(pts[i].U) || math.IsInf(pts[i].U, 0) || math.IsNaN(pts[i].Error) || math.IsInf(pts[i].Error, 0) {
			return &domain.Unsolvable{Reason: fmt.Sprintf("u at %s is not a finite number (u = %g, error %g): the solution there is beyond float64's range, or the source or data are undefined in the region; the exact form, where printed, still holds", pts[i].Input, pts[i].U, pts[i].Error)}
		}
	}
	return nil
}

// plainDecimal reports a number in the grammar's own form, with a sign:
// [+-](d+.d+ | d+ | .d+)([eE][+-]d+).
func plainDecimal(s string) bool {
	if s != "" && (s[0] == '+' || s[0] == '-') {
		s = s[1:]
	}
	digits := func() int {
		n := 0
		for n < len(s) && s[n] >= '0' && s[n] <= '9' {
			n++
		}
		d := n
		s = s[n:]
		return d
	}
	whole := digits()
	if s != "" && s[0] == '.' {
		s = s[1:]
		if digits() == 0 {
			return false
		}
	} else if whole == 0 {
		return false
	}
	if s != "" && (s[0] == 'e' || s[0] == 'E') {
		s = s[1:]
		if s != "" && (s[0] == '+' || s[0] == '-') {
			s = s[1:]
		}
		if digits() == 0 {
			return false
		}
	}
	return s == ""
}
