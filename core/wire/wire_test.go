package wire

import (
	"bytes"
	"errors"
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"
)

// Rows marked "RFC 8259 §n" check the grammar of that section of RFC 8259 (Bray, 2017,
// "The JavaScript Object Notation (JSON) Data Interchange Format").
func TestDecodeAccepts(t *testing.T) {
	tests := []struct {
		in   string
		want string // compact re-encoding
	}{
		// literals and whitespace (RFC 8259 §2, §3)
		{` true `, `true`},
		{"\t\r\nfalse", `false`},
		{`null`, `null`},
		// numbers (RFC 8259 §6)
		{`0`, `0`},
		{`-0`, `0`},
		{`12.5`, `12.5`},
		{`-1e3`, `-1000`},
		{`1E-2`, `0.01`},
		{`1e+2`, `100`},
		{`1.5e300`, `1.5e+300`},
		{`0.000001`, `0.000001`},
		{`1e-7`, `1e-07`},
		{`123456789012345678901234567890`, `1.2345678901234568e+29`},
		// strings (RFC 8259 §7)
		{`"a\"b\\c\/d"`, `"a\"b\\c/d"`},
		{`"\b\f\n\r\t"`, `"\u0008\u000c\n\r\t"`},
		{`"\u00e9\u4e2d"`, `"é中"`},
		{`"\ud83d\ude00"`, `"😀"`},
		{`"<b>&amp;</b>"`, `"\u003cb\u003e\u0026amp;\u003c/b\u003e"`},
		{"\"\u2028\"", `"\u2028"`},
		{`"CuSO4·5H2O"`, `"CuSO4·5H2O"`},
		// structures (RFC 8259 §4, §5)
		{`{}`, `{}`},
		{`[]`, `[]`},
		{` { "b" : 1 , "a" : [ 1 , { } , [ ] ] } `, `{"b":1,"a":[1,{},[]]}`},
		// byte order mark (RFC 8259 §8.1 allows ignoring it)
		{"\xEF\xBB\xBF{}", `{}`},
	}
	for _, tt := range tests {
		v, err := Decode([]byte(tt.in))
		if err != nil {
			t.Errorf("Decode(%q) error %v", tt.in, err)
			continue
		}
		got, err := Encode(v)
		if err != nil {
			t.Errorf("Encode(Decode(%q)) error %v", tt.in, err)
			continue
		}
		if string(got) != tt.want {
			t.Errorf("Encode(Decode(%q)) = %s, want %s", tt.in, got, tt.want)
		}
	}
}

func TestDecodeRefuses(t *testing.T) {
	tests := []struct {
		in      string
		wantMsg string // a part of the message
	}{
		{``, "end of input"},
		{` `, "end of input"},
		{`{"a":1,"a":2}`, `duplicate key "a"`},
		{`NaN`, "NaN and Infinity"},
		{`-Infinity`, "NaN and Infinity"},
		{`Infinity`, "NaN and Infinity"},
		{`01`, "leading zeros"},
		{`-01`, "leading zeros"},
		{`+1`, "expected a value"},
		{`.5`, "expected a value"},
		{`1.`, "digit must follow the decimal point"},
		{`1e`, "digit must follow the exponent"},
		{`-`, "digit must follow '-'"},
		{`1e400`, "too large"},
		{`0x10`, "after the end"},
		{`[1,]`, "expected a value"},
		{`{"a":1,}`, "expected a key"},
		{`{a:1}`, "expected a key"},
		{`{"a" 1}`, "expected ':'"},
		{`[1 2]`, "expected ',' or ']'"},
		{`{"a":1 "b":2}`, "expected ',' or '}'"},
		{`"abc`, "inside a string"},
		{"\"a\nb\"", "control characters"},
		{`"\x"`, `unknown escape \x`},
		{`"\u12"`, "four hex digits"},
		{`"\ud83d"`, "unpaired surrogate"},
		{`"\ude00"`, "unpaired surrogate"},
		{`"\ud83d\u0041"`, "unpaired surrogate"},
		{"\"\xff\"", "invalid UTF-8"},
		{`tru`, "unknown word"},
		{`nul`, "unknown word"},
		{`{} {}`, "after the end"},
		{`'a'`, "expected a value"},
	}
	for _, tt := range tests {
		_, err := Decode([]byte(tt.in))
		var se *SyntaxError
		if !errors.As(err, &se) {
			t.Errorf("Decode(%q) error = %v, want a *SyntaxError", tt.in, err)
			continue
		}
		if !strings.Contains(se.Msg, tt.wantMsg) {
			t.Errorf("Decode(%q) error %q, want it to contain %q", tt.in, se.Msg, tt.wantMsg)
		}
	}
}

