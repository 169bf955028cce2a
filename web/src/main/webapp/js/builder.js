/*
 * The "New from…" dialog: builds a scenario with the engine's builders (JsonFacade.build) from a
 * formula, a function (decision tree or diagram), a host graph family or a composition, with a
 * live preview (drawing, sizes, and the engine's W₊, W₋ and bound: enumerated for small domains, by
 * structure where the engine would use it, e.g. large host graphs). "Open as new scenario" loads it
 * like a file: the current work goes on the undo stack, nothing is lost.
 * A bad formula or size is reported by the engine with the request path; the page names the field.
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const A = self.SwApp;
  const $ = function (id) { return document.getElementById(id); };
  const dlg = $("builder");
  const PREVIEW_ANALYSIS_MAX_VARIABLES = 12;   // 4,096 inputs: quick in either engine

  const st = { task: null, view: null, serial: 0, busySince: 0, pending: false, built: null, timer: 0 };

  /* Which field a request path points at, for the message and the highlight. */
  const FIELDS = {
    formula: { "$.expression": ["b-expression", "formula"], "$.variables": ["b-variables", "variables"], "$.weights": ["b-formula-weights", "weights"] },
    tree: { "$.function": ["b-function", "function"], "$.variables": ["b-tree-variables", "variables"], "$.order": ["b-order", "query order"],
      "$.diagram": ["b-diagram", "merge option"], "$.weights": ["b-tree-weights", "weights"] },
    host: { "$.family": ["b-family", "family"], "$.size[0]": ["b-size1", null], "$.size[1]": ["b-size2", null], "$.size": ["b-size1", null],
      "$.seed": ["b-seed", "seed"], "$.s": ["b-s", "s"], "$.t": ["b-t", "t"], "$.atMostMissing": ["b-missing", "edges missing"],
      "$.scenario": ["b-family", "current drawing"] },
    compose: { "$.outer": ["b-outer", "outer scenario"], "$.inner": ["b-inner", "inner scenario"] }
  };

  const FAMILY = {
    path: { a: "vertices", b: null }, cycle: { a: "vertices", b: null }, grid: { a: "rows", b: "columns" },
    complete: { a: "vertices", b: null }, bipartite: { a: "left side", b: "right side" }, hypercube: { a: "dimension", b: null },
    random: { a: "vertices", b: "edges", seed: true }, given: { a: null, b: null }
  };

  function kind() { return dlg.querySelector("input[name=bkind]:checked").value; }

  function names(v) {
    const t = String(v || "").trim();
    return t ? t.split(/[\s,]+/).filter(Boolean) : null;
  }
  function number(id) {
    const raw = $(id).value.trim();
    if (raw === "") return null;
    const n = Number(raw);
    return isFinite(n) ? n : raw;   // the engine names a non-number at its path
  }

  /* The engine's built-in inner gadgets (spanwright.reduction.Gadgets): a request names them and
   * the engine builds them, so the default composition (the current scenario with the first one)
   * stays small. */
  const GADGETS = [
    ["either-of-2", "built-in gadget: either of two (p | q, 2 variables)"],
    ["both-of-2", "built-in gadget: both of two (p & q, 2 variables)"],
    ["two-of-3", "built-in gadget: two of three (majority, 3 variables)"]
  ];

  function composePart(sel) {
    const v = sel.value;
    if (v === "current") return JSON.parse(A.text());
    if (v.indexOf("gadget:") === 0) return v.slice(7);
    const g = A.gallery()[Number(v.slice(2))];
    return g ? JSON.parse(g.text) : null;
  }

  function request() {
    const k = kind();
    if (k === "formula") {
      const r = { kind: "formula", expression: $("b-expression").value, weights: $("b-formula-weights").value };
      const v = names($("b-variables").value);
      if (v) r.variables = v;
      return r;
    }
    if (k === "tree") {
      const r = { kind: "tree", function: $("b-function").value.trim(), diagram: $("b-diagram").checked, weights: $("b-tree-weights").value };
      const v = names($("b-tree-variables").value);
      if (v) r.variables = v;
      const o = names($("b-order").value);
      if (o) r.order = o;
      return r;
    }
    if (k === "host") {
      const fam = $("b-family").value;
      if (fam === "given") {
        const r = { kind: "host", family: "given", scenario: JSON.parse(A.text()) };
        if ($("b-s").value.trim()) r.s = $("b-s").value.trim();
        if ($("b-t").value.trim()) r.t = $("b-t").value.trim();
        if (number("b-missing") !== null) r.atMostMissing = number("b-missing");
        return r;
      }
      const spec = FAMILY[fam];
      const size = [number("b-size1")];
      if (spec.b) size.push(number("b-size2"));
      const r = { kind: "host", family: fam, size: size };
      if (spec.seed && number("b-seed") !== null) r.seed = number("b-seed");
      if ($("b-s").value.trim()) r.s = $("b-s").value.trim();
      if ($("b-t").value.trim()) r.t = $("b-t").value.trim();
      if (number("b-missing") !== null) r.atMostMissing = number("b-missing");
      return r;
    }
    return { kind: "compose", outer: composePart($("b-outer")), inner: composePart($("b-inner")) };
  }

  function showKind() {
    const k = kind();
    dlg.querySelectorAll("fieldset[data-kind]").forEach(function (f) { f.hidden = f.dataset.kind !== k; });
    if (k === "host") showFamily();
    dlg.dataset.kind = k;
  }
  function showFamily() {
    const spec = FAMILY[$("b-family").value] || FAMILY.grid;
    const setRow = function (id, label) {
      $(id).hidden = !label;
      $(id + "-label").hidden = !label;
      if (label) $(id + "-label").textContent = label;
    };
    setRow("b-size1", spec.a);
    setRow("b-size2", spec.b);
    setRow("b-seed", spec.seed ? "seed" : null);
  }

  function fillComposeLists() {
    ["b-outer", "b-inner"].forEach(function (id, which) {
      const sel = $(id);
      const keep = sel.value;
      sel.textContent = "";
      const cur = document.createElement("option");
      cur.value = "current";
      cur.textContent = "the current scenario";
      sel.appendChild(cur);
      if (which === 1) {
        GADGETS.forEach(function (g) {
          const op = document.createElement("option");
          op.value = "gadget:" + g[0];
          op.textContent = g[1];
          sel.appendChild(op);
        });
      }
      A.gallery().forEach(function (g, i) {
        const op = document.createElement("option");
        op.value = "g:" + i;
        op.textContent = g.title + " (" + g.file + ")";
        sel.appendChild(op);
      });
      // Default: the current scenario as the outer one, a two-variable gadget as the inner one
      // (two whole scenarios would usually pass the enumeration limit of variables).
      sel.value = keep && sel.querySelector("option[value='" + keep + "']") ? keep : (which === 0 ? "current" : "gadget:" + GADGETS[0][0]);
    });
  }

  function clearInvalid() {
    dlg.querySelectorAll("[aria-invalid=true]").forEach(function (el) { el.removeAttribute("aria-invalid"); });
  }

  function showError(err, k) {
    const box = $("builder-error");
    clearInvalid();
    const path = String(err.path || "$");
    const map = FIELDS[k] || {};
    let hit = map[path];
    if (!hit) {
      const key = Object.keys(map).filter(function (p) { return path.indexOf(p) === 0; }).sort(function (a, b) { return b.length - a.length; })[0];
      hit = key ? map[key] : null;
    }
    let fieldName = null;
    if (hit) {
      $(hit[0]).setAttribute("aria-invalid", "true");
      fieldName = hit[1] || ($(hit[0] + "-label") ? $(hit[0] + "-label").textContent : hit[0]);
    }
    box.hidden = false;
    box.textContent = "";
    const strong = document.createElement("strong");
    strong.textContent = (fieldName ? "In the " + fieldName + " field: " : "Cannot build: ");
    box.appendChild(strong);
    box.appendChild(document.createTextNode(String(err.message || "the engine refused the request")));
    const p = document.createElement("div");
    p.className = "error-path";
    p.textContent = "where: " + path + (err.code ? "  (" + err.code + ")" : "") + ". Your current scenario is unchanged.";
    box.appendChild(p);
    $("builder-create").disabled = true;
    st.built = null;
    dlg.dataset.preview = "error";
    // The last good preview is not this request's: take it away.
    $("builder-stats").textContent = "";
    if (st.view) st.view.cy.elements().remove();
  }

  // Readable names for the builders' statistics (the engine's JSON keys stay in data-stat).
  const STAT_LABELS = {
    vertices: "vertices", edges: "edges", variables: "variables",
    strategy: "tree shape", order: "query order", output: "output", depth: "depth T (worst-case queries)",
    wrongGuesses: "guess rank G (most wrong guesses on a path)",
    treeDecisionVertices: "tree: decision vertices", treeVertices: "tree: vertices", treeEdges: "tree: edges",
    diagramDecisionVertices: "diagram: decision vertices", diagramVertices: "diagram: vertices", diagramEdges: "diagram: edges",
    weights: "weights", boundPositive: "W₊ at most (guaranteed)", boundNegative: "W₋ at most (guaranteed)",
    leaves: "leaves (literal occurrences)", readOnce: "read-once",
    predictedPositive: "predicted W₊", predictedNegative: "predicted W₋", predictedComplexity: "predicted bound",
    outerPositive: "outer W₊", outerNegative: "outer W₋", innerPositive: "inner W₊", innerNegative: "inner W₋",
    negatedInnerPositive: "negated inner W₊", negatedInnerNegative: "negated inner W₋",
    productBound: "W₊·W₋ at most (outer × inner)", gadgets: "inner copies",
    family: "host family", size: "size", s: "s", t: "t", paths: "simple s–t paths",
    functionOmitted: "function omitted", promise: "promise"
  };

  function statLabel(key) {
    if (Object.prototype.hasOwnProperty.call(STAT_LABELS, key)) return STAT_LABELS[key];
    return String(key).replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();
  }

  function statText(value) {
    if (typeof value === "number") return F.num(value);
    if (typeof value === "boolean") return value ? "yes" : "no";
    if (value === null || value === undefined) return "—";
    if (Array.isArray(value)) return value.map(statText).join(value.every(function (x) { return typeof x === "number"; }) ? " × " : ", ");
    if (typeof value === "object") return JSON.stringify(value);
    return String(value);
  }

  function statLine(key, value) {
    const div = document.createElement("div");
    const k = document.createElement("span");
    k.className = "stat-key";
    k.textContent = statLabel(key);
    const v = document.createElement("span");
    v.className = "stat-value";
    v.dataset.stat = key;
    v.textContent = statText(value);
    div.appendChild(k);
    div.appendChild(document.createTextNode(": "));
    div.appendChild(v);
    return div;
  }

  function showBuilt(answer, serial) {
    clearInvalid();
    $("builder-error").hidden = true;
    const sc = answer.scenario;
    st.built = sc;
    if (!st.view) {
      st.view = new self.SwGraphView($("builder-graph"), { addVertex: noop, addEdge: noop, moveVertex: noop, select: noop, hover: noop });
      st.view.cy.autoungrabify(true);
      st.view.cy.autounselectify(true);
    }
    st.view.cy.resize();
    const missing = st.view.showScenario(sc);
    if (missing) st.view.arrange();
    st.view.fit();
    const box = $("builder-stats");
    box.textContent = "";
    const title = document.createElement("div");
    title.className = "stat-title";
    title.textContent = String(sc.title || "untitled");
    box.appendChild(title);
    const stats = answer.stats || {};
    Object.keys(stats).forEach(function (k) { box.appendChild(statLine(k, stats[k])); });
    $("builder-create").disabled = false;
    dlg.dataset.preview = "built";
    const nvars = Array.isArray(sc.variables) ? sc.variables.length : 0;
    const figures = document.createElement("div");
    figures.id = "builder-figures";
    figures.className = "builder-figures";
    box.appendChild(figures);
    dlg.dataset.previewFigures = "running";
    st.busySince = performance.now();
    const text = JSON.stringify(sc);
    // Small domains are enumerated in the preview; beyond, the preview analyses only when the
    // engine says it would use its structural method (validate's "method"), not a long enumeration.
    const method = nvars <= PREVIEW_ANALYSIS_MAX_VARIABLES ? Promise.resolve("enumerate")
      : st.task.run("validate", text).then(function (v) { return v.cancelled ? null : v.ok ? v.method : "refused"; });
    method.then(function (m) {
      if (m === null || serial !== st.serial) return null;
      if (m === "structure" || m === "enumerate") { figures.dataset.method = m; return st.task.run("analyze", text, false); }
      figures.textContent = "W₊, W₋ and the bound are computed when you open it (" + nvars + " variables is more than the preview enumerates).";
      dlg.dataset.previewFigures = "skipped";
      return null;
    }).then(function (r) {
      if (!r) return;
      if (st.pending) { preview(); return; }
      if (serial !== st.serial || r.cancelled) return;
      figures.textContent = "";
      if (!r.ok) { figures.textContent = "Not analysed: " + ((r.error && r.error.message) || "unknown problem"); dlg.dataset.previewFigures = "error"; return; }
      const res = r.result;
      const pos = res.positive || {}, neg = res.negative || {};
      // enumerated (positive.maxResistance) or by structure (maxResistance.value with its worst input)
      const wp = res.positive ? (pos.count ? pos.maxResistance : null) : res.maxResistance && res.maxResistance.worst ? res.maxResistance.value : null;
      const wm = res.negative ? (neg.count ? neg.maxCapacitance : null) : res.maxCapacitance && res.maxCapacitance.worst ? res.maxCapacitance.value : null;
      [["W₊", "wplus", wp], ["W₋", "wminus", wm], ["bound √(W₊·W₋)", "bound", res.complexity]].forEach(function (q) {
        const d = document.createElement("div");
        d.textContent = q[0] + " = ";
        const v = document.createElement("span");
        v.id = "builder-" + q[1];
        v.dataset.value = q[2] === null || q[2] === undefined ? "" : String(q[2]);
        v.textContent = F.num(q[2] === null || q[2] === undefined ? NaN : q[2]);
        d.appendChild(v);
        figures.appendChild(d);
      });
      const red = res.reduction || {};
      const v = document.createElement("div");
      v.textContent = red.correct === true ? "✓ decides the function on every input" : red.correct === false ? "✗ does not decide the function" : "no function to check";
      figures.appendChild(v);
      if (res.method === "structure") {
        const how = document.createElement("div");
        how.className = "small";
        how.textContent = "By structure, without enumerating the " + nvars + "-variable cube.";
        figures.appendChild(how);
      }
      const c = document.createElement("div");
      c.className = "caution";
      c.textContent = "Asymptotic query-complexity bounds for the span-program algorithm (weight = resistance, each edge once), not run-time estimates for real hardware.";
      figures.appendChild(c);
      dlg.dataset.previewFigures = "ready";
    });
  }

  function noop() {}

  function preview() {
    if (!dlg.open) return;
    if (!A.engineReady()) { schedule(300); return; }
    if (!A.has("build")) { showError({ message: "this build of the engine has no builders", path: "$" }, kind()); return; }
    st.task = st.task || A.newTask();
    if (st.task.busy) {
      // A slow build (a large decision tree, say) is abandoned for the newer request.
      if (performance.now() - st.busySince > 1500) st.task.cancel();
      else { st.pending = true; return; }
    }
    let req;
    try { req = request(); } catch (e) { showError({ message: "the current scenario could not be read: " + e.message, path: "$" }, kind()); return; }
    const k = kind();
    const serial = ++st.serial;
    dlg.dataset.request = JSON.stringify(req);
    st.pending = false;
    st.busySince = performance.now();
    $("builder-state").textContent = "building…";
    dlg.dataset.preview = "running";
    st.task.run("build", JSON.stringify(req)).then(function (answer) {
      if (answer.cancelled) return;
      if (serial === st.serial) {
        $("builder-state").textContent = "";
        if (!answer.ok) showError(answer.error || {}, k);
        else showBuilt(answer, serial);
      }
      if (st.pending) preview();
    });
  }

  function schedule(ms) {
    clearTimeout(st.timer);
    st.timer = setTimeout(preview, ms === undefined ? 300 : ms);
  }

  function open() {
    if (dlg.open) return;
    fillComposeLists();
    showKind();
    dlg.showModal();
    dlg.dataset.preview = "";
    schedule(0);
  }

  function create() {
    if (!st.built) return;
    const built = st.built;
    A.loadText("the built scenario", JSON.stringify(built)).then(function (ok) {
      if (!ok) return;
      dlg.close();
      A.notify("Opened a new scenario built by the engine: '" + String(built.title || "untitled") + "'. Undo brings back what you had.", "info");
    });
  }

  dlg.addEventListener("input", function (ev) { if (ev.target.name === "bkind") showKind(); else if (ev.target.id === "b-family") showFamily(); schedule(); });
  dlg.addEventListener("change", function (ev) { if (ev.target.name === "bkind") showKind(); else if (ev.target.id === "b-family") showFamily(); schedule(); });
  dlg.addEventListener("close", function () { clearTimeout(st.timer); if (st.task && st.task.busy) st.task.cancel(); });
  $("builder-create").addEventListener("click", create);
  $("builder-close").addEventListener("click", function () { dlg.close(); });
  $("new-from").addEventListener("click", open);
  A.on("engine", function () {
    $("new-from").disabled = !A.has("build");
    $("new-from").title = A.has("build") ? $("new-from").title : "This build of the engine has no builders";
  });

  self.SwBuilder = { open: open };
})();
