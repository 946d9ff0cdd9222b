# Saltcast build. `make` builds the single-file app and shows the demo; `make test` runs every
# test (it installs what the browser and worker tests need first); `make bench` prints the
# performance figures recorded in web/PERFORMANCE.md.
GO      ?= go
export PATH := $(shell $(GO) env GOROOT)/lib/wasm:$(PATH)

.PHONY: all build demo unpacker test test-core test-deps bench worker worker-run cli clean

all: build demo

# VERSION names this build in the page, on its batch sheet and in `saltcast --version`: the
# same `git describe` web.Version uses, else the first line of a VERSION file, else "dev".
VERSION ?= $(shell git describe --tags --always --dirty 2>/dev/null || head -n 1 VERSION 2>/dev/null || echo dev)

## cli: the command-line tool in bin/saltcast
cli:
	$(GO) build -ldflags "-X main.version=$(VERSION)" -o bin/saltcast ./web/cmd/saltcast

## demo: plan the invented demo recipes (core/recipe/demo) and print them readably
demo: cli
	@./bin/saltcast demo

## build: dist/saltcast.html, the single offline file (installs zopfli first when root)
build:
	@bash web/scripts/deps-build.sh
	$(GO) run ./web/bundle -version "$(VERSION)" -out dist/saltcast.html
	@echo "built $(CURDIR)/dist/saltcast.html"

## unpacker: after changing web/unlzma.wat, assemble it into web/loader.js (needs binaryen's
## wasm-as; the build itself does not: the bytes are committed)
unpacker:
	cd web && $(GO) generate -run gen_unpacker .

## test-deps: what the browser and worker tests need (chromium, firefox-esr, webkit2gtk-driver
## and xvfb via apt-get, workerd via npm ci)
test-deps:
	bash web/scripts/test-deps.sh

# The browser (chromedp), cross-engine (Gecko: firefox-esr; WebKit: WebKitWebDriver under Xvfb)
# and worker (workerd) tests are built only with these tags, so a plain `go test ./...` runs the
# host tests alone; with the tags a missing chromium, firefox-esr, WebKit driver, workerd or
# build is a failure, never a skip.
E2E_TAGS = browser,gecko,webkit,workerd

## test-core: host tests only (no browser, no worker), and vet of the js/wasm programs
test-core:
	$(GO) vet ./...
	GOOS=js GOARCH=wasm $(GO) vet ./wasm/... ./web/floor
	$(GO) test ./...

## test: everything, including the browser and worker tests, which fail if their tools are missing
test: test-deps build worker
	$(GO) vet -tags $(E2E_TAGS) ./...
	GOOS=js GOARCH=wasm $(GO) vet ./wasm/... ./web/floor
	$(GO) test -tags $(E2E_TAGS) ./...
	bash web/scripts/fuzz-short.sh

## bench: performance figures (core benchmarks, bundle size, load times, worker latency)
bench: build worker
	$(GO) test -run '^$$' -bench . -benchmem ./core/...
	$(GO) test -tags $(E2E_TAGS),bench -run 'TestFigures' -v ./web/... ./wasm/...

## worker: the Cloudflare Workers build in build/worker (wasm/worker/build.sh; sizes printed)
worker:
	bash wasm/worker/build.sh

## worker-run: serve the worker locally on http://127.0.0.1:8787 with workerd (Ctrl-C stops it)
worker-run: worker
	bash wasm/worker/deps-workerd.sh
	./wasm/worker/node_modules/.bin/workerd serve wasm/worker/workerd.capnp --verbose

clean:
	rm -rf bin dist build
