package recipe

import (
	"math"

	"saltcast/core/wire"
)

// ChecksumSig is the number of significant digits each number of a recipe keeps in the
// encoding Checksum hashes. The page shows a number in °F, lb or US gal with ten significant
// digits and stores what is typed back in °C, g and mL: a relative error up to 5e-10, well
// inside half a step of the eighth digit (at least 5e-9), so the same recipe shown and typed
// in any unit system gives the same checksum, while any change a balance (seven digits at
// most) can show changes it. Temperatures are rounded to ChecksumTempC instead: near 0 °C a
// relative rounding would keep digits that ten digits in K or °F do not carry.
const ChecksumSig = 8

// ChecksumTempC is the step, in °C (= K), temperatures are rounded to in the encoding Checksum
// hashes: ten times finer than the 1 mK the best laboratory thermometers read (common
// practice), a hundred times coarser than ten digits of a temperature in K or °F.
const ChecksumTempC = 1e-4

// checksumNum rounds one number of kind k as Checksum hashes it.
func checksumNum(v float64, k Kind) float64 {
	if k == Temp {
		return math.Round(v/ChecksumTempC)*ChecksumTempC + 0 // + 0: −0 prints as 0
	}
	return wire.RoundSig(v, ChecksumSig)
}

// Checksum returns a short fingerprint of the recipe's inputs, 8 lowercase hex digits, for
// telling a printed batch sheet's recipe from another: the CRC-32 (CRC-32/ISO-HDLC, the
// CRC of zip and PNG) of the recipe's canonical encoding, that is Encode (keys in the order
// of Fields, whatever the order of the file read) with every number rounded to ChecksumSig
// significant digits (temperatures to ChecksumTempC), and without the name and notes, which do not change the batch (the
// sheet prints the name beside the checksum). Text is hashed as written: "CuSO4" and
// "copper sulfate" give different checksums. It is a check against mix-ups, not a seal:
// anyone can make a recipe with a given checksum.
func (r Recipe) Checksum() string {
	r.Name, r.Notes = "", ""
	if r.Custom != nil {
		c := *r.Custom
		c.Points = append([]Point(nil), c.Points...)
		r.Custom = &c
	}
	for i := range Fields.Fields {
		f := &Fields.Fields[i]
		if f.Parent() != "" && r.Custom == nil {
			continue
		}
		switch {
		case f.Opt != nil:
			o := f.Opt(&r)
			o.Value = checksumNum(o.Value, f.Kind)
		case f.Num != nil:
			n := f.Num(&r)
			*n = checksumNum(*n, f.Kind)
		case f.Points != nil:
			for j, p := range *f.Points(&r) {
				(*f.Points(&r))[j] = Point{checksumNum(p.TempC, Temp), checksumNum(p.GPer100gWater, Plain)}
			}
		}
	}
	var e wire.Encoder
	Fields.encode(&e, &r)
	b, err := e.Bytes()
	if err != nil { // a number that is not finite: such a recipe is refused on reading
		return "--------"
	}
	return hex32(CRC32(b))
}

// crcTable is the table of the reflected CRC-32 of IEEE 802.3 (polynomial 0xEDB88320),
// built at start: a dozen lines instead of hash/crc32, which costs 2.8 KB of gzip in the page
// (measured for the carried-recipes block in web/carry, which uses this one too).
var crcTable = func() (t [256]uint32) {
	for i := range t {
		c := uint32(i)
		for range 8 {
			if c&1 != 0 {
				c = 0xEDB88320 ^ c>>1
			} else {
				c >>= 1
			}
		}
		t[i] = c
	}
	return t
}()

// CRC32 is CRC-32/ISO-HDLC (the CRC of zip, PNG and Ethernet): check value 0xCBF43926 for
// "123456789". The recipe check and the carried-recipes block (web/carry) both use it.
func CRC32(b []byte) uint32 {
	c := ^uint32(0)
	for _, x := range b {
		c = crcTable[byte(c)^x] ^ c>>8
	}
	return ^c
}

func hex32(v uint32) string {
	const digits = "0123456789abcdef"
	var b [8]byte
	for i := range b {
		b[i] = digits[v>>uint(28-4*i)&0xF]
	}
	return string(b[:])
}
