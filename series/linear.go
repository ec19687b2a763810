package series

// SolveLinear solves the square system a·x = b exactly by Gaussian
// elimination. A column with no pivot is a free unknown, set to 0 and
// listed; ok is false when the system is inconsistent.
func SolveLinear(a [][]Coef, b []Coef) (x []Coef, free []int, ok bool) {
	if len(a) == 1 && len(a[0]) == 1 && !a[0][0].IsZero() { // one mode on one circle: b/a
		if q, isRat := a[0][0].Rat(); isRat && q.Cmp(one) == 0 {
			return []Coef{b[0]}, nil, true
		}
		v, err := b[0].Div(a[0][0])
		return []Coef{v}, nil, err == nil
	}
	n := len(a[0])
	rows := len(a)
	m := make([][]Coef, rows)
	for i := range a {
		m[i] = append(append([]Coef(nil), a[i]...), b[i])
	}
	pivotCol := make([]int, 0, n)
	r := 0
	for c := 0; c < n && r < rows; c++ {
		p := -1
		for i := r; i < rows; i++ {
			if !m[i][c].IsZero() {
				p = i
				break
			}
		}
		if p < 0 {
			free = append(free, c)
			continue
		}
		m[r], m[p] = m[p], m[r]
		for i := 0; i < rows; i++ {
			if i == r || m[i][c].IsZero() {
				continue
			}
			k, _ := m[i][c].Div(m[r][c])
			for j := c; j <= n; j++ {
				m[i][j] = m[i][j].Sub(k.Mul(m[r][j]))
			}
		}
		pivotCol = append(pivotCol, c)
		r++
	}
	for c := len(pivotCol) + len(free); c < n; c++ {
		free = append(free, c)
	}
	for i := r; i < rows; i++ {
		if !m[i][n].IsZero() {
			return nil, nil, false
		}
	}
	x = make([]Coef, n)
	for i, c := range pivotCol {
		x[c], _ = m[i][n].Div(m[i][c])
	}
	return x, free, true
}
