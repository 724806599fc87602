package forms

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/unit"
)

// TestEnamelTableShape checks the recalled table for the properties any
// enamel table has: the build (overall minus nominal) never shrinks as the
// wire gets thicker, and a heavier grade is always thicker.
func TestEnamelTableShape(t *testing.T) {
	t.Parallel()
	d := loadBuiltin()
	if d.err != nil {
		t.Fatal(d.err)
	}
	// Builds are whole micrometres in the table; compare with that resolution.
	const buildTol = 0.5e-6
	for i, r := range d.enamel {
		b1, b2 := r.grade1-r.nominal, r.grade2-r.nominal
		if !(b2 > b1 && b1 > 0) {
			t.Errorf("row %d (%v): builds %v, %v; want 0 < grade1 < grade2", i, r.nominal, b1, b2)
		}
		if i == 0 {
			continue
		}
		p := d.enamel[i-1]
		if float64(b1-(p.grade1-p.nominal)) < -buildTol || float64(b2-(p.grade2-p.nominal)) < -buildTol {
			t.Errorf("row %d (%v): build shrinks from the row before", i, r.nominal)
		}
	}
}

func TestEnamelOverall(t *testing.T) {
	t.Parallel()
	const mmM = 1e-3
	cases := []struct {
		name  string
		bare  unit.Length
		grade string
		want  float64 // m
		err   string
	}{
		{name: "tabulated grade1", bare: 1.00 * mmM, grade: "grade1", want: 1.062 * mmM},      // IEC 60317-0-1 (from memory), data/enamel.csv
		{name: "tabulated grade2", bare: 1.00 * mmM, grade: "grade2", want: 1.094 * mmM},      // IEC 60317-0-1 (from memory), data/enamel.csv
		{name: "first row", bare: 0.050 * mmM, grade: "grade1", want: 0.060 * mmM},            // IEC 60317-0-1 (from memory), data/enamel.csv
		{name: "last row", bare: 3.15 * mmM, grade: "grade2", want: 3.276 * mmM},              // IEC 60317-0-1 (from memory), data/enamel.csv
		{name: "interpolated", bare: 1.06 * mmM, grade: "grade1", want: (1.06 + 0.063) * mmM}, // build halfway between 0.062 (1.00) and 0.064 (1.12)
		{name: "none", bare: 5 * mmM, grade: "none", want: 5 * mmM},
		{name: "too thin", bare: 0.04 * mmM, grade: "grade1", err: "outside the enamel table"},
		{name: "too thick", bare: 3.2 * mmM, grade: "grade1", err: "outside the enamel table"},
		{name: "grade3", bare: 1 * mmM, grade: "grade3", err: "grade3 is not in the built-in table"},
		{name: "unknown grade", bare: 1 * mmM, grade: "thick", err: "use none, grade1, grade2 or grade3"},
		{name: "nan", bare: unit.Length(math.NaN()), grade: "grade1", err: "must be a positive length"},
		{name: "negative", bare: -1 * mmM, grade: "grade1", err: "must be a positive length"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, err := EnamelOverall(tc.bare, tc.grade)
			if tc.err != "" {
				if err == nil || !strings.Contains(err.Error(), tc.err) {
					t.Fatalf("EnamelOverall(%v, %q) error = %v, want %q", tc.bare, tc.grade, err, tc.err)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			if !closeRel(float64(got), tc.want, implTol) {
				t.Errorf("EnamelOverall(%v, %q) = %.6g m, want %.6g m", tc.bare, tc.grade, float64(got), tc.want)
			}
		})
	}
}

func TestParseInsulation(t *testing.T) {
	t.Parallel()
	const bare = unit.Length(1e-3)
	g1, _ := EnamelOverall(bare, "grade1")
	g2, _ := EnamelOverall(bare, "grade2")
	cases := []struct {
		name  string
		in    string
		want  unit.Length
		label string
		err   string
	}{
		{name: "none", in: "none", want: bare, label: "none"},
		{name: "bare", in: "Bare", want: bare, label: "none"},
		{name: "grade1", in: "grade1", want: g1, label: "grade1"},
		{name: "g1", in: "g1", want: g1, label: "grade1"},
		{name: "single", in: "single", want: g1, label: "grade1"},
		{name: "spaced", in: "Grade 1", want: g1, label: "grade1"},
		{name: "heavy", in: "heavy", want: g2, label: "grade2"},
		{name: "g2", in: "g2", want: g2, label: "grade2"},
		{name: "overall", in: "1.06mm", want: 1.06e-3, label: "custom"},
		{name: "overall equal to bare", in: "1mm", want: bare, label: "none"},
		{name: "grade3", in: "grade3", err: "give the measured overall diameter"},
		{name: "smaller than bare", in: "0.9mm", err: "less than the bare 1mm"},
		{name: "word", in: "teflon", err: "use none, grade1, grade2, grade3 or the overall diameter"},
		{name: "number without unit", in: "1.06", err: "add a unit"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, label, err := ParseInsulation(tc.in, bare)
			if tc.err != "" {
				if err == nil || !strings.Contains(err.Error(), tc.err) {
					t.Fatalf("ParseInsulation(%q) error = %v, want %q", tc.in, err, tc.err)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			if label != tc.label || !closeRel(float64(got), float64(tc.want), implTol) {
				t.Errorf("ParseInsulation(%q) = %v, %q; want %v, %q", tc.in, got, label, tc.want, tc.label)
			}
		})
	}
}
