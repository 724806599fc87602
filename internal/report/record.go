package report

import (
	"encoding/json"
	"io"
	"turnwise/coil"
	"turnwise/internal/spec"
)

// SchemaVersion is the "schema" field of every JSON document; it changes
// only when a key changes meaning or disappears.
const SchemaVersion = 1

// CoilRecord is the JSON form of one predicted coil: every number in SI
// base units (m, H, F, Hz, Ω, kg, K). Keys are documented in README.md.
type CoilRecord struct {
	// Build.
	Support             string  `json:"support"`      // "mandrel" or "former"
	SupportName         string  `json:"support_name"` // stock name or "6mm rod"
	FormerDiameter      float64 `json:"former_diameter"`
	Springback          float64 `json:"springback"` // fraction
	SpringbackSource    string  `json:"springback_source"`
	Wire                string  `json:"wire"`
	WireSource          string  `json:"wire_source"`
	Insulation          string  `json:"insulation"`
	Conductor           string  `json:"conductor"`
	Turns               float64 `json:"turns"`
	Pitch               float64 `json:"pitch"`
	MeanDiameter        float64 `json:"mean_diameter"`
	WireDiameter        float64 `json:"wire_diameter"`
	WireOverallDiameter float64 `json:"wire_overall_diameter"`
	InsideDiameter      float64 `json:"inside_diameter"`
	OutsideDiameter     float64 `json:"outside_diameter"`
	WindingLength       float64 `json:"winding_length"` // outside, (N−1)·p + d_o
	SheetLength         float64 `json:"sheet_length"`   // N·p
	LeadLength          float64 `json:"lead_length"`    // each lead
	WireLength          float64 `json:"wire_length"`    // to cut
	WireLengthWinding   float64 `json:"wire_length_winding"`
	CutAllowance        float64 `json:"cut_allowance"`
	CopperMass          float64 `json:"copper_mass"`
	Temperature         float64 `json:"temperature"`

	// Model.
	Frequency            float64  `json:"frequency"` // 0 when none was given
	Inductance           float64  `json:"inductance"`
	InductanceCoil       float64  `json:"inductance_coil"`
	InductanceCoilAtF    float64  `json:"inductance_coil_at_f"`
	InductanceLeads      float64  `json:"inductance_leads"`
	InductanceSheet      float64  `json:"inductance_sheet"`
	Nagaoka              float64  `json:"nagaoka"`
	RosaKs               float64  `json:"rosa_k_s"`
	RosaKm               float64  `json:"rosa_k_m"`
	InternalFraction     float64  `json:"internal_inductance_fraction"`
	InductanceWheeler    float64  `json:"inductance_wheeler"`
	WheelerInRange       bool     `json:"wheeler_in_range"`
	SelfCapacitance      float64  `json:"self_capacitance"`
	SRF                  float64  `json:"srf"`
	SRFMin               float64  `json:"srf_min"`
	SRFMax               float64  `json:"srf_max"`
	SRFMounting          string   `json:"srf_mounting"`
	SRFFloatingMin       float64  `json:"srf_floating_min"`
	SRFFloatingMax       float64  `json:"srf_floating_max"`
	InductanceEffective  float64  `json:"inductance_effective"`
	RDC                  float64  `json:"r_dc"`
	SkinDepth            float64  `json:"skin_depth,omitempty"`
	ProximityFactor      float64  `json:"proximity_factor,omitempty"`
	RAC                  float64  `json:"r_ac,omitempty"`
	Q                    float64  `json:"q,omitempty"`
	QMin                 float64  `json:"q_min,omitempty"`
	QMax                 float64  `json:"q_max,omitempty"`
	TrimLengthPerPercent float64  `json:"trim_length_per_percent,omitempty"`
	Warnings             []string `json:"warnings"`
}

func NewCoilRecord(s spec.Spec, p coil.Prediction) CoilRecord {
	g := p.Geometry
	overall := g.OverallDiameter()
	temp := float64(g.Temperature)
	if temp == 0 {
		temp = 293.15
	}
	w := p.Warnings()
	if w == nil {
		w = []string{}
	}
	return CoilRecord{
		Support:             s.SupportKind.String(),
		SupportName:         s.SupportName,
		FormerDiameter:      float64(g.FormerDiameter),
		Springback:          g.Springback,
		SpringbackSource:    s.SpringbackSource.String(),
		Wire:                s.Wire.Name,
		WireSource:          s.Wire.Source,
		Insulation:          s.Wire.Insulation,
		Conductor:           g.Conductor.String(),
		Turns:               g.Turns,
		Pitch:               float64(g.Pitch),
		MeanDiameter:        float64(p.MeanDiameter),
		WireDiameter:        float64(g.WireDiameter),
		WireOverallDiameter: float64(overall),
		InsideDiameter:      float64(p.InsideDiameter),
		OutsideDiameter:     float64(p.OutsideDiameter),
		WindingLength:       float64(p.WindingLength),
		SheetLength:         float64(p.SheetLength),
		LeadLength:          float64(g.LeadLength),
		WireLength:          float64(p.WireLength),
		WireLengthWinding:   float64(p.HelixWire),
		CutAllowance:        float64(coil.CutAllowance),
		CopperMass:          float64(p.CopperMass),
		Temperature:         temp,

		Frequency:           float64(p.Frequency),
		Inductance:          float64(p.Inductance),
		InductanceCoil:      float64(p.InductanceCoil),
		InductanceCoilAtF:   float64(p.InductanceCoilAtF),
		InductanceLeads:     float64(p.InductanceLeads),
		InductanceSheet:     float64(p.InductanceSheet),
		Nagaoka:             p.Nagaoka,
		RosaKs:              p.SelfCorrection,
		RosaKm:              p.MutualCorrection,
		InternalFraction:    p.InternalFraction,
		InductanceWheeler:   float64(p.InductanceWheeler),
		WheelerInRange:      p.WheelerValid,
		SelfCapacitance:     float64(p.SelfCapacitance),
		SRF:                 float64(p.SRF),
		SRFMin:              float64(p.SRFMin),
		SRFMax:              float64(p.SRFMax),
		SRFMounting:         "one end grounded",
		SRFFloatingMin:      float64(p.SRFFloatingMin),
		SRFFloatingMax:      float64(p.SRFFloatingMax),
		InductanceEffective: float64(p.InductanceEffective),
		RDC:                 float64(p.RDC),
		SkinDepth:           float64(p.SkinDepth),
		ProximityFactor:     p.ProximityFactor,
		RAC:                 float64(p.RAC),
		Q:                   p.Q,
		QMin:                p.QMin,
		QMax:                p.QMax,
		Warnings:            w,
	}
}

// writeJSON encodes v indented, as every command prints JSON.
func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}
