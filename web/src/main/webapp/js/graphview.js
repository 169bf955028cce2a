/*
 * The network drawing (Cytoscape.js). Shows the scenario's graph; in focus it shows one input:
 * present edges solid, absent dashed; currents (width, arrow) or potentials (colour ramp).
 * Meaning is always carried by shape, line style or text as well as colour.
 *
 * Palette (colour-blind safe, lightness-separated): plain literal edges dark blue, negated
 * literal edges orange-brown, always-present edges grey; s and t black-bordered with their own
 * shapes (s: diamond, t: square) and labels.
 */
(function () {
  "use strict";
  const F = self.SwFormat;

  const COLOR_POS = "#1f5fa8";
  const COLOR_NEG = "#b8620a";
  const COLOR_ONE = "#6b6b6b";
  const COLOR_ABSENT = "#9a9a9a";

  function edgeColor(when) {
    if (when === "1") return COLOR_ONE;
    return when.charAt(0) === "!" ? COLOR_NEG : COLOR_POS;
  }

  function GraphView(container, handlers) {
    this.handlers = handlers;
    this.tool = "move";
    this.pendingSource = null;
    this.scale = 1;        // 1 normal, larger in presentation mode
    this.cy = cytoscape({
      container: container,
      boxSelectionEnabled: false,
      minZoom: 0.2,
      maxZoom: 4,
      style: this.style(),
      elements: []
    });
    const cy = this.cy;
    const self_ = this;
    cy.on("tap", function (ev) {
      if (ev.target === cy) {
        if (self_.tool === "vertex") { handlers.addVertex(ev.position); }
        else { self_.clearPending(); handlers.select(null); }
        return;
      }
      const el = ev.target;
      if (self_.tool === "edge" && el.isNode()) {
        if (!self_.pendingSource) { self_.pendingSource = el.id(); el.addClass("pending"); return; }
        const from = self_.pendingSource;
        self_.clearPending();
        if (from !== el.id()) handlers.addEdge(from, el.id());
        return;
      }
      handlers.select({ kind: el.isNode() ? "vertex" : "edge", id: el.id() });
    });
    cy.on("dragfree", "node", function (ev) {
      const p = ev.target.position();
      handlers.moveVertex(ev.target.id(), p.x, p.y);
    });
    cy.on("mouseover", "edge", function (ev) { handlers.hover({ kind: "edge", id: ev.target.id() }); });
    cy.on("mouseover", "node", function (ev) { handlers.hover({ kind: "vertex", id: ev.target.id() }); });
    cy.on("mouseout", function () { handlers.hover(null); });
  }

  GraphView.prototype.clearPending = function () {
    if (this.pendingSource) {
      const n = this.cy.getElementById(this.pendingSource);
      if (n) n.removeClass("pending");
    }
    this.pendingSource = null;
  };

  GraphView.prototype.setTool = function (tool) { this.tool = tool; this.clearPending(); };

  GraphView.prototype.style = function () {
    const k = this.scale || 1;
    return [
      { selector: "node", style: {
        "label": "data(label)", "text-valign": "center", "text-halign": "center",
        "font-size": 13 * k, "font-family": "system-ui, sans-serif", "color": "#111",
        "background-color": "#f4f4f4", "border-width": 1.5 * k, "border-color": "#333",
        "width": 34 * k, "height": 34 * k, "text-wrap": "wrap", "text-max-width": 120 * k,
        "text-background-color": "#fff", "text-background-opacity": 0
      } },
      { selector: "node.role-s", style: { "shape": "diamond", "width": 46 * k, "height": 46 * k, "border-width": 3 * k, "font-weight": "bold" } },
      { selector: "node.role-t", style: { "shape": "rectangle", "width": 38 * k, "height": 38 * k, "border-width": 3 * k, "font-weight": "bold" } },
      { selector: "node.ramp", style: { "background-color": "data(fill)", "color": "data(ink)" } },
      { selector: "node.wide-label", style: { "text-valign": "bottom", "text-margin-y": 4 * k, "text-background-opacity": 0.85, "text-background-padding": 2 } },
      { selector: "node.ramp.wide-label", style: { "color": "#111" } },
      // dense drawings: a vertex's label sits off its lower right corner, clear of the edges along
      // the rows and columns of a grid (whose absent, dashed edges would otherwise hide under it)
      { selector: "node.wide-label.dense", style: { "text-valign": "bottom", "text-halign": "right", "text-margin-x": -6 * k, "text-margin-y": -2 * k,
        "text-background-opacity": 0.6, "text-justification": "left" } },
      { selector: "node:selected", style: { "overlay-color": "#000", "overlay-opacity": 0.15, "border-style": "double", "border-width": 5 * k } },
      { selector: "node.pending", style: { "border-style": "dotted", "border-width": 5 * k } },
      { selector: "edge", style: {
        "curve-style": "bezier", "control-point-step-size": 36 * k,
        "width": 2.5 * k, "line-color": "data(color)", "label": "data(shown)",
        "font-size": "data(fs)", "text-margin-x": "data(mx)", "text-margin-y": "data(my)", "color": "#111", "text-background-color": "#fff",
        "text-wrap": "wrap", "text-max-width": 2000, "line-height": 1.1,
        "text-background-opacity": 0.85, "text-background-padding": 2 * k,
        "target-arrow-color": "data(color)", "source-arrow-color": "data(color)",
        "arrow-scale": 1.1 * k
      } },
      { selector: "edge.absent", style: { "line-style": "dashed", "line-dash-pattern": [6 * k, 5 * k], "line-color": COLOR_ABSENT, "width": 2 * k } },
      { selector: "edge.flow", style: { "width": "data(flowWidth)", "arrow-scale": 0.55 } },
      { selector: "edge.fwd", style: { "target-arrow-shape": "triangle" } },
      { selector: "edge.back", style: { "source-arrow-shape": "triangle" } },
      { selector: "edge:selected", style: { "overlay-color": "#000", "overlay-opacity": 0.18, "overlay-padding": 4 } }
    ];
  };

  GraphView.prototype.setScale = function (k) {
    this.scale = k;
    this.cy.style(this.style());
    this.placeLabels();
  };

  const BODY_BOX = { includeNodes: true, includeEdges: false, includeLabels: false, includeOverlays: false,
    includeUnderlays: false, includeOutlines: false, useCache: false };
  const NODE_LABEL_BOX = { includeNodes: false, includeEdges: false, includeLabels: true, includeMainLabels: true,
    includeOverlays: false, includeUnderlays: false, includeOutlines: false, useCache: false };
  const EDGE_LABEL_BOX = { includeNodes: false, includeEdges: false, includeLabels: true, includeMainLabels: true,
    includeSourceLabels: false, includeTargetLabels: false, includeOverlays: false, includeUnderlays: false,
    includeOutlines: false, useCache: false };
  const LABEL_GAP = 2;   // model units kept free around a label
  const DENSE_EDGES = 30; // from this many edges, labels that do not fit are cut down (placeLabels)
  const READABLE_PX = 11; // the smallest label size on screen, in CSS pixels

  function overlap(a, b, gap) {
    const w = Math.min(a.x2, b.x2) - Math.max(a.x1, b.x1) + gap;
    const h = Math.min(a.y2, b.y2) - Math.max(a.y1, b.y1) + gap;
    return w > 0 && h > 0 ? w * h : 0;
  }

  /**
   * Places edge labels clear of the vertices. Each edge label (its parts joined by " · ") is tried
   * on one line, on two lines (the last part below), with one part per line, at the middle of the
   * edge and then moved a fifth of its length towards either end, at full size and then smaller
   * (down to 60 %). A label may never cover a vertex where any try avoids it; it may touch a vertex label or an
   * edge label placed before it by at most 3 % of its area (label boxes include their padding).
   * The first try that fits is kept, or else the one that overlaps least. Measured with the
   * drawing's own label boxes, in model coordinates, so the result does not depend on zoom.
   * A drawing of DENSE_EDGES edges or more whose labels do not all fit shows less rather than a
   * pile of overlapping text: the conditions alone (no weights or focus values), and if those do not
   * fit either, no edge labels (the hover caption and the edge list still give every edge's
   * condition, weight and current); labelLevel ("full", "literal", "none") says which, and
   * labelNote() says it in words for the legend. Skipped above 400 edges, where the labels are
   * unreadable anyway.
   */
  GraphView.prototype.placeLabels = function () {
    const cy = this.cy;
    const k = this.scale || 1;
    const full = 12 * k;
    const edges = cy.edges();
    if (edges.length > 400) {
      cy.batch(function () { edges.forEach(function (e) { e.data({ shown: "", fs: full, mx: 0, my: 0 }); }); });
      this.labelLevel = "none";
      cy.container().dataset.edgeLabels = "none";
      return;
    }
    const dense = edges.length >= DENSE_EDGES;
    cy.nodes().toggleClass("dense", dense);
    const hard = [], soft0 = [];
    cy.nodes().forEach(function (n) {
      hard.push(n.boundingBox(BODY_BOX));
      if (n.data("label")) { const b = n.boundingBox(NODE_LABEL_BOX); if (b.w > 0 && b.h > 0) soft0.push(b); }
    });
    // quick: a level that will be given up (any crowded label) stops at its first crowded label
    const place = function (level, quick) {
      const soft = soft0.slice();
      let crowded = 0;
      edges.forEach(function (e) {
        if (quick && crowded) return;
        const label = level === "full" ? String(e.data("label") || "") : level === "literal" ? String(e.data("lit") || "") : "";
        if (!label) { e.data({ shown: "", fs: full, mx: 0, my: 0 }); return; }
        const parts = label.split(" · ");
        const shapes = [label];
        if (parts.length > 2) shapes.push(parts.slice(0, -1).join(" · ") + "\n" + parts[parts.length - 1]);
        if (parts.length > 1) shapes.push(parts.join("\n"));
        let best = null;
        // a dense drawing would have to zoom in far for small labels: there it shows fewer instead
        const sizes = dense ? [1, 0.85] : [1, 0.85, 0.72, 0.6];
        const a = e.source().position(), b = e.target().position();
        const dx = (b.x - a.x) * 0.2, dy = (b.y - a.y) * 0.2;
        const shifts = e.isLoop() ? [[0, 0]] : [[0, 0], [dx, dy], [-dx, -dy]];
        for (let i = 0; i < sizes.length && !(best && best.fits); i++) {
          for (let j = 0; j < shapes.length && !(best && best.fits); j++) {
            for (let m = 0; m < shifts.length; m++) {
              const t = { shown: shapes[j], fs: full * sizes[i], mx: shifts[m][0], my: shifts[m][1] };
              e.data(t);
              const box = e.boundingBox(EDGE_LABEL_BOX);
              let h = 0, so = 0;
              for (let q = 0; q < hard.length; q++) h += overlap(box, hard[q], LABEL_GAP);
              for (let q = 0; q < soft.length; q++) so += overlap(box, soft[q], 0);
              const fits = h === 0 && so <= 0.03 * box.w * box.h;
              // a label that covers no vertex beats one that does, however crowded it is
              const cost = (h > 0 ? 1e12 : 0) + 10 * h + so;
              if (!best || (fits && !best.fits) || (!best.fits && cost < best.cost)) best = { t: t, box: box, cost: cost, fits: fits };
              if (fits) break;
            }
          }
        }
        if (!best) return;
        e.data(best.t);
        if (!best.fits) crowded++;
        soft.push(best.box);
      });
      return crowded;
    };
    const levels = dense ? ["full", "literal", "none"] : ["full"];
    let level = levels[0], crowded = 0;
    for (let i = 0; i < levels.length; i++) {
      level = levels[i];
      crowded = place(level, i < levels.length - 1);
      if (crowded === 0) break;
    }
    this.labelLevel = level;
    cy.container().dataset.edgeLabels = level;
    cy.container().dataset.crowdedLabels = String(crowded);
    this.keepReadable(false);
  };

  /** The legend's words for what the edge labels leave out (see placeLabels), or "". */
  GraphView.prototype.labelNote = function () {
    const w = this.commonWeight === null || this.commonWeight === undefined ? "" : " · every edge has weight w = " + F.num(this.commonWeight);
    if (this.labelLevel === "none") return " · edge labels hidden at this size: hover an edge" + w;
    if (this.labelLevel === "literal") return " · edge labels: conditions only at this size (hover an edge for the rest)" + w;
    return w;
  };

  function vertexLabel(id, s, t) {
    if (id === s) return id === "s" ? "s" : id + "\n(s)";
    if (id === t) return id === "t" ? "t" : id + "\n(t)";
    return id;
  }

  /** The condition, and the weight unless it is 1 or every edge has the same one (said once in
   *  the legend instead: labelNote). */
  function edgeLabel(e, commonWeight) {
    const w = e.weight === undefined || e.weight === null ? 1 : e.weight;
    return String(e.when) + (w === 1 || w === commonWeight ? "" : " · w=" + F.num(w));
  }

  /** Draws the scenario's graph (positions from the scenario; missing ones by a layout). */
  GraphView.prototype.showScenario = function (scenario) {
    const g = scenario.graph;
    const cy = this.cy;
    const els = [];
    let missing = false;
    g.vertices.forEach(function (v, i) {
      const hasPos = typeof v.x === "number" && typeof v.y === "number";
      if (!hasPos) missing = true;
      const cls = (v.id === g.s ? "role-s" : v.id === g.t ? "role-t" : "") + (String(v.id).length > 3 ? " wide-label" : "");
      els.push({ group: "nodes", data: { id: v.id, label: vertexLabel(v.id, g.s, g.t) },
        position: hasPos ? { x: v.x, y: v.y } : { x: 80 * i, y: 0 }, classes: cls });
    });
    const self_ = this;
    // one weight shared by every edge (other than 1) is said once, in the legend
    const weights = g.edges.map(function (e) { return e.weight === undefined || e.weight === null ? 1 : e.weight; });
    const common = weights.length > 1 && weights[0] !== 1 && weights.every(function (w) { return w === weights[0]; }) ? weights[0] : null;
    this.commonWeight = common;
    g.edges.forEach(function (e) {
      const label = edgeLabel(e, common);
      els.push({ group: "edges", data: { id: e.id, source: e.u, target: e.v, label: label, color: edgeColor(String(e.when)), base: label,
        lit: String(e.when), shown: label, fs: 12 * (self_.scale || 1), mx: 0, my: 0 } });
    });
    const selected = cy.$(":selected").map(function (x) { return x.id(); });
    cy.batch(function () {
      cy.elements().remove();
      cy.add(els.filter(function (x) { return x.group === "nodes"; }));
      // Edges whose ends are unknown are left out of the drawing; validation names them.
      cy.add(els.filter(function (x) { return x.group === "edges" && cy.getElementById(x.data.source).length && cy.getElementById(x.data.target).length; }));
      selected.forEach(function (id) { const el = cy.getElementById(id); if (el.length) el.select(); });
    });
    this.focus = null;
    if (!missing) this.placeLabels();
    return missing;
  };

  /** Runs an automatic layout and returns the new positions {id: {x, y}}. */
  GraphView.prototype.arrange = function () {
    const cy = this.cy;
    cy.layout({ name: "breadthfirst", directed: false, spacingFactor: 1.2, animate: false,
      roots: cy.nodes(".role-s").length ? cy.nodes(".role-s") : undefined }).run();
    const out = {};
    cy.nodes().forEach(function (n) { const p = n.position(); out[n.id()] = { x: Math.round(p.x), y: Math.round(p.y) }; });
    cy.fit(undefined, 30);
    this.placeLabels();
    return out;
  };

  /** Shows the graph: the whole of it if its labels stay readable that way, else as much as fits
   *  with readable labels (see keepReadable), starting from its top left. */
  GraphView.prototype.fit = function () {
    this.whole = false;
    this.cy.fit(undefined, 30 * (this.scale || 1));
    if (this.cy.zoom() > 1.6) { this.cy.zoom(1.6); this.cy.center(); }
    this.keepReadable(true);
  };

  /** The whole graph in view however small its labels get, until the next fit(). */
  GraphView.prototype.wholeGraph = function () {
    this.whole = true;
    this.cy.fit(undefined, 20 * (this.scale || 1));
    this.cy.container().dataset.readable = "whole graph";
    if (this.handlers.partial) this.handlers.partial(false);
  };

  /** The smallest label of the drawing in model units (edge labels as placed, vertex labels). */
  GraphView.prototype.smallestLabel = function () {
    let m = Infinity;
    this.cy.edges().forEach(function (e) { if (e.data("shown")) m = Math.min(m, Number(e.data("fs")) || Infinity); });
    this.cy.nodes().forEach(function (n) { if (n.data("label")) m = Math.min(m, px(n.style("font-size"), Infinity)); });
    return m;
  };

  /**
   * Zooms in (never out) until every label is at least READABLE_PX high on screen; the rest of the
   * graph is then reached by dragging the background or the wheel, or "whole graph". After a fit
   * the view starts at the graph's top left (centred along a side that fits), where a tree's root
   * and a left-to-right network's s are. Skipped above 400 edges (labels off anyway), or after
   * wholeGraph().
   */
  GraphView.prototype.keepReadable = function (fromFit) {
    const cy = this.cy;
    if (this.whole || !cy.nodes().length || cy.edges().length > 400 || !(cy.width() > 0)) return;
    const smallest = this.smallestLabel();
    if (!isFinite(smallest)) return;
    const need = Math.min(cy.maxZoom(), READABLE_PX / smallest);
    const self_ = this;
    const mark = function () {
      const r = cy.elements().renderedBoundingBox({ includeLabels: true, includeOverlays: false });
      const whole = r.x1 >= -1 && r.y1 >= -1 && r.x2 <= cy.width() + 1 && r.y2 <= cy.height() + 1;
      cy.container().dataset.readable = whole ? "fits" : "part";
      if (self_.handlers.partial) self_.handlers.partial(!whole);
    };
    if (cy.zoom() >= need - 1e-9) { mark(); return; }
    if (fromFit) {
      const bb = cy.elements().boundingBox({ includeLabels: true, includeOverlays: false });
      const W = cy.width(), H = cy.height(), pad = 16 * (this.scale || 1);
      const x = bb.w * need + 2 * pad <= W ? (W - bb.w * need) / 2 - bb.x1 * need : pad - bb.x1 * need;
      const y = bb.h * need + 2 * pad <= H ? (H - bb.h * need) / 2 - bb.y1 * need : pad - bb.y1 * need;
      cy.viewport({ zoom: need, pan: { x: x, y: y } });
    } else {
      cy.zoom({ level: need, renderedPosition: { x: cy.width() / 2, y: cy.height() / 2 } });
    }
    mark();
  };

  /** Clears focus styling: every edge solid with its condition label. */
  GraphView.prototype.clearFocus = function () {
    const cy = this.cy;
    this.focusInfo = null;
    cy.batch(function () {
      cy.edges().removeClass("absent flow fwd back").forEach(function (e) { e.data("label", e.data("base")); });
      cy.nodes().removeClass("ramp");
    });
    this.restoreVertexLabels();
    this.placeLabels();
  };

  GraphView.prototype.restoreVertexLabels = function () {
    const s = this.cy.nodes(".role-s").id();
    const t = this.cy.nodes(".role-t").id();
    this.cy.nodes().forEach(function (n) { n.data("label", vertexLabel(n.id(), s, t)); });
  };

  /**
   * Shows one input's witness. detail: the engine's answer for that input; view: "flow" or
   * "potential". Positive input + flow: width ∝ |current|, arrow along the current, current in
   * the label, potentials in vertex labels. Otherwise: potentials as a colour ramp; on a negative
   * input the absent edges carry their energy.
   */
  GraphView.prototype.showFocus = function (detail, view) {
    const cy = this.cy;
    const k = this.scale || 1;
    this.restoreVertexLabels();
    const pot = detail.potentials || {};
    let pmin = Infinity, pmax = -Infinity;
    Object.keys(pot).forEach(function (id) { const p = pot[id]; if (typeof p === "number" && isFinite(p)) { pmin = Math.min(pmin, p); pmax = Math.max(pmax, p); } });
    const span = pmax > pmin ? pmax - pmin : 1;
    const positive = !!detail.connected;
    const useRamp = !positive || view === "potential";
    const byId = {};
    (detail.edges || []).forEach(function (e) { byId[e.id] = e; });
    cy.batch(function () {
      cy.edges().forEach(function (el) {
        const d = byId[el.id()];
        el.removeClass("absent flow fwd back");
        if (!d) { el.data("label", el.data("base")); return; }
        if (!d.present) {
          el.addClass("absent");
          const energy = typeof d.energy === "number" && !positive ? " · E=" + F.num(d.energy) : "";
          el.data("label", el.data("base") + energy);
          return;
        }
        if (positive && view !== "potential") {
          const c = typeof d.current === "number" ? d.current : 0;
          el.addClass("flow");
          el.data("flowWidth", (1.5 + 10 * Math.min(1, Math.abs(c))) * Math.sqrt(k));
          if (c > 1e-12) el.addClass("fwd"); else if (c < -1e-12) el.addClass("back");
          el.data("label", el.data("base") + " · i=" + F.num(Math.abs(c)));
        } else {
          el.data("label", el.data("base"));
        }
      });
      cy.nodes().forEach(function (n) {
        const p = pot[n.id()];
        const base = n.data("label");
        if (typeof p === "number") n.data("label", base + "\n" + "φ=" + F.num(p));
        if (useRamp && typeof p === "number") {
          const t = (p - pmin) / span;
          n.addClass("ramp");
          n.data("fill", F.ramp(t));
          n.data("ink", F.rampText(t));
        } else {
          n.removeClass("ramp");
        }
      });
    });
    this.placeLabels();
    this.focusInfo = { useRamp: useRamp, pmin: pmin, pmax: pmax, positive: positive, flow: positive && view !== "potential" };
    return this.focusInfo;
  };

  /**
   * The caption and colour key of an exported figure, as items in figure units (one unit = one
   * model unit of the drawing), the same for the SVG and the PNG: the page's caption lines
   * ({role, text}: title, input, value, bound, normalisation, caution), then a key of what the
   * drawing uses: the line colour of each kind of literal present, dashed absent edges and the
   * current's width and arrow when an input is in focus, the shapes of s and t, and the potential
   * ramp with its end values when vertices are coloured. Returns {items, width, height}.
   */
  GraphView.prototype.captionLayout = function (lines, minWidth) {
    const items = [];
    const size = 13, lh = 19;
    const est = function (t, sz) { return String(t).length * 0.56 * sz; };
    let y = 6, width = minWidth;
    (lines || []).forEach(function (l) {
      const sz = l.role === "title" ? 16 : size;
      y += l.role === "title" ? 22 : lh;
      items.push({ kind: "text", x: 0, y: y, text: l.text, size: sz, bold: l.role === "title" || l.role === "value", role: l.role, group: "caption" });
      width = Math.max(width, est(l.text, sz));
    });
    const colours = {};
    this.cy.edges().forEach(function (e) { colours[e.data("color")] = true; });
    const info = this.focusInfo;
    const entries = [];
    if (colours[COLOR_POS]) entries.push({ key: "literal", line: COLOR_POS, text: "literal a: present when a = 1" });
    if (colours[COLOR_NEG]) entries.push({ key: "negated", line: COLOR_NEG, text: "negated literal !a: present when a = 0" });
    if (colours[COLOR_ONE]) entries.push({ key: "always", line: COLOR_ONE, text: "always present (1)" });
    if (info) entries.push({ key: "absent", line: COLOR_ABSENT, dash: true, text: "dashed: absent in G(x)" });
    if (info && info.flow) entries.push({ key: "current", line: COLOR_POS, thick: true, text: "width ∝ |current|, arrow: direction of the unit current s→t" });
    entries.push({ key: "s", shape: "diamond", text: "s (source)" }, { key: "t", shape: "rect", text: "t (sink)" });
    y += 14;
    let x = 0, rowTop = y;
    entries.forEach(function (en) {
      const w = 34 + est(en.text, 12) + 18;
      if (x > 0 && x + w > width) { x = 0; rowTop += 22; }
      const cy_ = rowTop + 8;
      if (en.line) items.push({ kind: "line", x1: x, y1: cy_, x2: x + 28, y2: cy_, color: en.line, width: en.thick ? 7 : 2.5, dash: !!en.dash, arrow: !!en.thick, key: en.key, group: "key" });
      else items.push({ kind: "shape", shape: en.shape, x: x + 14, y: cy_, size: 14, key: en.key, group: "key" });
      items.push({ kind: "text", x: x + 34, y: cy_ + 4, text: en.text, size: 12, key: en.key, group: "key" });
      x += w;
    });
    y = rowTop + 22;
    if (info && info.useRamp && isFinite(info.pmin)) {
      const lo = "φ = " + F.num(info.pmin) + (info.positive ? "" : " (t side)");
      const hi = "φ = " + F.num(info.pmax) + (info.positive ? "" : " (s side)");
      items.push({ kind: "text", x: 0, y: y + 10, text: "vertex colour: potential", size: 12, key: "ramp", group: "key" });
      const rx = est("vertex colour: potential", 12) + 10;
      items.push({ kind: "text", x: rx, y: y + 10, text: lo, size: 12, key: "ramp-low", group: "key" });
      const bx = rx + est(lo, 12) + 8;
      items.push({ kind: "ramp", x: bx, y: y + 1, w: 160, h: 12, key: "ramp", group: "key" });
      items.push({ kind: "text", x: bx + 168, y: y + 10, text: hi, size: 12, key: "ramp-high", group: "key" });
      width = Math.max(width, bx + 168 + est(hi, 12));
      y += 22;
    }
    return { items: items, width: width, height: y + 6 };
  };

  function rampStops() {
    const out = [];
    for (let i = 0; i <= 10; i++) out.push({ at: i / 10, color: F.ramp(i / 10) });
    return out;
  }

  /** The drawing as a PNG (twice the screen resolution) with the caption and colour key below;
   *  a Promise of a Blob. */
  GraphView.prototype.png = function (lines) {
    const self_ = this;
    const k = 2;
    return this.cy.png({ full: true, scale: k, bg: "#ffffff", output: "blob-promise" }).then(function (blob) {
      return createImageBitmap(blob);
    }).then(function (img) {
      const pad = 12;
      const cap = self_.captionLayout(lines, (img.width / k) - 2 * pad);
      const canvas = document.createElement("canvas");
      canvas.width = Math.ceil(Math.max(img.width, (cap.width + 2 * pad) * k));
      canvas.height = Math.ceil(img.height + (cap.height + pad) * k);
      const ctx = canvas.getContext("2d");
      ctx.fillStyle = "#ffffff";
      ctx.fillRect(0, 0, canvas.width, canvas.height);
      ctx.drawImage(img, 0, 0);
      ctx.save();
      ctx.translate(pad * k, img.height);
      ctx.scale(k, k);
      cap.items.forEach(function (it) { drawItem(ctx, it); });
      ctx.restore();
      canvas.dataset.captionTop = String(img.height);
      return new Promise(function (resolve) { canvas.toBlob(function (b) { resolve({ blob: b, width: canvas.width, height: canvas.height, drawingHeight: img.height }); }, "image/png"); });
    });
  };

  function shapePath(ctx, it) {
    const h = it.size / 2;
    ctx.beginPath();
    if (it.shape === "diamond") { ctx.moveTo(it.x, it.y - h); ctx.lineTo(it.x + h, it.y); ctx.lineTo(it.x, it.y + h); ctx.lineTo(it.x - h, it.y); ctx.closePath(); }
    else ctx.rect(it.x - h * 0.85, it.y - h * 0.85, h * 1.7, h * 1.7);
  }

  function drawItem(ctx, it) {
    if (it.kind === "text") {
      ctx.fillStyle = "#111111";
      ctx.font = (it.bold ? "bold " : "") + it.size + "px system-ui, sans-serif";
      ctx.textBaseline = "alphabetic";
      ctx.fillText(it.text, it.x, it.y);
    } else if (it.kind === "line") {
      ctx.strokeStyle = it.color;
      ctx.lineWidth = it.width;
      ctx.setLineDash(it.dash ? [6, 5] : []);
      ctx.beginPath(); ctx.moveTo(it.x1, it.y1); ctx.lineTo(it.arrow ? it.x2 - 6 : it.x2, it.y2); ctx.stroke();
      ctx.setLineDash([]);
      if (it.arrow) { ctx.fillStyle = it.color; ctx.beginPath(); ctx.moveTo(it.x2 + 2, it.y2); ctx.lineTo(it.x2 - 8, it.y2 - 7); ctx.lineTo(it.x2 - 8, it.y2 + 7); ctx.closePath(); ctx.fill(); }
    } else if (it.kind === "shape") {
      shapePath(ctx, it);
      ctx.fillStyle = "#f4f4f4"; ctx.fill();
      ctx.strokeStyle = "#333333"; ctx.lineWidth = 2; ctx.stroke();
    } else if (it.kind === "ramp") {
      const g = ctx.createLinearGradient(it.x, 0, it.x + it.w, 0);
      rampStops().forEach(function (st) { g.addColorStop(st.at, st.color); });
      ctx.fillStyle = g;
      ctx.fillRect(it.x, it.y, it.w, it.h);
      ctx.strokeStyle = "#555555"; ctx.lineWidth = 1; ctx.strokeRect(it.x, it.y, it.w, it.h);
    }
  }

  /** One caption or key item as SVG (classes caption-line / key-swatch / key-text, never the
   *  drawing's own classes). */
  function svgItem(it, ox, oy) {
    const x = function (v) { return r2(v + ox); }, y = function (v) { return r2(v + oy); };
    const data = (it.role ? ' data-role="' + xml(it.role) + '"' : "") + (it.key ? ' data-key="' + xml(it.key) + '"' : "");
    if (it.kind === "text") {
      return '<text class="' + (it.group === "caption" ? "caption-line" : "key-text") + '"' + data + ' x="' + x(it.x) + '" y="' + y(it.y) + '" font-size="' + it.size +
        '" font-family="system-ui, sans-serif" fill="#111111"' + (it.bold ? ' font-weight="bold"' : "") + ">" + xml(it.text) + "</text>";
    }
    if (it.kind === "line") {
      let out = '<line class="key-swatch"' + data + ' x1="' + x(it.x1) + '" y1="' + y(it.y1) + '" x2="' + x(it.arrow ? it.x2 - 6 : it.x2) + '" y2="' + y(it.y2) + '" stroke="' + xml(it.color) +
        '" stroke-width="' + it.width + '"' + (it.dash ? ' stroke-dasharray="6 5"' : "") + "/>";
      if (it.arrow) out += '<polygon class="key-swatch"' + data + ' points="' + [it.x2 + 2, it.y2, it.x2 - 8, it.y2 - 7, it.x2 - 8, it.y2 + 7].map(function (v, i) { return i % 2 ? y(v) : x(v); }).join(" ") + '" fill="' + xml(it.color) + '"/>';
      return out;
    }
    if (it.kind === "shape") {
      const h = it.size / 2;
      if (it.shape === "diamond") return '<polygon class="key-swatch"' + data + ' points="' + [x(it.x), y(it.y - h), x(it.x + h), y(it.y), x(it.x), y(it.y + h), x(it.x - h), y(it.y)].join(" ") + '" fill="#f4f4f4" stroke="#333333" stroke-width="2"/>';
      return '<rect class="key-swatch"' + data + ' x="' + x(it.x - h * 0.85) + '" y="' + y(it.y - h * 0.85) + '" width="' + r2(h * 1.7) + '" height="' + r2(h * 1.7) + '" fill="#f4f4f4" stroke="#333333" stroke-width="2"/>';
    }
    if (it.kind === "ramp") {
      return '<rect class="key-swatch"' + data + ' x="' + x(it.x) + '" y="' + y(it.y) + '" width="' + it.w + '" height="' + it.h + '" fill="url(#sw-ramp)" stroke="#555555" stroke-width="1"/>';
    }
    return "";
  }

  function xml(t) {
    return String(t).replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
  }
  function px(v, fallback) { const x = parseFloat(v); return isFinite(x) ? x : fallback; }
  function r2(v) { return Math.round(v * 100) / 100; }

  /** Text lines centred in a label box taken from the drawing itself (model coordinates). */
  function svgLabel(out, text, box, fontPx, color, weight, background) {
    const lines = String(text || "").split("\n");
    if (!text || !(box.w > 0)) return;
    if (background) out.push('<rect x="' + r2(box.x1) + '" y="' + r2(box.y1) + '" width="' + r2(box.w) + '" height="' + r2(box.h) +
      '" fill="#ffffff" fill-opacity="0.85" class="label-back"/>');
    const lh = box.h / lines.length;
    lines.forEach(function (line, i) {
      out.push('<text x="' + r2((box.x1 + box.x2) / 2) + '" y="' + r2(box.y1 + lh * (i + 0.5)) + '" font-size="' + r2(fontPx) +
        '" font-family="system-ui, sans-serif" text-anchor="middle" dominant-baseline="central" fill="' + xml(color) + '"' +
        (weight === "bold" ? ' font-weight="bold"' : "") + ">" + xml(line) + "</text>");
    });
  }

  function arrowHead(out, tip, from, size, color) {
    const dx = tip.x - from.x, dy = tip.y - from.y, len = Math.hypot(dx, dy) || 1;
    const ux = dx / len, uy = dy / len;
    const bx = tip.x - ux * size, by = tip.y - uy * size;
    out.push('<polygon class="arrow" points="' + [tip.x, tip.y, bx - uy * size * 0.5, by + ux * size * 0.5, bx + uy * size * 0.5, by - ux * size * 0.5].map(r2).join(" ") +
      '" fill="' + xml(color) + '"/>');
  }

  /**
   * The drawing as it is shown (focus, currents, potentials, labels) as an SVG document for a
   * paper or slides. Written here from Cytoscape's own geometry (endpoints, control points, label
   * boxes): Cytoscape.js has no SVG output of its own and the one SVG extension is GPL-licensed.
   * Every string from the scenario is escaped, so names stay text.
   */
  GraphView.prototype.svg = function (title, lines) {
    const cy = this.cy;
    const bb = cy.elements().boundingBox({ includeLabels: true, includeOverlays: false });
    const pad = 12;
    const cap = this.captionLayout(lines || [], bb.w);
    const x0 = bb.x1 - pad, y0 = bb.y1 - pad, w = Math.max(1, Math.max(bb.w, cap.width) + 2 * pad), dh = Math.max(1, bb.h + 2 * pad);
    const h = dh + cap.height + pad;
    const out = [];
    out.push('<svg xmlns="http://www.w3.org/2000/svg" viewBox="' + [x0, y0, w, h].map(r2).join(" ") + '" width="' + r2(w) + '" height="' + r2(h) + '">');
    if (title) out.push("<title>" + xml(title) + "</title>");
    out.push('<defs><linearGradient id="sw-ramp">' + rampStops().map(function (st) { return '<stop offset="' + st.at + '" stop-color="' + st.color + '"/>'; }).join("") + "</linearGradient></defs>");
    out.push('<rect x="' + r2(x0) + '" y="' + r2(y0) + '" width="' + r2(w) + '" height="' + r2(h) + '" fill="#ffffff" class="background"/>');
    out.push('<g class="caption">' + cap.items.filter(function (it) { return it.group === "caption"; }).map(function (it) { return svgItem(it, x0 + pad, y0 + dh); }).join("") + "</g>");
    out.push('<g class="colour-key">' + cap.items.filter(function (it) { return it.group === "key"; }).map(function (it) { return svgItem(it, x0 + pad, y0 + dh); }).join("") + "</g>");
    const labels = [];
    cy.edges().forEach(function (e) {
      const a = e.sourceEndpoint(), b = e.targetEndpoint();
      const cps = (e.style("curve-style") === "bezier" && e.controlPoints && e.controlPoints()) || [];
      let d = "M " + r2(a.x) + " " + r2(a.y);
      if (cps.length === 1) d += " Q " + r2(cps[0].x) + " " + r2(cps[0].y) + " " + r2(b.x) + " " + r2(b.y);
      else if (cps.length > 1) {
        // Cytoscape joins several control points by quadratic pieces through their midpoints.
        for (let i = 0; i < cps.length - 1; i++) {
          const m = { x: (cps[i].x + cps[i + 1].x) / 2, y: (cps[i].y + cps[i + 1].y) / 2 };
          d += " Q " + r2(cps[i].x) + " " + r2(cps[i].y) + " " + r2(m.x) + " " + r2(m.y);
        }
        const last = cps[cps.length - 1];
        d += " Q " + r2(last.x) + " " + r2(last.y) + " " + r2(b.x) + " " + r2(b.y);
      } else d += " L " + r2(b.x) + " " + r2(b.y);
      const color = e.style("line-color");
      const width = px(e.style("width"), 2);
      const dashed = e.style("line-style") === "dashed";
      out.push('<path class="edge' + (dashed ? " absent" : "") + '" d="' + d + '" fill="none" stroke="' + xml(color) + '" stroke-width="' + r2(width) + '"' +
        (dashed ? ' stroke-dasharray="' + r2(3 * width) + " " + r2(2.5 * width) + '"' : "") + '><title>' + xml(e.id() + ": " + (e.data("label") || "")) + "</title></path>");
      const size = Math.max(6, width * 3 * px(e.style("arrow-scale"), 1));
      if (e.style("target-arrow-shape") === "triangle") arrowHead(out, b, cps.length ? cps[cps.length - 1] : a, size, e.style("target-arrow-color"));
      if (e.style("source-arrow-shape") === "triangle") arrowHead(out, a, cps.length ? cps[0] : b, size, e.style("source-arrow-color"));
      if (e.data("shown")) labels.push([e.data("shown"), e.boundingBox(EDGE_LABEL_BOX), px(e.style("font-size"), 12), e.style("color"), "normal", true]);
    });
    cy.nodes().forEach(function (n) {
      const p = n.position(), nw = n.width(), nh = n.height();
      const fill = xml(n.style("background-color")), stroke = xml(n.style("border-color")), bw = r2(px(n.style("border-width"), 1.5));
      const shape = n.style("shape");
      const role = n.hasClass("role-s") ? " role-s" : n.hasClass("role-t") ? " role-t" : "";
      const common = '" class="vertex' + role + '" fill="' + fill + '" stroke="' + stroke + '" stroke-width="' + bw + '"';
      if (shape === "diamond") {
        out.push('<polygon points="' + [p.x, p.y - nh / 2, p.x + nw / 2, p.y, p.x, p.y + nh / 2, p.x - nw / 2, p.y].map(r2).join(" ") + common + "/>");
      } else if (shape === "rectangle") {
        out.push('<rect x="' + r2(p.x - nw / 2) + '" y="' + r2(p.y - nh / 2) + '" width="' + r2(nw) + '" height="' + r2(nh) + common + "/>");
      } else {
        out.push('<ellipse cx="' + r2(p.x) + '" cy="' + r2(p.y) + '" rx="' + r2(nw / 2) + '" ry="' + r2(nh / 2) + common + "/>");
      }
      if (n.data("label")) labels.push([n.data("label"), n.boundingBox(NODE_LABEL_BOX), px(n.style("font-size"), 13), n.style("color"),
        n.style("font-weight"), n.hasClass("wide-label")]);
    });
    labels.forEach(function (l) { svgLabel(out, l[0], l[1], l[2], l[3], l[4], l[5]); });
    out.push("</svg>");
    return out.join("\n");
  };

  self.SwGraphView = GraphView;
})();
