package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// trimData is this command's own test data.
var trimData = filepath.Join("..", "..", "testdata", "trim")

// trimDoneWhen is the acceptance case: a coil designed for 48 nH
// that measures 52 nH. The coil: 4 turns of 1 mm bare copper on a 4.6 mm
// rod, 8 mm long outside, 5 mm leads, for which the model gives 49.1 nH
// (47.8 nH before the helix pitch correction: at p = 2.33 mm = 0.4·D the
// rings read 2.3 % low against the helix Neumann integral).
var trimDoneWhen = []string{"trim", "--mandrel", "4.6mm", "--wire", "1mm", "--turns", "4", "--length", "8mm", "--leads", "5mm",
	"--measured-l", "52nH", "--target", "48nH"}

// vhfTrim is the README's VHF coil at 145 MHz.
var vhfTrim = []string{"trim", "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm", "--freq", "145MHz"}

func TestTrimGolden(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	job := filepath.Join(trimData, "job.toml")
	tests := []struct {
		name   string
		args   []string
		golden string
	}{
		{"done when", trimDoneWhen, "trim_done.txt"},
		{"done when json", withArgs(trimDoneWhen, "--json"), "trim_done.json"},
		{"resonance with a test capacitor", withArgs(vhfTrim, "--measured-f", "101.5MHz", "--with-cap", "22pF", "--stray", "1.5pF"), "trim_resonance.txt"},
		{"two capacitors", []string{"trim", "--former", "25mm", "--wire", "22awg", "--turns", "30", "--leads", "20mm", "--freq", "3.7MHz",
			"--resonance", "2.0MHz@330pF", "--resonance", "0.9435MHz@1.5nF", "--cap-tol", "1%", "--stray", "3pF"}, "trim_two_cap.txt"},
		{"add turns, inches", withArgs(vhfTrim, "--measured-l", "101nH", "--target", "130nH", "--units", "in"), "trim_add_turns_in.txt"},
		{"remove turns", withArgs(vhfTrim, "--measured-l", "101nH", "--target", "60nH"), "trim_remove_turns.txt"},
		{"job, tapped, sections", []string{"trim", "--job", job, "--coil", "input", "--measured-l", "92nH", "--measured-bottom", "14nH", "--measured-top", "69nH"}, "trim_job_tap.txt"},
		{"job, in circuit, resonance target", []string{"trim", "--job", job, "--coil", "output", "--measured-f", "131MHz", "--circuit-cap", "17pF", "--target", "137.5MHz"}, "trim_in_circuit.txt"},
		{"on target", withArgs(vhfTrim, "--measured-l", "102.4nH"), "trim_none.txt"}, // the model expects 102.3 nH (101.5 before the helix pitch correction)
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) { checkGoldenRun(t, tc.args, tc.golden) })
	}
}

