package detail

import (
	"errors"
	"gaugeline/detail/jobfile"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"testing"
)

// FuzzParseJob checks that no job file makes ParseJob or Build panic, that
// every refusal is an *InputError naming the file with a message, and that
// every number of a job they accept is finite. Its seeds are the job files
// under testdata/jobs, testdata/propose and testdata/bad, and under
// testdata/fuzz/FuzzParseJob the inputs the fuzzer once found. Run it with
//
//	go test -run=^$ -fuzz=FuzzParseJob -fuzztime=60s ./detail
func FuzzParseJob(f *testing.F) {
	var files []string
	for _, pat := range []string{"jobs/*.yaml", "propose/*.yaml", "bad/*", "examples/*.yaml", "measured/*.yaml", "fuzz/FuzzParseJob/*"} {
		m, _ := filepath.Glob(filepath.Join("..", "testdata", pat))
		files = append(files, m...)
	}
	if len(files) < 60 {
		f.Fatalf("%d seed files", len(files))
	}
	for _, p := range files {
		b, err := os.ReadFile(p)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(b)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		j, err := jobfile.ParseJob("fuzz.yaml", data)
		if err != nil {
			checkInputError(t, "ParseJob", err)
			return
		}
		checkFinite(t, "job", reflect.ValueOf(j))
		d, err := Build(j)
		if err != nil {
			checkInputError(t, "Build", err)
			return
		}
		checkFinite(t, "design", reflect.ValueOf(&d.Conn))
		checkFinite(t, "design info", reflect.ValueOf(&d.Info))
		// and the check of what it built never panics, nor gives a
		// strength that is not a number
		r, err := Check(d)
		if err != nil {
			return
		}
		for _, x := range r.Results {
			if math.IsNaN(float64(x.Nominal)) || math.IsNaN(float64(x.Available)) || x.Nominal < 0 {
				t.Fatalf("%s: Rn %v, available %v", x.ID, x.Nominal, x.Available)
			}
		}
	})
}

func checkInputError(t *testing.T, fn string, err error) {
	t.Helper()
	var ie *jobfile.InputError
	if !errors.As(err, &ie) || ie.File != "fuzz.yaml" || ie.Msg == "" {
		t.Fatalf("%s: %v (%T) is not an *InputError naming the file", fn, err, err)
	}
}

// checkFinite fails on a NaN or infinite float anywhere in the exported
// fields of v.
func checkFinite(t *testing.T, path string, v reflect.Value) {
	t.Helper()
	switch v.Kind() {
	case reflect.Pointer, reflect.Interface:
		if !v.IsNil() {
			checkFinite(t, path, v.Elem())
		}
	case reflect.Struct:
		for i := range v.NumField() {
			if f := v.Type().Field(i); f.IsExported() {
				checkFinite(t, path+"."+f.Name, v.Field(i))
			}
		}
	case reflect.Slice, reflect.Array:
		for i := range v.Len() {
			checkFinite(t, path+"[]", v.Index(i))
		}
	case reflect.Float32, reflect.Float64:
		if x := v.Float(); math.IsNaN(x) || math.IsInf(x, 0) {
			t.Fatalf("%s = %v", path, x)
		}
	}
}
