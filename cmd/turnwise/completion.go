package main

import (
	"os"
	"strings"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"

	"turnwise/internal/spec"
)

// completionShells are the shells `turnwise completion` writes scripts for
// (cobra's generators).
var completionShells = []string{"bash", "zsh", "fish", "powershell"}

// setUpCompletion makes `turnwise completion` strict (an unknown or missing
// shell is bad input, exit 2, naming the shells, instead of help and exit 0)
// and registers value completion for every flag with a fixed set of words
// and for stock names.
func setUpCompletion(root *cobra.Command) {
	root.InitDefaultCompletionCmd()
	for _, c := range root.Commands() {
		if c.Name() != "completion" {
			continue
		}
		c.Args = cobra.ArbitraryArgs
		c.RunE = func(_ *cobra.Command, args []string) error {
			if len(args) == 0 {
				return usageErrorf("completion needs a shell: %s, e.g. turnwise completion bash", strings.Join(completionShells, ", "))
			}
			return usageErrorf("completion %s: unknown shell; turnwise writes completion for %s", args[0], strings.Join(completionShells, ", "))
		}
	}
	registerFlagCompletions(root)
}

// fixedWords are the words of flags that are plain strings but take a
// fixed set (a stock name or a size is also accepted by some of them).
var fixedWords = map[string][]string{
	"conductor":  {"copper", "silver-plated", "tinned"},
	"insulation": {"none", "grade1", "grade2", "grade3"},
	"law":        {"slc", "slf", "slw"},
}

func registerFlagCompletions(c *cobra.Command) {
	c.Flags().VisitAll(func(f *pflag.Flag) {
		var fn cobra.CompletionFunc
		switch v := f.Value.(type) {
		case *choiceFlag:
			words := v.choices
			fn = fixedCompletion(words, cobra.ShellCompDirectiveNoFileComp)
		default:
			switch f.Name {
			case "law": // a law, or a measured table file
				fn = fixedCompletion(fixedWords[f.Name], cobra.ShellCompDirectiveDefault)
			case "conductor", "insulation":
				fn = fixedCompletion(fixedWords[f.Name], cobra.ShellCompDirectiveNoFileComp)
			case "wire", "mandrel", "former":
				fn = stockNameCompletion(f.Name)
			}
		}
		if fn != nil {
			_ = c.RegisterFlagCompletionFunc(f.Name, fn)
		}
	})
	for _, sub := range c.Commands() {
		registerFlagCompletions(sub)
	}
}

func fixedCompletion(words []string, d cobra.ShellCompDirective) cobra.CompletionFunc {
	return func(_ *cobra.Command, _ []string, prefix string) ([]cobra.Completion, cobra.ShellCompDirective) {
		var out []cobra.Completion
		for _, w := range words {
			if strings.HasPrefix(strings.ToLower(w), strings.ToLower(prefix)) {
				out = append(out, w)
			}
		}
		return out, d
	}
}

// stockNameCompletion offers the names of wires, mandrels or formers from
// the built-in catalogs and the stock file the command line names (--stock,
// else $TURNWISE_STOCK). A stock file that cannot be read adds nothing.
func stockNameCompletion(kind string) cobra.CompletionFunc {
	return func(cmd *cobra.Command, _ []string, prefix string) ([]cobra.Completion, cobra.ShellCompDirective) {
		path := os.Getenv("TURNWISE_STOCK")
		if f := cmd.Flags().Lookup("stock"); f != nil && f.Changed {
			path = f.Value.String()
		}
		cat, err := spec.LoadCatalog(path, "")
		if err != nil && path != "" {
			cat, err = spec.LoadCatalog("", "builtin")
		}
		if err != nil {
			return nil, cobra.ShellCompDirectiveNoFileComp
		}
		return fixedCompletion(spec.CatalogNames(cat, kind), cobra.ShellCompDirectiveNoFileComp)(cmd, nil, prefix)
	}
}