// report.TrimRecord runs trim with --json and decodes the document.
func trimDoc(t *testing.T, args ...string) map[string]any {
	t.Helper()
	out, errOut, code := runCLI(t, withArgs(args, "--json")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	return doc
}

func num(t *testing.T, doc map[string]any, key string) float64 {
	t.Helper()
	v, ok := doc[key].(float64)
	if !ok || math.IsNaN(v) || math.IsInf(v, 0) {
		t.Fatalf("key %q = %v, not a finite number", key, doc[key])
	}
	return v
}

// The Done-when: one clear instruction that lands within 0.5 % of
// 48 nH, and every key the issue lists. A spread would end at pitch 2.90 mm
// of a 3.00 mm window, inside trim.WindowMargin of its loose end, so the
// instruction is a quarter turn less spread into the window (issue 10).
func TestTrimDoneWhen(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	doc := trimDoc(t, trimDoneWhen...)
	// Spreading cannot reach 48 nH: calibrated to the 52 nH reading (mean
	// diameter 5.82 mm), the helix Neumann integral gives 48.41 nH at the
	// window's loosest pitch, 3.00 mm (the model 48.41 nH; Rosa's rings
	// alone 46.36 nH, which made "spread to 9.7 mm" the old answer), and
	// its least over every pitch, 46.3 nH, lies at p ≈ 4–5 mm, past an even
	// spread. A quarter turn off at 7.7 mm (pitch 2.44 mm) gives 47.95 nH
	// by the integral: remove ¼ turn is the right correction
	// (coil/helix_neumann_test.go's helixNeumann, run for these numbers).
	if doc["action"] != "remove_turns" || num(t, doc, "new_turns") != 3.75 {
		t.Errorf("action %v to %v turns, want remove_turns to 3.75", doc["action"], doc["new_turns"])
	}
	if w := num(t, doc, "window_least"); math.Abs(w/48.41e-9-1) > 0.002 { // the helix integral's 48.41 nH, above
		t.Errorf("window least %g, want 48.41 nH", w)
	}
	ins, _ := doc["instruction"].(string)
	if !strings.HasPrefix(ins, "remove ¼ turn (3¾ turns left) and set 7.7 mm outside length") || !strings.Contains(ins, "outside length; expect 48") {
		t.Errorf("instruction %q", ins)
	}
	if p := num(t, doc, "new_pitch"); p < 1e-3+0.1*2e-3 || p > 3e-3-0.1*2e-3 { // window 1.00 … 3.00 mm, 10 % margins
		t.Errorf("new pitch %g m inside the window's margins", p)
	}
	if got := num(t, doc, "predicted_inductance"); math.Abs(got/48e-9-1) > 0.005 { // the 0.5 %
		t.Errorf("predicted %g, want 48 nH within 0.5 %%", got)
	}
	if l0, l1 := num(t, doc, "winding_length"), num(t, doc, "new_winding_length"); math.Abs(l1-7.7e-3) > 1e-9 || !(l1 < l0) {
		t.Errorf("winding length from %g to %g, want 7.7 mm", l0, l1)
	}
	if got := num(t, doc, "measured_inductance"); got != 52e-9 {
		t.Errorf("measured_inductance %g, want the 52 nH reading", got)
	}
	for _, k := range []string{"effective_diameter", "springback", "new_turns", "predicted_inductance", "trim_length_per_percent"} {
		if num(t, doc, k) <= 0 {
			t.Errorf("%s is not positive", k)
		}
	}
	if _, ok := doc["warnings"].([]any); !ok {
		t.Error("warnings is not an array")
	}
	if doc["schema"] != float64(report.SchemaVersion) {
		t.Error("schema missing")
	}
	// stray_capacitance appears with two resonances only.
	if _, ok := doc["stray_capacitance"]; ok {
		t.Error("stray_capacitance without a two-capacitor measurement")
	}
	two := trimDoc(t, "trim", "--former", "25mm", "--wire", "22awg", "--turns", "30", "--leads", "20mm",
		"--resonance", "2.0MHz@330pF", "--resonance", "0.9435MHz@1.5nF")
	if c := num(t, two, "stray_capacitance"); c <= 0 || c > 20e-12 {
		t.Errorf("stray_capacitance %g", c)
	}
}

// The two-capacitor hand-worked example of coil/trim_test.go through the
// command line: L = 2.2782 µH and C0 = 11.184 pF (hand calculation there).
func TestTrimTwoCapacitorHandWorked(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	// A coil near 2.3 µH: 10 turns of 22awg close-wound on a 20 mm former.
	doc := trimDoc(t, "trim", "--former", "20mm", "--wire", "22awg", "--turns", "10", "--leads", "10mm",
		"--resonance", "10MHz@100pF", "--resonance", "5.2MHz@400pF")
	const handTol = 5e-5 // five significant figures in the hand arithmetic
	if l := num(t, doc, "measured_inductance"); math.Abs(l/2.2782e-6-1) > handTol {
		t.Errorf("L %g, want 2.2782 µH", l)
	}
	if c := num(t, doc, "stray_capacitance"); math.Abs(c/11.184e-12-1) > handTol {
		t.Errorf("C0 %g, want 11.184 pF", c)
	}
}

// Bad input: one line naming the flag, exit 2, nothing on stdout.
func TestTrimBadInput(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	job := filepath.Join(trimData, "job.toml")
	coilFlags := []string{"trim", "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm"}
	tests := []struct {
		name     string
		args     []string
		wantText string
	}{
		{"larger capacitor higher resonance", withArgs(coilFlags, "--resonance", "98MHz@22pF", "--resonance", "120MHz@47pF"), "--resonance: the larger capacitor (47 pF) gave the same or a higher resonance"},
		{"same capacitor twice", withArgs(coilFlags, "--resonance", "98MHz@22pF", "--resonance", "97MHz@22pF"), "--resonance"},
		{"no measurement", coilFlags, "give a measurement"},
		{"two measurements", withArgs(coilFlags, "--measured-l", "90nH", "--resonance", "98MHz@22pF"), "give one measurement"},
		{"frequency without a capacitor", withArgs(coilFlags, "--measured-f", "98MHz"), "--measured-f needs"},
		{"capacitor without a frequency", withArgs(coilFlags, "--measured-l", "90nH", "--with-cap", "22pF"), "--with-cap"},
		{"resonance without @", withArgs(coilFlags, "--resonance", "98MHz"), "--resonance"},
		{"resonance with a bad unit", withArgs(coilFlags, "--resonance", "98MHz@22nH"), "--resonance"},
		{"frequency target without a circuit", withArgs(coilFlags, "--measured-l", "90nH", "--target", "145MHz"), "--circuit-cap"},
		{"target neither L nor f", withArgs(coilFlags, "--measured-l", "90nH", "--target", "22pF"), "--target"},
		{"fixture above the reading", withArgs(coilFlags, "--measured-l", "90nH", "--fixture-l", "95nH"), "--fixture-l"},
		{"reading no coil like this gives", withArgs(coilFlags, "--measured-l", "5uH"), "--measured-l"},
		{"reading in henries", withArgs(coilFlags, "--measured-l", "90"), "--measured-l"},
		{"resonance above the self-resonance", withArgs(coilFlags, "--measured-f", "5GHz", "--with-cap", "0.1pF"), "--measured-f"},
		{"stray with a meter", withArgs(coilFlags, "--measured-l", "90nH", "--stray", "2pF"), "--stray"},
		{"meter frequency with a resonance", withArgs(coilFlags, "--measured-f", "98MHz", "--with-cap", "22pF", "--meter-freq", "1MHz"), "--meter-freq"},
		{"capacitor tolerance too wide", withArgs(coilFlags, "--measured-f", "98MHz", "--with-cap", "22pF", "--cap-tol", "80%"), "--cap-tol"},
		{"save without a stock file", withArgs(coilFlags, "--measured-l", "90nH", "--save"), "--save"},
		{"sections without a tap", withArgs(coilFlags, "--measured-l", "90nH", "--measured-bottom", "20nH"), "--tap"},
		{"tap beyond the coil", withArgs(coilFlags, "--measured-l", "90nH", "--tap", "9"), "--tap"},
		{"tap ratio above one", withArgs(coilFlags, "--measured-l", "90nH", "--tap", "1", "--tap-ratio", "1.5"), "--tap-ratio"},
		{"job without coil", []string{"trim", "--job", job, "--measured-l", "90nH"}, "--coil"},
		{"job and coil flags", []string{"trim", "--job", job, "--coil", "input", "--turns", "6", "--measured-l", "90nH"}, "--turns"},
		{"coil without job", withArgs(coilFlags, "--coil", "input", "--measured-l", "90nH"), "--job"},
		{"unknown job coil", []string{"trim", "--job", job, "--coil", "inptu", "--measured-l", "90nH"}, "did you mean \"input\"?"},
		{"job coil is a design target", []string{"trim", "--job", job, "--coil", "middle", "--measured-l", "90nH"}, "design target"},
		{"missing job file", []string{"trim", "--job", "nope.toml", "--coil", "input", "--measured-l", "90nH"}, "nope.toml"},
		{"pitch below wire", withArgs(coilFlags, "--measured-l", "90nH", "--pitch", "0.5mm"), "--pitch"},
		// Review of issue #5: each names the flag that is wrong.
		{"circuit capacitance unused", withArgs(coilFlags, "--measured-l", "90nH", "--circuit-cap", "22pF"), "--circuit-cap"},
		{"circuit capacitance beside a test capacitor", withArgs(coilFlags, "--measured-f", "98MHz", "--with-cap", "22pF", "--circuit-cap", "22pF"), "--circuit-cap"},
		{"resonance target of zero", withArgs(coilFlags, "--measured-l", "90nH", "--target", "0MHz", "--circuit-cap", "22pF"), "--target 0MHz"},
		{"resonance target above the self-resonance", withArgs(coilFlags, "--measured-l", "90nH", "--target", "2GHz", "--circuit-cap", "22pF"), "--target"},
		{"negative stray", withArgs(coilFlags, "--measured-f", "98MHz", "--with-cap", "22pF", "--stray", "-1pF"), "--stray"},
		{"meter frequency near the self-resonance", withArgs(coilFlags, "--measured-l", "90nH", "--meter-freq", "1GHz"), "--meter-freq: the meter's test frequency"},
		{"capacitors too close", withArgs(coilFlags, "--resonance", "100MHz@22pF", "--resonance", "99.9MHz@22.05pF"), "capacitors further apart"},
		{"save into a missing directory", withArgs(coilFlags, "--measured-l", "90nH", "--stock", filepath.Join("no-such-dir", "s.toml"), "--save"), "no-such-dir does not exist"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) { checkRefusal(t, tc.args, exitBadInput, tc.wantText) })
	}
}

