package main

import (
	"encoding/json"
	"math"
	"strconv"
	"testing"
)

// The bench jobs stated as a practitioner states them (an invented 2 m
// tank and HF receiver): each gets an answer from one command.

// A 2 m tank covering 144–146 MHz with 15 pF fixed and a 2–10 pF trimmer,
// Q at least 150: candidates with trimmer settings inside the trimmer's
// range at both edges, in JSON with the band and the settings.
func TestDesignBandJSON(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	for _, tc := range []struct {
		name string
		args []string
	}{
		{"--band", []string{"design", "--band", "144-146MHz", "--cap", "15pF", "--trimmer", "2-10pF", "--stray", "2pF", "--min-q", "150", "--leads", "5mm", "--top", "3", "--json"}},
		{"--freq as a band", []string{"design", "--freq", "144-146MHz", "--cap", "15pF", "--trimmer", "2-10pF", "--stray", "2pF", "--min-q", "150", "--leads", "5mm", "--top", "3", "--json"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			out, errOut, code := runCLI(t, tc.args...)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			var doc struct {
				Band       map[string]float64 `json:"band"`
				Candidates []struct {
					Q           float64            `json:"q"`
					Band        map[string]float64 `json:"band"`
					TrimmerLow  *float64           `json:"trimmer_low"`
					TrimmerHigh *float64           `json:"trimmer_high"`
				} `json:"candidates"`
			}
			if err := json.Unmarshal([]byte(out), &doc); err != nil {
				t.Fatal(err)
			}
			if doc.Band["low"] != 144e6 || doc.Band["trimmer_max"] != 10e-12 || len(doc.Candidates) == 0 {
				t.Fatalf("doc %+v", doc)
			}
			for _, c := range doc.Candidates {
				if c.TrimmerLow == nil || c.TrimmerHigh == nil || c.Band["high"] != 146e6 {
					t.Fatalf("candidate without band keys: %+v", c)
				}
				// 10 % of the 8 pF swing kept free at each end.
				if !(*c.TrimmerLow <= 9.2e-12 && *c.TrimmerHigh >= 2.8e-12 && *c.TrimmerLow > *c.TrimmerHigh) {
					t.Errorf("trimmer %g … %g", *c.TrimmerHigh, *c.TrimmerLow)
				}
				if c.Q < 150 {
					t.Errorf("Q %g below 150", c.Q)
				}
			}
		})
	}
}

func TestDesignBandRefusals(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	base := []string{"design", "--leads", "5mm"}
	checkRefusal(t, withArgs(base, "--band", "144-146MHz", "--cap", "15pF"), exitBadInput, "--trimmer")
	checkRefusal(t, withArgs(base, "--band", "146-144MHz", "--cap", "15pF", "--trimmer", "2-10pF"), exitBadInput, "band")
	checkRefusal(t, withArgs(base, "--band", "144-148MHz", "--cap", "47pF", "--trimmer", "2-5pF"), exitInfeasible, "trimmer reaching")
	checkRefusal(t, withArgs(base, "--inductance", "100nH", "--freq", "145MHz", "--loaded-q", "20"), exitBadInput, "--tap-impedance")
}

