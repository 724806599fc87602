package testtools

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"regexp"
	"strconv"
	"strings"
)

// Golden files hold the program's own output. A build that fuses
// multiply-adds (GOAMD64=v3, arm64) rounds differently in the last bits, so
// goldens compare numbers with a tolerance and everything else exactly.

// RelTol is the relative tolerance for a JSON number: a few hundred ulps of
// float64 (ε = 2.2e-16, IEEE 754), far above the ulp-level differences of
// fused multiply-add and far below any change a reader could see.
const RelTol = 1e-12

// AbsFloor is the absolute tolerance below which two JSON numbers are equal
// however different their ratio, so that a quantity that is exactly zero in
// one build and 1e-30 in another passes. It is far below every SI value
// turnwise prints (the smallest are capacitances near 1e-13 F).
const AbsFloor = 1e-18

// closeNumbers reports whether a and b agree within rel (relative to the
// larger magnitude) or AbsFloor.
func closeNumbers(a, b, rel float64) bool {
	if a == b {
		return true
	}
	if math.IsNaN(a) || math.IsNaN(b) || math.IsInf(a, 0) || math.IsInf(b, 0) {
		return false
	}
	d := math.Abs(a - b)
	return d <= AbsFloor || d <= rel*math.Max(math.Abs(a), math.Abs(b))
}

// jsonNumber matches a JSON number where one may stand in the raw text.
var jsonNumber = regexp.MustCompile(`-?\d+(?:\.\d+)?(?:[eE][-+]?\d+)?`)

type jsonFrame struct {
	object  bool
	wantKey bool
	key     string
	index   int
}

func jsonPath(stack []jsonFrame) string {
	var b strings.Builder
	b.WriteString("$")
	for _, f := range stack {
		if f.object {
			if f.key != "" {
				b.WriteString("." + f.key)
			}
		} else {
			fmt.Fprintf(&b, "[%d]", f.index)
		}
	}
	return b.String()
}

// SameJSON compares two JSON documents token by token, in order: keys,
// strings, booleans, nulls and brackets must match exactly and numbers
// within RelTol, or within looser[key] for a number under that object key
// (for values a numerical derivative or a cancellation leaves less exact;
// the caller says why). The layout (indentation, key order) must match too.
// It returns nil or an error naming the first difference by its path.
func SameJSON(got, want []byte, looser map[string]float64) error {
	dg := json.NewDecoder(bytes.NewReader(got))
	dw := json.NewDecoder(bytes.NewReader(want))
	dg.UseNumber()
	dw.UseNumber()
	var stack []jsonFrame
	// done advances the enclosing container after a complete value.
	done := func() {
		if n := len(stack); n > 0 {
			if stack[n-1].object {
				stack[n-1].wantKey = true
			} else {
				stack[n-1].index++
			}
		}
	}
	for {
		tg, eg := dg.Token()
		tw, ew := dw.Token()
		if errors.Is(eg, io.EOF) && errors.Is(ew, io.EOF) {
			break
		}
		if eg != nil || ew != nil {
			switch {
			case errors.Is(eg, io.EOF):
				return fmt.Errorf("%s: got ends early; want %v", jsonPath(stack), tw)
			case errors.Is(ew, io.EOF):
				return fmt.Errorf("%s: got has more: %v", jsonPath(stack), tg)
			case eg != nil:
				return fmt.Errorf("got is not JSON: %v", eg)
			default:
				return fmt.Errorf("golden is not JSON: %v", ew)
			}
		}
		path := jsonPath(stack)
		switch w := tw.(type) {
		case json.Delim:
			if g, ok := tg.(json.Delim); !ok || g != w {
				return fmt.Errorf("%s: got %v, want %v", path, tg, w)
			}
			switch w {
			case '{':
				stack = append(stack, jsonFrame{object: true, wantKey: true})
			case '[':
				stack = append(stack, jsonFrame{})
			default:
				stack = stack[:len(stack)-1]
				done()
			}
			continue
		case json.Number:
			g, ok := tg.(json.Number)
			if !ok {
				return fmt.Errorf("%s: got %v, want the number %v", path, tg, w)
			}
			a, err1 := g.Float64()
			b, err2 := w.Float64()
			if err1 != nil || err2 != nil {
				return fmt.Errorf("%s: numbers %v, %v do not parse", path, g, w)
			}
			rel := RelTol
			if n := len(stack); n > 0 && stack[n-1].object {
				if l, ok := looser[stack[n-1].key]; ok {
					rel = l
				}
			}
			if !closeNumbers(a, b, rel) {
				return fmt.Errorf("%s: got %v, want %v (relative difference %.3g, tolerance %g)",
					path, g, w, math.Abs(a-b)/math.Max(math.Abs(a), math.Abs(b)), rel)
			}
		default:
			if tg != tw {
				return fmt.Errorf("%s: got %#v, want %#v", path, tg, tw)
			}
			if n := len(stack); n > 0 && stack[n-1].object && stack[n-1].wantKey {
				stack[n-1].key, _ = tw.(string)
				stack[n-1].wantKey = false
				continue
			}
		}
		done()
	}
	// Same tokens; now the layout with every number masked. Strings were
	// compared exactly above, so masking digits inside them loses nothing.
	mg := jsonNumber.ReplaceAll(got, []byte("#"))
	mw := jsonNumber.ReplaceAll(want, []byte("#"))
	if !bytes.Equal(mg, mw) {
		return fmt.Errorf("same values but a different layout:\n%s", firstLineDiff(string(mg), string(mw)))
	}
	return nil
}

