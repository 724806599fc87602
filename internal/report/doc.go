// Package report renders results as the commands print them: the text
// tables and JSON records of predict, design, tap, span (with its text
// chart), trim (with the wording of its findings) and stock. Writers take
// plain result values (coil.Prediction, design.Result, tuning.Span,
// report.Trim, spec.Spec for provenance) and an io.Writer, and return
// errors. JSON numbers are SI base units with snake_case keys and a
// warnings array; lengths in tables print through internal/quantity, as
// the build sheets do.
//
// It imports coil, coil/*, forms, internal/quantity and internal/spec;
// never cmd or cobra.
//
// References: none of its own; what it prints is computed in coil and
// coil/* (see their doc.go for the published methods).
package report
