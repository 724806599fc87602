package sweep

import (
	"errors"
	"fmt"
	"math"
	"math/cmplx"
	"turnwise/coil"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/optimize"
)

// Options shape a fit. Zero values take the defaults given.
type Options struct {
	// FMin and FMax bound the points fitted, Hz; zero FMax fits every
	// point below FitBelowSRF of the self-resonance.
	FMin, FMax float64
	// Frequency is where the apparent inductance and Q are reported; zero
	// takes the lowest frequency fitted.
	Frequency float64
	// LeadInductance adds the fixture's series lead inductance to the
	// model. Without open/short correction a long jig shows one; it is
	// told apart from L only by the shape of the curve near resonance, so
	// it widens L's uncertainty.
	LeadInductance bool
}

// FitBelowSRF is the fraction of the self-resonance below which points are
// fitted by default: close to resonance the impedance is so large that a
// reflection measurement resolves it poorly, and the lumped model departs
// from the coil's helical-line behaviour (common practice).
const FitBelowSRF = 0.8

// MinPoints is the fewest points a fit accepts.
const MinPoints = 6

// Thresholds of the findings (our own choices, stated so a test can reach
// them): NoisyResidual is an rms error of the measured S parameter about
// ten times a small analyser's trace noise; the others are relative
// uncertainties beyond which a figure says little.
const (
	NoisyResidual       = 0.01
	UncertainL          = 0.01
	UncertainC          = 0.25
	UncertainQ          = 0.2
	MinSpanForCapacitor = 1.5 // fmax/fmin of the points fitted
)

// Value is a fitted figure with its standard uncertainty (same unit).
type Value struct {
	Value, Uncertainty float64
}

// FlagKind is something about a fit a user should know.
type FlagKind int

const (
	// Noisy: Residual is above NoisyResidual.
	Noisy FlagKind = iota + 1
	// LUncertain: L's relative uncertainty is above UncertainL.
	LUncertain
	// Narrow: the points span less than MinSpanForCapacitor in
	// frequency, or C's relative uncertainty is above UncertainC: the
	// sweep stays too far below the self-resonance or is too narrow to
	// separate C from L.
	Narrow
	// LossUnresolved: Q's relative uncertainty is above UncertainQ.
	LossUnresolved
	// DCLossFixed: the DC part of the loss came out negative and was fixed
	// at zero.
	DCLossFixed
	// OutsideFit: the reporting frequency lies outside the points fitted.
	OutsideFit
)

// Flag is a finding with the figure that raised it and its limit.
type Flag struct {
	Kind         FlagKind
	Value, Limit float64
}

// Fit is the coil's equivalent model fitted to a sweep.
type Fit struct {
	Model Model
	// Frequency is where Inductance and Q are given.
	Frequency float64
	// Inductance is the coil's apparent inductance Im Z/ω at Frequency,
	// its self-capacitance included and the fixture excluded.
	Inductance Value
	// InductanceLow is the fitted L: the low-frequency inductance at the
	// coil's terminals, without the self-capacitance.
	InductanceLow   Value
	SelfCapacitance Value
	// SRF is the self-resonance: from the data where the sweep crosses it
	// (SRFFromData), else from the fitted L and C.
	SRF            Value
	SRFFromData    bool
	Q              Value
	RDC, RSkin     Value
	LeadInductance Value
	// Residual is the rms error of the fit in units of the measured S
	// parameter (first order).
	Residual float64
	// PointsUsed, FMinUsed and FMaxUsed describe the points fitted.
	PointsUsed         int
	FMinUsed, FMaxUsed float64
	Flags              []Flag
}

// Has reports whether the fit carries a flag of kind k.
func (f *Fit) Has(k FlagKind) bool {
	for _, g := range f.Flags {
		if g.Kind == k {
			return true
		}
	}
	return false
}

// ErrFit is a sweep the fit cannot use; errors wrapping it say why.
var ErrFit = errors.New("sweep: no fit")

