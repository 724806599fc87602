package main

import (
	"os"

	"github.com/spf13/pflag"

	"turnwise/forms"
	"turnwise/internal/spec"
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
func (o *stockOptions) load() (*forms.Catalog, error) { return spec.LoadCatalog(o.path, o.use.v) }
