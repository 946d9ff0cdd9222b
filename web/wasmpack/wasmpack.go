// Package wasmpack merges the data segments of a linked WebAssembly module so it compresses
// better.
//
// Go's linker leaves out every run of eight or more zero bytes in the program's data and
// starts a new active data segment after it (cmd/link/internal/wasm: "segmentOverhead"), so a
// Go module carries tens of thousands of segments. Each segment's header (flags, an
// i32.const offset expression, a length) is a few bytes of nearly random numbers that gzip
// compresses badly, while a run of zeros costs gzip almost nothing. Pack joins neighbouring
// segments whose gap is at most a given number of bytes, writing the gap's zeros out.
//
// The result starts with the same linear memory: memory starts zeroed (WebAssembly Core
// Specification 2.0, §4.5.3 "Memory instances"; active segments are copied in order at
// instantiation, §4.5.4), so a merged segment writes exactly what the two segments and the
// zeros between them held. Pack only merges when that argument holds: every segment active,
// in memory 0, at a constant offset, none overlapping another. Anything else is
// refused with an error rather than guessed at. Other sections pass through byte for byte.
package wasmpack

import (
	"bytes"
	"cmp"
	"errors"
	"slices"
	"strconv"
)

// Section ids used here (WebAssembly Core Specification 2.0, §5.5.2).
const (
	sectionData      = 11
	sectionDataCount = 12
)

const (
	opI32Const = 0x41
	opEnd      = 0x0b
)

var magic = []byte{0x00, 'a', 's', 'm', 0x01, 0x00, 0x00, 0x00}

// ErrFormat reports a module this package cannot read: not WebAssembly 1.0 binary format, or
// a section or data segment that ends early or runs over.
var ErrFormat = errors.New("wasmpack: malformed module")

// ErrUnsupported reports a valid module whose data segments Pack will not merge (a passive
// segment, another memory, a non-constant offset, or segments out of order or overlapping).
var ErrUnsupported = errors.New("wasmpack: data segments not mergeable")

// Section is one section of a module: its id and its contents without the size.
type Section struct {
	ID   byte
	Body []byte
}

// Segment is an active data segment of memory 0 at a constant offset.
type Segment struct {
	Offset uint32
	Data   []byte
}

// Sections splits a module into its sections. The bodies alias b.
func Sections(b []byte) ([]Section, error) {
	if !bytes.HasPrefix(b, magic) {
		return nil, formatError("no WebAssembly 1.0 header")
	}
	r := reader{b: b, i: len(magic)}
	var out []Section
	for r.i < len(r.b) {
		id := r.b[r.i]
		r.i++
		n, err := r.u32()
		if err != nil {
			return nil, err
		}
		body, err := r.take(n)
		if err != nil {
			return nil, err
		}
		out = append(out, Section{ID: id, Body: body})
	}
	return out, nil
}

// DataSegments reads the body of a data section. The segments' data alias body.
func DataSegments(body []byte) ([]Segment, error) {
	r := reader{b: body}
	n, err := r.u32()
	if err != nil {
		return nil, err
	}
	if uint64(n) > uint64(len(body)) { // each segment takes at least one byte
		return nil, formatError("more segments than bytes")
	}
	segs := make([]Segment, 0, n)
	for range n {
		flags, err := r.u32()
		if err != nil {
			return nil, err
		}
		if flags != 0 {
			return nil, unsupported("segment flags " + strconv.FormatUint(uint64(flags), 10) + " (passive or explicit memory)")
		}
		op, err := r.byte()
		if err != nil {
			return nil, err
		}
		if op != opI32Const {
			return nil, unsupported("offset is not an i32.const")
		}
		off, err := r.s32()
		if err != nil {
			return nil, err
		}
		if end, err := r.byte(); err != nil {
			return nil, err
		} else if end != opEnd {
			return nil, unsupported("offset expression longer than one i32.const")
		}
		size, err := r.u32()
		if err != nil {
			return nil, err
		}
		data, err := r.take(size)
		if err != nil {
			return nil, err
		}
		segs = append(segs, Segment{Offset: uint32(off), Data: data})
	}
	if r.i != len(r.b) {
		return nil, formatError("bytes after the last data segment")
	}
	return segs, nil
}

