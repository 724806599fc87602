package touchstone

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"math/cmplx"
	"path/filepath"
	"strconv"
	"strings"
)

// Causes of a ParseError; errors.Is finds them through it.
var (
	ErrOptionLine = errors.New("option line")
	ErrFrequency  = errors.New("frequency")
	ErrColumns    = errors.New("column count")
	ErrPorts      = errors.New("port count")
	ErrKeyword    = errors.New("keyword")
	ErrNumber     = errors.New("number")
	ErrEmpty      = errors.New("no data")
)

// ParseError is a file the reader cannot accept: the line (1-based; 0 for
// the end of the file) and what is wrong there.
type ParseError struct {
	Line int
	Err  error  // one of the Err* causes above
	Msg  string // what is wrong and how to fix it
}

func (e *ParseError) Error() string {
	if e.Line == 0 {
		return fmt.Sprintf("touchstone: end of file: %s", e.Msg)
	}
	return fmt.Sprintf("touchstone: line %d: %s", e.Line, e.Msg)
}

func (e *ParseError) Unwrap() error { return e.Err }

func perr(line int, cause error, format string, args ...any) error {
	return &ParseError{Line: line, Err: cause, Msg: fmt.Sprintf(format, args...)}
}

// PortsFromName is the port count a file name's extension states: 1 for
// .s1p, 2 for .s2p (any case), 0 when the name says nothing (a .ts file,
// no extension) and the file itself decides.
func PortsFromName(name string) int {
	ext := strings.ToLower(filepath.Ext(name))
	if len(ext) >= 4 && ext[1] == 's' && ext[len(ext)-1] == 'p' {
		if n, err := strconv.Atoi(ext[2 : len(ext)-1]); err == nil && n > 0 {
			return n
		}
	}
	return 0
}

// MaxLines bounds the lines Read accepts; a sweep has a few thousand.
const MaxLines = 1 << 20

// Read reads a version 1.1 or 2.0 one- or two-port file. ports is what the
// file name says (PortsFromName): 1, 2, or 0 to take the count from the
// file (the [Number of Ports] keyword, else the first data line's column
// count). Values are returned as the file states them: S as given, Y in
// siemens and Z in ohms (version 1.1's normalised Y and Z are scaled by
// the reference). Noise parameters after two-port data are skipped.
//
// Errors are *ParseError naming the line: a missing option line, a
// frequency that does not ascend, a line with the wrong number of
// columns, a port count the extension contradicts, a bad keyword or
// number.
func Read(r io.Reader, ports int) (Data, error) {
	if ports < 0 || ports > 2 {
		return Data{}, perr(0, ErrPorts, "%d-port data: turnwise reads one- and two-port files (.s1p, .s2p)", ports)
	}
	p := &parser{extPorts: ports, d: Data{Z0: 50}, unit: 1e9, param: S, format: "MA"}
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 64*1024), 1<<20)
	for sc.Scan() {
		p.line++
		if p.line > MaxLines {
			return Data{}, perr(p.line, ErrColumns, "more than %d lines: not a sweep file", MaxLines)
		}
		if err := p.feed(sc.Text()); err != nil {
			return Data{}, err
		}
		if p.ended {
			break
		}
	}
	if err := sc.Err(); err != nil {
		return Data{}, perr(p.line+1, ErrColumns, "cannot read the line: %v", err)
	}
	return p.finish()
}

type parser struct {
	line     int
	extPorts int
	d        Data

	v2       bool
	sawFirst bool // a non-comment line has been seen
	option   bool // the option line has been read
	unit     float64
	param    Param
	format   string

	// version 2.0 state
	ports, nFreq   int
	portsLine      int
	order21        bool // [Two-Port Data Order] 21_12
	orderGiven     bool
	refs           []float64
	refPending     bool // [Reference] values continue on the next line
	refLine        int
	inData, inInfo bool
	inNoise, ended bool
	dataLine       int
	refGiven       bool
	optionR        float64
	optionRGiven   bool
}

