# workerd configuration for running the Saltcast worker locally: `make worker-run` serves it on
# http://127.0.0.1:8787 (built first by `make worker` into build/worker/). The worker tests read
# this file and change only the address and the SALTCAST_ALLOW_ORIGIN text, so keep those two on
# lines of their own. Paths are relative to this file.
using Workerd = import "/workerd/workerd.capnp";

const config :Workerd.Config = (
  services = [(name = "saltcast", worker = .saltcast)],
  sockets = [(name = "http", address = "127.0.0.1:8787", http = (), service = "saltcast")],
);

const saltcast :Workerd.Worker = (
  modules = [
    (name = "worker.mjs", esModule = embed "../../build/worker/worker.mjs"),
    (name = "wasm_exec.js", esModule = embed "../../build/worker/wasm_exec.js"),
    (name = "app.wasm", wasm = embed "../../build/worker/app.wasm"),
    (name = "saltcast.html", text = embed "../../build/worker/saltcast.html"),
    (name = "sw.txt", text = embed "../../build/worker/sw.txt"),
    (name = "manifest.webmanifest", text = embed "../../build/worker/manifest.webmanifest"),
    (name = "icons/icon-192.png", data = embed "../../build/worker/icons/icon-192.png"),
    (name = "icons/icon-512.png", data = embed "../../build/worker/icons/icon-512.png"),
    (name = "icons/icon-maskable-512.png", data = embed "../../build/worker/icons/icon-maskable-512.png"),
    (name = "icons/apple-touch-icon.png", data = embed "../../build/worker/icons/apple-touch-icon.png"),
  ],
  compatibilityDate = "2026-11-01",
  bindings = [
    # One origin whose web pages may call the API from a browser (CORS), "*" for any; empty: none.
    (name = "SALTCAST_ALLOW_ORIGIN", text = ""),
  ],
);
