package forms

import "fmt"

// Limits on the files turnwise reads. A job or stock file is a few
// kilobytes; the TOML decoder's time and memory grow steeply with nesting
// (a 40 KB file of nested inline tables took tens of seconds and gigabytes),
// so both limits are checked on the raw text before decoding.
const (
	// MaxFileBytes is the largest job or stock file accepted: 1 MiB,
	// hundreds of times a real one.
	MaxFileBytes = 1 << 20
	// MaxNesting is the deepest nesting of arrays and inline tables
	// accepted; turnwise's own formats need 2 (a bands array, a table
	// header).
	MaxNesting = 16
)

// checkShape refuses text that is too large or nested too deeply, with
// the line where the nesting passes the limit. It scans brackets and
// braces outside strings and comments in one pass. kind and file label
// the error ("job" or "" for a stock file).
func checkShape(text, kind, file string) error {
	if len(text) > MaxFileBytes {
		return &ParseError{Kind: kind, File: file, Err: fmt.Errorf("larger than the %d MiB limit for turnwise files; is this the right file?", MaxFileBytes>>20)}
	}
	depth, line := 0, 1
	for i := 0; i < len(text); i++ {
		switch c := text[i]; c {
		case '\n':
			line++
		case '#':
			for i+1 < len(text) && text[i+1] != '\n' {
				i++
			}
		case '"', '\'':
			// Skip a string: basic ("..." with \ escapes), literal ('...'),
			// or multi-line (""" or ''').
			q := string(c)
			if i+2 < len(text) && text[i+1] == c && text[i+2] == c {
				q = string([]byte{c, c, c})
			}
			j := i + len(q)
			for j < len(text) {
				if c == '"' && text[j] == '\\' {
					if j+1 < len(text) && text[j+1] == '\n' {
						line++
					}
					j += 2
					continue
				}
				if text[j] == '\n' {
					if len(q) == 1 {
						break // unterminated one-line string: the decoder reports it
					}
					line++
				}
				if text[j] == c && j+len(q) <= len(text) && text[j:j+len(q)] == q {
					j += len(q) - 1
					break
				}
				j++
			}
			if j < len(text) && text[j] == '\n' {
				j-- // let the loop count the newline
			}
			i = j
		case '[', '{':
			depth++
			if depth > MaxNesting {
				return &ParseError{Kind: kind, File: file, Line: line, Err: fmt.Errorf("arrays or inline tables nested more than %d deep; turnwise files need at most 2: is this the right file?", MaxNesting)}
			}
		case ']', '}':
			if depth > 0 {
				depth--
			}
		}
	}
	return nil
}