func (p *parser) feed(raw string) error {
	s := raw
	if i := strings.IndexByte(s, '!'); i >= 0 {
		s = s[:i]
	}
	s = strings.TrimSpace(s)
	if s == "" {
		return nil
	}
	first := !p.sawFirst
	p.sawFirst = true
	if p.inInfo {
		if strings.EqualFold(strings.Join(strings.Fields(s), " "), "[End Information]") {
			p.inInfo = false
		}
		return nil
	}
	if s[0] == '[' {
		return p.keyword(s, first)
	}
	if p.refPending {
		return p.references(s)
	}
	if s[0] == '#' {
		if p.option { // later option lines are ignored (version 1.1)
			if p.v2 {
				return perr(p.line, ErrOptionLine, "a second option line: a version 2.0 file has one")
			}
			return nil
		}
		return p.optionLine(s)
	}
	if p.inNoise {
		return nil
	}
	if !p.option {
		return perr(p.line, ErrOptionLine, "data before the option line: a Touchstone file states its units first, e.g. \"# MHz S RI R 50\"")
	}
	if p.v2 && !p.inData {
		return perr(p.line, ErrKeyword, "data before [Network Data]")
	}
	return p.data(s)
}

func (p *parser) keyword(s string, first bool) error {
	end := strings.IndexByte(s, ']')
	if end < 0 {
		return perr(p.line, ErrKeyword, "%q has no closing ]", s)
	}
	name := strings.ToLower(strings.Join(strings.Fields(s[1:end]), " "))
	arg := strings.TrimSpace(s[end+1:])
	if name == "version" {
		if !first {
			return perr(p.line, ErrKeyword, "[Version] must be the first line that is not a comment")
		}
		if arg != "2.0" && arg != "2.1" {
			return perr(p.line, ErrKeyword, "[Version] %q: turnwise reads version 2.0 keywords (1.1 files have no [Version] line)", arg)
		}
		p.v2 = true
		return nil
	}
	if !p.v2 {
		return perr(p.line, ErrKeyword, "keyword [%s] in a file without [Version] 2.0 on its first line", s[1:end])
	}
	if p.ended {
		return nil
	}
	needArg := func() error {
		if arg == "" {
			return perr(p.line, ErrKeyword, "[%s] needs a value", s[1:end])
		}
		return nil
	}
	switch name {
	case "number of ports":
		if err := needArg(); err != nil {
			return err
		}
		n, err := strconv.Atoi(arg)
		if err != nil || n < 1 {
			return perr(p.line, ErrPorts, "[Number of Ports] %q is not a positive whole number", arg)
		}
		if n > 2 {
			return perr(p.line, ErrPorts, "[Number of Ports] %d: turnwise reads one- and two-port files", n)
		}
		if p.extPorts != 0 && n != p.extPorts {
			return perr(p.line, ErrPorts, "[Number of Ports] %d contradicts the file name's .s%dp: rename the file or fix the keyword", n, p.extPorts)
		}
		p.ports, p.portsLine = n, p.line
	case "two-port data order":
		switch strings.ToLower(arg) {
		case "12_21":
			p.order21 = false
		case "21_12":
			p.order21 = true
		default:
			return perr(p.line, ErrKeyword, "[Two-Port Data Order] %q: 12_21 or 21_12", arg)
		}
		p.orderGiven = true
	case "number of frequencies":
		n, err := strconv.Atoi(arg)
		if err != nil || n < 1 {
			return perr(p.line, ErrKeyword, "[Number of Frequencies] %q is not a positive whole number", arg)
		}
		p.nFreq = n
	case "reference":
		if p.ports == 0 {
			return perr(p.line, ErrKeyword, "[Reference] before [Number of Ports]")
		}
		p.refPending, p.refLine = true, p.line
		if arg != "" {
			return p.references(arg)
		}
	case "matrix format":
		if !strings.EqualFold(arg, "full") {
			return perr(p.line, ErrKeyword, "[Matrix Format] %q: turnwise reads Full matrices only", arg)
		}
	case "number of noise frequencies":
	case "begin information":
		p.inInfo = true
	case "end information":
	case "network data":
		if p.refPending {
			return perr(p.line, ErrKeyword, "[Reference] (line %d) has %d values, the file has %d ports", p.refLine, len(p.refs), p.ports)
		}
		if !p.option {
			return perr(p.line, ErrOptionLine, "missing option line before [Network Data], e.g. \"# MHz S RI R 50\"")
		}
		if p.ports == 0 {
			return perr(p.line, ErrPorts, "missing [Number of Ports] before [Network Data]")
		}
		if p.ports == 2 && !p.orderGiven {
			return perr(p.line, ErrKeyword, "a two-port file needs [Two-Port Data Order] 12_21 or 21_12 before [Network Data]")
		}
		p.inData, p.dataLine = true, p.line
	case "noise data":
		p.inData, p.inNoise = false, true
	case "end":
		p.ended = true
	default:
		return perr(p.line, ErrKeyword, "unknown or unsupported keyword [%s]", s[1:end])
	}
	return nil
}

