package forms

import (
	"bytes"
	"errors"
	"fmt"
	"regexp"
	"strconv"
	"strings"
	"unicode/utf8"

	"gonum.org/v1/gonum/unit"
)

// Editing a stock file. turnwise never re-encodes a user's TOML: that would
// drop their comments and reorder their rows. New rows are appended as text
// at the end, after everything already there, which LoadStock reads as the
// latest: for calibrations, the last one for a pair is the one in effect.
// The functions are pure (bytes in, bytes out); the caller writes the file.

// stockHeader starts a stock file that did not exist.
const stockHeader = `# turnwise stock file: your own wire, mandrels, formers and springback
# calibrations. Started by ` + "`turnwise trim --save`" + `; edit freely (comments
# are kept). ` + "`turnwise stock --template`" + ` prints an example of every entry.
`

// AppendCalibration returns src with c appended as a [[calibration]]
// entry. c.Mandrel and c.Wire must name rows of src or of the built-in
// catalog; add missing ones with AppendStock in the same call.
func AppendCalibration(src []byte, name string, c Calibration) ([]byte, error) {
	return AppendStock(src, name, &Catalog{Calibrations: []Calibration{c}})
}

// AppendStock returns src (a stock file's text, empty for a new file) with
// the rows of add appended as TOML sections — wires, mandrels, formers,
// then calibrations — under a comment saying turnwise added them. Every
// byte of src is kept: comments, layout and line endings (CRLF files get
// CRLF). name labels errors.
//
// src must load (LoadStock) before, and the result is loaded again after,
// so a row that clashes with the file (a name already used, calibrations
// written as an inline array) is an error and no text is returned. Errors
// are *ParseError.
func AppendStock(src []byte, name string, add *Catalog) ([]byte, error) {
	if _, err := LoadStock(bytes.NewReader(src), name); err != nil {
		var pe *ParseError
		if errors.As(err, &pe) {
			pe.Err = fmt.Errorf("%w (fix this before turnwise adds to the file)", pe.Err)
		}
		return nil, err
	}
	if add == nil {
		return bytes.Clone(src), nil
	}
	var b strings.Builder
	for _, w := range add.Wires {
		if err := writeWire(&b, w); err != nil {
			return nil, &ParseError{File: name, Field: fmt.Sprintf("wire %q", w.Name), Err: err}
		}
	}
	for _, m := range add.Mandrels {
		if err := writeHolder(&b, "mandrel", m.Name, m.Diameter, m.Kind, m.Source); err != nil {
			return nil, &ParseError{File: name, Field: fmt.Sprintf("mandrel %q", m.Name), Err: err}
		}
	}
	for _, f := range add.Formers {
		if err := writeHolder(&b, "former", f.Name, f.Diameter, f.Kind, f.Source); err != nil {
			return nil, &ParseError{File: name, Field: fmt.Sprintf("former %q", f.Name), Err: err}
		}
	}
	for _, c := range add.Calibrations {
		if err := writeCalibration(&b, c); err != nil {
			return nil, &ParseError{File: name, Field: "calibration", Err: err}
		}
	}
	block := b.String()

	out := bytes.Clone(src)
	if len(bytes.TrimSpace(out)) == 0 {
		out = append(out[:0], stockHeader...)
	}
	crlf := bytes.Contains(src, []byte("\r\n"))
	if len(out) > 0 && out[len(out)-1] != '\n' {
		out = append(out, '\n')
	}
	text := "\n" + block
	if crlf {
		text = strings.ReplaceAll(text, "\n", "\r\n")
		if !bytes.HasSuffix(out, []byte("\r\n")) && bytes.HasSuffix(out, []byte("\n")) {
			out = append(out[:len(out)-1], "\r\n"...)
		}
	}
	out = append(out, text...)

	if _, err := LoadStock(bytes.NewReader(out), name); err != nil {
		var pe *ParseError
		if errors.As(err, &pe) {
			// The line is in the new text, which the user has not seen.
			pe.Line = 0
			for _, m := range inlineArray.FindAllSubmatch(src, -1) {
				if sec := string(m[1]); adds(add, sec) {
					pe.Err = fmt.Errorf("cannot append a [[%s]] section to a file that writes them as an inline array (%s = [ ... ]): rewrite those entries as [[%s]] sections; %w", sec, sec, sec, pe.Err)
					break
				}
			}
		}
		return nil, err
	}
	return out, nil
}

// inlineArray finds a section assigned as an inline array (wire = [...]):
// TOML allows no [[wire]] after that.
var inlineArray = regexp.MustCompile(`(?m)^[ \t]*(wire|mandrel|former|calibration)[ \t]*=`)

