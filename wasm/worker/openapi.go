package main

import _ "embed"

// openAPI is the hand-written OpenAPI 3.1 description of the routes, served as it is.
//
//go:embed openapi.json
var openAPI []byte
