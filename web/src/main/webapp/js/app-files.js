/*
 * Spanwright page: where scenarios come from and go to. Opening files, the gallery and share links
 * (bad input never replaces the work), saving and exports, the autosave in localStorage, and the
 * scenario the page starts with. The parts are shared through self.SwPage (see app-state.js).
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const P = self.SwPage;
  const state = P.state;
  const $ = function (id) { return document.getElementById(id); };

  const AUTOSAVE_KEY = "spanwright.autosave.v1";
  const PREVIOUS_KEY = "spanwright.previous.v1";

  /* A small scenario of our own, used only when the gallery is empty. */
  const FALLBACK = {
    format: "spanwright-scenario", version: 1,
    title: "Two roads, one toll", notes: "Either road a or road b reaches the far bank; the toll bridge is always open.",
    variables: ["a", "b"], function: "a | b", promise: null,
    graph: { s: "s", t: "t",
      vertices: [{ id: "s", x: 0, y: 100 }, { id: "m", x: 150, y: 0 }, { id: "t", x: 300, y: 100 }],
      edges: [{ id: "e1", u: "s", v: "m", when: "a", weight: 1 }, { id: "e2", u: "s", v: "m", when: "b", weight: 1 },
        { id: "e3", u: "m", v: "t", when: "1", weight: 1 }] }
  };

  function autosave() {
    try { localStorage.setItem(AUTOSAVE_KEY, JSON.stringify({ savedAt: Date.now(), scenario: P.text() })); } catch (e) { /* storage full or blocked */ }
  }

  // ------------------------------------------------------------------ files, gallery, links

  /** Loads scenario text from somewhere (file, gallery, link). Bad input never replaces the work. */
  function loadText(sourceName, scenarioText, opts) {
    opts = opts || {};
    let obj;
    try { obj = JSON.parse(scenarioText); } catch (e) {
      // The engine's reader names line and column; the browser's message may not.
      return state.bridge.call("validate", scenarioText).then(function (v) {
        const why = !v.ok && v.error && v.error.message ? v.error.message : F.jsonProblem(scenarioText, e);
        P.notify("Could not open " + sourceName + ": " + why + ". Your current work is unchanged.", "error");
        return false;
      });
    }
    if (!obj || typeof obj !== "object" || Array.isArray(obj)) {
      P.notify("Could not open " + sourceName + ": it is not a scenario object. Your current work is unchanged.", "error");
      return Promise.resolve(false);
    }
    return state.bridge.call("validate", scenarioText).then(function (v) {
      if (!v.ok && !(v.error && v.error.code === "not-ready")) {
        const err = v.error || {};
        P.notify("Could not open " + sourceName + ": " + (err.message || "it is not a valid scenario") + (err.path ? " (at " + err.path + ")" : "") + ". Your current work is unchanged.", "error");
        return false;
      }
      P.openScenario(obj, opts.initial);
      P.clearFocus();
      if (v.warnings && v.warnings.length) P.notify("Opened " + sourceName + " with warnings: " + v.warnings.map(function (w) { return w.message || String(w); }).join("; "), "info");
      return true;
    });
  }

  $("open-file").addEventListener("change", function () {
    const file = this.files && this.files[0];
    if (!file) return;
    const reader = new FileReader();
    const input = this;
    reader.onload = function () { loadText("file '" + file.name + "'", String(reader.result)).then(function (ok) { if (ok) P.notify("Opened '" + file.name + "'. Undo brings back what you had.", "info"); }); input.value = ""; };
    reader.onerror = function () { P.notify("Could not read file '" + file.name + "'. Your current work is unchanged.", "error"); input.value = ""; };
    reader.readAsText(file);
  });

  $("save").addEventListener("click", function () {
    F.download(F.fileName(state.scenario.title, ".json"), new Blob([JSON.stringify(state.scenario, null, 2) + "\n"], { type: "application/json" }));
  });

  $("export-csv").addEventListener("click", function () {
    const a = state.analysis;
    if (!a) { P.notify("Nothing to export yet: the analysis has not finished.", "info"); return; }
    const lines = ["x,f,connected,kind,value,counterexample"];
    for (let i = 0; i < a.n; i++) {
      const fl = a.flags[i];
      lines.push(P.xOf(a.codes[i]) + "," + ((fl & 2) ? ((fl & 4) ? "1" : "0") : "") + "," + ((fl & 1) ? "true" : "false") + "," +
        ((fl & 1) ? "R" : "C") + "," + String(a.values[i]) + "," + (P.isBad(fl) ? "true" : "false"));
    }
    F.download(F.fileName(state.scenario.title, "-inputs.csv"), new Blob([lines.join("\n") + "\n"], { type: "text/csv" }));
  });

  $("export-png").addEventListener("click", function () {
    F.download(F.fileName(state.scenario.title, ".png"), P.drawing.png());
  });
  $("export-svg").addEventListener("click", function () {
    const text = P.drawing.svg(state.scenario.title);
    $("export-svg").dataset.chars = String(text.length);
    F.download(F.fileName(state.scenario.title, ".svg"), new Blob([text], { type: "image/svg+xml" }));
  });

  const gallery = (self.SpanwrightGallery || []).map(function (g) {
    let title = g.file;
    try { const o = JSON.parse(g.text); if (o && o.title) title = String(o.title); } catch (e) { /* shown by file name */ }
    return { file: g.file, text: g.text, title: title };
  });
  gallery.forEach(function (g, i) {
    const op = document.createElement("option");
    op.value = String(i);
    op.textContent = g.title + " (" + g.file + ")";
    $("gallery").appendChild(op);
  });
  $("gallery").addEventListener("change", function () {
    const i = $("gallery").value;
    $("gallery").value = "";
    if (i === "") return;
    const g = gallery[Number(i)];
    loadText("gallery scenario '" + g.file + "'", g.text).then(function (ok) { if (ok) P.notify("Opened '" + g.title + "' from the gallery. Undo brings back what you had.", "info"); });
  });

  function baseUrl() { return location.href.split("#")[0]; }

  $("copy-link").addEventListener("click", function () {
    state.bridge.call("encodeShare", P.text()).then(function (r) {
      if (!r.ok) { P.notify("Could not make a link: " + ((r.error && r.error.message) || "unknown problem"), "error"); return; }
      const link = baseUrl() + "#" + r.fragment;
      $("share-link").value = link;
      $("share-box").hidden = false;
      $("share-link").select();
      try { if (navigator.clipboard) navigator.clipboard.writeText(link).catch(function () { /* the field shows it */ }); } catch (e) { /* the field shows it */ }
    });
  });
  $("share-close").addEventListener("click", function () { $("share-box").hidden = true; });

  function clearHash() {
    try { history.replaceState(null, "", baseUrl()); } catch (e) { /* some file:// setups refuse; harmless */ }
  }

  /** Opens the scenario in the URL fragment, if any. A broken one leaves the current work alone. */
  function openFragment(initial) {
    const frag = location.hash.replace(/^#/, "");
    if (!frag) return Promise.resolve(false);
    return state.bridge.call("decodeShare", frag).then(function (r) {
      clearHash();
      if (!r.ok) {
        P.notify("This link does not hold a scenario Spanwright can open: " + ((r.error && r.error.message) || "it is damaged") +
          " Your current work is unchanged.", "error");
        document.body.dataset.linkStatus = "broken";
        return false;
      }
      const before = state.scenario ? P.text() : null;
      return loadText("the link", r.scenario, { initial: initial }).then(function (ok) {
        document.body.dataset.linkStatus = ok ? "opened" : "broken";
        if (ok && before && before !== P.text()) {
          try { localStorage.setItem(PREVIOUS_KEY, before); } catch (e) { /* ignore */ }
          P.notify("Opened the scenario from the link.", "info", { label: "Bring back my previous work", id: "restore-previous", action: function () {
            loadText("your previous work", before);
          } });
        }
        return ok;
      });
    });
  }
  window.addEventListener("hashchange", function () { if (state.bridge && state.bridge.ready) openFragment(false); });

  // ------------------------------------------------------------------ the scenario the page starts with

  /** The autosaved work if there is any, else the gallery's default scenario, else FALLBACK; as
   *  the parsed scenario (FALLBACK if the text does not parse) and where it came from. */
  function initialScenario() {
    let init = null;
    try {
      const saved = JSON.parse(localStorage.getItem(AUTOSAVE_KEY) || "null");
      if (saved && saved.scenario) init = { text: saved.scenario, from: "autosave" };
    } catch (e) { /* a damaged autosave is ignored, the default opens */ }
    if (!init) {
      const def = gallery.find(function (g) { return g.file === "default.json"; }) || gallery[0];
      init = def ? { text: def.text, from: "gallery" } : { text: JSON.stringify(FALLBACK), from: "built-in" };
    }
    let obj;
    try { obj = JSON.parse(init.text); } catch (e) { obj = FALLBACK; }
    return { scenario: obj, from: init.from };
  }

  Object.assign(P, {
    autosave: autosave, loadText: loadText, gallery: gallery, openFragment: openFragment, initialScenario: initialScenario
  });
})();
