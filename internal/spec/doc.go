// Package spec turns what a user describes — catalog rows and values from
// flags or a job file — into the model's inputs, with the provenance the
// outputs print. It owns the one coil builder (Resolve for a described
// winding, FromCandidate for a design candidate: support name and kind,
// pitch source, springback source, wire row, conductor, close-wound
// detection), the glue into the design search (Search), the two-gang
// settings (BuildSpan), job files (LoadJob, JobCatalog, ResolveJobCoil)
// and the build-sheet pages of job coils (JobSheetCoil). It never prints
// and never exits; bad input is a *UsageError or *FlagError naming the
// command's flag (a job file's key has the same name).
//
// It imports coil, coil/*, forms, internal/quantity and sheets; never cmd
// or cobra.
//
// References: none of its own; the physics and its sources are in coil
// and coil/* (see their doc.go), the catalog data sources in
// testdata/SOURCES.md.
package spec
