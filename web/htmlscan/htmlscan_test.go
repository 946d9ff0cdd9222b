package htmlscan

import "testing"

func TestAttr(t *testing.T) {
	for _, c := range []struct {
		page, name string
		p          int
		want       string
		wantEnd    int
	}{
		{`<script type="application/x-saltcast-recipes" id=x>`, "type", 7, "application/x-saltcast-recipes", 51},
		{`<script TYPE='a' type="b">`, "type", 7, "a", 26}, // the first one counts, as in HTML
		{`<style id=main>`, "id", 6, "main", 15},
		{`<style id = "sp ace" >`, "id", 6, "sp ace", 22},
		{`<p hidden>`, "id", 2, "", 10},
		{`<p =x>`, "=x", 2, "", 6}, // an '=' may start a name
		{`<p id="never`, "id", 2, "", -1},
		{`<p id=x`, "id", 2, "", -1},
	} {
		got, end := Attr(c.page, c.p, c.name)
		if got != c.want || end != c.wantEnd {
			t.Errorf("Attr(%q, %d, %q) = %q, %d; want %q, %d", c.page, c.p, c.name, got, end, c.want, c.wantEnd)
		}
	}
}

func TestTagNameAndIndexFold(t *testing.T) {
	if n, p := TagName("<SCRIPT type=x>", 1); n != "script" || p != 7 {
		t.Errorf("TagName = %q, %d", n, p)
	}
	if n, p := TagName("<h1>", 1); n != "h1" || p != 3 {
		t.Errorf("TagName(h1) = %q, %d", n, p)
	}
	if n, _ := TagName("< p>", 1); n != "" {
		t.Errorf("TagName of a space = %q, want none", n)
	}
	page := "<script>a</b></SCRIPT >"
	if i := IndexFold(page, 8, "</script"); i != 13 {
		t.Errorf("IndexFold = %d, want 13", i)
	}
	if i := IndexFold(page, 14, "</script"); i != -1 {
		t.Errorf("IndexFold past it = %d, want -1", i)
	}
}

func FuzzAttr(f *testing.F) {
	f.Add(`<script type="x" id='y'>`, "id")
	f.Add(`<a b=c d="e`, "b")
	f.Fuzz(func(t *testing.T, page, name string) {
		for p := 0; p <= len(page); p++ {
			if _, end := Attr(page, p, name); end > len(page) || end < -1 {
				t.Fatalf("Attr end %d outside page of %d", end, len(page))
			}
			if _, q := TagName(page, p); q < p || q > len(page) {
				t.Fatalf("TagName end %d", q)
			}
		}
	})
}
