// Package text91 writes bytes as plain ASCII text, 13 bits in every two characters, so the
// packed module inlined in the page takes 1.23 characters per byte instead of base64's 1.33.
//
// The alphabet is the 91 printable ASCII characters from '!' (0x21) to '~' (0x7e) without
// '<', '>' and '&': text in a <script> data block ends only at "</script" (WHATWG HTML,
// "script data state"), so without '<' nothing in the text can end it or start markup, and
// without '&' and '>' it reads the same wherever it is pasted. No space or line break is
// used, so trimming the text is harmless.
//
// Bits are taken from each byte lowest first and grouped by 13; a group v (0 ≤ v < 8192 ≤
// 91²) is written as the characters alphabet[v%91] then alphabet[v/91]. The last group, if
// it has 6 bits or fewer, is written as one character. The padding bits are zero and never
// reach a whole byte, so the text's length alone gives the number of bytes. The loader's
// unpacker (web/unlzma.wat) decodes the same way.
package text91

import (
	"errors"
	"strconv"
)

const base = 91

// Alphabet lists the characters in order of their value.
var Alphabet = func() string {
	b := make([]byte, 0, base)
	for c := byte('!'); c <= '~'; c++ {
		if c != '<' && c != '>' && c != '&' {
			b = append(b, c)
		}
	}
	return string(b)
}()

var value = func() (v [256]int16) {
	for i := range v {
		v[i] = -1
	}
	for i := range len(Alphabet) {
		v[Alphabet[i]] = int16(i)
	}
	return v
}()

// EncodedLen is the length of the text for n bytes.
func EncodedLen(n int) int {
	bits := 8 * n
	l := bits / 13 * 2
	switch r := bits % 13; {
	case r == 0:
	case r <= 6:
		l++
	default:
		l += 2
	}
	return l
}

// DecodedLen is the number of bytes a text of n characters holds.
func DecodedLen(n int) int { return (n/2*13 + n%2*6) / 8 }

// Encode returns b as text.
func Encode(b []byte) string {
	out := make([]byte, 0, EncodedLen(len(b)))
	var acc uint32
	bits := 0
	for _, c := range b {
		acc |= uint32(c) << bits
		bits += 8
		if bits >= 13 {
			v := acc & 0x1fff
			acc >>= 13
			bits -= 13
			out = append(out, Alphabet[v%base], Alphabet[v/base])
		}
	}
	switch {
	case bits == 0:
	case bits <= 6:
		out = append(out, Alphabet[acc])
	default:
		out = append(out, Alphabet[acc%base], Alphabet[acc/base])
	}
	return string(out)
}

// ErrText reports text that Encode cannot have written.
var ErrText = errors.New("text91: not text91")

// Decode returns the bytes s holds. It accepts only what Encode writes: it fails on a
// character outside the alphabet, a pair worth 8192 or more, a lone last character worth 64
// or more, and padding that is not zero or not the shortest.
func Decode(s string) ([]byte, error) {
	out := make([]byte, 0, DecodedLen(len(s)))
	var acc uint32
	bits := 0
	i := 0
	for ; i+1 < len(s); i += 2 {
		lo, hi := value[s[i]], value[s[i+1]]
		if lo < 0 || hi < 0 {
			return nil, bad(i, "character outside the alphabet")
		}
		v := uint32(lo) + base*uint32(hi)
		if v >= 1<<13 {
			return nil, bad(i, "pair worth more than 13 bits")
		}
		acc |= v << bits
		bits += 13
		for bits >= 8 {
			out = append(out, byte(acc))
			acc >>= 8
			bits -= 8
		}
	}
	if i < len(s) {
		v := value[s[i]]
		if v < 0 || v >= 1<<6 {
			return nil, bad(i, "last character worth more than 6 bits")
		}
		acc |= uint32(v) << bits
		bits += 6
		if bits >= 8 {
			out = append(out, byte(acc))
			acc >>= 8
		}
	}
	if acc != 0 || EncodedLen(len(out)) != len(s) {
		return nil, bad(len(s), "padding that Encode does not write")
	}
	return out, nil
}

// A textError says where the text went wrong; errors.Is(err, ErrText) holds.
type textError struct {
	at  int
	why string
}

func (e *textError) Error() string {
	return ErrText.Error() + ": " + e.why + " at " + strconv.Itoa(e.at)
}
func (e *textError) Unwrap() error { return ErrText }

func bad(at int, why string) error { return &textError{at, why} }
