package main

import "saltcast/web/policy"

// pageCSP returns the Content-Security-Policy header of the page the worker serves: the
// served page's policy (web/policy, the builder of the file's policy too) over the page's
// own inline scripts, plus what only a header can say (frame-ancestors).
func pageCSP(page []byte) string {
	return policy.Served(policy.InlineScripts(string(page))...) + policy.HeaderOnly
}
