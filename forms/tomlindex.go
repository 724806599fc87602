package forms

import (
	"strconv"
	"strings"
)

// tomlIndex records the line of each key in a TOML document that the toml
// package has already accepted. BurntSushi/toml reports lines for syntax
// errors, but MetaData keeps one position per dotted key, not one per element
// of an array of tables, so "[[wire]] name" in the third wire would get the
// line of the last one. This scanner walks the text once, tracking strings,
// comments, arrays and inline tables, and notes where each table entry and
// each key in it starts. It never fails: on input it does not follow it skips
// to the next line, and a missing line is reported as 0.
type tomlIndex struct {
	top    map[string]int          // top-level key or [table] header -> first line
	tables map[string][]*tableLine // array-of-tables name -> its elements in order
}

// tableLine is one element of an array of tables.
type tableLine struct {
	line int            // line of its [[header]] or of its inline '{'
	keys map[string]int // first segment of each key in it -> first line
}

func (e *tableLine) note(key string, line int) {
	if _, ok := e.keys[key]; !ok {
		e.keys[key] = line
	}
}

// keyLine returns the line of key in the i-th element of table, falling back
// to the element's own line.
func (x *tomlIndex) keyLine(table string, i int, key string) int {
	es := x.tables[table]
	if i < 0 || i >= len(es) {
		return x.top[table]
	}
	if l, ok := es[i].keys[key]; ok {
		return l
	}
	return es[i].line
}

// entryLine returns the line where the i-th element of table starts.
func (x *tomlIndex) entryLine(table string, i int) int {
	es := x.tables[table]
	if i < 0 || i >= len(es) {
		return x.top[table]
	}
	return es[i].line
}

// maxDepth bounds nesting of arrays and inline tables; deeper values are
// skipped line-wise, which only costs line precision.
const maxDepth = 64

type tomlScanner struct {
	s    string
	pos  int
	line int
	x    *tomlIndex
}

func indexTOML(s string) *tomlIndex {
	x := &tomlIndex{top: map[string]int{}, tables: map[string][]*tableLine{}}
	sc := &tomlScanner{s: strings.TrimPrefix(s, "\ufeff"), line: 1, x: x}
	sc.document()
	return x
}

func (sc *tomlScanner) eof() bool { return sc.pos >= len(sc.s) }

func (sc *tomlScanner) peek(off int) byte {
	if sc.pos+off < len(sc.s) {
		return sc.s[sc.pos+off]
	}
	return 0
}

func (sc *tomlScanner) advance() {
	if sc.s[sc.pos] == '\n' {
		sc.line++
	}
	sc.pos++
}

// space skips blanks; with newlines, also line breaks and comments.
func (sc *tomlScanner) space(newlines bool) {
	for !sc.eof() {
		switch c := sc.s[sc.pos]; {
		case c == ' ' || c == '\t' || c == '\r':
			sc.pos++
		case c == '\n' && newlines:
			sc.advance()
		case c == '#' && newlines:
			sc.skipLine()
		default:
			return
		}
	}
}

// skipLine moves to the start of the next line.
func (sc *tomlScanner) skipLine() {
	for !sc.eof() && sc.s[sc.pos] != '\n' {
		sc.pos++
	}
	if !sc.eof() {
		sc.advance()
	}
}

func (sc *tomlScanner) document() {
	var cur *tableLine // the array element keys belong to, if any
	inTable := false   // under a [table] or [[a.b]] header that is not tracked
	for {
		sc.space(true)
		if sc.eof() {
			return
		}
		start, line := sc.pos, sc.line
		if sc.s[sc.pos] == '[' {
			array := sc.peek(1) == '['
			sc.pos++
			if array {
				sc.pos++
			}
			path := sc.key()
			sc.skipLine()
			cur, inTable = nil, true
			if len(path) == 0 {
				continue
			}
			switch {
			case array && len(path) == 1:
				e := &tableLine{line: line, keys: map[string]int{}}
				sc.x.tables[path[0]] = append(sc.x.tables[path[0]], e)
				sc.noteTop(path[0], line)
				cur = e
			case len(path) == 1:
				sc.noteTop(path[0], line)
			default:
				// [wire.extra] or [[wire.extra]] adds a key to the last wire.
				if es := sc.x.tables[path[0]]; len(es) > 0 {
					es[len(es)-1].note(path[1], line)
				} else {
					sc.noteTop(path[0], line)
				}
			}
			continue
		}
		path := sc.key()
		if len(path) == 0 || sc.peek(0) != '=' {
			sc.skipLine()
			continue
		}
		sc.pos++
		switch {
		case cur != nil:
			cur.note(path[0], line)
			sc.value(0, "")
		case !inTable:
			sc.noteTop(path[0], line)
			// wire = [{...}, {...}] is an array of tables too.
			table := ""
			if len(path) == 1 {
				table = path[0]
			}
			sc.value(0, table)
		default:
			sc.value(0, "")
		}
		if sc.pos == start {
			sc.skipLine()
		}
	}
}

