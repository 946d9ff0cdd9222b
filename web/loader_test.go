//go:build browser

package web_test

import (
	"bytes"
	"crypto/sha256"
	"encoding/base64"
	"encoding/binary"
	"fmt"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"saltcast/web/text91"
)

// runUnpack writes the loader's unpacker (web/loader.js from the UNPACKER line to start:
// the assembled web/unlzma.wat and the JavaScript around it) and a node script that runs it on
// each file named after it, printing for each the unpacked bytes' length and SHA-256, or the
// error. node runs it outside the page, so each case is cheap.
func runUnpack(t *testing.T, dir string, texts ...[]byte) []string {
	t.Helper()
	node, err := exec.LookPath("node")
	if err != nil {
		t.Fatal("node is needed to run web/loader.js outside the browser (make test installs it with npm's worker tools)")
	}
	loader, err := os.ReadFile("loader.js")
	if err != nil {
		t.Fatal(err)
	}
	src := string(loader)
	a, b := strings.Index(src, "  // The unpacker:"), strings.Index(src, "  async function start")
	if a < 0 || b < a {
		t.Fatal("web/loader.js has no unpacker before start")
	}
	script := filepath.Join(dir, "run.js")
	if err := os.WriteFile(script, []byte(`const fs = require("fs"), crypto = require("crypto");
const unpack = new Function(fs.readFileSync(process.argv[2], "utf8") + "; return unpack;")();
(async () => {
  for (const f of process.argv.slice(3)) {
    try {
      const out = await unpack(fs.readFileSync(f, "utf8"));
      console.log(out.length + " " + crypto.createHash("sha256").update(out).digest("hex"));
    } catch (e) {
      console.log("error: " + (e instanceof Error ? e.message : "not an Error: " + String(e)));
    }
  }
})();
`), 0o644); err != nil {
		t.Fatal(err)
	}
	decoder := filepath.Join(dir, "unpack.js")
	if err := os.WriteFile(decoder, []byte(src[a:b]), 0o644); err != nil {
		t.Fatal(err)
	}
	args := []string{script, decoder}
	for i, text := range texts {
		f := filepath.Join(dir, "case"+strconv.Itoa(i)+".txt")
		if err := os.WriteFile(f, text, 0o644); err != nil {
			t.Fatal(err)
		}
		args = append(args, f)
	}
	out, err := exec.Command(node, args...).Output()
	if err != nil {
		t.Fatalf("node: %v", err)
	}
	lines := strings.Split(strings.TrimSuffix(string(out), "\n"), "\n")
	if len(lines) != len(texts) {
		t.Fatalf("node answered %d cases of %d:\n%s", len(lines), len(texts), out)
	}
	return lines
}

// digest is what runUnpack prints for bytes unpacked right.
func digest(b []byte) string {
	return strconv.Itoa(len(b)) + " " + fmt.Sprintf("%x", sha256.Sum256(b))
}