// A tapped coil for a 50 Ω antenna on the 2 m tank: each candidate has
// its taps, and where none is within ±10 %, a link and a divider.
func TestDesignTappedJSON(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, "design", "--band", "144-146MHz", "--cap", "15pF", "--trimmer", "2-10pF", "--leads", "5mm", "--top", "2", "--tap-impedance", "50ohm", "--json")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Candidates []struct {
			Tap struct {
				Want   float64 `json:"impedance_ratio_wanted"`
				Within bool    `json:"within_tolerance"`
				Taps   []struct {
					Ratio float64 `json:"impedance_ratio"`
					Error float64 `json:"error"`
				} `json:"taps"`
				Link *struct {
					LoadedQ float64 `json:"loaded_q"`
				} `json:"link"`
				Divider *struct {
					C1 float64 `json:"c_top"`
				} `json:"capacitive_divider"`
				WantQ float64 `json:"loaded_q_wanted"`
			} `json:"tap"`
		} `json:"candidates"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	for _, c := range doc.Candidates {
		tp := c.Tap
		if len(tp.Taps) == 0 || tp.Link == nil || tp.Divider == nil {
			t.Fatalf("tap %+v", tp)
		}
		if tp.Within != (math.Abs(tp.Taps[0].Error) <= 0.1) {
			t.Errorf("within %v, error %g", tp.Within, tp.Taps[0].Error)
		}
		if !tp.Within && math.Abs(tp.Link.LoadedQ/tp.WantQ-1) > 0.1 {
			t.Errorf("link gives Q %g, wanted %g", tp.Link.LoadedQ, tp.WantQ)
		}
	}
}

// tap --source for a loaded Q: the nearest tap and its loaded Q; the tap
// re-checks with --at (the impedance ratio printed there is the same).
func TestTapSourceRechecks(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	coilArgs := []string{"tap", "--former", "pvc 20mm", "--wire", "0.5mm", "--turns", "40", "--pitch", "1mm", "--leads", "20mm", "--freq", "7.1MHz"}
	out, errOut, code := runCLI(t, withArgs(coilArgs, "--source", "50ohm", "--tank-q", "150", "--loaded-q", "40", "--json")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		LoadedQ float64 `json:"loaded_q"`
		Plan    struct {
			Taps []struct {
				TapTurns float64 `json:"tap_turns"`
				Ratio    float64 `json:"impedance_ratio"`
			} `json:"taps"`
		} `json:"plan"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Plan.Taps) == 0 || !(doc.LoadedQ > 30 && doc.LoadedQ < 50) {
		t.Fatalf("doc %+v", doc)
	}
	tp := doc.Plan.Taps[0]
	out, errOut, code = runCLI(t, withArgs(coilArgs, "--at", strconv.FormatFloat(tp.TapTurns, 'g', -1, 64), "--json")...)
	if code != exitOK {
		t.Fatalf("--at: exit %d: %s", code, errOut)
	}
	var at struct {
		ImpedanceRatio float64 `json:"impedance_ratio"`
	}
	if err := json.Unmarshal([]byte(out), &at); err != nil {
		t.Fatal(err)
	}
	if math.Abs(at.ImpedanceRatio/tp.Ratio-1) > 1e-9 {
		t.Errorf("tap %g: ratio %g, --at gives %g", tp.TapTurns, tp.Ratio, at.ImpedanceRatio)
	}
	checkRefusal(t, withArgs(coilArgs, "--ratio", "0.2", "--tank-q", "100"), exitBadInput, "--source")
	checkRefusal(t, withArgs(coilArgs, "--source", "50"), exitBadInput, "resistance")
}

// span --choose-coil covers 160/80/40 m where --choose-tap on the same
// coil cannot (exit 3), and --max-harmonic is checked.
func TestSpanChooseCoil(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	bands := []string{"--band", "160m=1.81-2MHz", "--band", "80m=3.5-3.8MHz", "--band", "40m=7-7.2MHz"}
	_, _, code := runCLI(t, withArgs(withArgs(spanArgs, bands...), "--choose-tap")...)
	if code != exitInfeasible {
		t.Fatalf("premise: --choose-tap exit %d", code)
	}
	out, errOut, code := runCLI(t, withArgs(withArgs(spanArgs, bands...), "--choose-coil", "--json")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		ChooseCoil struct {
			Feasible bool    `json:"feasible"`
			Turns    float64 `json:"turns"`
		} `json:"choose_coil"`
		Bands []struct {
			Covered bool `json:"covered"`
		} `json:"bands"`
		MaxHarmonic int `json:"max_harmonic"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if !doc.ChooseCoil.Feasible || doc.ChooseCoil.Turns == 40 || doc.MaxHarmonic != 5 {
		t.Errorf("doc %+v", doc)
	}
	for i, b := range doc.Bands {
		if !b.Covered {
			t.Errorf("band %d not covered", i)
		}
	}
	checkRefusal(t, withArgs(spanArgs, "--tap", "17", "--max-harmonic", "1"), exitBadInput, "--max-harmonic")
	checkRefusal(t, withArgs(spanArgs, "--tap", "17", "--choose-coil"), exitBadInput)
}
