//go:build necfull

package coil

import (
	"context"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"
)

// TestNECTable recomputes the NEC-2 reference table of self-resonances,
// testdata/nec/srf.csv, from nec2c. It is behind the necfull build tag
// because it runs for several minutes:
//
//	go test -tags necfull -run TestNECTable -v ./coil
//
// Each coil is solved grounded and floating at the base segmentation
// (necSegmentsPerTurn) and, where the base has at most 320 segments, again
// at twice the segmentation (segments halved in length) to show
// convergence; larger coils leave the last two columns empty
// (TestNECTableDoubled fills them).
func TestNECTable(t *testing.T) {
	nec := necTool(t)
	coils := necReference()
	rows := make([]string, len(coils))
	var wg sync.WaitGroup
	sem := make(chan struct{}, 2)
	var mu sync.Mutex
	var firstErr error
	for i, c := range coils {
		wg.Add(1)
		go func() {
			defer wg.Done()
			sem <- struct{}{}
			defer func() { <-sem }()
			ctx := context.Background()
			dir := t.TempDir()
			f0 := necStartFrequency(c)
			fg, ns, _, err := necResonance(ctx, nec, dir, c, true, f0, 1)
			var ff, fg2, ff2 float64
			if err == nil {
				ff, _, _, err = necResonance(ctx, nec, dir, c, false, f0, 1)
			}
			if err == nil && ns <= 320 {
				fg2, _, _, err = necResonance(ctx, nec, dir, c, true, 0.9*fg, 2)
				if err == nil {
					ff2, _, _, err = necResonance(ctx, nec, dir, c, false, 0.9*ff, 2)
				}
			}
			mu.Lock()
			defer mu.Unlock()
			if err != nil {
				if firstErr == nil {
					firstErr = err
				}
				return
			}
			opt := func(v float64) string {
				if v == 0 {
					return ""
				}
				return fmt.Sprintf("%.6g", v)
			}
			rows[i] = fmt.Sprintf("%s,%.6g,%.6g,%.6g,%g,%d,%.6g,%.6g,%s,%s", c.Name, c.D, c.P, c.Wd, c.N, ns,
				fg, ff, opt(fg2), opt(ff2))
			t.Logf("%s", rows[i])
		}()
	}
	wg.Wait()
	if firstErr != nil {
		t.Fatal(firstErr)
	}
	head := "# NEC-2 (nec2c) first self-resonance of bare perfectly conducting helices; see coil/nec_driver_test.go.\n" +
		"# Made by: go test -tags necfull -run TestNECTable -v ./coil\n" +
		"# mean_diameter_m,pitch_m,wire_diameter_m: the helix; segments: base segmentation (grounded adds a one-segment stub);\n" +
		"# srf_*_hz: base segmentation; *_2x_hz: twice the segments (TestNECTable where the base has at most 320, TestNECTableDoubled for the rest).\n" +
		"name,mean_diameter_m,pitch_m,wire_diameter_m,turns,segments,srf_grounded_hz,srf_floating_hz,srf_grounded_2x_hz,srf_floating_2x_hz\n"
	out := head + strings.Join(rows, "\n") + "\n"
	if err := os.WriteFile(filepath.Join("..", "testdata", "nec", "srf.csv"), []byte(out), 0o644); err != nil {
		t.Fatal(err)
	}
}