// FitModel fits the equivalent model to the impedance points (ascending
// frequency). Bad options or too few points are a *coil.InputError naming
// "freq", "fit_range" or "sweep".
func FitModel(pts []Point, opt Options) (*Fit, error) {
	if len(pts) < MinPoints {
		return nil, coil.InputErrorf("sweep", "%d points: the fit needs at least %d", len(pts), MinPoints)
	}
	for i, p := range pts {
		if !(p.Frequency > 0) || math.IsInf(p.Frequency, 0) || cmplx.IsNaN(p.Z) || cmplx.IsInf(p.Z) || !(p.Sens > 0) {
			return nil, coil.InputErrorf("sweep", "point %d is not a finite impedance at a positive frequency", i+1)
		}
		if i > 0 && !(p.Frequency > pts[i-1].Frequency) {
			return nil, coil.InputErrorf("sweep", "frequencies must ascend (point %d)", i+1)
		}
	}
	if opt.FMin < 0 || opt.FMax < 0 || (opt.FMax > 0 && opt.FMax <= opt.FMin) || opt.Frequency < 0 ||
		math.IsInf(opt.FMax, 0) || math.IsNaN(opt.FMin+opt.FMax+opt.Frequency) || math.IsInf(opt.Frequency, 0) {
		return nil, coil.InputErrorf("fit_range", "the range must be 0 ≤ low < high, e.g. 10MHz-120MHz")
	}
	srfData, srfSigma := crossing(pts)
	hi := opt.FMax
	if hi == 0 {
		hi = math.Inf(1)
		if srfData > 0 {
			hi = FitBelowSRF * srfData
		}
	}
	used := selectRange(pts, opt.FMin, hi)
	if len(used) < MinPoints {
		return nil, coil.InputErrorf("fit_range", "%d points between %s and %s: the fit needs at least %d; widen the range or sweep more points",
			len(used), fmtHz(opt.FMin), fmtHz(math.Min(hi, pts[len(pts)-1].Frequency)), MinPoints)
	}
	fr, err := fitPoints(used, opt.LeadInductance)
	if err != nil {
		return nil, err
	}
	// Without a crossing in the data, the fitted SRF may still show the
	// upper points too close to it: fit again below 0.8 of it.
	if opt.FMax == 0 && srfData == 0 {
		lim := FitBelowSRF * fr.m.SRF()
		if used[len(used)-1].Frequency > lim {
			if again := selectRange(pts, opt.FMin, lim); len(again) >= MinPoints {
				used = again
				if fr, err = fitPoints(used, opt.LeadInductance); err != nil {
					return nil, err
				}
			}
		}
	}

	f := &Fit{Model: fr.m, Residual: fr.rms, PointsUsed: len(used),
		FMinUsed: used[0].Frequency, FMaxUsed: used[len(used)-1].Frequency}
	f.Frequency = opt.Frequency
	if f.Frequency == 0 {
		f.Frequency = f.FMinUsed
	}
	srfFit := fr.m.SRF()
	if f.Frequency > 0.9*srfFit {
		return nil, coil.InputErrorf("freq", "%s is above 90 %% of the fitted self-resonance %s: the coil is not a usable inductor there", fmtHz(f.Frequency), fmtHz(srfFit))
	}
	at := f.Frequency
	f.Inductance = fr.derived(func(m Model) float64 { return m.InductanceAt(at) })
	f.InductanceLow = fr.derived(func(m Model) float64 { return m.L })
	f.SelfCapacitance = fr.derived(func(m Model) float64 { return m.C })
	f.Q = fr.derived(func(m Model) float64 { return m.QAt(at) })
	f.RDC = fr.derived(func(m Model) float64 { return m.RDC })
	f.RSkin = fr.derived(func(m Model) float64 { return m.RSkin })
	f.LeadInductance = fr.derived(func(m Model) float64 { return m.LLead })
	f.SRF = fr.derived(func(m Model) float64 { return m.SRF() })
	if srfData > 0 {
		f.SRF, f.SRFFromData = Value{srfData, srfSigma}, true
	}

	add := func(k FlagKind, v, limit float64, cond bool) {
		if cond {
			f.Flags = append(f.Flags, Flag{Kind: k, Value: v, Limit: limit})
		}
	}
	rel := func(v Value) float64 { return math.Abs(v.Uncertainty / v.Value) }
	add(Noisy, f.Residual, NoisyResidual, f.Residual > NoisyResidual)
	add(LUncertain, rel(f.InductanceLow), UncertainL, rel(f.InductanceLow) > UncertainL)
	span := f.FMaxUsed / f.FMinUsed
	add(Narrow, rel(f.SelfCapacitance), UncertainC, rel(f.SelfCapacitance) > UncertainC || span < MinSpanForCapacitor)
	add(LossUnresolved, rel(f.Q), UncertainQ, rel(f.Q) > UncertainQ)
	add(DCLossFixed, 0, 0, fr.dcFixed)
	add(OutsideFit, at, 0, at < f.FMinUsed*(1-1e-9) || at > f.FMaxUsed*(1+1e-9))
	return f, nil
}