func TestDecodeErrorPosition(t *testing.T) {
	_, err := Decode([]byte("{\n  \"a\": 1,\n  \"a\": 2\n}"))
	var se *SyntaxError
	if !errors.As(err, &se) {
		t.Fatalf("error %v, want *SyntaxError", err)
	}
	if se.Line != 3 || se.Column != 3 {
		t.Errorf("duplicate key reported at line %d column %d, want line 3 column 3", se.Line, se.Column)
	}
	if want := "JSON line 3, column 3: duplicate key \"a\""; se.Error() != want {
		t.Errorf("Error() = %q, want %q", se.Error(), want)
	}
}

func TestLimits(t *testing.T) {
	deep := strings.Repeat("[", 33) + strings.Repeat("]", 33)
	if _, err := Decode([]byte(deep)); err == nil || !strings.Contains(err.Error(), "nesting deeper") {
		t.Errorf("Decode(33 nested arrays) error %v, want nesting limit", err)
	}
	ok := strings.Repeat("[", 32) + strings.Repeat("]", 32)
	if _, err := Decode([]byte(ok)); err != nil {
		t.Errorf("Decode(32 nested arrays) error %v, want nil", err)
	}
	big := `"` + strings.Repeat("a", 64<<10) + `"`
	if _, err := Decode([]byte(big)); err == nil || !strings.Contains(err.Error(), "larger than the limit") {
		t.Errorf("Decode(65 KiB) error %v, want size limit", err)
	}
	if _, err := DecodeLimits([]byte(big), Limits{MaxBytes: 1 << 20}); err != nil {
		t.Errorf("DecodeLimits(65 KiB, 1 MiB) error %v", err)
	}
	// Many keys: duplicate found past the linear-search threshold.
	var b strings.Builder
	b.WriteString("{")
	for i := 0; i < 40; i++ {
		b.WriteString(`"k` + strconv.Itoa(i) + `":1,`)
	}
	b.WriteString(`"k1":2}`)
	if _, err := Decode([]byte(b.String())); err == nil || !strings.Contains(err.Error(), `duplicate key "k1"`) {
		t.Errorf("Decode(41 keys with a duplicate) error %v", err)
	}
}

func TestGet(t *testing.T) {
	v, err := Decode([]byte(`{"x":1,"y":"two"}`))
	if err != nil {
		t.Fatal(err)
	}
	if y, ok := v.Get("y"); !ok || y.Kind != String || y.Text != "two" {
		t.Errorf(`Get("y") = %+v, %v`, y, ok)
	}
	if _, ok := v.Get("z"); ok {
		t.Error(`Get("z") found a member`)
	}
}

func TestEncoder(t *testing.T) {
	var e Encoder
	e.BeginObject()
	e.Key("name").String("a<b")
	e.Key("n").Int(-3)
	e.Key("x").Round(77.270123, 4)
	e.Key("ok").Bool(true)
	e.Key("none").Null()
	e.Key("list").BeginArray().Float(1.5).Float(-0.0).BeginObject().EndObject().EndArray()
	e.EndObject()
	got, err := e.Bytes()
	if err != nil {
		t.Fatal(err)
	}
	want := `{"name":"a\u003cb","n":-3,"x":77.27,"ok":true,"none":null,"list":[1.5,0,{}]}`
	if string(got) != want {
		t.Errorf("got %s\nwant %s", got, want)
	}
}