// The loader's unpacker (web/unlzma.wat, run by unpack in web/loader.js) unpacks what xz
// packs, byte for byte, for every literal/position setting xz offers, and refuses a cut,
// damaged or unknown-size stream instead of returning wrong bytes. The reference is xz itself
// (XZ Utils, the program the build packs with). The streams go in as the page carries them,
// text91 text, so the text decoding is covered too.
func TestLoaderUnpacksWhatXzPacks(t *testing.T) {
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
	want := digest(in.Bytes())
	var texts [][]byte
	var names []string
	add := func(name string, lz []byte) {
		names = append(names, name)
		texts = append(texts, []byte(text91.Encode(lz)))
	}
	var whole []byte
	for _, opts := range []string{"-9e", "--lzma1=preset=6,lc=0,lp=2,pb=2", "--lzma1=preset=9,lc=4,lp=0,pb=0", "--lzma1=preset=1,lc=3,lp=1,pb=1"} {
		lz, err := exec.Command("xz", "--format=lzma", opts, "--stdout", raw).Output()
		if err != nil {
			t.Fatalf("xz %s: %v", opts, err)
		}
		// The build writes the unpacked size into the header (web.withSize does the same).
		binary.LittleEndian.PutUint64(lz[5:13], uint64(in.Len()))
		add("xz "+opts, lz)
		if whole == nil {
			whole = lz
		}
	}
	got := runUnpack(t, dir, texts...)
	for i, g := range got {
		if g != want {
			t.Errorf("%s: unpacked to %.80s, want %s", names[i], g, want)
		}
	}

	// Refused: a cut stream, the unknown size xz writes, a size larger than the stream holds
	// (its end marker comes first), a smaller one is fine (unpacking stops there), text with a
	// character outside the alphabet, and a stream that is no lzma stream.
	unknown := append([]byte(nil), whole...)
	binary.LittleEndian.PutUint64(unknown[5:13], ^uint64(0))
	longer := append([]byte(nil), whole...)
	binary.LittleEndian.PutUint64(longer[5:13], uint64(in.Len()+1))
	shorter := append([]byte(nil), whole...)
	binary.LittleEndian.PutUint64(shorter[5:13], 1000)
	badProps := append([]byte(nil), whole...)
	badProps[0] = 225
	text := text91.Encode(whole)
	cases := []struct {
		name, text, want string
	}{
		{"cut in half", text91.Encode(whole[:len(whole)/2]), "error: the lzma stream is cut short"},
		{"cut to the header", text91.Encode(whole[:15]), "error: the lzma stream is cut short"},
		{"unknown size", text91.Encode(unknown), "error: the module is not an lzma stream of known size"},
		{"size one byte larger", text91.Encode(longer), "error: the lzma stream ends early"},
		{"size 1000", text91.Encode(shorter), digest(in.Bytes()[:1000])},
		{"properties 225", text91.Encode(badProps), "error: the module is not an lzma stream of known size"},
		{"a '<' in the text", text[:1000] + "<" + text[1001:], "error: damaged module text"},
		{"a space in the text", text[:1000] + " " + text[1001:], "error: damaged module text"},
		{"an e acute in the text", text[:1000] + "\u00e9" + text[1001:], "error: damaged module text"},
		{"a pair worth 8192", text[:1000] + "~~" + text[1002:], "error: damaged module text"},
	}
	texts = texts[:0]
	for _, c := range cases {
		texts = append(texts, []byte(c.text))
	}
	for i, g := range runUnpack(t, dir, texts...) {
		if g != cases[i].want {
			t.Errorf("%s: got %q, want %q", cases[i].name, g, cases[i].want)
		}
	}
}

// Property: the unpacker's text decoding gives back the bytes text91 wrote, for every length
// from 2 to 300 and some longer (a gzip stream, by its first two bytes, comes back as it is,
// so any bytes after 1f 8b show the decoding alone), and a last lone character worth 64 or
// more (more than its 6 bits) is refused.
func TestLoaderUnpackerDecodesText91(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	var texts [][]byte
	var want []string
	// Random bytes of each length, starting with gzip's magic bytes so the loader's decoder
	// takes them as they are.
	addRandom := func(n int) {
		b := make([]byte, n)
		for i := range b {
			b[i] = byte(r.IntN(256))
		}
		b[0], b[1] = 0x1f, 0x8b
		texts = append(texts, []byte(text91.Encode(b)))
		want = append(want, digest(b))
	}
	for n := 2; n <= 300; n++ {
		addRandom(n)
	}
	for _, n := range []int{4096, 65_537, 1 << 20} {
		addRandom(n)
	}
	// text91 ends with a lone character when 6 bits or fewer are left: take a length whose
	// text ends so and make that character worth 64.
	var odd string
	for n := 2; n < 40 && odd == ""; n++ {
		if e := text91.Encode(append([]byte{0x1f, 0x8b}, make([]byte, n-2)...)); len(e)%2 == 1 {
			odd = e[:len(e)-1] + string(text91.Alphabet[64])
		}
	}
	if odd == "" {
		t.Fatal("no length up to 40 gives text91 text of odd length")
	}
	texts = append(texts, []byte(odd))
	want = append(want, "error: damaged module text")
	for i, g := range runUnpack(t, t.TempDir(), texts...) {
		if g != want[i] {
			t.Errorf("case %d (%d characters): got %.80q, want %.80q", i, len(texts[i]), g, want[i])
		}
	}
}