func selectRange(pts []Point, lo, hi float64) []Point {
	var out []Point
	for _, p := range pts {
		if p.Frequency >= lo && p.Frequency <= hi {
			out = append(out, p)
		}
	}
	return out
}

// crossing finds the first parallel resonance in the data: where Im Y of
// the measured impedance turns from negative (inductive) to positive. A
// straight line through Im Y of the points within 5 % of the crossing
// places it and gives its standard error; with only the two bracketing
// points the error is a third of their spacing.
func crossing(pts []Point) (f, sigma float64) {
	k := -1
	for i := 1; i < len(pts); i++ {
		if imag(1/pts[i-1].Z) < 0 && imag(1/pts[i].Z) >= 0 {
			k = i
			break
		}
	}
	if k < 0 {
		return 0, 0
	}
	a, b := pts[k-1], pts[k]
	ya, yb := imag(1/a.Z), imag(1/b.Z)
	f0 := a.Frequency + (b.Frequency-a.Frequency)*(-ya)/(yb-ya)
	var xs, ys []float64
	for _, p := range pts {
		if math.Abs(p.Frequency-f0) <= 0.05*f0 {
			xs, ys = append(xs, p.Frequency), append(ys, imag(1/p.Z))
		}
	}
	if len(xs) < 4 {
		return f0, (b.Frequency - a.Frequency) / 3
	}
	n := float64(len(xs))
	mx, my, sxx, sxy := moments(xs, ys)
	slope := sxy / sxx
	if !(slope > 0) {
		return f0, (b.Frequency - a.Frequency) / 3
	}
	root := mx - my/slope
	var ss float64
	for i := range xs {
		e := ys[i] - (my + slope*(xs[i]-mx))
		ss += e * e
	}
	s2 := ss / (n - 2)
	v := (s2/n + (my/slope)*(my/slope)*s2/sxx) / (slope * slope)
	if math.Abs(root-f0) > 0.05*f0 {
		return f0, (b.Frequency - a.Frequency) / 3
	}
	return root, math.Sqrt(v)
}

// problem is one least-squares fit: scaled parameters x, the model they
// stand for, the weighted residuals.
type problem struct {
	pts   []Point
	base  Model   // scales: L0, C0
	rs    float64 // loss scale, ohm
	fref  float64
	free  []int // which of the five parameters are fitted
	fixed [5]float64
}

// model maps the scaled parameters to the circuit:
// L = L0·e^x0, C = C0·e^x1, R_dc = rs·x2, k = rs·x3/√fref, L_lead = L0·x4.
func (p *problem) model(x []float64) Model {
	v := p.fixed
	for i, j := range p.free {
		v[j] = x[i]
	}
	return Model{
		L:     p.base.L * math.Exp(v[0]),
		C:     p.base.C * math.Exp(v[1]),
		RDC:   p.rs * v[2],
		RSkin: p.rs * v[3] / math.Sqrt(p.fref),
		LLead: p.base.L * v[4],
	}
}

func (p *problem) residuals(x, r []float64) {
	m := p.model(x)
	for i, pt := range p.pts {
		e := (m.Z(pt.Frequency) - pt.Z) * complex(pt.Sens, 0)
		r[2*i], r[2*i+1] = real(e), imag(e)
	}
}

// jacobian by central differences in the scaled parameters (all of order
// one, so one step serves all).
func (p *problem) jacobian(x []float64, j *mat.Dense) {
	const h = 1e-6
	m := 2 * len(p.pts)
	rp, rm := make([]float64, m), make([]float64, m)
	xx := append([]float64(nil), x...)
	for k := range x {
		xx[k] = x[k] + h
		p.residuals(xx, rp)
		xx[k] = x[k] - h
		p.residuals(xx, rm)
		xx[k] = x[k]
		for i := range m {
			j.Set(i, k, (rp[i]-rm[i])/(2*h))
		}
	}
}

