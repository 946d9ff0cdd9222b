package wasmpack

import (
	"bytes"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"testing"
)

// module builds a WebAssembly 1.0 binary from sections given as id, body pairs.
func module(secs ...Section) []byte {
	b := append([]byte(nil), magic...)
	for _, s := range secs {
		b = append(b, s.ID)
		b = appendU32(b, uint32(len(s.Body)))
		b = append(b, s.Body...)
	}
	return b
}

// memorySection declares one memory of one page (section id 5, limits flag 0, min 1).
var memorySection = Section{ID: 5, Body: []byte{0x01, 0x00, 0x01}}

// tiny is a hand-built module: "ab" at 0, "cd" at 4, "ef" at 100, plus a custom section
// (id 0, name "x") that must pass through untouched.
var tiny = module(
	memorySection,
	Section{ID: sectionData, Body: []byte{
		0x03,
		0x00, opI32Const, 0x00, opEnd, 0x02, 'a', 'b',
		0x00, opI32Const, 0x04, opEnd, 0x02, 'c', 'd',
		0x00, opI32Const, 0xe4, 0x00, opEnd, 0x02, 'e', 'f', // 100 is 0xe4 0x00 in signed LEB128
	}},
	Section{ID: 0, Body: []byte{0x01, 'x', 0x2a}},
)

// The packed bytes of tiny with a gap of 8 were written out by hand from the binary format
// (WebAssembly Core Specification 2.0, §5.5.14 "Data section"), not copied from Pack.
var tinyPacked = module(
	memorySection,
	Section{ID: sectionData, Body: []byte{
		0x02,
		0x00, opI32Const, 0x00, opEnd, 0x06, 'a', 'b', 0, 0, 'c', 'd',
		0x00, opI32Const, 0xe4, 0x00, opEnd, 0x02, 'e', 'f',
	}},
	Section{ID: 0, Body: []byte{0x01, 'x', 0x2a}},
)

func TestPackTiny(t *testing.T) {
	for _, c := range []struct {
		gap  int
		want []byte
		segs int
	}{
		{gap: 8, want: tinyPacked, segs: 2},
		{gap: 1, want: tiny, segs: 3},       // the 2-byte gap stays a gap
		{gap: 2, want: tinyPacked, segs: 2}, // exactly the gap
	} {
		got, st, err := Pack(tiny, c.gap)
		if err != nil {
			t.Fatalf("Pack(tiny, %d): %v", c.gap, err)
		}
		if !bytes.Equal(got, c.want) {
			t.Errorf("Pack(tiny, %d) =\n% x\nwant\n% x", c.gap, got, c.want)
		}
		if st.SegmentsBefore != 3 || st.SegmentsAfter != c.segs {
			t.Errorf("Pack(tiny, %d) stats %+v, want 3 → %d segments", c.gap, st, c.segs)
		}
	}
	mem, err := Memory(tiny)
	if err != nil {
		t.Fatal(err)
	}
	want := make([]byte, 102)
	copy(want, "ab\x00\x00cd")
	copy(want[100:], "ef")
	if !bytes.Equal(mem, want) {
		t.Errorf("Memory(tiny) = %q, want %q", mem, want)
	}
}

func TestPackOutOfOrder(t *testing.T) {
	// Segments that do not overlap may come in any order (Go's linker writes its data
	// sections in its own order); they are sorted before merging.
	m := module(memorySection, Section{ID: sectionData, Body: []byte{
		0x02,
		0x00, opI32Const, 0x04, opEnd, 0x02, 'c', 'd',
		0x00, opI32Const, 0x00, opEnd, 0x02, 'a', 'b',
	}})
	got, _, err := Pack(m, 8)
	if err != nil {
		t.Fatal(err)
	}
	want := module(memorySection, Section{ID: sectionData, Body: []byte{
		0x01, 0x00, opI32Const, 0x00, opEnd, 0x06, 'a', 'b', 0, 0, 'c', 'd',
	}})
	if !bytes.Equal(got, want) {
		t.Errorf("Pack = % x, want % x", got, want)
	}
}

