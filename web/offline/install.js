// Keeps the served app on this device (see sw.js) and asks before a new version replaces it.
// Opened from disk (file:) it does nothing at all: no service worker, no request.
(function () {
  "use strict";
  var root = document.documentElement;
  if ((location.protocol !== "https:" && location.protocol !== "http:") || !("serviceWorker" in navigator)) {
    root.setAttribute("data-offline", "off");
    return;
  }
  var sw = navigator.serviceWorker;
  var bar = null;

  // The question, shown once a new version is installed and waiting.
  function ask(reg) {
    if (bar || !reg.waiting) {
      return;
    }
    bar = document.createElement("div");
    bar.className = "update-bar no-print";
    bar.id = "update-bar";
    bar.setAttribute("role", "alertdialog");
    bar.setAttribute("aria-labelledby", "update-text");
    var text = document.createElement("p");
    text.id = "update-text";
    text.textContent = "A new version of Saltcast is ready. Update now? Your recipes stay on this device.";
    var yes = document.createElement("button");
    yes.type = "button";
    yes.className = "act primary";
    yes.id = "update-now";
    yes.textContent = "Update now";
    var later = document.createElement("button");
    later.type = "button";
    later.className = "act";
    later.id = "update-later";
    later.textContent = "Later";
    yes.addEventListener("click", function () {
      yes.disabled = true;
      text.textContent = "Updating…";
      if (reg.waiting) {
        reg.waiting.postMessage({ saltcast: "activate-update" });
      }
    });
    later.addEventListener("click", function () {
      bar.hidden = true;
    });
    bar.append(text, yes, later);
    document.body.prepend(bar);
    root.setAttribute("data-offline", "update-ready");
  }

  // The page reloads once the agreed update has taken over; the first install, which
  // takes an uncontrolled page, does not reload it.
  var hadController = !!sw.controller;
  sw.addEventListener("controllerchange", function () {
    if (hadController) {
      location.reload();
      return;
    }
    hadController = true;
  });

  // A new worker that finishes installing while an older one runs this page is an update
  // waiting for the user's yes.
  function watch(reg, next) {
    if (!next) {
      return;
    }
    next.addEventListener("statechange", function () {
      if (next.state === "installed") {
        if (sw.controller) {
          ask(reg);
        } else {
          root.setAttribute("data-offline", "installing");
        }
      }
    });
  }

  sw.register("/sw.js", { scope: "/" }).then(function (reg) {
    ask(reg);
    watch(reg, reg.installing);
    reg.addEventListener("updatefound", function () {
      watch(reg, reg.installing);
    });
    // Look for a new version now (the browser also does on its own); offline this fails
    // quietly and the kept version runs.
    if (sw.controller) {
      reg.update().catch(function () {});
    }
    return sw.ready;
  }).then(function () {
    if (root.getAttribute("data-offline") !== "update-ready") {
      root.setAttribute("data-offline", "ready");
    }
    var foot = document.querySelector(".foot");
    if (foot && !document.getElementById("offline-note")) {
      var note = document.createElement("span");
      note.id = "offline-note";
      note.textContent = " Kept on this device: Saltcast opens here without a network.";
      foot.append(note);
    }
  }).catch(function (err) {
    // Offline use is a convenience: the app itself runs either way.
    root.setAttribute("data-offline", "error");
    root.setAttribute("data-offline-error", String(err));
  });
})();
