package domain

import (
	"errors"
	"testing"
)

// A library error keeps its cause (%w): callers test the kind with errors.As
// and still print the one message.
func TestErrorsWrap(t *testing.T) {
	cause := &MissingSides{Sides: []string{"rim"}}
	for _, err := range []error{unsupported("boundary data on %s: %w", "rim", cause), unsolvable("on %s: %w", "rim", cause)} {
		var ms *MissingSides
		if !errors.As(err, &ms) || ms.Sides[0] != "rim" {
			t.Errorf("%T %q does not unwrap to its cause", err, err)
		}
		if want := "rim: " + cause.Error(); err.Error()[len(err.Error())-len(want):] != want {
			t.Errorf("message %q does not end with the cause", err)
		}
	}
}
