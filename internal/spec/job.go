package spec

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"

	"turnwise/coil"
	"turnwise/forms"

	"gonum.org/v1/gonum/unit"
)

// Job files: read one, pick its stock, and turn a coil entry into the same
// Spec that predict's flags give. sheet uses these, and trim --job.

// LoadJob reads and checks a job file. A missing file is a usage error,
// a malformed one a *forms.ParseError with the line (both exit 2).
func LoadJob(path string) (*forms.Job, error) {
	f, err := os.Open(path)
	if err != nil {
		if errors.Is(err, os.ErrNotExist) {
			return nil, Usagef("job file %q does not exist; check the path (the demo is testdata/club-night.toml)", path)
		}
		return nil, fmt.Errorf("read job file: %w", err)
	}
	defer f.Close()
	return forms.LoadJob(f, path)
}

// LoadCatalog reads the catalogs a command draws on: use is builtin, mine
// or both ("" for both when path names a stock file, else builtin). A
// named stock file that is missing or malformed is bad input.
func LoadCatalog(path, use string) (*forms.Catalog, error) {
	if use == "" {
		use = "builtin"
		if path != "" {
			use = "both"
		}
	}
	var cats []*forms.Catalog
	if use == "builtin" || use == "both" {
		b, err := forms.BuiltIn()
		if err != nil {
			return nil, err
		}
		cats = append(cats, b)
	}
	if use == "mine" || use == "both" {
		if path == "" {
			return nil, Usagef("--use %s: no stock file; give --stock FILE or set TURNWISE_STOCK", use)
		}
		f, err := os.Open(path)
		if err != nil {
			if os.IsNotExist(err) {
				return nil, Usagef("--stock: %q does not exist; check the path, or start one with `turnwise stock --template > %s`", path, path)
			}
			return nil, err
		}
		defer f.Close()
		mine, err := forms.LoadStock(f, path)
		if err != nil {
			return nil, err
		}
		cats = append(cats, mine)
	}
	return forms.Merge(cats...), nil
}

// JobCatalog loads the catalogs a job draws on: the command line's stock
// and use when given there (flagsGiven), else the job file's own stock =
// and use = keys, the stock path taken relative to the job file. A stock
// file named in the job that cannot be read is reported at its line.
func JobCatalog(job *forms.Job, path, use string, flagsGiven bool) (*forms.Catalog, error) {
	if flagsGiven || (job.Stock == "" && job.Use == "") {
		return LoadCatalog(path, use)
	}
	path, use = JobStock(job, path, use, flagsGiven)
	cat, err := LoadCatalog(path, use)
	if err != nil {
		var ue *UsageError
		if errors.As(err, &ue) {
			return nil, &forms.ParseError{Kind: "job", File: job.File, Line: job.KeyLine("stock"), Field: "stock",
				Err: fmt.Errorf("%q (read as %s) cannot be used: %s", job.Stock, path, ue.Msg)}
		}
	}
	return cat, err
}

// JobPath is a path named in a job file as read: an absolute path as it
// stands, a relative one taken from the job file's directory.
func JobPath(job *forms.Job, p string) string {
	if filepath.IsAbs(p) {
		return p
	}
	return filepath.Join(filepath.Dir(job.File), p)
}

// fixedWinding refuses a coil entry that is a design target.
func fixedWinding(c *forms.JobCoil) error {
	if c.Target != nil || c.Winding.Turns == nil {
		return JobFieldError(&forms.Job{}, c, "", fmt.Errorf("is a design target, not a fixed winding; run the design search for it first"))
	}
	return nil
}

// ResolveJobCoil resolves a fixed-winding coil of a job with Resolve, as
// predict's flags of the same names would. Errors are *forms.ParseError at
// the line of the key at fault.
func ResolveJobCoil(job *forms.Job, c *forms.JobCoil, cat *forms.Catalog) (Spec, error) {
	if err := fixedWinding(c); err != nil {
		return Spec{}, withJobFile(err, job)
	}
	spec, err := Resolve(cat, c.Winding)
	if err != nil {
		return spec, JobCoilError(job, c, err)
	}
	return spec, nil
}

// PredictJobCoil resolves a fixed-winding coil and evaluates the model at
// its operating frequency, as `turnwise predict` does with the same flags.
func PredictJobCoil(job *forms.Job, c *forms.JobCoil, cat *forms.Catalog) (Spec, coil.Prediction, error) {
	spec, err := ResolveJobCoil(job, c, cat)
	if err != nil {
		return spec, coil.Prediction{}, err
	}
	var f unit.Frequency
	if c.Winding.Freq != nil {
		f = *c.Winding.Freq
	}
	p, err := coil.Predict(spec.Geometry, f)
	if err != nil {
		return spec, p, JobCoilError(job, c, AttachFlag(err, spec.SupportKind.String(), spec.PitchSource))
	}
	return spec, p, nil
}

// JobCoilError maps an error from the coil-flag layer (a *FlagError naming
// a flag, or a usage error) to the job file: the flag's name is the key's.
func JobCoilError(job *forms.Job, c *forms.JobCoil, err error) error {
	var fe *FlagError
	if errors.As(err, &fe) {
		return JobFieldError(job, c, fe.Flag, fe.Err)
	}
	var ue *UsageError
	if errors.As(err, &ue) {
		return JobFieldError(job, c, "", errors.New(ue.Msg))
	}
	if errors.Is(err, coil.ErrInfeasible) {
		return fmt.Errorf("job %q: line %d: %s: %w", job.File, c.Line, c.Label(), err)
	}
	return JobFieldError(job, c, "", err)
}

// JobFieldError reports err at key of coil c (the coil's own line when key
// is ""). Model errors (*coil.InputError) print their reason only, since the
// key already names the field.
func JobFieldError(job *forms.Job, c *forms.JobCoil, key string, err error) error {
	field := c.Label()
	if key != "" {
		field += ": " + key
	}
	var ie *coil.InputError
	if errors.As(err, &ie) {
		err = &reasonError{err: err, reason: ie.Reason}
	}
	return &forms.ParseError{Kind: "job", File: job.File, Line: c.KeyLine(key), Field: field, Err: err}
}

// withJobFile fills in the file name of a ParseError made without one.
func withJobFile(err error, job *forms.Job) error {
	var pe *forms.ParseError
	if errors.As(err, &pe) && pe.File == "" {
		pe.File = job.File
	}
	return err
}

// reasonError prints a model error's reason alone and still unwraps to it.
type reasonError struct {
	err    error
	reason string
}

func (e *reasonError) Error() string { return e.reason }
func (e *reasonError) Unwrap() error { return e.err }

// CatalogNames lists the names of the catalog's wires, mandrels or formers
// (kind "wire", "mandrel" or "former"), for flag completion.
func CatalogNames(cat *forms.Catalog, kind string) []string {
	var names []string
	switch kind {
	case "wire":
		for _, w := range cat.Wires {
			names = append(names, w.Name)
		}
	case "mandrel":
		for _, m := range cat.Mandrels {
			names = append(names, m.Name)
		}
	case "former":
		for _, f := range cat.Formers {
			names = append(names, f.Name)
		}
	}
	return names
}
