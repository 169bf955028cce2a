/*
 * Spanwright page: where scenarios come from and go to. Opening files (scenario JSON, or a graph as
 * GraphML or DOT through the engine's importGraph), the gallery and share links
 * (bad input never replaces the work), saving and exports, the autosave in localStorage with its
 * guard against a second tab, the kept earlier work, the Open link box, and the scenario the page
 * starts with. The parts are shared through self.SwPage (see app-state.js).
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const P = self.SwPage;
  const state = P.state;
  const $ = function (id) { return document.getElementById(id); };

  const AUTOSAVE_KEY = "spanwright.autosave.v1";
  const KEPT_KEY = "spanwright.kept.v1";
  const OLD_PREVIOUS_KEY = "spanwright.previous.v1";   // the one slot of earlier versions, folded into KEPT_KEY
  const KEPT_LIMIT = 20;

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

  // ------------------------------------------------------------------ autosave and kept work

  /* Each tab names itself; the autosave record says which tab wrote it and when. The last tab to
   * write owns the autosave: a tab that sees another tab write it (the storage event) stops
   * writing it, says so, and keeps its own work in a kept slot of its own instead, until the user
   * makes it the autosaving tab again. */
  const tabId = Date.now().toString(36) + "-" + Math.random().toString(36).slice(2, 8);
  let autosaving = true;
  document.body.dataset.autosave = "on";

  function readJson(key, fallback) {
    try { const v = JSON.parse(localStorage.getItem(key) || "null"); return v === null ? fallback : v; } catch (e) { return fallback; }
  }

  function autosave() {
    const t = P.text();
    if (!autosaving) { keep(t, "this tab, while another tab autosaved", tabId); return; }
    try {
      localStorage.setItem(AUTOSAVE_KEY, JSON.stringify({ savedAt: Date.now(), tab: tabId, pristine: t === state.pristine, scenario: t }));
    } catch (e) { /* storage full or blocked */ }
  }

  /** The kept list, newest first: [{at, title, text, why, tab?}]. */
  function keptList() {
    const list = readJson(KEPT_KEY, []);
    return Array.isArray(list) ? list.filter(function (k) { return k && typeof k.text === "string"; }) : [];
  }

  /** Keeps one scenario text in the kept list (newest first, at most KEPT_LIMIT, each text once;
   *  a tab's own slot is replaced in place). Returns whether it is kept. */
  function keep(text, why, tab) {
    let list = keptList().filter(function (k) { return k.text !== text && !(tab && k.tab === tab); });
    let title = "";
    try { title = String(JSON.parse(text).title || ""); } catch (e) { /* kept untitled */ }
    const entry = { at: Date.now(), title: title, text: text, why: why };
    if (tab) entry.tab = tab;
    list.unshift(entry);
    list = list.slice(0, KEPT_LIMIT);
    try { localStorage.setItem(KEPT_KEY, JSON.stringify(list)); } catch (e) { return false; }
    renderKept();
    return true;
  }

  /** Called by openScenario with the text of the scenario it replaces (not a bundled one as it came). */
  function keepReplaced(text, why) { return keep(text, why || "replaced", null); }

  (function foldOldSlot() {
    const old = localStorage.getItem(OLD_PREVIOUS_KEY);
    if (old) { keep(old, "kept by an earlier version", null); localStorage.removeItem(OLD_PREVIOUS_KEY); }
  })();

  function stamp(ms) {
    const d = new Date(ms);
    const two = function (n) { return (n < 10 ? "0" : "") + n; };
    return d.getFullYear() + "-" + two(d.getMonth() + 1) + "-" + two(d.getDate()) + " " + two(d.getHours()) + ":" + two(d.getMinutes());
  }

  function renderKept() {
    const sel = $("kept");
    if (!sel) return;
    const list = keptList();
    sel.textContent = "";
    const head = document.createElement("option");
    head.value = "";
    head.textContent = list.length ? "Earlier work (" + list.length + ")…" : "No earlier work kept";
    sel.appendChild(head);
    list.forEach(function (k, i) {
      const op = document.createElement("option");
      op.value = String(i);
      op.textContent = (k.title || "Untitled scenario") + " — " + stamp(k.at) + " (" + k.why + ")";
      sel.appendChild(op);
    });
    sel.disabled = !list.length;
    $("kept-open").disabled = !list.length;
  }

  function openKept() {
    const i = $("kept").value;
    if (i === "") { P.notify("Choose a scenario from the Earlier work list first.", "info"); return; }
    const k = keptList()[Number(i)];
    if (!k) return;
    loadText("earlier work '" + (k.title || "Untitled scenario") + "'", k.text, { why: "replaced by earlier work" }).then(function (ok) {
      if (ok) P.notify("Brought back '" + (k.title || "Untitled scenario") + "' (" + stamp(k.at) + "). Undo brings back what you had.", "info");
    });
  }

  function setAutosaving(on) {
    autosaving = on;
    document.body.dataset.autosave = on ? "on" : "paused";
    $("autosave-state").hidden = on;
    if (on) autosave(); else keep(P.text(), "this tab, while another tab autosaved", tabId);
  }

  window.addEventListener("storage", function (ev) {
    if (ev.key === KEPT_KEY) { renderKept(); return; }
    if (ev.key !== AUTOSAVE_KEY || !ev.newValue) return;
    let rec = null;
    try { rec = JSON.parse(ev.newValue); } catch (e) { /* not ours to read */ }
    if (!rec || rec.tab === tabId) return;
    const wasOn = autosaving;
    setAutosaving(false);
    if (wasOn) {
      P.notify("Spanwright is open in another tab of this browser, and that tab now autosaves its work. So that neither tab overwrites the other, this tab no longer autosaves; " +
        "its work is kept under Earlier work (Open link box).", "error", { label: "Autosave this tab instead", id: "autosave-here", action: function () { setAutosaving(true); } });
    }
  });

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
      const kept = P.openScenario(obj, { why: opts.why || "replaced by " + sourceName, pristine: !!opts.pristine });
      P.clearFocus();
      document.body.dataset.keptReplaced = kept ? "yes" : "no";
      if (v.warnings && v.warnings.length) P.notify("Opened " + sourceName + " with warnings: " + v.warnings.map(function (w) { return w.message || String(w); }).join("; "), "info");
      return true;
    });
  }

  // ------------------------------------------------------------------ graph files (GraphML, DOT)

  /* A graph file becomes a scenario in the engine (JsonFacade.importGraph: the page's own GraphML
   * and DOT readers, then the host-graph builder the command line uses). The dialog asks for s and
   * t (the file's role marks, else its first and last vertex), where each edge's condition comes
   * from and which attribute holds the weights; the scenario then opens like a file, as a new undo
   * step. A file the engine cannot read is reported with its line and column, and the work stays. */
  const GRAPH_ENDINGS = [".graphml", ".xml", ".dot", ".gv"];
  const NEW_VARIABLE = "\u0000one-per-edge", NO_WEIGHT = "\u0000none";
  const imp = { name: "", text: "", info: null };

  function isGraphFile(name, text) {
    const lower = String(name).toLowerCase();
    if (GRAPH_ENDINGS.some(function (e) { return lower.endsWith(e); })) return true;
    if (lower.endsWith(".json")) return false;
    return !/^\s*[{\[]/.test(text);   // not JSON-looking: let the engine tell the format from the text
  }

  function fillSelect(sel, options, chosen) {
    sel.textContent = "";
    options.forEach(function (o) {
      const op = document.createElement("option");
      op.value = o.value;
      op.textContent = o.label;
      sel.appendChild(op);
    });
    sel.value = chosen;
  }

  function importError(r) {
    const e = (r && r.error) || {};
    const where = e.path && e.path !== "$" && e.path !== "$.text" ? " (at " + e.path + ")" : "";
    return (e.message || "the engine could not read it") + where;
  }

  function openGraphFile(name, text) {
    return state.bridge.call("importGraph", text, JSON.stringify({ fileName: name, build: false })).then(function (r) {
      if (!r.ok) {
        document.body.dataset.importStatus = "refused";
        P.notify("Could not open file '" + name + "': " + importError(r) + ". Your current work is unchanged.", "error");
        return false;
      }
      imp.name = name; imp.text = text; imp.info = r;
      const vertices = r.vertices.map(function (v) { return { value: v, label: v }; });
      const mark = function (end) { return r.marked[end] === r[end] ? " (marked " + end + " in the file)" : ""; };
      fillSelect($("import-s"), vertices, r.s);
      fillSelect($("import-t"), vertices, r.t);
      const attrs = r.edgeAttributes || [];
      const every = function (n) { return attrs.some(function (a) { return a.name === n && a.edges === r.edges; }); };
      fillSelect($("import-literal"), [{ value: NEW_VARIABLE, label: "a new variable per edge" }].concat(attrs.map(function (a) {
        return { value: a.name, label: "the attribute '" + a.name + "' (" + a.edges + " of " + r.edges + " edges)" };
      })), every("literal") ? "literal" : NEW_VARIABLE);
      const hasWeight = attrs.some(function (a) { return a.name === "weight"; });
      fillSelect($("import-weight"), [{ value: NO_WEIGHT, label: "none: every weight 1" }].concat(attrs.map(function (a) {
        return { value: a.name, label: "the attribute '" + a.name + "'" };
      })), hasWeight ? "weight" : NO_WEIGHT);
      $("import-about").textContent = "'" + name + "': " + r.formatTitle + ", " + r.vertices.length + " vertices, " + r.edges + " edges." +
        (mark("s") || mark("t") ? " s and t as the file marks them." : " s and t: the first and the last vertex, unless you choose others.");
      $("import-error").hidden = true;
      $("import-state").textContent = "";
      $("import-open").disabled = false;
      document.body.dataset.importStatus = "asking";
      const dlg = $("import-dialog");
      if (!dlg.open) dlg.showModal();
      $("import-s").focus();
      return true;
    });
  }

  function importChosen() {
    const opts = { fileName: imp.name, s: $("import-s").value, t: $("import-t").value };
    if ($("import-literal").value !== NEW_VARIABLE) opts.literalKey = $("import-literal").value;
    opts.weightKey = $("import-weight").value === NO_WEIGHT ? "" : $("import-weight").value;
    $("import-open").disabled = true;
    $("import-state").textContent = "Building…";
    const name = imp.name;
    state.bridge.call("importGraph", imp.text, JSON.stringify(opts)).then(function (r) {
      $("import-open").disabled = false;
      $("import-state").textContent = "";
      if (!r.ok) {
        $("import-error").textContent = "Cannot open it so: " + importError(r) + ".";
        $("import-error").hidden = false;
        document.body.dataset.importStatus = "error";
        return;
      }
      imp.text = "";   // consumed: closing the dialog now is no cancellation
      $("import-dialog").close();
      loadText("graph file '" + name + "'", JSON.stringify(r.scenario), { why: "replaced by graph file '" + name + "'" }).then(function (ok) {
        document.body.dataset.importStatus = ok ? "opened" : "refused";
        if (ok) P.notify("Opened '" + name + "' as st-connectivity from " + r.s + " to " + r.t + " (" + r.stats.variables + " variables). Undo brings back what you had.", "info");
      });
    });
  }
  $("import-open").addEventListener("click", importChosen);
  $("import-cancel").addEventListener("click", function () { $("import-dialog").close(); });
  $("import-dialog").addEventListener("close", function () {
    if (imp.text) { document.body.dataset.importStatus = "cancelled"; imp.text = ""; }
  });

  $("open-file").addEventListener("change", function () {
    const file = this.files && this.files[0];
    if (!file) return;
    const reader = new FileReader();
    const input = this;
    reader.onload = function () {
      const text = String(reader.result);
      input.value = "";
      if (isGraphFile(file.name, text)) { openGraphFile(file.name, text); return; }
      loadText("file '" + file.name + "'", text).then(function (ok) { if (ok) P.notify("Opened '" + file.name + "'. Undo brings back what you had.", "info"); });
    };
    reader.onerror = function () { P.notify("Could not read file '" + file.name + "'. Your current work is unchanged.", "error"); input.value = ""; };
    reader.readAsText(file);
  });

  $("save").addEventListener("click", function () {
    F.download(F.fileName(state.scenario.title, ".json"), new Blob([JSON.stringify(state.scenario, null, 2) + "\n"], { type: "application/json" }));
  });

  /** A CSV field: quoted when it holds a comma, a quote or a line break. */
  function csvField(v) {
    const t = String(v);
    return /[",\r\n]/.test(t) ? '"' + t.replace(/"/g, '""') + '"' : t;
  }
  function oneLine(t) { return String(t).replace(/[\r\n]+/g, " "); }

  /** The inputs as CSV: a header block of comment lines (#: title, the normalisation, the bound
   *  as the Summary shows it, every edge with its condition and weight), then one row per input
   *  with the input string, one column per variable, f, s~t, R or C and whether it is a
   *  counterexample. */
  function inputsCsv(caption) {
    const a = state.analysis, sc = state.scenario;
    const lines = ["# Spanwright inputs: " + oneLine(sc.title || "Untitled scenario")];
    caption.forEach(function (c) { if (c.role === "bound" || c.role === "normalisation") lines.push("# " + oneLine(c.text)); });
    if (a.xs) lines.push("# rows: the structural engine's candidates (worst path, worst bond), not every input of the 2^" + a.nvars + " in the domain");
    lines.push("# weights (resistance), one edge a line: id, ends, present when, weight");
    sc.graph.edges.forEach(function (e) {
      lines.push("# edge " + oneLine(e.id) + ", " + oneLine(e.u) + " - " + oneLine(e.v) + ", " + oneLine(e.when) + ", " + String(e.weight === undefined || e.weight === null ? 1 : e.weight));
    });
    const fixed = ["x", "f", "connected", "kind", "value", "counterexample"];
    const varCols = sc.variables.map(function (v) { return fixed.indexOf(String(v)) >= 0 ? "var " + v : String(v); });
    lines.push(["x"].concat(varCols, ["f", "connected", "kind", "value", "counterexample"]).map(csvField).join(","));
    for (let i = 0; i < a.n; i++) {
      const fl = a.flags[i];
      const x = P.xOf(a.codes[i]);
      lines.push([x].concat(x.split(""), [(fl & 2) ? ((fl & 4) ? "1" : "0") : "", (fl & 1) ? "true" : "false",
        (fl & 1) ? "R" : "C", String(a.values[i]), P.isBad(fl) ? "true" : "false"]).join(","));
    }
    return lines.join("\n") + "\n";
  }

  /** What the engine needs to caption a figure as the Summary shows it: the input in focus, and
   *  W₊, W₋ and the engine's note on the bound when the shown analysis is of this text (else the
   *  engine analyses for the caption, as export --tikz does). */
  function figureOptions() {
    const a = state.analysis;
    const opts = { input: a && state.focus >= 0 ? P.xOf(a.codes[state.focus]) : null };
    if (a && a.text === P.text()) {
      const num = function (id) { const v = $(id).dataset.value; return v === "" || v === undefined ? null : Number(v); };
      opts.positive = num("sum-wplus");
      opts.negative = num("sum-wminus");
      const note = $("sum-bound-note").dataset.note;
      if (note) opts.note = note;
    }
    return opts;
  }

  /** The engine's figure for the current text (JsonFacade.tikz): the TikZ text and the caption
   *  lines, the same for the TikZ, PNG, SVG and CSV exports. Rejects with the engine's message. */
  function engineFigure() {
    return state.bridge.call("tikz", P.text(), JSON.stringify(figureOptions())).then(function (r) {
      if (!r.ok) throw new Error(((r.error && r.error.message) || "unknown problem") + (r.error && r.error.path ? " (at " + r.error.path + ")" : ""));
      return r;
    });
  }

  /** The caption lines of an exported figure: the title, then the engine's lines (the input in
   *  focus and its R or C, the bound and its standing, the normalisation and the caution). */
  function figureCaption() {
    return engineFigure().then(function (r) {
      return [{ role: "title", text: oneLine(state.scenario.title || "Untitled scenario") }].concat(r.caption);
    });
  }

  $("export-csv").addEventListener("click", function () {
    if (!state.analysis) { P.notify("Nothing to export yet: the analysis has not finished.", "info"); return; }
    figureCaption().then(function (caption) {
      F.download(F.fileName(state.scenario.title, "-inputs.csv"), new Blob([inputsCsv(caption)], { type: "text/csv" }));
    }).catch(function (e) { P.notify("Could not make the CSV: " + (e && e.message ? e.message : e), "error"); });
  });

  $("export-png").addEventListener("click", function () {
    figureCaption().then(function (caption) { return P.drawing.png(caption); }).then(function (r) {
      const b = $("export-png");
      b.dataset.size = r.width + "x" + r.height;
      b.dataset.drawingHeight = String(r.drawingHeight);
      F.download(F.fileName(state.scenario.title, ".png"), r.blob);
    }).catch(function (e) { P.notify("Could not make the PNG: " + (e && e.message ? e.message : e), "error"); });
  });
  $("export-svg").addEventListener("click", function () {
    figureCaption().then(function (caption) {
      const text = P.drawing.svg(state.scenario.title, caption);
      $("export-svg").dataset.chars = String(text.length);
      F.download(F.fileName(state.scenario.title, ".svg"), new Blob([text], { type: "image/svg+xml" }));
    }).catch(function (e) { P.notify("Could not make the SVG: " + (e && e.message ? e.message : e), "error"); });
  });

  /* The drawing as a TikZ figure, written by the engine (JsonFacade.tikz, as export --tikz): the
   * input in focus with its currents or potentials, and a caption with W₊ and W₋ as the Summary
   * shows them (passed in, so nothing is analysed again). */
  $("export-tikz").addEventListener("click", function () {
    const b = $("export-tikz");
    b.dataset.state = "running";
    engineFigure().then(function (r) {
      b.dataset.state = "done";
      b.dataset.chars = String(r.standalone.length);
      F.download(F.fileName(state.scenario.title, ".tex"), new Blob([r.standalone], { type: "application/x-tex" }));
    }).catch(function (e) {
      b.dataset.state = "error";
      P.notify("Could not make the TikZ figure: " + (e && e.message ? e.message : e), "error");
    });
  });
  P.hooks.engine.push(function () { $("export-tikz").disabled = !state.bridge.has("tikz"); });

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
    loadText("gallery scenario '" + g.file + "'", g.text, { pristine: true }).then(function (ok) { if (ok) P.notify("Opened '" + g.title + "' from the gallery. Undo brings back what you had.", "info"); });
  });

  function baseUrl() { return location.href.split("#")[0]; }

  $("copy-link").addEventListener("click", function () {
    state.bridge.call("encodeShare", P.text()).then(function (r) {
      if (!r.ok) { P.notify("Could not make a link: " + ((r.error && r.error.message) || "unknown problem"), "error"); return; }
      const link = baseUrl() + "#" + r.fragment;
      $("share-link").value = link;
      $("share-fragment").value = r.fragment;
      $("open-box").hidden = true;
      $("share-box").hidden = false;
      $("share-link").select();
      copyText(link);
    });
  });
  function copyText(t) {
    try { if (navigator.clipboard) navigator.clipboard.writeText(t).catch(function () { /* the field shows it */ }); } catch (e) { /* the field shows it */ }
  }
  $("share-copy-link").addEventListener("click", function () { $("share-link").select(); copyText($("share-link").value); });
  $("share-copy-fragment").addEventListener("click", function () { $("share-fragment").select(); copyText($("share-fragment").value); });
  $("share-close").addEventListener("click", function () { $("share-box").hidden = true; });

  function clearHash() {
    try { history.replaceState(null, "", baseUrl()); } catch (e) { /* some file:// setups refuse; harmless */ }
  }

  /** The share fragment in what the user pasted: a whole link from any place (file://, http://,
   *  a mail program's wrapped line) or the fragment alone, with or without its '#'; "" if none. */
  function fragmentOf(pasted) {
    let t = String(pasted || "").replace(/\s+/g, "");
    const hash = t.indexOf("#");
    if (hash >= 0) t = t.slice(hash + 1);
    else if (/^[a-z][a-z0-9+.-]*:/i.test(t) && !/^s\d+\./i.test(t)) return "";
    if (/%[0-9a-f]{2}/i.test(t)) { try { t = decodeURIComponent(t); } catch (e) { /* left as it is */ } }
    return t;
  }

  /** Opens a share fragment (from the address bar or the Open link field). A broken one leaves
   *  the current work alone; replaced work of the user's own is one Undo away and kept. */
  function openShared(frag, sourceName) {
    return state.bridge.call("decodeShare", frag).then(function (r) {
      if (!r.ok) {
        P.notify("This link does not hold a scenario Spanwright can open: " + ((r.error && r.error.message) || "it is damaged") +
          " Your current work is unchanged.", "error");
        document.body.dataset.linkStatus = "broken";
        return false;
      }
      const before = P.text();
      return loadText(sourceName, r.scenario, { why: "replaced by a link" }).then(function (ok) {
        document.body.dataset.linkStatus = ok ? "opened" : "broken";
        if (ok && document.body.dataset.keptReplaced === "yes") {
          P.notify("Opened the scenario from the link. What you had is one Undo away, and kept under Earlier work (Open link box).", "info",
            { label: "Bring back what you had", id: "restore-previous", action: function () { loadText("your previous work", before, { why: "replaced by earlier work" }); } });
        } else if (ok) {
          P.notify("Opened the scenario from the link.", "info");
        }
        return ok;
      });
    });
  }

  /** Opens the scenario in the URL fragment, if any. */
  function openFragment() {
    const frag = location.hash.replace(/^#/, "");
    if (!frag) return Promise.resolve(false);
    clearHash();
    return openShared(frag, "the link");
  }
  window.addEventListener("hashchange", function () { if (state.bridge && state.bridge.ready) openFragment(); });

  // ------------------------------------------------------------------ the Open link box

  function showOpenBox() {
    $("share-box").hidden = true;
    $("open-box").hidden = false;
    renderKept();
    $("open-link").focus();
    $("open-link").select();
  }
  function openPasted() {
    const frag = fragmentOf($("open-link").value);
    if (!frag) {
      P.notify("There is no scenario in what was pasted: a Spanwright link ends in #s1.… — paste the whole link, or only the part after #.", "error");
      document.body.dataset.linkStatus = "broken";
      return;
    }
    openShared(frag, "the pasted link").then(function (ok) { if (ok) { $("open-link").value = ""; $("open-box").hidden = true; } });
  }
  $("open-link-button").addEventListener("click", function () { if ($("open-box").hidden) showOpenBox(); else $("open-box").hidden = true; });
  $("open-link-go").addEventListener("click", openPasted);
  $("open-link").addEventListener("keydown", function (ev) {
    if (ev.key === "Enter") { ev.preventDefault(); openPasted(); }
    if (ev.key === "Escape") { ev.preventDefault(); $("open-box").hidden = true; }
  });
  $("open-close").addEventListener("click", function () { $("open-box").hidden = true; });
  $("kept-open").addEventListener("click", openKept);
  $("autosave-state").addEventListener("click", function () { setAutosaving(true); P.notify("This tab autosaves again; another open tab now stops autosaving.", "info"); });
  renderKept();

  // ------------------------------------------------------------------ the scenario the page starts with

  /** The autosaved work if there is any, else the gallery's default scenario, else FALLBACK; as
   *  the parsed scenario (FALLBACK if the text does not parse), where it came from, and whether
   *  an autosave holds a bundled scenario as it came (pristine). */
  function initialScenario() {
    let init = null;
    try {
      const saved = JSON.parse(localStorage.getItem(AUTOSAVE_KEY) || "null");
      if (saved && saved.scenario) init = { text: saved.scenario, from: "autosave", pristine: saved.pristine === true };
    } catch (e) { /* a damaged autosave is ignored, the default opens */ }
    if (!init) {
      const def = gallery.find(function (g) { return g.file === "default.json"; }) || gallery[0];
      init = def ? { text: def.text, from: "gallery" } : { text: JSON.stringify(FALLBACK), from: "built-in" };
    }
    let obj;
    try { obj = JSON.parse(init.text); } catch (e) { obj = FALLBACK; }
    return { scenario: obj, from: init.from, pristine: init.pristine === true };
  }

  Object.assign(P, {
    autosave: autosave, keepReplaced: keepReplaced, loadText: loadText, gallery: gallery, openFragment: openFragment,
    showOpenBox: showOpenBox, initialScenario: initialScenario
  });
})();
