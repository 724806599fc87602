package report

import "testing"

func TestOneTo(t *testing.T) {
	for _, c := range []struct {
		r    float64
		want string
	}{
		{0.2, "1:5"},
		{1 / 4.41, "1:4.41"},
		{1 / 1222.0, "1:1220"}, // was printed 1:1.22e+03
		{1 / 44100.0, "1:44100"},
	} {
		t.Run(c.want, func(t *testing.T) {
			if got := OneTo(c.r); got != c.want {
				t.Errorf("OneTo(%g) = %q, want %q", c.r, got, c.want)
			}
		})
	}
}