func TestEncoderRefusesNonFinite(t *testing.T) {
	for _, v := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		var e Encoder
		e.BeginObject().Key("a").Float(1).Key("crystals_g").Float(v).EndObject()
		_, err := e.Bytes()
		var nf *NotFiniteError
		if !errors.As(err, &nf) || nf.Key != "crystals_g" || !errors.Is(err, ErrNotFinite) {
			t.Errorf("Float(%v): Bytes error %v, want NotFiniteError for crystals_g", v, err)
		}
	}
}

func TestRoundSig(t *testing.T) {
	tests := []struct {
		v    float64
		sig  int
		want float64
	}{
		{77.270123, 4, 77.27},
		{0.00123456, 3, 0.00123},
		{-1234.5, 2, -1200},
		{0, 3, 0},
		{1.0, 40, 1.0},
	}
	for _, tt := range tests {
		if got := RoundSig(tt.v, tt.sig); got != tt.want {
			t.Errorf("RoundSig(%v, %d) = %v, want %v", tt.v, tt.sig, got, tt.want)
		}
	}
	if !math.IsNaN(RoundSig(math.NaN(), 3)) {
		t.Error("RoundSig(NaN) is not NaN")
	}
}

func TestAppendStringInvalidUTF8(t *testing.T) {
	got := AppendString(nil, "a\xffb")
	if want := `"a\ufffdb"`; string(got) != want {
		t.Errorf("AppendString(invalid) = %s, want %s", got, want)
	}
}

// FuzzDecode checks properties, not outputs: Decode never panics; whatever it accepts
// encodes without error, and decoding that output gives the same encoding again.
func FuzzDecode(f *testing.F) {
	for _, s := range []string{
		`{"format":1,"solute":"KNO3","water_g":100,"dissolve_temp_C":60}`,
		`[1,-0,1e-7,"\ud83d\ude00",{"a":[true,false,null]}]`,
		`"<&>"`, `{"a":1,"a":2}`, `1e400`, "\xEF\xBB\xBF[]",
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		v, err := Decode(data)
		if err != nil {
			return
		}
		once, err := Encode(v)
		if err != nil {
			t.Fatalf("Encode after Decode(%q): %v", data, err)
		}
		v2, err := Decode(once)
		if err != nil {
			t.Fatalf("Decode(Encode(Decode(%q))) = %v; encoded %s", data, err, once)
		}
		twice, err := Encode(v2)
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(once, twice) {
			t.Fatalf("not stable:\n%s\n%s", once, twice)
		}
	})
}

var sink Value

func BenchmarkDecodeRecipe(b *testing.B) {
	data := []byte(`{"format":1,"name":"Copper sulfate crystals (invented)","solute":"CuSO4",
"charged_form":"CuSO4·5H2O","purity_pct":99,"water_g":500,"dissolve_temp_C":60,
"saturation_pct":95,"cool_to_C":20,"seed_at_C":45,"metastable_width_K":4,"cooling_time_min":180}`)
	for b.Loop() {
		v, err := Decode(data)
		if err != nil {
			b.Fatal(err)
		}
		sink = v
	}
}

// RoundSig must agree with rounding the decimal text (strconv 'e' formatting) everywhere
// except within 0.002 units of the last digit of a tie (see RoundSig).
func TestRoundSigMatchesStrconv(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 6))
	for range 200000 {
		v := math.Pow(10, 40*rng.Float64()-20) * (rng.Float64() - 0.5)
		sig := 1 + rng.IntN(17)
		want, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'e', sig-1, 64), 64)
		got := RoundSig(v, sig)
		if got != want {
			// Allow a near tie to go the other way: the three digits after the last kept
			// one are 498 to 502.
			alt := strconv.FormatFloat(math.Abs(v), 'e', sig+2, 64)
			mant := strings.Replace(alt[:strings.IndexByte(alt, 'e')], ".", "", 1)
			if next := mant[sig:]; next >= "498" && next <= "502" {
				continue
			}
			t.Fatalf("RoundSig(%v, %d) = %v, want %v", v, sig, got, want)
		}
	}
}

func BenchmarkRoundSig(b *testing.B) {
	var s float64
	for b.Loop() {
		s += RoundSig(77.270123, 6)
	}
	_ = s
}