// Memory returns the start of the linear memory the module's data segments write at
// instantiation, up to the last byte any segment writes (memory beyond is zero). A module
// without a data section gives an empty image.
func Memory(module []byte) ([]byte, error) {
	secs, err := Sections(module)
	if err != nil {
		return nil, err
	}
	var mem []byte
	for _, s := range secs {
		if s.ID != sectionData {
			continue
		}
		segs, err := DataSegments(s.Body)
		if err != nil {
			return nil, err
		}
		for _, g := range segs {
			end := uint64(g.Offset) + uint64(len(g.Data))
			if end > maxImage {
				return nil, unsupported("data beyond " + strconv.Itoa(maxImage>>20) + " MiB")
			}
			if int(end) > len(mem) {
				mem = append(mem, make([]byte, int(end)-len(mem))...)
			}
			copy(mem[g.Offset:], g.Data)
		}
	}
	return mem, nil
}

// DefaultGap is the longest run of zeros Pack writes out by default. Measured on the bench
// app's module (71 051 segments): a gap of 16 bytes left 68 088 segments; 32 left 158; 64 left
// 16 and made the zopfli-compressed module 119 KB smaller; longer gaps saved under 1 KB more
// while adding raw bytes.
const DefaultGap = 64

// maxImage bounds the memory image Memory builds (Go's initial data is a few MB).
const maxImage = 1 << 30

// Stats describe what Pack did.
type Stats struct {
	SegmentsBefore, SegmentsAfter int
	ZerosAdded                    int // gap bytes written out as zeros
}

// Pack returns module with each pair of neighbouring data segments merged when at most
// maxGap bytes lie between them. A module without a data section is returned as it is.
func Pack(module []byte, maxGap int) ([]byte, Stats, error) {
	var st Stats
	if maxGap < 0 {
		return nil, st, errors.New("wasmpack: negative gap")
	}
	secs, err := Sections(module)
	if err != nil {
		return nil, st, err
	}
	dataSections := 0
	for _, s := range secs {
		if s.ID == sectionData {
			// The binary format allows each known section once (WebAssembly Core
			// Specification 2.0, §5.5.2); with two, a gap written out in one could cover
			// bytes the other writes.
			if dataSections++; dataSections > 1 {
				return nil, st, formatError("more than one data section")
			}
		}
		if s.ID == sectionDataCount {
			// A data count section is there for memory.init and data.drop, which name
			// segments by index; merging would renumber them.
			return nil, st, unsupported("module has a data count section")
		}
	}
	out := make([]byte, 0, len(module))
	out = append(out, magic...)
	for _, s := range secs {
		body := s.Body
		if s.ID == sectionData {
			segs, err := DataSegments(s.Body)
			if err != nil {
				return nil, st, err
			}
			st.SegmentsBefore += len(segs)
			segs, added, err := merge(segs, maxGap)
			if err != nil {
				return nil, st, err
			}
			st.SegmentsAfter += len(segs)
			st.ZerosAdded += added
			body = encodeData(segs)
		}
		out = append(out, s.ID)
		out = appendU32(out, uint32(len(body)))
		out = append(out, body...)
	}
	return out, st, nil
}

