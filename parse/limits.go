package parse

// Limits that keep exact arithmetic bounded; DEVELOPERS.md documents them.
const (
	MaxDecimalExponent = 1000  // |e| in a literal such as 2e5
	MaxExponent        = 1000  // |numerator| and denominator of a power's exponent
	MaxSumPower        = 64    // whole power of an expression that expands: several terms, or a trigonometric factor such as x = r·cos θ
	MaxSize            = 5000  // monomials in an intermediate result
	MaxBits            = 16384 // bits of any numerator or denominator in an intermediate result (about 4900 digits)
	// MaxWork bounds the term products one statement's expansion may do in
	// all (x*x*…*x one factor at a time costs what x^n would): a budget
	// that keeps every input answered or refused in well under a second.
	MaxWork = 20000
	// MaxInput bounds one statement's length in bytes.
	MaxInput = 1 << 16
)
