# Saltcast build. `make` builds the single-file app and shows the demo; `make test` runs every
# test (it installs what the browser and worker tests need first); `make bench` prints the
# performance figures recorded in the README.
GO      ?= go
export PATH := $(shell $(GO) env GOROOT)/lib/wasm:$(PATH)

.PHONY: all build demo test test-core test-deps bench worker worker-run cli clean

all: build demo

## cli: the command-line tool in bin/saltcast
cli:
	$(GO) build -o bin/saltcast ./web/cmd/saltcast

## demo: plan the invented demo recipes (core/recipe/demo) and print them readably
demo: cli
	@./bin/saltcast demo

## build: dist/saltcast.html, the single offline file (installs zopfli first when root)
build:
	@bash web/scripts/deps-build.sh
	$(GO) run ./web/bundle -out dist/saltcast.html
	@echo "built $(CURDIR)/dist/saltcast.html"

## test-deps: what the browser and worker tests need (chromium via apt-get, workerd via npm ci)
test-deps:
	bash web/scripts/test-deps.sh

## test-core: host tests only (no browser, no worker)
test-core:
	$(GO) vet ./...
	$(GO) test ./...

## test: everything, including the browser and worker tests, which fail if their tools are missing
test: test-deps build worker
	$(GO) vet ./...
	SALTCAST_REQUIRE_BROWSER=1 SALTCAST_REQUIRE_WORKERD=1 $(GO) test ./...
	bash web/scripts/fuzz-short.sh

## bench: performance figures (core benchmarks, bundle size, load times, worker latency)
bench: build worker
	$(GO) test -run '^$$' -bench . -benchmem ./core/...
	SALTCAST_BENCH=1 $(GO) test -run 'TestFigures' -v ./web/... ./wasm/...

## worker: the Cloudflare Workers build in build/worker (wasm/worker/build.sh; sizes printed)
worker:
	bash wasm/worker/build.sh

## worker-run: serve the worker locally on http://127.0.0.1:8787 with workerd (Ctrl-C stops it)
worker-run: worker
	bash wasm/worker/deps-workerd.sh
	./wasm/worker/node_modules/.bin/workerd serve wasm/worker/workerd.capnp --verbose

clean:
	rm -rf bin dist build
