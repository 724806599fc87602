package coil

import "testing"

// Wheeler 1928 claims about 1 % for coils longer than 0.8 of their radius
// (Proc. IRE 16, p. 1398); check it against the exact current sheet.
func TestWheelerClaim(t *testing.T) {
	t.Parallel()
	const wheelerTol = 0.01 // Wheeler's own claim
	for ld := 0.41; ld <= 100; ld *= 1.05 {
		d := 0.02
		w, valid := Wheeler(10, d, ld*d)
		if !valid {
			t.Fatalf("l/D=%g reported outside Wheeler's range", ld)
		}
		if e := relErr(w, SheetInductance(10, d, ld*d)); e > wheelerTol {
			t.Errorf("l/D=%.3g: Wheeler off by %.2f %%", ld, e*100)
		}
	}
	if _, valid := Wheeler(10, 0.02, 0.007); valid {
		t.Error("l = 0.7a reported inside Wheeler's range")
	}
}
