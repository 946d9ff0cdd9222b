//go:build webkit

package web_test

import "saltcast/web/enginetest"

func init() { engines = append(engines, engine{name: "webkit", start: enginetest.StartWebKit}) }
