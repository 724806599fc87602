package report

import (
	"testing"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Lengths print to the resolution they were rounded to (review of #5:
// 0.05 mm printed three decimals).
func TestFmtLenStep(t *testing.T) {
	t.Parallel()
	mm := quantity.LengthFormat{}
	tests := []struct {
		name   string
		length float64
		step   float64
		want   string
	}{
		{"tenth", 9.7e-3, 0.1e-3, "9.7 mm"},
		{"twentieth", 5.45e-3, 0.05e-3, "5.45 mm"},
		{"fiftieth", 5.46e-3, 0.02e-3, "5.46 mm"},
		{"hundredth", 5.47e-3, 0.01e-3, "5.47 mm"},
		{"whole", 12e-3, 1e-3, "12 mm"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			if got := fmtLenStep(mm, tc.length, unit.Length(tc.step)); got != tc.want {
				t.Errorf("got %q, want %q", got, tc.want)
			}
		})
	}
}
