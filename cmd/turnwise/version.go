package main

import (
	"fmt"
	"runtime/debug"

	"github.com/spf13/cobra"
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
	return &cobra.Command{
		Use:   "version",
		Short: "Print the turnwise version",
		Long:  "Print the turnwise version: the release tag set at build time, the module version, or \"dev\".",
		Args:  cobra.NoArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			_, err := fmt.Fprintf(cmd.OutOrStdout(), "turnwise %s\n", versionString())
			return err
		},
	}
}
