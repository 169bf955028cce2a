/*
 * Spanwright page: the network editor. The drawing (SwGraphView, P.drawing) with its tools and
 * hover caption, the Selection editor, the edge table, and the edits of vertices and edges (each
 * an undoable commit). The parts are shared through self.SwPage (see app-state.js).
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const P = self.SwPage;
  const state = P.state;
  const $ = function (id) { return document.getElementById(id); };

  // ------------------------------------------------------------------ edge controls

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
        P.notify("A weight is a resistance: a finite number greater than 0. '" + inp.value + "' was not applied.", "error");
        inp.value = String(current === undefined ? 1 : current);
        return;
      }
      onChange(w);
    });
    return inp;
  }

  /** Sets one key of one edge as an undoable edit; undefined removes the key. */
  function setEdge(id, field, value) {
    P.commit(function (sc) {
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

  // ------------------------------------------------------------------ edge table, selection editor

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

  // ------------------------------------------------------------------ vertex and edge edits

  function renameVertex(from, to) {
    if (!to || to === from) return;
    if (state.scenario.graph.vertices.some(function (v) { return v.id === to; })) { P.notify("There is already a vertex named '" + to + "'.", "error"); renderSelection(); return; }
    P.commit(function (sc) {
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
    P.commit(function (sc) {
      const g = sc.graph;
      if (sel.kind === "edge") {
        const n = g.edges.length;
        g.edges = g.edges.filter(function (e) { return e.id !== sel.id; });
        return g.edges.length !== n;
      }
      if (sel.id === g.s || sel.id === g.t) { P.notify("Vertex '" + sel.id + "' is " + (sel.id === g.s ? "s" : "t") + "; make another vertex " + (sel.id === g.s ? "s" : "t") + " before deleting it.", "error"); return false; }
      g.vertices = g.vertices.filter(function (v) { return v.id !== sel.id; });
      g.edges = g.edges.filter(function (e) { return e.u !== sel.id && e.v !== sel.id; });
    });
    state.selection = null;
    renderSelection();
  }

  function setRole(role) {
    const sel = state.selection;
    if (!sel || sel.kind !== "vertex") { P.notify("Select a vertex first, then press Set " + role + ".", "info"); return; }
    const other = role === "s" ? state.scenario.graph.t : state.scenario.graph.s;
    if (sel.id === other) { P.notify("s and t must be different vertices.", "error"); return; }
    P.commit(function (sc) { sc.graph[role] = sel.id; });
  }

  // ------------------------------------------------------------------ the drawing

  const view = new self.SwGraphView($("graph"), {
    addVertex: function (pos) {
      P.commit(function (sc) {
        const id = P.freshId("v", sc.graph.vertices.map(function (v) { return v.id; }));
        sc.graph.vertices.push({ id: id, x: Math.round(pos.x), y: Math.round(pos.y) });
        state.selection = { kind: "vertex", id: id };
      });
    },
    addEdge: function (u, v) {
      P.commit(function (sc) {
        const id = P.freshId("e", sc.graph.edges.map(function (e) { return e.id; }));
        sc.graph.edges.push({ id: id, u: u, v: v, when: sc.variables.length ? sc.variables[0] : "1", weight: 1 });
        state.selection = { kind: "edge", id: id };
      });
    },
    moveVertex: function (id, x, y) {
      P.commit(function (sc) {
        const v = sc.graph.vertices.find(function (q) { return q.id === id; });
        if (!v) return false;
        v.x = Math.round(x); v.y = Math.round(y);
      }, { analyse: false, redraw: false });
    },
    select: function (sel) { state.selection = sel; renderSelection(); },
    partial: function (on) { $("graph-part").hidden = !on; },
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
    P.commit(function (sc) { sc.graph.vertices.forEach(function (v) { if (pos[v.id]) { v.x = pos[v.id].x; v.y = pos[v.id].y; } }); }, { analyse: false });
  });

  $("fit-view").addEventListener("click", function () { view.wholeGraph(); });

  /** Wide drawing: the right column (results and inputs) hidden, the drawing on the whole width. */
  function toggleSides() {
    const wide = document.body.dataset.sides !== "hidden";
    document.body.dataset.sides = wide ? "hidden" : "shown";
    const b = $("toggle-sides");
    b.setAttribute("aria-pressed", wide ? "true" : "false");
    b.textContent = wide ? "⇤ Panels" : "⇥ Wide";
    view.cy.resize();
    view.fit();
  }
  $("toggle-sides").addEventListener("click", toggleSides);

  Object.assign(P, {
    toggleSides: toggleSides,
    drawing: view, renderEdgeTable: renderEdgeTable, renderSelection: renderSelection, deleteElement: deleteElement
  });
})();
