package forms

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"strings"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// GangPoint is one measured row of a two-gang capacitor: the capacitance
// of section A (and B, when measured) at a dial setting from 0 (plates
// fully open) to 1 (fully meshed).
type GangPoint struct {
	Setting float64
	A, B    unit.Capacitance
}

// GangTable is a measured capacitance law. HasB is false when the file
// gives one column, which then stands for both sections.
type GangTable struct {
	Points []GangPoint
	HasB   bool
}

// LoadGangTable reads a measured capacitor law: one row per dial setting,
// the setting in percent of the rotation from plates open (0 %) to fully
// meshed (100 %), then the capacitance of section A and optionally of
// section B, with units:
//
//	# dial   A       B
//	0%       16pF    15pF
//	25%      70pF    68pF
//	100%     368pF   362pF
//
// Fields are separated by spaces, tabs or commas; '#' starts a comment.
// Settings must start at 0 %, end at 100 % and rise; capacitance must not
// fall as the plates mesh. Errors are *ParseError with the line number.
func LoadGangTable(r io.Reader, file string) (GangTable, error) {
	var t GangTable
	sc := bufio.NewScanner(r)
	line, cols := 0, 0
	fail := func(format string, args ...any) (GangTable, error) {
		return GangTable{}, &ParseError{Kind: "capacitor table", File: file, Line: line, Err: fmt.Errorf(format, args...)}
	}
	for sc.Scan() {
		line++
		if line > maxBandLines {
			return fail("more than %d lines; is this the right file?", maxBandLines)
		}
		text, _, _ := strings.Cut(sc.Text(), "#")
		fields := strings.FieldsFunc(text, func(r rune) bool { return r == ',' || r == ' ' || r == '\t' })
		if len(fields) == 0 {
			continue
		}
		if len(fields) < 2 || len(fields) > 3 {
			return fail("%d fields; write the dial setting and one or two capacitances, e.g. 50%% 120pF 118pF", len(fields))
		}
		if cols == 0 {
			cols = len(fields)
			t.HasB = cols == 3
		} else if len(fields) != cols {
			return fail("%d fields where the first row had %d; give section B on every row or on none", len(fields), cols)
		}
		s, err := quantity.ParsePercent(fields[0])
		if err != nil {
			return fail("dial setting: %w", err)
		}
		if s < 0 || s > 1 {
			return fail("dial setting %s is outside 0 … 100 %%", fields[0])
		}
		var p GangPoint
		p.Setting = s
		if p.A, err = quantity.ParseCapacitance(fields[1]); err != nil {
			return fail("section A: %w", err)
		}
		p.B = p.A
		if cols == 3 {
			if p.B, err = quantity.ParseCapacitance(fields[2]); err != nil {
				return fail("section B: %w", err)
			}
		}
		if p.A < 0 || p.B < 0 || p.A > 1e-6 || p.B > 1e-6 {
			return fail("capacitance must be between 0 and 1 µF")
		}
		if n := len(t.Points); n > 0 {
			prev := t.Points[n-1]
			if p.Setting <= prev.Setting {
				return fail("dial setting %s does not rise above the previous row's %.4g %%", fields[0], prev.Setting*100)
			}
			if p.A < prev.A || p.B < prev.B {
				return fail("capacitance falls from the previous row; it must rise as the plates mesh")
			}
		} else if p.Setting != 0 {
			return fail("the first row must be at 0 %% (plates fully open)")
		}
		t.Points = append(t.Points, p)
	}
	if err := sc.Err(); err != nil {
		return fail("%w", err)
	}
	if len(t.Points) < 2 {
		return fail("needs at least two rows, at 0 %% and 100 %%")
	}
	if last := t.Points[len(t.Points)-1]; math.Abs(last.Setting-1) > 1e-12 {
		if last.Setting <= 0.01 {
			// Settings written as fractions of the rotation, 0 … 1.
			return fail("the last row must be at 100 %% (plates fully meshed); settings are percentages, so a bare 1 means 1 %%: write 100%%")
		}
		return fail("the last row must be at 100 %% (plates fully meshed)")
	}
	t.Points[len(t.Points)-1].Setting = 1
	return t, nil
}
