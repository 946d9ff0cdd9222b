package recipe

import "testing"

// The CRC under Checksum is CRC-32/ISO-HDLC. Check value: CRC of the ASCII "123456789" is
// 0xCBF43926 (G. Cook, "Catalogue of parametrised CRC algorithms", entry CRC-32/ISO-HDLC;
// the same CRC as ISO/IEC 3309 HDLC, zip and PNG).
func TestCRC32CheckValue(t *testing.T) {
	if got := CRC32([]byte("123456789")); got != 0xCBF43926 {
		t.Errorf("crc32(123456789) = %08x, want cbf43926", got)
	}
	if got := hex32(0xCBF43926); got != "cbf43926" {
		t.Errorf("hex32 = %q", got)
	}
	if got := hex32(0x0000000a); got != "0000000a" {
		t.Errorf("hex32 keeps leading zeros: %q", got)
	}
}