func (p *parser) references(s string) error {
	for _, f := range strings.Fields(s) {
		v, err := strconv.ParseFloat(f, 64)
		if err != nil || !(v > 0) || math.IsInf(v, 0) {
			return perr(p.line, ErrNumber, "reference impedance %q must be a positive number of ohms", f)
		}
		if len(p.refs) == p.ports {
			return perr(p.line, ErrKeyword, "[Reference] has more values than the file's %d ports", p.ports)
		}
		p.refs = append(p.refs, v)
	}
	if len(p.refs) == p.ports {
		p.refPending = false
		if p.ports == 2 && p.refs[0] != p.refs[1] {
			return perr(p.refLine, ErrKeyword, "[Reference] %g and %g ohms differ: turnwise reads files with one reference impedance for both ports", p.refs[0], p.refs[1])
		}
		p.refGiven = true
	}
	return nil
}

func (p *parser) optionLine(s string) error {
	f := strings.Fields(s[1:])
	for i := 0; i < len(f); i++ {
		switch t := strings.ToUpper(f[i]); t {
		case "HZ":
			p.unit = 1
		case "KHZ":
			p.unit = 1e3
		case "MHZ":
			p.unit = 1e6
		case "GHZ":
			p.unit = 1e9
		case "S", "Y", "Z":
			p.param = Param(t[0])
		case "G", "H":
			return perr(p.line, ErrOptionLine, "parameter %s: turnwise reads S, Y and Z data", t)
		case "RI", "MA", "DB":
			p.format = t
		case "R":
			if i+1 >= len(f) {
				return perr(p.line, ErrOptionLine, "R needs the reference impedance after it, e.g. \"R 50\"")
			}
			i++
			v, err := strconv.ParseFloat(f[i], 64)
			if err != nil || !(v > 0) || math.IsInf(v, 0) {
				return perr(p.line, ErrOptionLine, "reference impedance %q must be a positive number of ohms", f[i])
			}
			p.optionR, p.optionRGiven = v, true
		default:
			return perr(p.line, ErrOptionLine, "%q is not an option: the line takes a unit (Hz kHz MHz GHz), a parameter (S Y Z), a format (RI MA DB) and R <ohms>", f[i])
		}
	}
	p.option = true
	return nil
}

