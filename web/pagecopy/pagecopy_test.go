package pagecopy_test

import (
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"saltcast/web"
	"saltcast/web/pagecopy"
)

const page = `<!doctype html>
<html><head><meta charset="utf-8"><title>a <script id="x">not a script</script></title>
<style id="css">body { color: red } /* </styl */</style>
</head><body>
<!-- <script id="wasm">in a comment</script> -->
<textarea><script id="wasm">in a textarea</script></textarea>
<script id="wasm" type="application/octet-stream">QUJD
REVG</script>
<script id=loader>var s = "<\/script>"; if (a<b) {}</script>
<SCRIPT ID='upper'>x()</SCRIPT >
<script>unnamed()</script>
<script type="application/x-saltcast-recipes" id="saltcast-carried"></script>
</body></html>
`

func textOf(t *testing.T, id string) string {
	t.Helper()
	return map[string]string{
		"css":    "body { color: red } /* </styl */",
		"wasm":   "QUJD\nREVG",
		"loader": `var s = "<\/script>"; if (a<b) {}`,
		"upper":  "x()",
	}[id]
}

func TestCutJoin(t *testing.T) {
	ids := []string{"css", "wasm", "loader", "upper"}
	tpl, err := pagecopy.Cut([]byte(page), ids...)
	if err != nil {
		t.Fatal(err)
	}
	if got := strings.Join(tpl.IDs(), " "); got != "css wasm loader upper" {
		t.Errorf("IDs() = %q", got)
	}
	for _, id := range ids {
		if strings.Contains(string(tpl), textOf(t, id)) {
			t.Errorf("template still holds the text of %s", id)
		}
	}
	for _, kept := range []string{"not a script", "in a comment", "in a textarea", "unnamed()"} {
		if !strings.Contains(string(tpl), kept) {
			t.Errorf("template lost %q", kept)
		}
	}
	if got := string(tpl.Join(func(id string) string { return textOf(t, id) })); got != page {
		t.Errorf("Join(Cut(page)) differs from page:\n%s", got)
	}
	// A copy with other texts holds them in place.
	other := string(tpl.Join(func(id string) string { return "[" + id + "]" }))
	if !strings.Contains(other, `<script id="wasm" type="application/octet-stream">[wasm]</script>`) {
		t.Errorf("Join with other texts:\n%s", other)
	}
}

func TestCutRefuses(t *testing.T) {
	for name, tc := range map[string]struct {
		page string
		ids  []string
	}{
		"missing id":  {page, []string{"nope"}},
		"id twice":    {page + `<script id="wasm"></script>`, []string{"wasm"}},
		"CR LF":       {strings.ReplaceAll(page, "\n", "\r\n"), []string{"wasm"}},
		"NUL":         {page + "\x00", []string{"wasm"}},
		"not raw":     {`<div id="wasm">x</div>`, []string{"wasm"}},
		"script open": {`<script id="wasm">x`, []string{"wasm"}},
	} {
		if _, err := pagecopy.Cut([]byte(tc.page), tc.ids...); err == nil {
			t.Errorf("%s: Cut gave no error", name)
		}
	}
}

// The template compiles as Go and holds the same text.
func TestGoSource(t *testing.T) {
	tpl, err := pagecopy.Cut([]byte(page+"é \t \x7f\\ \"q\""), "wasm")
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	src := tpl.GoSource("main", "pageTemplate")
	prog := `package main

import "os"

func main() { os.Stdout.WriteString(pageTemplate) }
`
	if err := os.WriteFile(filepath.Join(dir, "tpl.go"), src, 0o644); err != nil {
		t.Fatal(err)
	}
	os.WriteFile(filepath.Join(dir, "main.go"), []byte(prog), 0o644)
	os.WriteFile(filepath.Join(dir, "go.mod"), []byte("module x\n\ngo 1.26\n"), 0o644)
	cmd := exec.Command("go", "run", ".")
	cmd.Dir = dir
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("go run: %v", err)
	}
	if string(out) != string(tpl) {
		t.Errorf("the compiled template differs from the template")
	}
}

// The bench app's own page (assembled by web.Page around a stand-in module) is cut and
// joined back byte for byte.
func TestBenchPage(t *testing.T) {
	root := strings.TrimSpace(run(t, "go", "env", "GOROOT"))
	wasmExec, err := os.ReadFile(filepath.Join(root, "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		t.Fatal("no wasm_exec.js: ", err)
	}
	p, err := web.Page([]byte("stand-in module"), string(wasmExec), "v-test")
	if err != nil {
		t.Fatal(err)
	}
	tpl, err := pagecopy.Cut(p, "saltcast-wasm")
	if err != nil {
		t.Fatal(err)
	}
	if len(tpl) > len(p)/2 {
		t.Logf("template %d B of a %d B page", len(tpl), len(p))
	}
	// what the browser's textContent gives for each element
	texts := map[string]string{}
	for _, id := range tpl.IDs() {
		i := strings.Index(string(p), `id="`+id+`"`)
		start := i + strings.IndexByte(string(p[i:]), '>') + 1
		end := start + strings.Index(string(p[start:]), "</script>")
		texts[id] = string(p[start:end])
	}
	if got := tpl.Join(func(id string) string { return texts[id] }); string(got) != string(p) {
		t.Error("Join(Cut(bench page)) is not the bench page")
	}
}

func run(t *testing.T, name string, args ...string) string {
	out, err := exec.Command(name, args...).Output()
	if err != nil {
		t.Fatal(name, err)
	}
	return string(out)
}
