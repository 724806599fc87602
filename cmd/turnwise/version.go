package main

import (
	"fmt"
	"runtime/debug"

	"github.com/spf13/cobra"

	"turnwise/internal/report"
)

// version is set at build time: -ldflags "-X main.version=v1.2.3".
var version = ""

func versionString() string {
	if version != "" {
		return version
	}
	if bi, ok := debug.ReadBuildInfo(); ok && bi.Main.Version != "" && bi.Main.Version != "(devel)" {
		return bi.Main.Version
	}
	return "dev"
}

func newVersionCmd(g *globalOptions) *cobra.Command {
	var asJSON bool
	cmd := &cobra.Command{
		Use:   "version",
		Short: "Print the turnwise version",
		Long:  "Print the turnwise version: the release tag set at build time, the module version, or \"dev\"; with --json also the Go version and platform.",
		Args:  cobra.NoArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			out := cmd.OutOrStdout()
			if asJSON {
				return report.WriteVersionJSON(out, versionString())
			}
			_, err := fmt.Fprintf(out, "turnwise %s\n", versionString())
			return err
		},
	}
	cmd.Flags().BoolVar(&asJSON, "json", false, "print JSON instead of a line")
	return cmd
}
