/*
 * Spanwright page: state, editing, undo/redo, panels. Every number shown comes from the engine
 * (TeaVM-compiled core) through the worker bridge; this file only arranges and draws.
 * Every user string is put on the page with textContent or as a form value, never as HTML.
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const $ = function (id) { return document.getElementById(id); };

  const AUTOSAVE_KEY = "spanwright.autosave.v1";
  const PREVIOUS_KEY = "spanwright.previous.v1";
  const ENGINE_KEY = "spanwright.engine";
  const HISTORY_LIMIT = 300;
  const TYPING_PAUSE_MS = 900;   // a pause in typing this long applies a text field
  const ROW_HEIGHT = 26;

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

  const state = {
    scenario: null,        // the scenario object (format v1)
    undo: [], redo: [],    // JSON texts
    bridge: null,
    engine: "",
    job: 0,
    analysis: null,        // {result, codes, values, flags, n, ms}
    view: null,            // Uint32Array of row indices after filter+sort
    focus: -1,             // row index into analysis arrays
    focusDetail: null,
    display: "flow",       // "flow" | "potential"
    selection: null,       // {kind, id}
    serial: 0,
    firstRenderMs: null,
    detailSerial: 0
  };

  /* Listeners of the panels in other files (tuning.js, builder.js, bounds.js, runpanel.js). */
  const hooks = { analysis: [], scenario: [], engine: [], sheet: [], focus: [], mode: [] };

  // ------------------------------------------------------------------ messages

  function notify(text, kind, extraButton) {
    const box = $("notice");
    box.dataset.kind = kind || "info";
    $("notice-text").textContent = text;
    const extra = $("notice-extra");
    extra.textContent = "";
    if (extraButton) {
      const b = document.createElement("button");
      b.textContent = extraButton.label;
      b.id = extraButton.id || "";
      b.addEventListener("click", function () { extraButton.action(); box.hidden = true; });
      extra.appendChild(b);
    }
    box.hidden = false;
  }
  $("notice-close").addEventListener("click", function () { $("notice").hidden = true; });

  // ------------------------------------------------------------------ scenario helpers

  function normalise(sc) {
    const s = JSON.parse(JSON.stringify(sc));
    if (!s.graph || typeof s.graph !== "object") s.graph = {};
    if (!Array.isArray(s.graph.vertices)) s.graph.vertices = [];
    if (!Array.isArray(s.graph.edges)) s.graph.edges = [];
    if (!Array.isArray(s.variables)) s.variables = [];
    return s;
  }
  function text() { return JSON.stringify(state.scenario); }
  function clone(x) { return JSON.parse(JSON.stringify(x)); }

  function freshId(prefix, taken) {
    const used = new Set(taken);
    for (let i = 1; ; i++) { if (!used.has(prefix + i)) return prefix + i; }
  }

  // ------------------------------------------------------------------ history

  /** Applies an edit: mutate(copy) changes a copy of the scenario, or returns a whole new scenario
   *  object to put in its place; the old text goes on the undo stack. */
  function commit(mutate, opts) {
    opts = opts || {};
    const before = text();
    let next = clone(state.scenario);
    const r = mutate(next);
    if (r === false) return false;
    if (r && typeof r === "object") next = normalise(r);
    const after = JSON.stringify(next);
    if (after === before) return false;
    state.undo.push(before);
    if (state.undo.length > HISTORY_LIMIT) state.undo.shift();
    state.redo = [];
    setScenario(next, { analyse: opts.analyse !== false, redraw: opts.redraw !== false });
    return true;
  }

  function undo() {
    if (!state.undo.length) return;
    state.redo.push(text());
    setScenario(JSON.parse(state.undo.pop()), { analyse: true, redraw: true });
  }
  function redo() {
    if (!state.redo.length) return;
    state.undo.push(text());
    setScenario(JSON.parse(state.redo.pop()), { analyse: true, redraw: true });
  }

  function setScenario(sc, opts) {
    state.scenario = normalise(sc);
    autosave();
    renderForms();
    if (opts.redraw !== false) {
      const missing = view.showScenario(state.scenario);
      if (missing) {
        const pos = view.arrange();
        state.scenario.graph.vertices.forEach(function (v) { if (pos[v.id]) { v.x = pos[v.id].x; v.y = pos[v.id].y; } });
        autosave();
      }
      if (opts.fit) view.fit();
      reapplyFocus();
    }
    renderSelection();
    updateUndoButtons();
    if (opts.analyse) scheduleAnalysis();
    hooks.scenario.forEach(function (h) { h(); });
  }

  function updateUndoButtons() {
    $("undo").disabled = !state.undo.length;
    $("redo").disabled = !state.redo.length;
  }

  function autosave() {
    try { localStorage.setItem(AUTOSAVE_KEY, JSON.stringify({ savedAt: Date.now(), scenario: text() })); } catch (e) { /* storage full or blocked */ }
  }

  // ------------------------------------------------------------------ forms

  function promiseToText(p) {
    if (p === null || p === undefined) return "";
    if (typeof p === "string") return p;
    if (p && Array.isArray(p.weights)) return "weights: " + p.weights.join(", ");
    if (p && Array.isArray(p.inputs)) return "inputs: " + p.inputs.join(", ");
    return JSON.stringify(p);
  }
  function textToPromise(t) {
    const s = t.trim();
    if (!s) return null;
    let m = /^weights\s*:\s*(.*)$/i.exec(s);
    if (m) return { weights: m[1].split(/[\s,]+/).filter(Boolean).map(Number) };
    m = /^inputs\s*:\s*(.*)$/i.exec(s);
    if (m) return { inputs: m[1].split(/[\s,]+/).filter(Boolean) };
    if (s.charAt(0) === "{") { try { return JSON.parse(s); } catch (e) { /* fall through: an expression */ } }
    return s;
  }

  function renderForms() {
    const sc = state.scenario;
    setValue($("title"), sc.title || "");
    setValue($("function"), sc.function || "");
    setValue($("promise"), promiseToText(sc.promise));
    setValue($("notes"), sc.notes || "");
    renderVariables();
    renderEdgeTable();
  }
  function setValue(el, v) { if (document.activeElement !== el && el.value !== v) el.value = v; }

  function renderVariables() {
    // the inputs list's x column is as wide as the input strings (CSS shrinks their type beyond 12)
    $("inputs-panel").style.setProperty("--x-chars", String(state.scenario.variables.length || 1));
    const box = $("variables");
    box.textContent = "";
    state.scenario.variables.forEach(function (name, i) {
      const wrap = document.createElement("span");
      wrap.className = "var-chip";
      const inp = document.createElement("input");
      inp.value = name;
      inp.size = Math.max(2, name.length + 1);
      inp.setAttribute("aria-label", "Name of variable " + (i + 1));
      inp.dataset.varIndex = String(i);
      inp.addEventListener("change", function () { renameVariable(i, inp.value.trim()); });
      const del = document.createElement("button");
      del.textContent = "×";
      del.title = "Remove this variable";
      del.addEventListener("click", function () { removeVariable(i); });
      wrap.appendChild(inp);
      wrap.appendChild(del);
      box.appendChild(wrap);
    });
    const add = document.createElement("button");
    add.textContent = "+ variable";
    add.id = "add-variable";
    add.addEventListener("click", function () {
      commit(function (sc) {
        const letters = "abcdefghijklmnopqrstuvwxyz";
        let name = null;
        for (let i = 0; i < letters.length && !name; i++) if (sc.variables.indexOf(letters[i]) < 0) name = letters[i];
        sc.variables.push(name || freshId("x", sc.variables));
      });
    });
    box.appendChild(add);
  }

  /**
   * Renames a variable everywhere (variable list, edge conditions, function, promise). The engine
   * does it token by token (JsonFacade.renameVariable), so the page needs no expression logic. The
   * edit is applied only if the scenario is still the one that was sent.
   */
  function renameVariable(i, to) {
    const from = state.scenario.variables[i];
    if (to === from) return;
    const before = text();
    state.bridge.call("renameVariable", before, from, to).then(function (r) {
      if (!r.ok) {
        const err = r.error || {};
        notify("Could not rename variable '" + from + "' to '" + to + "': " + (err.message || "the engine refused") +
          (err.path ? " (at " + err.path + ")" : "") + ". Nothing was changed.", "error");
        renderVariables();
        return;
      }
      if (text() !== before) {
        notify("The scenario changed while '" + from + "' was being renamed, so the rename was not applied. Try again.", "error");
        renderVariables();
        return;
      }
      let next;
      try { next = JSON.parse(r.scenario); } catch (e) { notify("The engine's renamed scenario was unreadable; nothing was changed.", "error"); renderVariables(); return; }
      commit(function () { return next; });
      document.body.dataset.renamed = to;
    });
  }

  function removeVariable(i) {
    const name = state.scenario.variables[i];
    const users = state.scenario.graph.edges.filter(function (e) { return e.when === name || e.when === "!" + name; }).map(function (e) { return e.id; });
    if (users.length) { notify("Variable '" + name + "' is still used by edge(s) " + users.join(", ") + "; change those first.", "error"); return; }
    commit(function (sc) { sc.variables.splice(i, 1); });
  }

  function conditionSelect(current, onChange) {
    const sel = document.createElement("select");
    const opts = ["1"];
    state.scenario.variables.forEach(function (v) { opts.push(v); opts.push("!" + v); });
    if (opts.indexOf(current) < 0) opts.push(current);
    opts.forEach(function (o) {
      const op = document.createElement("option");
      op.value = o;
      op.textContent = o === "1" ? "1 (always)" : o.charAt(0) === "!" ? o + " (when " + o.slice(1) + " = 0)" : o + " (when " + o + " = 1)";
      sel.appendChild(op);
    });
    sel.value = current;
    sel.addEventListener("change", function () { onChange(sel.value); });
    return sel;
  }

  function weightInput(current, onChange) {
    const inp = document.createElement("input");
    inp.type = "number";
    inp.step = "any";
    inp.min = "0";
    inp.value = String(current === undefined || current === null ? 1 : current);
    inp.addEventListener("change", function () {
      const w = Number(inp.value);
      if (inp.value.trim() === "") { return; }
      if (!(w > 0) || !isFinite(w)) {
        notify("A weight is a resistance: a finite number greater than 0. '" + inp.value + "' was not applied.", "error");
        inp.value = String(current === undefined ? 1 : current);
        return;
      }
      onChange(w);
    });
    return inp;
  }

  /** Sets one key of one edge as an undoable edit; undefined removes the key. */
  function setEdge(id, field, value) {
    commit(function (sc) {
      const e = sc.graph.edges.find(function (x) { return x.id === id; });
      if (!e) return false;
      if (value === undefined) delete e[field]; else e[field] = value;
    });
  }

  /** The optimiser's hints of one edge: a "locked" box and a tie-group name (format v1 keys
   *  `locked` and `group`; an empty group or an unticked box removes the key). */
  function hintControls(e) {
    const lock = document.createElement("input");
    lock.type = "checkbox";
    lock.className = "edge-locked";
    lock.checked = e.locked === true;
    lock.title = "Locked: the weight search keeps this weight as given";
    lock.setAttribute("aria-label", "Lock the weight of edge " + e.id);
    lock.addEventListener("change", function () { setEdge(e.id, "locked", lock.checked ? true : undefined); });
    const group = document.createElement("input");
    group.className = "edge-group";
    group.value = e.group === undefined || e.group === null ? "" : String(e.group);
    group.placeholder = "group";
    group.spellcheck = false;
    group.title = "Edges with the same group name share one weight in the weight search";
    group.setAttribute("aria-label", "Tie group of edge " + e.id);
    group.addEventListener("change", function () { setEdge(e.id, "group", group.value.trim() || undefined); });
    return [lock, group];
  }

  function renderEdgeTable() {
    const body = $("edge-table").tBodies[0];
    body.textContent = "";
    state.scenario.graph.edges.forEach(function (e) {
      const tr = document.createElement("tr");
      tr.dataset.edge = e.id;
      const c1 = document.createElement("td"); c1.textContent = e.id;
      const c2 = document.createElement("td"); c2.textContent = e.u + " — " + e.v;
      const c3 = document.createElement("td"); c3.appendChild(conditionSelect(String(e.when), function (v) { setEdge(e.id, "when", v); }));
      const c4 = document.createElement("td");
      const wi = weightInput(e.weight, function (w) { setEdge(e.id, "weight", w); });
      wi.className = "edge-weight";
      wi.setAttribute("aria-label", "Weight of edge " + e.id);
      c4.appendChild(wi);
      const c6 = document.createElement("td");
      c6.className = "edge-hints";
      hintControls(e).forEach(function (c) { c6.appendChild(c); });
      const c5 = document.createElement("td");
      const del = document.createElement("button");
      del.textContent = "×"; del.title = "Delete edge " + e.id;
      del.addEventListener("click", function () { deleteElement({ kind: "edge", id: e.id }); });
      c5.appendChild(del);
      [c1, c2, c3, c4, c6, c5].forEach(function (c) { tr.appendChild(c); });
      body.appendChild(tr);
    });
  }

  function renderSelection() {
    const body = $("selection-body");
    body.textContent = "";
    const sel = state.selection;
    const g = state.scenario.graph;
    if (sel && sel.kind === "edge") {
      const e = g.edges.find(function (x) { return x.id === sel.id; });
      if (!e) { state.selection = null; return renderSelection(); }
      const h = document.createElement("div");
      h.textContent = "Edge " + e.id + ": " + e.u + " — " + e.v;
      body.appendChild(h);
      body.appendChild(labelled("present when", conditionSelect(String(e.when), function (v) { setEdge(e.id, "when", v); })));
      const wi = weightInput(e.weight, function (w) { setEdge(e.id, "weight", w); });
      wi.id = "sel-weight";
      body.appendChild(labelled("weight (resistance)", wi));
      const hints = hintControls(e);
      hints[0].id = "sel-locked";
      hints[1].id = "sel-group";
      body.appendChild(labelled("locked for the weight search", hints[0]));
      body.appendChild(labelled("tie group", hints[1]));
      return;
    }
    if (sel && sel.kind === "vertex") {
      const v = g.vertices.find(function (x) { return x.id === sel.id; });
      if (!v) { state.selection = null; return renderSelection(); }
      const role = v.id === g.s ? " — the source s" : v.id === g.t ? " — the sink t" : "";
      const h = document.createElement("div");
      h.textContent = "Vertex " + v.id + role;
      body.appendChild(h);
      const inp = document.createElement("input");
      inp.value = v.id;
      inp.id = "sel-vertex-name";
      inp.addEventListener("change", function () { renameVertex(v.id, inp.value.trim()); });
      body.appendChild(labelled("name", inp));
      return;
    }
    body.textContent = "Nothing selected. Click a vertex or an edge; use + Vertex / + Edge to draw.";
  }

  function labelled(label, control) {
    const l = document.createElement("label");
    l.className = "inline-field";
    const s = document.createElement("span");
    s.textContent = label;
    l.appendChild(s);
    l.appendChild(control);
    return l;
  }

  function renameVertex(from, to) {
    if (!to || to === from) return;
    if (state.scenario.graph.vertices.some(function (v) { return v.id === to; })) { notify("There is already a vertex named '" + to + "'.", "error"); renderSelection(); return; }
    commit(function (sc) {
      const g = sc.graph;
      g.vertices.forEach(function (v) { if (v.id === from) v.id = to; });
      g.edges.forEach(function (e) { if (e.u === from) e.u = to; if (e.v === from) e.v = to; });
      if (g.s === from) g.s = to;
      if (g.t === from) g.t = to;
    });
    state.selection = { kind: "vertex", id: to };
    renderSelection();
  }

  function deleteElement(sel) {
    if (!sel) return;
    commit(function (sc) {
      const g = sc.graph;
      if (sel.kind === "edge") {
        const n = g.edges.length;
        g.edges = g.edges.filter(function (e) { return e.id !== sel.id; });
        return g.edges.length !== n;
      }
      if (sel.id === g.s || sel.id === g.t) { notify("Vertex '" + sel.id + "' is " + (sel.id === g.s ? "s" : "t") + "; make another vertex " + (sel.id === g.s ? "s" : "t") + " before deleting it.", "error"); return false; }
      g.vertices = g.vertices.filter(function (v) { return v.id !== sel.id; });
      g.edges = g.edges.filter(function (e) { return e.u !== sel.id && e.v !== sel.id; });
    });
    state.selection = null;
    renderSelection();
  }

  function setRole(role) {
    const sel = state.selection;
    if (!sel || sel.kind !== "vertex") { notify("Select a vertex first, then press Set " + role + ".", "info"); return; }
    const other = role === "s" ? state.scenario.graph.t : state.scenario.graph.s;
    if (sel.id === other) { notify("s and t must be different vertices.", "error"); return; }
    commit(function (sc) { sc.graph[role] = sel.id; });
  }

  // ------------------------------------------------------------------ the drawing

  const view = new self.SwGraphView($("graph"), {
    addVertex: function (pos) {
      commit(function (sc) {
        const id = freshId("v", sc.graph.vertices.map(function (v) { return v.id; }));
        sc.graph.vertices.push({ id: id, x: Math.round(pos.x), y: Math.round(pos.y) });
        state.selection = { kind: "vertex", id: id };
      });
    },
    addEdge: function (u, v) {
      commit(function (sc) {
        const id = freshId("e", sc.graph.edges.map(function (e) { return e.id; }));
        sc.graph.edges.push({ id: id, u: u, v: v, when: sc.variables.length ? sc.variables[0] : "1", weight: 1 });
        state.selection = { kind: "edge", id: id };
      });
    },
    moveVertex: function (id, x, y) {
      commit(function (sc) {
        const v = sc.graph.vertices.find(function (q) { return q.id === id; });
        if (!v) return false;
        v.x = Math.round(x); v.y = Math.round(y);
      }, { analyse: false, redraw: false });
    },
    select: function (sel) { state.selection = sel; renderSelection(); },
    hover: function (h) { showHover(h); }
  });

  function showHover(h) {
    const cap = $("focus-caption");
    if (!h) { cap.textContent = ""; return; }
    const d = state.focusDetail;
    if (h.kind === "edge") {
      const e = state.scenario.graph.edges.find(function (x) { return x.id === h.id; });
      if (!e) return;
      let t = "edge " + e.id + " (" + e.u + " — " + e.v + "), present when " + e.when + ", weight " + F.num(e.weight === undefined ? 1 : e.weight);
      const de = d && (d.edges || []).find(function (x) { return x.id === h.id; });
      if (de) {
        t += de.present ? " · present" : " · absent";
        if (typeof de.current === "number" && d.connected) t += " · current " + F.num(de.current) + " from " + e.u + " to " + e.v;
        if (typeof de.energy === "number" && !d.connected) t += " · energy " + F.num(de.energy);
      }
      cap.textContent = t;
    } else {
      let t = "vertex " + h.id;
      if (d && d.potentials && typeof d.potentials[h.id] === "number") t += " · potential " + F.num(d.potentials[h.id]);
      cap.textContent = t;
    }
  }

  document.querySelectorAll("[data-tool]").forEach(function (b) {
    b.addEventListener("click", function () {
      document.querySelectorAll("[data-tool]").forEach(function (x) { x.classList.toggle("active", x === b); });
      view.setTool(b.dataset.tool);
    });
  });
  $("delete-selected").addEventListener("click", function () { deleteElement(state.selection); });
  $("make-s").addEventListener("click", function () { setRole("s"); });
  $("make-t").addEventListener("click", function () { setRole("t"); });
  $("relayout").addEventListener("click", function () {
    const pos = view.arrange();
    commit(function (sc) { sc.graph.vertices.forEach(function (v) { if (pos[v.id]) { v.x = pos[v.id].x; v.y = pos[v.id].y; } }); }, { analyse: false });
  });

  // ------------------------------------------------------------------ analysis

  let analysisTimer = 0;
  function scheduleAnalysis(delay) {
    clearTimeout(analysisTimer);
    analysisTimer = setTimeout(runAnalysis, delay === undefined ? 250 : delay);
  }

  let progressTimer = 0;
  function runAnalysis() {
    if (!state.bridge || !state.bridge.ready) { scheduleAnalysis(100); return; }
    if (state.job) state.bridge.cancel(state.job);
    const scenarioText = text();
    document.body.dataset.analysis = "running";
    $("status").dataset.state = "running";
    $("status").textContent = "analysing…";
    clearTimeout(progressTimer);
    progressTimer = setTimeout(function () { $("progress-row").hidden = false; }, 300);
    const started = performance.now();
    const id = state.bridge.analyze(scenarioText, function (done, total) {
      if (id !== state.job) return;
      $("progress").max = total || 1;
      $("progress").value = done;
      $("progress-text").textContent = F.count(done) + " / " + F.count(total) + " inputs";
    }, function (m) {
      if (id !== state.job) return;
      state.job = 0;
      clearTimeout(progressTimer);
      $("progress-row").hidden = true;
      if (m.type === "cancelled") { $("status").dataset.state = "cancelled"; $("status").textContent = "cancelled — numbers below are from the last finished analysis"; document.body.dataset.analysis = "cancelled"; return; }
      let answer;
      try { answer = JSON.parse(m.text); } catch (e) { answer = { ok: false, error: { message: "unreadable answer", path: "$" } }; }
      if (m.type === "analysis-error" || !answer.ok) { showAnalysisError(answer.error || {}); return; }
      $("timing").dataset.retried = m.retried ? "true" : "false";
      showAnalysis(answer.result, m.inputs, m.ms, m.total, performance.now() - started, scenarioText);
    });
    state.job = id;
  }

  $("cancel").addEventListener("click", function () { if (state.job) state.bridge.cancel(state.job); });

  function showAnalysisError(err) {
    const box = $("error-box");
    box.hidden = false;
    box.textContent = "";
    const strong = document.createElement("strong");
    strong.textContent = "The scenario cannot be analysed: ";
    box.appendChild(strong);
    box.appendChild(document.createTextNode(String(err.message || "unknown problem")));
    if (err.path) {
      const p = document.createElement("div");
      p.className = "error-path";
      p.textContent = "where: " + err.path + (err.code ? "  (" + err.code + ")" : "");
      box.appendChild(p);
    }
    $("status").dataset.state = "error";
    $("status").textContent = "not analysed — see the message";
    document.body.dataset.analysis = "error";
    document.body.classList.add("stale");
    state.serial++;
    document.body.dataset.analysisSerial = String(state.serial);
  }

  function setFigure(id, v) {
    const el = $(id);
    el.textContent = F.num(v === null || v === undefined ? NaN : v);
    el.dataset.value = v === null || v === undefined ? "" : String(v);
    el.title = v === null || v === undefined ? "no inputs of this kind" : String(v);
  }

  function showAnalysis(result, inputs, ms, total, wallMs, scenarioText) {
    $("error-box").hidden = true;
    document.body.classList.remove("stale");
    const previousX = state.focus >= 0 && state.analysis ? state.analysis.codes[state.focus] : null;
    const n = inputs ? inputs.codes.length : 0;
    state.analysis = { result: result, codes: inputs ? inputs.codes : new Int32Array(0), values: inputs ? inputs.values : new Float64Array(0),
      flags: inputs ? inputs.flags : new Uint8Array(0), n: n, nvars: (result.variables || state.scenario.variables).length,
      text: scenarioText };
    const pos = result.positive || {}, neg = result.negative || {};
    setFigure("sum-wplus", pos.count ? pos.maxResistance : null);
    setFigure("sum-wminus", neg.count ? neg.maxCapacitance : null);
    setFigure("sum-bound", result.complexity);
    const counts = $("counts");
    counts.textContent = F.count(result.domainSize !== undefined ? result.domainSize : n) + " inputs in the domain: " +
      F.count(pos.count || 0) + " positive (s and t connected), " + F.count(neg.count || 0) + " negative.";
    const red = result.reduction || {};
    const verdict = $("verdict");
    verdict.textContent = "";
    if (red.correct === null || red.correct === undefined) {
      verdict.dataset.correct = "unchecked";
      verdict.textContent = "No function given: the reduction is not checked.";
    } else if (red.correct) {
      verdict.dataset.correct = "yes";
      verdict.textContent = "✓ The graph decides f: s and t are connected exactly when f(x) = 1, on every input of the domain.";
    } else {
      verdict.dataset.correct = "no";
      const c = red.counterexampleCount || 0;
      verdict.appendChild(document.createTextNode("✗ The graph does not decide f: " + F.count(c) + " counterexample" + (c === 1 ? "" : "s") + ". "));
      (red.counterexamples || []).slice(0, 8).forEach(function (x) {
        const b = document.createElement("button");
        b.className = "linkish";
        b.textContent = typeof x === "string" ? x : (x.x || JSON.stringify(x));
        b.addEventListener("click", function () { focusInput(typeof x === "string" ? x : x.x); });
        verdict.appendChild(b);
      });
    }
    $("worst-pos").disabled = !pos.worst;
    $("worst-neg").disabled = !neg.worst;
    const rate = total && ms > 0 ? total / (ms / 1000) : 0;
    const timing = $("timing");
    timing.textContent = F.count(total || n) + " inputs analysed in " + F.num(ms / 1000) + " s (" + F.count(Math.round(rate)) + " inputs/s) by the " + (state.engine === "wasm" ? "WebAssembly-GC" : "JavaScript") + " engine.";
    timing.dataset.ms = String(ms);
    timing.dataset.rate = String(rate);
    timing.dataset.engine = state.engine;
    $("status").dataset.state = "ready";
    $("status").textContent = "up to date";
    buildView();
    drawHistogram();
    state.focus = -1;
    if (previousX !== null) {
      const i = indexOfCode(previousX);
      if (i >= 0) setFocus(i, true);
      else clearFocus();
    } else clearFocus();
    state.serial++;
    document.body.dataset.analysis = "ready";
    document.body.dataset.analysisSerial = String(state.serial);
    hooks.analysis.forEach(function (h) { h(state.analysis); });
    if (state.firstRenderMs === null) {
      state.firstRenderMs = performance.now();
      document.body.dataset.firstRenderMs = String(Math.round(state.firstRenderMs));
    }
  }

  function indexOfCode(code) {
    const a = state.analysis;
    if (!a) return -1;
    // Full-cube domains are listed in input order, so index = code; check before searching.
    if (code < a.n && a.codes[code] === code) return code;
    for (let i = 0; i < a.n; i++) if (a.codes[i] === code) return i;
    return -1;
  }
  function codeOf(x) { return parseInt(x, 2); }
  function xOf(code) {
    const n = state.analysis ? state.analysis.nvars : state.scenario.variables.length;
    if (n === 0) return "";
    let s = (code >>> 0).toString(2);
    while (s.length < n) s = "0" + s;
    return s;
  }

  // ------------------------------------------------------------------ inputs list

  function isBad(fl) { return (fl & 2) !== 0 && (((fl & 4) !== 0) !== ((fl & 1) !== 0)); }

  function buildView() {
    const a = state.analysis;
    if (!a) return;
    const filter = $("filter").value;
    const sort = $("sort").value;
    const idx = [];
    for (let i = 0; i < a.n; i++) {
      const fl = a.flags[i];
      if (filter === "pos" && !(fl & 1)) continue;
      if (filter === "neg" && (fl & 1)) continue;
      if (filter === "bad" && !isBad(fl)) continue;
      idx.push(i);
    }
    let v = Uint32Array.from(idx);
    if (sort !== "input") {
      const vals = a.values;
      const sign = sort === "desc" ? -1 : 1;
      v.sort(function (p, q) {
        const x = vals[p], y = vals[q];
        if (x === y || (isNaN(x) && isNaN(y))) return p - q;
        if (isNaN(x)) return 1;
        if (isNaN(y)) return -1;
        return sign * (x - y);
      });
    }
    state.view = v;
    $("list-spacer").style.height = (v.length * ROW_HEIGHT) + "px";
    $("list-count").textContent = F.count(v.length) + " of " + F.count(a.n) + " inputs shown" + (a.n > 4096 ? " (rows are drawn as you scroll)" : "");
    renderRows();
  }

  const rowPool = [];
  function renderRows() {
    const list = $("list");
    const a = state.analysis;
    const v = state.view;
    if (!a || !v) return;
    const first = Math.max(0, Math.floor(list.scrollTop / ROW_HEIGHT) - 5);
    const last = Math.min(v.length, first + Math.ceil(list.clientHeight / ROW_HEIGHT) + 10);
    const res = a.result;
    const wp = res.positive && res.positive.maxResistance, wm = res.negative && res.negative.maxCapacitance;
    let used = 0;
    for (let k = first; k < last; k++) {
      const i = v[k];
      let row = rowPool[used];
      if (!row) {
        row = document.createElement("div");
        row.className = "row";
        row.setAttribute("role", "option");
        ["x", "f", "conn", "val"].forEach(function (c) { const s = document.createElement("span"); s.className = "c-" + c; row.appendChild(s); });
        const bar = document.createElement("span"); bar.className = "bar"; row.appendChild(bar);
        row.addEventListener("click", function () { setFocus(Number(row.dataset.index)); $("list").focus(); });
        rowPool.push(row);
        list.appendChild(row);
      }
      used++;
      const fl = a.flags[i];
      const val = a.values[i];
      row.style.top = (k * ROW_HEIGHT) + "px";
      row.hidden = false;
      row.dataset.index = String(i);
      row.dataset.x = xOf(a.codes[i]);
      row.classList.toggle("pos", (fl & 1) !== 0);
      row.classList.toggle("bad", isBad(fl));
      row.classList.toggle("focused", i === state.focus);
      row.setAttribute("aria-selected", i === state.focus ? "true" : "false");
      row.children[0].textContent = row.dataset.x;
      row.children[1].textContent = (fl & 2) ? ((fl & 4) ? "1" : "0") : "–";
      row.children[2].textContent = (fl & 1) ? "yes" : "no";
      row.children[3].textContent = ((fl & 1) ? "R " : "C ") + F.num(val) + (isBad(fl) ? "  ✗" : "");
      const max = (fl & 1) ? wp : wm;
      const frac = max > 0 && isFinite(val) ? Math.max(0, Math.min(1, val / max)) : 0;
      row.children[4].style.width = (frac * 100).toFixed(1) + "%";
    }
    for (let j = used; j < rowPool.length; j++) rowPool[j].hidden = true;
  }
  $("list").addEventListener("scroll", function () { requestAnimationFrame(renderRows); });
  $("filter").addEventListener("change", function () { buildView(); scrollToFocus(); });
  $("sort").addEventListener("change", function () { buildView(); scrollToFocus(); });

  function viewPosOf(i) {
    const v = state.view;
    if (!v) return -1;
    for (let k = 0; k < v.length; k++) if (v[k] === i) return k;
    return -1;
  }
  function scrollToFocus() {
    const k = viewPosOf(state.focus);
    if (k < 0) return;
    const list = $("list");
    const top = k * ROW_HEIGHT;
    if (top < list.scrollTop || top + ROW_HEIGHT > list.scrollTop + list.clientHeight) list.scrollTop = Math.max(0, top - list.clientHeight / 2);
    renderRows();
  }

  function step(delta) {
    const v = state.view;
    if (!v || !v.length) return;
    let k = viewPosOf(state.focus);
    k = k < 0 ? (delta > 0 ? 0 : v.length - 1) : Math.max(0, Math.min(v.length - 1, k + delta));
    setFocus(v[k]);
  }

  // ------------------------------------------------------------------ focus

  function focusInput(x) {
    const i = indexOfCode(codeOf(x));
    if (i < 0) { notify("Input " + x + " is not in the list.", "info"); return; }
    if (viewPosOf(i) < 0) { $("filter").value = "all"; buildView(); }
    setFocus(i);
  }

  function setFocus(i, keepQuiet) {
    const a = state.analysis;
    if (!a || i < 0 || i >= a.n) return;
    state.focus = i;
    const x = xOf(a.codes[i]);
    document.body.dataset.focus = x;
    const info = $("focus-info");
    const fl = a.flags[i];
    info.textContent = "";
    const line1 = document.createElement("div");
    line1.className = "focus-line";
    const xs = document.createElement("span"); xs.id = "focus-x"; xs.textContent = x;
    line1.appendChild(document.createTextNode("In focus: x = "));
    line1.appendChild(xs);
    const vars = state.scenario.variables.map(function (name, k) { return name + "=" + x.charAt(k); }).join(" ");
    line1.appendChild(document.createTextNode("  (" + vars + ")"));
    info.appendChild(line1);
    const line2 = document.createElement("div");
    line2.id = "focus-value";
    line2.dataset.value = String(a.values[i]);
    line2.textContent = ((fl & 1) ? "positive: s and t connected, effective resistance R = " : "negative: s and t apart, effective capacitance C = ") +
      F.num(a.values[i]) + ((fl & 2) ? "; f(x) = " + ((fl & 4) ? 1 : 0) : "") + (isBad(fl) ? " — a counterexample" : "");
    info.appendChild(line2);
    scrollToFocus();
    renderRows();
    requestDetail(x);
  }

  function clearFocus() {
    state.focus = -1;
    state.focusDetail = null;
    delete document.body.dataset.focus;
    $("focus-info").textContent = "No input in focus. Click a row, or press ↓, 1 (worst positive) or 0 (worst negative).";
    view.clearFocus();
    renderLegend(null);
    renderRows();
  }

  function requestDetail(x) {
    const serial = ++state.detailSerial;
    state.bridge.call("detail", text(), x).then(function (d) {
      if (serial !== state.detailSerial) return;
      if (!d.ok) { state.focusDetail = null; view.clearFocus(); $("focus-caption").textContent = "No witness for this input: " + ((d.error && d.error.message) || "unknown problem"); return; }
      state.focusDetail = d;
      const info = view.showFocus(d, state.display);
      renderLegend(info);
      document.body.dataset.focusDrawn = x;
      hooks.focus.forEach(function (h) { h(x); });
    });
  }

  function reapplyFocus() {
    if (state.focusDetail) renderLegend(view.showFocus(state.focusDetail, state.display));
  }

  function renderLegend(info) {
    const lg = $("legend");
    lg.textContent = "";
    const lines = document.createElement("div");
    lines.className = "legend-lines";
    if (!info) {
      lines.textContent = "◇ s (source)  □ t (sink)  · edge label: condition (a, !a, 1) and weight w if not 1";
      lg.appendChild(lines);
      return;
    }
    lines.textContent = "solid: present in G(x) · dashed: absent" + (info.positive && !info.useRamp ? " · width ∝ |current i|, arrow = direction of the unit current s→t" : "") +
      (!info.positive ? " · E = energy on an absent edge" : "");
    lg.appendChild(lines);
    if (info.useRamp && isFinite(info.pmin)) {
      const bar = document.createElement("div");
      bar.className = "legend-ramp";
      const lo = document.createElement("span"); lo.textContent = "φ " + F.num(info.pmin) + (info.positive ? "" : " (t side)");
      const grad = document.createElement("span"); grad.className = "ramp-bar"; grad.style.background = F.rampCss();
      const hi = document.createElement("span"); hi.textContent = F.num(info.pmax) + (info.positive ? "" : " (s side)");
      bar.appendChild(lo); bar.appendChild(grad); bar.appendChild(hi);
      lg.appendChild(bar);
    }
  }

  function worst(kind) {
    const a = state.analysis;
    if (!a) return;
    const side = kind === "pos" ? a.result.positive : a.result.negative;
    if (!side || !side.worst) { notify("There is no " + (kind === "pos" ? "positive" : "negative") + " input in the domain.", "info"); return; }
    focusInput(side.worst);
  }
  $("worst-pos").addEventListener("click", function () { worst("pos"); });
  $("worst-neg").addEventListener("click", function () { worst("neg"); });

  // ------------------------------------------------------------------ histogram

  /**
   * The histogram the engine computed (result.histogram: for each side min, max and equal-width
   * bin counts over [min, max]); the page only draws it. The counts are also put on the canvas
   * (data-positive, data-negative) and in its text alternative.
   */
  function drawHistogram() {
    const cv = $("histogram");
    const ctx = cv.getContext("2d");
    const a = state.analysis;
    const W = cv.width, H = cv.height;
    ctx.clearRect(0, 0, W, H);
    ctx.font = "12px system-ui, sans-serif";
    if (!a) return;
    const hist = a.result.histogram || {};
    const halves = [{ key: "positive", label: "R (positive)", x0: 0, hatch: false }, { key: "negative", label: "C (negative)", x0: W / 2 + 6, hatch: true }];
    const alt = [];
    halves.forEach(function (h) {
      const side = hist[h.key] || {};
      const counts = Array.isArray(side.counts) ? side.counts.map(Number) : [];
      cv.dataset[h.key] = JSON.stringify(counts);
      const total = counts.reduce(function (p, q) { return p + q; }, 0);
      const span = W / 2 - 12;
      const base = H - 22;
      ctx.fillStyle = "#111";
      const range = counts.length ? (side.min === side.max ? "all " + F.num(side.min) : F.num(side.min) + " … " + F.num(side.max)) : "";
      ctx.fillText(h.label + (counts.length ? ", " + range : ": none"), h.x0, 12);
      alt.push(h.label + ": " + (counts.length ? F.count(total) + " inputs in " + counts.length + " bin" + (counts.length === 1 ? "" : "s") + " over " + range + " (" + counts.join(", ") + ")" : "none"));
      const top = Math.max(1, Math.max.apply(null, counts.concat([0])));
      // One bin (every value equal) is drawn as one narrow bar in the middle.
      const bins = counts.length;
      const w = bins > 1 ? span / bins : span / 20;
      const xStart = bins > 1 ? h.x0 : h.x0 + (span - w) / 2;
      for (let b = 0; b < bins; b++) {
        const bh = (base - 20) * counts[b] / top;
        const x = xStart + b * w;
        ctx.fillStyle = h.hatch ? "#b8620a" : "#1f5fa8";
        ctx.fillRect(x + 1, base - bh, w - 2, bh);
        if (h.hatch && bh > 0) {
          ctx.strokeStyle = "#fff"; ctx.lineWidth = 1;
          for (let yy = base; yy > base - bh; yy -= 5) { ctx.beginPath(); ctx.moveTo(x + 1, yy); ctx.lineTo(x + w - 1, yy - 3); ctx.stroke(); }
        }
      }
      ctx.strokeStyle = "#111";
      ctx.beginPath(); ctx.moveTo(h.x0, base + 0.5); ctx.lineTo(h.x0 + span, base + 0.5); ctx.stroke();
      ctx.fillStyle = "#111";
      if (bins > 1) {
        ctx.fillText(F.num(side.min), h.x0, H - 6);
        const m = F.num(side.max);
        ctx.fillText(m, h.x0 + span - ctx.measureText(m).width, H - 6);
      } else if (bins === 1) {
        const m = F.num(side.min);
        ctx.fillText(m, h.x0 + (span - ctx.measureText(m).width) / 2, H - 6);
      }
    });
    cv.textContent = alt.join("; ");
    cv.setAttribute("aria-label", "Histogram of witness sizes. " + alt.join("; "));
  }

  // ------------------------------------------------------------------ forms → scenario

  $("title").addEventListener("change", function () { const v = $("title").value; commit(function (sc) { sc.title = v; }, { analyse: false }); });
  $("notes").addEventListener("change", function () { const v = $("notes").value; commit(function (sc) { sc.notes = v; }, { analyse: false }); });
  $("function").addEventListener("change", function () {
    const v = $("function").value.trim();
    commit(function (sc) { if (v) sc.function = v; else delete sc.function; });
  });
  $("promise").addEventListener("change", function () { const v = textToPromise($("promise").value); commit(function (sc) { sc.promise = v; }); });
  // Typing applies itself after a pause too (so a reload mid-edit loses nothing); change (Enter,
  // leaving the field) applies at once. commit() ignores a value that is already applied.
  ["title", "notes", "function", "promise"].forEach(function (id) {
    let timer = null;
    const field = $(id);
    field.addEventListener("input", function () {
      clearTimeout(timer);
      timer = setTimeout(function () { field.dispatchEvent(new Event("change")); }, TYPING_PAUSE_MS);
    });
    field.addEventListener("change", function () { clearTimeout(timer); });
  });
  $("undo").addEventListener("click", undo);
  $("redo").addEventListener("click", redo);

  // ------------------------------------------------------------------ files, gallery, links

  /** Loads scenario text from somewhere (file, gallery, link). Bad input never replaces the work. */
  function loadText(sourceName, scenarioText, opts) {
    opts = opts || {};
    let obj;
    try { obj = JSON.parse(scenarioText); } catch (e) {
      // The engine's reader names line and column; the browser's message may not.
      return state.bridge.call("validate", scenarioText).then(function (v) {
        const why = !v.ok && v.error && v.error.message ? v.error.message : F.jsonProblem(scenarioText, e);
        notify("Could not open " + sourceName + ": " + why + ". Your current work is unchanged.", "error");
        return false;
      });
    }
    if (!obj || typeof obj !== "object" || Array.isArray(obj)) {
      notify("Could not open " + sourceName + ": it is not a scenario object. Your current work is unchanged.", "error");
      return Promise.resolve(false);
    }
    return state.bridge.call("validate", scenarioText).then(function (v) {
      if (!v.ok && !(v.error && v.error.code === "not-ready")) {
        const err = v.error || {};
        notify("Could not open " + sourceName + ": " + (err.message || "it is not a valid scenario") + (err.path ? " (at " + err.path + ")" : "") + ". Your current work is unchanged.", "error");
        return false;
      }
      if (state.scenario && !opts.initial) {
        state.undo.push(text());
        state.redo = [];
      }
      state.selection = null;
      setScenario(obj, { analyse: true, redraw: true, fit: true });
      clearFocus();
      if (v.warnings && v.warnings.length) notify("Opened " + sourceName + " with warnings: " + v.warnings.map(function (w) { return w.message || String(w); }).join("; "), "info");
      return true;
    });
  }

  $("open-file").addEventListener("change", function () {
    const file = this.files && this.files[0];
    if (!file) return;
    const reader = new FileReader();
    const input = this;
    reader.onload = function () { loadText("file '" + file.name + "'", String(reader.result)).then(function (ok) { if (ok) notify("Opened '" + file.name + "'. Undo brings back what you had.", "info"); }); input.value = ""; };
    reader.onerror = function () { notify("Could not read file '" + file.name + "'. Your current work is unchanged.", "error"); input.value = ""; };
    reader.readAsText(file);
  });

  $("save").addEventListener("click", function () {
    F.download(F.fileName(state.scenario.title, ".json"), new Blob([JSON.stringify(state.scenario, null, 2) + "\n"], { type: "application/json" }));
  });

  $("export-csv").addEventListener("click", function () {
    const a = state.analysis;
    if (!a) { notify("Nothing to export yet: the analysis has not finished.", "info"); return; }
    const lines = ["x,f,connected,kind,value,counterexample"];
    for (let i = 0; i < a.n; i++) {
      const fl = a.flags[i];
      lines.push(xOf(a.codes[i]) + "," + ((fl & 2) ? ((fl & 4) ? "1" : "0") : "") + "," + ((fl & 1) ? "true" : "false") + "," +
        ((fl & 1) ? "R" : "C") + "," + String(a.values[i]) + "," + (isBad(fl) ? "true" : "false"));
    }
    F.download(F.fileName(state.scenario.title, "-inputs.csv"), new Blob([lines.join("\n") + "\n"], { type: "text/csv" }));
  });

  $("export-png").addEventListener("click", function () {
    F.download(F.fileName(state.scenario.title, ".png"), view.png());
  });
  $("export-svg").addEventListener("click", function () {
    const text = view.svg(state.scenario.title);
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
    loadText("gallery scenario '" + g.file + "'", g.text).then(function (ok) { if (ok) notify("Opened '" + g.title + "' from the gallery. Undo brings back what you had.", "info"); });
  });

  function baseUrl() { return location.href.split("#")[0]; }

  $("copy-link").addEventListener("click", function () {
    state.bridge.call("encodeShare", text()).then(function (r) {
      if (!r.ok) { notify("Could not make a link: " + ((r.error && r.error.message) || "unknown problem"), "error"); return; }
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
        notify("This link does not hold a scenario Spanwright can open: " + ((r.error && r.error.message) || "it is damaged") +
          " Your current work is unchanged.", "error");
        document.body.dataset.linkStatus = "broken";
        return false;
      }
      const before = state.scenario ? text() : null;
      return loadText("the link", r.scenario, { initial: initial }).then(function (ok) {
        document.body.dataset.linkStatus = ok ? "opened" : "broken";
        if (ok && before && before !== text()) {
          try { localStorage.setItem(PREVIOUS_KEY, before); } catch (e) { /* ignore */ }
          notify("Opened the scenario from the link.", "info", { label: "Bring back my previous work", id: "restore-previous", action: function () {
            loadText("your previous work", before);
          } });
        }
        return ok;
      });
    });
  }
  window.addEventListener("hashchange", function () { if (state.bridge && state.bridge.ready) openFragment(false); });

  // ------------------------------------------------------------------ presentation and keys

  function setPresenting(on) {
    document.body.dataset.mode = on ? "present" : "edit";
    view.setScale(on ? 1.5 : 1);
    $("histogram").hidden = on;
    setTimeout(function () { view.cy.resize(); view.fit(); reapplyFocus(); view.placeLabels(); hooks.mode.forEach(function (h) { h(on); }); }, 50);
  }
  $("present").addEventListener("click", function () { setPresenting(true); });

  function typing(ev) {
    const t = ev.target;
    return t && (t.tagName === "INPUT" || t.tagName === "TEXTAREA" || t.tagName === "SELECT" || t.isContentEditable);
  }

  document.addEventListener("keydown", function (ev) {
    const key = ev.key;
    if ((ev.ctrlKey || ev.metaKey) && (key === "z" || key === "Z")) {
      if (typing(ev) || document.querySelector("dialog[open]")) return;
      ev.preventDefault();
      if (ev.shiftKey) redo(); else undo();
      return;
    }
    if ((ev.ctrlKey || ev.metaKey) && (key === "y" || key === "Y") && !typing(ev)) { ev.preventDefault(); redo(); return; }
    if (typing(ev) || ev.ctrlKey || ev.metaKey || ev.altKey) return;
    if (document.querySelector("dialog[open]")) return;   // a dialog has the keyboard
    const presenting = document.body.dataset.mode === "present";
    switch (key) {
      case "ArrowDown": case "ArrowRight": ev.preventDefault(); step(1); break;
      case "ArrowUp": case "ArrowLeft": ev.preventDefault(); step(-1); break;
      case "PageDown": ev.preventDefault(); step(20); break;
      case "PageUp": ev.preventDefault(); step(-20); break;
      case "1": worst("pos"); break;
      case "0": worst("neg"); break;
      case "v": case "V":
        state.display = state.display === "flow" ? "potential" : "flow";
        document.body.dataset.display = state.display;
        reapplyFocus();
        break;
      case "m": case "M": setPresenting(!presenting); break;
      case "s": case "S": showSheet("summary"); break;
      case "w": case "W": showSheet("weights"); break;
      case "b": case "B": showSheet("bounds"); break;
      case "r": case "R": showSheet("run"); break;
      case "n": case "N": if (!presenting && window.SwBuilder) { ev.preventDefault(); window.SwBuilder.open(); } break;
      case "Escape": if (presenting) setPresenting(false); $("keys-help").hidden = true; break;
      case "?": $("keys-help").hidden = !$("keys-help").hidden; break;
      case "Delete": case "Backspace": if (!presenting && state.selection) { ev.preventDefault(); deleteElement(state.selection); } break;
      default: break;
    }
  });

  // ------------------------------------------------------------------ engine start

  function engineLabel(e) { return e === "wasm" ? "WebAssembly-GC" : "JavaScript"; }

  function preferredEngine() {
    const q = /[?&]engine=(js|wasm|auto)\b/.exec(location.search);
    if (q) return q[1];
    try { return localStorage.getItem(ENGINE_KEY) || "auto"; } catch (e) { return "auto"; }
  }

  function startEngine(preferred, then) {
    if (state.bridge) state.bridge.terminate();
    state.job = 0;
    $("engine-badge").textContent = "engine: starting…";
    const bridge = new self.SpanwrightEngineBridge(preferred, function (m) {
      state.engine = m.engine;
      const badge = $("engine-badge");
      badge.dataset.engine = m.engine;
      badge.textContent = "engine: " + (m.engine === "wasm" ? "wasm-GC" : "JS");
      badge.setAttribute("aria-label", "engine: " + engineLabel(m.engine));
      badge.title = (m.note ? m.note + " " : "") + "Started in " + Math.round(m.loadMs) + " ms.";
      if (m.note && preferred === "wasm") notify(m.note, "info");
      document.body.dataset.engineFunctions = (m.functions || []).join(" ");
      hooks.engine.forEach(function (h) { h(m); });
      if (then) then();
    }, function (message) {
      notify(message, "error");
      $("engine-badge").textContent = "engine: failed";
    });
    state.bridge = bridge;
  }

  $("engine-choice").addEventListener("change", function () {
    const v = $("engine-choice").value;
    try { localStorage.setItem(ENGINE_KEY, v); } catch (e) { /* ignore */ }
    startEngine(v, function () { runAnalysis(); });
  });

  function initialScenario() {
    try {
      const saved = JSON.parse(localStorage.getItem(AUTOSAVE_KEY) || "null");
      if (saved && saved.scenario) return { text: saved.scenario, from: "autosave" };
    } catch (e) { /* a damaged autosave is ignored, the default opens */ }
    const def = gallery.find(function (g) { return g.file === "default.json"; }) || gallery[0];
    if (def) return { text: def.text, from: "gallery" };
    return { text: JSON.stringify(FALLBACK), from: "built-in" };
  }

  function boot() {
    const pref = preferredEngine();
    $("engine-choice").value = pref;
    const init = initialScenario();
    let obj;
    try { obj = JSON.parse(init.text); } catch (e) { obj = FALLBACK; }
    state.scenario = normalise(obj);
    setScenario(state.scenario, { analyse: false, redraw: true, fit: true });
    clearFocus();
    document.body.dataset.loadedFrom = init.from;
    startEngine(pref, function () {
      openFragment(true).then(function (opened) { if (!opened) runAnalysis(); });
    });
  }

  // ------------------------------------------------------------------ result sheets (tabs)

  let currentSheet = "summary";
  function showSheet(name) {
    if (!$("sheet-" + name)) return;
    currentSheet = name;
    document.querySelectorAll(".sheet-tabs [role=tab]").forEach(function (t) {
      const on = t.dataset.sheet === name;
      t.setAttribute("aria-selected", on ? "true" : "false");
      t.tabIndex = on ? 0 : -1;
    });
    document.querySelectorAll("#summary-panel .sheet").forEach(function (p) { p.hidden = p.id !== "sheet-" + name; });
    document.body.dataset.sheet = name;
    hooks.sheet.forEach(function (h) { h(name); });
  }
  document.querySelectorAll(".sheet-tabs [role=tab]").forEach(function (t) {
    t.addEventListener("click", function () { showSheet(t.dataset.sheet); });
    t.addEventListener("keydown", function (ev) {
      if (ev.key !== "ArrowLeft" && ev.key !== "ArrowRight") return;
      ev.preventDefault();
      ev.stopPropagation();
      const tabs = Array.prototype.slice.call(document.querySelectorAll(".sheet-tabs [role=tab]"));
      const k = (tabs.indexOf(t) + (ev.key === "ArrowRight" ? 1 : tabs.length - 1)) % tabs.length;
      tabs[k].focus();
      showSheet(tabs[k].dataset.sheet);
    });
  });

  /**
   * What the panels in the other page scripts may use: the scenario text, edits (undoable), the
   * engine bridge and task workers, messages. They hold no scenario state of their own.
   */
  self.SwApp = {
    text: text,
    scenario: function () { return state.scenario; },
    commitScenario: function (obj) { return commit(function () { return obj; }); },
    loadText: loadText,
    notify: notify,
    bridge: function () { return state.bridge; },
    newTask: function () { return new self.SpanwrightEngineTask(state.engine || preferredEngine()); },
    has: function (fn) { return !!(state.bridge && state.bridge.ready && state.bridge.has(fn)); },
    engineReady: function () { return !!(state.bridge && state.bridge.ready); },
    analysis: function () { return state.analysis; },
    focusX: function () { return state.focus >= 0 && state.analysis ? xOf(state.analysis.codes[state.focus]) : null; },
    focusDetail: function () { return state.focusDetail; },
    gallery: function () { return gallery.slice(); },
    sheet: function () { return currentSheet; },
    showSheet: showSheet,
    presenting: function () { return document.body.dataset.mode === "present"; },
    on: function (what, fn) { hooks[what].push(fn); }
  };

  // A read-only window for tests and for the curious: the current scenario text and analysis.
  window.SpanwrightView = view;
  window.Spanwright = {
    scenarioText: function () { return text(); },
    engine: function () { return state.engine; },
    focus: function () { return state.focus >= 0 && state.analysis ? xOf(state.analysis.codes[state.focus]) : null; },
    summary: function () { return state.analysis ? JSON.stringify(state.analysis.result) : null; }
  };

  boot();
})();
