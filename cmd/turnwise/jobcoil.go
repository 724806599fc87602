package main

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"

	"turnwise/coil"
	"turnwise/forms"
)

// Job files: read one, pick its stock, and turn a coil entry into the same
// coilSpec that predict's flags give. sheet uses these, and trim --job.

// loadJobFile reads and checks a job file. A missing file is a usage error,
// a malformed one a *forms.ParseError with the line (both exit 2).
func loadJobFile(path string) (*forms.Job, error) {
	f, err := os.Open(path)
	if err != nil {
		if errors.Is(err, os.ErrNotExist) {
			return nil, usageErrorf("job file %q does not exist; check the path (the demo is testdata/club-night.toml)", path)
		}
		return nil, fmt.Errorf("read job file: %w", err)
	}
	defer f.Close()
	return forms.LoadJob(f, path)
}

// jobStockOptions returns the stock selection for a job: the command line's
// when --stock or --use was given there (flagsGiven), else the job file's
// own stock = and use = keys, the stock path taken relative to the job file.
func jobStockOptions(job *forms.Job, so *stockOptions, flagsGiven bool) *stockOptions {
	if flagsGiven || (job.Stock == "" && job.Use == "") {
		return so
	}
	out := newStockOptions()
	out.path = job.Stock
	if out.path != "" && !filepath.IsAbs(out.path) {
		out.path = filepath.Join(filepath.Dir(job.File), out.path)
	}
	out.use.v = job.Use
	return out
}

// jobCatalog loads the catalogs a job draws on; a stock file named in the
// job that cannot be read is reported at its line.
func jobCatalog(job *forms.Job, so *stockOptions, flagsGiven bool) (*forms.Catalog, error) {
	opts := jobStockOptions(job, so, flagsGiven)
	cat, err := opts.load()
	if err != nil && opts != so {
		var ue *usageError
		if errors.As(err, &ue) {
			return nil, &forms.ParseError{Kind: "job", File: job.File, Line: job.KeyLine("stock"), Field: "stock",
				Err: fmt.Errorf("%q (read as %s) cannot be used: %w", job.Stock, opts.path, ue)}
		}
	}
	return cat, err
}

// jobCoilOptions fills predict's coil flags from a fixed-winding coil entry:
// the job keys have the flags' names.
func jobCoilOptions(c *forms.JobCoil) (coilOptions, error) {
	w := c.Winding
	if c.Target != nil || w.Turns == nil {
		return coilOptions{}, jobFieldError(&forms.Job{}, c, "", fmt.Errorf("is a design target, not a fixed winding; run the design search for it first"))
	}
	o := coilOptions{
		mandrel:    w.Mandrel,
		former:     w.Former,
		wire:       w.Wire,
		insulation: w.Insulation,
		conductor:  w.Conductor,
	}
	o.turns = turnsFlag{raw: c.Raw("turns"), v: *w.Turns, set: true}
	if w.Springback != nil {
		o.springback = percentFlag{raw: c.Raw("springback"), v: *w.Springback, set: true}
	}
	if w.Pitch != nil {
		o.pitch = lengthFlag{raw: c.Raw("pitch"), v: *w.Pitch, set: true}
	}
	if w.Length != nil {
		o.length = lengthFlag{raw: c.Raw("length"), v: *w.Length, set: true}
	}
	if w.Leads != nil {
		o.leads = lengthFlag{raw: c.Raw("leads"), v: *w.Leads, set: true}
	}
	if w.Temp != nil {
		o.temp = temperatureFlag{raw: c.Raw("temp"), v: *w.Temp, set: true}
	}
	return o, nil
}

// jobFreq is the coil's operating frequency, zero when none was given.
func jobFreq(c *forms.JobCoil) frequencyFlag {
	if c.Winding.Freq == nil {
		return frequencyFlag{}
	}
	return frequencyFlag{raw: c.Raw("freq"), v: *c.Winding.Freq, set: true}
}

// resolveJobCoil resolves a fixed-winding coil of a job to the coilSpec
// predict uses. Errors are *forms.ParseError at the line of the key at
// fault.
func resolveJobCoil(job *forms.Job, c *forms.JobCoil, cat *forms.Catalog) (coilSpec, error) {
	o, err := jobCoilOptions(c)
	if err != nil {
		return coilSpec{}, withJobFile(err, job)
	}
	spec, err := o.resolve(cat)
	if err != nil {
		return spec, jobCoilError(job, c, err)
	}
	return spec, nil
}

// predictJobCoil resolves a fixed-winding coil and evaluates the model at
// its operating frequency, as `turnwise predict` does with the same flags.
func predictJobCoil(job *forms.Job, c *forms.JobCoil, cat *forms.Catalog) (coilSpec, coil.Prediction, error) {
	spec, err := resolveJobCoil(job, c, cat)
	if err != nil {
		return spec, coil.Prediction{}, err
	}
	o, _ := jobCoilOptions(c)
	p, err := coil.Predict(spec.Geometry, jobFreq(c).v)
	if err != nil {
		return spec, p, jobCoilError(job, c, o.attachFlag(err, spec.SupportKind, spec.PitchSource))
	}
	return spec, p, nil
}

// jobCoilError maps an error from the coil-flag layer (a *flagError naming
// a flag, or a usage error) to the job file: the flag's name is the key's.
func jobCoilError(job *forms.Job, c *forms.JobCoil, err error) error {
	var fe *flagError
	if errors.As(err, &fe) {
		return jobFieldError(job, c, fe.flag, fe.err)
	}
	var ue *usageError
	if errors.As(err, &ue) {
		return jobFieldError(job, c, "", ue)
	}
	if errors.Is(err, coil.ErrInfeasible) {
		return fmt.Errorf("job %q: line %d: %s: %w", job.File, c.Line, c.Label(), err)
	}
	return jobFieldError(job, c, "", err)
}

// jobFieldError reports err at key of coil c (the coil's own line when key
// is ""). Model errors (*coil.InputError) print their reason only, since the
// key already names the field.
func jobFieldError(job *forms.Job, c *forms.JobCoil, key string, err error) error {
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