func (p *parser) data(s string) error {
	fields := strings.Fields(s)
	vals := make([]float64, len(fields))
	for i, f := range fields {
		v, err := strconv.ParseFloat(f, 64)
		if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
			return perr(p.line, ErrNumber, "column %d: %q is not a finite number", i+1, f)
		}
		vals[i] = v
	}
	if p.ports == 0 {
		p.ports = p.extPorts
	}
	ports := p.ports
	if ports == 0 { // version 1.1 without a telling extension: the first line decides
		switch len(vals) {
		case 3:
			ports = 1
		case 9:
			ports = 2
		default:
			return perr(p.line, ErrColumns, "%d columns: a one-port line has 3 (frequency and one pair), a two-port line 9", len(vals))
		}
		p.ports = ports
	}
	want := 1 + 2*ports*ports
	freq := vals[0] * p.unit
	n := len(p.d.Points)
	if n > 0 && ports == 2 && !p.v2 && len(vals) == 5 && freq <= p.d.Points[n-1].Frequency {
		p.inNoise = true // version 1.1 noise parameters follow the network data
		return nil
	}
	if len(vals) != want {
		if ports == 1 && len(vals) == 9 && p.extPorts == 1 {
			return perr(p.line, ErrPorts, "9 columns is a two-port line, but the file name says one port (.s1p): rename it .s2p")
		}
		if ports == 2 && len(vals) == 3 && p.extPorts == 2 {
			return perr(p.line, ErrPorts, "3 columns is a one-port line, but the file name says two ports (.s2p): rename it .s1p")
		}
		return perr(p.line, ErrColumns, "%d columns, a %d-port line has %d (frequency and %d pairs)", len(vals), ports, want, want/2)
	}
	if !(freq >= 0) || math.IsInf(freq, 0) {
		return perr(p.line, ErrFrequency, "frequency %g must be zero or positive", vals[0])
	}
	if n > 0 && !(freq > p.d.Points[n-1].Frequency) {
		return perr(p.line, ErrFrequency, "frequency %s does not ascend (the line before has %s): frequencies must increase line by line",
			fields[0], strconv.FormatFloat(p.d.Points[n-1].Frequency/p.unit, 'g', -1, 64))
	}
	if p.v2 && p.nFreq > 0 && n == p.nFreq {
		return perr(p.line, ErrColumns, "more data lines than [Number of Frequencies] %d", p.nFreq)
	}
	pt := Point{Frequency: freq}
	pair := func(k int) (complex128, error) {
		a, b := vals[1+2*k], vals[2+2*k]
		var v complex128
		switch p.format {
		case "RI":
			v = complex(a, b)
		case "MA":
			v = cmplx.Rect(a, b*math.Pi/180)
		default:
			v = cmplx.Rect(math.Pow(10, a/20), b*math.Pi/180)
		}
		if cmplx.IsInf(v) || cmplx.IsNaN(v) {
			return 0, perr(p.line, ErrNumber, "pair %d (%g, %g) is not a finite value", k+1, a, b)
		}
		return v, nil
	}
	idx := [][2]int{{0, 0}}
	if ports == 2 {
		idx = [][2]int{{0, 0}, {1, 0}, {0, 1}, {1, 1}} // version 1.1 and 2.0's 21_12
		if p.v2 && !p.order21 {
			idx = [][2]int{{0, 0}, {0, 1}, {1, 0}, {1, 1}}
		}
	}
	for k, ij := range idx {
		v, err := pair(k)
		if err != nil {
			return err
		}
		pt.M[ij[0]][ij[1]] = v
	}
	p.d.Points = append(p.d.Points, pt)
	return nil
}

func (p *parser) finish() (Data, error) {
	if p.refPending {
		return Data{}, perr(p.refLine, ErrKeyword, "[Reference] has %d values, the file has %d ports", len(p.refs), p.ports)
	}
	if !p.option {
		return Data{}, perr(0, ErrOptionLine, "missing option line: a Touchstone file states its units, e.g. \"# MHz S RI R 50\"")
	}
	if p.v2 && !p.ended {
		return Data{}, perr(0, ErrKeyword, "a version 2.0 file ends with [End]")
	}
	if len(p.d.Points) == 0 {
		return Data{}, perr(0, ErrEmpty, "no data lines")
	}
	if p.v2 && p.nFreq > 0 && len(p.d.Points) != p.nFreq {
		return Data{}, perr(0, ErrColumns, "%d data lines, [Number of Frequencies] says %d", len(p.d.Points), p.nFreq)
	}
	if p.v2 && p.nFreq == 0 {
		return Data{}, perr(p.dataLine, ErrKeyword, "a version 2.0 file needs [Number of Frequencies] before [Network Data]")
	}
	if p.extPorts != 0 && p.ports != p.extPorts {
		return Data{}, perr(p.portsLine, ErrPorts, "%d-port data contradicts the file name's .s%dp", p.ports, p.extPorts)
	}
	d := p.d
	d.Ports, d.Param = p.ports, p.param
	if p.optionRGiven {
		d.Z0 = p.optionR
	}
	if p.refGiven {
		d.Z0 = p.refs[0]
	}
	if !p.v2 { // version 1.1 normalises Y and Z to the reference
		for i := range d.Points {
			for r := range 2 {
				for c := range 2 {
					switch d.Param {
					case Z:
						d.Points[i].M[r][c] *= complex(d.Z0, 0)
					case Y:
						d.Points[i].M[r][c] /= complex(d.Z0, 0)
					}
				}
			}
		}
	}
	return d, nil
}