// A target no turns change reaches is exit 3, saying what binds.
func TestTrimInfeasible(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(vhfTrim, "--measured-l", "101nH", "--target", "5uH")...)
	if code != exitInfeasible || out != "" || !strings.Contains(errOut, "self-resonance") {
		t.Errorf("exit %d, stdout %q, stderr %q", code, out, errOut)
	}
}

// copyFile copies testdata into a temporary directory with mode perm.
func copyFile(t *testing.T, src, dst string, perm os.FileMode) []byte {
	t.Helper()
	b, err := os.ReadFile(src)
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(dst, b, perm); err != nil {
		t.Fatal(err)
	}
	return b
}

// predictDoc runs predict --json.
func predictDoc(t *testing.T, args ...string) map[string]any {
	t.Helper()
	out, errOut, code := runCLI(t, withArgs(append([]string{"predict"}, args...), "--json")...)
	if code != exitOK {
		t.Fatalf("predict exit %d: %s", code, errOut)
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	return doc
}

// --save round trip: predict a coil with a known springback, feed its
// inductance to trim as the reading, save; the stock file keeps its text
// and comments, the old one is kept as .bak, and predict then uses the
// saved springback and says so.
func TestTrimSave(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	stock := filepath.Join(dir, "stock.toml")
	orig := copyFile(t, filepath.Join(trimData, "stock.toml"), stock, 0o600)
	coilArgs := []string{"--mandrel", "steel rod", "--wire", "bench copper", "--turns", "6", "--length", "11mm", "--leads", "5mm", "--stock", stock}

	const sb = 0.045
	truth := predictDoc(t, withArgs(coilArgs, "--springback", "4.5%")...)
	reading := num(t, truth, "inductance")
	before := predictDoc(t, coilArgs...)
	if before["springback_source"] != "calibration" || num(t, before, "springback") != 0.02 {
		t.Fatalf("the test stock's own calibration (2 %%) is not in use: %v %v", before["springback_source"], before["springback"])
	}

	args := append([]string{"trim"}, withArgs(coilArgs, "--measured-l", strconv.FormatFloat(reading*1e9, 'g', 12, 64)+"nH", "--save")...)
	out, errOut, code := runCLI(t, args...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	for _, want := range []string{"SAVED", "springback 4.50% for steel rod and bench copper in " + stock, "kept as " + stock + ".bak", "supersedes"} {
		if !strings.Contains(out, want) {
			t.Errorf("output lacks %q:\n%s", want, out)
		}
	}
	got, err := os.ReadFile(stock)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(got, orig) {
		t.Error("the stock file's text and comments were not kept")
	}
	if !bytes.Contains(got, []byte(`springback = "4.50%"`)) {
		t.Errorf("no saved springback in:\n%s", got)
	}
	if bak, err := os.ReadFile(stock + ".bak"); err != nil || !bytes.Equal(bak, orig) {
		t.Errorf("backup: %v (equal %v)", err, bytes.Equal(bak, orig))
	}
	if st, err := os.Stat(stock); err != nil || st.Mode().Perm() != 0o600 {
		t.Errorf("permissions not kept: %v %v", st.Mode(), err)
	}
	ents, _ := os.ReadDir(dir)
	if len(ents) != 2 {
		t.Errorf("files left in the directory: %v", ents)
	}

	after := predictDoc(t, coilArgs...)
	if after["springback_source"] != "calibration" || math.Abs(num(t, after, "springback")-sb) > 0.00005 {
		t.Errorf("predict after save: springback %v from %v, want 4.5 %% from the calibration", after["springback"], after["springback_source"])
	}
	if math.Abs(num(t, after, "inductance")/reading-1) > 1e-3 { // 4.50 % is saved to two decimals
		t.Errorf("predict after save gives %g, the reading was %g", num(t, after, "inductance"), reading)
	}
	table, _, _ := runCLI(t, append([]string{"predict"}, coilArgs...)...)
	if !strings.Contains(table, "4.5 % (your saved calibration: trim: meter") {
		t.Errorf("predict does not say it uses the saved calibration:\n%s", table)
	}
}

// --save into a file that does not exist yet creates it; a mandrel and a
// wire given as bare sizes become rows of their own so that the next
// predict with the same flags finds the calibration.
func TestTrimSaveNewFile(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	stock := filepath.Join(t.TempDir(), "new.toml")
	out, errOut, code := runCLI(t, withArgs(trimDoneWhen, "--stock", stock, "--save")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	if strings.Contains(out, "kept as") || !strings.Contains(out, `mandrel "4.6mm rod"`) {
		t.Errorf("a new file has no backup, and the rod is added:\n%s", out)
	}
	doc := predictDoc(t, "--mandrel", "4.6mm", "--wire", "1mm", "--turns", "4", "--length", "8mm", "--leads", "5mm", "--stock", stock)
	// The saved springback is trim's, as the stock file rounds it (4.72 %
	// with the helix pitch correction; 6.56 % before it).
	cal := trimDoc(t, trimDoneWhen...)
	if doc["springback_source"] != "calibration" || math.Abs(num(t, doc, "springback")-num(t, cal, "springback")) > 1e-4 { // the stock file keeps 0.01 %
		t.Errorf("predict: springback %v from %v, want trim's %v", doc["springback"], doc["springback_source"], cal["springback"])
	}
	// The correction, re-predicted with the saved calibration, lands on
	// the 48 nH target (the done-when, within its 0.5 %).
	re := predictDoc(t, "--mandrel", "4.6mm", "--wire", "1mm", "--turns", "3.75", "--length", "7.7mm", "--leads", "5mm", "--stock", stock)
	if l := num(t, re, "inductance"); math.Abs(l/48e-9-1) > 0.005 {
		t.Errorf("re-predicted %g, want 48 nH within 0.5 %%", l)
	}
	if _, err := os.Stat(stock + ".bak"); !os.IsNotExist(err) {
		t.Errorf("backup of a file that did not exist: %v", err)
	}
	// CRLF files stay CRLF.
	crlf := filepath.Join(t.TempDir(), "crlf.toml")
	copyFile(t, filepath.Join(trimData, "stock-crlf.toml"), crlf, 0o644)
	if _, errOut, code := runCLI(t, "trim", "--mandrel", "steel rod", "--wire", "1mm", "--turns", "5", "--length", "9mm", "--leads", "5mm",
		"--measured-l", "110nH", "--stock", crlf, "--save"); code != exitOK {
		t.Fatalf("crlf: exit %d: %s", code, errOut)
	}
	b, _ := os.ReadFile(crlf)
	if n := bytes.Count(b, []byte("\n")) - bytes.Count(b, []byte("\r\n")); n != 0 {
		t.Errorf("%d bare line feeds in a CRLF file", n)
	}
}

// A stock file turnwise cannot append to is left alone: exit 2, no
// backup, no temporary file, and nothing on stdout.
func TestTrimSaveRefused(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	stock := filepath.Join(dir, "inline.toml")
	orig := copyFile(t, filepath.Join(trimData, "stock-inline.toml"), stock, 0o644)
	out, errOut, code := runCLI(t, withArgs(vhfTrim, "--measured-l", "97nH", "--stock", stock, "--save")...)
	if code != exitBadInput || out != "" || !strings.Contains(errOut, "inline array") {
		t.Errorf("exit %d, stdout %q, stderr %q", code, out, errOut)
	}
	if b, _ := os.ReadFile(stock); !bytes.Equal(b, orig) {
		t.Error("the stock file changed")
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 1 {
		t.Errorf("files left behind: %v", ents)
	}
}

// The parse seam: flags land in the options struct as typed values.
func TestNewCmdTrim(t *testing.T) {
	cmd := newTrimCmd(&globalOptions{stdout: &bytes.Buffer{}, stderr: &bytes.Buffer{}})
	if err := cmd.ParseFlags([]string{"--resonance", "9.81MHz@100pF", "--resonance", "5.2MHz @ 400pF", "--cap-tol", "0.25pF",
		"--target", "145MHz", "--tap-ratio", "1:4", "--meter-tol", "1%"}); err != nil {
		t.Fatal(err)
	}
	// The options are reachable through the command's flags only; check
	// their printed values.
	for flag, want := range map[string]string{"resonance": "9.81MHz@100pF,5.2MHz @ 400pF", "cap-tol": "0.25pF", "target": "145MHz", "tap-ratio": "1:4", "meter-tol": "1%", "freq-tol": "0.1%", "tolerance": "0.5%"} {
		if got := cmd.Flags().Lookup(flag).Value.String(); got != want {
			t.Errorf("--%s = %q, want %q", flag, got, want)
		}
	}
	o := newTrimOptions()
	if err := o.resonances.Set("9.81MHz@100pF"); err != nil || len(o.resonances.v) != 1 || o.resonances.v[0].Frequency != 9.81e6 || o.resonances.v[0].Capacitance != 100e-12 {
		t.Errorf("resonance flag: %+v %v", o.resonances.v, err)
	}
	if err := o.capTol.Set("0.25pF"); err != nil || o.capTol.v.Abs != 0.25e-12 || o.capTol.v.Rel != 0 {
		t.Errorf("cap-tol: %+v %v", o.capTol, err)
	}
	if err := o.target.Set("48nH"); err != nil || o.target.v.IsFreq || math.Abs(float64(o.target.v.L)/48e-9-1) > 1e-12 {
		t.Errorf("target: %+v %v", o.target, err)
	}
}

// The help's examples are real invocations: each runs and succeeds (the
// stock file of --save goes to a temporary directory).
func TestTrimExamplesRun(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	cmd := newTrimCmd(&globalOptions{stdout: &bytes.Buffer{}, stderr: &bytes.Buffer{}})
	stock := filepath.Join(t.TempDir(), "stock.toml")
	lines := strings.Split(cmd.Example, "\n")
	if len(lines) < 2 {
		t.Fatalf("%d examples, want at least two", len(lines))
	}
	for _, line := range lines {
		args := splitShell(strings.TrimSpace(line))
		if len(args) < 2 || args[0] != "turnwise" {
			t.Fatalf("example %q does not start with turnwise", line)
		}
		for i, a := range args {
			switch {
			case a == "~/coils/stock.toml":
				args[i] = stock
			case strings.HasPrefix(a, "testdata/"):
				args[i] = filepath.Join("..", "..", a)
			}
		}
		if _, errOut, code := runCLI(t, args[1:]...); code != exitOK {
			t.Errorf("%s: exit %d: %s", line, code, errOut)
		}
	}
}

// splitShell splits a command line on blanks, keeping "double quoted"
// words together.
func splitShell(s string) []string {
	var out []string
	var cur strings.Builder
	quoted, started := false, false
	for _, r := range s {
		switch {
		case r == '"':
			quoted, started = !quoted, true
		case r == ' ' && !quoted:
			if started {
				out = append(out, cur.String())
				cur.Reset()
				started = false
			}
		default:
			cur.WriteRune(r)
			started = true
		}
	}
	if started {
		out = append(out, cur.String())
	}
	return out
}

// After --save the design search uses the saved springback for that
// mandrel and wire (through the same glue the design command calls).
func TestTrimSaveFeedsDesignSearch(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	stock := filepath.Join(t.TempDir(), "stock.toml")
	if _, errOut, code := runCLI(t, withArgs(trimDoneWhen, "--stock", stock, "--save")...); code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	so := newStockOptions()
	so.path = stock
	cat, err := so.load()
	if err != nil {
		t.Fatal(err)
	}
	saved, ok := cat.Springback("4.6mm", "1mm")
	if !ok {
		t.Fatal("no saved calibration")
	}
	res, err := spec.Search(cat, &spec.SearchOptions{Inductance: 48e-9, Leads: 5e-3, Mandrel: "4.6mm", Wires: []string{"1mm"}})
	if err != nil {
		t.Fatal(err)
	}
	if len(res.Candidates) == 0 {
		t.Fatal("no candidates")
	}
	c := res.Candidates[0]
	if c.SpringbackSource != "calibration" || c.Support.Springback != saved.Springback {
		t.Errorf("design uses springback %g from %q, want the saved %g", c.Support.Springback, c.SpringbackSource, saved.Springback)
	}
}

// A tapped coil loses turns at the hot end (the tap counts from the cold
// end), and the section warning names the tap once.
func TestTrimTappedRemoveTurns(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	job := filepath.Join(trimData, "job.toml")
	out, errOut, code := runCLI(t, "trim", "--job", job, "--coil", "input", "--measured-l", "80nH", "--measured-bottom", "14nH",
		"--measured-top", "69nH", "--target", "60nH", "--freq", "0Hz")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	// 4¼ turns cannot reach 60 nH: calibrated (mean diameter 6.53 mm),
	// the helix Neumann integral gives 60.11 nH at the loosest pitch,
	// 3.00 mm (the model the same; Rosa's rings alone 57.89 nH, the old
	// "remove ¾ turn"); 4 turns at 2.43 mm give 59.98 nH by the integral,
	// inside the window with room either way.
	if !strings.Contains(out, "→ remove 1 turn at the hot end (4 turns left)") {
		t.Errorf("instruction does not say which end:\n%s", out)
	}
	if !strings.Contains(errOut, "or the tap is not at 1 turn\n") || strings.Contains(errOut, "turn turns") {
		t.Errorf("section warning:\n%s", errOut)
	}
}

// --save through a symbolic link updates the file it points to and leaves
// the link in place.
func TestTrimSaveThroughSymlink(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	real := filepath.Join(dir, "real.toml")
	orig := copyFile(t, filepath.Join(trimData, "stock.toml"), real, 0o644)
	link := filepath.Join(dir, "link.toml")
	if err := os.Symlink("real.toml", link); err != nil {
		t.Skipf("no symbolic links here: %v", err)
	}
	if _, errOut, code := runCLI(t, withArgs(trimDoneWhen, "--stock", link, "--save")...); code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	if st, err := os.Lstat(link); err != nil || st.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link was replaced: %v %v", st, err)
	}
	got, _ := os.ReadFile(real)
	if !bytes.HasPrefix(got, orig) || !bytes.Contains(got, []byte("[[calibration]]\nmandrel = \"4.6mm rod\"")) {
		t.Errorf("the linked file did not get the calibration:\n%s", got)
	}
	if bak, err := os.ReadFile(real + ".bak"); err != nil || !bytes.Equal(bak, orig) {
		t.Errorf("backup beside the real file: %v", err)
	}
}

// A tap ratio beyond every quarter-turn tap is flagged, and a tap under
// one turn reads "¼ turn", not "0¼ turns".
func TestTrimTapOutOfReach(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(vhfTrim, "--measured-l", "101nH", "--tap", "1", "--tap-ratio", "0.01")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	if !strings.Contains(out, "move the tap from 1 to ¼ turn from the cold end") {
		t.Errorf("instruction:\n%s", out)
	}
	if !strings.Contains(errOut, "no quarter-turn tap gives the voltage ratio 0.010") {
		t.Errorf("no out-of-reach warning:\n%s", errOut)
	}
	_, errOut, _ = runCLI(t, withArgs(vhfTrim, "--measured-l", "101nH", "--tap", "1", "--tap-ratio", "0.5")...)
	if strings.Contains(errOut, "no quarter-turn tap") {
		t.Errorf("a reachable ratio flagged:\n%s", errOut)
	}
}
