package text91

import (
	"bytes"
	"encoding/base64"
	"errors"
	"math/rand/v2"
	"strings"
	"testing"
)

func TestAlphabet(t *testing.T) {
	if len(Alphabet) != 91 {
		t.Fatalf("alphabet has %d characters, want 91", len(Alphabet))
	}
	if strings.ContainsAny(Alphabet, "<>&") {
		t.Errorf("alphabet %q holds a character that could start markup", Alphabet)
	}
	for _, c := range []byte(Alphabet) {
		if c <= ' ' || c > '~' {
			t.Errorf("alphabet holds %q, not printable ASCII", c)
		}
	}
}

// Hand-worked examples: the bits of the input, lowest first, in groups of 13.
func TestEncodeKnown(t *testing.T) {
	for _, c := range []struct {
		in   []byte
		want string
	}{
		{nil, ""},
		// 8 bits, value 0: a pair (7 or more bits left), both characters of value 0.
		{[]byte{0}, "!!"},
		// 0xff: v = 255 = 2·91 + 73 → Alphabet[73], Alphabet[2].
		{[]byte{0xff}, string([]byte{Alphabet[73], Alphabet[2]})},
		// 16 bits of ones: first group 8191 = 90·91 + 1 → Alphabet[1], Alphabet[90]; 3 bits
		// left (value 7), one character.
		{[]byte{0xff, 0xff}, string([]byte{Alphabet[1], Alphabet[90], Alphabet[7]})},
	} {
		if got := Encode(c.in); got != c.want {
			t.Errorf("Encode(% x) = %q, want %q", c.in, got, c.want)
		}
	}
}

func TestRoundTrip(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for n := range 200 {
		b := make([]byte, n)
		for i := range b {
			b[i] = byte(r.Uint32())
		}
		s := Encode(b)
		if len(s) != EncodedLen(n) || DecodedLen(len(s)) != n {
			t.Errorf("n=%d: text %d characters, EncodedLen %d, DecodedLen %d", n, len(s), EncodedLen(n), DecodedLen(len(s)))
		}
		back, err := Decode(s)
		if err != nil || !bytes.Equal(back, b) {
			t.Fatalf("Decode(Encode(% x)) = % x, %v", b, back, err)
		}
	}
}

// The point of the package: fewer characters than base64 for the same bytes.
func TestShorterThanBase64(t *testing.T) {
	const n = 900_000 // about the packed module
	got, b64 := EncodedLen(n), base64.StdEncoding.EncodedLen(n)
	if got >= b64 {
		t.Errorf("EncodedLen(%d) = %d, base64 %d", n, got, b64)
	}
	// 16/13 characters per byte (derived: 13 bits per two characters).
	if want := (n*16 + 12) / 13; got < want-1 || got > want+1 {
		t.Errorf("EncodedLen(%d) = %d, want about %d", n, got, want)
	}
}

func TestDecodeRefuses(t *testing.T) {
	for _, s := range []string{
		"<!", "a b", "!é",
		"~~",     // 90 + 91·90 = 8280, more than 13 bits
		"!!!!!!", // 39 bits hold 4 bytes, which Encode writes in 5 characters, not 6
		"\"",     // lone character worth 1 with no byte: non-zero padding
	} {
		if _, err := Decode(s); !errors.Is(err, ErrText) {
			t.Errorf("Decode(%q) error %v, want ErrText", s, err)
		}
	}
}

// FuzzDecode: Decode never panics, and what it accepts Encode writes again exactly.
func FuzzDecode(f *testing.F) {
	f.Add("")
	f.Add("!!")
	f.Add(Encode([]byte("Saltcast")))
	f.Fuzz(func(t *testing.T, s string) {
		b, err := Decode(s)
		if err != nil {
			return
		}
		if again := Encode(b); again != s {
			t.Fatalf("Encode(Decode(%q)) = %q", s, again)
		}
	})
}
