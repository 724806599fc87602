package report

import (
	"io"
	"runtime"
)

// WriteVersionJSON prints `turnwise version --json`: the version, the Go
// version it was built with and the platform.
func WriteVersionJSON(w io.Writer, version string) error {
	return writeJSON(w, struct {
		Schema   int      `json:"schema"`
		Version  string   `json:"version"`
		Go       string   `json:"go"`
		Platform string   `json:"platform"`
		Warnings []string `json:"warnings"`
	}{SchemaVersion, version, runtime.Version(), runtime.GOOS + "/" + runtime.GOARCH, []string{}})
}