type fitResult struct {
	p       *problem
	x       []float64
	cov     *mat.SymDense // of x
	m       Model
	rms     float64
	dcFixed bool
}

// derived is a figure of the model with its uncertainty by first-order
// propagation of the parameters' covariance.
func (fr *fitResult) derived(g func(Model) float64) Value {
	v := g(fr.m)
	n := len(fr.x)
	grad := make([]float64, n)
	xx := append([]float64(nil), fr.x...)
	const h = 1e-6
	for k := range n {
		xx[k] = fr.x[k] + h
		a := g(fr.p.model(xx))
		xx[k] = fr.x[k] - h
		b := g(fr.p.model(xx))
		xx[k] = fr.x[k]
		grad[k] = (a - b) / (2 * h)
	}
	gv := mat.NewVecDense(n, grad)
	variance := mat.Inner(gv, fr.cov, gv)
	return Value{Value: v, Uncertainty: math.Sqrt(math.Max(variance, 0))}
}

// initial estimates L and C from a straight line through 1/L_app against
// ω² (1/L_app = 1/L − ω²C for a lossless coil), then the loss from the
// real part of the winding's impedance, Z with C removed, as a line in √f.
func initial(pts []Point) (Model, error) {
	var xs, ys []float64
	for _, p := range pts {
		w := 2 * math.Pi * p.Frequency
		if la := imag(p.Z) / w; la > 0 {
			xs, ys = append(xs, w*w), append(ys, 1/la)
		}
	}
	if len(xs) < 2 {
		return Model{}, coil.InputErrorf("sweep", "the sweep is not inductive below its self-resonance: check the fixture (reflection, series, shunt) and the file")
	}
	a, b := line(xs, ys)
	if !(a > 0) {
		return Model{}, coil.InputErrorf("sweep", "the sweep does not look like a coil: its apparent inductance does not settle at low frequency")
	}
	m := Model{L: 1 / a, C: -b}
	fmax := pts[len(pts)-1].Frequency
	if !(m.C > 0) || m.SRF() < fmax {
		// the curvature is lost in the noise: a capacitance that puts the
		// self-resonance well above the sweep
		w := 2 * math.Pi * 3 * fmax
		m.C = 1 / (w * w * m.L)
	}
	xs, ys = xs[:0], ys[:0]
	for _, p := range pts {
		w := 2 * math.Pi * p.Frequency
		zl := 1 / (1/p.Z - complex(0, w*m.C))
		xs, ys = append(xs, math.Sqrt(p.Frequency)), append(ys, real(zl))
	}
	r0, k := line(xs, ys)
	m.RDC, m.RSkin = math.Max(r0, 0), math.Max(k, 0)
	return m, nil
}

// moments are the means of xs and ys and the sums of squares and products
// about them, from which a least-squares line follows.
func moments(xs, ys []float64) (mx, my, sxx, sxy float64) {
	n := float64(len(xs))
	for i := range xs {
		mx += xs[i] / n
		my += ys[i] / n
	}
	for i := range xs {
		sxx += (xs[i] - mx) * (xs[i] - mx)
		sxy += (xs[i] - mx) * (ys[i] - my)
	}
	return mx, my, sxx, sxy
}

// line is the least-squares straight line y = a + b·x.
func line(xs, ys []float64) (a, b float64) {
	mx, my, sxx, sxy := moments(xs, ys)
	if sxx == 0 {
		return my, 0
	}
	b = sxy / sxx
	return my - b*mx, b
}