// textNumber matches an unsigned decimal number in text: signs, exponents
// and units stay text and must match exactly.
var textNumber = regexp.MustCompile(`\d+(?:\.\d+)?`)

// SameText compares two texts that print rounded numbers. Everything but
// the numbers must match exactly; each number must be printed with the
// same number of decimals and differ by at most one unit in its last digit,
// which is what a tie (…5 exactly) rounded the other way by a build that
// fuses multiply-adds can change. It returns nil or an error showing the
// first line that differs.
func SameText(got, want string) error {
	if got == want {
		return nil
	}
	ng := textNumber.FindAllStringIndex(got, -1)
	nw := textNumber.FindAllStringIndex(want, -1)
	fail := func() error { return errors.New(firstLineDiff(got, want)) }
	if len(ng) != len(nw) {
		return fail()
	}
	pg, pw := 0, 0
	for i := range ng {
		if got[pg:ng[i][0]] != want[pw:nw[i][0]] {
			return fail()
		}
		a, b := got[ng[i][0]:ng[i][1]], want[nw[i][0]:nw[i][1]]
		if !lastDigitClose(a, b) {
			return fail()
		}
		pg, pw = ng[i][1], nw[i][1]
	}
	if got[pg:] != want[pw:] {
		return fail()
	}
	return nil
}

// lastDigitClose reports whether two printed decimals have the same number
// of decimals and differ by at most one unit in the last place.
func lastDigitClose(a, b string) bool {
	if a == b {
		return true
	}
	fa, fb := "", ""
	if i := strings.IndexByte(a, '.'); i >= 0 {
		fa = a[i+1:]
	}
	if i := strings.IndexByte(b, '.'); i >= 0 {
		fb = b[i+1:]
	}
	if len(fa) != len(fb) || strings.Contains(a, ".") != strings.Contains(b, ".") {
		return false
	}
	ia, err1 := strconv.ParseInt(strings.Replace(a, ".", "", 1), 10, 64)
	ib, err2 := strconv.ParseInt(strings.Replace(b, ".", "", 1), 10, 64)
	if err1 != nil || err2 != nil {
		return false
	}
	return ia-ib <= 1 && ib-ia <= 1
}

// firstLineDiff shows the first line where got and want differ.
func firstLineDiff(got, want string) string {
	lg, lw := strings.Split(got, "\n"), strings.Split(want, "\n")
	for i := 0; i < max(len(lg), len(lw)); i++ {
		var a, b string
		if i < len(lg) {
			a = lg[i]
		}
		if i < len(lw) {
			b = lw[i]
		}
		if a != b {
			return fmt.Sprintf("line %d:\n got  %q\n want %q", i+1, a, b)
		}
	}
	return "texts differ"
}
