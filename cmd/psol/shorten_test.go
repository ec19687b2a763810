package main

import (
	"bytes"
	"encoding/json"
	"strings"
	"testing"
)

// A numeric sum of hundreds of terms prints its first terms and what
// follows in text; JSON keeps every term. (A kink's trace with numeric
// data: the FFT of both, some hundred modes.)
func TestLongNumericSumsShortened(t *testing.T) {
	args := []string{"solve", "lap(u) = abs(y - 0.3)", "--disk", "1", "--bc", "u = exp(x)"}
	var text, js bytes.Buffer
	if code := run(args, &text, &text); code != 0 {
		t.Fatalf("exit %d: %s", code, text.String())
	}
	var trace string
	for _, l := range strings.Split(text.String(), "\n") {
		if strings.HasPrefix(l, "trace") {
			trace = l
		}
	}
	if !strings.Contains(trace, "more terms, each coefficient at most") || len(trace) > 1000 {
		t.Errorf("trace line of %d bytes, want the first terms and a count: %s", len(trace), trace)
	}
	_, sum, _ := strings.Cut(trace, "≈")
	if got := strings.Count(sum, "theta)"); got != shownTerms-1 { // the constant, then the sines and cosines shown
		t.Errorf("%d angular terms shown, want %d", got, shownTerms-1)
	}
	if code := run(append(args, "--format", "json"), &js, &js); code != 0 {
		t.Fatalf("exit %d: %s", code, js.String())
	}
	var out struct {
		Trace struct{ Text string } `json:"trace"`
	}
	if err := json.Unmarshal(js.Bytes(), &out); err != nil {
		t.Fatal(err)
	}
	if n := strings.Count(out.Trace.Text, "theta)"); n < 200 || strings.Contains(out.Trace.Text, "…") {
		t.Errorf("JSON trace has %d terms (want them all, no ellipsis)", n)
	}
}

func TestSplitTerms(t *testing.T) {
	got := splitTerms("a + b*(c - d) - e + f(g + h)")
	want := []string{"a", " + b*(c - d)", " - e", " + f(g + h)"}
	if strings.Join(got, "|") != strings.Join(want, "|") {
		t.Errorf("splitTerms = %q, want %q", got, want)
	}
}
