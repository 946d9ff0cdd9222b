//go:build !(js && wasm)

package main

import (
	"net/http"
	"os"
)

func main() {
	addr := os.Getenv("SALTCAST_ADDR")
	if addr == "" {
		addr = "127.0.0.1:8788"
	}
	page, err := os.ReadFile("dist/saltcast.html")
	if err != nil {
		println("worker: no dist/saltcast.html (run make build); / serves a placeholder")
	}
	h := NewHandler(Options{Page: page, AllowOrigin: os.Getenv("SALTCAST_ALLOW_ORIGIN")})
	println("worker: serving http://" + addr)
	if err := http.ListenAndServe(addr, h); err != nil {
		println("worker:", err.Error())
		os.Exit(1)
	}
}