func TestPackRefuses(t *testing.T) {
	for _, c := range []struct {
		name string
		mod  []byte
		want error
	}{
		{"not wasm", []byte("hello"), ErrFormat},
		{"section runs past the end", append(append([]byte(nil), magic...), sectionData, 0x10, 0x00), ErrFormat},
		{"passive segment", module(Section{ID: sectionData, Body: []byte{0x01, 0x01, 0x01, 'a'}}), ErrUnsupported},
		{"overlap", module(Section{ID: sectionData, Body: []byte{
			0x02,
			0x00, opI32Const, 0x00, opEnd, 0x02, 'a', 'b',
			0x00, opI32Const, 0x01, opEnd, 0x01, 'c',
		}}), ErrUnsupported},
		{"global offset", module(Section{ID: sectionData, Body: []byte{0x01, 0x00, 0x23, 0x00, opEnd, 0x01, 'a'}}), ErrUnsupported},
		{"data count section", module(Section{ID: sectionDataCount, Body: []byte{0x01}},
			Section{ID: sectionData, Body: []byte{0x01, 0x00, opI32Const, 0x00, opEnd, 0x01, 'a'}}), ErrUnsupported},
		{"trailing bytes", module(Section{ID: sectionData, Body: []byte{0x00, 0x00}}), ErrFormat},
	} {
		if _, _, err := Pack(c.mod, 8); !errors.Is(err, c.want) {
			t.Errorf("Pack(%s) error %v, want %v", c.name, err, c.want)
		}
	}
}

// TestPackGoModule packs a module from Go's linker (the load-time yardstick, web/floor) and
// checks that its initial memory is unchanged byte for byte, with far fewer segments.
func TestPackGoModule(t *testing.T) {
	if testing.Short() {
		t.Skip("builds a Go program for js/wasm")
	}
	out := filepath.Join(t.TempDir(), "floor.wasm")
	cmd := exec.Command("go", "build", "-trimpath", "-ldflags=-s -w", "-o", out, "saltcast/web/floor")
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	if msg, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, msg)
	}
	orig, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	packed, st, err := Pack(orig, DefaultGap)
	if err != nil {
		t.Fatal(err)
	}
	if st.SegmentsAfter*10 > st.SegmentsBefore {
		t.Errorf("Pack left %d of %d segments; expected at most a tenth", st.SegmentsAfter, st.SegmentsBefore)
	}
	before, err := Memory(orig)
	if err != nil {
		t.Fatal(err)
	}
	after, err := Memory(packed)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(before, after) {
		t.Fatalf("initial memory differs: %d bytes before, %d after", len(before), len(after))
	}
	// Every section but the data section is unchanged.
	a, _ := Sections(orig)
	b, _ := Sections(packed)
	if len(a) != len(b) {
		t.Fatalf("%d sections before, %d after", len(a), len(b))
	}
	for i := range a {
		if a[i].ID != b[i].ID || (a[i].ID != sectionData && !bytes.Equal(a[i].Body, b[i].Body)) {
			t.Errorf("section %d (id %d) changed", i, a[i].ID)
		}
	}
}

// FuzzPack feeds Pack arbitrary bytes: it must not panic, and whatever it accepts keeps its
// initial memory and is already packed (packing again changes nothing).
func FuzzPack(f *testing.F) {
	f.Add(tiny, 8)
	f.Add(tinyPacked, 0)
	f.Add([]byte("\x00asm\x01\x00\x00\x00"), 64)
	f.Fuzz(func(t *testing.T, mod []byte, gap int) {
		if gap < 0 {
			gap = -gap
		}
		gap %= 1 << 16
		packed, _, err := Pack(mod, gap)
		if err != nil {
			return
		}
		before, err1 := Memory(mod)
		after, err2 := Memory(packed)
		if err1 != nil || err2 != nil {
			// Memory refuses only images over maxImage, which Pack could not change.
			if (err1 == nil) != (err2 == nil) {
				t.Fatalf("Memory before: %v, after: %v", err1, err2)
			}
			return
		}
		if !bytes.Equal(before, after) {
			t.Fatalf("initial memory changed")
		}
		again, _, err := Pack(packed, gap)
		if err != nil || !bytes.Equal(again, packed) {
			t.Fatalf("packing twice changed the module (err %v)", err)
		}
	})
}