// adds reports whether add has rows for section.
func adds(add *Catalog, section string) bool {
	switch section {
	case "wire":
		return len(add.Wires) > 0
	case "mandrel":
		return len(add.Mandrels) > 0
	case "former":
		return len(add.Formers) > 0
	}
	return len(add.Calibrations) > 0
}

const addedBy = "# added by turnwise trim --save\n"

func writeWire(b *strings.Builder, w Wire) error {
	if err := checkText(w.Name, "name"); err != nil {
		return err
	}
	b.WriteString(addedBy)
	b.WriteString("[[wire]]\n")
	fmt.Fprintf(b, "name = %s\n", tomlQuote(w.Name))
	fmt.Fprintf(b, "bare = %s\n", tomlQuote(lengthText(w.Bare)))
	switch w.Insulation {
	case "", "none":
		b.WriteString(`insulation = "none"` + "\n")
	case "grade1", "grade2", "grade3":
		fmt.Fprintf(b, "insulation = %s\n", tomlQuote(w.Insulation))
	default:
		fmt.Fprintf(b, "insulation = %s\n", tomlQuote(lengthText(w.Overall)))
	}
	if w.Conductor != "" {
		fmt.Fprintf(b, "conductor = %s\n", tomlQuote(w.Conductor))
	}
	if w.Source != "" {
		fmt.Fprintf(b, "source = %s\n", tomlQuote(w.Source))
	}
	b.WriteString("\n")
	return nil
}

func writeHolder(b *strings.Builder, section, name string, d unit.Length, kind, source string) error {
	if err := checkText(name, "name"); err != nil {
		return err
	}
	b.WriteString(addedBy)
	fmt.Fprintf(b, "[[%s]]\n", section)
	fmt.Fprintf(b, "name = %s\n", tomlQuote(name))
	fmt.Fprintf(b, "diameter = %s\n", tomlQuote(lengthText(d)))
	if kind != "" {
		fmt.Fprintf(b, "kind = %s\n", tomlQuote(kind))
	}
	if source != "" {
		fmt.Fprintf(b, "source = %s\n", tomlQuote(source))
	}
	b.WriteString("\n")
	return nil
}

func writeCalibration(b *strings.Builder, c Calibration) error {
	for _, t := range []struct{ v, field string }{{c.Mandrel, "mandrel"}, {c.Wire, "wire"}} {
		if err := checkText(t.v, t.field); err != nil {
			return err
		}
	}
	if !(c.Springback >= minSpringback && c.Springback <= maxSpringback) {
		return fmt.Errorf("springback %.4g%% is outside %.0f%% to %.0f%%", c.Springback*100, minSpringback*100, maxSpringback*100)
	}
	b.WriteString(addedBy)
	b.WriteString("[[calibration]]\n")
	fmt.Fprintf(b, "mandrel = %s\n", tomlQuote(c.Mandrel))
	fmt.Fprintf(b, "wire = %s\n", tomlQuote(c.Wire))
	fmt.Fprintf(b, "springback = %s\n", tomlQuote(SpringbackText(c.Springback)))
	if c.Note != "" {
		fmt.Fprintf(b, "note = %s\n", tomlQuote(c.Note))
	}
	return nil
}

// SpringbackText is how a springback is written to a stock file: a
// percentage with two decimals, e.g. "4.12%", which quantity.ParsePercent reads.
func SpringbackText(s float64) string {
	t := strconv.FormatFloat(s*100, 'f', 2, 64)
	if t == "-0.00" {
		t = "0.00"
	}
	return t + "%"
}

// lengthText writes a length in millimetres with enough digits to read
// back the same diameter (nine significant figures).
func lengthText(l unit.Length) string {
	return strconv.FormatFloat(float64(l)*1e3, 'g', 9, 64) + "mm"
}

func checkText(s, field string) error {
	if strings.TrimSpace(s) == "" {
		return fmt.Errorf("%s is empty", field)
	}
	if !utf8.ValidString(s) {
		return fmt.Errorf("%s is not valid UTF-8", field)
	}
	return nil
}

// tomlQuote writes s as a TOML basic string: quotes, backslashes and
// control characters escaped, everything else as UTF-8.
func tomlQuote(s string) string {
	var b strings.Builder
	b.WriteByte('"')
	for _, r := range s {
		switch {
		case r == '"':
			b.WriteString(`\"`)
		case r == '\\':
			b.WriteString(`\\`)
		case r == '\n':
			b.WriteString(`\n`)
		case r == '\t':
			b.WriteString(`\t`)
		case r == '\r':
			b.WriteString(`\r`)
		case r < 0x20 || r == 0x7f:
			fmt.Fprintf(&b, `\u%04X`, r)
		default:
			b.WriteRune(r)
		}
	}
	b.WriteByte('"')
	return b.String()
}
