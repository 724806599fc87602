package quantity

import (
	"strings"
	"testing"
)

func TestBarePrefixHint(t *testing.T) {
	for _, c := range []struct {
		in, want string
	}{
		{"145M", "did you mean 145MHz?"},
		{"14k", "did you mean 14kHz?"},
		{"7m", "did you mean 7MHz?"}, // m is mega for frequencies
	} {
		t.Run(c.in, func(t *testing.T) {
			_, err := ParseFrequency(c.in)
			if err == nil || !strings.Contains(err.Error(), c.want) {
				t.Errorf("ParseFrequency(%q) error %v, want %q", c.in, err, c.want)
			}
		})
	}
}