func fitPoints(pts []Point, lead bool) (*fitResult, error) {
	m0, err := initial(pts)
	if err != nil {
		return nil, err
	}
	fref := math.Sqrt(pts[0].Frequency * pts[len(pts)-1].Frequency)
	rs := m0.R(fref)
	if w := 2 * math.Pi * fref * m0.L; !(rs > w*1e-4) {
		rs = w * 1e-3
	}
	p := &problem{pts: pts, base: Model{L: m0.L, C: m0.C}, rs: rs, fref: fref}
	p.free = []int{0, 1, 2, 3}
	if lead {
		p.free = append(p.free, 4)
	}
	x0 := []float64{0, 0, m0.RDC / rs, m0.RSkin * math.Sqrt(fref) / rs, 0}
	fr, err := solve(p, x0)
	if err != nil {
		return nil, err
	}
	if fr.m.RDC < 0 {
		// A negative DC part is noise: fix it at zero and fit the rest.
		p.free = []int{0, 1, 3}
		if lead {
			p.free = append(p.free, 4)
		}
		p.fixed = [5]float64{}
		if fr, err = solve(p, x0); err != nil {
			return nil, err
		}
		fr.dcFixed = true
	}
	return fr, nil
}

func solve(p *problem, full []float64) (*fitResult, error) {
	n := len(p.free)
	x0 := make([]float64, n)
	for i, j := range p.free {
		x0[i] = full[j]
	}
	m := 2 * len(p.pts)
	r := make([]float64, m)
	jac := mat.NewDense(m, n, nil)
	prob := optimize.Problem{
		Func: func(x []float64) float64 {
			p.residuals(x, r)
			return floatsDot(r, r)
		},
		Grad: func(g, x []float64) {
			p.residuals(x, r)
			p.jacobian(x, jac)
			rv := mat.NewVecDense(m, r)
			gv := mat.NewVecDense(n, g)
			gv.MulVec(jac.T(), rv)
			gv.ScaleVec(2, gv)
		},
		Hess: func(h *mat.SymDense, x []float64) {
			p.jacobian(x, jac)
			h.SymOuterK(2, jac.T())
		},
	}
	settings := &optimize.Settings{
		MajorIterations: 200,
		FuncEvaluations: 5000,
		Converger:       &optimize.FunctionConverge{Absolute: 1e-30, Relative: 1e-12, Iterations: 5},
	}
	res, err := optimize.Minimize(prob, x0, settings, &optimize.Newton{})
	// A line search that cannot improve on the last point has reached the
	// minimum to the precision of the finite-difference Jacobian.
	if err != nil && !errors.Is(err, optimize.ErrLinesearcherFailure) {
		return nil, fmtErrFit("the least-squares fit did not converge: %v", err)
	}
	if res == nil {
		return nil, fmtErrFit("the least-squares fit returned nothing")
	}
	x := res.X
	fr := &fitResult{p: p, x: x, m: p.model(x)}
	p.residuals(x, r)
	ssr := floatsDot(r, r)
	fr.rms = math.Sqrt(ssr / float64(len(p.pts)))
	// covariance s²·(JᵀJ)⁻¹ with s² the residual variance per degree of
	// freedom
	p.jacobian(x, jac)
	var jtj mat.SymDense
	jtj.SymOuterK(1, jac.T())
	var ch mat.Cholesky
	if !ch.Factorize(&jtj) {
		return nil, coil.InputErrorf("sweep", "the sweep cannot separate L, C and the loss: sweep wider, closer to the self-resonance, or with more points")
	}
	cov := mat.NewSymDense(n, nil)
	if err := ch.InverseTo(cov); err != nil {
		return nil, coil.InputErrorf("sweep", "the sweep cannot separate L, C and the loss: sweep wider, closer to the self-resonance, or with more points")
	}
	dof := float64(m - n)
	cov.ScaleSym(ssr/dof, cov)
	fr.cov = cov
	m0 := fr.m
	if !finiteModel(m0) || !(m0.L > 0) || !(m0.C > 0) {
		return nil, fmtErrFit("the fit left the physical range")
	}
	return fr, nil
}

func finiteModel(m Model) bool {
	for _, v := range []float64{m.L, m.C, m.RDC, m.RSkin, m.LLead} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

func floatsDot(a, b []float64) float64 {
	var s float64
	for i := range a {
		s += a[i] * b[i]
	}
	return s
}

type fitError struct{ msg string }

func (e *fitError) Error() string { return "sweep: " + e.msg }
func (e *fitError) Unwrap() error { return ErrFit }

func fmtErrFit(format string, args ...any) error {
	return &fitError{msg: fmt.Sprintf(format, args...)}
}
