// Package htmlscan reads the start tags of an HTML page byte by byte, without a parser, to
// find Saltcast's own elements in a page: the carried-recipes block (web/carry), the
// script and style parts the page rebuilds itself from (web/pagecopy) and the inline scripts
// its Content-Security-Policy lists (web/policy).
//
// It follows the HTML tokenizer only as far as those callers need: tag names are ASCII
// letters then digits, attributes are name, optional '=' and a quoted or bare value, and
// names compare ASCII case-insensitively (strings.EqualFold would bring Unicode case tables
// into the browser build). It never panics on any input; a tag that never ends is reported
// with the index -1.
package htmlscan

import "strings"

// TagName reads a tag's name at p (just after '<' or "</"), lower-cased, and returns it with
// the index after it; "" if p does not start a name.
func TagName(page string, p int) (string, int) {
	start := p
	for p < len(page) && (isLetter(page[p]) || (p > start && page[p] >= '0' && page[p] <= '9')) {
		p++
	}
	if p == start {
		return "", p
	}
	return strings.ToLower(page[start:p]), p
}

// Attr reads the attributes of a start tag from p up to and including the '>' that ends
// it, and returns the value of the attribute called name (the first one, as in HTML; "" if
// absent) and the index after the '>'; -1 if the tag never ends.
func Attr(page string, p int, name string) (value string, end int) {
	value, _, end = Lookup(page, p, name)
	return value, end
}

// Lookup is Attr that also reports whether the tag has the attribute at all (an empty
// attribute and a missing one both have the value "").
func Lookup(page string, p int, name string) (value string, found bool, end int) {
	seen := false
	for p < len(page) {
		c := page[p]
		switch {
		case c == '>':
			return value, seen, p + 1
		case IsSpace(c) || c == '/':
			p++
			continue
		}
		start := p
		p++ // the first character belongs to the name, even an '='
		for p < len(page) && !IsSpace(page[p]) && page[p] != '>' && page[p] != '/' && page[p] != '=' {
			p++
		}
		attr := page[start:p]
		for p < len(page) && IsSpace(page[p]) {
			p++
		}
		val := ""
		if p < len(page) && page[p] == '=' {
			p++
			for p < len(page) && IsSpace(page[p]) {
				p++
			}
			if p < len(page) && (page[p] == '"' || page[p] == '\'') {
				q := page[p]
				end := strings.IndexByte(page[p+1:], q)
				if end < 0 {
					return "", false, -1
				}
				val = page[p+1 : p+1+end]
				p += end + 2
			} else {
				vs := p
				for p < len(page) && !IsSpace(page[p]) && page[p] != '>' {
					p++
				}
				val = page[vs:p]
			}
		}
		if !seen && EqualFold(attr, name) {
			value, seen = val, true
		}
	}
	return "", false, -1
}

// IndexFold finds sub (ASCII, e.g. "</script") in page from p on, ignoring ASCII case;
// -1 if absent.
func IndexFold(page string, p int, sub string) int {
	if sub == "" || p < 0 {
		return -1
	}
	for i := p; i+len(sub) <= len(page); i++ {
		j := strings.IndexByte(page[i:len(page)-len(sub)+1], sub[0])
		if j < 0 {
			return -1
		}
		i += j
		if EqualFold(page[i:i+len(sub)], sub) {
			return i
		}
	}
	return -1
}

// EqualFold reports whether a and b are equal ignoring ASCII case.
func EqualFold(a, b string) bool {
	if len(a) != len(b) {
		return false
	}
	for i := 0; i < len(a); i++ {
		x, y := a[i], b[i]
		if 'A' <= x && x <= 'Z' {
			x += 'a' - 'A'
		}
		if 'A' <= y && y <= 'Z' {
			y += 'a' - 'A'
		}
		if x != y {
			return false
		}
	}
	return true
}

// IsSpace reports whether c is HTML white space (tab, LF, FF, CR, space).
func IsSpace(c byte) bool { return c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' }

func isLetter(c byte) bool { return c|0x20 >= 'a' && c|0x20 <= 'z' }