func (sc *tomlScanner) noteTop(k string, line int) {
	if _, ok := sc.x.top[k]; !ok {
		sc.x.top[k] = line
	}
}

// key reads a dotted key and the blanks after it. It returns nil when there
// is no key at the cursor.
func (sc *tomlScanner) key() []string {
	var path []string
	for {
		sc.space(false)
		if sc.eof() {
			return path
		}
		var part string
		switch c := sc.s[sc.pos]; {
		case c == '"' || c == '\'':
			raw := sc.str()
			part = raw
			if c == '"' {
				if u, err := strconv.Unquote(raw); err == nil {
					part = u
				} else {
					part = strings.Trim(raw, `"`)
				}
			} else {
				part = strings.Trim(raw, "'")
			}
		case isBareKey(c):
			i := sc.pos
			for sc.pos < len(sc.s) && isBareKey(sc.s[sc.pos]) {
				sc.pos++
			}
			part = sc.s[i:sc.pos]
		default:
			return path
		}
		path = append(path, part)
		sc.space(false)
		if sc.peek(0) != '.' {
			return path
		}
		sc.pos++
	}
}

func isBareKey(c byte) bool {
	return c >= 'A' && c <= 'Z' || c >= 'a' && c <= 'z' || c >= '0' && c <= '9' || c == '_' || c == '-'
}

// str reads a string of any of the four TOML kinds and returns its raw text.
func (sc *tomlScanner) str() string {
	start := sc.pos
	q := sc.s[sc.pos]
	multi := sc.peek(1) == q && sc.peek(2) == q
	if multi {
		sc.pos += 3
		for !sc.eof() {
			if q == '"' && sc.s[sc.pos] == '\\' {
				sc.advance()
				if !sc.eof() {
					sc.advance()
				}
				continue
			}
			if sc.s[sc.pos] == q && sc.peek(1) == q && sc.peek(2) == q {
				sc.pos += 3
				// Up to two more quotes may close the string ("""a"""").
				for i := 0; i < 2 && sc.peek(0) == q; i++ {
					sc.pos++
				}
				break
			}
			sc.advance()
		}
		return sc.s[start:sc.pos]
	}
	sc.pos++
	for !sc.eof() && sc.s[sc.pos] != '\n' {
		c := sc.s[sc.pos]
		if q == '"' && c == '\\' && sc.pos+1 < len(sc.s) && sc.s[sc.pos+1] != '\n' {
			sc.pos += 2
			continue
		}
		sc.pos++
		if c == q {
			break
		}
	}
	return sc.s[start:sc.pos]
}

// value skips one value. When table is set and the value is an array, each
// inline table directly in it is recorded as an element of that table.
func (sc *tomlScanner) value(depth int, table string) {
	sc.space(false)
	if sc.eof() {
		return
	}
	if depth > maxDepth {
		sc.skipLine()
		return
	}
	switch c := sc.s[sc.pos]; c {
	case '"', '\'':
		sc.str()
	case '[':
		sc.pos++
		for {
			sc.space(true)
			if sc.eof() {
				return
			}
			if sc.s[sc.pos] == ']' {
				sc.pos++
				return
			}
			if sc.s[sc.pos] == ',' {
				sc.pos++
				continue
			}
			before := sc.pos
			if table != "" && sc.s[sc.pos] == '{' {
				e := &tableLine{line: sc.line, keys: map[string]int{}}
				sc.x.tables[table] = append(sc.x.tables[table], e)
				sc.inlineTable(depth+1, e)
			} else {
				sc.value(depth+1, "")
			}
			if sc.pos == before {
				sc.pos++
			}
		}
	case '{':
		sc.inlineTable(depth+1, nil)
	default:
		for !sc.eof() {
			switch sc.s[sc.pos] {
			case ' ', '\t', '\r', '\n', ',', ']', '}', '#':
				return
			}
			sc.pos++
		}
	}
}

// inlineTable skips {k = v, ...}, noting keys in e when e is set.
func (sc *tomlScanner) inlineTable(depth int, e *tableLine) {
	sc.pos++ // '{'
	for {
		sc.space(true)
		if sc.eof() {
			return
		}
		switch sc.s[sc.pos] {
		case '}':
			sc.pos++
			return
		case ',':
			sc.pos++
			continue
		}
		before, line := sc.pos, sc.line
		path := sc.key()
		if len(path) > 0 && sc.peek(0) == '=' {
			sc.pos++
			if e != nil {
				e.note(path[0], line)
			}
			sc.value(depth, "")
		}
		if sc.pos == before {
			sc.pos++
		}
	}
}
