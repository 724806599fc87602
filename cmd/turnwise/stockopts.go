package main

import (
	"os"

	"github.com/spf13/pflag"

	"turnwise/forms"
)

// stockOptions selects the catalogs a command draws on.
type stockOptions struct {
	path string      // --stock FILE, default $TURNWISE_STOCK
	use  *choiceFlag // builtin | mine | both
}

func newStockOptions() *stockOptions {
	return &stockOptions{use: newChoice("", "builtin", "mine", "both")}
}

func (o *stockOptions) addFlags(fs *pflag.FlagSet) {
	fs.StringVar(&o.path, "stock", os.Getenv("TURNWISE_STOCK"), "your stock file (TOML; default $TURNWISE_STOCK); turnwise stock --template prints a starting point")
	fs.Var(o.use, "use", "which stock to draw on: builtin, mine or both (default both when a stock file is given, else builtin)")
}

// load reads the selected catalogs. A named stock file that is missing or
// malformed is bad input (exit 2).
func (o *stockOptions) load() (*forms.Catalog, error) {
	use := o.use.v
	if use == "" {
		use = "builtin"
		if o.path != "" {
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
		if o.path == "" {
			return nil, usageErrorf("--use %s: no stock file; give --stock FILE or set TURNWISE_STOCK", use)
		}
		f, err := os.Open(o.path)
		if err != nil {
			if os.IsNotExist(err) {
				return nil, usageErrorf("--stock: %q does not exist; check the path, or start one with `turnwise stock --template > %s`", o.path, o.path)
			}
			return nil, err
		}
		defer f.Close()
		mine, err := forms.LoadStock(f, o.path)
		if err != nil {
			return nil, err
		}
		cats = append(cats, mine)
	}
	return forms.Merge(cats...), nil
}
