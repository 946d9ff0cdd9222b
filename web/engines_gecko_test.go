//go:build gecko

package web_test

import "saltcast/web/enginetest"

func init() {
	engines = append(engines, engine{name: "gecko", start: enginetest.StartGecko, scriptsOffByPolicy: true})
}
