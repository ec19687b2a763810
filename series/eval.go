package series

import "math"

// Compiled is a sum with float64 coefficients, for fast evaluation.
type Compiled struct {
	t      []cterm
	hasLog bool
}

type cterm struct {
	c, p    float64
	l, k, m int
	sin     bool
	whole   bool // p is a small whole number: r^p by multiplication, not Pow
}

// Compile fixes the parameters from env and rounds the coefficients to float64.
func (s Sum) Compile(env Env) (Compiled, error) {
	out := Compiled{t: make([]cterm, len(s.t))}
	for i, t := range s.t {
		c, err := t.C.Float(env)
		if err != nil {
			return Compiled{}, err
		}
		p, _ := t.power().Float64()
		out.t[i] = cterm{c, p, t.L, t.K, t.M, t.Sin, p == math.Trunc(p) && math.Abs(p) <= 64}
		out.hasLog = out.hasLog || t.L > 0
	}
	return out, nil
}

// At is the value at (r, θ), r > 0 (r = 0 is taken as the limit where it exists).
func (c Compiled) At(r, theta float64) float64 {
	sum := 0.0
	lnr := 0.0
	if c.hasLog {
		lnr = math.Log(r)
	}
	for _, t := range c.t {
		v := t.c
		switch {
		case t.p == 0:
		case r == 0 && t.p > 0:
			continue // r^p (ln r)^j → 0
		case t.whole:
			v *= powInt(r, int64(t.p))
		default:
			v *= math.Pow(r, t.p)
		}
		if t.l > 0 {
			v *= powInt(lnr, int64(t.l))
		}
		if t.k > 0 {
			v *= powInt(theta, int64(t.k))
		}
		if t.m > 0 {
			if t.sin {
				v *= math.Sin(float64(t.m) * theta)
			} else {
				v *= math.Cos(float64(t.m) * theta)
			}
		}
		sum += v
	}
	return sum
}

// Eval is s at (r, θ) with parameters from env.
func (s Sum) Eval(r, theta float64, env Env) (float64, error) {
	c, err := s.Compile(env)
	if err != nil {
		return 0, err
	}
	return c.At(r, theta), nil
}

// Grid adds the sum's values on the tensor grid rs × thetas to out[i][j]:
// every term is a radial factor times an angular one, so the work is
// terms·(len(rs) + len(thetas)) evaluations and one product per point.
func (c Compiled) Grid(rs, thetas []float64, out [][]float64) {
	rf := make([]float64, len(rs))
	tf := make([]float64, len(thetas))
	for _, t := range c.t {
		for i, r := range rs {
			v := t.c
			switch {
			case t.p == 0:
			case r == 0 && t.p > 0:
				v = 0
			default:
				v *= math.Pow(r, t.p)
			}
			if t.l > 0 && v != 0 {
				v *= powInt(math.Log(r), int64(t.l))
			}
			rf[i] = v
		}
		for j, th := range thetas {
			v := 1.0
			if t.k > 0 {
				v = powInt(th, int64(t.k))
			}
			if t.m > 0 {
				if t.sin {
					v *= math.Sin(float64(t.m) * th)
				} else {
					v *= math.Cos(float64(t.m) * th)
				}
			}
			tf[j] = v
		}
		for i := range rs {
			if rf[i] == 0 {
				continue
			}
			row := out[i]
			for j := range thetas {
				row[j] += rf[i] * tf[j]
			}
		}
	}
}
