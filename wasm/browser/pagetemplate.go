package main

// pageTemplate is this page's saltcast/web/pagecopy.Template, from which the running page
// writes an exact copy of itself. web/bundle compiles the real one in place of this file
// (go build -overlay, see web.TemplateFile); a program built any other way has none and
// says so when asked for a copy.
const pageTemplate = ""