// A damaged stream never makes the unpacker fail in any other way than with one of the
// loader's errors (no trap, hang or exception that is not an Error) or return a module of
// another length: 300 copies of a packed stream, each with a few bytes changed at random
// places after the header. (Without a checksum some damage unpacks to wrong bytes of the
// right length; WebAssembly's validation of the module then refuses them.)
func TestLoaderUnpackerSurvivesDamage(t *testing.T) {
	if _, err := exec.LookPath("xz"); err != nil {
		t.Fatal("xz is needed (web/scripts/deps-build.sh installs xz-utils)")
	}
	r := rand.New(rand.NewPCG(5, 6))
	in := make([]byte, 20_000)
	for i := range in {
		in[i] = "saltcast unpacker "[r.IntN(18)] ^ byte(r.IntN(2))
	}
	dir := t.TempDir()
	raw := filepath.Join(dir, "in.bin")
	if err := os.WriteFile(raw, in, 0o644); err != nil {
		t.Fatal(err)
	}
	lz, err := exec.Command("xz", "--format=lzma", "-9e", "--stdout", raw).Output()
	if err != nil {
		t.Fatalf("xz: %v", err)
	}
	binary.LittleEndian.PutUint64(lz[5:13], uint64(len(in)))
	var texts [][]byte
	for range 300 {
		d := append([]byte(nil), lz...)
		for k := 1 + r.IntN(3); k > 0; k-- {
			d[13+r.IntN(len(d)-13)] ^= byte(1 + r.IntN(255))
		}
		texts = append(texts, []byte(text91.Encode(d)))
	}
	ok := map[string]bool{
		"error: the lzma stream is cut short": true,
		"error: damaged lzma stream":          true,
		"error: the lzma stream ends early":   true,
	}
	refused := 0
	for i, g := range runUnpack(t, dir, texts...) {
		switch {
		case ok[g]:
			refused++
		case strings.HasPrefix(g, strconv.Itoa(len(in))+" "):
		default:
			t.Errorf("damaged copy %d: %q", i, g)
		}
	}
	if refused == 0 {
		t.Error("not one of 300 damaged streams was refused")
	}
	t.Logf("%d of 300 damaged streams refused", refused)
}

// The unpacker's bytes in web/loader.js are what binaryen's wasm-as makes of web/unlzma.wat
// (`go generate ./web` writes them): a change to the source without them, or to them without
// the source, fails here.
func TestLoaderUnpackerIsAssembledFromSource(t *testing.T) {
	if _, err := exec.LookPath("wasm-as"); err != nil {
		t.Fatal("wasm-as is needed (binaryen; web/scripts/deps-chromium.sh installs it)")
	}
	out := filepath.Join(t.TempDir(), "unlzma.wasm")
	if msg, err := exec.Command("wasm-as", "unlzma.wat", "-o", out).CombinedOutput(); err != nil {
		t.Fatalf("wasm-as unlzma.wat: %v\n%s", err, msg)
	}
	wasm, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	loader, err := os.ReadFile("loader.js")
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`(?m)^  var UNPACKER = "([A-Za-z0-9+/=]*)";$`).FindAllSubmatch(loader, -1)
	if len(m) != 1 {
		t.Fatalf("web/loader.js has %d lines `  var UNPACKER = \"...\";`, want 1", len(m))
	}
	have, err := base64.StdEncoding.DecodeString(string(m[0][1]))
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(have, wasm) {
		t.Errorf("web/loader.js carries %d B of unpacker, wasm-as makes %d B from web/unlzma.wat: run go generate ./web", len(have), len(wasm))
	}
}