// merge joins neighbouring segments. Segments that do not overlap write the same memory in
// any order, so they are sorted by offset first; overlapping segments are refused, since
// then order matters and a written-out gap could cover an earlier segment's bytes.
func merge(segs []Segment, maxGap int) ([]Segment, int, error) {
	segs = slices.Clone(segs)
	slices.SortStableFunc(segs, func(a, b Segment) int { return cmp.Compare(a.Offset, b.Offset) })
	var out []Segment
	added := 0
	for i, g := range segs {
		if i > 0 {
			prev := segs[i-1]
			if uint64(g.Offset) < uint64(prev.Offset)+uint64(len(prev.Data)) {
				return nil, 0, unsupported("segments overlap at offset " + strconv.FormatUint(uint64(g.Offset), 10))
			}
		}
		if n := len(out); n > 0 {
			last := &out[n-1]
			end := uint64(last.Offset) + uint64(len(last.Data))
			if gap := uint64(g.Offset) - end; gap <= uint64(maxGap) {
				// last.Data may alias the module; grow a copy.
				buf := make([]byte, 0, len(last.Data)+int(gap)+len(g.Data))
				buf = append(buf, last.Data...)
				buf = append(buf, make([]byte, gap)...)
				last.Data = append(buf, g.Data...)
				added += int(gap)
				continue
			}
		}
		out = append(out, g)
	}
	return out, added, nil
}

func encodeData(segs []Segment) []byte {
	var b []byte
	b = appendU32(b, uint32(len(segs)))
	for _, g := range segs {
		b = append(b, 0, opI32Const)
		b = appendS32(b, int32(g.Offset))
		b = append(b, opEnd)
		b = appendU32(b, uint32(len(g.Data)))
		b = append(b, g.Data...)
	}
	return b
}

func appendU32(b []byte, v uint32) []byte {
	for {
		c := byte(v & 0x7f)
		v >>= 7
		if v == 0 {
			return append(b, c)
		}
		b = append(b, c|0x80)
	}
}

func appendS32(b []byte, v int32) []byte {
	for {
		c := byte(v & 0x7f)
		v >>= 7
		if (v == 0 && c&0x40 == 0) || (v == -1 && c&0x40 != 0) {
			return append(b, c)
		}
		b = append(b, c|0x80)
	}
}

// reader decodes LEB128 numbers (WebAssembly Core Specification 2.0, §5.2.2) and byte runs.
type reader struct {
	b []byte
	i int
}

func (r *reader) byte() (byte, error) {
	if r.i >= len(r.b) {
		return 0, formatError("unexpected end")
	}
	c := r.b[r.i]
	r.i++
	return c, nil
}

func (r *reader) take(n uint32) ([]byte, error) {
	if uint64(n) > uint64(len(r.b)-r.i) {
		return nil, formatError("length " + strconv.FormatUint(uint64(n), 10) + " runs past the end")
	}
	s := r.b[r.i : r.i+int(n)]
	r.i += int(n)
	return s, nil
}

// u32 reads an unsigned LEB128 of at most 5 bytes whose value fits 32 bits.
func (r *reader) u32() (uint32, error) {
	var v uint32
	for shift := uint(0); shift < 35; shift += 7 {
		c, err := r.byte()
		if err != nil {
			return 0, err
		}
		if shift == 28 && c&0x70 != 0 {
			return 0, formatError("u32 out of range")
		}
		v |= uint32(c&0x7f) << shift
		if c&0x80 == 0 {
			return v, nil
		}
	}
	return 0, formatError("u32 longer than 5 bytes")
}

// s32 reads a signed LEB128 of at most 5 bytes whose value fits 32 bits.
func (r *reader) s32() (int32, error) {
	var v int64
	for shift := uint(0); shift < 35; shift += 7 {
		c, err := r.byte()
		if err != nil {
			return 0, err
		}
		v |= int64(c&0x7f) << shift
		if c&0x80 == 0 {
			if c&0x40 != 0 {
				v |= -1 << (shift + 7)
			}
			if v < -1<<31 || v > 1<<31-1 {
				return 0, formatError("s32 out of range")
			}
			return int32(v), nil
		}
	}
	return 0, formatError("s32 longer than 5 bytes")
}

func formatError(why string) error { return &packError{ErrFormat, why} }
func unsupported(why string) error { return &packError{ErrUnsupported, why} }

type packError struct {
	kind error
	why  string
}

func (e *packError) Error() string { return e.kind.Error() + ": " + e.why }
func (e *packError) Unwrap() error { return e.kind }
