package forms

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// ErrNotFound is matched by a *LookupError with errors.Is.
var ErrNotFound = errors.New("forms: not found")

// LookupError reports a name that is not in the catalog.
type LookupError struct {
	Kind        string   // "wire", "mandrel", "former", "mandrel or former"
	Name        string   // as asked for
	Suggestions []string // close names, best first; may be empty
	// Among, when set, is the whole list the name was looked for in (a
	// job file's coils), shown instead of the catalog hint.
	Among []string
}

func (e *LookupError) Error() string {
	msg := fmt.Sprintf("%s %q not found", e.Kind, e.Name)
	if e.Among != nil {
		msg += " in the job file"
		if len(e.Suggestions) > 0 {
			return msg + "; did you mean " + strconv.Quote(e.Suggestions[0]) + "?"
		}
		names := e.Among
		more := ""
		if len(names) > 10 {
			names, more = names[:10], fmt.Sprintf(" and %d more", len(e.Among)-10)
		}
		return msg + "; its coils are " + strings.Join(names, ", ") + more
	}
	switch n := len(e.Suggestions); n {
	case 0:
		return msg + "; list the catalog with turnwise stock, or add it to your stock file"
	case 1:
		return msg + "; did you mean " + e.Suggestions[0] + "?"
	default:
		return msg + "; did you mean " + strings.Join(e.Suggestions[:n-1], ", ") + " or " + e.Suggestions[n-1] + "?"
	}
}

// Is reports whether target is ErrNotFound.
func (e *LookupError) Is(target error) bool { return target == ErrNotFound }

// Wire finds a wire by name. It tries, in order: the exact name, ignoring case
// and repeated spaces; a gauge ("22 AWG" finds "22awg"; a valid gauge missing
// from the catalog is built from its definition); a name whose leading size is
// written another way ("1mm" finds "1.00mm", "1mm tinned" finds "1.00mm
// tinned"). The error is a *LookupError with close names, or a gauge error.
func (c *Catalog) Wire(name string) (Wire, error) {
	c = orEmpty(c)
	if i := findName(c.Wires, name, func(w Wire) string { return w.Name }); i >= 0 {
		return c.Wires[i], nil
	}
	if g, ok, err := ParseGauge(name); ok {
		if err != nil {
			return Wire{}, err
		}
		if i := findName(c.Wires, g.Name, func(w Wire) string { return w.Name }); i >= 0 {
			return c.Wires[i], nil
		}
		return g, nil
	}
	if i := findSize(c.Wires, name, func(w Wire) string { return w.Name }); i >= 0 {
		return c.Wires[i], nil
	}
	// A size is best answered with the neighbouring sizes, a name with names.
	var sugg []string
	if l, err := quantity.ParseLength(name); err == nil {
		var metric []Wire
		for _, w := range c.Wires {
			if w.System == "metric" && w.Conductor == "copper" {
				metric = append(metric, w)
			}
		}
		sugg = nearest(l, metric, func(w Wire) (string, unit.Length) { return w.Name, w.Bare })
	} else {
		sugg = suggest(name, c.Wires, func(w Wire) string { return w.Name })
	}
	return Wire{}, &LookupError{Kind: "wire", Name: name, Suggestions: sugg}
}

// Mandrel finds a mandrel by exact name (case and spacing ignored), by a name
// whose leading size is written another way ("6.0mm drill"), or by diameter:
// "6mm" finds the 6 mm drill, "1/4in" the 1/4 in drill. When several rows
// have that diameter the last wins, as in Merge, so the user's own rod is
// preferred to a built-in drill.
func (c *Catalog) Mandrel(name string) (Mandrel, error) {
	c = orEmpty(c)
	i, sugg := lookupSized(c.Mandrels, name, func(m Mandrel) (string, unit.Length) { return m.Name, m.Diameter })
	if i < 0 {
		return Mandrel{}, &LookupError{Kind: "mandrel", Name: name, Suggestions: sugg}
	}
	return c.Mandrels[i], nil
}

// Material finds a material of the expansion table by name (case and
// spacing ignored).
func (c *Catalog) Material(name string) (Material, error) {
	if m, ok := findMaterial(c.Materials, name); ok {
		return m, nil
	}
	return Material{}, &LookupError{Kind: "material", Name: name,
		Suggestions: suggest(name, c.Materials, func(x Material) string { return x.Name })}
}

// Former finds a former by exact name, by a name whose leading size is
// written another way, or by outside diameter ("20mm", "0.840in"), as Mandrel.
func (c *Catalog) Former(name string) (Former, error) {
	c = orEmpty(c)
	i, sugg := lookupSized(c.Formers, name, func(f Former) (string, unit.Length) { return f.Name, f.Diameter })
	if i < 0 {
		return Former{}, &LookupError{Kind: "former", Name: name, Suggestions: sugg}
	}
	return c.Formers[i], nil
}

// Springback returns the latest calibration for a mandrel (or former) and
// wire. Names are resolved as Mandrel, Former and Wire do, so "6.0mm drill"
// and "6mm drill" name the same mandrel, "22 AWG" and "22awg" the same wire,
// and "6mm" whichever mandrel Mandrel("6mm") finds. ok is false when there
// is none.
func (c *Catalog) Springback(mandrel, wire string) (Calibration, bool) {
	c = orEmpty(c)
	mk, wk := c.holderKey(mandrel), c.wireKey(wire)
	for i := len(c.Calibrations) - 1; i >= 0; i-- {
		cal := c.Calibrations[i]
		if c.holderKey(cal.Mandrel) == mk && c.wireKey(cal.Wire) == wk {
			return cal, true
		}
	}
	return Calibration{}, false
}

// orEmpty lets lookups on a nil *Catalog behave as on an empty one.
func orEmpty(c *Catalog) *Catalog {
	if c == nil {
		return &Catalog{}
	}
	return c
}

