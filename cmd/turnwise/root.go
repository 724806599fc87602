package main

import (
	"context"
	"errors"
	"io"
	"strings"

	"github.com/spf13/cobra"
)

// globalOptions carries what every command shares: the output streams.
type globalOptions struct {
	stdout io.Writer
	stderr io.Writer
}

// newRootCmd builds a fresh command tree; nothing is package-level, so
// tests can build it as often as they like.
func newRootCmd(g *globalOptions) *cobra.Command {
	root := &cobra.Command{
		Use:   "turnwise",
		Short: "Design air-wound single-layer coils and print their build sheets",
		Long: strings.TrimSpace(`
turnwise turns a circuit requirement into a coil you can wind from your own
mandrels, formers and wire: turns, pitch, tap and the inductance, Q and
self-resonance to expect, a correction after you measure it, and a printed
build sheet.

All inputs take unit suffixes: 48nH 0.048uH 25pF 145MHz 4.5mm 0.177in 22awg 18swg.
Every command prints a table, or JSON with --json (SI units: H, F, Hz, m, Ω).
` + exitStatusHelp),
		SilenceErrors: true,
		SilenceUsage:  true,
		Version:       versionString(),
	}
	root.SetOut(g.stdout)
	root.SetErr(g.stderr)
	root.SetFlagErrorFunc(func(_ *cobra.Command, err error) error {
		return &usageError{Msg: err.Error(), Err: err}
	})
	root.AddCommand(
		newPredictCmd(g),
		newStockCmd(g),
		newVersionCmd(g),
		newTapCmd(g), newSpanCmd(g),
		newSheetCmd(g),
		newTrimCmd(g),
		newDesignCmd(g),
		newCircuitCmd(g),
	)
	return root
}

// run executes the command line args and returns the exit status. Errors
// are printed here, once.
func run(args []string, stdout, stderr io.Writer) int {
	g := &globalOptions{stdout: stdout, stderr: stderr}
	root := newRootCmd(g)
	root.SetArgs(args)
	c, err := root.ExecuteContextC(context.Background())
	if err != nil && c == root {
		// The root command runs nothing, so an error there is its command
		// line: an unknown command (flag errors are usageErrors already).
		var ue *usageError
		if !errors.As(err, &ue) {
			err = &usageError{Msg: err.Error(), Err: err}
		}
	}
	if err != nil {
		printError(stderr, err)
	}
	return exitCode(err)
}
