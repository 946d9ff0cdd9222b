//go:build browser

package web_test

import (
	"bytes"
	"encoding/binary"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// The loader's LZMA decoder (web/loader.js, unlzma) unpacks what xz packs, byte for byte,
// for every literal/position setting xz offers, and refuses a cut or damaged stream instead of
// returning wrong bytes. The reference is xz itself (XZ Utils, the program the build packs
// with); node runs the decoder outside the page so each case is cheap.
func TestLoaderUnpacksWhatXzPacks(t *testing.T) {
	node, err := exec.LookPath("node")
	if err != nil {
		t.Fatal("node is needed to run web/loader.js outside the browser (make test installs it with npm's worker tools)")
	}
	if _, err := exec.LookPath("xz"); err != nil {
		t.Fatal("xz is needed (web/scripts/deps-build.sh installs xz-utils)")
	}
	dir := t.TempDir()
	// A mix the module has: runs, repeats at many distances, and random bytes.
	r := rand.New(rand.NewPCG(1, 2))
	var in bytes.Buffer
	for in.Len() < 300_000 {
		switch r.IntN(4) {
		case 0:
			in.Write(bytes.Repeat([]byte{byte(r.IntN(256))}, 1+r.IntN(300)))
		case 1:
			if n := in.Len(); n > 10 {
				from := r.IntN(n)
				in.Write(append([]byte(nil), in.Bytes()[from:from+min(n-from, 1+r.IntN(500))]...))
			}
		default:
			for i := r.IntN(200); i > 0; i-- {
				in.WriteByte(byte(r.IntN(256)))
			}
		}
	}
	raw := filepath.Join(dir, "in.bin")
	if err := os.WriteFile(raw, in.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	loader, err := os.ReadFile("loader.js")
	if err != nil {
		t.Fatal(err)
	}
	src := string(loader)
	a, b := strings.Index(src, "  function unlzma"), strings.Index(src, "  async function start")
	if a < 0 || b < a {
		t.Fatal("web/loader.js has no unlzma before start")
	}
	script := filepath.Join(dir, "run.js")
	if err := os.WriteFile(script, []byte(`const fs = require("fs");
const unlzma = new Function(fs.readFileSync(process.argv[2], "utf8") + "; return unlzma;")();
try { process.stdout.write(unlzma(new Uint8Array(fs.readFileSync(process.argv[3])))); }
catch (e) { process.stderr.write(String(e)); process.exit(3); }
`), 0o644); err != nil {
		t.Fatal(err)
	}
	decoder := filepath.Join(dir, "unlzma.js")
	if err := os.WriteFile(decoder, []byte(src[a:b]), 0o644); err != nil {
		t.Fatal(err)
	}
	unpack := func(lz []byte) ([]byte, error) {
		f := filepath.Join(dir, "in.lzma")
		if err := os.WriteFile(f, lz, 0o644); err != nil {
			t.Fatal(err)
		}
		return exec.Command(node, script, decoder, f).Output()
	}
	for _, opts := range []string{"-9e", "--lzma1=preset=6,lc=0,lp=2,pb=2", "--lzma1=preset=9,lc=4,lp=0,pb=0", "--lzma1=preset=1,lc=3,lp=1,pb=1"} {
		lz, err := exec.Command("xz", "--format=lzma", opts, "--stdout", raw).Output()
		if err != nil {
			t.Fatalf("xz %s: %v", opts, err)
		}
		// The build writes the unpacked size into the header (web.withSize does the same).
		binary.LittleEndian.PutUint64(lz[5:13], uint64(in.Len()))
		got, err := unpack(lz)
		if err != nil || !bytes.Equal(got, in.Bytes()) {
			t.Errorf("xz %s: unlzma gave %d bytes (%v), want the %d packed", opts, len(got), err, in.Len())
		}
		if opts != "-9e" {
			continue
		}
		// A cut stream and one with the unknown size xz writes are refused.
		if got, err := unpack(lz[:len(lz)/2]); err == nil && bytes.Equal(got, in.Bytes()) {
			t.Error("a stream cut in half unpacked to the whole input")
		} else if err == nil {
			t.Error("a stream cut in half was not refused")
		}
		unknown := append([]byte(nil), lz...)
		binary.LittleEndian.PutUint64(unknown[5:13], ^uint64(0))
		if _, err := unpack(unknown); err == nil {
			t.Error("a stream of unknown size was not refused")
		}
	}
}
