package coil

import (
	"fmt"
	"strings"
)

// The enums below name where a coil's build choices came from and how it is
// held. SupportKind, PitchSource and SpringbackSource are string types whose
// values are the words turnwise has always printed and written to JSON, so a
// record marshals byte for byte as before; each has a Parse function that
// lists the choices when a word is not one of them. Mounting is an int whose
// zero value is the default (one end grounded).

// SupportKind is what the coil is wound on.
type SupportKind string

const (
	// SupportMandrel: wound on a mandrel that is slid out afterwards; the
	// coil is self-supporting and springs back.
	SupportMandrel SupportKind = "mandrel"
	// SupportFormer: wound on a former that stays inside the coil.
	SupportFormer SupportKind = "former"
)

// SupportKinds lists every SupportKind in the order they are offered.
var SupportKinds = []SupportKind{SupportMandrel, SupportFormer}

func (k SupportKind) String() string { return string(k) }

// ParseSupportKind reads "mandrel" or "former" (case and surrounding space
// ignored).
func ParseSupportKind(s string) (SupportKind, error) {
	return parseEnum("support kind", s, SupportKinds)
}

// UnmarshalText accepts only the words ParseSupportKind accepts.
func (k *SupportKind) UnmarshalText(b []byte) error {
	v, err := ParseSupportKind(string(b))
	if err == nil {
		*k = v
	}
	return err
}

// PitchSource says how a coil's pitch was chosen.
type PitchSource string

const (
	// PitchGiven: the pitch was given directly (or chosen by the design
	// search).
	PitchGiven PitchSource = "pitch"
	// PitchFromLength: the pitch follows from a measured winding length.
	PitchFromLength PitchSource = "length"
	// PitchCloseWound: turns touch; the pitch is the wire's overall
	// diameter.
	PitchCloseWound PitchSource = "close-wound"
)

// PitchSources lists every PitchSource.
var PitchSources = []PitchSource{PitchGiven, PitchFromLength, PitchCloseWound}

func (p PitchSource) String() string { return string(p) }

// ParsePitchSource reads "pitch", "length" or "close-wound".
func ParsePitchSource(s string) (PitchSource, error) {
	return parseEnum("pitch source", s, PitchSources)
}

// UnmarshalText accepts only the words ParsePitchSource accepts.
func (p *PitchSource) UnmarshalText(b []byte) error {
	v, err := ParsePitchSource(string(b))
	if err == nil {
		*p = v
	}
	return err
}

// SpringbackSource says where a mandrel coil's springback came from.
type SpringbackSource string

const (
	// SpringbackGiven: given by the user, on the command line or with the
	// support's stock row.
	SpringbackGiven SpringbackSource = "given"
	// SpringbackCalibration: from a saved calibration of this support and
	// wire (turnwise trim --save).
	SpringbackCalibration SpringbackSource = "calibration"
	// SpringbackNone: none known; 0 assumed.
	SpringbackNone SpringbackSource = "none"
	// SpringbackOnFormer: the coil stays on its former, so it cannot spring
	// back.
	SpringbackOnFormer SpringbackSource = "former"
)

// SpringbackSources lists every SpringbackSource.
var SpringbackSources = []SpringbackSource{SpringbackGiven, SpringbackCalibration, SpringbackNone, SpringbackOnFormer}

func (s SpringbackSource) String() string { return string(s) }

// ParseSpringbackSource reads "given", "calibration", "none" or "former".
func ParseSpringbackSource(s string) (SpringbackSource, error) {
	return parseEnum("springback source", s, SpringbackSources)
}

// UnmarshalText accepts only the words ParseSpringbackSource accepts.
func (s *SpringbackSource) UnmarshalText(b []byte) error {
	v, err := ParseSpringbackSource(string(b))
	if err == nil {
		*s = v
	}
	return err
}

// Mounting is how the coil's ends sit relative to ground, which sets how its
// self-capacitance loads it at self-resonance.
type Mounting int

const (
	// Grounded: one end grounded, the other driven (the default, and the
	// case the self-resonance model describes).
	Grounded Mounting = iota
	// Floating: both ends floating above ground.
	Floating
)

// Mountings lists every Mounting.
var Mountings = []Mounting{Grounded, Floating}

func (m Mounting) String() string {
	switch m {
	case Grounded:
		return "grounded"
	case Floating:
		return "floating"
	}
	return fmt.Sprintf("Mounting(%d)", int(m))
}

// ParseMounting reads "grounded" or "floating".
func ParseMounting(s string) (Mounting, error) {
	return parseEnum("mounting", s, Mountings)
}

// MarshalText writes the word ParseMounting reads; an out-of-range value is
// an error.
func (m Mounting) MarshalText() ([]byte, error) {
	if m != Grounded && m != Floating {
		return nil, fmt.Errorf("coil: %v is not a mounting", m)
	}
	return []byte(m.String()), nil
}

// UnmarshalText accepts only the words ParseMounting accepts.
func (m *Mounting) UnmarshalText(b []byte) error {
	v, err := ParseMounting(string(b))
	if err == nil {
		*m = v
	}
	return err
}

// parseEnum finds s among choices by their String, ignoring case and
// surrounding space; the error names what was parsed and lists the choices.
func parseEnum[T fmt.Stringer](what, s string, choices []T) (T, error) {
	w := strings.ToLower(strings.TrimSpace(s))
	names := make([]string, len(choices))
	for i, c := range choices {
		if c.String() == w {
			return c, nil
		}
		names[i] = c.String()
	}
	var zero T
	return zero, fmt.Errorf("%s %q is not one of %s", what, s, strings.Join(names, ", "))
}
