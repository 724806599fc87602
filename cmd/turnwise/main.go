// Command turnwise designs air-wound single-layer coils and prints their
// build sheets. See README.md for the job and DEVELOPERS.md for the code.
package main

import (
	"context"
	"os"
	"os/signal"
	"syscall"
	"time"
)

func main() {
	os.Exit(runMain(os.Args[1:]))
}

// runMain runs the command with Ctrl-C and SIGTERM turned into a cancelled
// context: the file being written is abandoned and its temporary file
// removed (internal/atomicfile), then the process exits 130 (SIGINT) or
// 143 (SIGTERM), the shell's 128 + signal number. A second signal kills
// at once.
func runMain(args []string) int {
	sigs := make(chan os.Signal, 1)
	signal.Notify(sigs, os.Interrupt, syscall.SIGTERM)
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	done := make(chan int, 1)
	go func() { done <- runContext(ctx, args, os.Stdout, os.Stderr) }()
	var sig os.Signal
	select {
	case code := <-done:
		signal.Stop(sigs)
		return code
	case sig = <-sigs:
	}
	signal.Stop(sigs)
	cancel()
	// The writer removes its temporary file as the context is cancelled;
	// give the command a moment to return, but not forever (a long page
	// layout does not look at the context).
	select {
	case <-done:
	case <-time.After(2 * time.Second):
	}
	os.Stderr.WriteString("turnwise: interrupted; no output file was written\n")
	if sig == syscall.SIGTERM {
		return exitSignal + int(syscall.SIGTERM)
	}
	return exitSignal + int(syscall.SIGINT)
}
