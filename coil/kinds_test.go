package coil

import (
	"encoding/json"
	"strings"
	"testing"
)

func TestEnumsParseAndPrint(t *testing.T) {
	// The words are the ones turnwise has always written to JSON and
	// printed (the project's own records; common practice to keep them).
	tests := []struct {
		name  string
		parse func(string) (string, error)
		words []string
	}{
		{"support kind", func(s string) (string, error) { v, err := ParseSupportKind(s); return v.String(), err }, []string{"mandrel", "former"}},
		{"pitch source", func(s string) (string, error) { v, err := ParsePitchSource(s); return v.String(), err }, []string{"pitch", "length", "close-wound"}},
		{"springback source", func(s string) (string, error) { v, err := ParseSpringbackSource(s); return v.String(), err }, []string{"given", "calibration", "none", "former"}},
		{"mounting", func(s string) (string, error) { v, err := ParseMounting(s); return v.String(), err }, []string{"grounded", "floating"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			for _, w := range tc.words {
				got, err := tc.parse(" " + strings.ToUpper(w) + " ")
				if err != nil || got != w {
					t.Errorf("parse %q = %q, %v; want %q", w, got, err, w)
				}
			}
			_, err := tc.parse("bogus")
			if err == nil {
				t.Fatal("bogus accepted")
			}
			msg := err.Error()
			if !strings.Contains(msg, tc.name) || !strings.Contains(msg, `"bogus"`) || !strings.Contains(msg, strings.Join(tc.words, ", ")) {
				t.Errorf("error %q should name %s, the word and every choice", msg, tc.name)
			}
		})
	}
}

func TestEnumsJSON(t *testing.T) {
	type rec struct {
		S SupportKind      `json:"s"`
		P PitchSource      `json:"p"`
		B SpringbackSource `json:"b"`
		M Mounting         `json:"m"`
	}
	in := rec{SupportFormer, PitchCloseWound, SpringbackCalibration, Floating}
	b, err := json.Marshal(in)
	if err != nil {
		t.Fatal(err)
	}
	const want = `{"s":"former","p":"close-wound","b":"calibration","m":"floating"}`
	if string(b) != want {
		t.Errorf("marshal = %s, want %s", b, want)
	}
	var out rec
	if err := json.Unmarshal(b, &out); err != nil || out != in {
		t.Errorf("round trip = %+v, %v; want %+v", out, err, in)
	}
	if err := json.Unmarshal([]byte(`{"s":"table"}`), &out); err == nil {
		t.Error(`support kind "table" accepted`)
	}
	if _, err := json.Marshal(rec{M: Mounting(7)}); err == nil {
		t.Error("out-of-range mounting marshalled")
	}
	var zero Mounting
	if zero != Grounded {
		t.Error("the zero Mounting must be Grounded (the default)")
	}
}
