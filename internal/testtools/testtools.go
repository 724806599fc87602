// Package testtools holds what tests in several packages share: the rule
// for the external programs some tests run (ngspice, poppler's pdftotext,
// pdfinfo and pdftoppm, nec2c) and the golden-file comparisons that hold on
// every CPU (JSON numbers within a relative tolerance, rounded numbers in
// text within one unit of their last digit). Only test files import it.
package testtools

import (
	"os"
	"os/exec"
	"testing"
)

// RequireEnv is the environment variable CI sets to 1 (.ci/run): a missing
// program then fails the test instead of skipping it.
const RequireEnv = "TURNWISE_REQUIRE_TOOLS"

// Need returns the path of the program name, which the Debian package
// debianPackage provides. Without it the test skips with a message on a
// developer machine and fails when RequireEnv is 1.
func Need(t testing.TB, name, debianPackage string) string {
	t.Helper()
	p, err := exec.LookPath(name)
	if err != nil {
		if os.Getenv(RequireEnv) == "1" {
			t.Fatalf("%s is not installed and %s=1: install it (Debian package %s)", name, RequireEnv, debianPackage)
		}
		t.Skipf("%s is not installed (Debian package %s); skipping", name, debianPackage)
	}
	return p
}
