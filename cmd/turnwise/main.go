// Command turnwise designs air-wound single-layer coils and prints their
// build sheets. See README.md for the job and DEVELOPERS.md for the code.
package main

import "os"

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}
