package touchstone

import (
	"fmt"
	"math/cmplx"
)

// ToS returns d with its parameters as S at d's reference impedance Z0:
//
//	S = (Z − Z0·I)(Z + Z0·I)⁻¹ = (I − Z0·Y)(I + Z0·Y)⁻¹
//
// (the usual definitions for a common, real reference impedance). S data
// is returned unchanged. A point where the inverse does not exist (an
// active network exactly at −Z0) is an error naming its frequency.
func (d Data) ToS() (Data, error) {
	if d.Param == S {
		return d, nil
	}
	out := d
	out.Param = S
	out.Points = make([]Point, len(d.Points))
	z0 := complex(d.Z0, 0)
	for k, p := range d.Points {
		var a, b [2][2]complex128 // S = a·b⁻¹
		for i := range d.Ports {
			for j := range d.Ports {
				var id complex128
				if i == j {
					id = 1
				}
				switch d.Param {
				case Z:
					a[i][j] = p.M[i][j] - z0*id
					b[i][j] = p.M[i][j] + z0*id
				case Y:
					a[i][j] = id - z0*p.M[i][j]
					b[i][j] = id + z0*p.M[i][j]
				default:
					return Data{}, fmt.Errorf("%w: parameter %q", ErrData, string(d.Param))
				}
			}
		}
		out.Points[k].Frequency = p.Frequency
		if d.Ports == 1 {
			if b[0][0] == 0 {
				return Data{}, fmt.Errorf("%w: no S parameters at %g Hz (Z = −Z0)", ErrData, p.Frequency)
			}
			out.Points[k].M[0][0] = a[0][0] / b[0][0]
			continue
		}
		det := b[0][0]*b[1][1] - b[0][1]*b[1][0]
		if det == 0 || cmplx.IsNaN(det) {
			return Data{}, fmt.Errorf("%w: no S parameters at %g Hz", ErrData, p.Frequency)
		}
		inv := [2][2]complex128{{b[1][1] / det, -b[0][1] / det}, {-b[1][0] / det, b[0][0] / det}}
		for i := range 2 {
			for j := range 2 {
				out.Points[k].M[i][j] = a[i][0]*inv[0][j] + a[i][1]*inv[1][j]
			}
		}
	}
	return out, nil
}
