/*
 * Spanwright page: the scenario's fields. Title, function f, promise, notes and the list of
 * variables, shown from the scenario and applied back as undoable edits (a rename goes through
 * the engine). The parts are shared through self.SwPage (see app-state.js).
 */
(function () {
  "use strict";
  const P = self.SwPage;
  const state = P.state;
  const $ = function (id) { return document.getElementById(id); };

  const TYPING_PAUSE_MS = 900;   // a pause in typing this long applies a text field

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
    setValue($("function"), functionToText(sc.function));
    setValue($("promise"), promiseToText(sc.promise));
    setValue($("notes"), sc.notes || "");
    renderVariables();
    P.renderEdgeTable();
  }
  // The connectivity form {"connects": …} has no expression text: the field shows it in words and
  // keeps the object while those words are left as they are; typing an expression replaces it.
  const OWN_GRAPH_WORDS = "s–t connectivity of this graph";
  const LISTED_GRAPH_WORDS = "s–t connectivity of the listed host graph";
  function functionToText(f) {
    if (f && typeof f === "object" && f.connects !== undefined) return f.connects === "graph" ? OWN_GRAPH_WORDS : LISTED_GRAPH_WORDS;
    return f || "";
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
      P.commit(function (sc) {
        const letters = "abcdefghijklmnopqrstuvwxyz";
        let name = null;
        for (let i = 0; i < letters.length && !name; i++) if (sc.variables.indexOf(letters[i]) < 0) name = letters[i];
        sc.variables.push(name || P.freshId("x", sc.variables));
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
    const before = P.text();
    state.bridge.call("renameVariable", before, from, to).then(function (r) {
      if (!r.ok) {
        const err = r.error || {};
        P.notify("Could not rename variable '" + from + "' to '" + to + "': " + (err.message || "the engine refused") +
          (err.path ? " (at " + err.path + ")" : "") + ". Nothing was changed.", "error");
        renderVariables();
        return;
      }
      if (P.text() !== before) {
        P.notify("The scenario changed while '" + from + "' was being renamed, so the rename was not applied. Try again.", "error");
        renderVariables();
        return;
      }
      let next;
      try { next = JSON.parse(r.scenario); } catch (e) { P.notify("The engine's renamed scenario was unreadable; nothing was changed.", "error"); renderVariables(); return; }
      P.commit(function () { return next; });
      document.body.dataset.renamed = to;
    });
  }

  function removeVariable(i) {
    const name = state.scenario.variables[i];
    const users = state.scenario.graph.edges.filter(function (e) { return e.when === name || e.when === "!" + name; }).map(function (e) { return e.id; });
    if (users.length) { P.notify("Variable '" + name + "' is still used by edge(s) " + users.join(", ") + "; change those first.", "error"); return; }
    P.commit(function (sc) { sc.variables.splice(i, 1); });
  }

  // ------------------------------------------------------------------ fields → scenario

  $("title").addEventListener("change", function () { const v = $("title").value; P.commit(function (sc) { sc.title = v; }, { analyse: false }); });
  $("notes").addEventListener("change", function () { const v = $("notes").value; P.commit(function (sc) { sc.notes = v; }, { analyse: false }); });
  $("function").addEventListener("change", function () {
    const v = $("function").value.trim();
    P.commit(function (sc) {
      if (v && v === functionToText(sc.function)) return; // the words of the connectivity form: unchanged
      if (v) sc.function = v; else delete sc.function;
    });
  });
  $("promise").addEventListener("change", function () { const v = textToPromise($("promise").value); P.commit(function (sc) { sc.promise = v; }); });
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

  P.renderForms = renderForms;
})();
