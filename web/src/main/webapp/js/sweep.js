/*
 * The "Sweep" sheet: a built-in family run over a range of sizes, size by size, in a task worker
 * of its own (JsonFacade.sweepStart / sweepStep / sweepFinish), with progress per size and over
 * the sweep and a Cancel. Finished rows are kept in localStorage under the sweep's family and
 * options, and a restart of the same sweep skips them. The finished rows go to sweepReport, whose
 * fitted exponents, table, CSV and LaTeX are shown as the engine wrote them; the log–log plot is an
 * SVG of our own (download as SVG or PNG). Text only (textContent), never HTML.
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const A = self.SwApp;
  const K = self.SwSheet;
  const el = K.el;
  const $ = function (id) { return document.getElementById(id); };
  const SVGNS = "http://www.w3.org/2000/svg";
  const STORE = "spanwright.sweep.v1:";

  const st = { task: null, serial: 0, running: false, families: [], report: null };

  function num(v) { return v === null || v === undefined ? "—" : (F && F.num ? F.num(v) : String(v)); }

  function labelled(label, node, title) {
    const l = el("label", "inline-field");
    if (title) l.title = title;
    l.appendChild(el("span", "", label));
    l.appendChild(node);
    return l;
  }

  function numberInput(id, value, min) {
    const i = el("input");
    i.id = id;
    i.type = "number";
    i.step = "1";
    i.min = String(min);
    i.value = String(value);
    i.style.width = "5em";
    return i;
  }

  function bar(id, label) {
    const p = el("progress");
    p.id = id;
    p.setAttribute("aria-label", label);
    p.max = 1;
    p.value = 0;
    return p;
  }

  function skeleton(answer) {
    st.families = answer.families || [];
    const body = $("sweep-body");
    body.textContent = "";
    body.appendChild(el("p", "sheet-intro", "A family of instances over a range of sizes: for each size the engine builds the graph, checks the reduction, optimises the weights and computes √(W₊W₋) and, for small sizes, the lower bounds; then it fits exponents on a log–log scale."));
    const ctl = el("div", "opt-controls controls");
    const sel = el("select");
    sel.id = "sweep-family";
    st.families.forEach(function (f) {
      const o = el("option", "", f.title + " (" + f.parameter + ")");
      o.value = f.family;
      sel.appendChild(o);
    });
    sel.addEventListener("change", defaultsFor);
    ctl.appendChild(labelled("family", sel, "A built-in family of the engine"));
    const fo = el("input");
    fo.id = "sweep-family-options";
    fo.type = "text";
    fo.spellcheck = false;
    const foLabel = labelled("family options (JSON)", fo, "Options of the family as a JSON object, e.g. {\"k\": \"n / 2\"} for the threshold family; empty: the engine's defaults");
    foLabel.id = "sweep-family-options-field";
    ctl.appendChild(foLabel);
    ctl.appendChild(labelled("from", numberInput("sweep-from", 2, 1), "Smallest size"));
    ctl.appendChild(labelled("to", numberInput("sweep-to", 6, 1), "Largest size"));
    ctl.appendChild(labelled("fit from", numberInput("sweep-fit-from", 0, 0), "Fit only sizes whose number of variables is at least this (0: all)"));
    ctl.appendChild(labelled("fit last", numberInput("sweep-fit-last", 0, 0), "Fit only the last K sizes of the tail (0: all)"));
    const defaults = answer.sweepOptions || {};
    [["sweep-iterations", "optimiser iterations", "optimizeIterations", "Optimiser iterations per size (empty: the engine's default)"],
      ["sweep-bounds-max", "bounds up to variables", "boundsMaxVariables", "Lower bounds only for sizes with at most this many variables (empty: the engine's default)"]].forEach(function (q) {
      const i = numberInput(q[0], "", 0);
      i.dataset.option = q[2];
      if (defaults[q[2]] !== undefined) i.placeholder = String(defaults[q[2]]);
      ctl.appendChild(labelled(q[1], i, q[3]));
    });
    const run = el("button", "primary", "Run sweep");
    run.id = "sweep-run";
    run.addEventListener("click", start);
    ctl.appendChild(run);
    const forget = el("button", "", "Forget kept sizes");
    forget.id = "sweep-forget";
    forget.title = "Remove this sweep's finished sizes from the browser's storage";
    forget.addEventListener("click", function () {
      try { localStorage.removeItem(storeKey(request())); } catch (e) { /* storage unavailable */ }
      $("sweep-status").textContent = "Kept sizes of this sweep removed.";
    });
    ctl.appendChild(forget);
    body.appendChild(ctl);
    const meaning = el("p", "small");
    meaning.id = "sweep-meaning";
    body.appendChild(meaning);

    const prog = el("div", "progress-row sweep-progress");
    prog.id = "sweep-progress";
    prog.hidden = true;
    const one = el("div");
    one.appendChild(el("span", "", "this size "));
    one.appendChild(bar("sweep-size-bar", "Progress of the current size"));
    const oneText = el("span");
    oneText.id = "sweep-size-text";
    one.appendChild(oneText);
    prog.appendChild(one);
    const all = el("div");
    all.appendChild(el("span", "", "all sizes "));
    all.appendChild(bar("sweep-all-bar", "Progress over all sizes"));
    const allText = el("span");
    allText.id = "sweep-all-text";
    all.appendChild(allText);
    prog.appendChild(all);
    const cancel = el("button", "", "Cancel");
    cancel.id = "sweep-cancel";
    cancel.addEventListener("click", function () { stop(true); });
    prog.appendChild(cancel);
    body.appendChild(prog);
    const status = el("p", "small");
    status.id = "sweep-status";
    status.setAttribute("aria-live", "polite");
    body.appendChild(status);
    body.appendChild(K.errorBox("sweep-error"));

    const res = el("div");
    res.id = "sweep-result";
    res.hidden = true;
    res.appendChild(el("h3", "", "√(W₊W₋), lower bounds and D against n (log–log)"));
    const plotBox = el("div", "sweep-plot-box");
    plotBox.id = "sweep-plot-box";
    res.appendChild(plotBox);
    const tools = el("div", "controls");
    [["sweep-svg", "Plot as SVG", downloadSvg], ["sweep-png", "Plot as PNG", downloadPng],
      ["sweep-csv", "Table as CSV", function () { download("sweep.csv", "text/csv", st.report.csv); }],
      ["sweep-latex", "Table as LaTeX", function () { download("sweep.tex", "text/x-tex", st.report.latex); }]].forEach(function (b) {
      const x = el("button", "", b[1]);
      x.id = b[0];
      x.addEventListener("click", b[2]);
      tools.appendChild(x);
    });
    res.appendChild(tools);
    res.appendChild(el("h3", "", "Fitted exponents (least squares of log value on log n)"));
    const fits = el("ul", "sweep-fits");
    fits.id = "sweep-fits";
    res.appendChild(fits);
    const table = el("table", "sweep-table");
    table.id = "sweep-table";
    const scroller = el("div", "table-scroll");   // the table scrolls sideways, not the whole sheet
    scroller.appendChild(table);
    res.appendChild(scroller);
    const caution = el("p", "caution");
    caution.id = "sweep-caution";
    res.appendChild(caution);
    body.appendChild(res);
    defaultsFor();
  }

  function family() {
    const name = $("sweep-family").value;
    return st.families.filter(function (f) { return f.family === name; })[0] || null;
  }

  function defaultsFor() {
    const f = family();
    if (!f) return;
    $("sweep-meaning").textContent = f.parameter + " = " + f.meaning + "; the engine suggests " + f.parameter + " = " + f.defaultSizes + ".";
    const opts = f.options || [];
    $("sweep-family-options-field").hidden = opts.length === 0;
    $("sweep-family-options").value = "";
    $("sweep-family-options").placeholder = opts.length ? "{" + opts.map(function (o) { return "\"" + o + "\": …"; }).join(", ") + "}" : "";
  }

  function request() {
    const options = {};
    ["sweep-iterations", "sweep-bounds-max"].forEach(function (id) {
      const v = $(id).value.trim();
      if (v !== "") options[$(id).dataset.option] = parseInt(v, 10);
    });
    const spec = { family: $("sweep-family").value };
    const extra = $("sweep-family-options").value.trim();
    if (extra !== "" && !$("sweep-family-options-field").hidden) {
      let o;
      try { o = JSON.parse(extra); } catch (e) { throw new Error("The family options are not JSON: " + e.message); }
      if (!o || typeof o !== "object" || Array.isArray(o)) throw new Error("The family options must be a JSON object.");
      Object.keys(o).forEach(function (k) { if (k !== "family") spec[k] = o[k]; });
    }
    return { family: spec, options: options };
  }

  function storeKey(req) { return STORE + JSON.stringify([req.family, req.options]); }

  function loadKept(req) {
    try {
      const v = JSON.parse(localStorage.getItem(storeKey(req)) || "{}");
      return v && typeof v === "object" && v.rows ? v.rows : {};
    } catch (e) { return {}; }
  }

  function saveKept(req, rows) {
    try { localStorage.setItem(storeKey(req), JSON.stringify({ rows: rows })); } catch (e) { /* storage full or off */ }
  }

  function setBar(id, textId, value, max, text) {
    const b = $(id);
    if (max > 0) { b.max = max; b.value = value; } else { b.removeAttribute("value"); }
    $(textId).textContent = text;
  }

  function fail(message) {
    st.running = false;
    $("sweep-run").disabled = false;
    $("sweep-progress").hidden = true;
    const box = $("sweep-error");
    box.hidden = false;
    box.textContent = message;
    document.body.dataset.sweep = "error";
  }

  async function start() {
    if (st.running) return;
    const from = parseInt($("sweep-from").value, 10);
    const to = parseInt($("sweep-to").value, 10);
    if (!(from >= 1) || !(to >= from)) { fail("Choose sizes with 1 ≤ from ≤ to."); return; }
    let req;
    try { req = request(); } catch (e) { fail(e.message); return; }
    const sizes = [];
    for (let n = from; n <= to; n++) sizes.push(n);
    const kept = loadKept(req);
    const serial = ++st.serial;
    st.running = true;
    st.task = st.task || A.newTask();
    $("sweep-error").hidden = true;
    $("sweep-progress").hidden = false;
    document.body.dataset.sweep = "running";
    $("sweep-run").disabled = true;
    const computed = [], skipped = [];
    const t0 = performance.now();
    for (let i = 0; i < sizes.length; i++) {
      const n = sizes[i];
      setBar("sweep-all-bar", "sweep-all-text", i, sizes.length, " " + i + " of " + sizes.length + " sizes");
      if (kept[n]) { skipped.push(n); continue; }
      setBar("sweep-size-bar", "sweep-size-text", 0, 0, " n = " + n + ": building, checking, optimising, bounds…");
      const started = await st.task.run("sweepStart", JSON.stringify({ family: req.family, size: n, options: req.options }));
      if (serial !== st.serial || started.cancelled) return;
      if (!started.ok) { fail("Size " + n + " not computed: " + K.problem(started)); return; }
      let done = started.status !== "ok";
      let chunk = 4096;
      while (!done) {
        const s0 = performance.now();
        const step = await st.task.run("sweepStep", started.job, chunk);
        if (serial !== st.serial || step.cancelled) return;
        if (!step.ok) { fail("Size " + n + " not computed: " + K.problem(step)); return; }
        done = step.done;
        setBar("sweep-size-bar", "sweep-size-text", step.processed, step.total, " n = " + n + ": " + F.count(step.processed) + " of " + F.count(step.total) + " inputs");
        if (performance.now() - s0 < 30 && chunk < (1 << 20)) chunk *= 2;
      }
      const fin = await st.task.run("sweepFinish", started.job);
      if (serial !== st.serial || fin.cancelled) return;
      if (!fin.ok) { fail("Size " + n + " not finished: " + K.problem(fin)); return; }
      kept[n] = fin.row;
      saveKept(req, kept);
      computed.push(n);
    }
    setBar("sweep-all-bar", "sweep-all-text", sizes.length, sizes.length, " " + sizes.length + " of " + sizes.length + " sizes");
    const rows = sizes.map(function (n) { return kept[n]; });
    const fitFrom = parseInt($("sweep-fit-from").value, 10) || 0;
    const fitLast = parseInt($("sweep-fit-last").value, 10) || 0;
    const rep = await st.task.run("sweepReport", JSON.stringify({ family: req.family, sizes: from + ".." + to, options: req.options, rows: rows, fitFrom: fitFrom, fitLast: fitLast }));
    if (serial !== st.serial || rep.cancelled) return;
    st.running = false;
    $("sweep-run").disabled = false;
    $("sweep-progress").hidden = true;
    if (!rep.ok) { fail("No report: " + K.problem(rep)); return; }
    const body = $("sweep-body");
    body.dataset.computed = computed.join(",");
    body.dataset.kept = skipped.join(",");
    body.dataset.ms = String(Math.round(performance.now() - t0));
    $("sweep-status").textContent = "Computed " + (computed.length ? "n = " + computed.join(", ") : "no size") +
      (skipped.length ? "; kept from an earlier run of this sweep (browser storage): n = " + skipped.join(", ") : "") + ".";
    show(rep);
    document.body.dataset.sweep = "ready";
  }

  function stop(byUser) {
    if (!st.running) return;
    st.serial++;
    st.running = false;
    $("sweep-run").disabled = false;
    if (st.task) st.task.cancel();
    $("sweep-progress").hidden = true;
    $("sweep-status").textContent = "Cancelled. Finished sizes are kept; run the same sweep again to go on.";
    document.body.dataset.sweep = "cancelled";
    if (byUser) A.notify("Sweep cancelled; finished sizes kept.", "info");
  }

  // ---------------------------------------------------------------- report

  const SERIES = [
    { key: "complexity", label: "√(W₊W₋)", value: function (r) { return r.complexity; }, marker: "circle", dash: "" },
    { key: "adversaryGeneralLower", label: "ADV± (lower end)", value: function (r) { return r.bounds && r.bounds.adversaryGeneral ? r.bounds.adversaryGeneral.lower : null; }, marker: "square", dash: "6 4" },
    { key: "decisionTree", label: "D", value: function (r) { return r.bounds ? r.bounds.decisionTree : null; }, marker: "triangle", dash: "2 3" }
  ];

  function show(rep) {
    st.report = rep;
    const result = rep.result;
    $("sweep-result").hidden = false;
    const rows = (result.rows || []).filter(function (r) { return r.status === "ok"; });
    const series = (result.fits && result.fits.series) || {};
    // Fits
    const ul = $("sweep-fits");
    ul.textContent = "";
    Object.keys(series).forEach(function (k) {
      const s = series[k];
      const li = el("li", "", s.what + ": exponent " + num(s.exponent) + (s.standardError === null || s.standardError === undefined ? " (no error estimate)" : " ± " + num(s.standardError)) +
        " over n = " + s.fromVariables + " … " + s.toVariables + " (" + s.points + " points)");
      li.dataset.series = k;
      li.dataset.exponent = s.exponent === null || s.exponent === undefined ? "" : String(s.exponent);
      li.dataset.standardError = s.standardError === null || s.standardError === undefined ? "" : String(s.standardError);
      ul.appendChild(li);
    });
    // Table
    const t = $("sweep-table");
    t.textContent = "";
    const head = el("tr");
    [result.parameter ? result.parameter.name : "size", "variables", "|V|", "|E|", "method", "evaluated", "W₊", "W₋", "√(W₊W₋)", "ADV± lower", "D", "status"].forEach(function (h) { head.appendChild(el("th", "", h)); });
    const thead = el("thead");
    thead.appendChild(head);
    t.appendChild(thead);
    const tb = el("tbody");
    (result.rows || []).forEach(function (r) {
      const tr = el("tr");
      tr.dataset.size = String(r.size);
      tr.dataset.complexity = r.complexity === null || r.complexity === undefined ? "" : String(r.complexity);
      const b = r.bounds || {};
      [r.size, r.variables, r.vertices, r.edges, r.method, r.evaluated, num(r.positive && r.positive.maxResistance), num(r.negative && r.negative.maxCapacitance), num(r.complexity),
        num(b.adversaryGeneral ? b.adversaryGeneral.lower : null), b.decisionTree === undefined ? "—" : b.decisionTree, r.status + (r.reason ? ": " + r.reason : "") + (r.error ? ": " + r.error : "")].forEach(function (c) {
        tr.appendChild(el("td", "", c === undefined || c === null ? "—" : String(c)));
      });
      tb.appendChild(tr);
    });
    t.appendChild(tb);
    $("sweep-caution").textContent = "Caution: " + String(result.caution || (result.fits && result.fits.caution) || "") + ".";
    drawPlot(rows, series);
  }

  function svg(tag, attrs, text) {
    const e = document.createElementNS(SVGNS, tag);
    Object.keys(attrs || {}).forEach(function (k) { e.setAttribute(k, String(attrs[k])); });
    if (text !== undefined) e.textContent = text;
    return e;
  }

  function marker(kind, x, y, r) {
    if (kind === "square") return svg("rect", { x: x - r - 1.5, y: y - r - 1.5, width: 2 * r + 3, height: 2 * r + 3, fill: "none", stroke: "#1b4f72", "stroke-width": 1.6 });
    if (kind === "triangle") return svg("path", { d: "M" + x + " " + (y - r - 1) + " L" + (x + r + 1) + " " + (y + r) + " L" + (x - r - 1) + " " + (y + r) + " Z", fill: "#7a4b00", stroke: "#7a4b00" });
    return svg("circle", { cx: x, cy: y, r: r, fill: "#1b4f72" });
  }

  function drawPlot(rows, fits) {
    const box = $("sweep-plot-box");
    box.textContent = "";
    const W = 520, H = 400, L = 56, R = 16, T = 14, B = 126;
    const pts = [];
    SERIES.forEach(function (s) {
      rows.forEach(function (r) { const v = s.value(r); if (typeof v === "number" && v > 0 && r.variables > 0) pts.push([r.variables, v]); });
    });
    const root = svg("svg", { xmlns: SVGNS, width: W, height: H, viewBox: "0 0 " + W + " " + H, role: "img", id: "sweep-plot", "font-family": "sans-serif", "font-size": 13 });
    root.appendChild(svg("rect", { x: 0, y: 0, width: W, height: H, fill: "#ffffff" }));
    if (!pts.length) { root.appendChild(svg("text", { x: L, y: H / 2 }, "No finished size with a positive value to plot.")); box.appendChild(root); return; }
    const lx = pts.map(function (p) { return Math.log10(p[0]); }), ly = pts.map(function (p) { return Math.log10(p[1]); });
    let x0 = Math.floor(Math.min.apply(null, lx) * 10) / 10, x1 = Math.ceil(Math.max.apply(null, lx) * 10) / 10;
    let y0 = Math.floor(Math.min.apply(null, ly) * 10) / 10, y1 = Math.ceil(Math.max.apply(null, ly) * 10) / 10;
    if (x1 <= x0) x1 = x0 + 0.1;
    if (y1 <= y0) y1 = y0 + 0.1;
    const px = function (n) { return L + (Math.log10(n) - x0) / (x1 - x0) * (W - L - R); };
    const py = function (v) { return H - B - (Math.log10(v) - y0) / (y1 - y0) * (H - T - B); };
    // Axes with decade and 2/5 ticks
    root.appendChild(svg("line", { x1: L, y1: H - B, x2: W - R, y2: H - B, stroke: "#333" }));
    root.appendChild(svg("line", { x1: L, y1: T, x2: L, y2: H - B, stroke: "#333" }));
    function ticks(a0, a1, draw) {
      for (let d = Math.floor(a0); d <= Math.ceil(a1); d++) {
        (a1 - a0 < 1.2 ? [1, 2, 3, 4, 5, 6, 7, 8, 9] : [1, 2, 5]).forEach(function (m) {
          const v = m * Math.pow(10, d);
          const lv = Math.log10(v);
          if (lv >= a0 - 1e-9 && lv <= a1 + 1e-9) draw(v);
        });
      }
    }
    // x: the sweep's own n when there are few of them (every point then sits on a labelled tick)
    const ns = pts.map(function (p) { return p[0]; }).filter(function (n, i, a) { return a.indexOf(n) === i; }).sort(function (a, b) { return a - b; });
    const xTicks = ns.length <= 10 ? function (a0, a1, draw) { ns.forEach(draw); } : ticks;
    xTicks(x0, x1, function (v) {
      const x = px(v);
      root.appendChild(svg("line", { x1: x, y1: T, x2: x, y2: H - B, stroke: "#ddd" }));
      root.appendChild(svg("text", { x: x, y: H - B + 14, "text-anchor": "middle" }, String(v)));
    });
    ticks(y0, y1, function (v) {
      const y = py(v);
      root.appendChild(svg("line", { x1: L, y1: y, x2: W - R, y2: y, stroke: "#ddd" }));
      root.appendChild(svg("text", { x: L - 6, y: y + 4, "text-anchor": "end" }, String(v)));
    });
    root.appendChild(svg("text", { x: (L + W - R) / 2, y: H - B + 32, "text-anchor": "middle" }, "n (number of variables, log scale)"));
    root.appendChild(svg("text", { x: 14, y: (T + H - B) / 2, "text-anchor": "middle", transform: "rotate(-90 14 " + (T + H - B) / 2 + ")" }, "value (log scale)"));
    let legendY = H - B + 56;
    SERIES.forEach(function (s) {
      const f = fits[s.key];
      const mine = rows.filter(function (r) { const v = s.value(r); return typeof v === "number" && v > 0; });
      if (!mine.length) return;
      const g = svg("g", { "data-series": s.key });
      if (f && typeof f.exponent === "number" && typeof f.prefactor === "number" && f.toVariables > f.fromVariables) {
        const a = f.fromVariables, b = f.toVariables;
        g.appendChild(svg("line", { x1: px(a), y1: py(f.prefactor * Math.pow(a, f.exponent)), x2: px(b), y2: py(f.prefactor * Math.pow(b, f.exponent)),
          stroke: "#555", "stroke-width": 1.4, "stroke-dasharray": s.dash }));
      }
      mine.forEach(function (r) { g.appendChild(marker(s.marker, px(r.variables), py(s.value(r)), 3.5)); });
      root.appendChild(g);
      root.appendChild(marker(s.marker, L + 8, legendY, 4));
      root.appendChild(svg("line", { x1: L + 16, y1: legendY, x2: L + 44, y2: legendY, stroke: "#555", "stroke-width": 1.4, "stroke-dasharray": s.dash }));
      root.appendChild(svg("text", { x: L + 52, y: legendY + 4 }, s.label + (f && typeof f.exponent === "number" ? ":  exponent " + num(f.exponent) +
        (typeof f.standardError === "number" ? " ± " + num(f.standardError) : " (no error estimate)") : ":  no fit")));
      legendY += 22;
    });
    root.setAttribute("aria-label", "Log–log plot of " + SERIES.map(function (s) { return s.label; }).join(", ") + " against n, with fitted lines");
    box.appendChild(root);
  }

  function svgText() {
    return new XMLSerializer().serializeToString($("sweep-plot"));
  }

  function download(name, type, text) {
    const a = el("a");
    a.href = URL.createObjectURL(new Blob([text], { type: type }));
    a.download = name;
    document.body.appendChild(a);
    a.click();
    setTimeout(function () { URL.revokeObjectURL(a.href); a.remove(); }, 1000);
  }

  function downloadSvg() { download("sweep-plot.svg", "image/svg+xml", svgText()); }

  function downloadPng() {
    const plot = $("sweep-plot");
    const img = new Image();
    const url = URL.createObjectURL(new Blob([svgText()], { type: "image/svg+xml" }));
    img.onload = function () {
      const c = document.createElement("canvas");
      c.width = plot.width.baseVal.value * 2;
      c.height = plot.height.baseVal.value * 2;
      const g = c.getContext("2d");
      g.scale(2, 2);
      g.drawImage(img, 0, 0);
      URL.revokeObjectURL(url);
      c.toBlob(function (blob) {
        const a = el("a");
        a.href = URL.createObjectURL(blob);
        a.download = "sweep-plot.png";
        document.body.appendChild(a);
        a.click();
        setTimeout(function () { URL.revokeObjectURL(a.href); a.remove(); }, 1000);
      }, "image/png");
    };
    img.src = url;
  }

  let built = false;
  A.on("engine", function () {
    if (built) return;
    if (!A.has("sweepStart") || !A.has("sweepReport")) {
      K.unavailable("sweep-body", "sweep-missing", "This build of the engine does not run family sweeps (no sweepStart function).");
      return;
    }
    built = true;
    A.bridge().call("sweepFamilies").then(function (answer) {
      if (!answer.ok) { K.unavailable("sweep-body", "sweep-missing", "The engine did not list its families: " + K.problem(answer)); return; }
      skeleton(answer);
      document.body.dataset.sweepReady = "yes";
    });
  });
})();
