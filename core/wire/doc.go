// Package wire reads and writes the small, strict JSON that every Saltcast format uses.
//
// It exists so the browser build does not carry encoding/json and reflection (about 225 KB
// of WebAssembly). The reader follows RFC 8259 strictly and adds limits:
//
//   - input larger than Limits.MaxBytes (default 64 KiB) or nested deeper than
//     Limits.MaxDepth (default 32) is refused;
//   - duplicate keys in one object are refused, because a second value silently winning
//     is how a wrong number gets weighed;
//   - numbers follow the JSON grammar (no leading zeros, no "+", no ".5", no NaN or
//     Infinity) and must fit in a float64;
//   - strings must be valid UTF-8; \u escapes must pair surrogates correctly;
//   - a UTF-8 byte order mark at the very start is skipped (RFC 8259 §8.1 allows it).
//
// The reader returns a tree of Value that keeps object members in document order, so
// callers check unknown keys themselves and name them in their errors. Errors are
// *SyntaxError values carrying the byte offset, line and column.
//
// The writer (Encoder) appends to a byte slice with keys in the order they are written.
// It escapes <, > and & (and U+2028, U+2029) so output can be placed inside HTML or a
// script, and it refuses NaN and ±Inf: the first such number makes Bytes return an error
// naming the key.
package wire