// TestNECTableDoubled fills the doubled-segmentation columns of
// testdata/nec/srf.csv that TestNECTable leaves empty (coils whose base
// segmentation has more than 320 segments), with the same driver call and
// the same start (0.9 of the base resonance). The other columns are kept
// as they are. It runs for about ten minutes on two cores:
//
//	go test -tags necfull -run TestNECTableDoubled -timeout 60m -v ./coil
func TestNECTableDoubled(t *testing.T) {
	nec := necTool(t)
	path := filepath.Join("..", "testdata", "nec", "srf.csv")
	raw, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	rows := readNECTable(t, path)
	byName := map[string]int{}
	for i, r := range rows {
		byName[r.C.Name] = i
	}
	var wg sync.WaitGroup
	sem := make(chan struct{}, 2)
	var mu sync.Mutex
	var firstErr error
	run := func(i int, grounded bool) {
		defer wg.Done()
		sem <- struct{}{}
		defer func() { <-sem }()
		r := rows[i]
		base := r.Free
		if grounded {
			base = r.Grounded
		}
		start := time.Now()
		f, _, calls, err := necResonance(context.Background(), nec, t.TempDir(), r.C, grounded, 0.9*base, 2)
		mu.Lock()
		defer mu.Unlock()
		if err != nil {
			if firstErr == nil {
				firstErr = err
			}
			return
		}
		if grounded {
			rows[i].Grounded2 = f
		} else {
			rows[i].Free2 = f
		}
		t.Logf("%s grounded=%v: %.6g Hz (base %.6g, %+.2f %%), %d frequencies, %v", r.C.Name, grounded, f, base,
			100*(f/base-1), calls, time.Since(start).Round(time.Second))
	}
	for i, r := range rows {
		if r.Grounded2 == 0 {
			wg.Add(1)
			go run(i, true)
		}
		if r.Free2 == 0 {
			wg.Add(1)
			go run(i, false)
		}
	}
	wg.Wait()
	if firstErr != nil {
		t.Fatal(firstErr)
	}
	var out strings.Builder
	for _, line := range strings.SplitAfter(string(raw), "\n") {
		v := strings.Split(strings.TrimSuffix(line, "\n"), ",")
		i, ok := byName[v[0]]
		if ok && len(v) == 10 && (v[8] == "" || v[9] == "") {
			v[8] = fmt.Sprintf("%.6g", rows[i].Grounded2)
			v[9] = fmt.Sprintf("%.6g", rows[i].Free2)
			line = strings.Join(v, ",") + "\n"
		}
		out.WriteString(line)
	}
	if err := os.WriteFile(path, []byte(out.String()), 0o644); err != nil {
		t.Fatal(err)
	}
}

// TestNECTableAppend appends to testdata/nec/srf.csv the coils of
// necReference that the table does not have yet, each grounded and
// floating at the base and at the doubled segmentation (the doubled run
// starts at 0.9 of the base resonance), leaving the existing rows as they
// are. NEC_ONLY, if set, names the one coil to run:
//
//	go test -tags necfull -run TestNECTableAppend -timeout 60m -v ./coil
func TestNECTableAppend(t *testing.T) {
	nec := necTool(t)
	path := filepath.Join("..", "testdata", "nec", "srf.csv")
	have := map[string]bool{}
	for _, r := range readNECTable(t, path) {
		have[r.C.Name] = true
	}
	only := os.Getenv("NEC_ONLY")
	var todo []necCoil
	for _, c := range necReference() {
		if !have[c.Name] && (only == "" || only == c.Name) {
			todo = append(todo, c)
		}
	}
	for _, c := range todo {
		start := time.Now()
		ctx := context.Background()
		dir := t.TempDir()
		f0 := necStartFrequency(c)
		fg, ns, _, err := necResonance(ctx, nec, dir, c, true, f0, 1)
		if err != nil {
			t.Fatal(err)
		}
		ff, _, _, err := necResonance(ctx, nec, dir, c, false, f0, 1)
		if err != nil {
			t.Fatal(err)
		}
		fg2, _, _, err := necResonance(ctx, nec, dir, c, true, 0.9*fg, 2)
		if err != nil {
			t.Fatal(err)
		}
		ff2, _, _, err := necResonance(ctx, nec, dir, c, false, 0.9*ff, 2)
		if err != nil {
			t.Fatal(err)
		}
		row := fmt.Sprintf("%s,%.6g,%.6g,%.6g,%g,%d,%.6g,%.6g,%.6g,%.6g\n", c.Name, c.D, c.P, c.Wd, c.N, ns, fg, ff, fg2, ff2)
		f, err := os.OpenFile(path, os.O_APPEND|os.O_WRONLY, 0o644)
		if err != nil {
			t.Fatal(err)
		}
		_, err = f.WriteString(row)
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("%s (%v)", strings.TrimSpace(row), time.Since(start).Round(time.Second))
	}
}
