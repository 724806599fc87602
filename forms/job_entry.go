package forms

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"time"
	"turnwise/internal/quantity"
)

// Reading the values of one table of a job file, each error at its line.

// jobEntry reads keys of one table: the top level or a [[coil]].
type jobEntry struct {
	l     *jobLoader
	m     map[string]any
	label string // `coil "L1"`; empty at the top level
	line  func(key string) int
	typo  bool // has unknown keys: a missing key is then likely misspelt
}

func (e *jobEntry) fail(key, field string, err error) {
	f := e.label
	if field != "" {
		if f != "" {
			f += ": "
		}
		f += field
	}
	e.l.fail(e.line(key), f, err)
}

func (e *jobEntry) missing(err error) {
	if !e.typo {
		e.fail("", "", err)
	}
}

// str returns the text of key; ok is false when absent or not text.
func (e *jobEntry) str(key string, required bool, example string) (string, bool) {
	return tableString(e.m, key, required, example, e.fail, e.missing)
}

// choice reads key as one of choices (case ignored) and returns the
// canonical spelling.
func (e *jobEntry) choice(key string, choices []string) (string, bool) {
	s, ok := e.str(key, false, strconv.Quote(choices[0]))
	if !ok {
		return "", false
	}
	for _, c := range choices {
		if strings.EqualFold(strings.TrimSpace(s), c) {
			return c, true
		}
	}
	e.fail(key, key, fmt.Errorf("%q is not one of %s", s, strings.Join(choices, ", ")))
	return "", false
}

// number reads key as a TOML number or a number in quotes.
func (e *jobEntry) number(key, example string) (float64, bool) {
	v, present := e.m[key]
	if !present {
		return 0, false
	}
	var x float64
	switch v := v.(type) {
	case int64:
		x = float64(v)
	case float64:
		x = v
	case string:
		f, err := strconv.ParseFloat(strings.TrimSpace(v), 64)
		if err != nil {
			e.fail(key, key, fmt.Errorf("%q is not a number; e.g. %s = %s", v, key, example))
			return 0, false
		}
		x = f
	default:
		e.fail(key, key, fmt.Errorf("is a %s; write a number, e.g. %s = %s", tomlType(v), key, example))
		return 0, false
	}
	if math.IsNaN(x) || math.IsInf(x, 0) {
		e.fail(key, key, fmt.Errorf("must be a finite number, e.g. %s = %s", key, example))
		return 0, false
	}
	return x, true
}

// boolean reads key as true or false; ok is false when absent or not a
// boolean.
func (e *jobEntry) boolean(key string) (v, ok bool) {
	x, present := e.m[key]
	if !present {
		return false, false
	}
	switch x := x.(type) {
	case bool:
		return x, true
	case string:
		e.fail(key, key, fmt.Errorf("%q is text; write %s = true or false, without quotes", x, key))
	default:
		e.fail(key, key, fmt.Errorf("is a %s; write %s = true or false", tomlType(x), key))
	}
	return false, false
}

// integer reads key as a whole number within [lo, hi].
func (e *jobEntry) integer(key string, lo, hi int, example string) (int, bool) {
	x, ok := e.number(key, example)
	if !ok {
		return 0, false
	}
	if x != math.Trunc(x) || x < float64(lo) || x > float64(hi) {
		e.fail(key, key, fmt.Errorf("%v is not a whole number from %d to %d", x, lo, hi))
		return 0, false
	}
	return int(x), true
}

// quantityOf reads key as text with a unit, parsed by parse; the value must
// be positive (or zero when zeroOK).
func quantityOf[T ~float64](e *jobEntry, key, example string, parse func(string) (T, error), zeroOK bool) (*T, bool) {
	s, ok := e.str(key, false, example)
	if !ok {
		return nil, false
	}
	v, err := parse(s)
	if err != nil {
		e.fail(key, key, err)
		return nil, false
	}
	if v < 0 || (v == 0 && !zeroOK) {
		e.fail(key, key, fmt.Errorf("must be positive, e.g. %s = %s", key, example))
		return nil, false
	}
	return &v, true
}

// fraction reads key as a number (0.25) or a percentage ("25%").
func (e *jobEntry) fraction(key, example string) (*float64, bool) {
	v, present := e.m[key]
	if !present {
		return nil, false
	}
	if s, isStr := v.(string); isStr && strings.Contains(s, "%") {
		x, err := quantity.ParsePercent(s)
		if err != nil {
			e.fail(key, key, err)
			return nil, false
		}
		return &x, true
	}
	x, ok := e.number(key, example)
	if !ok {
		return nil, false
	}
	return &x, true
}

// date reads key as a TOML date or "YYYY-MM-DD" text.
func (e *jobEntry) date(key string) time.Time {
	v, present := e.m[key]
	if !present {
		return time.Time{}
	}
	switch v := v.(type) {
	case time.Time:
		return time.Date(v.Year(), v.Month(), v.Day(), 0, 0, 0, 0, time.UTC)
	case string:
		t, err := time.Parse("2006-01-02", strings.TrimSpace(v))
		if err == nil {
			return t
		}
	}
	e.fail(key, key, errors.New("write a date as 2026-03-14"))
	return time.Time{}
}
