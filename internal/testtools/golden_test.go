package testtools

import (
	"strings"
	"testing"
)

func TestSameJSON(t *testing.T) {
	const want = `{
  "schema": 1,
  "inductance": 5.416444327582555e-8,
  "zero": 0,
  "name": "L1 2.5mm",
  "ok": true,
  "rows": [1.5, 2.5],
  "trim_length_per_percent": 0.0000758666050930137
}
`
	looser := map[string]float64{"trim_length_per_percent": 1e-9}
	tests := []struct {
		name    string
		got     string
		wantErr string // empty: equal
	}{
		{"identical", want, ""},
		// Values from a GOAMD64=v3 build of the same golden (2 ulps apart).
		{"fma ulps", strings.Replace(want, "5.416444327582555e-8", "5.416444327582553e-8", 1), ""},
		{"tiny beside zero", strings.Replace(want, `"zero": 0`, `"zero": 1e-30`, 1), ""},
		{"looser key", strings.Replace(want, "0.0000758666050930137", "0.00007586660509232554", 1), ""},
		{"looser key, real change", strings.Replace(want, "0.0000758666050930137", "0.0000758676050930137", 1), "$.trim_length_per_percent"},
		{"relative 1e-9", strings.Replace(want, "5.416444327582555e-8", "5.416444332999e-8", 1), "$.inductance"},
		{"zero against small", strings.Replace(want, `"zero": 0`, `"zero": 1e-13`, 1), "$.zero"},
		{"array element", strings.Replace(want, "[1.5, 2.5]", "[1.5, 2.6]", 1), "$.rows[1]"},
		{"string differs", strings.Replace(want, "L1 2.5mm", "L1 2.6mm", 1), "$.name"},
		{"key renamed", strings.Replace(want, `"ok"`, `"okay"`, 1), "okay"},
		{"bool differs", strings.Replace(want, "true", "false", 1), "$.ok"},
		{"number for string", strings.Replace(want, `"L1 2.5mm"`, `2.5`, 1), "$.name"},
		{"missing element", strings.Replace(want, "[1.5, 2.5]", "[1.5]", 1), "$.rows"},
		{"keys reordered", strings.Replace(strings.Replace(want, `"zero": 0,`, `"ok": true,`, 1), `"ok": true,
  "rows"`, `"zero": 0,
  "rows"`, 1), "$"},
		{"layout", strings.Replace(want, "  \"schema\"", "    \"schema\"", 1), "layout"},
		{"not JSON", `{"a":`, "got"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			err := SameJSON([]byte(tc.got), []byte(want), looser)
			switch {
			case tc.wantErr == "" && err != nil:
				t.Errorf("unexpected difference: %v", err)
			case tc.wantErr != "" && err == nil:
				t.Errorf("difference not found")
			case tc.wantErr != "" && !strings.Contains(err.Error(), tc.wantErr):
				t.Errorf("error %q does not name %q", err, tc.wantErr)
			}
		})
	}
}

func TestSameText(t *testing.T) {
	const want = "outside length 15.26 mm\ncut 139 mm, Q 293\nL = 54.2 nH at 145.0 MHz\n"
	tests := []struct {
		name string
		got  string
		same bool
	}{
		{"identical", want, true},
		// A tie (15.255 mm) rounded the other way by a GOAMD64=v3 build.
		{"tie flipped", strings.Replace(want, "15.26", "15.25", 1), true},
		{"carry", strings.Replace(want, "54.2", "54.3", 1), true},
		{"two units", strings.Replace(want, "15.26", "15.24", 1), false},
		{"more decimals", strings.Replace(want, "15.26", "15.260", 1), false},
		{"integer off by one", strings.Replace(want, "139", "140", 1), true},
		{"integer off by two", strings.Replace(want, "139", "141", 1), false},
		{"unit differs", strings.Replace(want, "nH", "µH", 1), false},
		{"word differs", strings.Replace(want, "cut", "Cut", 1), false},
		{"extra number", want + "1\n", false},
		{"sign", strings.Replace(want, "= 54.2", "= -54.2", 1), false},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			err := SameText(tc.got, want)
			if (err == nil) != tc.same {
				t.Errorf("SameText = %v, want same=%v", err, tc.same)
			}
		})
	}
}