// holderKey identifies a mandrel or former by its catalog row.
func (c *Catalog) holderKey(name string) string {
	if m, err := c.Mandrel(name); err == nil {
		return "mandrel:" + nameKey(m.Name)
	}
	if f, err := c.Former(name); err == nil {
		return "former:" + nameKey(f.Name)
	}
	return "?:" + nameKey(name)
}

func (c *Catalog) wireKey(name string) string {
	if w, err := c.Wire(name); err == nil {
		return "wire:" + nameKey(w.Name)
	}
	return "?:" + nameKey(name)
}

// lookupSized runs the name, size-in-name and diameter lookups shared by
// mandrels and formers, returning the index or suggestions.
func lookupSized[T any](rows []T, name string, get func(T) (string, unit.Length)) (int, []string) {
	nameOf := func(r T) string { n, _ := get(r); return n }
	if i := findName(rows, name, nameOf); i >= 0 {
		return i, nil
	}
	if i := findSize(rows, name, nameOf); i >= 0 {
		return i, nil
	}
	l, err := quantity.ParseLength(name)
	if err == nil {
		for i := len(rows) - 1; i >= 0; i-- {
			if _, d := get(rows[i]); sameLength(d, l) {
				return i, nil
			}
		}
	}
	if err == nil {
		return -1, nearest(l, rows, get)
	}
	return -1, suggest(name, rows, nameOf)
}

// nameKey folds case and spacing: "6MM  Drill" and "6mm drill" are one name.
func nameKey(s string) string {
	return strings.Join(strings.Fields(strings.ToLower(s)), " ")
}

// sizeKey rewrites a leading size in a name as nanometres, so that "1mm",
// "1.00mm" and "1.0 mm" or "1/4in drill" and "6.35mm drill" agree. It
// returns "" when the name does not start with a length.
func sizeKey(s string) string {
	f := strings.Fields(strings.ToLower(s))
	for n := 1; n <= 2 && n <= len(f); n++ {
		l, err := quantity.ParseLength(strings.Join(f[:n], ""))
		if err != nil || !(l > 0) {
			continue
		}
		nm := math.Round(float64(l) * 1e9)
		if nm > 1e15 {
			return ""
		}
		return strings.Join(append([]string{strconv.FormatFloat(nm, 'f', 0, 64) + "nm"}, f[n:]...), " ")
	}
	return ""
}

func findName[T any](rows []T, name string, nameOf func(T) string) int {
	k := nameKey(name)
	if k == "" {
		return -1
	}
	for i := len(rows) - 1; i >= 0; i-- {
		if nameKey(nameOf(rows[i])) == k {
			return i
		}
	}
	return -1
}

func findSize[T any](rows []T, name string, nameOf func(T) string) int {
	k := sizeKey(name)
	if k == "" {
		return -1
	}
	for i := len(rows) - 1; i >= 0; i-- {
		if sizeKey(nameOf(rows[i])) == k {
			return i
		}
	}
	return -1
}

// sameLength compares diameters written in different units ("1/4in" and
// "6.35mm"): the relative tolerance only absorbs the unit conversion.
func sameLength(a, b unit.Length) bool {
	const convTol = 1e-9
	return math.Abs(float64(a-b)) <= convTol*math.Max(math.Abs(float64(a)), math.Abs(float64(b)))
}

// maxSuggestions keeps did-you-mean lists short enough to read.
const maxSuggestions = 3

// suggest returns names within a small edit distance of name, closest first.
func suggest[T any](name string, rows []T, nameOf func(T) string) []string {
	k := nameKey(name)
	if k == "" || len(k) > 64 {
		return nil
	}
	limit := max(2, len(k)/4)
	type cand struct {
		name string
		dist int
	}
	var cs []cand
	for _, r := range rows {
		n := nameOf(r)
		if d := editDistance(k, nameKey(n)); d <= limit {
			cs = append(cs, cand{n, d})
		}
	}
	slices.SortStableFunc(cs, func(a, b cand) int { return a.dist - b.dist })
	// Only the closest names: "22agw" gets 22awg, not 2awg and 12awg too.
	var out []string
	for _, c := range cs {
		if len(out) == maxSuggestions || c.dist > cs[0].dist {
			break
		}
		out = append(out, c.name)
	}
	return out
}

// nearest returns the names of the rows just below and just above size l.
func nearest[T any](l unit.Length, rows []T, get func(T) (string, unit.Length)) []string {
	below, above := -1, -1
	for i, r := range rows {
		_, d := get(r)
		if d <= l && (below < 0 || d > lengthOf(rows[below], get)) {
			below = i
		}
		if d >= l && (above < 0 || d < lengthOf(rows[above], get)) {
			above = i
		}
	}
	var out []string
	for _, i := range []int{below, above} {
		if i >= 0 {
			n, _ := get(rows[i])
			if !slices.Contains(out, n) {
				out = append(out, n)
			}
		}
	}
	return out
}

func lengthOf[T any](r T, get func(T) (string, unit.Length)) unit.Length {
	_, d := get(r)
	return d
}

// mergeSuggestions joins lists, first list first, without repeats.
func mergeSuggestions(a, b []string) []string {
	out := slices.Clone(a)
	for _, s := range b {
		if !slices.Contains(out, s) {
			out = append(out, s)
		}
	}
	if len(out) > maxSuggestions {
		out = out[:maxSuggestions]
	}
	return out
}

// editDistance is the optimal-string-alignment distance: insertions,
// deletions, substitutions and swaps of neighbours ("agw" for "awg") cost 1.
func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	prev2 := make([]int, len(rb)+1)
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && ra[i-1] == rb[j-2] && ra[i-2] == rb[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(rb)]
}
