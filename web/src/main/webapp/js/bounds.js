/*
 * The "Bounds" sheet: lower bounds (ADV±, ADV) and classical measures (D, C₀, C₁, C, s, bs, deg)
 * of the scenario's function on its domain, the optimality gap and the speed-up over classical,
 * all computed by the engine (JsonFacade.bounds) in a worker of its own. A measure the engine did
 * not compute is shown as "—" with the engine's reason. Runs when the sheet is shown and the
 * scenario has changed since the last run; Cancel ends the worker (one blocking engine call).
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const A = self.SwApp;
  const $ = function (id) { return document.getElementById(id); };

  const st = { task: null, serial: 0, doneFor: null, running: false, started: 0, untick: function () {}, result: null };

  /* Rows: [group, key, label, explanation, key whose reason also serves]. The labels are ours; the values the engine's. */
  const ROWS = [
    ["top", "complexity", "this graph's bound √(W₊·W₋)", "current weights"],
    ["top", "optimalityGap", "optimality gap √(W₊·W₋) / ADV±", "≥ 1; 1 means this graph is optimal up to constants"],
    ["top", "speedup", "speed-up over classical D / √(W₊·W₋)", "constants not included"],
    ["top", "optimisedComplexity", "bound with optimised weights", "the engine's weight optimiser, run for this comparison (a local optimum)"],
    ["top", "optimisedGap", "optimality gap, optimised weights", "≥ 1"],
    ["adversary", "general", "ADV± (general adversary)", "lower bound for every graph deciding f; Θ(quantum query complexity)"],
    ["adversary", "generalDual", "ADV± upper value", "the dual value of the same semidefinite program"],
    ["adversary", "positive", "ADV (positive adversary)", "certified lower end; ADV ≤ ADV±"],
    ["adversary", "positiveUpper", "ADV upper value", "certified upper end (the minimax value of the engine's distributions, or the SDP witness's value where smaller); ADV lies between the two", "positive"],
    ["classical", "D", "D (decision-tree depth)", "deterministic query complexity"],
    ["classical", "C0", "C₀ (0-certificate)", ""],
    ["classical", "C1", "C₁ (1-certificate)", ""],
    ["classical", "C", "C (certificate complexity)", ""],
    ["classical", "s", "s (sensitivity)", ""],
    ["classical", "bs", "bs (block sensitivity)", ""],
    ["classical", "deg", "deg (exact degree)", ""]
  ];

  const K = self.SwSheet;
  const el = K.el;

  function skeleton() {
    const body = $("bounds-body");
    body.textContent = "";
    body.appendChild(el("p", "sheet-intro", "Lower bounds and classical measures of the function f on its domain, and how this graph compares. Computed by the engine when this sheet is shown."));
    const ctl = el("div", "opt-controls controls");
    const again = el("button", "", "Compute again");
    again.id = "bounds-run";
    again.addEventListener("click", function () { start(true); });
    ctl.appendChild(again);
    body.appendChild(ctl);
    body.appendChild(K.progressRow("bounds", "Computing bounds", function () { stop(true); }));
    body.appendChild(K.errorBox("bounds-error"));
    const res = el("div");
    res.id = "bounds-result";
    res.hidden = true;
    const warn = el("div", "stale-note");
    warn.id = "bounds-warning";
    warn.hidden = true;
    res.appendChild(warn);
    const table = el("table", "compare bounds-table");
    table.id = "bounds-table";
    const tb = el("tbody");
    let group = null;
    ROWS.forEach(function (r) {
      if (r[0] !== group) {
        group = r[0];
        const h = el("tr", "group-row");
        const th = el("th", "", group === "adversary" ? "Quantum lower bounds" : group === "classical" ? "Classical measures" : "This graph");
        th.colSpan = 2;
        h.appendChild(th);
        tb.appendChild(h);
      }
      const tr = el("tr");
      const th = el("th", "", r[2]);
      th.scope = "row";
      if (r[3]) th.title = r[3];
      const td = el("td", "value");
      td.id = "bounds-" + r[1];
      tr.appendChild(th);
      tr.appendChild(td);
      tb.appendChild(tr);
    });
    table.appendChild(tb);
    res.appendChild(table);
    const wit = el("div", "bounds-witnesses small");
    wit.id = "bounds-witnesses";
    res.appendChild(wit);
    const lim = el("p", "small");
    lim.id = "bounds-limits";
    res.appendChild(lim);
    const fb = el("p", "small");
    fb.id = "bounds-fallback";
    fb.hidden = true;
    res.appendChild(fb);
    body.appendChild(res);
  }

  function unavailable() {
    K.unavailable("bounds-body", "bounds-missing", "This build of the engine does not compute lower bounds (no bounds function).");
  }

  function setValue(id, v, reason) {
    const td = $("bounds-" + id);
    if (!td) return;
    td.textContent = "";
    const has = v !== null && v !== undefined;
    td.dataset.value = has ? String(v) : "";
    td.dataset.reason = has ? "" : String(reason || "");
    const val = el("span", "num", has ? F.num(v) : "—");
    td.appendChild(val);
    if (!has && reason) td.appendChild(el("div", "reason", String(reason)));
  }

  function show(r) {
    st.result = r;
    $("bounds-result").hidden = false;
    const adv = r.adversary || {}, cl = r.classical || {};
    const advR = adv.reasons || {}, clR = cl.reasons || {}, topR = r.reasons || {};
    ROWS.forEach(function (row) {
      const src = row[0] === "adversary" ? adv : row[0] === "classical" ? cl : r;
      const why = row[0] === "adversary" ? advR : row[0] === "classical" ? clR : topR;
      setValue(row[1], src[row[1]], why[row[1]] || (row[4] && why[row[4]]));
    });
    // The engine's standing of √(W₊W₋): when the graph does not decide f, the rows built on it
    // (this graph's bound, the gaps, the speed-up) are marked; the lower bounds of f stand.
    const notBound = r.complexityIsBound === false || r.reductionCorrect === false;
    const warn = $("bounds-warning");
    warn.hidden = !notBound;
    warn.textContent = notBound ? "√(W₊·W₋) is " + String(r.complexityNote || "not a bound for f: the graph does not decide f") +
      ". The rows of this graph (its bound, the gaps, the speed-up) say nothing about f; the lower bounds of f below still hold. Fix the reduction first." : "";
    ["complexity", "optimalityGap", "speedup", "optimisedComplexity", "optimisedGap"].forEach(function (k) {
      const td = $("bounds-" + k);
      if (!td) return;
      td.dataset.bound = notBound ? "no" : "yes";
      if (notBound && td.dataset.value !== "") td.appendChild(el("div", "reason", "not a bound for f"));
    });
    const w = $("bounds-witnesses");
    w.textContent = "";
    const ws = cl.witnesses || {};
    const lines = [];
    const cert = function (c, name) {
      if (!c) return;
      const fixed = Object.keys(c.fixed || {}).map(function (k) { return k + "=" + c.fixed[k]; }).join(", ");
      lines.push(name + ": input " + c.x + " (f = " + c.f + ") is settled by " + (fixed || "no variable"));
    };
    cert(ws.certificate0, "largest 0-certificate");
    cert(ws.certificate1, "largest 1-certificate");
    if (ws.blockSensitivity) lines.push("sensitive blocks at " + ws.blockSensitivity.x + ": " + (ws.blockSensitivity.blocks || []).map(function (b) { return "{" + b.join(", ") + "}"; }).join(" "));
    if (ws.degree && Array.isArray(ws.degree.monomial)) lines.push("top monomial: " + (ws.degree.monomial.join("·") || "1") + " with coefficient " + F.num(ws.degree.coefficient));
    if (adv.generalStatus) lines.push("ADV± solver: " + adv.generalStatus + (adv.generalMethod ? " (" + adv.generalMethod + ")" : "") + ", primal–dual gap " + F.num(adv.generalGap));
    lines.forEach(function (t) { w.appendChild(el("div", "", t)); });
    const lim = r.limits || {};
    $("bounds-limits").textContent = "Size limits in " + (lim.for || "the page") + ": ADV± up to " + lim.general + " variables, ADV up to " + lim.positive +
      ", classical measures up to " + lim.classical + " (the command-line tool goes further).";
  }

  function start(force) {
    if (!A.engineReady() || !A.has("bounds")) return;
    const text = A.text();
    if (!force && text === st.doneFor) return;
    stop(false);
    const serial = ++st.serial;
    st.running = true;
    st.started = performance.now();
    $("bounds-error").hidden = true;
    document.body.dataset.bounds = "running";
    st.untick();
    st.untick = K.ticker("bounds-elapsed", "computing", st.started, 0);
    st.task = st.task || A.newTask();
    st.task.run("bounds", text).then(function (answer) {
      if (serial !== st.serial || answer.cancelled) return;
      st.running = false;
      st.untick();
      $("bounds-progress").hidden = true;
      st.doneFor = text;
      const ms = performance.now() - st.started;
      $("bounds-body").dataset.ms = String(Math.round(ms));
      if (!answer.ok) {
        const box = $("bounds-error");
        box.hidden = false;
        box.textContent = "No bounds for this scenario: " + K.problem(answer);
        $("bounds-result").hidden = true;
        document.body.dataset.bounds = "error";
        return;
      }
      show(answer.result);
      $("bounds-fallback").hidden = !answer.fallback;
      $("bounds-fallback").textContent = answer.fallback ? "Note: " + answer.fallback + "." : "";
      document.body.dataset.bounds = "ready";
    });
  }

  function stop(byUser) {
    if (!st.running) return;
    st.serial++;
    st.running = false;
    st.untick();
    if (st.task) st.task.cancel();
    $("bounds-progress").hidden = true;
    document.body.dataset.bounds = "cancelled";
    if (byUser) {
      st.doneFor = A.text();   // do not start again by itself for this scenario
      A.notify("Bounds computation cancelled.", "info");
    }
  }

  let changeTimer = 0;
  A.on("engine", function () {
    if (!A.has("bounds")) { unavailable(); return; }
    if (!$("bounds-table")) skeleton();
    if (A.sheet() === "bounds") start(false);
  });
  A.on("sheet", function (name) { if (name === "bounds") start(false); });
  A.on("scenario", function () {
    if (A.sheet() !== "bounds" || !$("bounds-table")) return;
    clearTimeout(changeTimer);
    changeTimer = setTimeout(function () { start(false); }, 600);
  });
})();
