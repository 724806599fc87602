package circuit

// Retune tells the solver that part values (a capacitor's setting, a
// load's impedance) changed since the last call: the next call assembles
// and factors the equations again even at the same frequency and port
// terminations, which the solver would otherwise reuse.
func (s *Solver) Retune() { s.lf = 0 }
