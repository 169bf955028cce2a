/*
 * The "Run" sheet: the span-program algorithm simulated exactly by the engine
 * (JsonFacade.simulate) for the scenario, with the focused input's spectrum: eigenphases of U(x)
 * on a circle with |0⟩'s weight as spoke lengths, the acceptance probability against the number
 * of phase bits b (worst positive vs worst negative input, and the focused input), and the costs
 * (bits, queries, qubits) with the engine's model assumptions and caution. Runs in a worker of
 * its own when the sheet is shown, the scenario or the focus changes; a newer request ends an
 * older one.
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const A = self.SwApp;
  const $ = function (id) { return document.getElementById(id); };

  const st = { task: null, serial: 0, key: null, running: false, started: 0, result: null, untick: function () {} };

  const K = self.SwSheet;
  const el = K.el;

  function field(label, id, value, title) {
    const l = el("label", "inline-field");
    l.title = title;
    l.appendChild(el("span", "", label));
    const i = el("input");
    i.id = id;
    i.type = "number";
    i.step = "any";
    i.min = "0";
    i.value = value;
    l.appendChild(i);
    i.addEventListener("change", function () { start(true); });
    return l;
  }

  function skeleton() {
    const body = $("run-body");
    body.textContent = "";
    body.appendChild(el("p", "sheet-intro", "The span-program algorithm simulated exactly (phase estimation on U(x), no sampling) for every input, and in detail for the input in focus. Beyond the engine's whole-domain limit, the input in focus alone."));
    const ctl = el("div", "opt-controls controls");
    ctl.appendChild(field("error ε", "run-epsilon", "0.1", "The largest accepted probability of error on a negative input"));
    ctl.appendChild(field("α² (empty: W₊)", "run-alpha2", "", "Scale of the start vector; empty uses the engine's default"));
    body.appendChild(ctl);
    body.appendChild(K.progressRow("run", "Simulating", function () { stop(true); }));
    body.appendChild(K.errorBox("run-error"));
    const res = el("div");
    res.id = "run-result";
    res.hidden = true;
    const costs = el("dl", "figures run-costs");
    [["run-bits", "phase bits b"], ["run-queries", "queries (one run)"], ["run-qubits", "qubits"]].forEach(function (q) {
      const d = el("div");
      d.appendChild(el("dt", "", q[1]));
      const dd = el("dd", "", "–");
      dd.id = q[0];
      d.appendChild(dd);
      costs.appendChild(d);
    });
    res.appendChild(costs);
    res.appendChild(el("h3", "", "Input in focus: eigenphases of U(x), spoke length = weight of |0⟩"));
    const fx = el("div", "small");
    fx.id = "run-focus";
    res.appendChild(fx);
    const circle = el("canvas");
    circle.id = "run-circle";
    circle.setAttribute("role", "img");
    res.appendChild(circle);
    res.appendChild(el("h3", "", "Acceptance probability against phase bits b"));
    const curve = el("canvas");
    curve.id = "run-curves";
    curve.setAttribute("role", "img");
    res.appendChild(curve);
    const sum = el("div", "small");
    sum.id = "run-summary";
    res.appendChild(sum);
    const det = el("details", "small");
    det.appendChild(el("summary", "", "Model assumptions"));
    const ul = el("ul");
    ul.id = "run-assumptions";
    det.appendChild(ul);
    res.appendChild(det);
    body.appendChild(res);
  }

  function unavailable() {
    K.unavailable("run-body", "run-missing", "This build of the engine does not simulate the algorithm (no simulate function).");
  }

  function options() {
    const o = {};
    const eps = $("run-epsilon").value.trim();
    const a2 = $("run-alpha2").value.trim();
    if (eps !== "") o.epsilon = Number(eps);
    if (a2 !== "") o.alpha2 = Number(a2);
    const x = A.focusX();
    if (x !== null) o.input = x;
    return o;
  }

  function setCost(id, v) {
    const dd = $(id);
    dd.textContent = v === null || v === undefined ? "—" : F.count(v);
    dd.dataset.value = v === null || v === undefined ? "" : String(v);
  }

  function draw() {
    const r = st.result;
    if (!r || $("run-result").hidden || A.sheet() !== "run") return;
    const big = A.presenting();
    const f = r.focus;
    const circle = $("run-circle");
    if (f && Array.isArray(f.spectrum) && f.spectrum.length) {
      const tol = r.checks && typeof r.checks.zeroPhaseTolerance === "number" ? r.checks.zeroPhaseTolerance : 0;
      self.SwCharts.phaseCircle(circle, f.spectrum.map(function (e) { return e.phase; }), f.spectrum.map(function (e) { return e.weight; }),
        { highlight: tol, font: big ? 15 : 11, lineWidth: big ? 4 : 2.5 });
      circle.dataset.phases = String(f.spectrum.length);
      circle.setAttribute("aria-label", f.spectrum.length + " eigenphases of U(" + f.x + "); spoke length = weight of |0⟩; |0⟩ weight on phase 0: " + F.num(f.phaseZeroWeight));
      circle.hidden = false;
    } else {
      circle.hidden = true;
    }
    const c = r.curves || {};
    const bits = c.bits || [];
    // A one-input run (scope "input") has no domain-wide curves: only the input in focus is drawn.
    const series = r.scope === "input" ? [] : [
      { label: "worst positive", points: bits.map(function (b, i) { return [b, c.minPositive ? c.minPositive[i] : NaN]; }) },
      { label: "worst negative", points: bits.map(function (b, i) { return [b, c.maxNegative ? c.maxNegative[i] : NaN]; }) }
    ];
    if (f && Array.isArray(f.acceptanceByBits)) series.push({ label: "in focus " + f.x, points: bits.map(function (b, i) { return [b, f.acceptanceByBits[i]]; }) });
    self.SwCharts.line($("run-curves"), series, { xInteger: true, xLabel: "bits b", yMin: 0, yMax: 1, font: big ? 14 : 11, lineWidth: big ? 3 : 1.8, markerRadius: big ? 4 : 3 });
    $("run-curves").dataset.minPositive = JSON.stringify(c.minPositive || []);
    $("run-curves").dataset.maxNegative = JSON.stringify(c.maxNegative || []);
  }

  function show(r) {
    st.result = r;
    $("run-result").hidden = false;
    setCost("run-bits", r.bits);
    setCost("run-queries", r.queries);
    setCost("run-qubits", r.qubits);
    const pos = r.positive || {}, neg = r.negative || {};
    const parts = [];
    const one = r.scope === "input";
    $("run-body").dataset.scope = r.scope || "domain";
    if (one) parts.push("Only the input in focus is simulated: " + String(r.scopeReason || "the domain is too large") + ".");
    parts.push("α² = " + F.num(r.alpha2) + (r.alpha2Source ? " (" + r.alpha2Source + ")" : "") + ", ε = " + F.num(r.epsilon) + ".");
    // The bits separate the whole domain's inputs: a one-input run has none to show.
    if (!one && (r.bits === null || r.bits === undefined)) parts.push("No number of bits separates the inputs: " + (r.bitsReason || "no reason given") + ".");
    else if (!one) parts.push("With b = " + r.bits + ": worst positive input accepted with probability " + F.num(pos.minAcceptance) + ", worst negative with " + F.num(neg.maxAcceptance) + ".");
    parts.push("Qubits: " + F.count(r.stateQubits) + " for the state + " + (r.phaseQubits === null || r.phaseQubits === undefined ? "–" : F.count(r.phaseQubits)) + " phase qubits.");
    if (r.repetitions) parts.push("For two-sided error ε: " + F.count(r.repetitions.runs) + " runs, " + (r.totalQueries === null ? "–" : F.count(r.totalQueries)) + " queries in all.");
    else if (!one && r.repetitionReason && r.repetitionReason !== r.bitsReason) parts.push(String(r.repetitionReason) + ".");
    if (r.textbook) parts.push("Textbook choice Θ = " + F.num(r.textbook.theta) + ": " + F.count(r.textbook.bits) + " bits, " + F.count(r.textbook.queries) + " queries.");
    if (st.fallback) parts.push("Note: " + st.fallback + ".");
    if (r.reductionCorrect === false) parts.push("⚠ The graph does not decide f: the simulated run decides s–t connectivity, not f.");
    $("run-summary").textContent = parts.join(" ");
    const f = r.focus;
    const fx = $("run-focus");
    if (f) {
      fx.textContent = "x = " + f.x + " · " + (f.positive ? "positive, R = " : "negative, C = ") + F.num(f.witnessSize) + " · weight of |0⟩ on phase 0: " +
        F.num(f.phaseZeroWeight) + " · acceptance at b: " + F.num(f.acceptance) + " · phase gap " + F.num(f.phaseGap) + (f.inDomain === false ? " · not in the domain" : "");
      fx.dataset.x = f.x;
      fx.dataset.phaseZeroWeight = f.phaseZeroWeight === null ? "" : String(f.phaseZeroWeight);
    } else {
      fx.textContent = "No input in focus: click a row or press 1 / 0 to see one input's spectrum.";
      fx.dataset.x = "";
    }
    const ul = $("run-assumptions");
    ul.textContent = "";
    (r.assumptions || []).forEach(function (a) { ul.appendChild(el("li", "", String(a))); });
    const caution = document.querySelector("#sheet-run .caution");
    if (r.caution) caution.textContent = "These are " + String(r.caution) + ".";
    draw();
  }

  function start(force) {
    if (!A.engineReady() || !A.has("simulate") || A.sheet() !== "run") return;
    const text = A.text();
    const opts = JSON.stringify(options());
    const key = text + "\u0000" + opts;
    if (!force && key === st.key) return;
    if (st.running) {
      st.serial++;
      st.task.cancel();
    }
    const serial = ++st.serial;
    st.running = true;
    st.key = key;
    st.started = performance.now();
    $("run-error").hidden = true;
    document.body.dataset.simulation = "running";
    // Show progress only when it takes a while (a quick rerun for a new focus should not flicker).
    st.untick();
    st.untick = K.ticker("run-elapsed", "simulating", st.started, 0.3);
    st.task = st.task || A.newTask();
    $("run-body").dataset.options = opts;
    st.task.run("simulate", text, opts).then(function (answer) {
      if (serial !== st.serial || answer.cancelled) return;
      st.running = false;
      st.untick();
      $("run-progress").hidden = true;
      $("run-body").dataset.ms = String(Math.round(performance.now() - st.started));
      if (!answer.ok) {
        const box = $("run-error");
        box.hidden = false;
        box.textContent = "Not simulated: " + K.problem(answer);
        $("run-result").hidden = true;
        document.body.dataset.simulation = "error";
        return;
      }
      st.fallback = answer.fallback || null;
      show(answer.result);
      document.body.dataset.simulation = "ready";
    });
  }

  function stop(byUser) {
    if (!st.running) return;
    st.serial++;
    st.running = false;
    st.untick();
    st.task.cancel();
    $("run-progress").hidden = true;
    document.body.dataset.simulation = "cancelled";
    if (byUser) A.notify("Simulation cancelled.", "info");
  }

  let timer = 0;
  function soon() { clearTimeout(timer); timer = setTimeout(function () { start(false); }, 250); }
  A.on("engine", function () {
    if (!A.has("simulate")) { unavailable(); return; }
    if (!$("run-result")) skeleton();
    if (A.sheet() === "run") start(false);
  });
  A.on("sheet", function (name) { if (name === "run") { start(false); draw(); } });
  A.on("scenario", function () { if ($("run-result")) soon(); });
  A.on("focus", function () { if ($("run-result")) soon(); });
  A.on("mode", function () { draw(); });
})();
