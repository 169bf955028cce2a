/*
 * Spanwright page, first of the app-*.js scripts: the page state and the one owner of the
 * scenario. Only this file puts a scenario in place or touches the undo and redo stacks; every
 * edit elsewhere goes through commit(), undo(), redo(), setScenario() or openScenario().
 *
 * The app-*.js scripts share their parts through self.SwPage (P below), loaded in this order:
 * state, network, fields, summary, inputs, focus, files, shell (the last one starts the page).
 * A part of another file is always called as P.name(...), so it may be defined in a file loaded
 * later. The panels in the other page scripts use only self.SwApp (made in app-shell.js).
 *
 * Every number shown comes from the engine (TeaVM-compiled core) through the worker bridge;
 * these files only arrange and draw. Every user string is put on the page with textContent or as
 * a form value, never as HTML.
 */
(function () {
  "use strict";
  const $ = function (id) { return document.getElementById(id); };
  const P = self.SwPage = {};

  const HISTORY_LIMIT = 300;

  /* Who writes what: scenario, undo and redo only this file; bridge, engine and display
   * app-shell.js; job app-shell.js and app-summary.js; analysis, serial and firstRenderMs
   * app-summary.js; view app-inputs.js; focus app-focus.js (app-summary.js clears it before it
   * finds the input again in a new analysis); focusDetail and detailSerial app-focus.js;
   * selection app-network.js and openScenario() here; pristine only this file. */
  const state = {
    scenario: null,        // the scenario object (format v1)
    undo: [], redo: [],    // JSON texts
    pristine: null,        // the text of a bundled scenario as it was opened, until it is edited
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
    pushUndo(before);
    state.redo = [];
    setScenario(next, { analyse: opts.analyse !== false, redraw: opts.redraw !== false });
    return true;
  }

  /** One step on the undo stack, which keeps the newest HISTORY_LIMIT steps. */
  function pushUndo(before) {
    state.undo.push(before);
    while (state.undo.length > HISTORY_LIMIT) state.undo.shift();
  }

  function undo() {
    if (!state.undo.length) return;
    state.redo.push(text());
    setScenario(JSON.parse(state.undo.pop()), { analyse: true, redraw: true });
  }
  function redo() {
    if (!state.redo.length) return;
    pushUndo(text());
    setScenario(JSON.parse(state.redo.pop()), { analyse: true, redraw: true });
  }

  /** Puts a scenario opened from somewhere (file, gallery, link, builder) in place of the work.
   *  The replaced scenario becomes an undo step and is offered to P.keepReplaced (which keeps the
   *  user's own work across reloads); nothing stays selected. opts.pristine: the opened scenario
   *  is a bundled one as it comes (so replacing it later loses nothing). Returns whether the
   *  replaced scenario was kept as the user's own work. */
  function openScenario(obj, opts) {
    opts = opts || {};
    let kept = false;
    if (state.scenario) {
      const before = text();
      pushUndo(before);
      state.redo = [];
      if (before !== state.pristine) kept = P.keepReplaced(before, opts.why || "replaced");
    }
    state.selection = null;
    setScenario(obj, { analyse: true, redraw: true, fit: true });
    state.pristine = opts.pristine ? text() : null;
    P.autosave();   // again, now that it is known whether this is a bundled scenario as it came
    return kept;
  }

  /** The page's first scenario: no undo step; pristine unless it is the user's autosaved work. */
  function startScenario(obj, pristine) {
    setScenario(obj, { analyse: false, redraw: true, fit: true });
    state.pristine = pristine ? text() : null;
    P.autosave();
  }

  function setScenario(sc, opts) {
    state.scenario = normalise(sc);
    P.autosave();
    P.renderForms();
    if (opts.redraw !== false) {
      const missing = P.drawing.showScenario(state.scenario);
      if (missing) {
        const pos = P.drawing.arrange();
        state.scenario.graph.vertices.forEach(function (v) { if (pos[v.id]) { v.x = pos[v.id].x; v.y = pos[v.id].y; } });
        P.autosave();
      }
      if (opts.fit) P.drawing.fit();
      P.reapplyFocus();
    }
    P.renderSelection();
    updateUndoButtons();
    if (opts.analyse) P.scheduleAnalysis();
    hooks.scenario.forEach(function (h) { h(); });
  }

  function updateUndoButtons() {
    $("undo").disabled = !state.undo.length;
    $("redo").disabled = !state.redo.length;
  }

  $("undo").addEventListener("click", undo);
  $("redo").addEventListener("click", redo);

  Object.assign(P, {
    state: state, hooks: hooks, notify: notify,
    normalise: normalise, text: text, freshId: freshId,
    commit: commit, undo: undo, redo: redo, openScenario: openScenario, startScenario: startScenario, setScenario: setScenario,
    historyLimit: HISTORY_LIMIT
  });
})();
