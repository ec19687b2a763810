package cart

import (
	"math"

	"psol/series"
)

// Side is one side of the rectangle [0, L] × [0, H].
type Side int

const (
	Left   Side = iota // x = 0
	Right              // x = L
	Bottom             // y = 0
	Top                // y = H
)

var sideNames = [...]string{"left", "right", "bottom", "top"}

func (s Side) String() string { return sideNames[s] }

// SideSeries is the harmonic function that equals Σ b_n sin(nπs/ℓ) on one
// side and vanishes on the other three (Dirichlet): along the side the
// coordinate s runs over [0, ℓ]; across, the factor
//
//	sinh(nπ d/ℓ)/sinh(nπ w/ℓ),  d the distance from the opposite side, w the width,
//
// is evaluated as e^(−nπ(w−d)/ℓ)(1 − e^(−2nπd/ℓ))/(1 − e^(−2nπw/ℓ)), which
// neither overflows nor loses digits for large n.
type SideSeries struct {
	Side Side
	B    series.Coef // b_n, general in n
	L, H series.Coef
}

// along is the side's length ℓ and the width w across.
func (s SideSeries) along() (l, w series.Coef) {
	if s.Side == Left || s.Side == Right {
		return s.H, s.L
	}
	return s.L, s.H
}

// Text prints the series in psol's syntax.
func (s SideSeries) Text() string {
	l, w := s.along()
	lt, wt := paren(l.Text()), paren(w.Text())
	var sv, d string
	switch s.Side {
	case Bottom:
		sv, d = "x", "("+wt+" - y)"
	case Top:
		sv, d = "x", "y"
	case Left:
		sv, d = "y", "("+wt+" - x)"
	case Right:
		sv, d = "y", "x"
	}
	b := series.Const(s.B).Text()
	if len(b) > 1 && (containsAny(b[1:], " ") || containsAny(b, "/")) {
		b = "(" + b + ")"
	}
	over := "/" + lt
	if lt == "1" {
		over = ""
	}
	return "sum(n=1..inf, " + b + "*sin(n*pi*" + sv + over + ")*sinh(n*pi*" + d + over + ")/sinh(n*pi*" + wt + over + "))"
}

// LaTeX prints the series with \sum.
func (s SideSeries) LaTeX() string {
	l, w := s.along()
	var sv, d string
	switch s.Side {
	case Bottom:
		sv, d = "x", "("+w.LaTeX()+" - y)"
	case Top:
		sv, d = "x", "y"
	case Left:
		sv, d = "y", "("+w.LaTeX()+" - x)"
	case Right:
		sv, d = "y", "x"
	}
	k := `\frac{n \pi}{` + l.LaTeX() + `}`
	return `\sum_{n=1}^{\infty} \left(` + series.Const(s.B).LaTeX() + `\right) \sin\left(` + k + " " + sv + `\right) \frac{\sinh\left(` + k + " " + d + `\right)}{\sinh\left(` + k + " " + w.LaTeX() + `\right)}`
}

func paren(s string) string {
	if containsAny(s, " +-*/") {
		return "(" + s + ")"
	}
	return s
}

func containsAny(s, chars string) bool {
	for _, c := range s {
		for _, d := range chars {
			if c == d {
				return true
			}
		}
	}
	return false
}

// CompiledSide evaluates a side series.
type CompiledSide struct {
	side Side
	b    func(n float64) float64
	l, w float64
	bs   []float64 // cached b_n
}

// Compile fixes parameters for evaluation.
func (s SideSeries) Compile(env series.Env) (*CompiledSide, error) {
	b, err := s.B.IndexFunc(env)
	if err != nil {
		return nil, err
	}
	l, w := s.along()
	lf, err := l.Float(env)
	if err != nil {
		return nil, err
	}
	wf, err := w.Float(env)
	return &CompiledSide{side: s.Side, b: b, l: lf, w: wf}, err
}

func (c *CompiledSide) coef(n int) float64 {
	for len(c.bs) < n {
		c.bs = append(c.bs, c.b(float64(len(c.bs)+1)))
	}
	return c.bs[n-1]
}

// At sums the series at (x, y) until n·|term bound| < tol·max(1, |sum|), at most maxTerms.
func (c *CompiledSide) At(x, y, tol float64, maxTerms int) (sum, tail float64) {
	var s, d float64
	switch c.side {
	case Bottom:
		s, d = x, c.w-y
	case Top:
		s, d = x, y
	case Left:
		s, d = y, c.w-x
	case Right:
		s, d = y, x
	}
	quiet := 0
	tail = math.Inf(1)
	for n := 1; n <= maxTerms; n++ {
		k := float64(n) * math.Pi / c.l
		ratio := math.Exp(-k*(c.w-d)) * (-math.Expm1(-2 * k * d)) / (-math.Expm1(-2 * k * c.w))
		term := c.coef(n) * ratio
		sum += term * math.Sin(k*s)
		tail = float64(n) * math.Abs(term)
		if tail <= tol*math.Max(1, math.Abs(sum)) {
			if quiet++; quiet >= 4 {
				break
			}
		} else {
			quiet = 0
		}
	}
	return sum, tail
}

// Integral is ∬ over the rectangle: Σ b_n · ℓ(1 − (−1)^n)/(nπ) · (ℓ/(nπ)) tanh(nπw/(2ℓ)),
// since ∫_0^w sinh(kd)/sinh(kw) dd = (cosh(kw) − 1)/(k sinh(kw)) = tanh(kw/2)/k.
func (c *CompiledSide) Integral(tol float64, maxTerms int) float64 {
	sum, quiet := 0.0, 0
	for n := 1; n <= maxTerms; n++ {
		k := float64(n) * math.Pi / c.l
		odd := 1 - math.Pow(-1, float64(n))
		term := c.coef(n) * odd / k * math.Tanh(k*c.w/2) / k
		sum += term
		if math.Abs(term)*float64(n) < tol*math.Max(1, math.Abs(sum)) { // even n give 0: ask for a run of small terms
			if quiet++; quiet >= 8 {
				break
			}
		} else {
			quiet = 0
		}
	}
	return sum
}
